// Task 'holonomy': carry one tube around a rasterised loop and multiply the gauge-mapped overlaps of the chosen level,
// W = prod <psi_k | G_k^dagger psi_{k+1}> (PHYSICS.md section 3); for a real problem the sign and its residual.
import { lowestEigenpairs } from '../eigen';
import { SpecError } from '../errors';
import { gaugeMapForStep, gaugedOverlap, applyGaugeMap } from '../gauge-map';
import { buildHamiltonian, isRealFlux } from '../hamiltonian';
import { rasteriseLoop } from '../loop-path';
import { tubesWithMoving } from '../parallel/scan-chunk';
import type { HolonomySpec } from '../schemas/holonomy';
import type { StateBlock, Vec2 } from '../types';
import {
  boxOf,
  checkAbort,
  elapsedMs,
  gridReport,
  prepareTask,
  taskMethod,
  principalArg,
  progressReporter,
  runtimeFacts,
  TASK_DEFAULT_TOL,
  type TaskRunContext,
  tubeReport,
  yieldToLoop,
} from './task-support';

/** Result of the holonomy task. */
export interface HolonomyResult {
  task: 'holonomy';
  /** W / |W|. */
  holonomy: { re: number; im: number };
  /** arg W in (-pi, pi]; exactly 0 or pi for a real problem. */
  phase: number;
  /** |W| (1 when the level stays isolated and the loop is slow; smaller across near-degeneracies). */
  modulus: number;
  steps: number;
  orientation: 'ccw' | 'cw';
  level: number;
  alpha: number;
  /** +1 or -1 when the problem is real (integer or half-integer fluxes). */
  sign?: 1 | -1;
  /** |Im W| / |W| for a real problem (rounding only). */
  residual?: number;
  /** Tube positions P_0 .. P_{N-1} (plaquette centres); the walk closes back to P_0. */
  path: Vec2[];
  /** Number of grid sites the loop encloses. */
  enclosedSites: number;
  tubes: ReturnType<typeof tubeReport>;
  grid: ReturnType<typeof gridReport>;
  /** Level energies at every position of the path. */
  energies: number[];
  diagnostics: {
    unknowns: number;
    iterations: number;
    maxResidual: number;
    unconverged: number;
    /** Smallest |overlap| of one step. */
    minStepOverlap: number;
    /** Smallest distance of the level to its neighbours along the loop. */
    minGap: number;
    wallMs: number;
    node: string;
    platform: string;
  };
}

/**
 * Carries a tube of flux `moving.alpha` around `loop` with the fixed tubes in place and returns the loop value W.
 *
 * Convention (PHYSICS.md section 3): W = prod_k <psi_k | G_k^dagger psi_{k+1}> over the rasterised walk, psi_N = psi_0 (the
 * same vector). A counter-clockwise loop enclosing all of the charge gives W/|W| = exp(-2 pi i alpha) (Berry 1984); a loop
 * enclosing none gives 1. For a real problem (integer or half-integer fluxes) W is real: `sign` and `residual` are
 * reported and the phase is exactly 0 or pi.
 *
 * @param spec - validated holonomy spec
 * @param ctx - progress, cancellation, mask-file resolver
 * @returns holonomy, phase, modulus, path and diagnostics (wall time etc., excluded from hashes)
 * @throws SpecError for a loop that encloses no site, a disconnected or holed site set; AbortError when cancelled
 * @see M. V. Berry, Proc. R. Soc. Lond. A 392, 45 (1984); H. C. Longuet-Higgins, Proc. R. Soc. Lond. A 344, 147 (1975)
 * @example
 * const r = await runHolonomy(parseTaskSpec({ task: 'holonomy', well: { disk: { center: [0, 0], radius: 1 } },
 *   grid: { h: 1 / 16 }, moving: { alpha: 0.5 }, loop: { circle: { center: [0, 0], radius: 1.3 } } }) as HolonomySpec, {});
 * r.sign; // -1
 */
