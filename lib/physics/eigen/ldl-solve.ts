// Triangular solves with an LDL factor: (A - sigma I) X = B for a block of right-hand sides, permuted into
// row-interleaved work arrays and solved by the real or complex multi-column sweeps.
import type { StateBlock } from '../types';
import { solveComplex } from './ldl-solve-complex';
import { solveReal } from './ldl-solve-real';
import type { LdlFactor } from './ldl-types';

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
