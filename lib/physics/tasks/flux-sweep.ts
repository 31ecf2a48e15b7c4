// Task 'flux-sweep': levels versus the flux of one tube (spectral flow), sorted and tracked through true crossings by
// the overlaps of neighbouring states (PHYSICS.md section 5). The tube does not move, so every step shares one gauge.
import { lowestEigenpairs } from '../eigen';
import { buildHamiltonian } from '../hamiltonian';
import { LevelTracker } from '../level-tracking';
import type { FluxSweepSpec } from '../schemas/flux-sweep';
import type { StateBlock } from '../types';
import {
  checkAbort,
  elapsedMs,
  gridReport,
  prepareTask,
  taskMethod,
  progressReporter,
  runtimeFacts,
  TASK_DEFAULT_TOL,
  type TaskRunContext,
  tubeReport,
  yieldToLoop,
} from './task-support';

/** Extra levels computed above the requested ones so that tracks leaving from the top can be followed (common practice). */
export const TRACKING_GUARD_LEVELS = 2;
/** Relative spacing below which levels count as degenerate for tracking. */
export const TRACKING_DEGENERACY_REL = 1e-7;

/** Result of the flux-sweep task. */
export interface FluxSweepResult {
  task: 'flux-sweep';
  tube: number;
  alphas: number[];
  /** sorted[l][s]: the l-th lowest level at alphas[s] (energy units hbar^2/(2 m L^2)). */
  sorted: number[][];
  /** tracked[t][s]: level followed from level t at the first alpha, through crossings. */
  tracked: number[][];
  /** order[t][s]: which sorted level track t is at step s. */
  order: number[][];
  tubes: ReturnType<typeof tubeReport>;
  grid: ReturnType<typeof gridReport>;
  diagnostics: {
    unknowns: number;
    iterations: number;
    maxResidual: number;
    unconverged: number;
    /** Smallest accepted |overlap|^2 per track (below 0.5 the tracking is doubtful there). */
    trackOverlap: number[];
    wallMs: number;
    node: string;
    platform: string;
  };
}

/**
 * Sweeps the flux of tube `sweep.tube` from `sweep.from` to `sweep.to` in `sweep.steps` equal steps.
 *
 * Each step starts from the previous step's states (warm start); levels are tracked by maximum-overlap assignment
 * against each track's last state taken where its level was isolated. The spectrum is periodic in alpha with period 1
 * and symmetric under alpha -> 1 - alpha (Byers & Yang 1961).
 *
 * @param spec - validated flux-sweep spec
 * @param ctx - progress, cancellation, file resolver
 * @returns alphas, sorted and tracked levels, and diagnostics
 * @see N. Byers and C. N. Yang, Phys. Rev. Lett. 7, 46 (1961)
 * @example
 * const r = await runFluxSweep(spec);
 * r.tracked[0]; // the ground level at alpha = from, followed across crossings
 */
export async function runFluxSweep(spec: FluxSweepSpec, ctx: TaskRunContext = {}): Promise<FluxSweepResult> {
  const start = performance.now();
  const problem = prepareTask(spec, ctx, [], spec.sweep.steps);
  const { lattice, tubes } = problem;
  const { tube, from, to, steps } = spec.sweep;
  const levels = Math.min(spec.levels, lattice.n);
  const k = Math.min(levels + TRACKING_GUARD_LEVELS, lattice.n);
  const tol = spec.tol ?? TASK_DEFAULT_TOL;
  const alphas = Array.from({ length: steps }, (_, s) => (s === steps - 1 ? to : from + ((to - from) * s) / (steps - 1)));
  const tracker = new LevelTracker(k, TRACKING_DEGENERACY_REL);
  const report = progressReporter(ctx, 'sweeping the flux');
  let prev: StateBlock | null = null;
  let iterations = 0;
  let maxResidual = 0;
  let unconverged = 0;
  report(0);
  for (let s = 0; s < steps; s++) {
    checkAbort(ctx);
    const swept = tubes.map((t, i) => (i === tube ? { ...t, alpha: alphas[s] } : t));
    const matrix = buildHamiltonian(lattice, swept);
    let initial = prev;
    if (initial && matrix.im && !initial.im) initial = { ...initial, im: new Float64Array(initial.re.length) };
    const res = lowestEigenpairs(matrix, k, { tol, initial, seed: 1, signal: ctx.signal, method: taskMethod(ctx, lattice.n) });
    iterations += res.iterations;
    if (!res.converged) unconverged++;
    for (let l = 0; l < k; l++) maxResidual = Math.max(maxResidual, res.residualNorms[l] / Math.max(1, Math.abs(res.values[l])));
    tracker.push(res.values, res.vectors);
    prev = res.vectors;
    report((s + 1) / steps);
    if (s % 4 === 3) await yieldToLoop();
  }
  const tracked = tracker.result();
  return {
    task: 'flux-sweep',
    tube,
    alphas,
    sorted: tracked.sorted.slice(0, levels),
    tracked: tracked.tracked.slice(0, levels),
    order: tracked.order.slice(0, levels),
    tubes: tubeReport(tubes),
    grid: gridReport(lattice),
    diagnostics: {
      unknowns: lattice.n,
      iterations,
      maxResidual,
      unconverged,
      trackOverlap: tracked.minOverlap.slice(0, levels),
      wallMs: elapsedMs(start),
      ...runtimeFacts(),
    },
  };
}
