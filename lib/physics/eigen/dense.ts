// Dense Hermitian eigensolvers for small matrices: real symmetric via ml-matrix EVD, complex Hermitian via the
// real 2n x 2n embedding [[A, -B], [B, A]], whose eigenvalues come in equal pairs (PHYSICS.md section 2).
import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import { csrMatVecColumns, toDense } from '../csr';
import type { CsrMatrix, EigenResult } from '../types';

/** Eigenvalues of the embedding closer than this times the largest |eigenvalue| are searched together for pairs. */
const PAIR_GROUP_RTOL = 1e-8;
/**
 * A candidate carries a new complex direction when its squared norm left after projection exceeds this (a copy
 * i z of an accepted z leaves ~1e-30; a new direction, picked by pivoting, leaves at least ~2 / (group size)).
 */
const NEW_DIRECTION_MIN_NORM2 = 1e-6;

export interface DenseEigen {
  /** Ascending eigenvalues (length n). */
  values: Float64Array;
  /** Orthonormal eigenvectors, column-major: vector j at [j * n, (j + 1) * n). */
  vectorsRe: Float64Array;
  /** Imaginary parts, or null for a real symmetric input. */
  vectorsIm: Float64Array | null;
}

/**
 * All eigenpairs of a real symmetric matrix (row-major n x n; the average of a and a^T is used).
 * @see ml-matrix EigenvalueDecomposition (tred2 / tql2, EISPACK)
 * @example
 * symmetricEigen(new Float64Array([2, 1, 1, 2]), 2).values; // Float64Array [1, 3]
 */
export function symmetricEigen(a: Float64Array, n: number): DenseEigen {
  const m = new Matrix(n, n);
  for (let r = 0; r < n; r++) for (let c = 0; c < n; c++) m.set(r, c, 0.5 * (a[r * n + c] + a[c * n + r]));
  const evd = new EigenvalueDecomposition(m, { assumeSymmetric: true });
  const d = evd.realEigenvalues;
  const V = evd.eigenvectorMatrix;
  const order = d.map((_, i) => i).sort((p, q) => d[p] - d[q] || p - q);
  const values = new Float64Array(n);
  const vectorsRe = new Float64Array(n * n);
  order.forEach((src, j) => {
    values[j] = d[src];
    for (let r = 0; r < n; r++) vectorsRe[j * n + r] = V.get(r, src);
  });
  return { values, vectorsRe, vectorsIm: null };
}

/**
 * All eigenpairs of a complex Hermitian matrix A + iB (row-major n x n arrays), through the real symmetric
 * embedding M = [[A, -B], [B, A]]. An eigenvector (u; v) of M gives the eigenvector u + iv of A + iB; each complex
 * eigenvector appears twice in M (as z and iz), so within each group of (nearly) equal eigenvalues pivoted complex
 * Gram-Schmidt keeps exactly the new complex directions (robust for degenerate levels and noisy pairs).
 * @example
 * hermitianEigen(new Float64Array([1, 0, 0, 1]), new Float64Array([0, -1, 1, 0]), 2).values; // [0, 2]
 */
