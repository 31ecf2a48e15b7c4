// Fast block update W -= Q C on column-major blocks (real or complex): the second half of a Gram-Schmidt pass.
// Chunked over rows, two columns of W per pass over the basis chunk. Fixed summation order (deterministic bits).
import { CHUNK, J_BLOCK } from './block-chunking';

/** w_t -= sum_j q_j C[j * p + t]. */
export function subtractProjection(
  qr: Float64Array,
  qi: Float64Array | null,
  m: number,
  wr: Float64Array,
  wi: Float64Array | null,
  p: number,
  n: number,
  cr: Float64Array,
  ci: Float64Array | null,
): void {
  for (let i0 = 0; i0 < n; i0 += CHUNK) {
    const i1 = Math.min(n, i0 + CHUNK);
    let t0 = 0;
    if (qi && wi && ci) {
      // Complex: two columns of w per pass over the basis chunk (each basis load feeds both).
      for (let j0 = 0; j0 < m; j0 += J_BLOCK) {
        const j1 = Math.min(m, j0 + J_BLOCK);
        for (let t = 0; t + 1 < p; t += 2) subtractPairComplex(qr, qi, j0, j1, wr, wi, t, p, n, i0, i1, cr, ci);
      }
      t0 = p - (p % 2);
    } else if (!qi && !wi) {
      for (let j0 = 0; j0 < m; j0 += J_BLOCK) {
        const j1 = Math.min(m, j0 + J_BLOCK);
        for (let t = 0; t + 1 < p; t += 2) subtractPairReal(qr, j0, j1, wr, t, p, n, i0, i1, cr);
      }
      t0 = p - (p % 2);
    }
    for (let t = t0; t < p; t++) {
      const wo = t * n;
      let j = 0;
      if (!qi || !wi || !ci) {
        for (; j + 3 < m; j += 4) {
          const q0 = j * n;
          const q1 = q0 + n;
          const q2 = q1 + n;
          const q3 = q2 + n;
          const a0 = cr[j * p + t];
          const a1 = cr[(j + 1) * p + t];
          const a2 = cr[(j + 2) * p + t];
          const a3 = cr[(j + 3) * p + t];
          for (let i = i0; i < i1; i++) {
            wr[wo + i] -= a0 * qr[q0 + i] + a1 * qr[q1 + i] + a2 * qr[q2 + i] + a3 * qr[q3 + i];
          }
        }
        for (; j < m; j++) {
          const qo = j * n;
          const a0 = cr[j * p + t];
          for (let i = i0; i < i1; i++) wr[wo + i] -= a0 * qr[qo + i];
        }
        continue;
      }
      for (; j + 1 < m; j += 2) {
        const q0 = j * n;
        const q1 = q0 + n;
        const a0r = cr[j * p + t];
        const a0i = ci[j * p + t];
        const a1r = cr[(j + 1) * p + t];
        const a1i = ci[(j + 1) * p + t];
        for (let i = i0; i < i1; i++) {
          const b0r = qr[q0 + i];
          const b0i = qi[q0 + i];
          const b1r = qr[q1 + i];
          const b1i = qi[q1 + i];
          wr[wo + i] -= a0r * b0r - a0i * b0i + a1r * b1r - a1i * b1i;
          wi[wo + i] -= a0r * b0i + a0i * b0r + a1r * b1i + a1i * b1r;
        }
      }
      for (; j < m; j++) {
        const qo = j * n;
        const ar = cr[j * p + t];
        const ai = ci[j * p + t];
        for (let i = i0; i < i1; i++) {
          const br = qr[qo + i];
          const bi = qi[qo + i];
          wr[wo + i] -= ar * br - ai * bi;
          wi[wo + i] -= ar * bi + ai * br;
        }
      }
    }
  }
}

