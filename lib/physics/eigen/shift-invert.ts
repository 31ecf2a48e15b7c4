// Shift-invert eigensolver for the lowest levels: a block Krylov (Davidson) space built with (H - sigma)^-1 from a
// sparse LDL factorisation, Rayleigh-Ritz on H itself; plus an LDL preconditioner for LOBPCG scans.
import { csrMatVecColumns } from '../csr';
import { throwIfAborted } from '../errors';
import { mulberry32 } from '../random';
import { hermitianEigen } from './dense';
import type { CsrMatrix, EigenOptions, EigenResult, Preconditioner, StateBlock } from '../types';
import { asCols, columnNorm, copyColumn } from './block-ops';
import { combineColumns } from './block-combine';
import { projectCoefficients } from './block-project';
import { subtractProjection } from './block-subtract';
import { analyzeLdl, factorLdl, LdlPivotError, matchesPattern, solveLdl, type LdlFactor, type LdlSymbolic } from './ldl';
import type { NestedDissectionOptions } from './ordering';

export interface ShiftInvertOptions extends EigenOptions {
  /** Shift below the wanted levels. Default: 0, or a Gershgorin lower bound of H when that is negative. */
  sigma?: number;
  /** Reuse a symbolic analysis of the same sparsity pattern (otherwise the last one is reused when it matches). */
  symbolic?: LdlSymbolic | null;
  /** Reuse the last symbolic analysis when the pattern matches (default true; the bench turns it off for cold timings). */
  reuseAnalysis?: boolean;
  /** Ordering hints for a fresh analysis (e.g. lattice coordinates). */
  ordering?: NestedDissectionOptions;
  /** Extra Ritz pairs tracked beyond k so that a level degenerate with level k does not stall. Default 1. */
  guard?: number;
  /** Largest search space before a thick restart. Default max(40, 8 (k + guard)). */
  maxBasis?: number;
  /** Block Krylov steps between two Rayleigh-Ritz steps. Default 3. */
  depth?: number;
}

/** Default relative residual tolerance (see EigenOptions.tol). */
export const DEFAULT_TOLERANCE = 1e-9;
/** Default number of expansion steps. Cold solves of the bench cases need 4-8 (bench/results.json). */
export const DEFAULT_MAX_ITERATIONS = 200;
/**
 * Block Krylov steps per Rayleigh-Ritz step, and Ritz pairs tracked beyond k. Measured on the unit disk at h = 1/80
 * (k = 4; alpha = 0, 0.3, 1/2): depth 3 with one guard pair costs 25-35% less CPU time than depth 2 with two guards,
 * and still converges when level k is degenerate with level k + 1 (alpha = 0, the m = +-2 pair).
 */
export const DEFAULT_DEPTH = 3;
export const DEFAULT_GUARD = 1;
/** Rayleigh-Ritz steps without halving the worst residual after which the iteration gives up (converged: false). */
const STALL_LIMIT = 4;
/** A new direction whose norm falls below this fraction of its norm before orthogonalisation is dropped. */
const DROP_TOLERANCE = 1e-10;

