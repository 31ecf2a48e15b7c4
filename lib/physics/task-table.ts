// The solver's tasks, one row each: task name -> the zod schema of its spec. TASK_NAMES, the task-spec union
// (schemas/index.ts), runTask's runners (run-task.ts) and the figure kinds (lib/figure-kinds) are all derived from it.
import type { z } from 'zod';
import { convergenceSpecSchema } from './schemas/convergence';
import { degeneracySpecSchema } from './schemas/degeneracy';
import { fluxSweepSpecSchema } from './schemas/flux-sweep';
import { holonomySpecSchema } from './schemas/holonomy';
import { nodalLinesSpecSchema } from './schemas/nodal-lines';
import { positionSweepSpecSchema } from './schemas/position-sweep';
import { spectrumSpecSchema } from './schemas/spectrum';

/**
 * Every task, in the order the UI lists them. A row holds what the browser may load (the spec schema); the runner of
 * each task lives in run-task.ts, whose table is typed by this one so that no task can lack a runner (the runners pull
 * in worker threads and the eigensolvers, which must stay out of the forms' bundles).
 */
export const TASK_TABLE = {
  spectrum: { schema: spectrumSpecSchema },
  'flux-sweep': { schema: fluxSweepSpecSchema },
  'position-sweep': { schema: positionSweepSpecSchema },
  holonomy: { schema: holonomySpecSchema },
  degeneracy: { schema: degeneracySpecSchema },
  'nodal-lines': { schema: nodalLinesSpecSchema },
  convergence: { schema: convergenceSpecSchema },
} as const;

export type TaskName = keyof typeof TASK_TABLE;

/** Every task name, in the table's order. */
export const TASK_NAMES = Object.keys(TASK_TABLE) as readonly TaskName[];

/** The spec schema of one task. */
export type TaskSpecSchemaOf<T extends TaskName> = (typeof TASK_TABLE)[T]['schema'];
/** A validated spec of one task (defaults filled in). */
export type TaskSpecOf<T extends TaskName> = z.output<TaskSpecSchemaOf<T>>;
/** A spec of one task as a user writes it, before defaults. */
export type TaskSpecInputOf<T extends TaskName> = z.input<TaskSpecSchemaOf<T>>;

/** Whether `name` is a task of the table (own keys only, so `toString` and friends are not tasks). */
export function isTaskName(name: unknown): name is TaskName {
  return typeof name === 'string' && Object.prototype.hasOwnProperty.call(TASK_TABLE, name);
}
