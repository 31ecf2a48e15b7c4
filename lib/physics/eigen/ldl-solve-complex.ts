// Complex triangular solves L y = b, D z = y, L^H x = z on an interleaved (re, im) work array, several right-hand
// sides per sweep over the factor. Every entry sees the same operations in the same order whatever the grouping.
import type { LdlFactor } from './ldl-types';

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
export function solveComplex(factor: LdlFactor, W: Float64Array, k: number): void {
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