export async function runHolonomy(spec: HolonomySpec, ctx: TaskRunContext = {}): Promise<HolonomyResult> {
  const start = performance.now();
  const grid = { h: spec.grid.h, offset: (spec.grid.offset ?? [0, 0]) as Vec2 };
  const path = rasteriseLoop(spec.loop, grid, spec.orientation);
  const problem = prepareTask(spec, ctx, [boxOf(path.points)], path.plaquettes.length);
  const { lattice } = problem;
  const fixed = problem.tubes;
  const alpha = spec.moving.alpha;
  const level = spec.level;
  const tol = spec.tol ?? TASK_DEFAULT_TOL;
  const k = Math.min(level + 2, lattice.n);
  if (level >= lattice.n) throw new SpecError(`level ${level} does not exist: the grid has only ${lattice.n} unknowns`, 'level');
  const real = isRealFlux([alpha, ...fixed.map((t) => t.alpha)]);
  const report = progressReporter(ctx, 'carrying the tube around the loop');
  const job = { lattice, fixed, alpha };
  const N = path.plaquettes.length;

  let w = { re: 1, im: 0 };
  let first: StateBlock | null = null;
  let prev: StateBlock | null = null;
  let iterations = 0;
  let maxResidual = 0;
  let unconverged = 0;
  let minStepOverlap = Infinity;
  let minGap = Infinity;
  const energies: number[] = [];
  report(0);
  for (let s = 0; s < N; s++) {
    checkAbort(ctx);
    const [a, b] = path.plaquettes[s];
    let initial: StateBlock | null = null;
    if (prev) initial = applyGaugeMap(gaugeMapForStep(lattice, { from: path.plaquettes[s - 1], to: [a, b] }, alpha), prev);
    const matrix = buildHamiltonian(lattice, tubesWithMoving(job, a, b));
    const res = lowestEigenpairs(matrix, k, { tol, initial, seed: 1, signal: ctx.signal, method: taskMethod(ctx, lattice.n) });
    iterations += res.iterations;
    if (!res.converged) unconverged++;
    for (let l = 0; l < k; l++) maxResidual = Math.max(maxResidual, res.residualNorms[l] / Math.max(1, Math.abs(res.values[l])));
    energies.push(res.values[level]);
    if (level > 0) minGap = Math.min(minGap, res.values[level] - res.values[level - 1]);
    if (level + 1 < k) minGap = Math.min(minGap, res.values[level + 1] - res.values[level]);
    const state = res.vectors;
    if (prev) w = multiplyStep(w, prev, state, path.plaquettes[s - 1], [a, b]);
    else first = state;
    prev = state;
    report((s + 1) / (N + 1));
    if (s % 8 === 7) await yieldToLoop();
  }
  // Close the loop with the very same state psi_0.
  w = multiplyStep(w, prev!, first!, path.plaquettes[N - 1], path.plaquettes[0]);
  report(1);

  function multiplyStep(acc: { re: number; im: number }, from: StateBlock, to: StateBlock, pa: [number, number], pb: [number, number]) {
    const map = gaugeMapForStep(lattice, { from: pa, to: pb }, alpha);
    const z = gaugedOverlap(map, from, level, to, level);
    minStepOverlap = Math.min(minStepOverlap, Math.hypot(z.re, z.im));
    return { re: acc.re * z.re - acc.im * z.im, im: acc.re * z.im + acc.im * z.re };
  }

  const modulus = Math.hypot(w.re, w.im);
  const result: HolonomyResult = {
    task: 'holonomy',
    holonomy: modulus > 0 ? { re: w.re / modulus, im: w.im / modulus } : { re: 0, im: 0 },
    phase: principalArg(w.re, w.im),
    modulus,
    steps: N,
    orientation: path.orientation,
    level,
    alpha,
    path: path.points,
    enclosedSites: path.sites.length,
    tubes: tubeReport(fixed),
    grid: gridReport(lattice),
    energies,
    diagnostics: {
      unknowns: lattice.n,
      iterations,
      maxResidual,
      unconverged,
      minStepOverlap,
      minGap: Number.isFinite(minGap) ? minGap : 0,
      wallMs: 0,
      ...runtimeFacts(),
    },
  };
  if (real) {
    const sign: 1 | -1 = w.re < 0 ? -1 : 1;
    result.sign = sign;
    result.phase = sign === -1 ? Math.PI : 0;
    result.residual = modulus > 0 ? Math.abs(w.im) / modulus : 1;
  }
  result.diagnostics.wallMs = elapsedMs(start);
  return result;
}
