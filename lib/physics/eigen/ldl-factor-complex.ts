// Numeric multifrontal factorisation of a complex Hermitian A - sigma I = L D L^H (separate real and imaginary
// panels), supernode by supernode, with the dense Schur-complement update of each front. Fixed operation order.
import { checkPivot, childLists, type FactorContext } from './ldl-front';

export function factorComplex(context: FactorContext): void {
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
