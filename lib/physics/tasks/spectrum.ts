// Task 'spectrum': the lowest levels of one configuration (well, grid, tubes, potential), optionally with the states
// on the grid (density, real and imaginary parts, phase in the cut gauge).
import { degenerateGroups, lowestEigenpairs } from '../eigen';
import { AbortError, SpecError } from '../errors';
import { isRealFlux } from '../hamiltonian';
import { checkBudget } from '../limits';
import type { SpectrumSpec } from '../schemas/spectrum';
import { prepareProblem } from '../problem';
import type { EigenOptions, Lattice, StateBlock, TaskContext, Vec2 } from '../types';
import { elapsedMs, gridReport, type GridReport, runtimeFacts, TASK_DEFAULT_TOL, tubeReport } from './task-support';

/** Levels closer than this (relative to max(1, |E|)) are reported as one degenerate group. */
export const DEGENERACY_RTOL = 1e-8;
/** A solve whose worst relative residual exceeds the tolerance by more than this factor is a failure. */
const ACCEPT_FACTOR = 1e3;

/** The states on the lattice box (row by row, x fastest, nx * ny values each; 0 at wall sites). */
export interface SpectrumStates {
  /** |psi|^2 per level (normalised so that sum over sites = 1). */
  density: number[][];
  /** Real parts per level. */
  re: number[][];
  /** Imaginary parts per level, null for a real problem. */
  im: number[][] | null;
  /** arg psi in (-pi, pi] in the cut gauge (PHYSICS.md section 2), null for a real problem; 0 at wall sites. */
  phase: number[][] | null;
  /** Real problems only (every 2 alpha an integer): the real, sign-fixed states (the same numbers as `re`). */
  real?: number[][];
  /** The gauge the states are given in. */
  gauge: 'cut towards +x';
}

export interface SpectrumResult {
  task: 'spectrum';
  /** Ascending levels with multiplicity, energy units hbar^2 / (2 m L^2). */
  levels: number[];
  /** Index groups of levels equal within DEGENERACY_RTOL (only groups of two or more). */
  degenerate: number[][];
  /** Tubes after snapping: position used, flux, position asked for. */
  tubes: { at: Vec2; alpha: number; requested: Vec2 }[];
  unknowns: number;
  grid: GridReport;
  states?: SpectrumStates;
  diagnostics: {
    iterations: number;
    /** Absolute residual norms ||H v - E v|| per level. */
    residuals: number[];
    converged: boolean;
    method: string;
    wallMs: number;
    node: string;
    platform: string;
  };
}

/** Spreads k unknown-indexed vectors onto the box (0 at wall sites). */
function toBox(lattice: Lattice, block: StateBlock, part: 're' | 'im'): number[][] {
  const out: number[][] = [];
  const src = part === 're' ? block.re : block.im;
  for (let j = 0; j < block.k; j++) {
    const row = new Array<number>(lattice.nx * lattice.ny).fill(0);
    if (src) for (let u = 0; u < lattice.n; u++) row[lattice.siteOf[u]] = src[j * block.n + u];
    out.push(row);
  }
  return out;
}

function statesOf(lattice: Lattice, block: StateBlock, real: boolean): SpectrumStates {
  const re = toBox(lattice, block, 're');
  const im = real ? null : toBox(lattice, block, 'im');
  const density = re.map((r, j) => r.map((v, s) => v * v + (im ? im[j][s] ** 2 : 0)));
  const phase = im ? re.map((r, j) => r.map((v, s) => (v === 0 && im[j][s] === 0 ? 0 : principal(Math.atan2(im[j][s], v))))) : null;
  return { density, re, im, phase, ...(real ? { real: re } : {}), gauge: 'cut towards +x' };
}

function principal(phase: number): number {
  return phase === -Math.PI ? Math.PI : phase;
}

/**
 * Computes the lowest `spec.levels` levels (and states when `spec.states`).
 *
 * @param spec - validated spectrum spec (parseTaskSpec)
 * @param ctx - signal, onProgress, resolveFile for mask wells, optional eigensolver method
 * @returns levels ascending with multiplicity, degenerate groups, snapped tubes, grid, states, diagnostics
 * @throws SpecError / LimitError for bad input or budget, AbortError when cancelled, Error when the solver fails
 * @example
 * const r = await runSpectrum(parseTaskSpec({ task: 'spectrum', well: { disk: { center: [0, 0], radius: 1 } },
 *   grid: { h: 1 / 40 }, tubes: [{ at: [0, 0], alpha: 0.5 }], levels: 2 }) as SpectrumSpec, {});
 * r.levels; // two equal levels near pi^2 (DLMF 10.16.1), about 9.61 at this h
 */
export async function runSpectrum(
  spec: SpectrumSpec,
  ctx: TaskContext & { resolveFile?: (key: string) => Uint8Array; method?: EigenOptions['method'] } = {},
): Promise<SpectrumResult> {
  const start = performance.now();
  if (ctx.signal?.aborted) throw new AbortError();
  ctx.onProgress?.(0, 'building the lattice');
  const problem = prepareProblem(spec, { resolveFile: ctx.resolveFile });
  const { lattice, tubes } = problem;
  const levels = spec.levels ?? 6;
  if (levels > lattice.n) {
    throw new SpecError(`the well holds only ${lattice.n} grid sites at h = ${lattice.h}: ask for at most ${lattice.n} levels or use a smaller h`, 'levels');
  }
  const real = isRealFlux(tubes.map((t) => t.alpha));
  checkBudget({ unknowns: lattice.n, h: lattice.h, levels, complex: !real });
  const matrix = problem.matrix();
  const tol = spec.tol ?? TASK_DEFAULT_TOL;
  const eig = lowestEigenpairs(matrix, levels, {
    tol,
    signal: ctx.signal,
    method: ctx.method,
    onProgress: (f) => ctx.onProgress?.(0.05 + 0.9 * f, 'solving'),
  });
  let worst = 0;
  for (let j = 0; j < levels; j++) worst = Math.max(worst, eig.residualNorms[j] / Math.max(1, Math.abs(eig.values[j])));
  if (!eig.converged && worst > ACCEPT_FACTOR * tol) {
    throw new Error(
      `the eigensolver did not converge: worst relative residual ${worst.toExponential(2)} after ${eig.iterations} iterations (tolerance ${tol})`,
    );
  }
  const values = Array.from(eig.values);
  const result: SpectrumResult = {
    task: 'spectrum',
    levels: values,
    degenerate: degenerateGroups(values, DEGENERACY_RTOL),
    tubes: tubeReport(tubes),
    unknowns: lattice.n,
    grid: gridReport(lattice),
    diagnostics: {
      iterations: eig.iterations,
      residuals: Array.from(eig.residualNorms),
      converged: eig.converged,
      method: eig.method,
      wallMs: 0,
      ...runtimeFacts(),
    },
  };
  if (spec.states) result.states = statesOf(lattice, eig.vectors, real);
  result.diagnostics.wallMs = elapsedMs(start);
  ctx.onProgress?.(1, 'done');
  return result;
}