/**
 * Lowest k eigenpairs of a Hermitian CSR matrix by shift-invert.
 *
 * The search space starts from (H - sigma)^-1 applied to the warm-start vectors (if any) and seeded random ones, and
 * grows by (H - sigma)^-1 r for the residuals r of the tracked Ritz pairs: with an exact inverse this spans the
 * same space as block Lanczos on (H - sigma)^-1, but the new directions are computed from small residuals, so
 * nothing cancels as the pairs converge. Every step does Rayleigh-Ritz with H itself, and the reported residuals
 * are ||H v - lambda v|| computed with H. sigma must lie below the spectrum: with Dirichlet walls and V >= 0, H is
 * positive definite and sigma = 0 works; otherwise a Gershgorin lower bound is used, and the inertia of the LDL
 * factorisation (no negative pivot) proves that no level lies below sigma.
 *
 * Complex Hermitian matrices use the complex LDL^H; the small dense Hermitian problems go to the core's dense solver
 * (real symmetric embedding [[A, -B], [B, A]], PHYSICS.md section 2).
 *
 * @param matrix Hermitian CSR, both triangles; energies in hbar^2/(2 m L^2)
 * @param k number of lowest levels, 1 <= k <= n
 * @param options tolerance, seed, warm start (`initial`), `signal`, `onProgress`, `sigma`
 * @returns ascending values, orthonormal vectors, residual norms; `converged` false when maxIter ran out
 * @throws RangeError for bad k or options; LdlPivotError when a given sigma is not below the spectrum
 * @example
 * const { values } = shiftInvertEigenpairs(H, 4); // lowest four levels
 * @see Y. Saad, Numerical Methods for Large Eigenvalue Problems, 2nd ed., SIAM (2011), sections 4.3 (shift-invert) and 8.3 (Davidson)
 * @see E. R. Davidson, J. Comput. Phys. 17, 87 (1975)
 */
export function shiftInvertEigenpairs(matrix: CsrMatrix, k: number, options: ShiftInvertOptions = {}): EigenResult {
  const n = matrix.n;
  if (!Number.isInteger(k) || k < 1) throw new RangeError(`k must be a positive integer, got ${k}`);
  if (k > n) throw new RangeError(`k = ${k} exceeds the number of unknowns n = ${n}`);
  const tol = options.tol ?? DEFAULT_TOLERANCE;
  if (!(tol > 0)) throw new RangeError(`tol must be positive, got ${tol}`);
  const maxIter = options.maxIter ?? DEFAULT_MAX_ITERATIONS;
  if (!Number.isInteger(maxIter) || maxIter < 1) throw new RangeError(`maxIter must be a positive integer, got ${maxIter}`);
  const guard = Math.min(options.guard ?? DEFAULT_GUARD, n - k);
  if (!Number.isInteger(guard) || guard < 0) throw new RangeError(`guard must be a non-negative integer, got ${options.guard}`);
  if (options.initial && options.initial.n !== n) {
    throw new RangeError(`initial has n = ${options.initial.n} rows but the matrix has ${n}`);
  }
  const track = k + guard;
  const depth = options.depth ?? DEFAULT_DEPTH;
  if (!Number.isInteger(depth) || depth < 1) throw new RangeError(`depth must be a positive integer, got ${options.depth}`);
  const maxBasis = Math.min(n, options.maxBasis ?? Math.max(40, 8 * track));
  if (!Number.isInteger(maxBasis) || maxBasis < Math.min(n, (depth + 1) * track)) {
    throw new RangeError(`maxBasis must be an integer >= (depth + 1) (k + guard) = ${(depth + 1) * track}, got ${options.maxBasis}`);
  }
  throwIfAborted(options.signal);

  const factor = factorShifted(matrix, options);
  const complex = matrix.im !== null;
  const space = new SearchSpace(matrix, maxBasis, complex);
  const rng = mulberry32(((options.seed ?? 1) >>> 0) ^ 0x9e3779b9);

  // Start: warm vectors and seeded random ones, all smoothed by one inverse application. For a warm start from a
  // neighbouring configuration this matters: the old states have a large residual concentrated on the few links
  // that changed, and (H - sigma)^-1 turns that spike into a smooth, small correction.
  const start = startBlock(n, track, complex, options.initial ?? null, rng);
  const smoothed = emptyBlock(n, track, complex);
  solveLdl(factor, start.block, smoothed);
  space.addColumns(smoothed, 0, track);

  let iterations = 0;
  let best = space.ritz(track);
  let firstResidual = -1;
  let reported = 0;
  let bestWorst = Infinity;
  let stalled = 0;
  while (true) {
    const worst = maxRelative(best.residualNorms, best.values, k);
    // Rounding sets a floor of about eps ||H|| on the residual: stop when a tolerance below it stops improving.
    if (worst < 0.5 * bestWorst) {
      bestWorst = worst;
      stalled = 0;
    } else if (++stalled >= STALL_LIMIT) break;
    if (firstResidual < 0) firstResidual = Math.max(worst, tol * 10);
    if (options.onProgress) {
      const fraction = Math.min(1, Math.max(reported, Math.log(firstResidual / Math.max(worst, tol)) / Math.log(firstResidual / tol)));
      if (fraction > reported) reported = fraction;
      options.onProgress(reported);
    }
    if (worst <= tol || iterations >= maxIter) break;
    throwIfAborted(options.signal);
    iterations++;

    // Corrections for the tracked pairs that have not converged yet (the first k decide convergence).
    const pending: number[] = [];
    for (let j = 0; j < track; j++) {
      if (best.residualNorms[j] / Math.max(1, Math.abs(best.values[j])) > tol) pending.push(j);
    }
    const residuals = emptyBlock(n, pending.length, complex);
    for (let t = 0; t < pending.length; t++) copyColumn(n, asCols(best.residuals), pending[t], asCols(residuals), t);
    const corrections = emptyBlock(n, pending.length, complex);
    solveLdl(factor, residuals, corrections);
    const growth = depth * pending.length;
    if (space.size + growth > maxBasis) space.restart(best, Math.max(track, Math.min(maxBasis - growth, 2 * track)));
    let added = space.addColumns(corrections, 0, pending.length);
    if (added === 0) break; // the space cannot grow: the pairs are as accurate as the arithmetic allows
    // Further block Krylov steps on the newest directions before the next Rayleigh-Ritz (it costs more than they do).
    for (let step = 1; step < depth && space.size + added <= maxBasis; step++) {
      const newest = space.columns(space.size - added, added);
      const next = emptyBlock(n, added, complex);
      solveLdl(factor, newest, next);
      added = space.addColumns(next, 0, added);
      if (added === 0) break;
    }
    best = space.ritz(track);
  }

  // Final residuals with H itself on the returned vectors.
  const vectors = sliceBlock(best.vectors, 0, k);
  const hv = emptyBlock(n, k, complex);
  csrMatVecColumns(matrix, vectors.re, vectors.im, hv.re, hv.im, k);
  const values = best.values.slice(0, k);
  const residualNorms = new Float64Array(k);
  for (let j = 0; j < k; j++) residualNorms[j] = residualNorm(hv, vectors, j, values[j]);
  const converged = maxRelative(residualNorms, values, k) <= tol;
  options.onProgress?.(1);
  return { values, vectors, residualNorms, iterations, converged, method: 'shift-invert' };
}

