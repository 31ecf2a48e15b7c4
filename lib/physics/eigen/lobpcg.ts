// Block LOBPCG for the lowest eigenpairs of a real symmetric or complex Hermitian CSR matrix (Knyazev 2001).
// Orthonormal basis [X P W] (P kept orthonormal in coefficient space, W by Gram-Schmidt + Cholesky-QR), soft locking, guard vectors, best iterate.
import { csrMatVecColumns } from '../csr';
import { AbortError } from '../errors';
import { mulberry32 } from '../random';
import type { CsrMatrix, EigenOptions, EigenResult } from '../types';
import { columnNorm, combine, copyColumn, gram, scaleColumn, type Cols } from './block-ops';
import { chebyshevDegreeFor, chebyshevPreconditioner } from './chebyshev';
import { denseEigenpairs, hermitianEigen } from './dense';

/** Default relative residual tolerance ||H v - lambda v|| / max(1, |lambda|). */
export const DEFAULT_TOL = 1e-9;
/** Default iteration cap (with the default polynomial preconditioner ~40 iterations suffice at 8e4 unknowns; without any, thousands). */
export const DEFAULT_MAX_ITER = 5000;
/** A column whose squared remaining norm falls below this fraction during orthonormalisation is dropped. */
const DROP_RTOL = 1e-10;

/**
 * Block size: k wanted vectors plus guard vectors (faster convergence of the k-th level, and whole degenerate
 * clusters at the top of the wanted range), at most n / 3 so that the basis [X P W] fits.
 */
export function lobpcgBlockSize(k: number, n: number): number {
  const guard = Math.max(2, Math.ceil(0.25 * k));
  return Math.min(k + guard, Math.floor(n / 3));
}

interface Workspace {
  n: number;
  m: number;
  complex: boolean;
  S: Cols;
  AS: Cols;
  T: Cols;
  R: Cols;
  tmp: Cols;
}

function allocCols(cols: number, n: number, complex: boolean): Cols {
  return { re: new Float64Array(cols * n), im: complex ? new Float64Array(cols * n) : null, off: 0 };
}

function at(block: Cols, off: number): Cols {
  return { re: block.re, im: block.im, off };
}

function matVec(A: CsrMatrix, ws: Workspace, from: Cols, to: Cols, cols: number): void {
  const n = ws.n;
  const xr = from.re.subarray(from.off * n, (from.off + cols) * n);
  const xi = from.im ? from.im.subarray(from.off * n, (from.off + cols) * n) : null;
  const yr = to.re.subarray(to.off * n, (to.off + cols) * n);
  const yi = to.im ? to.im.subarray(to.off * n, (to.off + cols) * n) : null;
  csrMatVecColumns(A, xr, xi, yr, yi, cols);
}

/**
 * Orthonormalises c columns V (Cholesky-QR with dropping of dependent columns), compacting the kept ones to the
 * front. The first `tracked` columns carry A-images in AV, transformed alike (the triangular factor keeps them first).
 * @returns kept columns, how many of them are tracked, and the smallest relative pivot (near 1 when V was orthonormal)
 */
