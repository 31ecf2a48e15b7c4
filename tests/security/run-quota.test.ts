// Run starts through the API against the real database: a start of an input identical to a queued run joins that run,
// and the quotas of active runs per figure and per person refuse further starts with 429 and write nothing.
import { randomUUID } from 'node:crypto';
import { and, count, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sqlClient } from '@/db';
import { insertRun } from '@/db/queries/runs';
import { runs, type Figure } from '@/db/schema';
import { parseTaskSpec } from '@/lib/physics/schemas';
import { SOLVER_VERSION } from '@/lib/physics/version';
import { inputHash } from '@/lib/runs/input-hash';
import { ACTIVE_RUNS_PER_FIGURE, ACTIVE_RUNS_PER_PERSON } from '@/lib/runs/start-run';
import { testDb } from '../helpers/db';
import { signedInClient, type HttpClient } from '../helpers/http-client';
import { createTestTeam, type TestTeam } from '../helpers/test-manuscripts';
import { createTestFigure, SMALL_SPECTRUM } from '../runs/fixtures';

let team: TestTeam;
let author: HttpClient;

beforeAll(async () => {
  team = await createTestTeam({ title: 'Run quota' });
  author = await signedInClient(team.author);
});

afterAll(async () => {
  await sqlClient.end({ timeout: 5 });
});

/** A figure whose parameters no other test computes (a unique grid offset), so no stored result serves it. */
async function freshFigure(): Promise<Figure> {
  const offset = [Number((Math.random() * 0.4 + 0.05).toFixed(6)), Number((Math.random() * 0.4 + 0.05).toFixed(6))];
  return createTestFigure({ user: team.author, manuscript: team.manuscript }, { ...SMALL_SPECTRUM, grid: { h: 0.1, offset } });
}

/** A queued run row without a queue job (no worker takes it), as a start would leave it while workers are busy. */
async function queuedRun(figure: Figure, hash = randomUUID().replace(/-/g, '').padEnd(64, '0')) {
  return insertRun({
    values: {
      figureId: figure.id,
      params: parseTaskSpec(figure.params),
      inputHash: hash,
      solverVersion: SOLVER_VERSION,
      status: 'queued',
      message: 'Waiting for a worker',
      startedById: team.author.id,
    },
  });
}

async function runsOf(figureId: string): Promise<number> {
  const [{ n }] = await testDb.select({ n: count() }).from(runs).where(eq(runs.figureId, figureId));
  return n;
}

describe('run starts', () => {
  it('joins the queued run of an identical input instead of queueing another', async () => {
    const figure = await freshFigure();
    const waiting = await queuedRun(figure, inputHash(parseTaskSpec(figure.params), SOLVER_VERSION));
    const response = await author.fetch(`/api/figures/${figure.id}/runs`, { method: 'POST' });
    expect(response.status).toBe(202);
    const { run, fromCache } = (await response.json()) as { run: { id: string }; fromCache: boolean };
    expect(fromCache).toBe(false);
    expect(run.id).toBe(waiting.id);
    expect(await runsOf(figure.id)).toBe(1);
  });

  it(`refuses a start beyond ${ACTIVE_RUNS_PER_FIGURE} active runs of one figure with 429`, async () => {
    const figure = await freshFigure();
    for (let i = 0; i < ACTIVE_RUNS_PER_FIGURE; i += 1) await queuedRun(figure);
    const response = await author.fetch(`/api/figures/${figure.id}/runs`, { method: 'POST' });
    expect(response.status).toBe(429);
    expect(((await response.json()) as { error: string }).error).toMatch(/This figure already has 2 runs queued or running/);
    expect(await runsOf(figure.id)).toBe(ACTIVE_RUNS_PER_FIGURE);
  });

  it(`refuses a start beyond ${ACTIVE_RUNS_PER_PERSON} active runs of one person with 429`, async () => {
    const [{ n: before }] = await testDb
      .select({ n: count() })
      .from(runs)
      .where(and(eq(runs.startedById, team.author.id), eq(runs.status, 'queued')));
    // Earlier tests of this file left queued runs of this person; top up to the quota on figures of one run each.
    for (let i = before; i < ACTIVE_RUNS_PER_PERSON; i += 1) await queuedRun(await freshFigure());
    const figure = await freshFigure();
    const response = await author.fetch(`/api/figures/${figure.id}/runs`, { method: 'POST' });
    expect(response.status).toBe(429);
    expect(((await response.json()) as { error: string }).error).toMatch(/You already have 4 runs queued or running/);
    expect(await runsOf(figure.id)).toBe(0);
    // Cancelled runs free the quota.
    await testDb.update(runs).set({ status: 'cancelled' }).where(eq(runs.startedById, team.author.id));
    const accepted = await author.fetch(`/api/figures/${figure.id}/runs`, { method: 'POST' });
    expect(accepted.status).toBe(202);
  });
});
