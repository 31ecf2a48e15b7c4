// Shared plumbing of the sweep, loop, degeneracy, nodal-line and convergence tasks: problem set-up with a covered box,
// throttled progress, wall-clock diagnostics, and the grid description every result reports.
import { policyMethod, TASK_POLICY } from '../eigen/choose-method';
import { AbortError } from '../errors';
import { prepareProblem } from '../problem';
import type { BaseProblemSpec } from '../schemas/common';
import type { EigenOptions, Lattice, SnappedTube, TaskContext, Vec2 } from '../types';

/** Context handed to every task: progress, cancellation and the mask-file resolver. */
export type TaskRunContext = TaskContext & { resolveFile?: (key: string) => Uint8Array } & ScanTuning;

/** Options the bench and the worker may pass beside the spec (not part of the public spec). */
export interface ScanTuning {
  /** Warm-start each solve from the neighbour's states mapped through the gauge map. Default true. */
  warmStart?: boolean;
  /** Worker threads for scans: 0 inline; default depends on the scan size (lib/physics/parallel/pool.ts). */
  workers?: number;
  /** Eigensolver method for every solve (default 'auto', see lib/physics/eigen/choose-method.ts). */
  method?: EigenOptions['method'];
}

/** The grid a result reports. */
export interface GridReport {
  h: number;
  offset: Vec2;
  nx: number;
  ny: number;
  /** Position of box site (0, 0), units of L. */
  origin: Vec2;
  unknowns: number;
}

/** Grid description of a lattice. */
export function gridReport(lattice: Lattice): GridReport {
  return {
    h: lattice.h,
    offset: [lattice.offset[0], lattice.offset[1]],
    nx: lattice.nx,
    ny: lattice.ny,
    origin: [(lattice.i0 + 0.5 + lattice.offset[0]) * lattice.h, (lattice.j0 + 0.5 + lattice.offset[1]) * lattice.h],
    unknowns: lattice.n,
  };
}

/** Tubes as results report them. */
export function tubeReport(tubes: readonly SnappedTube[]): { at: Vec2; alpha: number; requested: Vec2 }[] {
  return tubes.map((t) => ({ at: [t.at[0], t.at[1]], alpha: t.alpha, requested: [t.requested[0], t.requested[1]] }));
}

/**
 * Builds well, lattice and snapped fixed tubes, with the lattice box grown to cover `cover` (tube positions that
 * leave the well), and checks the budget for `configurations` solves (LimitError says what to change).
 */
export function prepareTask(spec: BaseProblemSpec, ctx: TaskRunContext, cover: { min: Vec2; max: Vec2 }[] = [], configurations = 1) {
  return prepareProblem(spec, { cover, resolveFile: ctx.resolveFile, configurations });
}

/** Bounding box of a list of points. */
export function boxOf(points: readonly Vec2[]): { min: Vec2; max: Vec2 } {
  let x0 = Infinity;
  let y0 = Infinity;
  let x1 = -Infinity;
  let y1 = -Infinity;
  for (const [x, y] of points) {
    x0 = Math.min(x0, x);
    y0 = Math.min(y0, y);
    x1 = Math.max(x1, x);
    y1 = Math.max(y1, y);
  }
  return { min: [x0, y0], max: [x1, y1] };
}

/** Progress reporter that calls ctx.onProgress at most every 1 % (and always at 0 and 1). */
export function progressReporter(ctx: TaskContext, message: string): (fraction: number) => void {
  let last = -1;
  return (fraction: number) => {
    const f = Math.min(1, Math.max(0, fraction));
    if (f === 1 || f === 0 || f - last >= 0.01) {
      last = f;
      ctx.onProgress?.(f, message);
    }
  };
}

/** Throws AbortError when the task's signal has fired. */
export function checkAbort(ctx: TaskContext): void {
  if (ctx.signal?.aborted) throw new AbortError();
}

/** Yields to the event loop so that abort handlers and progress writes can run. */
export function yieldToLoop(): Promise<void> {
  return new Promise((resolve) => setImmediate(resolve));
}

/** Runtime facts for diagnostics (excluded from hashes). */
export function runtimeFacts(): { node: string; platform: string } {
  return { node: process.version, platform: `${process.platform}-${process.arch}` };
}

/** Milliseconds since `start` (performance.now()). */
export function elapsedMs(start: number): number {
  return Math.round((performance.now() - start) * 10) / 10;
}

/** Default residual tolerance of the tasks when the spec gives none (relative, see EigenOptions.tol). */
export const TASK_DEFAULT_TOL = 1e-9;

/** The principal argument in (-pi, pi]: -pi is reported as +pi. */
export function principalArg(re: number, im: number): number {
  const phase = Math.atan2(im, re);
  return phase === -Math.PI ? Math.PI : phase;
}

/**
 * Eigensolver for the many nearby solves of sweeps, loops and scans: the caller's choice, else the one method policy
 * (lib/physics/eigen/choose-method.ts) with the tasks' thresholds: dense for tiny lattices, shift-invert above.
 */
export function taskMethod(ctx: ScanTuning, unknowns: number): EigenOptions['method'] {
  if (ctx.method) return ctx.method;
  return policyMethod(unknowns, 0, false, TASK_POLICY);
}
