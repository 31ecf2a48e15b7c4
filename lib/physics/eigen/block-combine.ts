// Fast block combination X = Q Y on column-major blocks (real or complex), e.g. Ritz vectors from a basis.
// Chunked over rows, two output columns per pass over the basis chunk. Fixed summation order (deterministic bits).
import type { StateBlock } from '../types';
import { CHUNK, J_BLOCK } from './block-chunking';

/** x_t = sum_j q_j Y[t * m + j] for t < want (complex when Q or Y is). */
export function combineColumns(
  qr: Float64Array,
  qi: Float64Array | null,
  m: number,
  yr: Float64Array,
  yi: Float64Array | null,
  want: number,
  n: number,
  out: StateBlock,
): void {
  const xr = out.re;
  const xi = out.im;
  xr.fill(0, 0, want * n);
  xi?.fill(0, 0, want * n);
  for (let i0 = 0; i0 < n; i0 += CHUNK) {
    const i1 = Math.min(n, i0 + CHUNK);
    let t0 = 0;
    if (qi && xi && yi) {
      // Complex: two output columns per pass over the basis chunk (each basis load feeds both).
      for (let j0 = 0; j0 < m; j0 += J_BLOCK) {
        const j1 = Math.min(m, j0 + J_BLOCK);
        for (let t = 0; t + 1 < want; t += 2) combinePairComplex(qr, qi, j0, j1, m, yr, yi, t, n, i0, i1, xr, xi);
      }
      t0 = want - (want % 2);
    } else if (!qi || !xi) {
      for (let j0 = 0; j0 < m; j0 += J_BLOCK) {
        const j1 = Math.min(m, j0 + J_BLOCK);
        for (let t = 0; t + 1 < want; t += 2) combinePairReal(qr, j0, j1, m, yr, t, n, i0, i1, xr);
      }
      t0 = want - (want % 2);
    }
    for (let t = t0; t < want; t++) {
      const xo = t * n;
      let j = 0;
      if (!qi || !xi) {
        for (; j + 3 < m; j += 4) {
          const q0 = j * n;
          const q1 = q0 + n;
          const q2 = q1 + n;
          const q3 = q2 + n;
          const a0 = yr[t * m + j];
          const a1 = yr[t * m + j + 1];
          const a2 = yr[t * m + j + 2];
          const a3 = yr[t * m + j + 3];
          for (let i = i0; i < i1; i++) {
            xr[xo + i] += a0 * qr[q0 + i] + a1 * qr[q1 + i] + a2 * qr[q2 + i] + a3 * qr[q3 + i];
          }
        }
        for (; j < m; j++) {
          const qo = j * n;
          const a0 = yr[t * m + j];
          for (let i = i0; i < i1; i++) xr[xo + i] += a0 * qr[qo + i];
        }
        continue;
      }
      for (; j + 1 < m; j += 2) {
        const q0 = j * n;
        const q1 = q0 + n;
        const a0r = yr[t * m + j];
        const a0i = yi ? yi[t * m + j] : 0;
        const a1r = yr[t * m + j + 1];
        const a1i = yi ? yi[t * m + j + 1] : 0;
        for (let i = i0; i < i1; i++) {
          const b0r = qr[q0 + i];
          const b0i = qi[q0 + i];
          const b1r = qr[q1 + i];
          const b1i = qi[q1 + i];
          xr[xo + i] += a0r * b0r - a0i * b0i + a1r * b1r - a1i * b1i;
          xi[xo + i] += a0r * b0i + a0i * b0r + a1r * b1i + a1i * b1r;
        }
      }
      for (; j < m; j++) {
        const qo = j * n;
        const ar = yr[t * m + j];
        const ai = yi ? yi[t * m + j] : 0;
        for (let i = i0; i < i1; i++) {
          const br = qr[qo + i];
          const bi = qi[qo + i];
          xr[xo + i] += ar * br - ai * bi;
          xi[xo + i] += ar * bi + ai * br;
        }
      }
    }
  }
}

