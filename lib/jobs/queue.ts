// The run queue (pg-boss 10 in PostgreSQL): its name, retry and expiry policy, the web side's client and `enqueueRun`.
// The web side never works jobs or runs maintenance (`supervise: false`); workers do (scripts/worker.ts).
import PgBoss from 'pg-boss';
import { databaseUrl } from '@/db';

/** Default queue of figure runs; FLUXFOLIO_RUN_QUEUE overrides it (tests use their own queue). */
export const RUN_QUEUE = 'figure-runs';

/** Attempts after the first when a worker is lost or fails for a reason outside the solver (pg-boss `retryLimit`). */
export const RUN_RETRY_LIMIT = 3;
/** Seconds before a retried job may start again. */
export const RUN_RETRY_DELAY_SECONDS = 2;
/**
 * Default time budget of one run, in seconds: a run still computing after this is stopped and reported as
 * failed (and pg-boss would expire the job). Override with FLUXFOLIO_RUN_EXPIRE_SECONDS.
 */
export const RUN_EXPIRE_SECONDS_DEFAULT = 1800;

/** The data of a run job: only the run id; everything else is read from the runs row. */
export interface RunJobData {
  runId: string;
}

/** The queue name in use (FLUXFOLIO_RUN_QUEUE or {@link RUN_QUEUE}). */
export function runQueueName(): string {
  return process.env.FLUXFOLIO_RUN_QUEUE?.trim() || RUN_QUEUE;
}

/** The time budget of one run in seconds (FLUXFOLIO_RUN_EXPIRE_SECONDS, at least 5). */
export function runExpireSeconds(): number {
  const value = Number(process.env.FLUXFOLIO_RUN_EXPIRE_SECONDS);
  return Number.isFinite(value) && value >= 5 ? Math.floor(value) : RUN_EXPIRE_SECONDS_DEFAULT;
}

/** Queue policy: retries for lost workers, expiry a little after the run's own time budget (its backstop). */
export function runQueueOptions(): Omit<PgBoss.Queue, 'name'> {
  return {
    policy: 'standard',
    retryLimit: RUN_RETRY_LIMIT,
    retryDelay: RUN_RETRY_DELAY_SECONDS,
    retryBackoff: false,
    expireInSeconds: runExpireSeconds() + 60,
  };
}

const created = new WeakMap<PgBoss, Map<string, Promise<void>>>();

/**
 * Create the run queue once per client (pg-boss 10 needs the queue before `send` and `work`; creating an existing
 * queue is a no-op in the database).
 */
export function ensureRunQueue(boss: PgBoss, name = runQueueName()): Promise<void> {
  let byName = created.get(boss);
  if (!byName) created.set(boss, (byName = new Map()));
  let promise = byName.get(name);
  if (!promise) {
    promise = boss.createQueue(name, { name, ...runQueueOptions() }).catch((error: unknown) => {
      byName.delete(name);
      throw error;
    });
    byName.set(name, promise);
  }
  return promise;
}

const globalForBoss = globalThis as unknown as { fluxfolioBoss?: Promise<PgBoss> };

/**
 * The web side's pg-boss client (one per process, reused across dev reloads): small pool, no maintenance, no
 * schedules. Starting it installs or migrates the `pgboss` schema when needed.
 */
export function getQueueClient(): Promise<PgBoss> {
  if (!globalForBoss.fluxfolioBoss) {
    const boss = new PgBoss({
      connectionString: databaseUrl(),
      supervise: false,
      schedule: false,
      max: 3,
      application_name: 'fluxfolio-web',
    });
    boss.on('error', (error) => console.error('[queue]', error));
    globalForBoss.fluxfolioBoss = boss.start().catch((error: unknown) => {
      globalForBoss.fluxfolioBoss = undefined;
      throw error;
    });
  }
  return globalForBoss.fluxfolioBoss;
}

/** Stop the web side's client (tests and scripts that must exit). */
export async function stopQueueClient(): Promise<void> {
  const pending = globalForBoss.fluxfolioBoss;
  globalForBoss.fluxfolioBoss = undefined;
  if (pending) await (await pending).stop({ graceful: false, wait: true });
}

/**
 * Put a run on the queue.
 *
 * @param runId - id of a runs row in state 'queued'
 * @returns the pg-boss job id
 * @example
 * const jobId = await enqueueRun(run.id);
 */
export async function enqueueRun(runId: string): Promise<string> {
  const boss = await getQueueClient();
  const name = runQueueName();
  await ensureRunQueue(boss, name);
  const data: RunJobData = { runId };
  const { policy: _policy, ...sendOptions } = runQueueOptions();
  const jobId = await boss.send(name, data, sendOptions);
  if (!jobId) throw new Error(`the queue "${name}" refused the job for run ${runId}`);
  return jobId;
}

/** Cancel a run's queued job (best effort: a worker that fetches it anyway sees the cancelled run and skips it). */
export async function cancelRunJob(jobId: string): Promise<void> {
  const boss = await getQueueClient();
  await boss.cancel(runQueueName(), jobId);
}
