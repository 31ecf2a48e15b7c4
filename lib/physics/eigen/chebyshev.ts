// Polynomial preconditioner for LOBPCG: a few steps of Chebyshev iteration on (H - lo) x = r, using only sparse products.
// It inverts H approximately on the upper part of the spectrum, which is what slows unpreconditioned LOBPCG.
import { csrMatVecColumns } from '../csr';
import type { CsrMatrix, Preconditioner, StateBlock } from '../types';

/** Default polynomial degree when none is asked for explicitly (see chebyshevDegreeFor). */
export const DEFAULT_CHEBYSHEV_DEGREE = 12;
/** Degree bounds of the automatic choice. */
const MIN_DEGREE = 4;
const MAX_DEGREE = 48;

/**
 * Degree for an n-unknown lattice Hamiltonian: the condition number of the free lattice Laplacian on a well of area
 * n h^2 is at most about 0.44 n (Faber-Krahn bound lambda_1 >= pi j01^2 / area, spectrum below 8 / h^2), and about
 * sqrt(kappa) / 5 products per step leave LOBPCG some 15-30 iterations (measured with npm run bench).
 * @example
 * chebyshevDegreeFor(80_000); // 37
 */
export function chebyshevDegreeFor(n: number): number {
  return Math.max(MIN_DEGREE, Math.min(MAX_DEGREE, Math.round(0.13 * Math.sqrt(n))));
}

/**
 * Gershgorin bounds [lo, hi] of the spectrum of a Hermitian CSR matrix.
 * @example
 * gershgorinBounds(H); // e.g. [0, 8 / h^2] for the free lattice Laplacian
 */
export function gershgorinBounds(A: CsrMatrix): [number, number] {
  let lo = Infinity;
  let hi = -Infinity;
  for (let r = 0; r < A.n; r++) {
    let diag = 0;
    let off = 0;
    for (let p = A.rowPtr[r]; p < A.rowPtr[r + 1]; p++) {
      if (A.colIdx[p] === r) diag = A.re[p];
      else off += A.im ? Math.hypot(A.re[p], A.im[p]) : Math.abs(A.re[p]);
    }
    lo = Math.min(lo, diag - off);
    hi = Math.max(hi, diag + off);
  }
  return [lo, hi];
}

/**
 * Builds T ~ (H - lo)^-1 as the degree-d Chebyshev iteration polynomial on the interval [b / d^2, b], b = hi - lo
 * (Gershgorin bounds). T is positive definite on the whole spectrum: it damps the high modes like 1/x and scales the
 * low (wanted) modes almost uniformly, cutting LOBPCG iterations by roughly a factor d for d sparse products.
 *
 * @param A - Hermitian CSR matrix
 * @param degree - polynomial degree (>= 1); default DEFAULT_CHEBYSHEV_DEGREE
 * @see Y. Saad, Iterative Methods for Sparse Linear Systems, 2nd ed., SIAM (2003), Algorithm 12.1 (Chebyshev iteration)
 * @example
 * lowestEigenpairs(H, 4, { method: 'lobpcg', preconditioner: chebyshevPreconditioner(H) });
 */