/** Complex columns t0 and t0 + 1 of combineColumns on rows [i0, i1): the same updates in the same order. */
function combinePairComplex(
  qr: Float64Array,
  qi: Float64Array,
  j0: number,
  j1: number,
  m: number,
  yr: Float64Array,
  yi: Float64Array,
  t0: number,
  n: number,
  i0: number,
  i1: number,
  xr: Float64Array,
  xi: Float64Array,
): void {
  const xa = t0 * n;
  const xb = xa + n;
  const ya = t0 * m;
  const yb = ya + m;
  let j = j0;
  for (; j + 1 < j1; j += 2) {
    const q0 = j * n;
    const q1 = q0 + n;
    const a0r = yr[ya + j];
    const a0i = yi[ya + j];
    const a1r = yr[ya + j + 1];
    const a1i = yi[ya + j + 1];
    const c0r = yr[yb + j];
    const c0i = yi[yb + j];
    const c1r = yr[yb + j + 1];
    const c1i = yi[yb + j + 1];
    for (let i = i0; i < i1; i++) {
      const b0r = qr[q0 + i];
      const b0i = qi[q0 + i];
      const b1r = qr[q1 + i];
      const b1i = qi[q1 + i];
      xr[xa + i] += a0r * b0r - a0i * b0i + a1r * b1r - a1i * b1i;
      xi[xa + i] += a0r * b0i + a0i * b0r + a1r * b1i + a1i * b1r;
      xr[xb + i] += c0r * b0r - c0i * b0i + c1r * b1r - c1i * b1i;
      xi[xb + i] += c0r * b0i + c0i * b0r + c1r * b1i + c1i * b1r;
    }
  }
  for (; j < j1; j++) {
    const qo = j * n;
    const ar = yr[ya + j];
    const ai = yi[ya + j];
    const cr = yr[yb + j];
    const ci = yi[yb + j];
    for (let i = i0; i < i1; i++) {
      const br = qr[qo + i];
      const bi = qi[qo + i];
      xr[xa + i] += ar * br - ai * bi;
      xi[xa + i] += ar * bi + ai * br;
      xr[xb + i] += cr * br - ci * bi;
      xi[xb + i] += cr * bi + ci * br;
    }
  }
}

/** Real columns t0 and t0 + 1 of combineColumns on rows [i0, i1): the same updates in the same order. */
function combinePairReal(
  qr: Float64Array,
  j0: number,
  j1: number,
  m: number,
  yr: Float64Array,
  t0: number,
  n: number,
  i0: number,
  i1: number,
  xr: Float64Array,
): void {
  const xa = t0 * n;
  const xb = xa + n;
  const ya = t0 * m;
  const yb = ya + m;
  let j = j0;
  for (; j + 3 < j1; j += 4) {
    const q0 = j * n;
    const q1 = q0 + n;
    const q2 = q1 + n;
    const q3 = q2 + n;
    const a0 = yr[ya + j];
    const a1 = yr[ya + j + 1];
    const a2 = yr[ya + j + 2];
    const a3 = yr[ya + j + 3];
    const b0 = yr[yb + j];
    const b1 = yr[yb + j + 1];
    const b2 = yr[yb + j + 2];
    const b3 = yr[yb + j + 3];
    for (let i = i0; i < i1; i++) {
      const x0 = qr[q0 + i];
      const x1 = qr[q1 + i];
      const x2 = qr[q2 + i];
      const x3 = qr[q3 + i];
      xr[xa + i] += a0 * x0 + a1 * x1 + a2 * x2 + a3 * x3;
      xr[xb + i] += b0 * x0 + b1 * x1 + b2 * x2 + b3 * x3;
    }
  }
  for (; j < j1; j++) {
    const qo = j * n;
    const a0 = yr[ya + j];
    const b0 = yr[yb + j];
    for (let i = i0; i < i1; i++) {
      xr[xa + i] += a0 * qr[qo + i];
      xr[xb + i] += b0 * qr[qo + i];
    }
  }
}
