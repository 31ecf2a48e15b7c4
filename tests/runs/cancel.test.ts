// Cancelling runs: a queued run is cancelled before any work; a running run stops within a fraction of a second
// and stores nothing for itself; a finished run cannot be cancelled (409).
import { eq, sql } from 'drizzle-orm';
import { afterAll, describe, expect, it } from 'vitest';
import { db, sqlClient } from '@/db';
import { getRunById } from '@/db/queries/runs';
import { results } from '@/db/schema';
import { executeRun } from '@/lib/jobs/run-job';
import { cancelRun } from '@/lib/runs/cancel-run';
import { startRun } from '@/lib/runs/start-run';
import { createTestFigure, createWorld, SLOW_FLUX_SWEEP, SMALL_SPECTRUM, waitFor } from './fixtures';

afterAll(async () => {
  await sqlClient.end({ timeout: 5 });
});

describe('cancellation', () => {
  it('cancels a queued run; a worker that picks up its job does nothing', async () => {
    const world = await createWorld('author');
    const figure = await createTestFigure(world, { ...SMALL_SPECTRUM, grid: { h: 0.1, offset: [0.21, 0.07] } });
    const { run } = await startRun({ figure, user: world.user, enqueue: null });
    const cancelled = await cancelRun({ run });
    expect(cancelled.status).toBe('cancelled');
    const outcome = await executeRun(run.id);
    expect(outcome).toMatchObject({ status: 'skipped' });
    expect((await getRunById({ id: run.id }))?.status).toBe('cancelled');
    await expect(cancelRun({ run })).rejects.toMatchObject({ code: 'conflict' });
  });

  it('stops a running computation and keeps no result for it', async () => {
    const world = await createWorld('author');
    const params = { ...SLOW_FLUX_SWEEP, grid: { h: SLOW_FLUX_SWEEP.grid.h, offset: [0.031, 0.017] } };
    const figure = await createTestFigure(world, params);
    const { run } = await startRun({ figure, user: world.user, enqueue: null });
    const computing = executeRun(run.id);
    await waitFor('the run to start computing', async () => {
      const current = await getRunById({ id: run.id });
      return current?.status === 'running' ? true : undefined;
    });
    await cancelRun({ run });
    const outcome = await computing;
    expect(outcome.status).toBe('cancelled');
    const after = await getRunById({ id: run.id });
    expect(after?.status).toBe('cancelled');
    expect(after?.resultId).toBeNull();
    const stored = await db.select({ n: sql<number>`count(*)::int` }).from(results).where(eq(results.inputHash, run.inputHash));
    expect(stored[0].n).toBe(0);
  });

  it('refuses to cancel a finished run', async () => {
    const world = await createWorld('author');
    const figure = await createTestFigure(world, { ...SMALL_SPECTRUM, levels: 2 });
    const { run } = await startRun({ figure, user: world.user, enqueue: null });
    if (run.status !== 'succeeded') await executeRun(run.id);
    await expect(cancelRun({ run })).rejects.toMatchObject({ code: 'conflict' });
  });
});
