// Watch step of a run job: one AbortSignal for the solver that fires on cancellation (polled), on the time budget and
// on worker shutdown, and a throttled progress writer. stop() ends the watch and waits for the last progress write.
import type { Db } from '@/db';
import { getRunStatus, updateRunProgress } from '@/db/queries/runs';

/** At most one progress write per this many milliseconds (about 4 per second). */
export const PROGRESS_WRITE_INTERVAL_MS = 250;
/** How often a computing run checks whether it was cancelled. */
export const CANCEL_POLL_INTERVAL_MS = 400;

/** Why the solver's signal fired. */
export type AbortReason = 'cancelled' | 'budget' | 'shutdown';

export interface RunWatch {
  /** Aborted on cancellation, time budget or shutdown (the first reason wins). */
  signal: AbortSignal;
  /** Why `signal` fired, or null while it has not. */
  reason(): AbortReason | null;
  /** The solver's progress callback: keeps the latest value, writes at most every PROGRESS_WRITE_INTERVAL_MS. */
  onProgress(fraction: number, message?: string): void;
  /** Stops the timers and the shutdown listener and waits for a progress write in flight. Safe to call twice. */
  stop(): Promise<void>;
}

/**
 * Starts watching a run that is about to be computed.
 * @param shutdown - the worker's signal: when it fires the run stops with reason 'shutdown'
 * @param budgetSeconds - time budget; the run stops with reason 'budget' after it
 */
export function watchRun({
  runId,
  database,
  shutdown,
  budgetSeconds,
}: {
  runId: string;
  database: Db;
  shutdown?: AbortSignal;
  budgetSeconds: number;
}): RunWatch {
  const controller = new AbortController();
  let abortReason: AbortReason | null = null;
  const abort = (reason: AbortReason) => {
    if (!abortReason) abortReason = reason;
    controller.abort();
  };
  const onShutdown = () => abort('shutdown');

  if (shutdown?.aborted) abort('shutdown');
  shutdown?.addEventListener('abort', onShutdown, { once: true });
  const budgetTimer = setTimeout(() => abort('budget'), budgetSeconds * 1000);
  const cancelPoll = setInterval(() => {
    getRunStatus({ id: runId, database })
      .then((status) => {
        if (status === 'cancelled' || status === null) abort('cancelled');
      })
      .catch(() => {});
  }, CANCEL_POLL_INTERVAL_MS);

  // Throttled progress: keep the latest value, write at most every PROGRESS_WRITE_INTERVAL_MS, one write at a time.
  let latest = { progress: 0, message: 'Computing' };
  let lastWrite = 0;
  let writing: Promise<void> | null = null;

  return {
    signal: controller.signal,
    reason: () => abortReason,
    onProgress(fraction: number, message?: string) {
      latest = { progress: Number.isFinite(fraction) ? fraction : latest.progress, message: message ?? latest.message };
      const now = Date.now();
      if (writing || now - lastWrite < PROGRESS_WRITE_INTERVAL_MS) return;
      lastWrite = now;
      writing = updateRunProgress({ id: runId, ...latest, database })
        .catch(() => {})
        .finally(() => {
          writing = null;
        });
    },
    async stop() {
      clearTimeout(budgetTimer);
      clearInterval(cancelPoll);
      shutdown?.removeEventListener('abort', onShutdown);
      if (writing) await writing;
    },
  };
}
