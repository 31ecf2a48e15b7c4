// Task 'convergence': one spectrum on grids h, h/2, h/4 with the observed order per level and Richardson extrapolation
// with the theoretical order (PHYSICS.md section 2), keeping tube positions identical on every grid.
import { lowestEigenpairs } from '../eigen';
import { LimitError } from '../errors';
import { buildHamiltonian } from '../hamiltonian';
import type { ConvergenceSpec } from '../schemas/convergence';
import type { Vec2 } from '../types';
import { checkAbort, elapsedMs, prepareTask, taskMethod, progressReporter, runtimeFacts, TASK_DEFAULT_TOL, type TaskRunContext, yieldToLoop } from './task-support';

/** One grid of the study. */
export interface ConvergenceGrid {
  h: number;
  offset: Vec2;
  unknowns: number;
  levels: number[];
  /** Snapped tube positions on this grid. */
  tubes: Vec2[];
}

/** Result of the convergence task. */
export interface ConvergenceResult {
  task: 'convergence';
  grids: ConvergenceGrid[];
  /** Grids that were not computed, with the reason (budget). */
  skipped: { h: number; reason: string }[];
  /** Theoretical order used for extrapolation and where it comes from. */
  order: { value: number; source: 'given' | 'rectangle with walls on sites' | 'staircase walls or flux tubes' };
  /** Observed order per level from three grids: log2((E_h - E_h/2) / (E_h/2 - E_h/4)); null when undefined. */
  observedOrder: (number | null)[];
  /** Richardson-extrapolated levels from the two finest grids with the theoretical order. */
  extrapolated: number[];
  /** True when snapping put a tube at a different point on some grid. */
  tubesMoved: boolean;
  /** Notes on how the finer grids were chosen. */
  notes: string[];
  diagnostics: { iterations: number; maxResidual: number; wallMs: number; perGridMs: number[]; node: string; platform: string };
}

/** Relative tolerance of "a wall lies on a row of sites". */
const ON_SITE_TOL = 1e-9;

/**
 * Richardson extrapolation from a coarse and a fine value with refinement ratio 2 and order p:
 * E* = E_fine + (E_fine - E_coarse) / (2^p - 1).
 * @see L. F. Richardson, Phil. Trans. R. Soc. A 210, 307 (1911)
 * @example
 * richardson(10.4, 10.2, 1); // 10.0
 */
export function richardson(coarse: number, fine: number, p: number): number {
  return fine + (fine - coarse) / (2 ** p - 1);
}

/**
 * Observed order from three grids with ratio 2, or null when the differences do not shrink monotonically.
 * @example
 * observedOrder(10.4, 10.1, 10.025); // 2
 */
export function observedOrder(e1: number, e2: number, e3: number): number | null {
  const d1 = e1 - e2;
  const d2 = e2 - e3;
  if (d1 === 0 || d2 === 0 || d1 / d2 <= 0) return null;
  return Math.log2(d1 / d2);
}

/** True when the value lies on a row of sites of a grid (sites at (I + 1/2 + f) h). */
function onSites(x: number, h: number, f: number): boolean {
  const t = x / h - 0.5 - f;
  return Math.abs(t - Math.round(t)) < ON_SITE_TOL * Math.max(1, Math.abs(t));
}

/**
 * Runs the spectrum of `of` on grids h, h/2 (and h/4 when refinements = 3) and compares.
 *
 * Finer grids keep the tube positions: with fractional fluxes present their offset is 2^r times the coarse offset (so the
 * coarse plaquette centres stay centres; for the default anchoring this is the same offset); without them the offset
 * (in units of h) is kept, so walls on sites stay on sites. Default theoretical order: 2 for a rectangle whose walls
 * lie on sites with no fractional flux, else 1 (staircase walls; a half tube's state converges like h^{2 nu} = h);
 * `order` overrides (e.g. 2 nu for a state of angular order nu < 1/2).
 *
 * @param spec - validated convergence spec
 * @param ctx - progress, cancellation, file resolver
 * @returns per-grid levels, observed orders, extrapolated levels, notes and diagnostics
 * @throws LimitError when even the two coarsest grids exceed the budget; AbortError when cancelled
 * @see PHYSICS.md section 2; L. F. Richardson, Phil. Trans. R. Soc. A 210, 307 (1911)
 * @example
 * const r = await runConvergence(spec);
 * r.extrapolated[0]; // closer to j01^2 = 5.783186 than r.grids[2].levels[0] for the unit disk
 */
