// A worker killed with SIGKILL in the middle of a run leaves no result and no snapshot, and the run is not marked
// succeeded; a new worker notices the lost run (its lock died with the process), pg-boss retries the job, and the
// run completes. Then SIGTERM stops the worker gracefully.
import { randomUUID } from 'node:crypto';
import { and, eq, sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db, sqlClient } from '@/db';
import { getRunById } from '@/db/queries/runs';
import { results, snapshots } from '@/db/schema';
import { stopQueueClient } from '@/lib/jobs/queue';
import { startRun } from '@/lib/runs/start-run';
import { freezeRun } from '@/lib/snapshots/freeze';
import { createTestFigure, createWorld, SLOW_FLUX_SWEEP, waitFor } from './fixtures';
import { startWorker, type WorkerProcess } from './worker-process';

const queue = `runs-kill-test-${randomUUID().slice(0, 8)}`;
const workers: WorkerProcess[] = [];

beforeAll(() => {
  process.env.FLUXFOLIO_RUN_QUEUE = queue;
});

afterAll(async () => {
  for (const worker of workers) {
    if (worker.child.exitCode === null && worker.child.signalCode === null) {
      worker.child.kill('SIGKILL');
      await worker.exited;
    }
  }
  await stopQueueClient();
  await sqlClient.end({ timeout: 5 });
});

describe('worker killed during a run', () => {
  it('leaves nothing partial and the job is retried to completion', async () => {
    const world = await createWorld('author');
    // A grid offset of its own so that no earlier test run has this input in the cache.
    const params = { ...SLOW_FLUX_SWEEP, grid: { h: SLOW_FLUX_SWEEP.grid.h, offset: [0.013, 0.029] } };
    const figure = await createTestFigure(world, params);

    const first = startWorker(queue);
    workers.push(first);
    await first.waitForLine(/ready: queue/);

    const { run, fromCache } = await startRun({ figure, user: world.user });
    expect(fromCache).toBe(false);
    expect(run.jobId).toBeTruthy();

    // Wait until the worker is computing (progress written), then kill it without warning.
    await waitFor('the run to make progress', async () => {
      const current = await getRunById({ id: run.id });
      return current?.status === 'running' && current.progress > 0 ? true : undefined;
    });
    first.child.kill('SIGKILL');
    const died = await first.exited;
    expect(died.signal).toBe('SIGKILL');

    const afterKill = await getRunById({ id: run.id });
    expect(afterKill).not.toBeNull();
    // Still marked running, or already handed back to the queue by a worker's lost-run sweep (lib/jobs/lost-runs.ts).
    expect(['running', 'queued']).toContain(afterKill!.status);
    expect(afterKill!.resultId).toBeNull();
    const stored = await db.select({ n: sql<number>`count(*)::int` }).from(results).where(eq(results.inputHash, run.inputHash));
    expect(stored[0].n).toBe(0);
    const frozen = await db.select({ n: sql<number>`count(*)::int` }).from(snapshots).where(eq(snapshots.figureId, figure.id));
    expect(frozen[0].n).toBe(0);
    await expect(freezeRun({ runId: run.id, user: world.user })).rejects.toMatchObject({ code: 'conflict' });

    // A new worker finds the lost run, pg-boss retries the job, and the run completes.
    const second = startWorker(queue);
    workers.push(second);
    await second.waitForLine(/ready: queue/);
    const done = await waitFor(
      'the retried run to finish',
      async () => {
        const current = await getRunById({ id: run.id });
        return current && ['succeeded', 'failed', 'cancelled'].includes(current.status) ? current : undefined;
      },
      { timeoutMs: 180_000, intervalMs: 500 },
    );
    expect(done.error).toBeNull();
    expect(done.status).toBe('succeeded');
    expect(done.resultId).not.toBeNull();
    expect(second.output()).toMatch(/worker was lost|will be retried/);

    const job = (await db.execute(
      sql`SELECT state, retry_count FROM pgboss.job WHERE name = ${queue} AND id = ${run.jobId}::uuid
          UNION ALL SELECT state, retry_count FROM pgboss.archive WHERE name = ${queue} AND id = ${run.jobId}::uuid`,
    )) as unknown as { state: string; retry_count: number }[];
    expect(job[0]).toMatchObject({ state: 'completed' });
    expect(job[0].retry_count).toBeGreaterThanOrEqual(1);

    const rows = await db.select().from(results).where(and(eq(results.inputHash, done.inputHash)));
    expect(rows).toHaveLength(1);
    const snapshot = await freezeRun({ runId: run.id, user: world.user });
    expect(snapshot.version).toBe(1);

    // Graceful stop.
    second.child.kill('SIGTERM');
    const stopped = await second.exited;
    expect(stopped.code).toBe(0);
    expect(second.output()).toMatch(/stopped/);
  }, 300_000); // two worker start-ups, a computation and a retry: longer than the default test timeout on a loaded machine
});
