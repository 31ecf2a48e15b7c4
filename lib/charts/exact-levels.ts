// Exact reference levels drawn over computed ones: a disk of radius R with a tube of flux alpha at its centre
// (E = j_{|m - alpha|, n}^2 / R^2) and a rectangle a x b (E = pi^2 (n^2/a^2 + m^2/b^2)); includes a real-order Bessel J_nu.
import type { WellSpec } from '@/lib/physics/schemas/common';

/** Lanczos coefficients (g = 7, n = 9), good to about 1e-15 relative for Re z > 0.5 (Numerical Recipes 3rd ed. §6.1). */
const LANCZOS_G = 7;
const LANCZOS_C = [
  0.99999999999980993, 676.5203681218851, -1259.1392167224028, 771.32342877765313, -176.61502916214059,
  12.507343278686905, -0.13857109526572012, 9.9843695780195716e-6, 1.5056327351493116e-7,
];

/**
 * Natural logarithm of the Gamma function for z > 0 (Lanczos approximation, reflection for z < 1/2).
 * @example logGamma(5) // returns ~3.1780538303479458 (= ln 24)
 */
export function logGamma(z: number): number {
  if (z < 0.5) return Math.log(Math.PI / Math.abs(Math.sin(Math.PI * z))) - logGamma(1 - z);
  const x = z - 1;
  let a = LANCZOS_C[0];
  const t = x + LANCZOS_G + 0.5;
  for (let i = 1; i < LANCZOS_C.length; i++) a += LANCZOS_C[i] / (x + i);
  return 0.5 * Math.log(2 * Math.PI) + (x + 0.5) * Math.log(t) - t + Math.log(a);
}

/** Power series of J_nu (DLMF 10.2.2), accurate where |x| is small or below the order (little cancellation). */
function besselJSeries(nu: number, x: number): number {
  const half = x / 2;
  let term = Math.exp(nu * Math.log(half) - logGamma(nu + 1));
  let sum = term;
  const q = -half * half;
  for (let k = 1; k < 500; k++) {
    term *= q / (k * (k + nu));
    sum += term;
    if (Math.abs(term) <= 1e-17 * Math.abs(sum)) break;
  }
  return sum;
}

/** 16-point Gauss–Legendre nodes and weights on [-1, 1] (A&S Table 25.4). */
const GL_X = [
  0.0950125098376374, 0.2816035507792589, 0.4580167776572274, 0.6178762444026438, 0.755404408355003, 0.8656312023878318,
  0.9445750230732326, 0.9894009349916499,
];
const GL_W = [
  0.1894506104550685, 0.1826034150449236, 0.1691565193950025, 0.1495959888165767, 0.1246289712555339, 0.0951585116824928,
  0.0622535239386479, 0.0271524594117541,
];

function gaussLegendre(f: (t: number) => number, a: number, b: number, panels: number): number {
  const width = (b - a) / panels;
  let total = 0;
  for (let p = 0; p < panels; p++) {
    const mid = a + (p + 0.5) * width;
    const half = width / 2;
    let s = 0;
    for (let i = 0; i < GL_X.length; i++) s += GL_W[i] * (f(mid - half * GL_X[i]) + f(mid + half * GL_X[i]));
    total += s * half;
  }
  return total;
}

/**
 * Schläfli's integral (DLMF 10.9.6) for x > 0:
 * J_nu(x) = (1/pi) ∫_0^pi cos(nu t - x sin t) dt - (sin(nu pi)/pi) ∫_0^∞ exp(-x sinh t - nu t) dt.
 * Both integrands are smooth; composite 16-point Gauss–Legendre with enough panels per oscillation.
 */
function besselJIntegral(nu: number, x: number): number {
  // The first integrand makes about (x + nu) / 2 oscillations on [0, pi]; 16 nodes resolve two per panel to rounding.
  const panels1 = Math.max(6, Math.ceil((x + nu) / 4));
  const first = gaussLegendre((t) => Math.cos(nu * t - x * Math.sin(t)), 0, Math.PI, panels1) / Math.PI;
  const s = Math.sin(nu * Math.PI);
  if (Math.abs(s) < 1e-300) return first;
  // The second integrand is below e^-40 of its start beyond T with x sinh T + nu T = 40.
  let upper = 1;
  while (x * Math.sinh(upper) + nu * upper < 40) upper *= 1.5;
  const second = gaussLegendre((t) => Math.exp(-x * Math.sinh(t) - nu * t), 0, upper, Math.max(8, Math.ceil(upper * 3)));
  return first - (s / Math.PI) * second;
}