export function chebyshevPreconditioner(A: CsrMatrix, degree = DEFAULT_CHEBYSHEV_DEGREE): Preconditioner {
  const [lo, hi] = gershgorinBounds(A);
  const b = Math.max(hi - lo, Number.MIN_VALUE);
  const a = b / Math.max(4, degree * degree);
  const theta = (b + a) / 2;
  const delta = (b - a) / 2;
  const sigma1 = theta / delta;
  const n = A.n;
  let cap = 0;
  let res = new Float64Array(0);
  let resIm: Float64Array | null = null;
  let dir = new Float64Array(0);
  let dirIm: Float64Array | null = null;
  let next = new Float64Array(0);
  let nextIm: Float64Array | null = null;
  let prod = new Float64Array(0);
  let prodIm: Float64Array | null = null;

  return (r: StateBlock, out: StateBlock) => {
    const k = r.k;
    const len = k * n;
    const complex = r.im !== null || A.im !== null;
    if (len > cap || (complex && resIm === null)) {
      cap = len;
      res = new Float64Array(len);
      dir = new Float64Array(len);
      next = new Float64Array(len);
      resIm = complex ? new Float64Array(len) : null;
      dirIm = complex ? new Float64Array(len) : null;
      nextIm = complex ? new Float64Array(len) : null;
      prod = new Float64Array(len);
      prodIm = complex ? new Float64Array(len) : null;
    }
    const xr = out.re;
    const xi = complex ? out.im : null;
    if (complex && !xi) throw new TypeError('chebyshevPreconditioner: out.im must be allocated for a complex problem');
    for (let i = 0; i < len; i++) {
      res[i] = r.re[i];
      dir[i] = r.re[i] / theta;
      xr[i] = 0;
    }
    if (resIm && dirIm && xi) {
      for (let i = 0; i < len; i++) {
        const v = r.im ? r.im[i] : 0;
        resIm[i] = v;
        dirIm[i] = v / theta;
        xi[i] = 0;
      }
    }
    let rho = 1 / sigma1;
    for (let step = 1; step < degree; step++) {
      const rhoNext = 1 / (2 * sigma1 - rho);
      const c1 = rhoNext * rho;
      const c2 = (2 * rhoNext) / delta;
      if (resIm && dirIm && nextIm && prodIm && xi) {
        csrMatVecColumns(A, dir, dirIm, prod, prodIm, k);
        chebyshevUpdateComplex(len, lo, c1, c2, xr, xi, res, resIm, dir, dirIm, prod, prodIm, next, nextIm);
      } else {
        csrMatVecColumns(A, dir, null, prod, null, k);
        chebyshevUpdateReal(len, lo, c1, c2, xr, res, dir, prod, next);
      }
      [dir, next] = [next, dir];
      if (dirIm && nextIm) [dirIm, nextIm] = [nextIm, dirIm];
      rho = rhoNext;
    }
    for (let i = 0; i < len; i++) xr[i] += dir[i];
    if (xi && dirIm) for (let i = 0; i < len; i++) xi[i] += dirIm[i];
  };
}

/**
 * The vector part of one Chebyshev step for real columns, given s = A d (shared CSR product, five columns per pass):
 * x += d; r -= (A - lo) d; d' = c1 d + c2 r, element by element.
 */
function chebyshevUpdateReal(
  len: number,
  lo: number,
  c1: number,
  c2: number,
  x: Float64Array,
  res: Float64Array,
  d: Float64Array,
  s: Float64Array,
  dNext: Float64Array,
): void {
  for (let i = 0; i < len; i++) {
    const di = d[i];
    x[i] += di;
    const ri = res[i] - (s[i] - lo * di);
    res[i] = ri;
    dNext[i] = c1 * di + c2 * ri;
  }
}

/** The same update for complex columns, given s = A d (A Hermitian, possibly complex). */
function chebyshevUpdateComplex(
  len: number,
  lo: number,
  c1: number,
  c2: number,
  xr: Float64Array,
  xi: Float64Array,
  resRe: Float64Array,
  resIm: Float64Array,
  dRe: Float64Array,
  dIm: Float64Array,
  sRe: Float64Array,
  sIm: Float64Array,
  nRe: Float64Array,
  nIm: Float64Array,
): void {
  for (let i = 0; i < len; i++) {
    const a = dRe[i];
    const b = dIm[i];
    xr[i] += a;
    xi[i] += b;
    const rr = resRe[i] - (sRe[i] - lo * a);
    const ri = resIm[i] - (sIm[i] - lo * b);
    resRe[i] = rr;
    resIm[i] = ri;
    nRe[i] = c1 * a + c2 * rr;
    nIm[i] = c1 * b + c2 * ri;
  }
}
