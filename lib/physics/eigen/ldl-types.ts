// Types of the sparse LDL factorisation: the symbolic analysis, the numeric factor, their options, and the pivot
// error raised when A - sigma I is singular or (unless allowed) indefinite.
import type { NestedDissectionOptions, Ordering } from './ordering';

/**
 * Pattern-only analysis of a symmetric sparse matrix: fill-reducing order, elimination tree and supernodes.
 * It depends only on the sparsity pattern, so one analysis serves every matrix with the same pattern
 * (e.g. every tube position on one lattice).
 */
export interface LdlSymbolic {
  n: number;
  /** `perm[k]` = original index of the k-th pivot; `inverse` its inverse. */
  perm: Int32Array;
  inverse: Int32Array;
  /** Lower triangle of the permuted matrix by column: rows in `lowerRow`, source entry in the CSR in `lowerSource`. */
  lowerPtr: Int32Array;
  lowerRow: Int32Array;
  lowerSource: Int32Array;
  /** Supernode s holds the consecutive pivots [superStart[s], superStart[s + 1]). */
  superCount: number;
  superStart: Int32Array;
  /** Row structure of supernode s (its own pivots first, then the rows below, ascending). */
  superRowPtr: Int32Array;
  superRowIdx: Int32Array;
  superParent: Int32Array;
  /** Offset of supernode s's dense (rows x pivots) panel in the factor's value arrays. */
  panelOffset: Float64Array;
  /** Entries of L stored (dense supernode panels, diagonal blocks included). */
  storedEntries: number;
  /** Nonzeros of L counted column by column (diagonal included). */
  factorNonzeros: number;
  /** Multiply-adds of the numeric factorisation of a real matrix (estimate from the column counts). */
  flops: number;
  /** Copy of the analysed pattern, to check that a matrix matches this analysis. */
  rowPtr: Int32Array;
  colIdx: Int32Array;
}

/** A numeric factorisation P (A - sigma I) P^T = L D L^H with unit lower triangular L and real diagonal D. */
export interface LdlFactor {
  symbolic: LdlSymbolic;
  sigma: number;
  complex: boolean;
  /** Supernode panels, column-major (rows x pivots) at `symbolic.panelOffset[s]`. */
  lre: Float64Array;
  lim: Float64Array | null;
  /** Pivots in elimination order. */
  d: Float64Array;
  /** Number of negative pivots = number of eigenvalues of A below sigma (Sylvester's law of inertia). */
  negativePivots: number;
}

export interface LdlAnalyzeOptions extends NestedDissectionOptions {
  /** A ready-made ordering to use instead of nested dissection. */
  ordering?: Ordering | null;
}

export interface LdlFactorOptions {
  /** Shift: the factorised matrix is A - sigma I. Default 0. */
  sigma?: number;
  /** Reuse an analysis of the same pattern (checked). */
  symbolic?: LdlSymbolic | null;
  /** Accept negative pivots (symmetric indefinite without pivoting). Default false: a negative pivot is an error. */
  allowIndefinite?: boolean;
  /** Options for the analysis when `symbolic` is not given. */
  analyze?: LdlAnalyzeOptions;
}

/** Relative size below which a pivot counts as zero: |d| <= SINGULAR_PIVOT * max|diag(A - sigma)|. */
export const SINGULAR_PIVOT = 1e-13;

/** Raised when A - sigma I has a zero or (unless allowed) negative pivot. */
export class LdlPivotError extends Error {
  constructor(
    message: string,
    readonly kind: 'singular' | 'indefinite',
    /** Original (unpermuted) index of the failing pivot. */
    readonly index: number,
    readonly pivot: number,
  ) {
    super(message);
    this.name = 'LdlPivotError';
  }
}
