// The cache key of a run: SHA-256 of the canonical JSON of its (validated) parameters and the solver version.
// Two runs with equal keys compute the same result, so the second is served from the stored one.
import { createHash } from 'node:crypto';
import { canonicalJson } from '@/lib/physics/canonical';

/**
 * SHA-256 (hex) of `canonicalJson({ params, solverVersion })`. Pass the parameters AFTER the solver's schema has
 * filled in defaults, so that `{levels: 6}` written out and left to its default hash the same.
 *
 * @param params - a validated task spec (lib/physics/schemas `parseTaskSpec` output)
 * @param solverVersion - lib/physics `SOLVER_VERSION`; a new solver version never reuses an old result
 * @returns 64 lower-case hex digits
 * @example
 * inputHash({ task: 'spectrum', levels: 4, ... }, '0.1.0+solver.1'); // '3f1c…'
 */
export function inputHash(params: unknown, solverVersion: string): string {
  return createHash('sha256').update(canonicalJson({ params, solverVersion }), 'utf8').digest('hex');
}
