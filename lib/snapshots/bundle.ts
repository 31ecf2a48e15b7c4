// The reproducibility bundle of a snapshot: one JSON file with the parameters, versions, hash and data (the
// `reproduce` command recomputes it), and the data as CSV alongside. `bundleSchema` validates a bundle read back.
import { z } from 'zod';
import type { Result, Snapshot } from '@/db/schema';
import { resultCsv } from '@/lib/export/csv';

export const BUNDLE_FORMAT = 'fluxfolio-snapshot-bundle';
export const BUNDLE_FORMAT_VERSION = 1;

/** A snapshot bundle as read back from a file (the data stays free-form JSON: the hash checks it). */
export const bundleSchema = z.object({
  format: z.literal(BUNDLE_FORMAT, { error: `format must be "${BUNDLE_FORMAT}"` }),
  formatVersion: z.literal(BUNDLE_FORMAT_VERSION, { error: `formatVersion must be ${BUNDLE_FORMAT_VERSION}` }),
  manuscript: z.object({ slug: z.string(), title: z.string() }),
  figure: z.object({ label: z.string(), kind: z.string(), caption: z.string() }),
  version: z.int({ error: 'version must be a whole number' }).min(1),
  params: z.record(z.string(), z.unknown(), { error: 'params must be an object (a solver task spec)' }),
  solverVersion: z.string({ error: 'solverVersion must be text' }),
  gitCommit: z.string().nullable(),
  resultHash: z.string().regex(/^[0-9a-f]{64}$/, 'resultHash must be 64 lower-case hex digits (SHA-256)'),
  frozenBy: z.string().nullable(),
  frozenAt: z.string(),
  data: z.record(z.string(), z.unknown(), { error: 'data must be an object (the result without diagnostics)' }),
  /** Timings and solver facts; not covered by the hash, so a bundle without them still verifies. */
  diagnostics: z.unknown().optional(),
});
export type SnapshotBundle = z.infer<typeof bundleSchema>;

/** What a bundle names besides the snapshot itself. */
export interface BundleContext {
  manuscript: { slug: string; title: string };
  frozenBy: { name: string | null } | null;
}

/**
 * The JSON bundle of a snapshot.
 *
 * @param snapshot - the frozen snapshot row
 * @param result - its result row (data without diagnostics, diagnostics apart)
 * @param context - the manuscript's slug and title, and who froze it
 * @example
 * const bundle = snapshotBundle(snapshot, result, { manuscript, frozenBy });
 * JSON.stringify(bundle); // what GET /api/snapshots/[id]/bundle answers
 */
export function snapshotBundle(
  snapshot: Snapshot,
  result: Pick<Result, 'data' | 'diagnostics'>,
  context: BundleContext,
): SnapshotBundle {
  return {
    format: BUNDLE_FORMAT,
    formatVersion: BUNDLE_FORMAT_VERSION,
    manuscript: { slug: context.manuscript.slug, title: context.manuscript.title },
    figure: { label: snapshot.label, kind: snapshot.kind, caption: snapshot.caption },
    version: snapshot.version,
    params: snapshot.params as Record<string, unknown>,
    solverVersion: snapshot.solverVersion,
    gitCommit: snapshot.gitCommit,
    resultHash: snapshot.resultHash,
    frozenBy: context.frozenBy?.name ?? null,
    frozenAt: snapshot.frozenAt.toISOString(),
    data: result.data as Record<string, unknown>,
    diagnostics: result.diagnostics,
  };
}

/** The bundle's data as one RFC 4180 CSV (lib/export/csv.ts long form: table,row,column,value). */
export function snapshotBundleCsv(bundle: Pick<SnapshotBundle, 'data'>): string {
  return resultCsv(bundle.data);
}

/**
 * File name of a bundle download: `<label>-v<version>.json` (or `.csv`).
 *
 * @example bundleFileName({ label: 'gap-map' }, 2, 'csv') // 'gap-map-v2.csv'
 */
export function bundleFileName(figure: { label: string }, version: number, extension: 'json' | 'csv'): string {
  return `${figure.label}-v${version}.${extension}`;
}