/**
 * An approximate inverse (A - sigma)^-1 for preconditioned iterations (LOBPCG), from one LDL factorisation of a
 * nearby matrix, e.g. the same lattice without flux (real, cheaper) for a whole scan of tube positions.
 * A real factor accepts complex residual blocks (real and imaginary parts solved separately).
 *
 * @param matrix Hermitian CSR, both triangles; the matrix whose inverse approximates the wanted one
 * @param sigma shift; default as in shiftInvertEigenpairs (0, or a Gershgorin lower bound when negative)
 * @returns a Preconditioner writing (A - sigma)^-1 r into `out` (out.im required when r or A is complex)
 * @example
 * const precondition = factorPreconditioner(buildHamiltonian(lattice, [])); // zero-flux lattice
 * lobpcgEigenpairs(H, 4, { preconditioner: precondition });
 */
export function factorPreconditioner(matrix: CsrMatrix, sigma?: number): Preconditioner {
  const factor = factorShifted(matrix, { sigma });
  return (r: StateBlock, out: StateBlock) => solveLdl(factor, r, out);
}

/**
 * Lower bound of the spectrum by Gershgorin discs: min over rows of A_ii - sum_{j != i} |A_ij|.
 * @example
 * gershgorinLowerBound(H); // 0 for the Dirichlet 5-point Laplacian without potential
 */