/** Complex columns t0 and t0 + 1 of subtractProjection on rows [i0, i1): the same updates in the same order. */
function subtractPairComplex(
  qr: Float64Array,
  qi: Float64Array,
  j0: number,
  j1: number,
  wr: Float64Array,
  wi: Float64Array,
  t0: number,
  p: number,
  n: number,
  i0: number,
  i1: number,
  cr: Float64Array,
  ci: Float64Array,
): void {
  const wa = t0 * n;
  const wb = wa + n;
  let j = j0;
  for (; j + 1 < j1; j += 2) {
    const q0 = j * n;
    const q1 = q0 + n;
    const a0r = cr[j * p + t0];
    const a0i = ci[j * p + t0];
    const a1r = cr[(j + 1) * p + t0];
    const a1i = ci[(j + 1) * p + t0];
    const c0r = cr[j * p + t0 + 1];
    const c0i = ci[j * p + t0 + 1];
    const c1r = cr[(j + 1) * p + t0 + 1];
    const c1i = ci[(j + 1) * p + t0 + 1];
    for (let i = i0; i < i1; i++) {
      const b0r = qr[q0 + i];
      const b0i = qi[q0 + i];
      const b1r = qr[q1 + i];
      const b1i = qi[q1 + i];
      wr[wa + i] -= a0r * b0r - a0i * b0i + a1r * b1r - a1i * b1i;
      wi[wa + i] -= a0r * b0i + a0i * b0r + a1r * b1i + a1i * b1r;
      wr[wb + i] -= c0r * b0r - c0i * b0i + c1r * b1r - c1i * b1i;
      wi[wb + i] -= c0r * b0i + c0i * b0r + c1r * b1i + c1i * b1r;
    }
  }
  for (; j < j1; j++) {
    const qo = j * n;
    const ar = cr[j * p + t0];
    const ai = ci[j * p + t0];
    const cr1 = cr[j * p + t0 + 1];
    const ci1 = ci[j * p + t0 + 1];
    for (let i = i0; i < i1; i++) {
      const br = qr[qo + i];
      const bi = qi[qo + i];
      wr[wa + i] -= ar * br - ai * bi;
      wi[wa + i] -= ar * bi + ai * br;
      wr[wb + i] -= cr1 * br - ci1 * bi;
      wi[wb + i] -= cr1 * bi + ci1 * br;
    }
  }
}

/** Real columns t0 and t0 + 1 of subtractProjection on rows [i0, i1): the same updates in the same order. */
function subtractPairReal(
  qr: Float64Array,
  j0: number,
  j1: number,
  wr: Float64Array,
  t0: number,
  p: number,
  n: number,
  i0: number,
  i1: number,
  cr: Float64Array,
): void {
  const wa = t0 * n;
  const wb = wa + n;
  let j = j0;
  for (; j + 3 < j1; j += 4) {
    const q0 = j * n;
    const q1 = q0 + n;
    const q2 = q1 + n;
    const q3 = q2 + n;
    const a0 = cr[j * p + t0];
    const a1 = cr[(j + 1) * p + t0];
    const a2 = cr[(j + 2) * p + t0];
    const a3 = cr[(j + 3) * p + t0];
    const b0 = cr[j * p + t0 + 1];
    const b1 = cr[(j + 1) * p + t0 + 1];
    const b2 = cr[(j + 2) * p + t0 + 1];
    const b3 = cr[(j + 3) * p + t0 + 1];
    for (let i = i0; i < i1; i++) {
      const x0 = qr[q0 + i];
      const x1 = qr[q1 + i];
      const x2 = qr[q2 + i];
      const x3 = qr[q3 + i];
      wr[wa + i] -= a0 * x0 + a1 * x1 + a2 * x2 + a3 * x3;
      wr[wb + i] -= b0 * x0 + b1 * x1 + b2 * x2 + b3 * x3;
    }
  }
  for (; j < j1; j++) {
    const qo = j * n;
    const a0 = cr[j * p + t0];
    const b0 = cr[j * p + t0 + 1];
    for (let i = i0; i < i1; i++) {
      wr[wa + i] -= a0 * qr[qo + i];
      wr[wb + i] -= b0 * qr[qo + i];
    }
  }
}
