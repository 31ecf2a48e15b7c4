// Numeric multifrontal factorisation of a real symmetric A - sigma I = L D L^T, supernode by supernode, with the
// dense Schur-complement update of each front. Fixed operation order (deterministic bits).
import { checkPivot, childLists, type FactorContext } from './ldl-front';

export function factorReal(context: FactorContext): void {
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