export function gershgorinLowerBound(matrix: CsrMatrix): number {
  const { n, rowPtr, colIdx, re, im } = matrix;
  let bound = Infinity;
  for (let i = 0; i < n; i++) {
    let diag = 0;
    let off = 0;
    for (let q = rowPtr[i]; q < rowPtr[i + 1]; q++) {
      if (colIdx[q] === i) diag += re[q];
      else off += im ? Math.hypot(re[q], im[q]) : Math.abs(re[q]);
    }
    bound = Math.min(bound, diag - off);
  }
  return n > 0 ? bound : 0;
}

// ---------------------------------------------------------------------------------------------------------
// Factorisation with a checked shift, reusing the last symbolic analysis when the pattern matches.

let lastSymbolic: LdlSymbolic | null = null;

function factorShifted(
  matrix: CsrMatrix,
  options: Pick<ShiftInvertOptions, 'sigma' | 'symbolic' | 'ordering' | 'reuseAnalysis'>,
): LdlFactor {
  let symbolic = options.symbolic ?? null;
  if (!symbolic) {
    const reuse = (options.reuseAnalysis ?? true) && lastSymbolic !== null && matchesPattern(lastSymbolic, matrix);
    symbolic = reuse ? lastSymbolic! : analyzeLdl(matrix, options.ordering);
    lastSymbolic = symbolic;
  }
  if (options.sigma !== undefined) {
    if (!Number.isFinite(options.sigma)) throw new RangeError(`sigma must be a finite number, got ${options.sigma}`);
    return factorLdl(matrix, { sigma: options.sigma, symbolic });
  }
  const lower = gershgorinLowerBound(matrix);
  const sigma = Math.min(0, lower);
  try {
    return factorLdl(matrix, { sigma, symbolic });
  } catch (error) {
    if (!(error instanceof LdlPivotError)) throw error;
    // sigma = 0 touched the spectrum (e.g. a zero level): step below the Gershgorin bound, which is safe.
    const margin = 1e-3 * Math.max(1, Math.abs(lower), diagonalMagnitude(matrix));
    return factorLdl(matrix, { sigma: Math.min(sigma, lower) - margin, symbolic });
  }
}

function diagonalMagnitude(matrix: CsrMatrix): number {
  let m = 0;
  for (let i = 0; i < matrix.n; i++) {
    for (let q = matrix.rowPtr[i]; q < matrix.rowPtr[i + 1]; q++) {
      if (matrix.colIdx[q] === i) m = Math.max(m, Math.abs(matrix.re[q]));
    }
  }
  return m;
}

// ---------------------------------------------------------------------------------------------------------
// Search space: orthonormal basis Q and the projected matrix G = Q^H H Q.

interface RitzPairs {
  values: Float64Array;
  vectors: StateBlock;
  hvectors: StateBlock;
  residuals: StateBlock;
  residualNorms: Float64Array;
}

class SearchSpace {
  readonly n: number;
  size = 0;
  private readonly qre: Float64Array;
  private readonly qim: Float64Array | null;
  private readonly gre: Float64Array;
  private readonly gim: Float64Array | null;

  constructor(
    private readonly matrix: CsrMatrix,
    private readonly capacity: number,
    private readonly complex: boolean,
  ) {
    this.n = matrix.n;
    this.qre = new Float64Array(capacity * this.n);
    this.qim = complex ? new Float64Array(capacity * this.n) : null;
    this.gre = new Float64Array(capacity * capacity);
    this.gim = complex ? new Float64Array(capacity * capacity) : null;
  }

