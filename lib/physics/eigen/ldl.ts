// Sparse LDL^T (real symmetric) and LDL^H (complex Hermitian) factorisation of A - sigma I, and block solves.
// Symbolic analysis (elimination tree, column counts, supernodes) is split from the multifrontal numeric phase.
import type { CsrMatrix, StateBlock } from '../types';
import { nestedDissectionOrdering, type NestedDissectionOptions, type Ordering } from './ordering';

/**
 * Pattern-only analysis of a symmetric sparse matrix: fill-reducing order, elimination tree and supernodes.
 * It depends only on the sparsity pattern, so one analysis serves every matrix with the same pattern
 * (e.g. every tube position on one lattice).
 */
export interface LdlSymbolic {
  n: number;
  /** `perm[k]` = original index of the k-th pivot; `inverse` its inverse. */
  perm: Int32Array;
  inverse: Int32Array;
  /** Lower triangle of the permuted matrix by column: rows in `lowerRow`, source entry in the CSR in `lowerSource`. */
  lowerPtr: Int32Array;
  lowerRow: Int32Array;
  lowerSource: Int32Array;
  /** Supernode s holds the consecutive pivots [superStart[s], superStart[s + 1]). */
  superCount: number;
  superStart: Int32Array;
  /** Row structure of supernode s (its own pivots first, then the rows below, ascending). */
  superRowPtr: Int32Array;
  superRowIdx: Int32Array;
  superParent: Int32Array;
  /** Offset of supernode s's dense (rows x pivots) panel in the factor's value arrays. */
  panelOffset: Float64Array;
  /** Entries of L stored (dense supernode panels, diagonal blocks included). */
  storedEntries: number;
  /** Nonzeros of L counted column by column (diagonal included). */
  factorNonzeros: number;
  /** Multiply-adds of the numeric factorisation of a real matrix (estimate from the column counts). */
  flops: number;
  /** Copy of the analysed pattern, to check that a matrix matches this analysis. */
  rowPtr: Int32Array;
  colIdx: Int32Array;
}

/** A numeric factorisation P (A - sigma I) P^T = L D L^H with unit lower triangular L and real diagonal D. */
export interface LdlFactor {
  symbolic: LdlSymbolic;
  sigma: number;
  complex: boolean;
  /** Supernode panels, column-major (rows x pivots) at `symbolic.panelOffset[s]`. */
  lre: Float64Array;
  lim: Float64Array | null;
  /** Pivots in elimination order. */
  d: Float64Array;
  /** Number of negative pivots = number of eigenvalues of A below sigma (Sylvester's law of inertia). */
  negativePivots: number;
}

export interface LdlAnalyzeOptions extends NestedDissectionOptions {
  /** A ready-made ordering to use instead of nested dissection. */
  ordering?: Ordering | null;
}

export interface LdlFactorOptions {
  /** Shift: the factorised matrix is A - sigma I. Default 0. */
  sigma?: number;
  /** Reuse an analysis of the same pattern (checked). */
  symbolic?: LdlSymbolic | null;
  /** Accept negative pivots (symmetric indefinite without pivoting). Default false: a negative pivot is an error. */
  allowIndefinite?: boolean;
  /** Options for the analysis when `symbolic` is not given. */
  analyze?: LdlAnalyzeOptions;
}

/** Relative size below which a pivot counts as zero: |d| <= SINGULAR_PIVOT * max|diag(A - sigma)|. */
export const SINGULAR_PIVOT = 1e-13;

/** Raised when A - sigma I has a zero or (unless allowed) negative pivot. */
export class LdlPivotError extends Error {
  constructor(
    message: string,
    readonly kind: 'singular' | 'indefinite',
    /** Original (unpermuted) index of the failing pivot. */
    readonly index: number,
    readonly pivot: number,
  ) {
    super(message);
    this.name = 'LdlPivotError';
  }
}

/**
 * Symbolic analysis: nested dissection ordering, elimination tree (Liu 1986), postorder, column counts from
 * row subtrees, fundamental supernodes and their row structures (Davis 2006, chapters 4 and 9).
 *
 * @param matrix Hermitian CSR holding both triangles (only the pattern is read)
 * @example
 * const symbolic = analyzeLdl(matrix); // then factorLdl(matrix, { symbolic })
 * @see T. A. Davis, Direct Methods for Sparse Linear Systems, SIAM (2006)
 * @see J. W. H. Liu, "A compact row storage scheme for Cholesky factors using elimination trees", ACM TOMS 12, 127 (1986)
 */