function cholQR(ws: Workspace, V: Cols, c: number, AV: Cols | null, tracked: number): { kept: number; keptTracked: number; minPivot: number } {
  const { n, complex } = ws;
  if (c === 0) return { kept: 0, keptTracked: 0, minPivot: 1 };
  const gr = new Float64Array(c * c);
  const gi = complex ? new Float64Array(c * c) : null;
  gram(n, V, c, V, c, gr, gi);
  // Upper-triangular R with V = Q R over kept columns (complex Cholesky of G, left-looking, with dropping).
  const rr = new Float64Array(c * c);
  const ri = new Float64Array(c * c);
  const keep: number[] = [];
  let minPivot = Infinity;
  for (let j = 0; j < c; j++) {
    const gjj = gr[j * c + j];
    for (const l of keep) {
      let sr = gr[l * c + j];
      let si = gi ? gi[l * c + j] : 0;
      for (const t of keep) {
        if (t >= l) break;
        // sum conj(R[t][l]) R[t][j]
        sr -= rr[t * c + l] * rr[t * c + j] + ri[t * c + l] * ri[t * c + j];
        si -= rr[t * c + l] * ri[t * c + j] - ri[t * c + l] * rr[t * c + j];
      }
      rr[l * c + j] = sr / rr[l * c + l];
      ri[l * c + j] = si / rr[l * c + l];
    }
    let d = gjj;
    for (const l of keep) d -= rr[l * c + j] ** 2 + ri[l * c + j] ** 2;
    if (gjj > 0 && d > DROP_RTOL * gjj) {
      rr[j * c + j] = Math.sqrt(d);
      keep.push(j);
      minPivot = Math.min(minPivot, d / gjj);
    }
  }
  const q = keep.length;
  // Coefficients: Q[:, u] = sum_t V[:, keep[t]] Rinv[t][u] (Rinv upper triangular, q x q), laid out as c x q.
  const cr = new Float64Array(c * q);
  const ci = complex ? new Float64Array(c * q) : null;
  for (let u = 0; u < q; u++) {
    // Column u of Rinv by back substitution: R_kk x = e_u.
    const xr = new Float64Array(q);
    const xi = new Float64Array(q);
    for (let t = u; t >= 0; t--) {
      let sr = t === u ? 1 : 0;
      let si = 0;
      for (let w = t + 1; w <= u; w++) {
        const ar = rr[keep[t] * c + keep[w]];
        const ai = ri[keep[t] * c + keep[w]];
        sr -= ar * xr[w] - ai * xi[w];
        si -= ar * xi[w] + ai * xr[w];
      }
      const diag = rr[keep[t] * c + keep[t]];
      xr[t] = sr / diag;
      xi[t] = si / diag;
    }
    for (let t = 0; t <= u; t++) {
      cr[keep[t] * q + u] = xr[t];
      if (ci) ci[keep[t] * q + u] = xi[t];
    }
  }
  combine(n, V, c, cr, ci, q, 0, ws.tmp, q, false);
  for (let u = 0; u < q; u++) copyColumn(n, ws.tmp, u, V, u);
  let keptTracked = 0;
  while (keptTracked < q && keep[keptTracked] < tracked) keptTracked++;
  if (AV && keptTracked > 0) {
    combine(n, AV, tracked, cr, ci, q, 0, ws.tmp, keptTracked, false);
    for (let u = 0; u < keptTracked; u++) copyColumn(n, ws.tmp, u, AV, u);
  }
  return { kept: q, keptTracked, minPivot: q > 0 ? minPivot : 0 };
}

/** V -= X (X^H V) twice (classical Gram-Schmidt with reorthogonalisation); AV -= AX (X^H V) on the first `tracked` columns. */
function projectOut(ws: Workspace, X: Cols, m: number, AX: Cols, V: Cols, c: number, AV: Cols | null, tracked: number): void {
  const { n, complex } = ws;
  const gr = new Float64Array(m * c);
  const gi = complex ? new Float64Array(m * c) : null;
  for (let pass = 0; pass < 2; pass++) {
    gram(n, X, m, V, c, gr, gi);
    combine(n, X, m, gr, gi, c, 0, V, c, true);
    if (AV && tracked > 0) combine(n, AX, m, gr, gi, c, 0, AV, tracked, true);
  }
}

/**
 * Turns the raw residual block (a columns at W) into new search directions: unit columns, orthogonal to the
 * orthonormal block Q = [X P] (q columns at the start of S), orthonormal among themselves; dependent ones dropped.
 * @returns the number of kept W columns
 */
function orthonormalizeW(ws: Workspace, q: number, a: number): number {
  const W = at(ws.S, q);
  for (let j = 0; j < a; j++) {
    const norm = columnNorm(ws.n, W, j);
    if (norm > 0) scaleColumn(ws.n, W, j, 1 / norm);
  }
  projectOut(ws, at(ws.S, 0), q, at(ws.AS, 0), W, a, null, 0);
  const first = cholQR(ws, W, a, null, 0);
  const second = cholQR(ws, W, first.kept, null, 0);
  return second.kept;
}

/**
 * Coefficients of the new P directions in the basis S: the W and P parts of the Ritz coefficients C, made orthogonal
 * to C itself and orthonormal (small s x m work, so P stays orthonormal and orthogonal to the new X without touching
 * long vectors). Columns that vanish (no new direction for that Ritz vector) are flagged invalid.
 */
