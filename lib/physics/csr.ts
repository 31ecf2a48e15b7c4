// Sparse kernels on CsrMatrix: block matrix-vector products (real and complex) and a dense copy for tests.
// Blocks are column-major (vector j at [j * n, (j + 1) * n)); each row of the matrix is read once for all columns.
import { csrMatVecFiveComplex, csrMatVecFiveReal, MATVEC_GROUP } from './csr-five-columns';
import type { CsrMatrix, StateBlock } from './types';

/**
 * y = A x for a block of k vectors. Real A with real x writes only y.re; a complex A or complex x needs y.im.
 * Writes into preallocated `y` (same n and k as x); never allocates.
 *
 * @param A - Hermitian CSR (both triangles)
 * @param x - input block, `x.k` columns
 * @param y - output block; `y.im` must be non-null when A or x is complex
 * @example
 * csrMatVec(H, { n, k: 1, re: v, im: null }, { n, k: 1, re: out, im: null });
 */
export function csrMatVec(A: CsrMatrix, x: StateBlock, y: StateBlock): void {
  csrMatVecColumns(A, x.re, x.im, y.re, y.im, x.k);
}

/**
 * Same as csrMatVec on raw column-major arrays with k columns (used by the eigensolvers on sub-blocks). Whole groups
 * of five columns go through the five-column kernels (csr-five-columns.ts), the rest column by column: every sum
 * runs over the row in the same order either way, so the bits do not depend on the grouping.
 */
export function csrMatVecColumns(
  A: CsrMatrix,
  xr: Float64Array,
  xi: Float64Array | null,
  yr: Float64Array,
  yi: Float64Array | null,
  k: number,
): void {
  const { n, rowPtr, colIdx, re, im } = A;
  if (im === null && xi === null) {
    if (k === 1) {
      for (let r = 0; r < n; r++) {
        let s = 0;
        for (let p = rowPtr[r], end = rowPtr[r + 1]; p < end; p++) s += re[p] * xr[colIdx[p]];
        yr[r] = s;
      }
      return;
    }
    let c0 = 0;
    for (; c0 + MATVEC_GROUP <= k; c0 += MATVEC_GROUP) csrMatVecFiveReal(A, xr, yr, c0 * n);
    for (let r = 0; r < n; r++) {
      const start = rowPtr[r];
      const end = rowPtr[r + 1];
      for (let c = c0, off = c0 * n; c < k; c++, off += n) {
        let s = 0;
        for (let p = start; p < end; p++) s += re[p] * xr[off + colIdx[p]];
        yr[off + r] = s;
      }
    }
    if (yi) yi.fill(0, 0, k * n);
    return;
  }
  if (yi === null) throw new TypeError('csrMatVec: y.im must be allocated for a complex matrix or vector');
  let c0 = 0;
  if (im !== null && xi !== null) {
    for (; c0 + MATVEC_GROUP <= k; c0 += MATVEC_GROUP) csrMatVecFiveComplex(A, im, xr, xi, yr, yi, c0 * n);
  }
  for (let r = 0; r < n; r++) {
    const start = rowPtr[r];
    const end = rowPtr[r + 1];
    for (let c = c0, off = c0 * n; c < k; c++, off += n) {
      let sr = 0;
      let si = 0;
      for (let p = start; p < end; p++) {
        const q = off + colIdx[p];
        const ar = re[p];
        const ai = im === null ? 0 : im[p];
        const vr = xr[q];
        const vi = xi === null ? 0 : xi[q];
        sr += ar * vr - ai * vi;
        si += ar * vi + ai * vr;
      }
      yr[off + r] = sr;
      yi[off + r] = si;
    }
  }
}

/**
 * Dense copy of a CSR matrix (row-major n x n arrays), for tests and the small dense path.
 * @example
 * const { re, im } = toDense(H); // re[r * n + c]
 */
export function toDense(A: CsrMatrix): { re: Float64Array; im: Float64Array | null } {
  const { n, rowPtr, colIdx } = A;
  const re = new Float64Array(n * n);
  const im = A.im ? new Float64Array(n * n) : null;
  for (let r = 0; r < n; r++) {
    for (let p = rowPtr[r]; p < rowPtr[r + 1]; p++) {
      re[r * n + colIdx[p]] = A.re[p];
      if (im && A.im) im[r * n + colIdx[p]] = A.im[p];
    }
  }
  return { re, im };
}