export function analyzeLdl(matrix: Pick<CsrMatrix, 'n' | 'rowPtr' | 'colIdx'>, options: LdlAnalyzeOptions = {}): LdlSymbolic {
  const { n, rowPtr, colIdx } = matrix;
  checkPattern(matrix);
  const first = options.ordering ?? nestedDissectionOrdering({ n, rowPtr, colIdx }, options);
  if (first.perm.length !== n) throw new RangeError(`ordering.perm must have length n = ${n}`);

  // Elimination tree of the nested-dissection order, then relabel by its postorder so that every subtree
  // (and so every supernode) is a contiguous range of pivots.
  const parent0 = eliminationTree(n, rowPtr, colIdx, first.perm, first.inverse);
  const post = postorder(parent0);
  const perm = new Int32Array(n);
  for (let k = 0; k < n; k++) perm[k] = first.perm[post[k]];
  const inverse = new Int32Array(n);
  for (let k = 0; k < n; k++) inverse[perm[k]] = k;
  const parent = eliminationTree(n, rowPtr, colIdx, perm, inverse);

  // Lower triangle of C = P A P^T by column; C[i][j] (i >= j) is conj(A[perm[j]][perm[i]]).
  const lowerPtr = new Int32Array(n + 1);
  for (let j = 0; j < n; j++) {
    const p = perm[j];
    let count = 0;
    for (let q = rowPtr[p]; q < rowPtr[p + 1]; q++) if (inverse[colIdx[q]] >= j) count++;
    lowerPtr[j + 1] = lowerPtr[j] + count;
  }
  const lowerRow = new Int32Array(lowerPtr[n]);
  const lowerSource = new Int32Array(lowerPtr[n]);
  for (let j = 0; j < n; j++) {
    const p = perm[j];
    let at = lowerPtr[j];
    for (let q = rowPtr[p]; q < rowPtr[p + 1]; q++) {
      const i = inverse[colIdx[q]];
      if (i >= j) {
        lowerRow[at] = i;
        lowerSource[at++] = q;
      }
    }
  }

  const counts = columnCounts(n, rowPtr, colIdx, perm, inverse, parent);
  let factorNonzeros = 0;
  let flops = 0;
  for (let j = 0; j < n; j++) {
    factorNonzeros += counts[j];
    flops += (counts[j] - 1) * (counts[j] - 1) / 2 + counts[j];
  }

  // Fundamental supernodes (pivot j + 1 continues j's supernode when it is j's parent and L(:, j) minus its
  // diagonal has exactly the structure of L(:, j + 1)), then relaxed amalgamation of chains.
  const starts = relaxedSupernodes(n, parent, counts);
  const superCount = Math.max(0, starts.length - 1);
  const superStart = Int32Array.from(n > 0 ? starts : [0]);
  const superOf = new Int32Array(n);
  for (let s = 0; s < superCount; s++) for (let j = superStart[s]; j < superStart[s + 1]; j++) superOf[j] = s;
  const superParent = new Int32Array(superCount);
  for (let s = 0; s < superCount; s++) {
    const last = superStart[s + 1] - 1;
    superParent[s] = parent[last] === -1 ? -1 : superOf[parent[last]];
  }

  // Row structures: own pivots, rows of the original lower columns, and the children's rows above the supernode.
  const superRowPtr = new Int32Array(superCount + 1);
  // A (relaxed) supernode's rows are its own pivots plus the rows of its last pivot's column below it.
  for (let s = 0; s < superCount; s++) {
    const last = superStart[s + 1] - 1;
    superRowPtr[s + 1] = superRowPtr[s] + (superStart[s + 1] - superStart[s]) + counts[last] - 1;
  }
  const superRowIdx = new Int32Array(superRowPtr[superCount]);
  const childHead = new Int32Array(superCount).fill(-1);
  const childNext = new Int32Array(superCount).fill(-1);
  for (let s = superCount - 1; s >= 0; s--) {
    const p = superParent[s];
    if (p >= 0) {
      childNext[s] = childHead[p];
      childHead[p] = s;
    }
  }
  const mark = new Int32Array(n).fill(-1);
  const panelOffset = new Float64Array(superCount + 1);
  for (let s = 0; s < superCount; s++) {
    const f = superStart[s];
    const l = superStart[s + 1];
    const base = superRowPtr[s];
    let size = 0;
    for (let j = f; j < l; j++) {
      superRowIdx[base + size++] = j;
      mark[j] = s;
    }
    for (let j = f; j < l; j++) {
      for (let q = lowerPtr[j]; q < lowerPtr[j + 1]; q++) {
        const i = lowerRow[q];
        if (mark[i] !== s) {
          mark[i] = s;
          superRowIdx[base + size++] = i;
        }
      }
    }
    for (let c = childHead[s]; c !== -1; c = childNext[c]) {
      const cb = superRowPtr[c];
      const ce = superRowPtr[c + 1];
      for (let q = cb + (superStart[c + 1] - superStart[c]); q < ce; q++) {
        const i = superRowIdx[q];
        if (mark[i] !== s) {
          mark[i] = s;
          superRowIdx[base + size++] = i;
        }
      }
    }
    if (size !== superRowPtr[s + 1] - base) {
      throw new Error(`LDL analysis is inconsistent at supernode ${s}: ${size} rows, expected ${superRowPtr[s + 1] - base}`);
    }
    superRowIdx.subarray(base + (l - f), base + size).sort();
    panelOffset[s + 1] = panelOffset[s] + size * (l - f);
  }

  return {
    n,
    perm,
    inverse,
    lowerPtr,
    lowerRow,
    lowerSource,
    superCount,
    superStart,
    superRowPtr,
    superRowIdx,
    superParent,
    panelOffset,
    storedEntries: panelOffset[superCount],
    factorNonzeros,
    flops,
    rowPtr: rowPtr.slice(),
    colIdx: colIdx.slice(),
  };
}

/** True when `symbolic` was computed for exactly this sparsity pattern. */
export function matchesPattern(symbolic: LdlSymbolic, matrix: Pick<CsrMatrix, 'n' | 'rowPtr' | 'colIdx'>): boolean {
  if (symbolic.n !== matrix.n) return false;
  const a = symbolic.rowPtr;
  const b = matrix.rowPtr;
  if (a.length !== b.length || symbolic.colIdx.length !== matrix.colIdx.length) return false;
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return false;
  const c = symbolic.colIdx;
  const d = matrix.colIdx;
  for (let i = 0; i < c.length; i++) if (c[i] !== d[i]) return false;
  return true;
}

/**
 * Numeric multifrontal factorisation P (A - sigma I) P^T = L D L^H. Each supernode assembles a dense front
 * from A and its children's update matrices, factors its pivot columns and passes the Schur complement up.
 * Real matrices (`im` null) use real arithmetic; Hermitian ones keep separate real and imaginary arrays.
 * Without pivoting: a negative pivot is an error unless `allowIndefinite`, a (relatively) zero pivot always is.
 *
 * @param matrix Hermitian CSR (both triangles)
 * @param options `sigma` (same units as A), `symbolic` to reuse an analysis
 * @throws LdlPivotError with the failing pivot and the reason
 * @example
 * const factor = factorLdl(h, { sigma: 0 });
 * solveLdl(factor, rhs, x); // x = (H - 0)^-1 rhs
 * @see T. A. Davis, Direct Methods for Sparse Linear Systems, SIAM (2006), section 9
 * @see J. W. H. Liu, "The multifrontal method for sparse matrix solution", SIAM Review 34, 82 (1992)
 */
export function factorLdl(matrix: CsrMatrix, options: LdlFactorOptions = {}): LdlFactor {
  checkPattern(matrix);
  const sigma = options.sigma ?? 0;
  if (!Number.isFinite(sigma)) throw new RangeError(`sigma must be a finite number, got ${sigma}`);
  if (matrix.re.length !== matrix.colIdx.length) throw new RangeError('matrix.re must have one value per stored entry');
  if (matrix.im && matrix.im.length !== matrix.colIdx.length) throw new RangeError('matrix.im must have one value per stored entry');
  let symbolic = options.symbolic ?? null;
  if (symbolic && !matchesPattern(symbolic, matrix)) {
    throw new RangeError('symbolic analysis does not match the sparsity pattern of the matrix');
  }
  symbolic ??= analyzeLdl(matrix, options.analyze);
  const complex = matrix.im !== null;
  const stored = symbolic.storedEntries;
  if (stored > 2 ** 31 - 1) throw new RangeError(`factor too large: ${stored} stored entries`);
  const lre = new Float64Array(stored);
  const lim = complex ? new Float64Array(stored) : null;
  const d = new Float64Array(symbolic.n);
  const scale = diagonalScale(matrix, sigma);
  const context: FactorContext = {
    symbolic,
    matrix,
    sigma,
    lre,
    lim,
    d,
    tiny: SINGULAR_PIVOT * scale,
    allowIndefinite: options.allowIndefinite ?? false,
    negative: 0,
  };
  if (complex) factorComplex(context);
  else factorReal(context);
  return { symbolic, sigma, complex, lre, lim, d, negativePivots: context.negative };
}