function pCoefficients(s: number, m: number, cr: Float64Array, ci: Float64Array | null, active: number[], valid: Uint8Array) {
  const zr = new Float64Array(s * m);
  const zi = ci ? new Float64Array(s * m) : null;
  for (let i = m; i < s; i++) {
    for (let j = 0; j < m; j++) {
      zr[i * m + j] = cr[i * m + j];
      if (zi && ci) zi[i * m + j] = ci[i * m + j];
    }
  }
  // Complex column helpers on row-major s x m arrays.
  const dot = (ar: Float64Array, ai: Float64Array | null, p: number, br: Float64Array, bi: Float64Array | null, q: number): [number, number] => {
    let re = 0;
    let im = 0;
    for (let i = 0; i < s; i++) {
      const a = ar[i * m + p];
      const b = ai ? ai[i * m + p] : 0;
      const c = br[i * m + q];
      const d = bi ? bi[i * m + q] : 0;
      re += a * c + b * d;
      im += a * d - b * c;
    }
    return [re, im];
  };
  const subtract = (tr: Float64Array, ti: Float64Array | null, q: number, br: Float64Array, bi: Float64Array | null, p: number, [cre, cim]: [number, number]) => {
    for (let i = 0; i < s; i++) {
      const c = br[i * m + p];
      const d = bi ? bi[i * m + p] : 0;
      tr[i * m + q] -= cre * c - cim * d;
      if (ti) ti[i * m + q] -= cre * d + cim * c;
    }
  };
  // Only columns still being iterated get a P direction: locked ones would use up the s - m available dimensions.
  valid.fill(0);
  const done: number[] = [];
  for (const j of active) {
    const before = Math.sqrt(dot(zr, zi, j, zr, zi, j)[0]);
    for (let pass = 0; pass < 2; pass++) {
      for (let l = 0; l < m; l++) subtract(zr, zi, j, cr, ci, l, dot(cr, ci, l, zr, zi, j));
      for (const l of done) subtract(zr, zi, j, zr, zi, l, dot(zr, zi, l, zr, zi, j));
    }
    const norm = Math.sqrt(dot(zr, zi, j, zr, zi, j)[0]);
    valid[j] = norm > 1e-8 * before && norm > 1e-14 ? 1 : 0;
    if (valid[j]) done.push(j);
    for (let i = 0; i < s; i++) {
      zr[i * m + j] = valid[j] ? zr[i * m + j] / norm : 0;
      if (zi) zi[i * m + j] = valid[j] ? zi[i * m + j] / norm : 0;
    }
  }
  // Columns without a direction are zero.
  for (let j = 0; j < m; j++) {
    if (valid[j]) continue;
    for (let i = 0; i < s; i++) {
      zr[i * m + j] = 0;
      if (zi) zi[i * m + j] = 0;
    }
  }
  return { zr, zi };
}

/** Rayleigh-Ritz on the s-column orthonormal basis: lowest m Ritz values and coefficients (row-major s x m). */
function rayleighRitz(ws: Workspace, s: number, lambda: Float64Array, haveLambda: boolean) {
  const { n, m, complex } = ws;
  const lo = haveLambda ? m : 0;
  const w = s - lo;
  const g2r = new Float64Array(s * w);
  const g2i = complex ? new Float64Array(s * w) : null;
  gram(n, at(ws.S, 0), s, at(ws.AS, lo), w, g2r, g2i);
  const gr = new Float64Array(s * s);
  const gi = complex ? new Float64Array(s * s) : null;
  for (let i = 0; i < s; i++) {
    for (let j = lo; j < s; j++) {
      gr[i * s + j] = g2r[i * w + j - lo];
      if (gi && g2i) gi[i * s + j] = g2i[i * w + j - lo];
      if (j >= lo && i < lo) {
        gr[j * s + i] = gr[i * s + j];
        if (gi) gi[j * s + i] = -gi[i * s + j];
      }
    }
  }
  if (haveLambda) for (let i = 0; i < m; i++) gr[i * s + i] = lambda[i];
  const eig = hermitianEigen(gr, gi, s);
  const cr = new Float64Array(s * m);
  const ci = complex ? new Float64Array(s * m) : null;
  for (let j = 0; j < m; j++) {
    for (let i = 0; i < s; i++) {
      cr[i * m + j] = eig.vectorsRe[j * s + i];
      if (ci && eig.vectorsIm) ci[i * m + j] = eig.vectorsIm[j * s + i];
    }
  }
  return { values: eig.values.slice(0, m), cr, ci };
}

function swap(ws: Workspace): void {
  [ws.S, ws.T] = [ws.T, ws.S];
}

