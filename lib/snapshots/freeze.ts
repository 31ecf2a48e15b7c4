// Freezing a run: an immutable, numbered version (v1, v2, …) of its figure holding the parameters, the solver
// version and git commit, the result and its SHA-256, who froze it and when. Numbers are allocated under a lock.
import { and, eq, sql } from 'drizzle-orm';
import type { Db } from '@/db';
import { db as defaultDb } from '@/db';
import { pgErrorCode, UNIQUE_VIOLATION } from '@/db/queries/pg-errors';
import { figures, results, runs, snapshots, type Snapshot } from '@/db/schema';
import { buildCommit } from '@/lib/build-info';
import { conflict, notFound } from '@/lib/domain-error';

/**
 * Freeze a succeeded run as the next snapshot version of its figure.
 *
 * The figure row is locked (`SELECT … FOR UPDATE`) while the next number is chosen, so concurrent freezes of one
 * figure get v1, v2, … without gaps or duplicates (the unique index on (figure, version) is the backstop). The
 * snapshot copies the figure's label, caption and view spec as they are now, and the run's parameters.
 *
 * @throws DomainError `not-found` when the run does not exist, `conflict` when it has not succeeded or is already frozen
 * @example
 * const snapshot = await freezeRun({ runId, user }); // snapshot.version === 1
 */
export async function freezeRun({
  runId,
  user,
  database = defaultDb,
}: {
  runId: string;
  user: { id: string } | null;
  database?: Db;
}): Promise<Snapshot> {
  const commit = buildCommit();
  try {
    return await database.transaction(async (tx) => {
      const [run] = await tx.select().from(runs).where(eq(runs.id, runId)).limit(1);
      if (!run) throw notFound('Run not found');
      const [figure] = await tx.select().from(figures).where(eq(figures.id, run.figureId)).for('update');
      if (!figure) throw notFound('Run not found');
      if (run.status !== 'succeeded' || !run.resultId) {
        throw conflict(`Only a succeeded run can be frozen; this run is ${run.status}`);
      }
      const [already] = await tx
        .select({ version: snapshots.version })
        .from(snapshots)
        .where(and(eq(snapshots.figureId, figure.id), eq(snapshots.runId, run.id)))
        .limit(1);
      if (already) throw conflict(`This run is already frozen as v${already.version}`);
      const [result] = await tx.select().from(results).where(eq(results.id, run.resultId)).limit(1);
      if (!result) throw conflict('The result of this run is missing');
      const [{ next }] = await tx
        .select({ next: sql<number>`coalesce(max(${snapshots.version}), 0)::int + 1` })
        .from(snapshots)
        .where(eq(snapshots.figureId, figure.id));
      const [snapshot] = await tx
        .insert(snapshots)
        .values({
          figureId: figure.id,
          manuscriptId: figure.manuscriptId,
          version: next,
          kind: run.params.task,
          label: figure.label,
          caption: figure.caption,
          params: run.params,
          viewSpec: figure.viewSpec,
          solverVersion: result.solverVersion,
          gitCommit: commit,
          resultId: result.id,
          resultHash: result.resultHash,
          runId: run.id,
          frozenById: user?.id ?? null,
        })
        .returning();
      return snapshot;
    });
  } catch (error) {
    if (pgErrorCode(error) === UNIQUE_VIOLATION) {
      throw conflict('Another snapshot of this figure was frozen at the same moment; try again');
    }
    throw error;
  }
}