/**
 * Solve (A - sigma I) X = B for a block of right-hand sides, writing X into `out` (same n and k as `rhs`).
 * A real factor accepts complex right-hand sides (real and imaginary parts are solved separately); a complex
 * factor treats a real right-hand side as having zero imaginary part, and then `out.im` must be present.
 *
 * @example
 * solveLdl(factor, { n, k: 1, re: b, im: null }, { n, k: 1, re: x, im: null });
 */
export function solveLdl(factor: LdlFactor, rhs: StateBlock, out: StateBlock): void {
  const { n } = factor.symbolic;
  if (rhs.n !== n || out.n !== n) throw new RangeError(`right-hand side and output must have n = ${n} rows`);
  if (rhs.k !== out.k) throw new RangeError(`right-hand side has ${rhs.k} columns but output has ${out.k}`);
  const k = rhs.k;
  if (k === 0 || n === 0) return;
  const wantComplex = factor.complex || rhs.im !== null;
  if (wantComplex && !out.im) throw new RangeError('output block needs an imaginary part for a complex solve');
  if (!factor.complex) {
    // Real factor: every real column (and imaginary column) is an independent real solve.
    const columns = rhs.im ? 2 * k : k;
    const work = new Float64Array(n * columns);
    gather(factor.symbolic.perm, rhs.re, k, work, columns, 0);
    if (rhs.im) gather(factor.symbolic.perm, rhs.im, k, work, columns, k);
    solveReal(factor, work, columns);
    scatter(factor.symbolic.perm, work, columns, 0, out.re, k);
    if (rhs.im) scatter(factor.symbolic.perm, work, columns, k, out.im!, k);
    else if (out.im) out.im.fill(0);
    return;
  }
  // Complex work array with the real and imaginary parts of each entry side by side (see solveComplex).
  const work = new Float64Array(2 * n * k);
  gatherComplex(factor.symbolic.perm, rhs.re, rhs.im, k, work);
  solveComplex(factor, work, k);
  scatterComplex(factor.symbolic.perm, work, k, out.re, out.im!);
}

// ---------------------------------------------------------------------------------------------------------
// Symbolic helpers

function checkPattern(matrix: Pick<CsrMatrix, 'n' | 'rowPtr' | 'colIdx'>): void {
  const { n, rowPtr, colIdx } = matrix;
  if (!Number.isInteger(n) || n < 0) throw new RangeError(`matrix.n must be a non-negative integer, got ${n}`);
  if (rowPtr.length !== n + 1) throw new RangeError(`matrix.rowPtr must have length n + 1 = ${n + 1}`);
  if (rowPtr[0] !== 0 || rowPtr[n] !== colIdx.length) throw new RangeError('matrix.rowPtr must start at 0 and end at colIdx.length');
}

/** Relaxed amalgamation thresholds (pivots per supernode, largest fraction of explicit zeros): CHOLMOD's defaults. */
const RELAX_COLUMNS = [4, 16, 48];
const RELAX_ZEROS = [0.8, 0.1, 0.05];

/**
 * Supernode boundaries: fundamental supernodes, then a chain of supernodes is merged into its parent when the
 * merged front stores few explicit zeros (relaxed amalgamation, Ashcraft & Grimes 1989; thresholds as in
 * CHOLMOD, Chen, Davis, Hager & Rajamanickam, ACM TOMS 35, 22 (2008)). Larger dense blocks run faster than
 * the zeros they add cost.
 */
function relaxedSupernodes(n: number, parent: Int32Array, counts: Int32Array): number[] {
  if (n === 0) return [0];
  // Each entry: first pivot, number of pivots, front rows, true nonzeros.
  const first: number[] = [];
  const cols: number[] = [];
  const rows: number[] = [];
  const nonzeros: number[] = [];
  let j = 0;
  while (j < n) {
    let l = j + 1;
    while (l < n && parent[l - 1] === l && counts[l - 1] === counts[l] + 1) l++;
    let f = j;
    let ncol = l - j;
    let m = counts[j];
    let nz = 0;
    for (let t = j; t < l; t++) nz += counts[t];
    // Merge the preceding supernode(s) while they are children of this one and the zeros stay acceptable.
    while (first.length > 0 && parent[f - 1] >= f && parent[f - 1] < f + ncol) {
      const top = first.length - 1;
      const mc = cols[top] + ncol;
      const mm = cols[top] + m;
      const mnz = nonzeros[top] + nz;
      const dense = mc * mm - (mc * (mc - 1)) / 2;
      const zeros = (dense - mnz) / dense;
      const accept = mc <= RELAX_COLUMNS[0] || (mc <= RELAX_COLUMNS[1] && zeros < RELAX_ZEROS[0]) ||
        (mc <= RELAX_COLUMNS[2] && zeros < RELAX_ZEROS[1]) || zeros < RELAX_ZEROS[2];
      if (!accept) break;
      f = first[top];
      ncol = mc;
      m = mm;
      nz = mnz;
      first.pop();
      cols.pop();
      rows.pop();
      nonzeros.pop();
    }
    first.push(f);
    cols.push(ncol);
    rows.push(m);
    nonzeros.push(nz);
    j = l;
  }
  return [...first, n];
}

/** Elimination tree of P A P^T (parent -1 at roots), with path compression through `ancestor`. */
function eliminationTree(n: number, rowPtr: Int32Array, colIdx: Int32Array, perm: Int32Array, inverse: Int32Array): Int32Array {
  const parent = new Int32Array(n);
  const ancestor = new Int32Array(n);
  for (let k = 0; k < n; k++) {
    parent[k] = -1;
    ancestor[k] = -1;
    const p = perm[k];
    for (let q = rowPtr[p]; q < rowPtr[p + 1]; q++) {
      let i = inverse[colIdx[q]];
      while (i !== -1 && i < k) {
        const next = ancestor[i];
        ancestor[i] = k;
        if (next === -1) {
          parent[i] = k;
          break;
        }
        i = next;
      }
    }
  }
  return parent;
}

