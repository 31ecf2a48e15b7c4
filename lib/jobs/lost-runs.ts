// Recovery of runs whose worker was lost (kill -9, crash, machine gone): a 'running' run whose lock is free goes
// back to the queue and its pg-boss job is failed at once, so pg-boss retries it on any live worker (instead of
// waiting for the job's expiry).
import { and, eq, sql } from 'drizzle-orm';
import type PgBoss from 'pg-boss';
import type { Db } from '@/db';
import { db as defaultDb } from '@/db';
import { failRun, listRunningRuns } from '@/db/queries/runs';
import { runs } from '@/db/schema';
import { isRunLockFree } from './run-lock';

export const LOST_WORKER_MESSAGE = 'The worker computing this run stopped; the run starts again on another worker';

/**
 * Find running runs whose worker is gone and hand them back to the queue. Safe to call from several workers at
 * once: the lock check and the status change happen in one transaction.
 *
 * @returns the ids of the runs recovered
 */
export async function recoverLostRuns({
  boss,
  queue,
  database = defaultDb,
  log = () => {},
}: {
  boss: PgBoss;
  queue: string;
  database?: Db;
  log?: (line: string) => void;
}): Promise<string[]> {
  const recovered: string[] = [];
  for (const candidate of await listRunningRuns({ database })) {
    const jobId = await database.transaction(async (tx) => {
      if (candidate.jobId !== null) {
        // Only runs whose job lives in this worker's queue: another queue's workers look after their own.
        const rows = (await tx.execute(
          sql`SELECT state FROM pgboss.job WHERE name = ${queue} AND id = ${candidate.jobId}::uuid`,
        )) as unknown as { state: string }[];
        if (rows[0]?.state !== 'active') return undefined;
      }
      if (!(await isRunLockFree(tx, candidate.id))) return undefined;
      const [row] = await tx
        .update(runs)
        .set({ status: 'queued', progress: 0, message: LOST_WORKER_MESSAGE })
        .where(and(eq(runs.id, candidate.id), eq(runs.status, 'running')))
        .returning({ jobId: runs.jobId });
      return row ? row.jobId : undefined;
    });
    if (jobId === undefined) continue;
    recovered.push(candidate.id);
    if (jobId === null) {
      // A run computed outside the queue (the seed): nothing will retry it.
      await failRun({ id: candidate.id, error: 'The computation stopped before it finished', database });
      log(`run ${candidate.id}: lost outside the queue, marked failed`);
      continue;
    }
    await boss.fail(queue, jobId, { message: LOST_WORKER_MESSAGE });
    const job = await boss.getJobById(queue, jobId);
    if (!job || job.state === 'failed' || job.state === 'completed' || job.state === 'cancelled') {
      await failRun({
        id: candidate.id,
        error: 'The run was interrupted too many times (its worker stopped during every attempt)',
        database,
      });
      log(`run ${candidate.id}: lost, no attempts left, marked failed`);
    } else {
      log(`run ${candidate.id}: its worker was lost; job ${jobId} will be retried`);
    }
  }
  return recovered;
}
