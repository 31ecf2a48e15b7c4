// Exports draw the chart in a child process with a heap and a wall-time limit: a view whose expressions build a huge array
// is refused with a clear domain error (directly and through the export route) and the server keeps answering.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sqlClient } from '@/db';
import { figures, results, snapshots } from '@/db/schema';
import { isDomainError } from '@/lib/domain-error';
import { exportFigure } from '@/lib/export/export-figure';
import { EXPORT_LIMITS, renderSvgInChild } from '@/lib/export/render-in-child';
import { viewSpecSchema } from '@/lib/charts/view-spec';
import { testDb, RUN_TAG } from '../helpers/db';
import { HttpClient, signedInClient } from '../helpers/http-client';
import { createTestTeam } from '../helpers/test-manuscripts';
import { smallResult } from './solver-results';

/** A view the schema allows (a calculate transform) whose expression builds an array of 1e8 numbers (about 800 MB). */
const HEAVY_VIEW = { transform: [{ calculate: 'length(sequence(0, 1e8))', as: 'heavy' }] };

let spectrum: Awaited<ReturnType<typeof smallResult>>;

beforeAll(async () => {
  spectrum = await smallResult('spectrum');
});

afterAll(async () => {
  await sqlClient.end({ timeout: 5 });
});

describe('export limits', () => {
  it('the heavy view passes the view-spec schema (only the export limits stop it)', () => {
    expect(viewSpecSchema.safeParse(HEAVY_VIEW).success).toBe(true);
  });

  it('refuses a view that exhausts the memory limit with a domain error, within the time limit, and exports normally after', async () => {
    const started = Date.now();
    const thrown = await exportFigure({ kind: 'spectrum', result: spectrum.result, params: spectrum.spec, viewSpec: HEAVY_VIEW, label: 'heavy', format: 'svg' }).then(
      () => null,
      (error: unknown) => error,
    );
    expect(isDomainError(thrown, 'invalid')).toBe(true);
    expect((thrown as Error).message).toMatch(/too heavy to export: it needed more than 256 MB of memory/);
    expect(Date.now() - started).toBeLessThan(EXPORT_LIMITS.timeMs + 5_000);
    const file = await exportFigure({ kind: 'spectrum', result: spectrum.result, params: spectrum.spec, label: 'light', format: 'png' });
    expect((file.body as Buffer).subarray(1, 4).toString()).toBe('PNG');
  }, 60_000);

  it('stops a render that takes longer than the time limit', async () => {
    const spec = { data: { values: [{ a: 1 }] }, mark: 'point' as const, encoding: { x: { field: 'a', type: 'quantitative' as const } } };
    await expect(renderSvgInChild(spec, {}, { ...EXPORT_LIMITS, timeMs: 1 })).rejects.toThrow(/too heavy to export: it took longer than 0.001 s/);
    await expect(renderSvgInChild(spec)).resolves.toMatchObject({ svg: expect.stringMatching(/^<svg/) });
  }, 60_000);
});

describe('export route with a heavy stored view', () => {
  let client: HttpClient;
  let heavyId: string;
  let lightId: string;

  beforeAll(async () => {
    const { manuscript, author } = await createTestTeam({ title: 'Export limits' });
    client = await signedInClient(author);
    const [result] = await testDb
      .insert(results)
      .values({ inputHash: `limits-${RUN_TAG}`, solverVersion: 'test', params: spectrum.spec, data: spectrum.result as Record<string, unknown>, diagnostics: {}, resultHash: `limits-${RUN_TAG}` })
      .returning();
    const snapshotOf = async (label: string, viewSpec: Record<string, unknown> | null) => {
      const [figure] = await testDb.insert(figures).values({ manuscriptId: manuscript.id, label, kind: 'spectrum', params: spectrum.spec }).returning();
      const [snapshot] = await testDb
        .insert(snapshots)
        .values({ figureId: figure.id, manuscriptId: manuscript.id, version: 1, kind: 'spectrum', label, caption: '', params: spectrum.spec, viewSpec, solverVersion: 'test', resultId: result.id, resultHash: result.resultHash })
        .returning();
      return snapshot.id;
    };
    heavyId = await snapshotOf(`heavy-${RUN_TAG}`, HEAVY_VIEW);
    lightId = await snapshotOf(`light-${RUN_TAG}`, null);
  }, 60_000);

  it('answers 400 with the reason and keeps serving exports', async () => {
    const heavy = await client.json('GET', `/api/snapshots/${heavyId}/export?format=svg`);
    expect(heavy.status).toBe(400);
    expect(heavy.body.error).toMatch(/too heavy to export: it needed more than 256 MB of memory/);
    const light = await client.fetch(`/api/snapshots/${lightId}/export?format=svg`);
    // Status and the start of the body together, so a refusal shows its reason.
    expect(`${light.status} ${(await light.text()).slice(0, 300)}`).toMatch(/^200 <svg/);
  }, 90_000);
});