/** Postorder of a forest given by parent pointers: post[k] = node visited k-th (children in index order). */
function postorder(parent: Int32Array): Int32Array {
  const n = parent.length;
  const head = new Int32Array(n).fill(-1);
  const next = new Int32Array(n).fill(-1);
  for (let j = n - 1; j >= 0; j--) {
    const p = parent[j];
    if (p !== -1) {
      next[j] = head[p];
      head[p] = j;
    }
  }
  const post = new Int32Array(n);
  const stack = new Int32Array(n);
  let k = 0;
  for (let root = 0; root < n; root++) {
    if (parent[root] !== -1) continue;
    let top = 0;
    stack[0] = root;
    while (top >= 0) {
      const v = stack[top];
      const child = head[v];
      if (child === -1) {
        top--;
        post[k++] = v;
      } else {
        head[v] = next[child];
        stack[++top] = child;
      }
    }
  }
  return post;
}

/** Column counts of L (diagonal included) by walking each row subtree of the elimination tree. */
function columnCounts(
  n: number,
  rowPtr: Int32Array,
  colIdx: Int32Array,
  perm: Int32Array,
  inverse: Int32Array,
  parent: Int32Array,
): Int32Array {
  const counts = new Int32Array(n);
  const mark = new Int32Array(n).fill(-1);
  for (let k = 0; k < n; k++) {
    mark[k] = k;
    counts[k]++;
    const p = perm[k];
    for (let q = rowPtr[p]; q < rowPtr[p + 1]; q++) {
      let i = inverse[colIdx[q]];
      while (i < k && mark[i] !== k) {
        counts[i]++;
        mark[i] = k;
        i = parent[i];
      }
    }
  }
  return counts;
}

function diagonalScale(matrix: CsrMatrix, sigma: number): number {
  let scale = 0;
  const { n, rowPtr, colIdx, re } = matrix;
  for (let i = 0; i < n; i++) {
    let diag = -sigma;
    for (let q = rowPtr[i]; q < rowPtr[i + 1]; q++) if (colIdx[q] === i) diag += re[q];
    if (Math.abs(diag) > scale) scale = Math.abs(diag);
  }
  return scale > 0 ? scale : 1;
}

// ---------------------------------------------------------------------------------------------------------
// Numeric factorisation

interface FactorContext {
  symbolic: LdlSymbolic;
  matrix: CsrMatrix;
  sigma: number;
  lre: Float64Array;
  lim: Float64Array | null;
  d: Float64Array;
  tiny: number;
  allowIndefinite: boolean;
  negative: number;
}

function checkPivot(context: FactorContext, k: number, pivot: number): void {
  if (!(Math.abs(pivot) > context.tiny)) {
    const index = context.symbolic.perm[k];
    throw new LdlPivotError(
      `LDL factorisation failed: A - sigma I is singular to working precision (pivot ${pivot} at unknown ${index}, sigma = ${context.sigma}); ` +
        'sigma is (numerically) an eigenvalue: move sigma',
      'singular',
      index,
      pivot,
    );
  }
  if (pivot < 0) {
    if (!context.allowIndefinite) {
      const index = context.symbolic.perm[k];
      throw new LdlPivotError(
        `LDL factorisation failed: A - sigma I is not positive definite (negative pivot ${pivot} at unknown ${index}, sigma = ${context.sigma}); ` +
          'sigma must lie below the lowest eigenvalue',
        'indefinite',
        index,
        pivot,
      );
    }
    context.negative++;
  }
}

function factorReal(context: FactorContext): void {
  const { symbolic, matrix, sigma, lre: L, d } = context;
  const { superCount, superStart, superRowPtr, superRowIdx, superParent, panelOffset, lowerPtr, lowerRow, lowerSource } = symbolic;
  const values = matrix.re;
  const rel = new Int32Array(symbolic.n);
  const updates: Array<Float64Array | null> = new Array(superCount).fill(null);
  const { head, next } = childLists(superParent);
  let loc = new Int32Array(64);
  for (let s = 0; s < superCount; s++) {
    const f = superStart[s];
    const ncol = superStart[s + 1] - f;
    const rs = superRowPtr[s];
    const m = superRowPtr[s + 1] - rs;
    const m2 = m - ncol;
    const off = panelOffset[s];
    for (let t = 0; t < m; t++) rel[superRowIdx[rs + t]] = t;
    const U = m2 > 0 ? new Float64Array(m2 * m2) : null;

    // Assemble the original entries and the shift.
    for (let jj = 0; jj < ncol; jj++) {
      const base = off + jj * m;
      const j = f + jj;
      for (let q = lowerPtr[j]; q < lowerPtr[j + 1]; q++) L[base + rel[lowerRow[q]]] += values[lowerSource[q]];
      L[base + jj] -= sigma;
    }
    // Extend-add the children's update matrices.
    for (let c = head[s]; c !== -1; c = next[c]) {
      const Uc = updates[c]!;
      updates[c] = null;
      const crs = superRowPtr[c] + (superStart[c + 1] - superStart[c]);
      const mc = superRowPtr[c + 1] - crs;
      if (loc.length < mc) loc = new Int32Array(2 * mc);
      for (let a = 0; a < mc; a++) loc[a] = rel[superRowIdx[crs + a]];
      for (let b = 0; b < mc; b++) {
        const gb = loc[b];
        const src = b * mc;
        if (gb < ncol) {
          const dst = off + gb * m;
          for (let a = b; a < mc; a++) L[dst + loc[a]] += Uc[src + a];
        } else {
          const dst = (gb - ncol) * m2 - ncol;
          for (let a = b; a < mc; a++) U![dst + loc[a]] += Uc[src + a];
        }
      }
    }
    // Dense LDL^T of the pivot columns (right-looking inside the panel).
    for (let k = 0; k < ncol; k++) {
      const ck = off + k * m;
      const pivot = L[ck + k];
      checkPivot(context, f + k, pivot);
      d[f + k] = pivot;
      const inv = 1 / pivot;
      for (let i = k + 1; i < m; i++) L[ck + i] *= inv;
      for (let j = k + 1; j < ncol; j++) {
        const coeff = L[ck + j] * pivot;
        if (coeff === 0) continue;
        const cj = off + j * m;
        for (let i = j; i < m; i++) L[cj + i] -= L[ck + i] * coeff;
      }
    }
    // Schur complement U -= L21 D L21^T, four pivot columns at a time to reuse each pass over U.
    if (U) {
      schurReal(L, d, off, f, m, ncol, m2, U);
      updates[s] = U;
    }
  }
}

