// Task 'position-sweep': levels versus the position of a moving tube, either along a path (walked through adjacent
// plaquette centres, levels tracked with gauge-mapped overlaps) or over a region (energy landscape and force F = -grad E0).
import { lowestEigenpairs } from '../eigen';
import { SpecError } from '../errors';
import { applyGaugeMap, gaugeMapForStep } from '../gauge-map';
import { buildHamiltonian } from '../hamiltonian';
import { nearestPlaquette, plaquetteCentre } from '../lattice';
import { LevelTracker } from '../level-tracking';
import { runChunks } from '../parallel/pool';
import { type ScanJob, scanChunks, tubesWithMoving } from '../parallel/scan-chunk';
import type { PositionSweepSpec } from '../schemas/position-sweep';
import type { StateBlock, Vec2 } from '../types';
import { TRACKING_DEGENERACY_REL, TRACKING_GUARD_LEVELS } from './flux-sweep';
import {
  boxOf,
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

/** Result along a path. */
export interface PathSweepResult {
  task: 'position-sweep';
  mode: 'path';
  alpha: number;
  /** Tube positions walked (adjacent plaquette centres). */
  positions: Vec2[];
  /** Distance walked along the positions (units of L). */
  s: number[];
  sorted: number[][];
  tracked: number[][];
  order: number[][];
  tubes: ReturnType<typeof tubeReport>;
  grid: ReturnType<typeof gridReport>;
  diagnostics: Diagnostics & { trackOverlap: number[] };
}

/** Result over a region. */
export interface RegionSweepResult {
  task: 'position-sweep';
  mode: 'region';
  alpha: number;
  /** Plaquette-centre coordinates of the scanned grid. */
  xs: number[];
  ys: number[];
  /** levels[l]: level l at every position, x fastest. */
  levels: number[][];
  /** Force on the tube F = -grad E0 (energy / length units), central differences inside, one-sided on the border. */
  force: { fx: number[]; fy: number[]; scheme: 'central differences (one-sided on the border)' };
  tubes: ReturnType<typeof tubeReport>;
  grid: ReturnType<typeof gridReport>;
  diagnostics: Diagnostics;
}

interface Diagnostics {
  unknowns: number;
  positions: number;
  iterations: number;
  maxResidual: number;
  unconverged: number;
  wallMs: number;
  node: string;
  platform: string;
}

export type PositionSweepResult = PathSweepResult | RegionSweepResult;

/**
 * Walks a polyline through adjacent plaquettes: each segment from the plaquette nearest its start to the one nearest
 * its end, choosing at every unit step the move that stays closest to the straight segment (ties: horizontal first).
 *
 * @param points - polyline vertices (units of L)
 * @param closed - also walk back from the last vertex to the first
 * @param grid - spacing and offset
 * @returns plaquettes with no repeated neighbours (for a closed path the start is not repeated at the end)
 * @example
 * walkPolyline([[0, 0], [0.3, 0]], false, { h: 0.1, offset: [0, 0] }).length; // 4
 */
export function walkPolyline(points: readonly Vec2[], closed: boolean, grid: { h: number; offset: Vec2 }): [number, number][] {
  const verts = closed ? [...points, points[0]] : [...points];
  const toU = (p: Vec2): Vec2 => [p[0] / grid.h - 1 - grid.offset[0], p[1] / grid.h - 1 - grid.offset[1]];
  const out: [number, number][] = [nearestPlaquette(grid, verts[0])];
  for (let v = 0; v + 1 < verts.length; v++) {
    const [ux, uy] = toU(verts[v]);
    const [wx, wy] = toU(verts[v + 1]);
    const target = nearestPlaquette(grid, verts[v + 1]);
    const dx = wx - ux;
    const dy = wy - uy;
    const len = Math.hypot(dx, dy);
    const distance = (a: number, b: number) => (len === 0 ? Math.hypot(a - ux, b - uy) : Math.abs((a - ux) * dy - (b - uy) * dx) / len);
    let [a, b] = out[out.length - 1];
    let guard = 0;
    while (a !== target[0] || b !== target[1]) {
      const sa = Math.sign(target[0] - a);
      const sb = Math.sign(target[1] - b);
      if (sa !== 0 && (sb === 0 || distance(a + sa, b) <= distance(a, b + sb))) a += sa;
      else b += sb;
      out.push([a, b]);
      if (++guard > 10_000_000) throw new SpecError('the path is too long for this grid', 'path');
    }
  }
  if (closed && out.length > 1) {
    const [a, b] = out[out.length - 1];
    if (a === out[0][0] && b === out[0][1]) out.pop();
  }
  return out;
}

/**
 * Levels of the problem with a moving tube of flux `moving.alpha` placed along `path` or over `region`.
 *
 * @param spec - validated position-sweep spec
 * @param ctx - progress, cancellation, file resolver; `workers`/`warmStart` tune the region scan
 * @returns a path result (sorted and tracked levels versus distance walked) or a region result (landscape and force)
 * @throws AbortError when cancelled; SpecError when the region holds no plaquette centre
 * @see PHYSICS.md section 5 (levels versus tube position; force on a tube)
 * @example
 * const r = await runPositionSweep(spec);
 * r.mode === 'region' && r.force.fx.length === r.xs.length * r.ys.length; // true
 */
export async function runPositionSweep(spec: PositionSweepSpec, ctx: TaskRunContext = {}): Promise<PositionSweepResult> {
  if (spec.path) return runPath(spec, spec.path, ctx);
  return runRegion(spec, spec.region!, ctx);
}

async function runPath(spec: PositionSweepSpec, path: NonNullable<PositionSweepSpec['path']>, ctx: TaskRunContext): Promise<PathSweepResult> {
  const start = performance.now();
  const grid = { h: spec.grid.h, offset: (spec.grid.offset ?? [0, 0]) as Vec2 };
  const walk = walkPolyline(path.points as Vec2[], path.closed ?? false, grid);
  const positions = walk.map(([a, b]) => plaquetteCentre(grid, a, b));
  const problem = prepareTask(spec, ctx, [boxOf(positions)], walk.length);
  const { lattice } = problem;
  const fixed = problem.tubes;
  const alpha = spec.moving.alpha;
  const levels = Math.min(spec.levels, lattice.n);
  const k = Math.min(levels + TRACKING_GUARD_LEVELS, lattice.n);
  const tol = spec.tol ?? TASK_DEFAULT_TOL;
  const tracker = new LevelTracker(k, TRACKING_DEGENERACY_REL);
  const report = progressReporter(ctx, 'moving the tube along the path');
  const job = { lattice, fixed, alpha };
  let prev: StateBlock | null = null;
  let iterations = 0;
  let maxResidual = 0;
  let unconverged = 0;
  report(0);
  for (let s = 0; s < walk.length; s++) {
    checkAbort(ctx);
    const [a, b] = walk[s];
    let initial: StateBlock | null = null;
    if (s > 0) {
      const map = gaugeMapForStep(lattice, { from: walk[s - 1], to: [a, b] }, alpha);
      initial = applyGaugeMap(map, prev!);
      const refs = tracker.references();
      if (refs) tracker.setReferences(applyGaugeMap(map, refs));
    }
    const matrix = buildHamiltonian(lattice, tubesWithMoving(job, a, b));
    if (initial && matrix.im && !initial.im) initial = { ...initial, im: new Float64Array(initial.re.length) };
    const res = lowestEigenpairs(matrix, k, { tol, initial, seed: 1, signal: ctx.signal, method: taskMethod(ctx, lattice.n) });
    iterations += res.iterations;
    if (!res.converged) unconverged++;
    for (let l = 0; l < k; l++) maxResidual = Math.max(maxResidual, res.residualNorms[l] / Math.max(1, Math.abs(res.values[l])));
    tracker.push(res.values, res.vectors);
    prev = res.vectors;
    report((s + 1) / walk.length);
    if (s % 4 === 3) await yieldToLoop();
  }
  const tracked = tracker.result();
  return {
    task: 'position-sweep',
    mode: 'path',
    alpha,
    positions,
    s: positions.map((_, i) => i * grid.h),
    sorted: tracked.sorted.slice(0, levels),
    tracked: tracked.tracked.slice(0, levels),
    order: tracked.order.slice(0, levels),
    tubes: tubeReport(fixed),
    grid: gridReport(lattice),
    diagnostics: {
      unknowns: lattice.n,
      positions: walk.length,
      iterations,
      maxResidual,
      unconverged,
      trackOverlap: tracked.minOverlap.slice(0, levels),
      wallMs: elapsedMs(start),
      ...runtimeFacts(),
    },
  };
}

async function runRegion(
  spec: PositionSweepSpec,
  region: NonNullable<PositionSweepSpec['region']>,
  ctx: TaskRunContext,
): Promise<RegionSweepResult> {
  const start = performance.now();
  const h = spec.grid.h;
  const offset = (spec.grid.offset ?? [0, 0]) as Vec2;
  const slack = 1e-9;
  const a0 = Math.ceil(region.min[0] / h - 1 - offset[0] - slack);
  const a1 = Math.floor(region.max[0] / h - 1 - offset[0] + slack);
  const b0 = Math.ceil(region.min[1] / h - 1 - offset[1] - slack);
  const b1 = Math.floor(region.max[1] / h - 1 - offset[1] + slack);
  const na = a1 - a0 + 1;
  const nb = b1 - b0 + 1;
  if (na < 1 || nb < 1) throw new SpecError('the region holds no plaquette centre at this grid; make it larger or use a finer grid', 'region');
  const lo = plaquetteCentre({ h, offset }, a0, b0);
  const hi = plaquetteCentre({ h, offset }, a1, b1);
  const problem = prepareTask(spec, ctx, [{ min: lo, max: hi }], na * nb);
  const { lattice } = problem;
  const levels = Math.min(spec.levels, lattice.n);
  const job: ScanJob = {
    lattice,
    fixed: problem.tubes,
    alpha: spec.moving.alpha,
    a0,
    b0,
    na,
    nb,
    k: levels,
    m: 0,
    tol: spec.tol ?? TASK_DEFAULT_TOL,
    seed: 1,
    warmStart: ctx.warmStart ?? true,
    method: taskMethod(ctx, lattice.n),
  };
  const total = na * nb;
  const report = progressReporter(ctx, 'scanning tube positions');
  report(0);
  const results = await runChunks(job, scanChunks(nb), { workers: ctx.workers, signal: ctx.signal, onPositions: (d) => report(d / total) });
  const energies = new Float64Array(total * levels);
  let iterations = 0;
  let maxResidual = 0;
  let unconverged = 0;
  for (const r of results) {
    energies.set(r.energies, r.rowStart * na * levels);
    iterations += r.iterations;
    maxResidual = Math.max(maxResidual, r.maxResidual);
    unconverged += r.unconverged;
  }
  const levelMaps = Array.from({ length: levels }, (_, l) => Array.from({ length: total }, (_, i) => energies[i * levels + l]));
  const e0 = levelMaps[0];
  const fx = new Array<number>(total).fill(0);
  const fy = new Array<number>(total).fill(0);
  for (let q = 0; q < nb; q++) {
    for (let p = 0; p < na; p++) {
      const i = p + na * q;
      fx[i] = na < 2 ? 0 : -derivative(e0, i, p, na, 1, h);
      fy[i] = nb < 2 ? 0 : -derivative(e0, i, q, nb, na, h);
    }
  }
  report(1);
  return {
    task: 'position-sweep',
    mode: 'region',
    alpha: spec.moving.alpha,
    xs: Array.from({ length: na }, (_, p) => plaquetteCentre({ h, offset }, a0 + p, b0)[0]),
    ys: Array.from({ length: nb }, (_, q) => plaquetteCentre({ h, offset }, a0, b0 + q)[1]),
    levels: levelMaps,
    force: { fx, fy, scheme: 'central differences (one-sided on the border)' },
    tubes: tubeReport(problem.tubes),
    grid: gridReport(lattice),
    diagnostics: { unknowns: lattice.n, positions: total, iterations, maxResidual, unconverged, wallMs: elapsedMs(start), ...runtimeFacts() },
  };
}

/** dE/dx along one axis at flat index i (position c of count along that axis, flat stride). */
function derivative(e: number[], i: number, c: number, count: number, stride: number, h: number): number {
  if (c === 0) return (e[i + stride] - e[i]) / h;
  if (c === count - 1) return (e[i] - e[i - stride]) / h;
  return (e[i + stride] - e[i - stride]) / (2 * h);
}
