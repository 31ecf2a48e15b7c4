// Real triangular solves L y = b, D z = y, L^T x = z on a row-interleaved work array, several right-hand sides per
// sweep over the factor. Every entry sees the same operations in the same order whatever the grouping.
import type { LdlFactor } from './ldl-types';

/** Right-hand sides per sweep over the factor (values or sums then live in registers): measured 25-30% faster for 4-5 columns than a loop over columns. */
const SOLVE_GROUP = 6;

export function solveReal(factor: LdlFactor, W: Float64Array, k: number): void {
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