function schurReal(L: Float64Array, d: Float64Array, off: number, f: number, m: number, ncol: number, m2: number, U: Float64Array): void {
  let k = 0;
  for (; k + 3 < ncol; k += 4) {
    const c0 = off + k * m + ncol;
    const c1 = c0 + m;
    const c2 = c1 + m;
    const c3 = c2 + m;
    const d0 = d[f + k];
    const d1 = d[f + k + 1];
    const d2 = d[f + k + 2];
    const d3 = d[f + k + 3];
    for (let b = 0; b < m2; b++) {
      const w0 = L[c0 + b] * d0;
      const w1 = L[c1 + b] * d1;
      const w2 = L[c2 + b] * d2;
      const w3 = L[c3 + b] * d3;
      if (w0 === 0 && w1 === 0 && w2 === 0 && w3 === 0) continue;
      const ub = b * m2;
      for (let a = b; a < m2; a++) {
        U[ub + a] -= L[c0 + a] * w0 + L[c1 + a] * w1 + L[c2 + a] * w2 + L[c3 + a] * w3;
      }
    }
  }
  for (; k < ncol; k++) {
    const c0 = off + k * m + ncol;
    const d0 = d[f + k];
    for (let b = 0; b < m2; b++) {
      const w0 = L[c0 + b] * d0;
      if (w0 === 0) continue;
      const ub = b * m2;
      for (let a = b; a < m2; a++) U[ub + a] -= L[c0 + a] * w0;
    }
  }
}

function factorComplex(context: FactorContext): void {
  const { symbolic, matrix, sigma, lre: R, d } = context;
  const I = context.lim!;
  const { superCount, superStart, superRowPtr, superRowIdx, superParent, panelOffset, lowerPtr, lowerRow, lowerSource } = symbolic;
  const vre = matrix.re;
  const vim = matrix.im!;
  const rel = new Int32Array(symbolic.n);
  const updRe: Array<Float64Array | null> = new Array(superCount).fill(null);
  const updIm: Array<Float64Array | null> = new Array(superCount).fill(null);
  const { head, next } = childLists(superParent);
  let loc = new Int32Array(64);
  for (let s = 0; s < superCount; s++) {
    const f = superStart[s];
    const ncol = superStart[s + 1] - f;
    const rs = superRowPtr[s];
    const m = superRowPtr[s + 1] - rs;
    const m2 = m - ncol;
    const off = panelOffset[s];
    for (let t = 0; t < m; t++) rel[superRowIdx[rs + t]] = t;
    const Ure = m2 > 0 ? new Float64Array(m2 * m2) : null;
    const Uim = m2 > 0 ? new Float64Array(m2 * m2) : null;

    // C[i][j] (i >= j) = conj(A[perm[j]][perm[i]]): the CSR row of perm[j] holds the conjugate.
    for (let jj = 0; jj < ncol; jj++) {
      const base = off + jj * m;
      const j = f + jj;
      for (let q = lowerPtr[j]; q < lowerPtr[j + 1]; q++) {
        const at = base + rel[lowerRow[q]];
        R[at] += vre[lowerSource[q]];
        I[at] -= vim[lowerSource[q]];
      }
      R[base + jj] -= sigma;
    }
    for (let c = head[s]; c !== -1; c = next[c]) {
      const Ucr = updRe[c]!;
      const Uci = updIm[c]!;
      updRe[c] = null;
      updIm[c] = null;
      const crs = superRowPtr[c] + (superStart[c + 1] - superStart[c]);
      const mc = superRowPtr[c + 1] - crs;
      if (loc.length < mc) loc = new Int32Array(2 * mc);
      for (let a = 0; a < mc; a++) loc[a] = rel[superRowIdx[crs + a]];
      for (let b = 0; b < mc; b++) {
        const gb = loc[b];
        const src = b * mc;
        if (gb < ncol) {
          const dst = off + gb * m;
          for (let a = b; a < mc; a++) {
            R[dst + loc[a]] += Ucr[src + a];
            I[dst + loc[a]] += Uci[src + a];
          }
        } else {
          const dst = (gb - ncol) * m2 - ncol;
          for (let a = b; a < mc; a++) {
            Ure![dst + loc[a]] += Ucr[src + a];
            Uim![dst + loc[a]] += Uci[src + a];
          }
        }
      }
    }
    for (let k = 0; k < ncol; k++) {
      const ck = off + k * m;
      const pivot = R[ck + k];
      checkPivot(context, f + k, pivot);
      d[f + k] = pivot;
      I[ck + k] = 0;
      const inv = 1 / pivot;
      for (let i = k + 1; i < m; i++) {
        R[ck + i] *= inv;
        I[ck + i] *= inv;
      }
      // P[i][j] -= L[i][k] d conj(L[j][k])
      for (let j = k + 1; j < ncol; j++) {
        const wr = R[ck + j] * pivot;
        const wi = -I[ck + j] * pivot;
        if (wr === 0 && wi === 0) continue;
        const cj = off + j * m;
        for (let i = j; i < m; i++) {
          const lr = R[ck + i];
          const li = I[ck + i];
          R[cj + i] -= lr * wr - li * wi;
          I[cj + i] -= lr * wi + li * wr;
        }
      }
    }
    if (Ure && Uim) {
      schurComplex(R, I, d, off, f, m, ncol, m2, Ure, Uim);
      updRe[s] = Ure;
      updIm[s] = Uim;
    }
  }
}

