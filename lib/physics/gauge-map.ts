// The gauge map G_k between the cut gauges of neighbouring tube positions (PHYSICS.md section 3), its action on
// state blocks, and gauge-mapped overlaps <psi | G^dagger phi> (scalar and, for a block of levels, the determinant).
import type { Lattice, StateBlock } from './types';

/** A complex number. */
export interface Complex {
  re: number;
  im: number;
}

/**
 * exp(i theta) for theta = s 2 pi alpha, exact (+-1, +-i) when 4 alpha is an integer so that real problems stay real.
 *
 * @param alpha - flux in units of h/e
 * @param sign - +1 or -1
 */
export function fluxPhase(alpha: number, sign: number): Complex {
  const frac = alpha - Math.floor(alpha);
  const quarter = frac * 4;
  if (Number.isInteger(quarter)) {
    const table: Complex[] = [
      { re: 1, im: 0 },
      { re: 0, im: 1 },
      { re: -1, im: 0 },
      { re: 0, im: -1 },
    ];
    const z = table[quarter % 4];
    return { re: z.re, im: sign * z.im + 0 };
  }
  const theta = 2 * Math.PI * frac;
  return { re: Math.cos(theta), im: sign * Math.sin(theta) };
}

/** One unit step of a tube between adjacent plaquettes (global indices). */
export interface TubeStep {
  from: [number, number];
  to: [number, number];
}

/**
 * The gauge map of one unit step: the unknowns it multiplies and the factor.
 * Step UP (a, b) -> (a, b+1): factor exp(-2 pi i alpha) on row b+1, columns > a; step DOWN (a, b) -> (a, b-1):
 * exp(+2 pi i alpha) on row b, columns > a; horizontal steps: identity (no sites).
 */
export interface GaugeMap {
  /** Unknown indices multiplied by `factor` (ascending). */
  sites: Int32Array;
  factor: Complex;
}

/**
 * Builds G_k for a unit step of a tube with flux alpha (PHYSICS.md section 3, signs as specified there).
 *
 * @param lattice - the lattice (box and unknown numbering)
 * @param step - from/to global plaquette indices; must differ by one unit in exactly one direction
 * @param alpha - flux of the moving tube (units of h/e)
 * @returns the swept unknowns and their factor
 * @throws RangeError when the step is not a unit step
 * @example
 * const g = gaugeMapForStep(lattice, { from: [0, 0], to: [0, 1] }, 0.5); // factor -1 on row 1, columns >= 1
 */
export function gaugeMapForStep(lattice: Lattice, step: TubeStep, alpha: number): GaugeMap {
  const [a, b] = step.from;
  const [a2, b2] = step.to;
  const da = a2 - a;
  const db = b2 - b;
  if (Math.abs(da) + Math.abs(db) !== 1) {
    throw new RangeError(`step must move the tube by one plaquette, got (${a}, ${b}) -> (${a2}, ${b2})`);
  }
  if (db === 0) return { sites: new Int32Array(0), factor: { re: 1, im: 0 } };
  const row = db > 0 ? b + 1 : b;
  const factor = fluxPhase(alpha, db > 0 ? -1 : 1);
  const j = row - lattice.j0;
  const out: number[] = [];
  if (j >= 0 && j < lattice.ny) {
    const iStart = Math.max(0, a + 1 - lattice.i0);
    for (let i = iStart; i < lattice.nx; i++) {
      const u = lattice.unknownOf[i + lattice.nx * j];
      if (u >= 0) out.push(u);
    }
  }
  return { sites: Int32Array.from(out), factor };
}

/** True when the map changes nothing (horizontal step, integer flux or no swept unknowns). */
export function isIdentityMap(map: GaugeMap): boolean {
  return map.sites.length === 0 || (map.factor.re === 1 && map.factor.im === 0);
}

/**
 * Applies G to every vector of a block, returning a new block (complex when the factor is not real).
 *
 * @param map - the gauge map of one step
 * @param block - states in the gauge of the step's start
 * @returns G block, in the gauge of the step's end
 * @example
 * // Warm start for the next tube position of a scan:
 * const initial = applyGaugeMap(gaugeMapForStep(lattice, { from: [a, b], to: [a, b + 1] }, alpha), previous.vectors);
 */
export function applyGaugeMap(map: GaugeMap, block: StateBlock): StateBlock {
  const { n, k } = block;
  const re = Float64Array.from(block.re);
  const realFactor = map.factor.im === 0;
  const im = block.im ? Float64Array.from(block.im) : realFactor ? null : new Float64Array(n * k);
  const { re: gr, im: gi } = map.factor;
  if (isIdentityMap(map)) return { n, k, re, im };
  for (let c = 0; c < k; c++) {
    const off = c * n;
    for (let s = 0; s < map.sites.length; s++) {
      const idx = off + map.sites[s];
      const xr = re[idx];
      const xi = im ? im[idx] : 0;
      re[idx] = gr * xr - gi * xi;
      if (im) im[idx] = gr * xi + gi * xr;
    }
  }
  return { n, k, re, im };
}

