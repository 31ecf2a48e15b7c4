// Shared check of task specs that need a real problem: every flux an integer or a half-integer (PHYSICS.md section 2).
// Kept free of solver imports so that forms can use the schemas that call it.

/** |2 alpha - round(2 alpha)| below this counts as an integer or half-integer flux (same slack as the Hamiltonian). */
const REAL_FLUX_SLACK = 1e-12;

/**
 * True when alpha is an integer or a half-integer (all Peierls factors +-1, H real symmetric).
 * @example
 * isIntegerOrHalf(1.5); // true
 */
export function isIntegerOrHalf(alpha: number): boolean {
  return Math.abs(2 * alpha - Math.round(2 * alpha)) <= REAL_FLUX_SLACK;
}
