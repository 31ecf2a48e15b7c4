// Snapshots: numbered v1, v2, … per figure even under concurrent freezes; only succeeded runs freeze; the database
// refuses UPDATE and DELETE (trigger); a bundle recomputed by the solver gives the same hash, a tampered one does not.
import { eq, sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db, sqlClient } from '@/db';
import { deleteFigureById, updateFigure } from '@/db/queries/figures';
import { getResultById } from '@/db/queries/results';
import { insertRun } from '@/db/queries/runs';
import { getSnapshotContext, listSnapshotsByFigure } from '@/db/queries/snapshots';
import { figures, runs, snapshots, type Figure, type Snapshot } from '@/db/schema';
import { executeRun } from '@/lib/jobs/run-job';
import { parseTaskSpec } from '@/lib/physics/schemas';
import { startRun } from '@/lib/runs/start-run';
import { snapshotBundle, snapshotBundleCsv, type SnapshotBundle } from '@/lib/snapshots/bundle';
import { freezeRun } from '@/lib/snapshots/freeze';
import { BundleError, parseBundle, verifyBundle } from '@/lib/snapshots/verify-bundle';
import { createTestFigure, createWorld, SMALL_SPECTRUM, setFigureParams, type TestWorld } from './fixtures';
import { thrownBy } from '../helpers/thrown';

let world: TestWorld;
let figure: Figure;

/**
 * Start and compute a run of the figure's current parameters (in-process, no queue); returns the run id. A stored result
 * (also one first computed for another manuscript, which is not reported as `fromCache`) gives a run succeeded at once.
 */
async function computedRun(fig: Figure): Promise<string> {
  const { run } = await startRun({ figure: fig, user: world.user, enqueue: null });
  if (run.status !== 'succeeded') {
    const outcome = await executeRun(run.id);
    if (outcome.status !== 'succeeded') throw new Error(`run ended ${outcome.status}`);
  }
  return run.id;
}

async function bundleOf(snapshot: Snapshot): Promise<SnapshotBundle> {
  const context = await getSnapshotContext({ id: snapshot.id });
  const result = await getResultById({ id: snapshot.resultId });
  return snapshotBundle(snapshot, result!, context!);
}

