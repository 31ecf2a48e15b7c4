// The figure-notes API end to end against the running app (APP_URL, started by scripts/test.sh) and a real worker:
// an author creates a note and a figure, starts a run, freezes v1, downloads the bundle; a repeated run comes from
// the cache; unsafe MDX is refused naming the line; a coauthor reads but cannot edit, run or freeze; outsiders and
// unknown ids get the same 404.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sqlClient } from '@/db';
import { getResultById } from '@/db/queries/results';
import { getSnapshotById } from '@/db/queries/snapshots';
import { exportFigure } from '@/lib/export/export-figure';
import { DEFAULT_ASPECT } from '@/lib/export/widths';
import { RUN_QUEUE } from '@/lib/jobs/queue';
import { HttpClient, signedInClient } from '../helpers/http-client';
import { createTestTeam, type TestTeam } from '../helpers/test-manuscripts';
import { SMALL_SPECTRUM, waitFor } from './fixtures';
import { startWorker, type WorkerProcess } from './worker-process';

let team: TestTeam;
let author: HttpClient;
let coauthor: HttpClient;
let outsider: HttpClient;
let worker: WorkerProcess | null = null;
const ids: { figure?: string; run?: string; snapshot?: string; note?: string } = {};

describe('figure-notes API', () => {
  beforeAll(async () => {
    team = await createTestTeam({ title: 'Runs API' });
    [author, coauthor, outsider] = await Promise.all(
      [team.author, team.coauthor, team.outsider].map((user) => signedInClient(user)),
    );
    // The app queues on its default queue; this worker serves it (another worker of the test run may too).
    worker = startWorker(process.env.FLUXFOLIO_APP_RUN_QUEUE ?? RUN_QUEUE);
    await worker.waitForLine(/ready: queue/);
  });

  afterAll(async () => {
    if (worker && worker.child.exitCode === null) {
      worker.child.kill('SIGTERM');
      await worker.exited;
    }
    await sqlClient.end({ timeout: 5 });
  });

  it('refuses unsafe MDX at save time with a message naming the line', async () => {
    const created = await author.fetch(`/api/manuscripts/${team.manuscript.id}/notes`, {
      method: 'POST',
      json: { title: 'Spectral flow', source: 'Intro with $\\alpha$.\n\n<Figure label="flow" />\n' },
    });
    expect(created.status).toBe(201);
    const { note } = (await created.json()) as { note: { id: string; revision: number } };
    ids.note = note.id;

    for (const [source, line] of [
      ['Intro\n\nimport fs from "node:fs"\n', 3],
      ['Intro\n\n\n# Title {process.exit()}\n', 4],
      ['export const x = 1\n', 1],
    ] as const) {
      const response = await author.fetch(`/api/notes/${note.id}`, { method: 'PUT', json: { title: 'Spectral flow', source } });
      expect(response.status).toBe(400);
      const body = (await response.json()) as { error: string; lines: { line: number }[] };
      expect(body.error).toContain(`line ${line}`);
      expect(body.lines[0].line).toBe(line);
    }
    const saved = await author.fetch(`/api/notes/${note.id}`, {
      method: 'PUT',
      json: { title: 'Spectral flow', source: 'Second draft.\n\n<Figure label="flow" version={1} />\n', baseRevision: 1 },
    });
    expect(saved.status).toBe(200);
    expect(((await saved.json()) as { note: { revision: number } }).note.revision).toBe(2);
    const history = await author.fetch(`/api/notes/${note.id}/revisions`);
    expect(((await history.json()) as { revisions: unknown[] }).revisions).toHaveLength(2);
    const pair = await author.fetch(`/api/notes/${note.id}/revisions?from=1&to=2`);
    expect(pair.status).toBe(200);
  });

  it('creates a figure, runs it, freezes v1 and serves the bundle', async () => {
    const bad = await author.fetch(`/api/manuscripts/${team.manuscript.id}/figures`, {
      method: 'POST',
      json: { label: 'flow', kind: 'spectrum', params: { ...SMALL_SPECTRUM, grid: { h: -1 } } },
    });
    expect(bad.status).toBe(400);
    expect(((await bad.json()) as { fields: Record<string, string[]> }).fields['params.grid.h']).toBeTruthy();

    const params = { ...SMALL_SPECTRUM, grid: { h: 0.1, offset: [0.043, 0.011] } };
    const created = await author.fetch(`/api/manuscripts/${team.manuscript.id}/figures`, {
      method: 'POST',
      json: { label: 'flow', kind: 'spectrum', caption: 'Levels', params },
    });
    expect(created.status).toBe(201);
    ids.figure = ((await created.json()) as { figure: { id: string } }).figure.id;

    const started = await author.fetch(`/api/figures/${ids.figure}/runs`, { method: 'POST' });
    expect(started.status).toBe(202);
    const { run } = (await started.json()) as { run: { id: string } };
    ids.run = run.id;
    const finished = await waitFor(
      'the run to finish',
      async () => {
        const response = await author.fetch(`/api/runs/${run.id}`);
        const body = (await response.json()) as { run: { status: string; error: string | null }; result: { data: unknown } | null };
        return ['succeeded', 'failed', 'cancelled'].includes(body.run.status) ? body : undefined;
      },
      { timeoutMs: 120_000, intervalMs: 300 },
    );
    expect(finished.run.error).toBeNull();
    expect(finished.run.status).toBe('succeeded');
    expect(finished.result?.data).toMatchObject({ levels: expect.any(Array) });

    const frozen = await author.fetch(`/api/runs/${run.id}/freeze`, { method: 'POST' });
    expect(frozen.status).toBe(201);
    const { snapshot } = (await frozen.json()) as { snapshot: { id: string; version: number; resultHash: string } };
    expect(snapshot.version).toBe(1);
    ids.snapshot = snapshot.id;

    const bundle = await author.fetch(`/api/snapshots/${snapshot.id}/bundle`);
    expect(bundle.status).toBe(200);
    expect(bundle.headers.get('content-disposition')).toContain('flow-v1.json');
    expect((await bundle.json()) as object).toMatchObject({ format: 'fluxfolio-snapshot-bundle', resultHash: snapshot.resultHash });
    const csv = await author.fetch(`/api/snapshots/${snapshot.id}/bundle?format=csv`);
    expect(csv.headers.get('content-type')).toContain('text/csv');
    expect((await csv.text()).startsWith('table,row,column,value')).toBe(true);

    const again = await author.fetch(`/api/figures/${ids.figure}/runs`, { method: 'POST' });
    expect(again.status).toBe(202);
    expect((await again.json()) as object).toMatchObject({ fromCache: true, run: { status: 'succeeded', fromCache: true } });
  });

  it('exports the snapshot through exportFigure with the one export query', async () => {
    const snapshot = await getSnapshotById({ id: ids.snapshot! });
    const result = snapshot && (await getResultById({ id: snapshot.resultId }));
    expect(result).toBeTruthy();
    const svg = await author.fetch(`/api/snapshots/${ids.snapshot}/export?format=svg&width=two-column&units=physical&L=40`);
    expect(svg.status).toBe(200);
    expect(svg.headers.get('content-disposition')).toContain('flow-v1.svg');
    const expected = await exportFigure({
      kind: snapshot!.kind,
      result: result!.data,
      params: snapshot!.params,
      viewSpec: snapshot!.viewSpec,
      label: snapshot!.label,
      version: snapshot!.version,
      format: 'svg',
      width: 'two-column',
      units: { system: 'physical', lengthNm: 40, effectiveMass: 0.067 },
      aspect: DEFAULT_ASPECT,
    });
    expect(await svg.text()).toBe(expected.body);
    const pdf = await author.fetch(`/api/snapshots/${ids.snapshot}/export`);
    expect(pdf.headers.get('content-type')).toBe('application/pdf');
    expect(pdf.headers.get('content-disposition')).toContain('flow-v1.pdf');
    const csv = await author.fetch(`/api/snapshots/${ids.snapshot}/export?format=csv`);
    expect(csv.headers.get('content-type')).toContain('text/csv');
    expect((await csv.text()).startsWith('table,row,column,value')).toBe(true);

    const bad = await author.fetch(`/api/snapshots/${ids.snapshot}/export?format=gif&width=one&units=physical&L=abc`);
    expect(bad.status).toBe(400);
    const { fields } = (await bad.json()) as { fields: Record<string, string[]> };
    expect(Object.keys(fields).sort()).toEqual(['format', 'width']);
    const badUnits = await author.fetch(`/api/snapshots/${ids.snapshot}/export?format=svg&units=physical&L=abc`);
    expect(badUnits.status).toBe(400);
    expect(Object.keys(((await badUnits.json()) as { fields: Record<string, string[]> }).fields)).toEqual(['L']);
    const unknownKey = await author.fetch(`/api/snapshots/${ids.snapshot}/export?format=svg&dpi=1200`);
    expect(unknownKey.status).toBe(400);
  });

  it('lets a coauthor read but not edit, run or freeze', async () => {
    expect((await coauthor.fetch(`/api/manuscripts/${team.manuscript.id}/figures`)).status).toBe(200);
    expect((await coauthor.fetch(`/api/figures/${ids.figure}`)).status).toBe(200);
    expect((await coauthor.fetch(`/api/snapshots/${ids.snapshot}`)).status).toBe(200);
    expect((await coauthor.fetch(`/api/figures/${ids.figure}/runs`, { method: 'POST' })).status).toBe(403);
    expect((await coauthor.fetch(`/api/runs/${ids.run}/freeze`, { method: 'POST' })).status).toBe(403);
    expect((await coauthor.fetch(`/api/runs/${ids.run}/cancel`, { method: 'POST' })).status).toBe(403);
    expect((await coauthor.fetch(`/api/figures/${ids.figure}`, { method: 'PATCH', json: { caption: 'x' } })).status).toBe(403);
    expect(
      (await coauthor.fetch(`/api/notes/${ids.note}`, { method: 'PUT', json: { title: 't', source: 'changed' } })).status,
    ).toBe(403);
    expect(
      (await coauthor.fetch(`/api/manuscripts/${team.manuscript.id}/figures`, {
        method: 'POST',
        json: { label: 'x', kind: 'spectrum', params: SMALL_SPECTRUM },
      })).status,
    ).toBe(403);
  });

  it('answers 404 alike for foreign and unknown ids, and 401 without a session', async () => {
    const unknown = '00000000-0000-4000-8000-000000000000';
    for (const [foreign, missing] of [
      [`/api/figures/${ids.figure}`, `/api/figures/${unknown}`],
      [`/api/runs/${ids.run}`, `/api/runs/${unknown}`],
      [`/api/snapshots/${ids.snapshot}`, `/api/snapshots/${unknown}`],
      [`/api/snapshots/${ids.snapshot}/bundle`, `/api/snapshots/${unknown}/bundle`],
      [`/api/notes/${ids.note}`, `/api/notes/${unknown}`],
      [`/api/manuscripts/${team.manuscript.id}/figures`, `/api/manuscripts/${unknown}/figures`],
    ]) {
      const a = await outsider.fetch(foreign);
      const b = await outsider.fetch(missing);
      expect(a.status).toBe(404);
      expect(b.status).toBe(404);
      expect(await a.json()).toEqual(await b.json());
    }
    expect((await outsider.fetch('/api/figures/not-a-uuid')).status).toBe(400);
    expect((await new HttpClient().fetch(`/api/figures/${ids.figure}`)).status).toBe(401);
  });
});