/**
 * The gauge-mapped overlap <psi_i | G^dagger phi_j> = sum_s conj(psi_i(s)) (G^dagger phi_j)(s).
 *
 * @param map - G for the step from psi's position to phi's position
 * @param psi - states at the step's start (column i used)
 * @param phi - states at the step's end (column j used)
 * @returns the complex overlap
 * @see PHYSICS.md section 3 (W = prod_k <psi_k | G_k^dagger psi_{k+1}>)
 * @example
 * const z = gaugedOverlap(gaugeMapForStep(lattice, step, 0.5), psiK, 0, psiNext, 0); // about +-1 for a slow step
 */
export function gaugedOverlap(map: GaugeMap, psi: StateBlock, i: number, phi: StateBlock, j: number): Complex {
  const { n } = psi;
  const pr = psi.re;
  const pi = psi.im;
  const qr = phi.re;
  const qi = phi.im;
  const po = i * n;
  const qo = j * n;
  // Full sum first (G = identity), then correct the swept sites by (conj(g) - 1).
  let sr = 0;
  let si = 0;
  if (pi === null && qi === null) {
    for (let s = 0; s < n; s++) sr += pr[po + s] * qr[qo + s];
  } else {
    for (let s = 0; s < n; s++) {
      const ar = pr[po + s];
      const ai = pi ? pi[po + s] : 0;
      const br = qr[qo + s];
      const bi = qi ? qi[qo + s] : 0;
      sr += ar * br + ai * bi;
      si += ar * bi - ai * br;
    }
  }
  if (isIdentityMap(map)) return { re: sr, im: si };
  let tr = 0;
  let ti = 0;
  for (let t = 0; t < map.sites.length; t++) {
    const s = map.sites[t];
    const ar = pr[po + s];
    const ai = pi ? pi[po + s] : 0;
    const br = qr[qo + s];
    const bi = qi ? qi[qo + s] : 0;
    tr += ar * br + ai * bi;
    ti += ar * bi - ai * br;
  }
  // conj(g) - 1
  const cr = map.factor.re - 1;
  const ci = -map.factor.im;
  return { re: sr + cr * tr - ci * ti, im: si + cr * ti + ci * tr };
}

/**
 * Determinant of the m x m gauge-mapped overlap matrix M[i][j] = <psi_i | G^dagger phi_j> (i, j < m): the overlap of
 * the subspaces spanned by the m lowest states, insensitive to rotations inside the subspace. For m = 1 this is the
 * scalar overlap.
 *
 * @param map - G for the step from psi's position to phi's position
 * @param psi - states at the start (first m columns used)
 * @param phi - states at the end (first m columns used)
 * @param m - subspace dimension (>= 1)
 */
export function gaugedOverlapDeterminant(map: GaugeMap, psi: StateBlock, phi: StateBlock, m: number): Complex {
  if (m === 1) return gaugedOverlap(map, psi, 0, phi, 0);
  const re = new Float64Array(m * m);
  const im = new Float64Array(m * m);
  for (let i = 0; i < m; i++) {
    for (let j = 0; j < m; j++) {
      const z = gaugedOverlap(map, psi, i, phi, j);
      re[i * m + j] = z.re;
      im[i * m + j] = z.im;
    }
  }
  return complexDeterminant(re, im, m);
}

/** Determinant of a small complex matrix (row-major re/im), Gaussian elimination with partial pivoting. */
export function complexDeterminant(reIn: Float64Array, imIn: Float64Array, m: number): Complex {
  const re = Float64Array.from(reIn);
  const im = Float64Array.from(imIn);
  let dr = 1;
  let di = 0;
  for (let c = 0; c < m; c++) {
    let p = c;
    let best = -1;
    for (let r = c; r < m; r++) {
      const mag = Math.hypot(re[r * m + c], im[r * m + c]);
      if (mag > best) {
        best = mag;
        p = r;
      }
    }
    if (best === 0) return { re: 0, im: 0 };
    if (p !== c) {
      for (let j = 0; j < m; j++) {
        [re[p * m + j], re[c * m + j]] = [re[c * m + j], re[p * m + j]];
        [im[p * m + j], im[c * m + j]] = [im[c * m + j], im[p * m + j]];
      }
      dr = -dr;
      di = -di;
    }
    const pr = re[c * m + c];
    const pim = im[c * m + c];
    const nd = dr * pr - di * pim;
    di = dr * pim + di * pr;
    dr = nd;
    const den = pr * pr + pim * pim;
    for (let r = c + 1; r < m; r++) {
      // f = a[r][c] / a[c][c]
      const ar = re[r * m + c];
      const ai = im[r * m + c];
      const fr = (ar * pr + ai * pim) / den;
      const fi = (ai * pr - ar * pim) / den;
      for (let j = c; j < m; j++) {
        const br = re[c * m + j];
        const bi = im[c * m + j];
        re[r * m + j] -= fr * br - fi * bi;
        im[r * m + j] -= fr * bi + fi * br;
      }
    }
  }
  return { re: dr, im: di };
}

/** Product of two complex numbers. */
export function complexMul(x: Complex, y: Complex): Complex {
  return { re: x.re * y.re - x.im * y.im, im: x.re * y.im + x.im * y.re };
}

/** Complex conjugate. */
export function complexConj(x: Complex): Complex {
  return { re: x.re, im: -x.im + 0 };
}
