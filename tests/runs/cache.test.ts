// A repeated run is served from the stored result (content hash of parameters + solver version): no second
// computation, no job, one results row. Also: the worker-side cache and the stored form matching the hash.
import { eq, inArray, sql } from 'drizzle-orm';
import { afterAll, describe, expect, it } from 'vitest';
import { db, sqlClient } from '@/db';
import { getResultById } from '@/db/queries/results';
import { getRunById, insertRun } from '@/db/queries/runs';
import { results, runs } from '@/db/schema';
import { executeRun } from '@/lib/jobs/run-job';
import { canonicalJson, resultHash } from '@/lib/physics/canonical';
import { parseTaskSpec } from '@/lib/physics/schemas';
import { SOLVER_VERSION } from '@/lib/physics/version';
import { inputHash } from '@/lib/runs/input-hash';
import { startRun } from '@/lib/runs/start-run';
import { createTestFigure, createWorld, SMALL_SPECTRUM } from './fixtures';

afterAll(async () => {
  await sqlClient.end({ timeout: 5 });
});

/**
 * A spectrum spec of its own for each test (a distinct grid offset, in units of h), with any result stored for it
 * by an earlier run of this file removed first, so every test starts with an empty cache for its input.
 */
async function freshSpectrum(k: number): Promise<Record<string, unknown>> {
  const params = { ...SMALL_SPECTRUM, grid: { h: 0.1, offset: [0.0101 * k, 0.0037] } };
  const key = inputHash(parseTaskSpec(params), SOLVER_VERSION);
  const stale = db.select({ id: results.id }).from(results).where(eq(results.inputHash, key));
  await db.delete(runs).where(inArray(runs.resultId, stale));
  await db.delete(results).where(eq(results.inputHash, key));
  return params;
}

describe('result cache', () => {
  it('serves a repeated run from the stored result without computing again', async () => {
    const world = await createWorld('author');
    const figure = await createTestFigure(world, await freshSpectrum(1));

    const first = await startRun({ figure, user: world.user, enqueue: null });
    expect(first.fromCache).toBe(false);
    expect(first.run.status).toBe('queued');
    const outcome = await executeRun(first.run.id);
    expect(outcome.status).toBe('succeeded');
    const done = await getRunById({ id: first.run.id });
    expect(done?.status).toBe('succeeded');
    expect(done?.fromCache).toBe(false);
    expect(done?.progress).toBe(1);

    // Same parameters (written differently: defaults spelled out) -> same input hash -> cache.
    const spelled = { ...(figure.params as object), levels: 4 };
    const second = await startRun({ figure: { ...figure, params: spelled }, user: world.user, enqueue: null });
    expect(second.fromCache).toBe(true);
    expect(second.run.status).toBe('succeeded');
    expect(second.run.jobId).toBeNull();
    expect(second.run.resultId).toBe(done?.resultId);
    expect(second.run.inputHash).toBe(first.run.inputHash);

    const rows = await db.select({ n: sql<number>`count(*)::int` }).from(results).where(eq(results.inputHash, first.run.inputHash));
    expect(rows[0].n).toBe(1);
  });

  it('keys results by the validated parameters and the solver version', () => {
    const spec = parseTaskSpec(SMALL_SPECTRUM);
    expect(inputHash(spec, SOLVER_VERSION)).toBe(inputHash(parseTaskSpec({ ...SMALL_SPECTRUM }), SOLVER_VERSION));
    expect(inputHash(spec, SOLVER_VERSION)).not.toBe(inputHash(spec, `${SOLVER_VERSION}-other`));
    expect(inputHash(spec, SOLVER_VERSION)).not.toBe(inputHash({ ...spec, levels: 5 }, SOLVER_VERSION));
    expect(inputHash(spec, SOLVER_VERSION)).toMatch(/^[0-9a-f]{64}$/);
  });

  it('lets a queued duplicate find the result another run stored meanwhile (worker-side cache)', async () => {
    const world = await createWorld('author');
    const figure = await createTestFigure(world, await freshSpectrum(2));
    const a = await startRun({ figure, user: world.user, enqueue: null });
    // A second start would join run a (start-run.ts); a duplicate queued row can still exist (e.g. queued before a restart).
    const { id: _id, createdAt: _createdAt, ...values } = a.run;
    const b = { run: await insertRun({ values }), fromCache: false };
    expect(b.run.id).not.toBe(a.run.id);
    const first = await executeRun(a.run.id);
    const second = await executeRun(b.run.id);
    expect(first.status).toBe('succeeded');
    expect(second).toMatchObject({ status: 'succeeded', fromCache: true });
    const runB = await getRunById({ id: b.run.id });
    expect(runB?.fromCache).toBe(true);
    expect(runB?.resultId).toBe((await getRunById({ id: a.run.id }))?.resultId);
  });

  it('stores exactly what the result hash covers (data without diagnostics, canonical)', async () => {
    const world = await createWorld('author');
    const figure = await createTestFigure(world, await freshSpectrum(3));
    const { run } = await startRun({ figure, user: world.user, enqueue: null });
    const outcome = await executeRun(run.id);
    if (outcome.status !== 'succeeded') throw new Error(`run ${outcome.status}`);
    const stored = await getResultById({ id: outcome.resultId });
    expect(stored).not.toBeNull();
    expect((stored!.data as Record<string, unknown>).diagnostics).toBeUndefined();
    expect(resultHash(stored!.data)).toBe(stored!.resultHash);
    expect(resultHash({ ...(stored!.data as object), diagnostics: stored!.diagnostics })).toBe(stored!.resultHash);
    expect(canonicalJson(stored!.params)).toBe(canonicalJson(parseTaskSpec(figure.params)));
    expect(stored!.solverVersion).toBe(SOLVER_VERSION);
  });

  it('refuses invalid parameters with per-field messages and writes nothing', async () => {
    const world = await createWorld('author');
    const figure = await createTestFigure(world, await freshSpectrum(4));
    const bad = { ...SMALL_SPECTRUM, grid: { h: -1 } };
    await expect(startRun({ figure: { ...figure, params: bad }, user: world.user, enqueue: null })).rejects.toMatchObject({
      code: 'invalid',
      fields: { 'params.grid.h': [expect.any(String)] },
    });
  });

  it('refuses to run a figure of a kind without a solver task (uploaded data) and writes no run', async () => {
    const world = await createWorld('author');
    const figure = await createTestFigure(world, { columns: ['alpha', 'E0'], rows: [[0, 5.8], [0.5, 9.9]] }, { kind: 'uploaded-data' });
    expect(figure.kind).toBe('uploaded-data');
    await expect(startRun({ figure, user: world.user, enqueue: null })).rejects.toMatchObject({
      code: 'conflict',
      message: expect.stringContaining('"uploaded-data" are not computed'),
    });
    const rows = await db.select({ n: sql<number>`count(*)::int` }).from(runs).where(eq(runs.figureId, figure.id));
    expect(rows[0].n).toBe(0);
  });
});