/** Fills X (columns 0..m-1 of S) from the warm start and seeded random columns; returns nothing, X orthonormal. */
function initialBlock(ws: Workspace, options: EigenOptions): void {
  const { n, m } = ws;
  const next = mulberry32(options.seed ?? 1);
  const X = at(ws.S, 0);
  let filled = 0;
  const init = options.initial;
  if (init && init.n === n) {
    for (let c = 0; c < Math.min(init.k, m); c++) {
      const src = c * n;
      let useIm = false;
      if (!ws.complex && init.im) {
        // Real problem, complex warm start: keep whichever part carries more weight.
        let a = 0;
        let b = 0;
        for (let r = 0; r < n; r++) {
          a += init.re[src + r] ** 2;
          b += init.im[src + r] ** 2;
        }
        useIm = b > a;
      }
      X.re.set((useIm && init.im ? init.im : init.re).subarray(src, src + n), filled * n);
      if (X.im) {
        if (init.im) X.im.set(init.im.subarray(src, src + n), filled * n);
        else X.im.fill(0, filled * n, (filled + 1) * n);
      }
      filled++;
    }
  }
  for (let attempt = 0; attempt < 8; attempt++) {
    for (let c = filled; c < m; c++) {
      for (let r = 0; r < n; r++) X.re[c * n + r] = next() - 0.5;
      if (X.im) X.im.fill(0, c * n, (c + 1) * n);
    }
    filled = cholQR(ws, X, m, null, 0).kept;
    filled = cholQR(ws, X, filled, null, 0).kept;
    if (filled === m) return;
  }
  throw new Error('lobpcg: could not build an independent start block');
}

/**
 * The k lowest eigenpairs of a Hermitian CSR matrix by block LOBPCG.
 *
 * Convergence: ||H v - lambda v|| <= tol * max(1, |lambda|) for each of the k wanted pairs. Returned residual norms are
 * absolute (||v|| = 1). If the iteration cap is reached, the best iterate (smallest worst residual) is returned with
 * `converged: false`. Deterministic: seeded start vectors and fixed summation order.
 *
 * @param matrix - real symmetric (`im` null) or complex Hermitian CSR, both triangles
 * @param k - number of lowest pairs, 1 <= k <= n (validated by lowestEigenpairs)
 * @param options - tol (default 1e-9), maxIter (default 5000), seed (default 1), initial (warm start), signal (throws
 *   AbortError), onProgress (fraction in [0, 1]), preconditioner (default: a Chebyshev polynomial in H, see
 *   chebyshev.ts; pass null for none, or e.g. a sparse-factorisation solve)
 * @see A. V. Knyazev, SIAM J. Sci. Comput. 23, 517 (2001), doi:10.1137/S1064827500366124
 * @see U. Hetmaniuk and R. Lehoucq, J. Comput. Phys. 218, 324 (2006) (orthonormal basis variant)
 * @example
 * const { values } = lobpcgEigenpairs(H, 4, { tol: 1e-9 });
 */