export async function runConvergence(spec: ConvergenceSpec, ctx: TaskRunContext = {}): Promise<ConvergenceResult> {
  const start = performance.now();
  const of = spec.of;
  const h0 = of.grid.h;
  const f0 = (of.grid.offset ?? [0, 0]) as Vec2;
  const fractional = of.tubes.some((t) => Math.abs(t.alpha - Math.round(t.alpha)) > 1e-12);
  const count = spec.refinements;
  const notes: string[] = [];
  const grids: ConvergenceGrid[] = [];
  const skipped: { h: number; reason: string }[] = [];
  const perGridMs: number[] = [];
  let iterations = 0;
  let maxResidual = 0;
  const report = progressReporter(ctx, 'solving on refined grids');
  report(0);
  // Work grows about 4x (unknowns) times 2x (iterations) per halving: weight progress accordingly.
  const weights = Array.from({ length: count }, (_, r) => 8 ** r);
  const totalWeight = weights.reduce((a, b) => a + b, 0);
  let doneWeight = 0;
  for (let r = 0; r < count; r++) {
    checkAbort(ctx);
    const t0 = performance.now();
    const scale = 2 ** r;
    const h = h0 / scale;
    const offset: Vec2 = fractional ? [f0[0] * scale, f0[1] * scale] : [f0[0], f0[1]];
    if (r === 1 && fractional && (Math.abs(f0[0] - Math.round(f0[0])) > 1e-12 || Math.abs(f0[1] - Math.round(f0[1])) > 1e-12)) {
      notes.push(
        `finer grids use offset 2^r x [${f0[0]}, ${f0[1]}] (in their own h) so that the tubes stay at the same points; walls therefore sit differently relative to the sites on each grid`,
      );
    }
    let problem;
    try {
      problem = prepareTask({ ...of, grid: { h, offset } }, ctx);
    } catch (error) {
      if (error instanceof LimitError && r >= 2) {
        skipped.push({ h, reason: error.message });
        break;
      }
      throw error;
    }
    const { lattice, tubes } = problem;
    const levels = Math.min(of.levels, lattice.n);
    const matrix = buildHamiltonian(lattice, tubes);
    const res = lowestEigenpairs(matrix, levels, { tol: of.tol ?? TASK_DEFAULT_TOL, seed: 1, signal: ctx.signal, method: taskMethod(ctx, lattice.n) });
    iterations += res.iterations;
    for (let l = 0; l < levels; l++) maxResidual = Math.max(maxResidual, res.residualNorms[l] / Math.max(1, Math.abs(res.values[l])));
    grids.push({ h, offset, unknowns: lattice.n, levels: Array.from(res.values), tubes: tubes.map((t) => [t.at[0], t.at[1]] as Vec2) });
    perGridMs.push(elapsedMs(t0));
    doneWeight += weights[r];
    report(doneWeight / totalWeight);
    await yieldToLoop();
  }

  let tubesMoved = false;
  for (const g of grids.slice(1)) {
    g.tubes.forEach((at, i) => {
      const ref = grids[0].tubes[i];
      if (Math.abs(at[0] - ref[0]) > 1e-9 * Math.max(1, Math.abs(ref[0])) || Math.abs(at[1] - ref[1]) > 1e-9 * Math.max(1, Math.abs(ref[1]))) {
        tubesMoved = true;
      }
    });
  }
  if (tubesMoved) notes.push('snapping moved at least one tube between grids: the levels compared are not for identical tube positions');

  let order: ConvergenceResult['order'];
  if (spec.order !== undefined) order = { value: spec.order, source: 'given' };
  else {
    const rect = 'rectangle' in of.well ? of.well.rectangle : null;
    const onSiteWalls =
      rect !== null &&
      grids.every((g) => onSites(rect.min[0], g.h, g.offset[0]) && onSites(rect.max[0], g.h, g.offset[0]) && onSites(rect.min[1], g.h, g.offset[1]) && onSites(rect.max[1], g.h, g.offset[1]));
    order = onSiteWalls && !fractional ? { value: 2, source: 'rectangle with walls on sites' } : { value: 1, source: 'staircase walls or flux tubes' };
  }
  const nLevels = Math.min(...grids.map((g) => g.levels.length));
  const observed: (number | null)[] = [];
  const extrapolated: number[] = [];
  for (let l = 0; l < nLevels; l++) {
    observed.push(grids.length >= 3 ? observedOrder(grids[0].levels[l], grids[1].levels[l], grids[2].levels[l]) : null);
    const fine = grids[grids.length - 1].levels[l];
    const coarse = grids[grids.length - 2].levels[l];
    extrapolated.push(richardson(coarse, fine, order.value));
  }
  report(1);
  return {
    task: 'convergence',
    grids,
    skipped,
    order,
    observedOrder: observed,
    extrapolated,
    tubesMoved,
    notes,
    diagnostics: { iterations, maxResidual, wallMs: elapsedMs(start), perGridMs, ...runtimeFacts() },
  };
}