function schurComplex(
  R: Float64Array,
  I: Float64Array,
  d: Float64Array,
  off: number,
  f: number,
  m: number,
  ncol: number,
  m2: number,
  Ure: Float64Array,
  Uim: Float64Array,
): void {
  let k = 0;
  for (; k + 1 < ncol; k += 2) {
    const c0 = off + k * m + ncol;
    const c1 = c0 + m;
    const d0 = d[f + k];
    const d1 = d[f + k + 1];
    for (let b = 0; b < m2; b++) {
      // w = d conj(L[b][k])
      const w0r = R[c0 + b] * d0;
      const w0i = -I[c0 + b] * d0;
      const w1r = R[c1 + b] * d1;
      const w1i = -I[c1 + b] * d1;
      if (w0r === 0 && w0i === 0 && w1r === 0 && w1i === 0) continue;
      const ub = b * m2;
      for (let a = b; a < m2; a++) {
        const a0r = R[c0 + a];
        const a0i = I[c0 + a];
        const a1r = R[c1 + a];
        const a1i = I[c1 + a];
        Ure[ub + a] -= a0r * w0r - a0i * w0i + a1r * w1r - a1i * w1i;
        Uim[ub + a] -= a0r * w0i + a0i * w0r + a1r * w1i + a1i * w1r;
      }
    }
  }
  for (; k < ncol; k++) {
    const c0 = off + k * m + ncol;
    const d0 = d[f + k];
    for (let b = 0; b < m2; b++) {
      const w0r = R[c0 + b] * d0;
      const w0i = -I[c0 + b] * d0;
      if (w0r === 0 && w0i === 0) continue;
      const ub = b * m2;
      for (let a = b; a < m2; a++) {
        const a0r = R[c0 + a];
        const a0i = I[c0 + a];
        Ure[ub + a] -= a0r * w0r - a0i * w0i;
        Uim[ub + a] -= a0r * w0i + a0i * w0r;
      }
    }
  }
}

function childLists(superParent: Int32Array): { head: Int32Array; next: Int32Array } {
  const count = superParent.length;
  const head = new Int32Array(count).fill(-1);
  const next = new Int32Array(count).fill(-1);
  for (let s = count - 1; s >= 0; s--) {
    const p = superParent[s];
    if (p >= 0) {
      next[s] = head[p];
      head[p] = s;
    }
  }
  return { head, next };
}

// ---------------------------------------------------------------------------------------------------------
// Triangular solves on row-interleaved work arrays: work[i * columns + c] is row i (permuted) of column c.

function gather(perm: Int32Array, src: Float64Array, k: number, work: Float64Array, columns: number, firstColumn: number): void {
  const n = perm.length;
  for (let c = 0; c < k; c++) {
    const base = c * n;
    const wc = firstColumn + c;
    for (let i = 0; i < n; i++) work[i * columns + wc] = src[base + perm[i]];
  }
}

function scatter(perm: Int32Array, work: Float64Array, columns: number, firstColumn: number, dst: Float64Array, k: number): void {
  const n = perm.length;
  for (let c = 0; c < k; c++) {
    const base = c * n;
    const wc = firstColumn + c;
    for (let i = 0; i < n; i++) dst[base + perm[i]] = work[i * columns + wc];
  }
}

/** Columns of src (column-major, k columns) into the interleaved complex work array, rows permuted (see solveComplex). */
function gatherComplex(perm: Int32Array, re: Float64Array, im: Float64Array | null, k: number, work: Float64Array): void {
  const n = perm.length;
  for (let i = 0; i < n; i++) {
    const from = perm[i];
    const row = 2 * i * k;
    for (let c = 0; c < k; c++) {
      work[row + 2 * c] = re[c * n + from];
      work[row + 2 * c + 1] = im ? im[c * n + from] : 0;
    }
  }
}

/** Inverse of gatherComplex. */
function scatterComplex(perm: Int32Array, work: Float64Array, k: number, re: Float64Array, im: Float64Array): void {
  const n = perm.length;
  for (let i = 0; i < n; i++) {
    const to = perm[i];
    const row = 2 * i * k;
    for (let c = 0; c < k; c++) {
      re[c * n + to] = work[row + 2 * c];
      im[c * n + to] = work[row + 2 * c + 1];
    }
  }
}

/** Right-hand sides per sweep over the factor (values or sums then live in registers): measured 25-30% faster for 4-5 columns than a loop over columns. */
const SOLVE_GROUP = 6;

function solveReal(factor: LdlFactor, W: Float64Array, k: number): void {
  const { n } = factor.symbolic;
  const d = factor.d;
  // Columns in balanced groups of at most SOLVE_GROUP (e.g. 5 = one group, 7 = 4 + 3).
  const groups = Math.ceil(k / SOLVE_GROUP);
  const size = Math.ceil(k / groups);
  for (let c0 = 0; c0 < k; c0 += size) forwardReal(factor, W, k, c0, Math.min(size, k - c0));
  for (let i = 0; i < n; i++) {
    const inv = 1 / d[i];
    for (let c = 0; c < k; c++) W[i * k + c] *= inv;
  }
  for (let c0 = 0; c0 < k; c0 += size) backwardReal(factor, W, k, c0, Math.min(size, k - c0));
}

/** L y = b on columns [c0, c0 + w) (w <= SOLVE_GROUP) of the row-interleaved work array. */
function forwardReal(factor: LdlFactor, W: Float64Array, k: number, c0: number, w: number): void {
  const { superCount, superStart, superRowPtr, superRowIdx, panelOffset } = factor.symbolic;
  const L = factor.lre;
  for (let s = 0; s < superCount; s++) {
    const f = superStart[s];
    const ncol = superStart[s + 1] - f;
    const rs = superRowPtr[s];
    const m = superRowPtr[s + 1] - rs;
    const off = panelOffset[s];
    for (let jj = 0; jj < ncol; jj++) {
      const base = off + jj * m;
      const src = (f + jj) * k + c0;
      const x0 = W[src];
      const x1 = w > 1 ? W[src + 1] : 0;
      const x2 = w > 2 ? W[src + 2] : 0;
      const x3 = w > 3 ? W[src + 3] : 0;
      const x4 = w > 4 ? W[src + 4] : 0;
      const x5 = w > 5 ? W[src + 5] : 0;
      if (w === 4) {
        // The common block of four, without per-column tests.
        for (let t = jj + 1; t < m; t++) {
          const lv = L[base + t];
          const dst = superRowIdx[rs + t] * k + c0;
          W[dst] -= lv * x0;
          W[dst + 1] -= lv * x1;
          W[dst + 2] -= lv * x2;
          W[dst + 3] -= lv * x3;
        }
        continue;
      }
      if (w === 5) {
        // k + guard = 5 for the usual k = 4: the block of five, without per-column tests.
        for (let t = jj + 1; t < m; t++) {
          const lv = L[base + t];
          const dst = superRowIdx[rs + t] * k + c0;
          W[dst] -= lv * x0;
          W[dst + 1] -= lv * x1;
          W[dst + 2] -= lv * x2;
          W[dst + 3] -= lv * x3;
          W[dst + 4] -= lv * x4;
        }
        continue;
      }
      for (let t = jj + 1; t < m; t++) {
        const lv = L[base + t];
        const dst = superRowIdx[rs + t] * k + c0;
        W[dst] -= lv * x0;
        if (w > 1) W[dst + 1] -= lv * x1;
        if (w > 2) W[dst + 2] -= lv * x2;
        if (w > 3) W[dst + 3] -= lv * x3;
        if (w > 4) W[dst + 4] -= lv * x4;
        if (w > 5) W[dst + 5] -= lv * x5;
      }
    }
  }
}

