// Public entry of the eigensolvers: validates once, dispatches (dense, LOBPCG, shift-invert) and fixes phases.
// `lowestEigenpairs` is what every task calls; `degenerateGroups` and `fixPhases` help interpret the result.
import type { CsrMatrix, EigenOptions, EigenResult } from '../types';
import { chooseMethod } from './choose-method';
import { denseEigenpairs } from './dense';
import { lobpcgEigenpairs } from './lobpcg';
import { fixPhases } from './phase';
import { shiftInvertEigenpairs } from './shift-invert';

export { degenerateGroups, fixPhases } from './phase';
export { DEFAULT_TOL, DEFAULT_MAX_ITER } from './lobpcg';

const METHODS = ['auto', 'lobpcg', 'shift-invert', 'dense'] as const;

function validate(matrix: CsrMatrix, k: number, options: EigenOptions): void {
  if (!matrix || !Number.isInteger(matrix.n) || matrix.n < 1) {
    throw new RangeError(`lowestEigenpairs: matrix.n must be a positive integer (got ${matrix?.n}); the well has no unknowns at this grid`);
  }
  const { n } = matrix;
  if (!(matrix.rowPtr instanceof Int32Array) || matrix.rowPtr.length !== n + 1) {
    throw new TypeError(`lowestEigenpairs: matrix.rowPtr must be an Int32Array of length n + 1 = ${n + 1}`);
  }
  const nnz = matrix.rowPtr[n];
  if (!(matrix.colIdx instanceof Int32Array) || matrix.colIdx.length < nnz || !(matrix.re instanceof Float64Array) || matrix.re.length < nnz) {
    throw new TypeError('lowestEigenpairs: matrix.colIdx (Int32Array) and matrix.re (Float64Array) must hold rowPtr[n] entries');
  }
  if (matrix.im !== null && (!(matrix.im instanceof Float64Array) || matrix.im.length < nnz)) {
    throw new TypeError('lowestEigenpairs: matrix.im must be null or a Float64Array holding rowPtr[n] entries');
  }
  if (!Number.isInteger(k) || k < 1 || k > n) {
    throw new RangeError(`lowestEigenpairs: k must be an integer with 1 <= k <= n = ${n} (got ${k})`);
  }
  if (options.tol !== undefined && !(options.tol > 0 && options.tol < 1)) {
    throw new RangeError(`lowestEigenpairs: options.tol must be in (0, 1) (got ${options.tol})`);
  }
  if (options.maxIter !== undefined && !(Number.isInteger(options.maxIter) && options.maxIter >= 1)) {
    throw new RangeError(`lowestEigenpairs: options.maxIter must be a positive integer (got ${options.maxIter})`);
  }
  if (options.seed !== undefined && !Number.isInteger(options.seed)) {
    throw new RangeError(`lowestEigenpairs: options.seed must be an integer (got ${options.seed})`);
  }
  if (options.method !== undefined && !METHODS.includes(options.method)) {
    throw new RangeError(`lowestEigenpairs: options.method must be one of ${METHODS.join(', ')} (got ${String(options.method)})`);
  }
  if (options.initial && options.initial.n !== n) {
    throw new RangeError(`lowestEigenpairs: options.initial.n must equal matrix.n = ${n} (got ${options.initial.n})`);
  }
}

/**
 * The k lowest eigenpairs of a Hermitian CSR matrix (the lattice Hamiltonian).
 *
 * Dispatch: `options.method` or, for 'auto', `chooseMethod(n, k, options)` (dense for tiny n, LOBPCG when a preconditioner is given, shift-invert otherwise).
 * Vectors are orthonormal, real when the matrix is real, and phase-fixed (largest-modulus component real positive,
 * ties to the lowest index) so that identical inputs give identical bytes.
 *
 * @param matrix - Hermitian CSR holding both triangles (`im` null when real)
 * @param k - number of levels, 1 <= k <= n
 * @param options - see EigenOptions (tol relative to max(1, |lambda|), default 1e-9)
 * @returns ascending values, vectors (k columns), absolute residual norms, iterations, convergence flag, method
 * @throws RangeError / TypeError naming the bad parameter and its valid values
 * @example
 * const { values } = lowestEigenpairs(buildHamiltonian(lattice, tubes), 4);
 */
export function lowestEigenpairs(matrix: CsrMatrix, k: number, options: EigenOptions = {}): EigenResult {
  validate(matrix, k, options);
  const method = chooseMethod(matrix.n, k, options);
  let result: EigenResult;
  if (method === 'dense') result = denseEigenpairs(matrix, k);
  else if (method === 'shift-invert') result = shiftInvertEigenpairs(matrix, k, options);
  else result = lobpcgEigenpairs(matrix, k, options);
  const { vectors } = result;
  if (matrix.im === null && vectors.im !== null) {
    // A real problem keeps real states.
    result = { ...result, vectors: { ...vectors, im: null } };
  }
  fixPhases(result.vectors.n, result.vectors.k, result.vectors.re, result.vectors.im);
  return result;
}