export function hermitianEigen(re: Float64Array, im: Float64Array | null, n: number): DenseEigen {
  if (im === null) return symmetricEigen(re, n);
  const n2 = 2 * n;
  const m = new Float64Array(n2 * n2);
  for (let r = 0; r < n; r++) {
    for (let c = 0; c < n; c++) {
      const a = 0.5 * (re[r * n + c] + re[c * n + r]);
      const b = 0.5 * (im[r * n + c] - im[c * n + r]);
      m[r * n2 + c] = a;
      m[(r + n) * n2 + c + n] = a;
      m[r * n2 + c + n] = -b;
      m[(r + n) * n2 + c] = b;
    }
  }
  const big = symmetricEigen(m, n2);
  const scale = Math.max(1, Math.abs(big.values[0]), Math.abs(big.values[n2 - 1]));
  const values = new Float64Array(n);
  const vectorsRe = new Float64Array(n * n);
  const vectorsIm = new Float64Array(n * n);
  let found = 0;
  let start = 0;
  while (start < n2 && found < n) {
    // A group: a chain of eigenvalues closer than the (loose) window. Exact pairs z, iz always fall in one group;
    // distinct eigenvalues sharing a group are not mixed, since their complex overlaps vanish.
    let end = start + 1;
    while (end < n2 && big.values[end] - big.values[end - 1] <= PAIR_GROUP_RTOL * scale) end++;
    const cr: Float64Array[] = [];
    const ci: Float64Array[] = [];
    const lambda: number[] = [];
    for (let w = start; w < end; w++) {
      cr.push(big.vectorsRe.slice(w * n2, w * n2 + n));
      ci.push(big.vectorsRe.slice(w * n2 + n, w * n2 + n2));
      lambda.push(big.values[w]);
    }
    const norm2 = cr.map((v, l) => dotRe(v, ci[l], v, ci[l]));
    // Pivoted complex Gram-Schmidt: take the candidate with the most new direction while one is left.
    for (;;) {
      let pick = -1;
      for (let l = 0; l < cr.length; l++) if (norm2[l] >= 0 && (pick < 0 || norm2[l] > norm2[pick])) pick = l;
      if (pick < 0 || norm2[pick] < NEW_DIRECTION_MIN_NORM2 || found >= n) break;
      const s = 1 / Math.sqrt(norm2[pick]);
      const zr = cr[pick];
      const zi = ci[pick];
      for (let r = 0; r < n; r++) {
        zr[r] *= s;
        zi[r] *= s;
      }
      norm2[pick] = -1;
      for (let l = 0; l < cr.length; l++) {
        if (norm2[l] < 0) continue;
        // c = <z, w> = sum conj(z) w; w -= c z
        let pr = 0;
        let pi = 0;
        for (let r = 0; r < n; r++) {
          pr += zr[r] * cr[l][r] + zi[r] * ci[l][r];
          pi += zr[r] * ci[l][r] - zi[r] * cr[l][r];
        }
        for (let r = 0; r < n; r++) {
          cr[l][r] -= pr * zr[r] - pi * zi[r];
          ci[l][r] -= pr * zi[r] + pi * zr[r];
        }
        norm2[l] = dotRe(cr[l], ci[l], cr[l], ci[l]);
      }
      values[found] = lambda[pick];
      vectorsRe.set(zr, found * n);
      vectorsIm.set(zi, found * n);
      found++;
    }
    start = end;
  }
  if (found < n) throw new Error(`hermitianEigen: recovered ${found} of ${n} eigenvectors from the real embedding`);
  // Pivoting may pick within a group out of order: sort ascending (stable).
  const order = Array.from(values.keys()).sort((p, q) => values[p] - values[q] || p - q);
  const sorted: DenseEigen = { values: new Float64Array(n), vectorsRe: new Float64Array(n * n), vectorsIm: new Float64Array(n * n) };
  order.forEach((src, j) => {
    sorted.values[j] = values[src];
    sorted.vectorsRe.set(vectorsRe.subarray(src * n, (src + 1) * n), j * n);
    (sorted.vectorsIm as Float64Array).set(vectorsIm.subarray(src * n, (src + 1) * n), j * n);
  });
  return sorted;
}

/** Re <a, b> for complex vectors given as (re, im) pairs. */
function dotRe(ar: Float64Array, ai: Float64Array, br: Float64Array, bi: Float64Array): number {
  let s = 0;
  for (let r = 0; r < ar.length; r++) s += ar[r] * br[r] + ai[r] * bi[r];
  return s;
}

/**
 * The k lowest eigenpairs of a CSR matrix by dense diagonalisation (for n up to a few hundred).
 * Residual norms are absolute, ||H v - lambda v|| with ||v|| = 1.
 * @example
 * denseEigenpairs(H, 4).values; // the 4 lowest levels
 */
export function denseEigenpairs(matrix: CsrMatrix, k: number): EigenResult {
  const { n } = matrix;
  const dense = toDense(matrix);
  const all = hermitianEigen(dense.re, dense.im, n);
  const re = all.vectorsRe.slice(0, k * n);
  const im = all.vectorsIm ? all.vectorsIm.slice(0, k * n) : null;
  const values = all.values.slice(0, k);
  const residualNorms = residuals(matrix, values, re, im, k);
  return { values, vectors: { n, k, re, im }, residualNorms, iterations: 1, converged: true, method: 'dense' };
}

/** ||H v_j - lambda_j v_j|| for each of k columns. */
export function residuals(matrix: CsrMatrix, values: Float64Array, re: Float64Array, im: Float64Array | null, k: number): Float64Array {
  const { n } = matrix;
  const complex = im !== null || matrix.im !== null;
  const yr = new Float64Array(k * n);
  const yi = complex ? new Float64Array(k * n) : null;
  csrMatVecColumns(matrix, re, im, yr, yi, k);
  const out = new Float64Array(k);
  for (let j = 0; j < k; j++) {
    let s = 0;
    for (let r = j * n; r < (j + 1) * n; r++) {
      const dr = yr[r] - values[j] * re[r];
      const di = yi ? yi[r] - values[j] * (im ? im[r] : 0) : 0;
      s += dr * dr + di * di;
    }
    out[j] = Math.sqrt(s);
  }
  return out;
}