/** L^T x = y on columns [c0, c0 + w) (w <= SOLVE_GROUP) of the row-interleaved work array. */
function backwardReal(factor: LdlFactor, W: Float64Array, k: number, c0: number, w: number): void {
  const { superCount, superStart, superRowPtr, superRowIdx, panelOffset } = factor.symbolic;
  const L = factor.lre;
  for (let s = superCount - 1; s >= 0; s--) {
    const f = superStart[s];
    const ncol = superStart[s + 1] - f;
    const rs = superRowPtr[s];
    const m = superRowPtr[s + 1] - rs;
    const off = panelOffset[s];
    for (let jj = ncol - 1; jj >= 0; jj--) {
      const base = off + jj * m;
      const dst = (f + jj) * k + c0;
      let s0 = 0;
      let s1 = 0;
      let s2 = 0;
      let s3 = 0;
      let s4 = 0;
      let s5 = 0;
      if (w === 4) {
        for (let t = jj + 1; t < m; t++) {
          const lv = L[base + t];
          const src = superRowIdx[rs + t] * k + c0;
          s0 += lv * W[src];
          s1 += lv * W[src + 1];
          s2 += lv * W[src + 2];
          s3 += lv * W[src + 3];
        }
      } else if (w === 5) {
        for (let t = jj + 1; t < m; t++) {
          const lv = L[base + t];
          const src = superRowIdx[rs + t] * k + c0;
          s0 += lv * W[src];
          s1 += lv * W[src + 1];
          s2 += lv * W[src + 2];
          s3 += lv * W[src + 3];
          s4 += lv * W[src + 4];
        }
      } else {
        for (let t = jj + 1; t < m; t++) {
          const lv = L[base + t];
          const src = superRowIdx[rs + t] * k + c0;
          s0 += lv * W[src];
          if (w > 1) s1 += lv * W[src + 1];
          if (w > 2) s2 += lv * W[src + 2];
          if (w > 3) s3 += lv * W[src + 3];
          if (w > 4) s4 += lv * W[src + 4];
          if (w > 5) s5 += lv * W[src + 5];
        }
      }
      W[dst] -= s0;
      if (w > 1) W[dst + 1] -= s1;
      if (w > 2) W[dst + 2] -= s2;
      if (w > 3) W[dst + 3] -= s3;
      if (w > 4) W[dst + 4] -= s4;
      if (w > 5) W[dst + 5] -= s5;
    }
  }
}

/**
 * Complex right-hand sides per sweep over the factor (their real and imaginary parts then live in registers).
 * Measured on the unit disk at h = 1/160 (k = 5): one sweep of five takes about 35% less time than the former loop
 * over separate real and imaginary arrays; groups of 3 + 2 were no faster than that loop (two passes over L).
 */
const COMPLEX_SOLVE_GROUP = 5;

/**
 * (L D L^H) X = B on the interleaved work array: W[2 (i k + c)] and W[2 (i k + c) + 1] are the real and imaginary
 * parts of row i (permuted) of column c. Columns go in balanced groups of at most COMPLEX_SOLVE_GROUP; every entry
 * sees the same operations in the same order whatever the grouping, so the result does not depend on it.
 */
function solveComplex(factor: LdlFactor, W: Float64Array, k: number): void {
  const { n } = factor.symbolic;
  const d = factor.d;
  const groups = Math.ceil(k / COMPLEX_SOLVE_GROUP);
  const size = Math.ceil(k / groups);
  for (let c0 = 0; c0 < k; c0 += size) forwardComplex(factor, W, k, c0, Math.min(size, k - c0));
  for (let i = 0; i < n; i++) {
    const inv = 1 / d[i];
    for (let q = 2 * i * k; q < 2 * (i + 1) * k; q++) W[q] *= inv;
  }
  for (let c0 = 0; c0 < k; c0 += size) backwardComplex(factor, W, k, c0, Math.min(size, k - c0));
}

/** L y = b on complex columns [c0, c0 + w) (w <= COMPLEX_SOLVE_GROUP): y[t] -= L[t][j] y[j]. */
function forwardComplex(factor: LdlFactor, W: Float64Array, k: number, c0: number, w: number): void {
  const { superCount, superStart, superRowPtr, superRowIdx, panelOffset } = factor.symbolic;
  const R = factor.lre;
  const I = factor.lim!;
  const k2 = 2 * k;
  const o = 2 * c0;
  for (let s = 0; s < superCount; s++) {
    const f = superStart[s];
    const ncol = superStart[s + 1] - f;
    const rs = superRowPtr[s];
    const m = superRowPtr[s + 1] - rs;
    const off = panelOffset[s];
    for (let jj = 0; jj < ncol; jj++) {
      const base = off + jj * m;
      const src = (f + jj) * k2 + o;
      const x0r = W[src];
      const x0i = W[src + 1];
      const x1r = w > 1 ? W[src + 2] : 0;
      const x1i = w > 1 ? W[src + 3] : 0;
      const x2r = w > 2 ? W[src + 4] : 0;
      const x2i = w > 2 ? W[src + 5] : 0;
      const x3r = w > 3 ? W[src + 6] : 0;
      const x3i = w > 3 ? W[src + 7] : 0;
      const x4r = w > 4 ? W[src + 8] : 0;
      const x4i = w > 4 ? W[src + 9] : 0;
      if (w === 5) {
        // The usual block of five (k + guard for k = 4), without per-column tests; the same updates as below.
        for (let t = jj + 1; t < m; t++) {
          const lr = R[base + t];
          const li = I[base + t];
          if (lr === 0 && li === 0) continue;
          const dst = superRowIdx[rs + t] * k2 + o;
          W[dst] -= lr * x0r - li * x0i;
          W[dst + 1] -= lr * x0i + li * x0r;
          W[dst + 2] -= lr * x1r - li * x1i;
          W[dst + 3] -= lr * x1i + li * x1r;
          W[dst + 4] -= lr * x2r - li * x2i;
          W[dst + 5] -= lr * x2i + li * x2r;
          W[dst + 6] -= lr * x3r - li * x3i;
          W[dst + 7] -= lr * x3i + li * x3r;
          W[dst + 8] -= lr * x4r - li * x4i;
          W[dst + 9] -= lr * x4i + li * x4r;
        }
        continue;
      }
      for (let t = jj + 1; t < m; t++) {
        const lr = R[base + t];
        const li = I[base + t];
        if (lr === 0 && li === 0) continue;
        const dst = superRowIdx[rs + t] * k2 + o;
        W[dst] -= lr * x0r - li * x0i;
        W[dst + 1] -= lr * x0i + li * x0r;
        if (w > 1) {
          W[dst + 2] -= lr * x1r - li * x1i;
          W[dst + 3] -= lr * x1i + li * x1r;
          if (w > 2) {
            W[dst + 4] -= lr * x2r - li * x2i;
            W[dst + 5] -= lr * x2i + li * x2r;
            if (w > 3) {
              W[dst + 6] -= lr * x3r - li * x3i;
              W[dst + 7] -= lr * x3i + li * x3r;
              if (w > 4) {
                W[dst + 8] -= lr * x4r - li * x4i;
                W[dst + 9] -= lr * x4i + li * x4r;
              }
            }
          }
        }
      }
    }
  }
}