  /**
   * Orthonormalise columns [from, from + count) of `block` against the basis (block classical Gram-Schmidt,
   * twice: "twice is enough", Giraud et al., Numer. Math. 101, 87 (2005)), then among themselves, and append the
   * ones that keep more than DROP_TOLERANCE of their norm. Returns how many were appended.
   */
  addColumns(block: StateBlock, from: number, count: number): number {
    const { n, size } = this;
    const p = Math.min(count, this.capacity - size);
    if (p <= 0) return 0;
    const at = size * n;
    const wr = this.qre.subarray(at, at + p * n);
    const wi = this.qim ? this.qim.subarray(at, at + p * n) : null;
    wr.set(block.re.subarray(from * n, (from + p) * n));
    if (wi) {
      if (block.im) wi.set(block.im.subarray(from * n, (from + p) * n));
      else wi.fill(0);
    }
    // origin[t]: the column's norm on entry, in the units of its current scaling (for the drop test).
    const origin = new Float64Array(p);
    const norms = new Float64Array(p);
    for (let t = 0; t < p; t++) origin[t] = norms[t] = columnNorm(n, { re: wr, im: wi, off: 0 }, t);
    let accepted = p;
    const cr = new Float64Array(Math.max(1, size * p));
    const ci = this.complex ? new Float64Array(Math.max(1, size * p)) : null;
    for (let round = 0; round < 3; round++) {
      // Against the basis: block Gram-Schmidt repeated while a pass removes more than 1 - 1/sqrt(2) of a column
      // (the criterion of Daniel, Gragg, Kaufman & Stewart, Math. Comp. 30, 772 (1976)).
      for (let pass = 0; pass < 4 && size > 0; pass++) {
        projectCoefficients(this.qre, this.qim, size, wr, wi, accepted, n, cr, ci);
        subtractProjection(this.qre, this.qim, size, wr, wi, accepted, n, cr, ci);
        let again = false;
        for (let t = 0; t < accepted; t++) {
          const after = columnNorm(n, { re: wr, im: wi, off: 0 }, t);
          if (after < Math.SQRT1_2 * norms[t] && after > DROP_TOLERANCE * origin[t]) again = true;
          norms[t] = after;
        }
        if (!again) break;
      }
      // Within the block: modified Gram-Schmidt, twice, keeping (compacted) the columns that survive.
      let kept = 0;
      let clean = true;
      for (let t = 0; t < accepted; t++) {
        const vr = wr.subarray(t * n, (t + 1) * n);
        const vi = wi ? wi.subarray(t * n, (t + 1) * n) : null;
        const entry = columnNorm(n, { re: vr, im: vi, off: 0 }, 0);
        if (!(entry > DROP_TOLERANCE * origin[t]) || !Number.isFinite(entry)) continue;
        for (let pass = 0; pass < 2; pass++) {
          for (let s = 0; s < kept; s++) {
            removeComponent(wr.subarray(s * n, (s + 1) * n), wi ? wi.subarray(s * n, (s + 1) * n) : null, vr, vi, n);
          }
        }
        const after = columnNorm(n, { re: vr, im: vi, off: 0 }, 0);
        if (!(after > DROP_TOLERANCE * origin[t])) continue;
        // A column that lost much here may have regained components along the basis: one more round.
        if (after < Math.SQRT1_2 * entry && size > 0) clean = false;
        const inv = 1 / after;
        const dr = wr.subarray(kept * n, (kept + 1) * n);
        for (let i = 0; i < n; i++) dr[i] = vr[i] * inv;
        if (wi && vi) {
          const di = wi.subarray(kept * n, (kept + 1) * n);
          for (let i = 0; i < n; i++) di[i] = vi[i] * inv;
        }
        origin[kept] = origin[t] * inv;
        norms[kept] = 1;
        kept++;
      }
      accepted = kept;
      if (clean || accepted === 0) break;
    }
    if (accepted === 0) return 0;
    // H on the new columns, then the new columns of G = Q^H H Q.
    const hr = new Float64Array(accepted * n);
    const hi = this.complex ? new Float64Array(accepted * n) : null;
    csrMatVecColumns(this.matrix, wr.subarray(0, accepted * n), wi ? wi.subarray(0, accepted * n) : null, hr, hi, accepted);
    const total = size + accepted;
    const gr = new Float64Array(total * accepted);
    const gi = this.complex ? new Float64Array(total * accepted) : null;
    projectCoefficients(this.qre, this.qim, total, hr, hi, accepted, n, gr, gi);
    const cap = this.capacity;
    for (let j = 0; j < total; j++) {
      for (let t = 0; t < accepted; t++) {
        const col = size + t;
        const vr = gr[j * accepted + t];
        const vi = gi ? (j === col ? 0 : gi[j * accepted + t]) : 0;
        if (j > col) continue; // the entry below the diagonal comes from the later column (Hermitian)
        this.gre[j * cap + col] = vr;
        this.gre[col * cap + j] = vr;
        if (this.gim) {
          this.gim[j * cap + col] = vi;
          this.gim[col * cap + j] = -vi;
        }
      }
    }
    this.size = total;
    return accepted;
  }

