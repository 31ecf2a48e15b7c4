// Shift-invert eigensolver over a sparse LDL factorisation (being written; see lib/physics/eigen/ldl.ts).
// Until it lands, asking for method 'shift-invert' is refused with a clear error.
import type { CsrMatrix, EigenOptions, EigenResult } from '../types';

export function shiftInvertEigenpairs(_matrix: CsrMatrix, _k: number, _options: EigenOptions = {}): EigenResult {
  throw new Error("eigen method 'shift-invert' is not available yet; use 'lobpcg' or 'auto'");
}
