// The reproduce command end to end: a real snapshot's bundle written to a file verifies (exit 0); a bundle whose
// data was changed does not (exit 1, with a summary); unreadable or invalid bundles exit 2 with a message.
import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sqlClient } from '@/db';
import { getResultById } from '@/db/queries/results';
import { getSnapshotContext } from '@/db/queries/snapshots';
import { executeRun } from '@/lib/jobs/run-job';
import { startRun } from '@/lib/runs/start-run';
import { snapshotBundle, type SnapshotBundle } from '@/lib/snapshots/bundle';
import { freezeRun } from '@/lib/snapshots/freeze';
import { createTestFigure, createWorld, SMALL_SPECTRUM } from './fixtures';

const ROOT = path.resolve(__dirname, '../..');
let dir: string;
let bundle: SnapshotBundle;

function reproduce(file: string) {
  const result = spawnSync(process.execPath, ['--import', 'tsx', 'scripts/reproduce.ts', file], {
    cwd: ROOT,
    encoding: 'utf8',
    timeout: 120_000,
  });
  return { code: result.status, stdout: result.stdout, stderr: result.stderr };
}

function write(name: string, content: string): string {
  const file = path.join(dir, name);
  writeFileSync(file, content);
  return file;
}

beforeAll(async () => {
  dir = mkdtempSync(path.join(tmpdir(), 'fluxfolio-reproduce-'));
  const world = await createWorld('author');
  const figure = await createTestFigure(world, { ...SMALL_SPECTRUM, levels: 5 });
  const { run } = await startRun({ figure, user: world.user, enqueue: null });
  if (run.status !== 'succeeded') await executeRun(run.id);
  const snapshot = await freezeRun({ runId: run.id, user: world.user });
  const context = await getSnapshotContext({ id: snapshot.id });
  bundle = JSON.parse(JSON.stringify(snapshotBundle(snapshot, (await getResultById({ id: snapshot.resultId }))!, context!)));
});

afterAll(async () => {
  await sqlClient.end({ timeout: 5 });
});

describe('npm run reproduce', () => {
  it('exits 0 when the recomputed hash is identical', () => {
    const out = reproduce(write('good.json', JSON.stringify(bundle, null, 2)));
    expect(out.stderr).toContain('reproduce:');
    expect(out.stdout).toMatch(/^identical/);
    expect(out.stdout).toContain(bundle.resultHash);
    expect(out.code).toBe(0);
  });

  it('exits 1 with the fields and the largest relative difference when the data differs', () => {
    const tampered = JSON.parse(JSON.stringify(bundle)) as SnapshotBundle;
    (tampered.data.levels as number[])[0] += 0.5;
    const out = reproduce(write('tampered.json', JSON.stringify(tampered)));
    expect(out.code).toBe(1);
    expect(out.stdout).toMatch(/DIFFERENT/);
    expect(out.stdout).toMatch(/fields that differ \(1\): levels\[\]/);
    expect(out.stdout).toMatch(/largest relative difference: [0-9.e+-]+ at levels\[0\]/);
  });

  it('exits 1 when the recorded hash is not the hash of the result', () => {
    const forged = { ...bundle, resultHash: '0'.repeat(64) };
    const out = reproduce(write('forged.json', JSON.stringify(forged)));
    expect(out.code).toBe(1);
    expect(out.stdout).toMatch(/DIFFERENT/);
  });

  it('exits 2 for a missing file, malformed JSON, a non-bundle and invalid parameters', () => {
    const missing = reproduce(path.join(dir, 'no-such-file.json'));
    expect(missing.code).toBe(2);
    expect(missing.stderr).toMatch(/cannot read/);

    const malformed = reproduce(write('malformed.json', '{"format": '));
    expect(malformed.code).toBe(2);
    expect(malformed.stderr).toMatch(/not valid JSON/);

    const notBundle = reproduce(write('other.json', JSON.stringify({ hello: 'world' })));
    expect(notBundle.code).toBe(2);
    expect(notBundle.stderr).toMatch(/format/);

    const badParams = reproduce(write('bad-params.json', JSON.stringify({ ...bundle, params: { ...bundle.params, grid: { h: 0 } } })));
    expect(badParams.code).toBe(2);
    expect(badParams.stderr).toMatch(/params\.grid\.h/);
  });
});