export function lobpcgEigenpairs(matrix: CsrMatrix, k: number, options: EigenOptions = {}): EigenResult {
  const { n } = matrix;
  const m = lobpcgBlockSize(k, n);
  if (m < k) return { ...denseEigenpairs(matrix, k), method: 'dense' };
  const complex = matrix.im !== null;
  const tol = options.tol ?? DEFAULT_TOL;
  const maxIter = options.maxIter ?? DEFAULT_MAX_ITER;
  const ws: Workspace = {
    n,
    m,
    complex,
    S: allocCols(3 * m, n, complex),
    AS: allocCols(3 * m, n, complex),
    T: allocCols(3 * m, n, complex),
    R: allocCols(m, n, complex),
    tmp: allocCols(2 * m, n, complex),
  };

  // No preconditioner given (undefined): a Chebyshev polynomial in H; null asks for none.
  const preconditioner =
    options.preconditioner === undefined ? chebyshevPreconditioner(matrix, chebyshevDegreeFor(n)) : options.preconditioner;
  initialBlock(ws, options);
  let lambda = new Float64Array(m);
  // Rayleigh-Ritz on the start block X alone; afterwards A X and A P are recomputed exactly every step (no drift).
  const ritzOnX = () => {
    matVec(matrix, ws, at(ws.S, 0), at(ws.AS, 0), m);
    const rr = rayleighRitz(ws, m, lambda, false);
    combine(n, at(ws.S, 0), m, rr.cr, rr.ci, m, 0, at(ws.T, 0), m, false);
    swap(ws);
    matVec(matrix, ws, at(ws.S, 0), at(ws.AS, 0), m);
    lambda = rr.values;
  };
  ritzOnX();

  const rel = new Float64Array(m);
  const abs = new Float64Array(m);
  const validP = new Uint8Array(m);
  const best = {
    worst: Infinity,
    values: new Float64Array(k),
    re: new Float64Array(k * n),
    im: complex ? new Float64Array(k * n) : null,
    res: new Float64Array(k),
  };
  let haveP = false;
  let iterations = 0;
  let converged = false;
  let firstWorst = NaN;
  let reported = 0;

  for (;;) {
    // Residuals R = AX - X Lambda for all m columns.
    const X = at(ws.S, 0);
    const AX = at(ws.AS, 0);
    for (let j = 0; j < m; j++) {
      const o = j * n;
      const l = lambda[j];
      let s = 0;
      for (let r = o; r < o + n; r++) {
        const d = AX.re[r] - l * X.re[r];
        ws.R.re[r] = d;
        s += d * d;
      }
      if (ws.R.im && AX.im && X.im) {
        for (let r = o; r < o + n; r++) {
          const d = AX.im[r] - l * X.im[r];
          ws.R.im[r] = d;
          s += d * d;
        }
      }
      abs[j] = Math.sqrt(s);
      rel[j] = abs[j] / Math.max(1, Math.abs(l));
    }
    let worst = 0;
    for (let j = 0; j < k; j++) worst = Math.max(worst, rel[j]);
    if (worst < best.worst) {
      best.worst = worst;
      best.values.set(lambda.subarray(0, k));
      best.re.set(X.re.subarray(0, k * n));
      if (best.im && X.im) best.im.set(X.im.subarray(0, k * n));
      best.res.set(abs.subarray(0, k));
    }
    if (worst <= tol) {
      converged = true;
      break;
    }
    if (iterations >= maxIter) break;
    if (options.signal?.aborted) throw new AbortError();
    if (options.onProgress) {
      if (Number.isNaN(firstWorst)) firstWorst = worst;
      const f = firstWorst > tol ? Math.log(firstWorst / worst) / Math.log(firstWorst / tol) : 1;
      const fraction = Math.min(0.99, Math.max(0, f));
      if (fraction >= reported + 0.01) {
        reported = fraction;
        options.onProgress(fraction);
      }
    }
    iterations++;

    // Soft locking: only columns whose residual is still above tolerance get new search directions.
    const active: number[] = [];
    for (let j = 0; j < m; j++) if (rel[j] > tol) active.push(j);
    let p = 0;
    if (haveP) {
      for (const j of active) {
        if (!validP[j]) continue;
        if (j !== p) {
          copyColumn(n, at(ws.S, m), j, at(ws.S, m), p);
          copyColumn(n, at(ws.AS, m), j, at(ws.AS, m), p);
        }
        p++;
      }
    }
    const a = active.length;
    active.forEach((j, t) => {
      if (j !== t) copyColumn(n, ws.R, j, ws.R, t);
    });
    const W = at(ws.S, m + p);
    if (preconditioner) {
      const span = (arr: Float64Array, off: number) => arr.subarray(off * n, (off + a) * n);
      preconditioner(
        { n, k: a, re: span(ws.R.re, 0), im: ws.R.im ? span(ws.R.im, 0) : null },
        { n, k: a, re: span(W.re, W.off), im: W.im ? span(W.im, W.off) : null },
      );
    } else {
      for (let t = 0; t < a; t++) copyColumn(n, ws.R, t, W, t);
    }
    const aKept = orthonormalizeW(ws, m + p, a);
    if (aKept + p === 0) break; // no new direction: X spans an invariant subspace to rounding
    matVec(matrix, ws, W, at(ws.AS, m + p), aKept);
    const s = m + p + aKept;
    const rr = rayleighRitz(ws, s, lambda, true);
    combine(n, at(ws.S, 0), s, rr.cr, rr.ci, m, 0, at(ws.T, 0), m, false);
    const z = pCoefficients(s, m, rr.cr, rr.ci, active, validP);
    combine(n, at(ws.S, 0), s, z.zr, z.zi, m, 0, at(ws.T, m), m, false);
    swap(ws);
    // Exact A-images of the new X and P (a few sparse products are cheaper than updating them by recurrence,
    // and nothing drifts).
    matVec(matrix, ws, at(ws.S, 0), at(ws.AS, 0), 2 * m);
    lambda = rr.values;
    haveP = true;
  }

  options.onProgress?.(1);
  const X = at(ws.S, 0);
  if (converged) {
    return {
      values: lambda.slice(0, k),
      vectors: { n, k, re: X.re.slice(0, k * n), im: X.im ? X.im.slice(0, k * n) : null },
      residualNorms: abs.slice(0, k),
      iterations,
      converged: true,
      method: 'lobpcg',
    };
  }
  return {
    values: best.values,
    vectors: { n, k, re: best.re, im: best.im },
    residualNorms: best.res,
    iterations,
    converged: false,
    method: 'lobpcg',
  };
}
