// What the real and complex numeric factorisations share: the factor context, the pivot check (zero or negative
// pivots) and the child lists of the supernodal elimination tree.
import type { CsrMatrix } from '../types';
import { LdlPivotError, type LdlSymbolic } from './ldl-types';

export interface FactorContext {
  symbolic: LdlSymbolic;
  matrix: CsrMatrix;
  sigma: number;
  lre: Float64Array;
  lim: Float64Array | null;
  d: Float64Array;
  tiny: number;
  allowIndefinite: boolean;
  negative: number;
}

export function checkPivot(context: FactorContext, k: number, pivot: number): void {
  if (!(Math.abs(pivot) > context.tiny)) {
    const index = context.symbolic.perm[k];
    throw new LdlPivotError(
      `LDL factorisation failed: A - sigma I is singular to working precision (pivot ${pivot} at unknown ${index}, sigma = ${context.sigma}); ` +
        'sigma is (numerically) an eigenvalue: move sigma',
      'singular',
      index,
      pivot,
    );
  }
  if (pivot < 0) {
    if (!context.allowIndefinite) {
      const index = context.symbolic.perm[k];
      throw new LdlPivotError(
        `LDL factorisation failed: A - sigma I is not positive definite (negative pivot ${pivot} at unknown ${index}, sigma = ${context.sigma}); ` +
          'sigma must lie below the lowest eigenvalue',
        'indefinite',
        index,
        pivot,
      );
    }
    context.negative++;
  }
}

export function childLists(superParent: Int32Array): { head: Int32Array; next: Int32Array } {
  const count = superParent.length;
  const head = new Int32Array(count).fill(-1);
  const next = new Int32Array(count).fill(-1);
  for (let s = count - 1; s >= 0; s--) {
    const p = superParent[s];
    if (p >= 0) {
      next[s] = head[p];
      head[p] = s;
    }
  }
  return { head, next };
}
