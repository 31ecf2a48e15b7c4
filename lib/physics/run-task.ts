// runTask: one entry point for every solver task, dispatching on `task` (CLI, job worker and tests call this).
// Each task is `(spec, ctx) => Promise<result>`; results are plain JSON-ready objects with a `diagnostics` field.
import type { TaskSpec } from './schemas';
import { runConvergence, type ConvergenceResult } from './tasks/convergence';
import { runDegeneracy, type DegeneracyResult } from './tasks/degeneracy';
import { runFluxSweep, type FluxSweepResult } from './tasks/flux-sweep';
import { runHolonomy, type HolonomyResult } from './tasks/holonomy';
import { runNodalLines, type NodalLinesResult } from './tasks/nodal-lines';
import { runPositionSweep, type PositionSweepResult } from './tasks/position-sweep';
import { runSpectrum, type SpectrumResult } from './tasks/spectrum';
import type { TaskRunContext } from './tasks/task-support';

/** Every task name, in the order the UI lists them. */
export const TASK_NAMES = ['spectrum', 'flux-sweep', 'position-sweep', 'holonomy', 'degeneracy', 'nodal-lines', 'convergence'] as const;
export type TaskName = (typeof TASK_NAMES)[number];

export type TaskResult =
  | SpectrumResult
  | FluxSweepResult
  | PositionSweepResult
  | HolonomyResult
  | DegeneracyResult
  | NodalLinesResult
  | ConvergenceResult;

/** Context of a task run: progress, cancellation, mask files, solver tuning. */
export type RunTaskContext = TaskRunContext;

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
  switch (spec.task) {
    case 'spectrum':
      return runSpectrum(spec, ctx);
    case 'flux-sweep':
      return runFluxSweep(spec, ctx);
    case 'position-sweep':
      return runPositionSweep(spec, ctx);
    case 'holonomy':
      return runHolonomy(spec, ctx);
    case 'degeneracy':
      return runDegeneracy(spec, ctx);
    case 'nodal-lines':
      return runNodalLines(spec, ctx);
    case 'convergence':
      return runConvergence(spec, ctx);
    default: {
      const never: never = spec;
      throw new Error(`unknown task ${JSON.stringify((never as { task?: unknown }).task)}`);
    }
  }
}
