// The run worker (`npm run worker`): takes figure runs from the pg-boss queue one at a time and computes them.
// Several workers on several machines may share one database; SIGTERM/SIGINT stop it gracefully.
import os from 'node:os';
import PgBoss from 'pg-boss';
import { databaseUrl, sqlClient } from '@/db';
import { recoverLostRuns } from '@/lib/jobs/lost-runs';
import { ensureRunQueue, runQueueName, type RunJobData } from '@/lib/jobs/queue';
import { executeRun, RetryLaterError } from '@/lib/jobs/run-job';
import { SOLVER_VERSION } from '@/lib/physics/version';

/** Seconds between checks for runs whose worker was lost (FLUXFOLIO_RECOVER_SECONDS). */
const RECOVER_SECONDS = positiveEnv('FLUXFOLIO_RECOVER_SECONDS', 5);
/** Seconds between pg-boss maintenance passes: expiry, archive, clean-up (FLUXFOLIO_MAINTENANCE_SECONDS). */
const MAINTENANCE_SECONDS = positiveEnv('FLUXFOLIO_MAINTENANCE_SECONDS', 30);
/** Seconds a stopping worker lets the current run finish before handing it back to the queue. */
const GRACE_SECONDS = positiveEnv('FLUXFOLIO_WORKER_GRACE_SECONDS', 5);

function positiveEnv(name: string, fallback: number): number {
  const value = Number(process.env[name]);
  return Number.isFinite(value) && value > 0 ? value : fallback;
}

function log(line: string): void {
  process.stdout.write(`[worker ${process.pid}] ${new Date().toISOString()} ${line}\n`);
}

async function main(): Promise<void> {
  const queue = runQueueName();
  const boss = new PgBoss({
    connectionString: databaseUrl(),
    supervise: true,
    schedule: false,
    maintenanceIntervalSeconds: Math.max(1, Math.round(MAINTENANCE_SECONDS)),
    max: 4,
    application_name: `fluxfolio-worker-${os.hostname()}-${process.pid}`,
  });
  boss.on('error', (error) => log(`queue error: ${error.message}`));
  await boss.start();
  await ensureRunQueue(boss, queue);

  const shutdown = new AbortController();
  let recovering = false;
  const recover = async () => {
    if (recovering || shutdown.signal.aborted) return;
    recovering = true;
    try {
      await recoverLostRuns({ boss, queue, log });
    } catch (error) {
      log(`lost-run check failed: ${(error as Error).message}`);
    } finally {
      recovering = false;
    }
  };
  await recover();
  const recoverTimer = setInterval(recover, RECOVER_SECONDS * 1000);

  await boss.work<RunJobData>(
    queue,
    { batchSize: 1, pollingIntervalSeconds: 0.5, includeMetadata: true },
    async ([job]) => {
      const runId = job?.data?.runId;
      if (typeof runId !== 'string') {
        log(`job ${job?.id}: no run id, ignored`);
        return { status: 'skipped', reason: 'no run id' };
      }
      const attempt = `attempt ${job.retryCount + 1}/${job.retryLimit + 1}`;
      log(`job ${job.id}: run ${runId} (${attempt})`);
      try {
        const outcome = await executeRun(runId, {
          signal: shutdown.signal,
          canRetry: job.retryCount < job.retryLimit,
          timeBudgetSeconds: Math.max(5, job.expireInSeconds - 60),
          log,
        });
        const detail = outcome.status === 'failed' ? `: ${outcome.error}` : outcome.status === 'skipped' ? ` (${outcome.reason})` : '';
        log(`job ${job.id}: run ${runId} ${outcome.status}${detail}`);
        return outcome;
      } catch (error) {
        const reason = error instanceof RetryLaterError ? error.message : `unexpected: ${(error as Error).message}`;
        log(`job ${job.id}: run ${runId} will be retried (${reason})`);
        throw error;
      }
    },
  );
  log(`ready: queue "${queue}", solver ${SOLVER_VERSION}, database ${databaseUrl().replace(/\/\/[^@/]*@/, '//')}`);

  let stopping = false;
  const stop = async (signal: string) => {
    if (stopping) return;
    stopping = true;
    log(`${signal}: stopping (current run gets ${GRACE_SECONDS} s to finish)`);
    clearInterval(recoverTimer);
    const graceTimer = setTimeout(() => shutdown.abort(), GRACE_SECONDS * 1000);
    try {
      await boss.stop({ graceful: true, wait: true, timeout: (GRACE_SECONDS + 10) * 1000 });
    } finally {
      clearTimeout(graceTimer);
      shutdown.abort();
      await sqlClient.end({ timeout: 5 });
    }
    log('stopped');
    process.exit(0);
  };
  process.on('SIGTERM', () => void stop('SIGTERM'));
  process.on('SIGINT', () => void stop('SIGINT'));
}

main().catch((error: unknown) => {
  log(`cannot start: ${error instanceof Error ? error.message : String(error)}`);
  process.exit(1);
});
