// Block operations on column-major views of vectors (real or complex) for LOBPCG and shift-invert: Gram matrices
// U^H V, linear combinations S C, column copies, norms and scaling. The long loops are the fast kernels next door.
import type { StateBlock } from '../types';
import { combineColumns } from './block-combine';
import { projectCoefficients } from './block-project';
import { subtractProjection } from './block-subtract';

/** A block view: column c of the block is at [(off + c) * n, (off + c + 1) * n) of re (and im when complex). */
export interface Cols {
  re: Float64Array;
  im: Float64Array | null;
  off: number;
}

/** The view of a whole StateBlock (column 0 at offset 0). */
export function asCols(block: StateBlock): Cols {
  return { re: block.re, im: block.im, off: 0 };
}

/** Columns [off, off + count) of a view as raw arrays starting at its first column. */
function span(n: number, A: Cols, count: number): { re: Float64Array; im: Float64Array | null } {
  const from = A.off * n;
  const to = (A.off + count) * n;
  return { re: A.re.subarray(from, to), im: A.im ? A.im.subarray(from, to) : null };
}

/** Both views real, or both complex with gi present: the kernels do not mix the two. */
function checkSameKind(U: Cols, V: Cols, gi: Float64Array | null): void {
  if ((U.im === null) !== (V.im === null) || (U.im !== null && gi === null)) {
    throw new TypeError('block-ops: both blocks (and the coefficients) must be real, or all complex');
  }
}

/**
 * G = U^H V (cu x cv, row-major in gr/gi: G[p * cv + q] = sum_r conj(U_p[r]) V_q[r]), by projectCoefficients.
 * U and V are both real (gi may be null) or both complex (gi required).
 * @example
 * gram(n, { re: x, im: null, off: 0 }, 2, { re: x, im: null, off: 0 }, 2, g, null); // 2 x 2 overlap matrix
 */
export function gram(n: number, U: Cols, cu: number, V: Cols, cv: number, gr: Float64Array, gi: Float64Array | null): void {
  checkSameKind(U, V, gi);
  const u = span(n, U, cu);
  const v = span(n, V, cv);
  projectCoefficients(u.re, u.im, cu, v.re, v.im, cv, n, gr, u.im ? gi : null);
}

/**
 * out[:, j] (=|-=) sum_l S[:, l] C[l, cOff + j] for j < cout, l < cs; C row-major with leading dimension ldc.
 * `out` must not overlap the columns of S. S, C and out are all real (ci null) or all complex.
 * Subtracting uses subtractProjection, assigning uses combineColumns (on a compact copy of the used part of C).
 * @param subtract - false: out = S C; true: out -= S C
 */
export function combine(
  n: number,
  S: Cols,
  cs: number,
  cr: Float64Array,
  ci: Float64Array | null,
  ldc: number,
  cOff: number,
  out: Cols,
  cout: number,
  subtract: boolean,
): void {
  checkSameKind(S, out, S.im ? ci : null);
  if (S.im === null && ci !== null) throw new TypeError('block-ops: complex coefficients need complex blocks');
  const s = span(n, S, cs);
  const o = span(n, out, cout);
  const complex = s.im !== null;
  if (subtract) {
    // subtractProjection reads C[l * cout + j]: the used columns of C, packed.
    const pr = new Float64Array(cs * cout);
    const pi = complex ? new Float64Array(cs * cout) : null;
    for (let l = 0; l < cs; l++) {
      for (let j = 0; j < cout; j++) {
        pr[l * cout + j] = cr[l * ldc + cOff + j];
        if (pi && ci) pi[l * cout + j] = ci[l * ldc + cOff + j];
      }
    }
    subtractProjection(s.re, s.im, cs, o.re, o.im, cout, n, pr, pi);
    return;
  }
  // combineColumns reads Y[j * cs + l] (the coefficients of output column j contiguous): C transposed.
  const yr = new Float64Array(cout * cs);
  const yi = complex ? new Float64Array(cout * cs) : null;
  for (let l = 0; l < cs; l++) {
    for (let j = 0; j < cout; j++) {
      yr[j * cs + l] = cr[l * ldc + cOff + j];
      if (yi && ci) yi[j * cs + l] = ci[l * ldc + cOff + j];
    }
  }
  combineColumns(s.re, s.im, cs, yr, yi, cout, n, { n, k: cout, re: o.re, im: o.im });
}

/** Copies column `from` of A to column `to` of B (both with n rows). */
export function copyColumn(n: number, A: Cols, from: number, B: Cols, to: number): void {
  const src = (A.off + from) * n;
  const dst = (B.off + to) * n;
  B.re.set(A.re.subarray(src, src + n), dst);
  if (B.im) {
    if (A.im) B.im.set(A.im.subarray(src, src + n), dst);
    else B.im.fill(0, dst, dst + n);
  }
}

/** Euclidean norm of column c. */
export function columnNorm(n: number, A: Cols, c: number): number {
  const o = (A.off + c) * n;
  let s = 0;
  for (let r = o; r < o + n; r++) s += A.re[r] * A.re[r];
  if (A.im) for (let r = o; r < o + n; r++) s += A.im[r] * A.im[r];
  return Math.sqrt(s);
}

/** Scales column c by a real factor. */
export function scaleColumn(n: number, A: Cols, c: number, factor: number): void {
  const o = (A.off + c) * n;
  for (let r = o; r < o + n; r++) A.re[r] *= factor;
  if (A.im) for (let r = o; r < o + n; r++) A.im[r] *= factor;
}
