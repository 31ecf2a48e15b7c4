// Numeric phase of the sparse LDL: checks the matrix against the analysis, sets up the factor arrays and the
// singular-pivot threshold, and runs the real or complex multifrontal factorisation.
import type { CsrMatrix } from '../types';
import { factorComplex } from './ldl-factor-complex';
import { factorReal } from './ldl-factor-real';
import type { FactorContext } from './ldl-front';
import { analyzeLdl, checkPattern, matchesPattern } from './ldl-symbolic';
import { SINGULAR_PIVOT, type LdlFactor, type LdlFactorOptions } from './ldl-types';

/**
 * Numeric multifrontal factorisation P (A - sigma I) P^T = L D L^H. Each supernode assembles a dense front
 * from A and its children's update matrices, factors its pivot columns and passes the Schur complement up.
 * Real matrices (`im` null) use real arithmetic; Hermitian ones keep separate real and imaginary arrays.
 * Without pivoting: a negative pivot is an error unless `allowIndefinite`, a (relatively) zero pivot always is.
 *
 * @param matrix Hermitian CSR (both triangles)
 * @param options `sigma` (same units as A), `symbolic` to reuse an analysis
 * @throws LdlPivotError with the failing pivot and the reason
 * @example
 * const factor = factorLdl(h, { sigma: 0 });
 * solveLdl(factor, rhs, x); // x = (H - 0)^-1 rhs
 * @see T. A. Davis, Direct Methods for Sparse Linear Systems, SIAM (2006), section 9
 * @see J. W. H. Liu, "The multifrontal method for sparse matrix solution", SIAM Review 34, 82 (1992)
 */
export function factorLdl(matrix: CsrMatrix, options: LdlFactorOptions = {}): LdlFactor {
  checkPattern(matrix);
  const sigma = options.sigma ?? 0;
  if (!Number.isFinite(sigma)) throw new RangeError(`sigma must be a finite number, got ${sigma}`);
  if (matrix.re.length !== matrix.colIdx.length) throw new RangeError('matrix.re must have one value per stored entry');
  if (matrix.im && matrix.im.length !== matrix.colIdx.length) throw new RangeError('matrix.im must have one value per stored entry');
  let symbolic = options.symbolic ?? null;
  if (symbolic && !matchesPattern(symbolic, matrix)) {
    throw new RangeError('symbolic analysis does not match the sparsity pattern of the matrix');
  }
  symbolic ??= analyzeLdl(matrix, options.analyze);
  const complex = matrix.im !== null;
  const stored = symbolic.storedEntries;
  if (stored > 2 ** 31 - 1) throw new RangeError(`factor too large: ${stored} stored entries`);
  const lre = new Float64Array(stored);
  const lim = complex ? new Float64Array(stored) : null;
  const d = new Float64Array(symbolic.n);
  const scale = diagonalScale(matrix, sigma);
  const context: FactorContext = {
    symbolic,
    matrix,
    sigma,
    lre,
    lim,
    d,
    tiny: SINGULAR_PIVOT * scale,
    allowIndefinite: options.allowIndefinite ?? false,
    negative: 0,
  };
  if (complex) factorComplex(context);
  else factorReal(context);
  return { symbolic, sigma, complex, lre, lim, d, negativePivots: context.negative };
}

function diagonalScale(matrix: CsrMatrix, sigma: number): number {
  let scale = 0;
  const { n, rowPtr, colIdx, re } = matrix;
  for (let i = 0; i < n; i++) {
    let diag = -sigma;
    for (let q = rowPtr[i]; q < rowPtr[i + 1]; q++) if (colIdx[q] === i) diag += re[q];
    if (Math.abs(diag) > scale) scale = Math.abs(diag);
  }
  return scale > 0 ? scale : 1;
}
