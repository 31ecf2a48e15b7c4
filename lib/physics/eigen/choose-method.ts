// Picks the eigensolver for a problem: dense for tiny matrices, shift-invert (sparse LDL) otherwise, LOBPCG when the
// caller brings its own preconditioner. The thresholds are named constants justified by `npm run bench`.
import type { EigenOptions } from '../types';

/**
 * At or below this many unknowns a dense Hermitian eigensolver is used. Measured (CPU time, unit disk, k = 4):
 * dense and shift-invert cost the same near n = 80 (about 30 ms real); at n = 208 dense costs 4x (real) to 8x
 * (complex) more, at n = 316 about 20x to 50x more (bench/README.md, "Method policy").
 */
export const DENSE_MAX_UNKNOWNS = 96;

/** Dense also when k is a sizeable fraction of n (an iterative block would be nearly as large as the matrix). */
export const DENSE_MIN_UNKNOWNS_PER_LEVEL = 5;

export type EigenMethod = 'lobpcg' | 'shift-invert' | 'dense';

/**
 * Resolve `options.method` ('auto' by default) to a concrete method for an n x n matrix and k pairs.
 *
 * 'auto': dense for n <= DENSE_MAX_UNKNOWNS or n < 5k; LOBPCG when `options.preconditioner` is given (the caller
 * has factorised a nearby matrix once for a whole scan, see factorPreconditioner); shift-invert otherwise, cold or
 * warm. On the cases (unit disk, h = 1/160, about 80k unknowns) one shift-invert solve is within 2x of
 * scipy's eigsh, while LOBPCG without a preconditioner needs hundreds of iterations already at h = 1/40
 * (bench/results.json, `methodComparison`).
 *
 * @example
 * chooseMethod(80_000, 4); // 'shift-invert'
 * chooseMethod(50, 4); // 'dense'
 */
export function chooseMethod(n: number, k: number, options: EigenOptions = {}): EigenMethod {
  const method = options.method ?? 'auto';
  if (method !== 'auto') return method;
  if (n <= DENSE_MAX_UNKNOWNS || k * DENSE_MIN_UNKNOWNS_PER_LEVEL > n) return 'dense';
  if (options.preconditioner) return 'lobpcg';
  return 'shift-invert';
}