/**
 * Bessel function of the first kind J_nu(x) for real order nu >= 0 and x >= 0: the power series where it is free of
 * cancellation (x <= 8 or x < nu), Schläfli's integral otherwise. Relative accuracy about 1e-13 away from zeros.
 *
 * @param nu - order, nu >= 0 (real)
 * @param x - argument, x >= 0
 * @example besselJ(0, 2.404825557695773) // returns ~0 (first zero, DLMF §10.21)
 * @example besselJ(0.5, 1) // returns sqrt(2/pi) sin(1) = 0.6713967071418031 (DLMF 10.16.1)
 * @see DLMF §10.2 (series), §10.9.6 (Schläfli's integral)
 */
export function besselJ(nu: number, x: number): number {
  if (!(nu >= 0) || !Number.isFinite(nu)) throw new RangeError(`order nu must be a finite number >= 0, got ${nu}`);
  if (!(x >= 0) || !Number.isFinite(x)) throw new RangeError(`argument x must be a finite number >= 0, got ${x}`);
  if (x === 0) return nu === 0 ? 1 : 0;
  if (x <= 8 || x < nu) return besselJSeries(nu, x);
  return besselJIntegral(nu, x);
}

/** Refine a bracketed sign change of f on [a, b] (Brent's method; R. P. Brent, Algorithms for Minimization, 1973, ch. 4). */
function brent(f: (x: number) => number, a: number, b: number, fa: number, fb: number): number {
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  for (let iter = 0; iter < 200; iter++) {
    if (Math.sign(fb) === Math.sign(fc)) {
      c = a;
      fc = fa;
      d = b - a;
      e = d;
    }
    if (Math.abs(fc) < Math.abs(fb)) {
      a = b;
      b = c;
      c = a;
      fa = fb;
      fb = fc;
      fc = fa;
    }
    const tol = 2 * Number.EPSILON * Math.abs(b) + 1e-16;
    const m = (c - b) / 2;
    if (Math.abs(m) <= tol || fb === 0) return b;
    if (Math.abs(e) >= tol && Math.abs(fa) > Math.abs(fb)) {
      const s = fb / fa;
      let p: number;
      let q: number;
      if (a === c) {
        p = 2 * m * s;
        q = 1 - s;
      } else {
        const qq = fa / fc;
        const r = fb / fc;
        p = s * (2 * m * qq * (qq - r) - (b - a) * (r - 1));
        q = (qq - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      else p = -p;
      if (2 * p < Math.min(3 * m * q - Math.abs(tol * q), Math.abs(e * q))) {
        e = d;
        d = p / q;
      } else {
        d = m;
        e = m;
      }
    } else {
      d = m;
      e = m;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol ? d : m > 0 ? tol : -tol;
    fb = f(b);
  }
  return b;
}

/**
 * Scan step for bracketing zeros. Successive positive zeros of J_nu (nu >= 0) are more than 3 apart (the spacing tends
 * to pi, from below for nu < 1/2 and from above for nu > 1/2, and j_{0,2} - j_{0,1} = 3.115; DLMF 10.21(vi)), so a step of
 * 1 never holds two zeros and every sign change brackets exactly one.
 */
const ZERO_SCAN_STEP = 1;

/**
 * The first `count` positive zeros j_{nu,1} < j_{nu,2} < … of J_nu, or all zeros below `below` when given.
 *
 * @param nu - order >= 0
 * @param count - how many zeros (at most 200)
 * @example besselJZeros(0, 2) // returns [2.404825557695773, 5.520078110286311] (DLMF §10.21, A&S Table 9.5)
 * @example besselJZeros(0.5, 2) // returns [pi, 2 pi] (DLMF 10.16.1)
 */
export function besselJZeros(nu: number, count: number, below = Infinity): number[] {
  if (!Number.isInteger(count) || count < 0 || count > 200) throw new RangeError(`count must be an integer in 0..200, got ${count}`);
  const f = (x: number) => besselJ(nu, x);
  const zeros: number[] = [];
  // No zero lies below nu (j_{nu,1} > nu, DLMF 10.21.3); start just above the origin.
  let a = Math.max(1e-3, nu * 0.999);
  let fa = f(a);
  while (zeros.length < count && a < below) {
    const b = a + ZERO_SCAN_STEP;
    const fb = f(b);
    if (fb === 0) {
      zeros.push(b);
      a = b + 1e-9;
      fa = f(a);
      continue;
    }
    if (Math.sign(fa) !== Math.sign(fb)) {
      const z = brent(f, a, b, fa, fb);
      if (z < below) zeros.push(z);
      else break;
    }
    a = b;
    fa = fb;
  }
  return zeros;
}

/** One exact level with its quantum numbers. */
export interface ExactLevel {
  energy: number;
  /** Disk: angular momentum m and radial index n (j_{|m - alpha|, n}); rectangle: the two mode numbers. */
  quantum: { m: number; n: number; nu?: number };
}

/**
 * Every level of a disk with a centred tube below `energyMax` (units ħ²/(2mL²)), with its quantum numbers, ascending.
 *
 * @example diskLevelsBelow(0, 1, 15).map((l) => l.quantum.m) // returns [0, -1, 1] (j01², then j11² twice)
 */
export function diskLevelsBelow(alpha: number, radius: number, energyMax: number): ExactLevel[] {
  if (!Number.isFinite(alpha)) throw new RangeError(`alpha must be finite, got ${alpha}`);
  if (!(radius > 0)) throw new RangeError(`radius must be positive, got ${radius}`);
  if (!(energyMax > 0) || !Number.isFinite(energyMax)) return [];
  const limit = Math.sqrt(energyMax) * radius;
  const centre = Math.round(alpha);
  const found: ExactLevel[] = [];
  for (let dm = 0; dm <= limit + 1; dm++) {
    for (const m of dm === 0 ? [centre] : [centre - dm, centre + dm]) {
      const nu = Math.abs(m - alpha);
      if (nu >= limit) continue;
      besselJZeros(nu, 200, limit).forEach((j, i) => found.push({ energy: (j * j) / (radius * radius), quantum: { m, n: i + 1, nu } }));
    }
  }
  found.sort((p, q) => p.energy - q.energy || p.quantum.m - q.quantum.m);
  return found;
}

/**
 * Lowest levels of a disk of radius R with a tube of flux alpha at its centre (hard wall, no potential):
 * E = j_{|m - alpha|, n}^2 / R^2 over all integers m, n >= 1, in units ħ²/(2mL²) with R in L. Sorted ascending, with multiplicity.
 *
 * @param alpha - flux in units of h/e (any real; only its fractional part matters, Byers & Yang 1961)
 * @param radius - R in units of L
 * @param count - number of levels (1..200)
 * @example diskLevels(0, 1, 3).map((l) => l.energy) // returns [5.783186, 14.681971, 14.681971] (j01², j11² twice; DLMF §10.21)
 * @example diskLevels(0.5, 1, 2).map((l) => l.energy) // returns [pi², pi²] (j_{1/2,1} = pi, DLMF 10.16.1)
 */
export function diskLevels(alpha: number, radius: number, count: number): ExactLevel[] {
  if (!Number.isFinite(alpha)) throw new RangeError(`alpha must be finite, got ${alpha}`);
  if (!(radius > 0)) throw new RangeError(`radius must be positive, got ${radius}`);
  if (!Number.isInteger(count) || count < 1 || count > 200) throw new RangeError(`count must be an integer in 1..200, got ${count}`);
  const centre = Math.round(alpha);
  // Grow the cut-off X until `count` zeros j < X are known: every order with nu < X is scanned (j_{nu,1} > nu).
  for (let limit = 8; ; limit *= 1.5) {
    const found: ExactLevel[] = [];
    for (let dm = 0; dm <= limit + 1; dm++) {
      for (const m of dm === 0 ? [centre] : [centre - dm, centre + dm]) {
        const nu = Math.abs(m - alpha);
        if (nu >= limit) continue;
        besselJZeros(nu, 200, limit).forEach((j, i) => found.push({ energy: (j * j) / (radius * radius), quantum: { m, n: i + 1, nu } }));
      }
    }
    if (found.length >= count) {
      found.sort((p, q) => p.energy - q.energy || p.quantum.m - q.quantum.m);
      return found.slice(0, count);
    }
  }
}

/**
 * One exact disk level followed in flux: E_{m,n}(alpha) = j_{|m - alpha|, n}^2 / R^2 (a smooth curve; curves of different m
 * cross, as the lattice's tracked levels do).
 *
 * @example diskLevelEnergy(0, 1, 0, 1) // returns j01² = 5.783185962946784 (DLMF §10.21)
 */
export function diskLevelEnergy(m: number, n: number, alpha: number, radius: number): number {
  const zeros = besselJZeros(Math.abs(m - alpha), n);
  const j = zeros[n - 1];
  return (j * j) / (radius * radius);
}

/**
 * Lowest levels of an a x b rectangle with hard walls: E = pi^2 (n^2/a^2 + m^2/b^2), n, m >= 1, units ħ²/(2mL²).
 *
 * @example rectangleLevels(1, 1, 3).map((l) => l.energy) // returns [2 pi², 5 pi², 5 pi²]
 */
export function rectangleLevels(a: number, b: number, count: number): ExactLevel[] {
  if (!(a > 0) || !(b > 0)) throw new RangeError(`sides must be positive, got ${a} x ${b}`);
  if (!Number.isInteger(count) || count < 1 || count > 200) throw new RangeError(`count must be an integer in 1..200, got ${count}`);
  const levels: ExactLevel[] = [];
  const maxN = count + 1;
  for (let n = 1; n <= maxN; n++) {
    for (let m = 1; m <= maxN; m++) {
      levels.push({ energy: Math.PI ** 2 * ((n * n) / (a * a) + (m * m) / (b * b)), quantum: { m: n, n: m } });
    }
  }
  levels.sort((p, q) => p.energy - q.energy || p.quantum.m - q.quantum.m);
  return levels.slice(0, count);
}

/** Where a closed form exists for a problem: which one and its parameters. */
export type ExactCase =
  | { kind: 'disk'; radius: number; centre: [number, number]; alpha: number }
  | { kind: 'rectangle'; a: number; b: number };

interface ProblemLike {
  well: WellSpec;
  tubes?: { at: [number, number]; alpha: number }[];
  potential?: string;
}

const POSITION_TOLERANCE = 1e-9;

function isInteger(x: number): boolean {
  return Math.abs(x - Math.round(x)) < 1e-12;
}

/**
 * Decide whether a problem has exact levels: a disk whose tubes all sit at its centre or outside it, or a rectangle whose
 * tubes are all outside it or carry integer flux (gauge-trivial: Byers & Yang 1961), with no potential. Tubes outside a
 * simply connected well do not change its spectrum (Aharonov & Bohm 1959). Returns null otherwise.
 *
 * @param problem - a base problem spec (well, tubes, potential)
 * @param extraTubes - further tubes (e.g. the swept tube at its position) to take into account
 */
export function exactCaseFor(problem: ProblemLike, extraTubes: { at: [number, number]; alpha: number }[] = []): ExactCase | null {
  if (problem.potential) return null;
  const tubes = [...(problem.tubes ?? []), ...extraTubes];
  const well = problem.well;
  if ('disk' in well) {
    const { center, radius } = well.disk;
    let alpha = 0;
    for (const t of tubes) {
      const r = Math.hypot(t.at[0] - center[0], t.at[1] - center[1]);
      if (r <= POSITION_TOLERANCE) alpha += t.alpha;
      else if (r < radius + POSITION_TOLERANCE && !isInteger(t.alpha)) return null;
    }
    return { kind: 'disk', radius, centre: [center[0], center[1]], alpha };
  }
  if ('rectangle' in well) {
    const { min, max } = well.rectangle;
    for (const t of tubes) {
      const inside = t.at[0] > min[0] - POSITION_TOLERANCE && t.at[0] < max[0] + POSITION_TOLERANCE && t.at[1] > min[1] - POSITION_TOLERANCE && t.at[1] < max[1] + POSITION_TOLERANCE;
      if (inside && !isInteger(t.alpha)) return null;
    }
    return { kind: 'rectangle', a: max[0] - min[0], b: max[1] - min[1] };
  }
  return null;
}

/** Exact levels of an exact case (see exactCaseFor). */
export function exactLevelsOf(exact: ExactCase, count: number): ExactLevel[] {
  return exact.kind === 'disk' ? diskLevels(exact.alpha, exact.radius, count) : rectangleLevels(exact.a, exact.b, count);
}
