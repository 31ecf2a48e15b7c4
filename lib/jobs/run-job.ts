// The body of a run job, shared by the worker, the seed and the tests: claim the run, compute it with the solver,
// report throttled progress, honour cancellation and the time budget, then store result + finished run atomically.
import type { Db } from '@/db';
import { db as defaultDb } from '@/db';
import { getResultByInputHash } from '@/db/queries/results';
import {
  claimRun,
  failRun,
  finishRunFromResult,
  finishRunWithResult,
  getRunById,
  getRunStatus,
  requeueRun,
  updateRunProgress,
} from '@/db/queries/runs';
import { AbortError, LimitError, SpecError } from '@/lib/physics/errors';
import { runTask } from '@/lib/physics/run-task';
import { parseTaskSpec } from '@/lib/physics/schemas';
import { SOLVER_VERSION } from '@/lib/physics/version';
import { inputHash } from '@/lib/runs/input-hash';
import { toStoredForm } from '@/lib/runs/stored-form';
import { runExpireSeconds } from './queue';
import { tryLockRun } from './run-lock';

/** At most one progress write per this many milliseconds (about 4 per second). */
export const PROGRESS_WRITE_INTERVAL_MS = 250;
/** How often a computing run checks whether it was cancelled. */
export const CANCEL_POLL_INTERVAL_MS = 400;

/** How a job ended. `requeued`: the run goes back to the queue and the caller must let pg-boss retry the job. */
export type RunJobOutcome =
  | { status: 'succeeded'; runId: string; fromCache: boolean; resultId: string; resultHash: string }
  | { status: 'failed'; runId: string; error: string }
  | { status: 'cancelled'; runId: string }
  | { status: 'skipped'; runId: string; reason: string };

/** Thrown when the job must be retried later (another live worker holds the run, the worker is stopping, a database error). */
export class RetryLaterError extends Error {
  constructor(message: string, options?: { cause?: unknown }) {
    super(message, options);
    this.name = 'RetryLaterError';
  }
}

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