  /** Copy of basis columns [from, from + count). */
  columns(from: number, count: number): StateBlock {
    const { n } = this;
    return {
      n,
      k: count,
      re: this.qre.slice(from * n, (from + count) * n),
      im: this.qim ? this.qim.slice(from * n, (from + count) * n) : null,
    };
  }

  /** Rayleigh-Ritz with H: the lowest `count` Ritz pairs with their residuals H x - theta x. */
  ritz(count: number): RitzPairs {
    const { n, size } = this;
    const want = Math.min(count, size);
    const eig = projectedEigen(this.gre, this.gim, size, this.capacity, want);
    const vectors = emptyBlock(n, want, this.complex);
    const hvectors = emptyBlock(n, want, this.complex);
    combineColumns(this.qre, this.qim, size, eig.vre, eig.vim, want, n, vectors);
    // H x by sparse products (5 entries a row) is cheaper than combining the stored H q columns.
    csrMatVecColumns(this.matrix, vectors.re, vectors.im, hvectors.re, hvectors.im, want);
    const residuals = emptyBlock(n, want, this.complex);
    const residualNorms = new Float64Array(want);
    for (let j = 0; j < want; j++) {
      const theta = eig.values[j];
      let sum = 0;
      for (let i = j * n; i < (j + 1) * n; i++) {
        const r = hvectors.re[i] - theta * vectors.re[i];
        residuals.re[i] = r;
        sum += r * r;
      }
      if (this.complex) {
        for (let i = j * n; i < (j + 1) * n; i++) {
          const r = hvectors.im![i] - theta * vectors.im![i];
          residuals.im![i] = r;
          sum += r * r;
        }
      }
      residualNorms[j] = Math.sqrt(sum);
    }
    return { values: eig.values, vectors, hvectors, residuals, residualNorms };
  }

  /** Thick restart: keep the lowest `keep` Ritz vectors of the current space, drop the rest. */
  restart(current: RitzPairs, keep: number): void {
    const { n } = this;
    const pairs = current.vectors.k >= keep ? current : this.ritz(keep);
    const kept = Math.min(keep, pairs.vectors.k);
    this.qre.set(pairs.vectors.re.subarray(0, kept * n));
    if (this.qim) this.qim.set(pairs.vectors.im!.subarray(0, kept * n));
    this.gre.fill(0);
    this.gim?.fill(0);
    for (let j = 0; j < kept; j++) this.gre[j * this.capacity + j] = pairs.values[j];
    this.size = kept;
  }
}

/** v -= <u, v> u for a unit vector u. */
function removeComponent(ur: Float64Array, ui: Float64Array | null, vr: Float64Array, vi: Float64Array | null, n: number): void {
  let cr = 0;
  let ci = 0;
  for (let i = 0; i < n; i++) cr += ur[i] * vr[i];
  if (ui && vi) {
    for (let i = 0; i < n; i++) {
      cr += ui[i] * vi[i];
      ci += ur[i] * vi[i] - ui[i] * vr[i];
    }
    for (let i = 0; i < n; i++) {
      vr[i] -= cr * ur[i] - ci * ui[i];
      vi[i] -= cr * ui[i] + ci * ur[i];
    }
    return;
  }
  for (let i = 0; i < n; i++) vr[i] -= cr * ur[i];
}

