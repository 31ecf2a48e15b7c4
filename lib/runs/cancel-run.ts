// Cancelling a run: a queued or running run becomes 'cancelled' at once; its worker notices within a fraction of
// a second and stops computing, and a job not yet taken is withdrawn from the queue.
import type { Db } from '@/db';
import { db as defaultDb } from '@/db';
import { cancelRunById } from '@/db/queries/runs';
import type { Run } from '@/db/schema';
import { conflict } from '@/lib/domain-error';
import { cancelRunJob } from '@/lib/jobs/queue';

/**
 * Cancel a run.
 *
 * @throws DomainError `conflict` when the run has already finished (succeeded, failed or cancelled)
 * @returns the cancelled run
 * @example
 * const run = await cancelRun({ run });
 */
export async function cancelRun({
  run,
  database = defaultDb,
}: {
  run: Pick<Run, 'id' | 'status' | 'jobId'>;
  database?: Db;
}): Promise<Run> {
  const cancelled = await cancelRunById({ id: run.id, database });
  if (!cancelled) throw conflict('This run has already finished and cannot be cancelled');
  if (cancelled.jobId) {
    // Best effort: a worker that already took the job sees the cancelled status and stops.
    await cancelRunJob(cancelled.jobId).catch((error: unknown) => console.error('[runs] cancel job', error));
  }
  return cancelled;
}