function messageOf(error: unknown): string {
  return error instanceof Error ? error.message : String(error);
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

  const existing = await getRunById({ id: runId, database });
  if (!existing) return { status: 'skipped', runId, reason: 'the run no longer exists' };
  if (existing.status !== 'queued' && existing.status !== 'running') {
    return { status: 'skipped', runId, reason: `the run is already ${existing.status}` };
  }

  const lock = await tryLockRun(database.$client, runId);
  if (!lock) throw new RetryLaterError(`run ${runId} is being computed by another worker`);

  const controller = new AbortController();
  let abortReason: 'cancelled' | 'budget' | 'shutdown' | null = null;
  const abort = (reason: 'cancelled' | 'budget' | 'shutdown') => {
    if (!abortReason) abortReason = reason;
    controller.abort();
  };
  const onShutdown = () => abort('shutdown');
  const timers: ReturnType<typeof setInterval>[] = [];

  try {
    const run = await claimRun({ id: runId, database });
    if (!run) return { status: 'skipped', runId, reason: 'the run finished meanwhile' };

    let spec;
    try {
      spec = parseTaskSpec(run.params);
    } catch (error) {
      const message = messageOf(error);
      await failRun({ id: runId, error: message, database });
      return { status: 'failed', runId, error: message };
    }

    // Key the result by the solver that computes it (a worker of a newer version does not file its result under
    // the version the web server asked for).
    const key = run.solverVersion === SOLVER_VERSION ? run.inputHash : inputHash(spec, SOLVER_VERSION);
    const cached = await getResultByInputHash({ inputHash: key, database });
    if (cached) {
      const finished = await finishRunFromResult({ runId, resultId: cached.id, database });
      if (!finished) return { status: 'cancelled', runId };
      log(`run ${runId}: served from the cache`);
      return { status: 'succeeded', runId, fromCache: true, resultId: cached.id, resultHash: cached.resultHash };
    }

    // Cancellation, shutdown and time budget all abort the same signal.
    if (options.signal?.aborted) abort('shutdown');
    options.signal?.addEventListener('abort', onShutdown, { once: true });
    const budgetSeconds = options.timeBudgetSeconds ?? runExpireSeconds();
    const budgetTimer = setTimeout(() => abort('budget'), budgetSeconds * 1000);
    timers.push(budgetTimer as unknown as ReturnType<typeof setInterval>);
    timers.push(
      setInterval(() => {
        getRunStatus({ id: runId, database })
          .then((status) => {
            if (status === 'cancelled' || status === null) abort('cancelled');
          })
          .catch(() => {});
      }, CANCEL_POLL_INTERVAL_MS),
    );

    // Throttled progress: keep the latest value, write at most every PROGRESS_WRITE_INTERVAL_MS, one write at a time.
    let latest = { progress: 0, message: 'Computing' };
    let lastWrite = 0;
    let writing: Promise<void> | null = null;
    const onProgress = (fraction: number, message?: string) => {
      latest = { progress: Number.isFinite(fraction) ? fraction : latest.progress, message: message ?? latest.message };
      const now = Date.now();
      if (writing || now - lastWrite < PROGRESS_WRITE_INTERVAL_MS) return;
      lastWrite = now;
      writing = updateRunProgress({ id: runId, ...latest, database })
        .catch(() => {})
        .finally(() => {
          writing = null;
        });
    };

    let result: object;
    const started = Date.now();
    try {
      result = await runTask(spec, { signal: controller.signal, onProgress });
    } catch (error) {
      if (error instanceof AbortError || controller.signal.aborted) {
        if (abortReason === 'budget') {
          const message = `The run took longer than its time budget of ${budgetSeconds} s and was stopped; use a coarser grid (larger h), fewer levels or fewer sweep steps`;
          await failRun({ id: runId, error: message, database });
          return { status: 'failed', runId, error: message };
        }
        if (abortReason === 'shutdown') {
          if (!canRetry) {
            const message = 'The worker stopped during the last allowed attempt; start the run again';
            await failRun({ id: runId, error: message, database });
            return { status: 'failed', runId, error: message };
          }
          await requeueRun({ id: runId, message: 'The worker stopped; the run will start again', database });
          throw new RetryLaterError(`run ${runId} interrupted by the worker stopping`);
        }
        log(`run ${runId}: cancelled`);
        return { status: 'cancelled', runId };
      }
      const message = error instanceof SpecError || error instanceof LimitError ? error.message : `Solver error: ${messageOf(error)}`;
      await failRun({ id: runId, error: message, database });
      log(`run ${runId}: failed: ${message}`);
      return { status: 'failed', runId, error: message };
    } finally {
      for (const timer of timers) clearInterval(timer);
      options.signal?.removeEventListener('abort', onShutdown);
      if (writing) await writing;
    }

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
    log(`run ${runId}: ${finished?.status ?? 'gone'} in ${((Date.now() - started) / 1000).toFixed(1)} s (${row.resultHash.slice(0, 12)})`);
    if (finished?.status === 'succeeded') {
      return { status: 'succeeded', runId, fromCache: false, resultId: row.id, resultHash: row.resultHash };
    }
    return { status: 'cancelled', runId };
  } catch (error) {
    if (error instanceof RetryLaterError) throw error;
    // Database or other infrastructure trouble: retry when attempts remain, otherwise record the failure.
    const message = messageOf(error);
    if (canRetry) {
      await requeueRun({ id: runId, message: `Retrying after an error: ${message}`, database }).catch(() => {});
      throw new RetryLaterError(`run ${runId}: ${message}`, { cause: error });
    }
    await failRun({ id: runId, error: `The run could not be completed: ${message}`, database }).catch(() => {});
    return { status: 'failed', runId, error: message };
  } finally {
    for (const timer of timers) clearInterval(timer);
    await lock.release().catch(() => {});
  }
}
