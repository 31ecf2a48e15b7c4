// Queries about solver runs: create, claim, progress, finish (result + run in one transaction), fail, cancel, list.
// Every state change is a conditional UPDATE on the current status, so two workers or a cancel race cannot both win.
import { and, desc, eq, inArray } from 'drizzle-orm';
import { db, type Db } from '@/db';
import { results, runs, type Result, type Run } from '@/db/schema';

export type RunStatus = Run['status'];

/** A run by id, or null. */
export async function getRunById({ id, database = db }: { id: string; database?: Db }): Promise<Run | null> {
  const [row] = await database.select().from(runs).where(eq(runs.id, id)).limit(1);
  return row ?? null;
}

/** Only the status of a run (polled by the worker to notice a cancellation), or null when it is gone. */
export async function getRunStatus({ id, database = db }: { id: string; database?: Db }): Promise<RunStatus | null> {
  const [row] = await database.select({ status: runs.status }).from(runs).where(eq(runs.id, id)).limit(1);
  return row?.status ?? null;
}

/** The runs of a figure, newest first. */
export async function listRunsByFigure({ figureId, limit = 50, database = db }: { figureId: string; limit?: number; database?: Db }): Promise<Run[]> {
  return database.select().from(runs).where(eq(runs.figureId, figureId)).orderBy(desc(runs.createdAt), desc(runs.id)).limit(limit);
}

/** The newest run of a figure in one of the given states (all states by default), or null. */
export async function getLatestRun({
  figureId,
  statuses,
  database = db,
}: {
  figureId: string;
  statuses?: RunStatus[];
  database?: Db;
}): Promise<Run | null> {
  const where = statuses?.length
    ? and(eq(runs.figureId, figureId), inArray(runs.status, statuses))
    : eq(runs.figureId, figureId);
  const [row] = await database.select().from(runs).where(where).orderBy(desc(runs.createdAt), desc(runs.id)).limit(1);
  return row ?? null;
}

/** Insert a run row (queued, or already succeeded when served from the cache). */
export async function insertRun({ values, database = db }: { values: typeof runs.$inferInsert; database?: Db }): Promise<Run> {
  const [row] = await database.insert(runs).values(values).returning();
  return row;
}

/** Record the queue's job id on a run. */
export async function setRunJobId({ id, jobId, database = db }: { id: string; jobId: string; database?: Db }): Promise<void> {
  await database.update(runs).set({ jobId }).where(eq(runs.id, id));
}

/**
 * Claim a run for computation: queued (or running, when a previous worker died) becomes running.
 * Returns null when the run is gone or already finished (succeeded, failed, cancelled): nothing to do.
 */
export async function claimRun({ id, database = db }: { id: string; database?: Db }): Promise<Run | null> {
  const [row] = await database
    .update(runs)
    .set({ status: 'running', startedAt: new Date(), progress: 0, message: 'Starting', error: null })
    .where(and(eq(runs.id, id), inArray(runs.status, ['queued', 'running'])))
    .returning();
  return row ?? null;
}

/** Write progress (fraction 0..1 and a short message) while the run is running. */
export async function updateRunProgress({
  id,
  progress,
  message,
  database = db,
}: {
  id: string;
  progress: number;
  message: string;
  database?: Db;
}): Promise<void> {
  await database
    .update(runs)
    .set({ progress: Math.min(1, Math.max(0, progress)), message: message.slice(0, 500) })
    .where(and(eq(runs.id, id), eq(runs.status, 'running')));
}

/** What the finishing transaction stores. `data` is the canonical result without diagnostics. */
export interface ResultToStore {
  inputHash: string;
  solverVersion: string;
  params: Result['params'];
  data: unknown;
  diagnostics: unknown;
  resultHash: string;
}

