// The stored form of a solver result: canonical data without diagnostics (exactly what the result hash covers)
// and the diagnostics apart. Shared by the worker (storing), bundles (exporting) and reproduce (recomputing).
import { canonicalJson, resultHash } from '@/lib/physics/canonical';

/** A result split as stored in the `results` table. */
export interface StoredForm {
  /** The canonical JSON of the result without `diagnostics`, parsed back (typed arrays become arrays, -0 becomes 0). */
  data: Record<string, unknown>;
  /** Timing and solver diagnostics, excluded from the hash. */
  diagnostics: unknown;
  /** SHA-256 hex of the canonical JSON of the result without diagnostics (lib/physics `resultHash`). */
  resultHash: string;
}

/**
 * Split a solver result into its stored form, so that what is stored is exactly what the hash covers.
 *
 * @example
 * const { data, diagnostics, resultHash } = toStoredForm(await runTask(spec, {}));
 */
export function toStoredForm(result: object): StoredForm {
  const { diagnostics = {}, ...rest } = result as { diagnostics?: unknown } & Record<string, unknown>;
  return {
    data: JSON.parse(canonicalJson(rest)) as Record<string, unknown>,
    diagnostics: JSON.parse(canonicalJson(diagnostics)) as unknown,
    resultHash: resultHash(result),
  };
}
