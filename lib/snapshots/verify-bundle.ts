// Recompute a snapshot bundle with this solver and compare: the recomputed result hash must equal the recorded one,
// and so must the hash of the bundle's own data (a bundle whose data was edited does not verify).
import { diffJson, summarizeDiff, type JsonDiff } from '@/lib/canonical-diff';
import { DomainError } from '@/lib/domain-error';
import { resultHash } from '@/lib/physics/canonical';
import { SpecError } from '@/lib/physics/errors';
import { runTask } from '@/lib/physics/run-task';
import { parseTaskSpec, zodIssuesToSpecIssues } from '@/lib/physics/schemas';
import { SOLVER_VERSION } from '@/lib/physics/version';
import { toStoredForm } from '@/lib/runs/stored-form';
import { fieldMessages } from '@/lib/validation-fields';
import { bundleSchema, type SnapshotBundle } from './bundle';

/**
 * The bundle is not readable as a snapshot bundle (wrong format, missing fields, invalid parameters): a domain error
 * `invalid` with per-field messages, that also keeps the list of issues for the command line.
 */
export class BundleError extends DomainError {
  readonly issues: { path: string; message: string }[];

  constructor(issues: { path: string; message: string }[]) {
    super(
      'invalid',
      issues.map((issue) => (issue.path ? `${issue.path}: ${issue.message}` : issue.message)).join('\n'),
      fieldMessages(issues),
    );
    this.name = 'BundleError';
    this.issues = issues;
  }
}

/**
 * Validate parsed JSON as a snapshot bundle, including its parameters against the solver's schema.
 *
 * @throws BundleError listing every problem (`path: message`)
 */
export function parseBundle(input: unknown): SnapshotBundle {
  const parsed = bundleSchema.safeParse(input);
  if (!parsed.success) throw new BundleError(zodIssuesToSpecIssues(parsed.error.issues));
  try {
    parseTaskSpec(parsed.data.params);
  } catch (error) {
    if (error instanceof SpecError) {
      throw new BundleError(error.issues.map((issue) => ({ path: issue.path ? `params.${issue.path}` : 'params', message: issue.message })));
    }
    throw error;
  }
  return parsed.data;
}

export interface BundleVerification {
  /** The recomputed hash equals the recorded one AND the bundle's data hashes to it. */
  identical: boolean;
  recordedHash: string;
  recomputedHash: string;
  /** Hash of the data carried in the bundle (differs from the recorded hash when the data was edited). */
  bundleDataHash: string;
  solverVersion: { recorded: string; current: string };
  /** Differences between the bundle's data and the recomputed data (null when identical). */
  diff: JsonDiff | null;
  /** Human-readable lines: verdict, hashes, versions and (when different) which fields differ and by how much. */
  summary: string;
}

/**
 * Recompute a bundle's result and compare it with the recorded hash and data.
 *
 * @param bundle - a bundle validated by {@link parseBundle}
 * @param options - progress (fraction 0..1, message) and cancellation, passed to the solver
 * @example
 * const check = await verifyBundle(parseBundle(JSON.parse(text)));
 * process.exit(check.identical ? 0 : 1);
 */
export async function verifyBundle(
  bundle: SnapshotBundle,
  options: { signal?: AbortSignal; onProgress?: (fraction: number, message?: string) => void } = {},
): Promise<BundleVerification> {
  const spec = parseTaskSpec(bundle.params);
  const result = await runTask(spec, { signal: options.signal, onProgress: options.onProgress });
  const recomputed = toStoredForm(result);
  const bundleDataHash = resultHash(bundle.data);
  const identical = recomputed.resultHash === bundle.resultHash && bundleDataHash === bundle.resultHash;
  const diff = identical ? null : diffJson(bundle.data, recomputed.data);

  const lines: string[] = [];
  lines.push(identical ? 'identical: the recomputed result has the recorded hash' : 'DIFFERENT: the recomputed result does not match the bundle');
  lines.push(`recorded hash:   ${bundle.resultHash}`);
  lines.push(`recomputed hash: ${recomputed.resultHash}`);
  if (bundleDataHash !== bundle.resultHash) lines.push(`bundle data hash: ${bundleDataHash} (the data in the bundle does not match its recorded hash)`);
  lines.push(`solver: recorded ${bundle.solverVersion}, current ${SOLVER_VERSION}${bundle.solverVersion === SOLVER_VERSION ? '' : ' (versions differ)'}`);
  if (diff) {
    if (diff.equal) {
      lines.push('the data fields are equal; the difference is in the recorded hash itself');
    } else {
      lines.push(`fields that differ (${diff.fields.length}): ${diff.fields.map((f) => f.field).join(', ')}`);
      lines.push(
        diff.largest
          ? `largest relative difference: ${diff.largest.relativeDifference.toExponential(3)} at ${diff.largest.path} (${diff.largest.a} in the bundle, ${diff.largest.b} recomputed)`
          : 'largest relative difference: none (the differences are not numbers)',
      );
      lines.push(summarizeDiff(diff));
    }
  }
  return {
    identical,
    recordedHash: bundle.resultHash,
    recomputedHash: recomputed.resultHash,
    bundleDataHash,
    solverVersion: { recorded: bundle.solverVersion, current: SOLVER_VERSION },
    diff,
    summary: lines.join('\n'),
  };
}
