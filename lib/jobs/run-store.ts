// Store step of a run job: the run's final state. A cached result or a new result row is written together with the
// run's success in one transaction; a stopped or failed computation leaves the run failed, cancelled or requeued.
import type { Db } from '@/db';
import { getResultByInputHash, resultKnownToManuscript } from '@/db/queries/results';
import { failRun, finishRunFromResult, finishRunWithResult, requeueRun } from '@/db/queries/runs';
import { AbortError, LimitError, SpecError } from '@/lib/physics/errors';
import { SOLVER_VERSION } from '@/lib/physics/version';
import { toStoredForm } from '@/lib/runs/stored-form';
import type { RunSpec } from './run-claim';
import { messageOf, RetryLaterError, type RunJobOutcome } from './run-outcome';
import type { AbortReason } from './run-watch';

/**
 * Finishes the run from a result already stored under `key`, if there is one.
 * @returns the outcome ('succeeded' from the cache, or 'cancelled' when the run was cancelled meanwhile), or null
 */
export async function finishFromCache(runId: string, key: string, database: Db): Promise<RunJobOutcome | null> {
  const cached = await getResultByInputHash({ inputHash: key, database });
  if (!cached) return null;
  // A result first computed for another manuscript is not shown as cached: that would tell that it exists.
  const fromCache = await resultKnownToManuscript({ resultId: cached.id, manuscript: { ofRun: runId }, database });
  const finished = await finishRunFromResult({ runId, resultId: cached.id, fromCache, database });
  if (!finished) return { status: 'cancelled', runId };
  return { status: 'succeeded', runId, fromCache, resultId: cached.id, resultHash: cached.resultHash };
}

/**
 * Stores a computed result and the run's success in one transaction (db/queries/runs.ts `finishRunWithResult`).
 * A result that cannot be put in its stored form fails the run.
 */
export async function storeResult({
  runId,
  key,
  spec,
  result,
  database,
}: {
  runId: string;
  key: string;
  spec: RunSpec;
  result: object;
  database: Db;
}): Promise<RunJobOutcome> {
  let stored;
  try {
    stored = toStoredForm(result);
  } catch (error) {
    const message = `Solver error: the result cannot be stored (${messageOf(error)})`;
    await failRun({ id: runId, error: message, database });
    return { status: 'failed', runId, error: message };
  }
  const { run: finished, result: row } = await finishRunWithResult({
    runId,
    result: { inputHash: key, solverVersion: SOLVER_VERSION, params: spec, ...stored },
    database,
  });
  if (finished?.status === 'succeeded') {
    return { status: 'succeeded', runId, fromCache: false, resultId: row.id, resultHash: row.resultHash };
  }
  return { status: 'cancelled', runId };
}

/**
 * The run's final state after the solver threw. Over the time budget: failed with advice. Worker stopping: requeued
 * (throws RetryLaterError) while attempts remain, else failed. Cancelled: left cancelled. SpecError / LimitError
 * messages are stored verbatim; other solver errors are stored too (a deterministic computation would fail again).
 * @throws RetryLaterError when the run was requeued
 */
export async function storeComputeError({
  runId,
  error,
  aborted,
  reason,
  budgetSeconds,
  canRetry,
  database,
}: {
  runId: string;
  error: unknown;
  aborted: boolean;
  reason: AbortReason | null;
  budgetSeconds: number;
  canRetry: boolean;
  database: Db;
}): Promise<RunJobOutcome> {
  if (error instanceof AbortError || aborted) {
    if (reason === 'budget') {
      const message = `The run took longer than its time budget of ${budgetSeconds} s and was stopped; use a coarser grid (larger h), fewer levels or fewer sweep steps`;
      await failRun({ id: runId, error: message, database });
      return { status: 'failed', runId, error: message };
    }
    if (reason === 'shutdown') {
      if (!canRetry) {
        const message = 'The worker stopped during the last allowed attempt; start the run again';
        await failRun({ id: runId, error: message, database });
        return { status: 'failed', runId, error: message };
      }
      await requeueRun({ id: runId, message: 'The worker stopped; the run will start again', database });
      throw new RetryLaterError(`run ${runId} interrupted by the worker stopping`);
    }
    return { status: 'cancelled', runId };
  }
  const message = error instanceof SpecError || error instanceof LimitError ? error.message : `Solver error: ${messageOf(error)}`;
  await failRun({ id: runId, error: message, database });
  return { status: 'failed', runId, error: message };
}

/**
 * The run's final state after infrastructure trouble (database, lock): requeued while attempts remain (throws
 * RetryLaterError), otherwise failed.
 * @throws RetryLaterError when the run was requeued
 */
export async function storeInfrastructureError(runId: string, error: unknown, canRetry: boolean, database: Db): Promise<RunJobOutcome> {
  const message = messageOf(error);
  if (canRetry) {
    await requeueRun({ id: runId, message: `Retrying after an error: ${message}`, database }).catch(() => {});
    throw new RetryLaterError(`run ${runId}: ${message}`, { cause: error });
  }
  await failRun({ id: runId, error: `The run could not be completed: ${message}`, database }).catch(() => {});
  return { status: 'failed', runId, error: message };
}