/**
 * Store a computed result and finish its run, IN ONE TRANSACTION: a worker killed before the commit leaves
 * neither a result nor a succeeded run. The result is shared by input hash (an identical input computed
 * meanwhile by another run keeps its row). A run cancelled meanwhile stays cancelled (the result is still kept:
 * it is valid and serves later runs from the cache).
 *
 * @returns the run after the transaction (null when it no longer exists) and the result row
 */
export async function finishRunWithResult({
  runId,
  result,
  fromCache = false,
  database = db,
}: {
  runId: string;
  result: ResultToStore;
  fromCache?: boolean;
  database?: Db;
}): Promise<{ run: Run | null; result: Result }> {
  return database.transaction(async (tx) => {
    await tx
      .insert(results)
      .values({
        inputHash: result.inputHash,
        solverVersion: result.solverVersion,
        params: result.params,
        data: result.data,
        diagnostics: result.diagnostics,
        resultHash: result.resultHash,
      })
      .onConflictDoNothing({ target: results.inputHash });
    const [stored] = await tx.select().from(results).where(eq(results.inputHash, result.inputHash)).limit(1);
    const [finished] = await tx
      .update(runs)
      .set({
        status: 'succeeded',
        inputHash: result.inputHash,
        solverVersion: result.solverVersion,
        resultId: stored.id,
        progress: 1,
        message: fromCache ? 'Served from the cache' : 'Done',
        error: null,
        fromCache,
        finishedAt: new Date(),
      })
      .where(and(eq(runs.id, runId), eq(runs.status, 'running')))
      .returning();
    const run = finished ?? (await tx.select().from(runs).where(eq(runs.id, runId)).limit(1))[0] ?? null;
    return { run, result: stored };
  });
}

/** Finish a run with an existing result (an identical input was computed by another run meanwhile). */
export async function finishRunFromResult({
  runId,
  resultId,
  fromCache,
  database = db,
}: {
  runId: string;
  resultId: string;
  /** Whether to show the run as served from the cache (the caller decides who may know the result existed). */
  fromCache: boolean;
  database?: Db;
}): Promise<Run | null> {
  const [row] = await database
    .update(runs)
    .set({ status: 'succeeded', resultId, progress: 1, message: fromCache ? 'Served from the cache' : 'Done', fromCache, finishedAt: new Date() })
    .where(and(eq(runs.id, runId), eq(runs.status, 'running')))
    .returning();
  return row ?? null;
}

/** Mark a queued or running run failed with its reason (shown to the user verbatim). */
export async function failRun({ id, error, database = db }: { id: string; error: string; database?: Db }): Promise<Run | null> {
  const [row] = await database
    .update(runs)
    .set({ status: 'failed', error: error.slice(0, 4000), message: 'Failed', finishedAt: new Date() })
    .where(and(eq(runs.id, id), inArray(runs.status, ['queued', 'running'])))
    .returning();
  return row ?? null;
}

/** Put a running run back in the queue (its worker was lost or hit a transient error; the job will be retried). */
export async function requeueRun({ id, message, database = db }: { id: string; message: string; database?: Db }): Promise<Run | null> {
  const [row] = await database
    .update(runs)
    .set({ status: 'queued', progress: 0, message: message.slice(0, 500) })
    .where(and(eq(runs.id, id), eq(runs.status, 'running')))
    .returning();
  return row ?? null;
}

/** Cancel a queued or running run. Returns the cancelled run, or null when it had already finished. */
export async function cancelRunById({ id, database = db }: { id: string; database?: Db }): Promise<Run | null> {
  const [row] = await database
    .update(runs)
    .set({ status: 'cancelled', message: 'Cancelled', finishedAt: new Date() })
    .where(and(eq(runs.id, id), inArray(runs.status, ['queued', 'running'])))
    .returning();
  return row ?? null;
}

/** Runs currently marked running (candidates for the lost-worker check). */
export async function listRunningRuns({ limit = 100, database = db }: { limit?: number; database?: Db } = {}): Promise<Run[]> {
  return database.select().from(runs).where(eq(runs.status, 'running')).limit(limit);
}
