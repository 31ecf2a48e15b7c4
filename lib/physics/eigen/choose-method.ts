// Picks the eigensolver for a problem: dense for tiny matrices, LOBPCG otherwise (shift-invert once it is ready).
// The thresholds are named constants; the benchmark (npm run bench) is where they are justified.
import type { EigenOptions } from '../types';

/** Below this many unknowns a dense Hermitian eigensolver is cheaper than any iterative method. */
export const DENSE_MAX_UNKNOWNS = 300;

export type EigenMethod = 'lobpcg' | 'shift-invert' | 'dense';

/** Resolve `options.method` ('auto' by default) to a concrete method for an n x n matrix and k pairs. */
export function chooseMethod(n: number, k: number, options: EigenOptions = {}): EigenMethod {
  const method = options.method ?? 'auto';
  if (method !== 'auto') return method;
  if (n <= DENSE_MAX_UNKNOWNS || k * 5 > n) return 'dense';
  return 'lobpcg';
}
