// runTask: one entry point for every solver task, dispatching on `task` (CLI, job worker and tests call this).
// The runners table is typed by the task table (task-table.ts), so every task has exactly one runner.
import type { TaskSpec } from './schemas';
import { isTaskName, TASK_NAMES, type TaskName, type TaskSpecOf } from './task-table';
import { runConvergence } from './tasks/convergence';
import { runDegeneracy } from './tasks/degeneracy';
import { runFluxSweep } from './tasks/flux-sweep';
import { runHolonomy } from './tasks/holonomy';
import { runNodalLines } from './tasks/nodal-lines';
import { runPositionSweep } from './tasks/position-sweep';
import { runSpectrum } from './tasks/spectrum';
import type { TaskRunContext } from './tasks/task-support';

export { TASK_NAMES, type TaskName };

/** Context of a task run: progress, cancellation, mask files, solver tuning. */
export type RunTaskContext = TaskRunContext;

/** Each task's runner: `(spec, ctx) => Promise<result>`; results are plain JSON-ready objects with `diagnostics`. */
const TASK_RUNNERS = {
  spectrum: runSpectrum,
  'flux-sweep': runFluxSweep,
  'position-sweep': runPositionSweep,
  holonomy: runHolonomy,
  degeneracy: runDegeneracy,
  'nodal-lines': runNodalLines,
  convergence: runConvergence,
} satisfies { [T in TaskName]: (spec: TaskSpecOf<T>, ctx: RunTaskContext) => Promise<{ diagnostics: unknown }> };

/** The result of one task. */
export type TaskResultOf<T extends TaskName> = Awaited<ReturnType<(typeof TASK_RUNNERS)[T]>>;
export type TaskResult = TaskResultOf<TaskName>;

/**
 * Runs a validated task spec.
 *
 * @param spec - from parseTaskSpec (defaults applied)
 * @param ctx - signal (AbortError on cancel), onProgress(fraction, message), resolveFile for mask wells
 * @returns the task's result; its `diagnostics` (timings, platform) are excluded from resultHash
 * @throws SpecError, LimitError, AbortError, or Error for a solver failure
 * @example
 * const result = await runTask(parseTaskSpec(json), { onProgress: (f) => console.error(f) });
 */
export async function runTask(spec: TaskSpec, ctx: RunTaskContext = {}): Promise<TaskResult> {
  const task: unknown = (spec as { task?: unknown }).task;
  if (!isTaskName(task)) throw new Error(`unknown task ${JSON.stringify(task)}`);
  // The spec's `task` picked the runner, so the spec is that runner's spec; TypeScript cannot correlate the two.
  const run = TASK_RUNNERS[task] as (spec: TaskSpec, ctx: RunTaskContext) => Promise<TaskResult>;
  return run(spec, ctx);
}
