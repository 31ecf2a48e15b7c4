// The task spec: a discriminated union on `task` of every schema in the task table, and `parseTaskSpec` for all entry points.
// Invalid input becomes a SpecError listing "path: message" for every problem.
import { z } from 'zod';
import { SpecError } from '../errors';
import { TASK_NAMES, TASK_TABLE, type TaskName, type TaskSpecSchemaOf } from '../task-table';
import { zodIssuesToSpecIssues } from './issues';

export * from './common';
export * from './spectrum';
export * from './flux-sweep';
export * from './position-sweep';
export * from './holonomy';
export * from './degeneracy';
export * from './nodal-lines';
export * from './convergence';
export { formatPath, zodIssuesToSpecIssues } from './issues';

/** One schema per task, in the task table's order (the union needs a non-empty tuple). */
const TASK_SPEC_SCHEMAS = TASK_NAMES.map((name) => TASK_TABLE[name].schema) as unknown as [
  TaskSpecSchemaOf<TaskName>,
  ...TaskSpecSchemaOf<TaskName>[],
];

/** Any task spec: a union on `task` of every task's schema in the task table (lib/physics/task-table.ts). */
export const taskSpecSchema = z.discriminatedUnion('task', TASK_SPEC_SCHEMAS, {
  error: (issue) => (issue.code === 'invalid_union' ? `task must be one of ${TASK_NAMES.join(', ')}` : undefined),
});
export type TaskSpec = z.infer<typeof taskSpecSchema>;
/** A task spec as written by a user, before defaults are applied. */
export type TaskSpecInput = z.input<typeof taskSpecSchema>;

/**
 * Validates any task spec (parsed JSON) and applies defaults.
 *
 * @param input - parsed JSON from a form, an API body, a job or the CLI
 * @returns the typed spec with defaults filled in
 * @throws SpecError with one issue per problem (`path: message`)
 * @example
 * const spec = parseTaskSpec({ task: 'spectrum', well: { disk: { center: [0, 0], radius: 1 } }, grid: { h: 0.05 } });
 * spec.levels; // 6
 */
export function parseTaskSpec(input: unknown): TaskSpec {
  const parsed = taskSpecSchema.safeParse(input);
  if (!parsed.success) throw new SpecError(zodIssuesToSpecIssues(parsed.error.issues));
  return parsed.data;
}