/** The statement fails with the trigger's message (Drizzle wraps the driver error: the message is in `cause`). */
async function expectDatabaseRefusal(query: PromiseLike<unknown>): Promise<void> {
  const error = await Promise.resolve(query).then(
    () => null,
    (e: unknown) => e as Error & { code?: string; cause?: Error & { code?: string } },
  );
  expect(error).not.toBeNull();
  const cause: (Error & { code?: string }) | null = error?.cause ?? error;
  expect(cause?.message).toMatch(/snapshots are immutable \((UPDATE|DELETE) refused/);
  expect(cause?.code).toBe('23000');
}

beforeAll(async () => {
  world = await createWorld('author');
  figure = await createTestFigure(world, { ...SMALL_SPECTRUM, levels: 3 });
});

afterAll(async () => {
  await sqlClient.end({ timeout: 5 });
});

describe('freezing', () => {
  it('numbers snapshots v1, v2, v3 … without gaps or duplicates under concurrent freezes', async () => {
    const runIds: string[] = [];
    for (const levels of [3, 4, 5, 6, 7]) {
      const fig = await setFigureParams(figure.id, { ...SMALL_SPECTRUM, levels });
      runIds.push(await computedRun(fig));
    }
    const frozen = await Promise.all(runIds.map((runId) => freezeRun({ runId, user: world.user })));
    expect(frozen.map((s) => s.version).sort((a, b) => a - b)).toEqual([1, 2, 3, 4, 5]);
    const listed = await listSnapshotsByFigure({ figureId: figure.id });
    expect(listed.map((s) => s.version)).toEqual([1, 2, 3, 4, 5]);
    for (const snapshot of frozen) {
      expect(snapshot.resultHash).toMatch(/^[0-9a-f]{64}$/);
      expect(snapshot.frozenById).toBe(world.user.id);
      expect(snapshot.label).toBe(figure.label);
      expect(snapshot.kind).toBe('spectrum');
      expect(snapshot.solverVersion).toBeTruthy();
    }
  });

  it('refuses a run that has not succeeded, and a run frozen already', async () => {
    for (const status of ['queued', 'running', 'failed', 'cancelled'] as const) {
      const unfinished = await insertRun({
        values: { figureId: figure.id, params: parseTaskSpec(figure.params), inputHash: '0'.repeat(64), solverVersion: 'test', status },
      });
      await expect(freezeRun({ runId: unfinished.id, user: world.user })).rejects.toMatchObject({
        code: 'conflict',
        message: expect.stringContaining(status),
      });
      // Leave no active row behind: the figure's quota of active runs (lib/runs/start-run.ts) would refuse the start below.
      if (status === 'queued' || status === 'running') await db.update(runs).set({ status: 'cancelled' }).where(eq(runs.id, unfinished.id));
    }
    const fig = await setFigureParams(figure.id, { ...SMALL_SPECTRUM, levels: 8 });
    const run = { id: await computedRun(fig) };
    const snapshot = await freezeRun({ runId: run.id, user: world.user });
    expect(snapshot.version).toBe(6);
    await expect(freezeRun({ runId: run.id, user: world.user })).rejects.toMatchObject({
      code: 'conflict',
      message: expect.stringContaining('v6'),
    });
    await expect(freezeRun({ runId: '00000000-0000-4000-8000-000000000000', user: world.user })).rejects.toMatchObject({
      code: 'not-found',
    });
  });

  it('freezes the caption and view spec the figure holds when the freeze takes its lock, none from its caller', async () => {
    const fig = await setFigureParams(figure.id, { ...SMALL_SPECTRUM, levels: 2 });
    const runId = await computedRun(fig);
    // Changed after the run finished, just before freezing: the snapshot carries these values.
    await updateFigure({ id: figure.id, patch: { caption: 'Caption as edited before the freeze', viewSpec: { fluxfolio: { level: 1 } } } });
    // The freeze waits for another transaction that holds the figure row and changes the caption again; a freeze that read
    // the figure before taking the lock (or without it) would freeze the earlier caption.
    let release!: () => void;
    const released = new Promise<void>((resolve) => (release = resolve));
    let locked!: () => void;
    const isLocked = new Promise<void>((resolve) => (locked = resolve));
    const holder = db.transaction(async (tx) => {
      await tx.select().from(figures).where(eq(figures.id, figure.id)).for('update');
      locked();
      await released;
      await tx.update(figures).set({ caption: 'Caption committed while the freeze waited' }).where(eq(figures.id, figure.id));
    });
    await isLocked;
    // A caption passed by the caller is not part of freezeRun's input and is ignored.
    const freezing = freezeRun({ runId, user: world.user, ...({ caption: 'from the caller' } as object) });
    await new Promise((resolve) => setTimeout(resolve, 300));
    release();
    await holder;
    const snapshot = await freezing;
    expect(snapshot.caption).toBe('Caption committed while the freeze waited');
    expect(snapshot.viewSpec).toEqual({ fluxfolio: { level: 1 } });
  });

  it('keeps a figure that has snapshots (delete answers 409)', async () => {
    await expect(deleteFigureById({ id: figure.id })).rejects.toMatchObject({ code: 'conflict' });
  });
});

describe('immutability in the database', () => {
  it('refuses UPDATE and DELETE of snapshots (trigger), through Drizzle and raw SQL', async () => {
    const [snapshot] = await listSnapshotsByFigure({ figureId: figure.id });
    await expectDatabaseRefusal(db.update(snapshots).set({ caption: 'edited' }).where(eq(snapshots.id, snapshot.id)));
    await expectDatabaseRefusal(db.delete(snapshots).where(eq(snapshots.id, snapshot.id)));
    await expectDatabaseRefusal(db.execute(sql`UPDATE snapshots SET result_hash = 'x' WHERE id = ${snapshot.id}`));
    await expectDatabaseRefusal(db.execute(sql`DELETE FROM snapshots WHERE figure_id = ${figure.id}`));
    const [again] = await db.select().from(snapshots).where(eq(snapshots.id, snapshot.id));
    expect(again).toEqual(snapshot);
  });
});

describe('bundles', () => {
  it('recomputes a snapshot with the same hash', async () => {
    const [snapshot] = await listSnapshotsByFigure({ figureId: figure.id });
    const bundle = parseBundle(JSON.parse(JSON.stringify(await bundleOf(snapshot))));
    expect(bundle).toMatchObject({
      format: 'fluxfolio-snapshot-bundle',
      formatVersion: 1,
      version: snapshot.version,
      resultHash: snapshot.resultHash,
      figure: { label: figure.label, kind: 'spectrum' },
      manuscript: { slug: world.manuscript.slug },
    });
    const check = await verifyBundle(bundle);
    expect(check.identical).toBe(true);
    expect(check.recomputedHash).toBe(snapshot.resultHash);
    expect(check.summary).toMatch(/^identical/);
    expect(snapshotBundleCsv(bundle).split('\r\n')[0]).toBe('table,row,column,value');
  });

  it('reports which fields differ and by how much when the data was changed', async () => {
    const [snapshot] = await listSnapshotsByFigure({ figureId: figure.id });
    const bundle = JSON.parse(JSON.stringify(await bundleOf(snapshot))) as SnapshotBundle;
    const levels = bundle.data.levels as number[];
    levels[1] *= 1.001;
    const check = await verifyBundle(parseBundle(bundle));
    expect(check.identical).toBe(false);
    expect(check.diff?.fields.map((f) => f.field)).toContain('levels[]');
    expect(check.diff?.largest?.path).toBe('levels[1]');
    expect(check.diff?.largest?.relativeDifference).toBeCloseTo(0.001 / 1.001, 6);
    expect(check.summary).toMatch(/DIFFERENT/);
    expect(check.summary).toMatch(/levels\[1\]/);
  });

  it('rejects what is not a bundle, naming the fields', () => {
    expect(() => parseBundle({ format: 'something-else' })).toThrow(BundleError);
    const error = thrownBy(() => parseBundle({ format: 'fluxfolio-snapshot-bundle', formatVersion: 1 }));
    expect(error).toBeInstanceOf(BundleError);
    expect((error as BundleError).issues.map((i) => i.path)).toEqual(expect.arrayContaining(['params', 'resultHash', 'data']));
  });
});
