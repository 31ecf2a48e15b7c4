// Fast block projection C = Q^H W on column-major blocks (real or complex), chunked over rows and two columns of W
// per pass so that each loaded basis entry feeds several products. Fixed summation order (deterministic bits).
import { CHUNK, J_BLOCK } from './block-chunking';

/** C[j * p + t] = <q_j, w_t> = sum_i conj(q_j[i]) w_t[i] for j < m, t < p. */
export function projectCoefficients(
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
  cr.fill(0, 0, m * p);
  ci?.fill(0, 0, m * p);
  for (let i0 = 0; i0 < n; i0 += CHUNK) {
    const i1 = Math.min(n, i0 + CHUNK);
    let t0 = 0;
    if (qi && wi && ci) {
      // Complex: two columns of w against two basis columns per pass (each load feeds twice the products).
      for (let j0 = 0; j0 < m; j0 += J_BLOCK) {
        const j1 = Math.min(m, j0 + J_BLOCK);
        for (let t = 0; t + 1 < p; t += 2) projectPairComplex(qr, qi, j0, j1, wr, wi, t, p, n, i0, i1, cr, ci);
      }
      t0 = p - (p % 2);
    } else if (!qi && !wi) {
      // Real: two columns of w per pass (the same sums as below, each basis load feeding both).
      for (let j0 = 0; j0 < m; j0 += J_BLOCK) {
        const j1 = Math.min(m, j0 + J_BLOCK);
        for (let t = 0; t + 1 < p; t += 2) projectPairReal(qr, j0, j1, wr, t, p, n, i0, i1, cr);
      }
      t0 = p - (p % 2);
    }
    for (let t = t0; t < p; t++) {
      const wo = t * n;
      let j = 0;
      if (!qi || !wi || !ci) {
        // Four basis columns per pass over w: one load of w[i] feeds four products.
        for (; j + 3 < m; j += 4) {
          const q0 = j * n;
          const q1 = q0 + n;
          const q2 = q1 + n;
          const q3 = q2 + n;
          let s0 = 0;
          let s1 = 0;
          let s2 = 0;
          let s3 = 0;
          for (let i = i0; i < i1; i++) {
            const w = wr[wo + i];
            s0 += qr[q0 + i] * w;
            s1 += qr[q1 + i] * w;
            s2 += qr[q2 + i] * w;
            s3 += qr[q3 + i] * w;
          }
          cr[j * p + t] += s0;
          cr[(j + 1) * p + t] += s1;
          cr[(j + 2) * p + t] += s2;
          cr[(j + 3) * p + t] += s3;
        }
        for (; j < m; j++) {
          const qo = j * n;
          let s0 = 0;
          for (let i = i0; i < i1; i++) s0 += qr[qo + i] * wr[wo + i];
          cr[j * p + t] += s0;
        }
        continue;
      }
      for (; j + 1 < m; j += 2) {
        const q0 = j * n;
        const q1 = q0 + n;
        let s0r = 0;
        let s0i = 0;
        let s1r = 0;
        let s1i = 0;
        for (let i = i0; i < i1; i++) {
          const br = wr[wo + i];
          const bi = wi[wo + i];
          const a0r = qr[q0 + i];
          const a0i = qi[q0 + i];
          const a1r = qr[q1 + i];
          const a1i = qi[q1 + i];
          s0r += a0r * br + a0i * bi;
          s0i += a0r * bi - a0i * br;
          s1r += a1r * br + a1i * bi;
          s1i += a1r * bi - a1i * br;
        }
        cr[j * p + t] += s0r;
        ci[j * p + t] += s0i;
        cr[(j + 1) * p + t] += s1r;
        ci[(j + 1) * p + t] += s1i;
      }
      for (; j < m; j++) {
        const qo = j * n;
        let sr = 0;
        let si = 0;
        for (let i = i0; i < i1; i++) {
          const ar = qr[qo + i];
          const ai = qi[qo + i];
          const br = wr[wo + i];
          const bi = wi[wo + i];
          sr += ar * br + ai * bi;
          si += ar * bi - ai * br;
        }
        cr[j * p + t] += sr;
        ci[j * p + t] += si;
      }
    }
  }
}


