// Task 'nodal-lines': the zero lines of one real state of a real problem (integer and half-integer fluxes), contoured in a
// local gauge so that no false line runs along a cut, with lines ending on half tubes or the wall (PHYSICS.md sections 1, 5).
import { lowestEigenpairs } from '../eigen';
import { SpecError } from '../errors';
import { buildHamiltonian, isRealFlux } from '../hamiltonian';
import { type NodalLine, nodalLines } from '../marching-squares';
import { NODAL_LINES_NEED_REAL, type NodalLinesSpec } from '../schemas/nodal-lines';
import { elapsedMs, gridReport, prepareTask, taskMethod, progressReporter, runtimeFacts, TASK_DEFAULT_TOL, type TaskRunContext, tubeReport } from './task-support';

/** Result of the nodal-lines task. */
export interface NodalLinesResult {
  task: 'nodal-lines';
  level: number;
  energy: number;
  /** True when the level is degenerate with a neighbour: the state (and its lines) is then one choice in that subspace. */
  degenerate: boolean;
  lines: NodalLine[];
  /** Sign of the state at every box site (x fastest), 0 on wall sites, in the cut gauge of the tubes. */
  sign: { gauge: 'cut'; nx: number; ny: number; values: number[] };
  tubes: ReturnType<typeof tubeReport>;
  grid: ReturnType<typeof gridReport>;
  diagnostics: { unknowns: number; iterations: number; maxResidual: number; method: string; wallMs: number; node: string; platform: string };
}

/** Relative spacing below which two levels count as degenerate (reported, not asserted). */
const DEGENERACY_REL = 1e-7;

/**
 * Computes level `level` of a real problem and its nodal lines.
 *
 * @param spec - validated nodal-lines spec (every tube alpha an integer or half-integer)
 * @param ctx - progress, cancellation, file resolver
 * @returns polylines with their ends (tube index, wall, or closed), the sign field and diagnostics
 * @throws SpecError for a complex problem (a fractional flux that is not one half)
 * @see PHYSICS.md sections 1 and 5 (real states of a half-flux problem change sign around each half tube)
 * @example
 * const r = await runNodalLines(parseTaskSpec({ task: 'nodal-lines', well: { disk: { center: [0, 0], radius: 1 } },
 *   grid: { h: 1 / 20 }, tubes: [{ at: [0.2, 0.1], alpha: 0.5 }] }) as NodalLinesSpec);
 * r.lines.some((l) => l.ends.some((e) => e.kind === 'tube')); // true
 */
export async function runNodalLines(spec: NodalLinesSpec, ctx: TaskRunContext = {}): Promise<NodalLinesResult> {
  const start = performance.now();
  spec.tubes.forEach((t, i) => {
    if (!isRealFlux([t.alpha])) throw new SpecError(NODAL_LINES_NEED_REAL, `tubes[${i}].alpha`);
  });
  const report = progressReporter(ctx, 'solving for the state');
  report(0);
  const problem = prepareTask(spec, ctx);
  const { lattice, tubes } = problem;
  if (spec.level >= lattice.n) throw new SpecError(`level ${spec.level} does not exist: the grid has only ${lattice.n} unknowns`, 'level');
  const k = Math.min(spec.level + 2, lattice.n);
  const matrix = buildHamiltonian(lattice, tubes);
  const res = lowestEigenpairs(matrix, k, { tol: spec.tol ?? TASK_DEFAULT_TOL, seed: 1, signal: ctx.signal, method: taskMethod(ctx, lattice.n) });
  report(0.9);
  const { n } = lattice;
  const psi = res.vectors.re.slice(spec.level * n, (spec.level + 1) * n);
  const lines = nodalLines(lattice, psi, tubes);
  const values = new Array<number>(lattice.nx * lattice.ny).fill(0);
  for (let u = 0; u < n; u++) values[lattice.siteOf[u]] = psi[u] > 0 ? 1 : psi[u] < 0 ? -1 : 0;
  const e = res.values[spec.level];
  const near = (other: number) => Math.abs(other - e) <= DEGENERACY_REL * Math.max(1, Math.abs(e));
  const degenerate = (spec.level > 0 && near(res.values[spec.level - 1])) || (spec.level + 1 < k && near(res.values[spec.level + 1]));
  let maxResidual = 0;
  for (let l = 0; l < k; l++) maxResidual = Math.max(maxResidual, res.residualNorms[l] / Math.max(1, Math.abs(res.values[l])));
  report(1);
  return {
    task: 'nodal-lines',
    level: spec.level,
    energy: e,
    degenerate,
    lines,
    sign: { gauge: 'cut', nx: lattice.nx, ny: lattice.ny, values },
    tubes: tubeReport(tubes),
    grid: gridReport(lattice),
    diagnostics: {
      unknowns: n,
      iterations: res.iterations,
      maxResidual,
      method: res.method,
      wallMs: elapsedMs(start),
      ...runtimeFacts(),
    },
  };
}