/** L^H x = y on complex columns [c0, c0 + w) (w <= COMPLEX_SOLVE_GROUP): x[j] -= conj(L[t][j]) x[t]. */
function backwardComplex(factor: LdlFactor, W: Float64Array, k: number, c0: number, w: number): void {
  const { superCount, superStart, superRowPtr, superRowIdx, panelOffset } = factor.symbolic;
  const R = factor.lre;
  const I = factor.lim!;
  const k2 = 2 * k;
  const o = 2 * c0;
  for (let s = superCount - 1; s >= 0; s--) {
    const f = superStart[s];
    const ncol = superStart[s + 1] - f;
    const rs = superRowPtr[s];
    const m = superRowPtr[s + 1] - rs;
    const off = panelOffset[s];
    for (let jj = ncol - 1; jj >= 0; jj--) {
      const base = off + jj * m;
      const dst = (f + jj) * k2 + o;
      // Running values start from the entry itself, so each subtraction rounds exactly as an in-place update would.
      let s0r = W[dst];
      let s0i = W[dst + 1];
      let s1r = w > 1 ? W[dst + 2] : 0;
      let s1i = w > 1 ? W[dst + 3] : 0;
      let s2r = w > 2 ? W[dst + 4] : 0;
      let s2i = w > 2 ? W[dst + 5] : 0;
      let s3r = w > 3 ? W[dst + 6] : 0;
      let s3i = w > 3 ? W[dst + 7] : 0;
      let s4r = w > 4 ? W[dst + 8] : 0;
      let s4i = w > 4 ? W[dst + 9] : 0;
      if (w === 5) {
        // The usual block of five, without per-column tests; the same updates as below.
        for (let t = jj + 1; t < m; t++) {
          const lr = R[base + t];
          const li = I[base + t];
          if (lr === 0 && li === 0) continue;
          const src = superRowIdx[rs + t] * k2 + o;
          const y0r = W[src];
          const y0i = W[src + 1];
          s0r -= lr * y0r + li * y0i;
          s0i -= lr * y0i - li * y0r;
          const y1r = W[src + 2];
          const y1i = W[src + 3];
          s1r -= lr * y1r + li * y1i;
          s1i -= lr * y1i - li * y1r;
          const y2r = W[src + 4];
          const y2i = W[src + 5];
          s2r -= lr * y2r + li * y2i;
          s2i -= lr * y2i - li * y2r;
          const y3r = W[src + 6];
          const y3i = W[src + 7];
          s3r -= lr * y3r + li * y3i;
          s3i -= lr * y3i - li * y3r;
          const y4r = W[src + 8];
          const y4i = W[src + 9];
          s4r -= lr * y4r + li * y4i;
          s4i -= lr * y4i - li * y4r;
        }
        W[dst] = s0r;
        W[dst + 1] = s0i;
        W[dst + 2] = s1r;
        W[dst + 3] = s1i;
        W[dst + 4] = s2r;
        W[dst + 5] = s2i;
        W[dst + 6] = s3r;
        W[dst + 7] = s3i;
        W[dst + 8] = s4r;
        W[dst + 9] = s4i;
        continue;
      }
      for (let t = jj + 1; t < m; t++) {
        const lr = R[base + t];
        const li = I[base + t];
        if (lr === 0 && li === 0) continue;
        const src = superRowIdx[rs + t] * k2 + o;
        const y0r = W[src];
        const y0i = W[src + 1];
        s0r -= lr * y0r + li * y0i;
        s0i -= lr * y0i - li * y0r;
        if (w > 1) {
          const y1r = W[src + 2];
          const y1i = W[src + 3];
          s1r -= lr * y1r + li * y1i;
          s1i -= lr * y1i - li * y1r;
          if (w > 2) {
            const y2r = W[src + 4];
            const y2i = W[src + 5];
            s2r -= lr * y2r + li * y2i;
            s2i -= lr * y2i - li * y2r;
            if (w > 3) {
              const y3r = W[src + 6];
              const y3i = W[src + 7];
              s3r -= lr * y3r + li * y3i;
              s3i -= lr * y3i - li * y3r;
              if (w > 4) {
                const y4r = W[src + 8];
                const y4i = W[src + 9];
                s4r -= lr * y4r + li * y4i;
                s4i -= lr * y4i - li * y4r;
              }
            }
          }
        }
      }
      W[dst] = s0r;
      W[dst + 1] = s0i;
      if (w > 1) {
        W[dst + 2] = s1r;
        W[dst + 3] = s1i;
        if (w > 2) {
          W[dst + 4] = s2r;
          W[dst + 5] = s2i;
          if (w > 3) {
            W[dst + 6] = s3r;
            W[dst + 7] = s3i;
            if (w > 4) {
              W[dst + 8] = s4r;
              W[dst + 9] = s4i;
            }
          }
        }
      }
    }
  }
}