// ---------------------------------------------------------------------------------------------------------
// Small dense Hermitian eigenproblem: the core's dense solver (real symmetric embedding for complex G).

/** Lowest `want` eigenpairs of the m x m Hermitian G (row stride `stride`), vectors as columns of length m. */
function projectedEigen(
  gre: Float64Array,
  gim: Float64Array | null,
  m: number,
  stride: number,
  want: number,
): { values: Float64Array; vre: Float64Array; vim: Float64Array | null } {
  const re = new Float64Array(m * m);
  const im = gim ? new Float64Array(m * m) : null;
  for (let i = 0; i < m; i++) {
    re.set(gre.subarray(i * stride, i * stride + m), i * m);
    if (im && gim) im.set(gim.subarray(i * stride, i * stride + m), i * m);
  }
  const eig = hermitianEigen(re, im, m);
  return {
    values: eig.values.slice(0, want),
    vre: eig.vectorsRe.slice(0, want * m),
    vim: eig.vectorsIm ? eig.vectorsIm.slice(0, want * m) : null,
  };
}

// ---------------------------------------------------------------------------------------------------------
// Block helpers.

function emptyBlock(n: number, k: number, complex: boolean): StateBlock {
  return { n, k, re: new Float64Array(n * k), im: complex ? new Float64Array(n * k) : null };
}

function sliceBlock(block: StateBlock, from: number, count: number): StateBlock {
  const { n } = block;
  return {
    n,
    k: count,
    re: block.re.slice(from * n, (from + count) * n),
    im: block.im ? block.im.slice(from * n, (from + count) * n) : null,
  };
}

/** Warm-start columns first (real part, or imaginary part when larger, for a real problem), then seeded random. */
function startBlock(
  n: number,
  track: number,
  complex: boolean,
  initial: StateBlock | null,
  rng: () => number,
): { block: StateBlock; warm: number } {
  const block = emptyBlock(n, track, complex);
  const warm = initial ? Math.min(initial.k, track) : 0;
  for (let c = 0; c < warm; c++) {
    const src = initial!;
    const re = src.re.subarray(c * n, (c + 1) * n);
    const im = src.im ? src.im.subarray(c * n, (c + 1) * n) : null;
    if (complex) {
      block.re.set(re, c * n);
      if (im) block.im!.set(im, c * n);
    } else {
      const useIm = im !== null && dotSelf(im, null) > dotSelf(re, null);
      block.re.set(useIm ? im! : re, c * n);
    }
  }
  for (let i = warm * n; i < track * n; i++) block.re[i] = rng() - 0.5;
  if (complex) for (let i = warm * n; i < track * n; i++) block.im![i] = rng() - 0.5;
  return { block, warm };
}

function dotSelf(vr: Float64Array, vi: Float64Array | null): number {
  let s = 0;
  for (let i = 0; i < vr.length; i++) s += vr[i] * vr[i];
  if (vi) for (let i = 0; i < vi.length; i++) s += vi[i] * vi[i];
  return s;
}

function residualNorm(hv: StateBlock, v: StateBlock, j: number, lambda: number): number {
  const { n } = v;
  let s = 0;
  for (let i = j * n; i < (j + 1) * n; i++) {
    const r = hv.re[i] - lambda * v.re[i];
    s += r * r;
  }
  if (v.im && hv.im) {
    for (let i = j * n; i < (j + 1) * n; i++) {
      const r = hv.im[i] - lambda * v.im[i];
      s += r * r;
    }
  }
  return Math.sqrt(s);
}

function maxRelative(norms: Float64Array, values: Float64Array, k: number): number {
  let worst = 0;
  for (let j = 0; j < Math.min(k, norms.length); j++) worst = Math.max(worst, norms[j] / Math.max(1, Math.abs(values[j])));
  return worst;
}
