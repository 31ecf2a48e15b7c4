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

/** The size thresholds of the method policy: who uses it decides them (one policy, two sets of thresholds). */
export interface MethodPolicy {
  /** At or below this many unknowns: dense. */
  denseMaxUnknowns: number;
  /** Dense also when n < k * this (0: no per-level rule). */
  denseMinUnknownsPerLevel: number;
}

/** Thresholds of single solves through lowestEigenpairs ('auto'). */
export const SOLVE_POLICY: MethodPolicy = {
  denseMaxUnknowns: DENSE_MAX_UNKNOWNS,
  denseMinUnknownsPerLevel: DENSE_MIN_UNKNOWNS_PER_LEVEL,
};

/**
 * At or below this many unknowns the tasks' repeated solves (sweeps, loops, scans) are dense. It predates
 * DENSE_MAX_UNKNOWNS and stays as it is: raising it to 96 would change the results of small task lattices.
 */
export const TASK_DENSE_MAX_UNKNOWNS = 64;

/**
 * Thresholds of the tasks' repeated solves: no per-level rule, since the task decides once for the whole lattice.
 * Shift-invert above the size: about 20x faster per solve than unpreconditioned LOBPCG on the unit disk at h = 1/16
 * (measured while writing the tasks: 33 ms versus 0.6 s per warm-started solve).
 */
export const TASK_POLICY: MethodPolicy = { denseMaxUnknowns: TASK_DENSE_MAX_UNKNOWNS, denseMinUnknownsPerLevel: 0 };

/**
 * The one method policy: dense for small n (or k a sizeable fraction of n), LOBPCG when the caller brings its own
 * preconditioner, shift-invert otherwise.
 * @example
 * policyMethod(80_000, 4, false, SOLVE_POLICY); // 'shift-invert'
 * policyMethod(64, 4, false, TASK_POLICY); // 'dense'
 */
export function policyMethod(n: number, k: number, preconditioned: boolean, policy: MethodPolicy): EigenMethod {
  if (n <= policy.denseMaxUnknowns || k * policy.denseMinUnknownsPerLevel > n) return 'dense';
  if (preconditioned) return 'lobpcg';
  return 'shift-invert';
}

/**
 * Resolve `options.method` ('auto' by default) to a concrete method for an n x n matrix and k pairs.
 *
 * 'auto': policyMethod with SOLVE_POLICY: dense for n <= DENSE_MAX_UNKNOWNS or n < 5k; LOBPCG when
 * `options.preconditioner` is given (the caller has factorised a nearby matrix once for a whole scan, see
 * factorPreconditioner); shift-invert otherwise, cold or warm. On the cases (unit disk, h = 1/160, about 80k
 * unknowns) one shift-invert solve is within 2x of scipy's eigsh, while LOBPCG without a preconditioner needs
 * hundreds of iterations already at h = 1/40 (bench/results.json, `methodComparison`).
 *
 * @example
 * chooseMethod(80_000, 4); // 'shift-invert'
 * chooseMethod(50, 4); // 'dense'
 */
export function chooseMethod(n: number, k: number, options: EigenOptions = {}): EigenMethod {
  const method = options.method ?? 'auto';
  if (method !== 'auto') return method;
  return policyMethod(n, k, Boolean(options.preconditioner), SOLVE_POLICY);
}
