// The body of a run job, shared by the worker, the seed and the tests: claim the run (run-claim.ts), compute it with
// the solver under a watch (run-watch.ts: cancellation, time budget, progress), then store its final state (run-store.ts).
import type { Db } from '@/db';
import { db as defaultDb } from '@/db';
import { runTask } from '@/lib/physics/run-task';
import { SOLVER_VERSION } from '@/lib/physics/version';
import { inputHash } from '@/lib/runs/input-hash';
import { runExpireSeconds } from './queue';
import { lockJobRun, startJobRun } from './run-claim';
import { RetryLaterError, type RunJobOutcome } from './run-outcome';
import { finishFromCache, storeComputeError, storeInfrastructureError, storeResult } from './run-store';
import { watchRun, type RunWatch } from './run-watch';

export { RetryLaterError, type RunJobOutcome } from './run-outcome';
export { CANCEL_POLL_INTERVAL_MS, PROGRESS_WRITE_INTERVAL_MS } from './run-watch';

export interface RunJobOptions {
  /** Aborted when the worker shuts down: the run is put back in the queue for another attempt. */
  signal?: AbortSignal;
  /** Time budget in seconds (default: the queue's, FLUXFOLIO_RUN_EXPIRE_SECONDS). */
  timeBudgetSeconds?: number;
  /** Whether a later attempt will follow if this one throws (pg-boss retries left). Default true. */
  canRetry?: boolean;
  /** Database to use (the seed passes its own). */
  database?: Db;
  /** Progress and status lines (the worker prints them). */
  log?: (line: string) => void;
}

/**
 * Run the job of one run to its end state.
 *
 * - A run that is gone or already finished is skipped (a retried or duplicate job does nothing).
 * - The run's lock (lib/jobs/run-lock.ts) marks this worker alive; a run locked by another live worker is left to it.
 * - SpecError / LimitError messages are stored verbatim as the run's error; other solver errors are stored too
 *   (a deterministic computation would fail again). Cancellation leaves the run 'cancelled'.
 * - The result row and the run's success are written in one transaction (db/queries/runs.ts `finishRunWithResult`).
 *
 * @throws RetryLaterError when the job must be retried (worker stopping, database trouble, run held elsewhere)
 */
export async function executeRun(runId: string, options: RunJobOptions = {}): Promise<RunJobOutcome> {
  const database = options.database ?? defaultDb;
  const log = options.log ?? (() => {});
  const canRetry = options.canRetry ?? true;

  const held = await lockJobRun(runId, database);
  if ('outcome' in held) return held.outcome;
  let watch: RunWatch | null = null;
  try {
    const started = await startJobRun(runId, database);
    if ('outcome' in started) return started.outcome;
    const { run, spec } = started;

    // Key the result by the solver that computes it (a worker of a newer version does not file its result under
    // the version the web server asked for).
    const key = run.solverVersion === SOLVER_VERSION ? run.inputHash : inputHash(spec, SOLVER_VERSION);
    const fromCache = await finishFromCache(runId, key, database);
    if (fromCache) {
      if (fromCache.status === 'succeeded') log(`run ${runId}: served from the cache`);
      return fromCache;
    }

    const budgetSeconds = options.timeBudgetSeconds ?? runExpireSeconds();
    watch = watchRun({ runId, database, shutdown: options.signal, budgetSeconds });
    let result: object;
    const startedAt = Date.now();
    try {
      result = await runTask(spec, { signal: watch.signal, onProgress: watch.onProgress });
    } catch (error) {
      const outcome = await storeComputeError({
        runId,
        error,
        aborted: watch.signal.aborted,
        reason: watch.reason(),
        budgetSeconds,
        canRetry,
        database,
      });
      if (outcome.status === 'cancelled') log(`run ${runId}: cancelled`);
      if (outcome.status === 'failed') log(`run ${runId}: failed: ${outcome.error}`);
      return outcome;
    } finally {
      await watch.stop();
    }

    const outcome = await storeResult({ runId, key, spec, result, database });
    const took = `${((Date.now() - startedAt) / 1000).toFixed(1)} s`;
    log(`run ${runId}: ${outcome.status} in ${took}${outcome.status === 'succeeded' ? ` (${outcome.resultHash.slice(0, 12)})` : ''}`);
    return outcome;
  } catch (error) {
    if (error instanceof RetryLaterError) throw error;
    // Database or other infrastructure trouble: retry when attempts remain, otherwise record the failure.
    return await storeInfrastructureError(runId, error, canRetry, database);
  } finally {
    await watch?.stop();
    await held.lock.release().catch(() => {});
  }
}