/** Complex columns t0 and t0 + 1 of projectCoefficients on rows [i0, i1): the same sums in the same order. */
function projectPairComplex(
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
    let a0r = 0;
    let a0i = 0;
    let a1r = 0;
    let a1i = 0;
    let b0r = 0;
    let b0i = 0;
    let b1r = 0;
    let b1i = 0;
    for (let i = i0; i < i1; i++) {
      const x0r = qr[q0 + i];
      const x0i = qi[q0 + i];
      const x1r = qr[q1 + i];
      const x1i = qi[q1 + i];
      const ur = wr[wa + i];
      const ui = wi[wa + i];
      a0r += x0r * ur + x0i * ui;
      a0i += x0r * ui - x0i * ur;
      a1r += x1r * ur + x1i * ui;
      a1i += x1r * ui - x1i * ur;
      const vr = wr[wb + i];
      const vi = wi[wb + i];
      b0r += x0r * vr + x0i * vi;
      b0i += x0r * vi - x0i * vr;
      b1r += x1r * vr + x1i * vi;
      b1i += x1r * vi - x1i * vr;
    }
    cr[j * p + t0] += a0r;
    ci[j * p + t0] += a0i;
    cr[(j + 1) * p + t0] += a1r;
    ci[(j + 1) * p + t0] += a1i;
    cr[j * p + t0 + 1] += b0r;
    ci[j * p + t0 + 1] += b0i;
    cr[(j + 1) * p + t0 + 1] += b1r;
    ci[(j + 1) * p + t0 + 1] += b1i;
  }
  for (; j < j1; j++) {
    const qo = j * n;
    let ar = 0;
    let ai = 0;
    let br = 0;
    let bi = 0;
    for (let i = i0; i < i1; i++) {
      const xr = qr[qo + i];
      const xi = qi[qo + i];
      const ur = wr[wa + i];
      const ui = wi[wa + i];
      const vr = wr[wb + i];
      const vi = wi[wb + i];
      ar += xr * ur + xi * ui;
      ai += xr * ui - xi * ur;
      br += xr * vr + xi * vi;
      bi += xr * vi - xi * vr;
    }
    cr[j * p + t0] += ar;
    ci[j * p + t0] += ai;
    cr[j * p + t0 + 1] += br;
    ci[j * p + t0 + 1] += bi;
  }
}


/** Real columns t0 and t0 + 1 of projectCoefficients on rows [i0, i1): the same sums in the same order. */
function projectPairReal(
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
    let a0 = 0;
    let a1 = 0;
    let a2 = 0;
    let a3 = 0;
    let b0 = 0;
    let b1 = 0;
    let b2 = 0;
    let b3 = 0;
    for (let i = i0; i < i1; i++) {
      const u = wr[wa + i];
      const v = wr[wb + i];
      const x0 = qr[q0 + i];
      const x1 = qr[q1 + i];
      const x2 = qr[q2 + i];
      const x3 = qr[q3 + i];
      a0 += x0 * u;
      a1 += x1 * u;
      a2 += x2 * u;
      a3 += x3 * u;
      b0 += x0 * v;
      b1 += x1 * v;
      b2 += x2 * v;
      b3 += x3 * v;
    }
    cr[j * p + t0] += a0;
    cr[(j + 1) * p + t0] += a1;
    cr[(j + 2) * p + t0] += a2;
    cr[(j + 3) * p + t0] += a3;
    cr[j * p + t0 + 1] += b0;
    cr[(j + 1) * p + t0 + 1] += b1;
    cr[(j + 2) * p + t0 + 1] += b2;
    cr[(j + 3) * p + t0 + 1] += b3;
  }
  for (; j < j1; j++) {
    const qo = j * n;
    let a0 = 0;
    let b0 = 0;
    for (let i = i0; i < i1; i++) {
      a0 += qr[qo + i] * wr[wa + i];
      b0 += qr[qo + i] * wr[wb + i];
    }
    cr[j * p + t0] += a0;
    cr[j * p + t0 + 1] += b0;
  }
}

