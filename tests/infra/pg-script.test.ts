// scripts/pg.sh: argument checks, database URLs, and a whole private lifecycle (initdb, start, a second start that is a
// no-op, create/drop a database, stop, status 3 when down) on a spare port and data directory.
import { spawnSync } from 'node:child_process';
import { chmodSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';

const databaseUrl = new URL(process.env.DATABASE_URL || 'postgres://postgres@127.0.0.1:54329/fluxfolio_test');
const scratch = mkdtempSync(path.join(tmpdir(), 'ff-pgtest-'));
// The server runs as the unprivileged postgres user, which must be able to enter the scratch folder.
chmodSync(scratch, 0o755);

function pgScript(args: string[], env: Record<string, string> = {}) {
  const result = spawnSync('bash', ['scripts/pg.sh', ...args], {
    env: { ...process.env, PGPORT: databaseUrl.port || '5432', ...env },
    encoding: 'utf8',
  });
  return { status: result.status, out: `${result.stdout}${result.stderr}` };
}

/** A TCP port nobody listens on right now (the kernel picks it). */
async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = createServer();
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const { port } = server.address() as { port: number };
      server.close(() => resolve(port));
    });
  });
}

afterAll(() => rmSync(scratch, { recursive: true, force: true }));

describe('scripts/pg.sh', () => {
  it('rejects a missing command and a bad database name with exit 2', () => {
    expect(pgScript([]).status).toBe(2);
    const bad = pgScript(['ensure-db', 'Robert";DROP']);
    expect(bad.status).toBe(2);
    expect(bad.out).toMatch(/invalid database name/);
    expect(pgScript(['drop-db', 'postgres']).status).toBe(2);
  });

  it('prints the URL of a database on its port', () => {
    const { status, out } = pgScript(['url', 'some_db'], { PGPORT: '54999' });
    expect(status).toBe(0);
    expect(out.trim()).toBe('postgres://postgres@127.0.0.1:54999/some_db');
  });

  it('initialises, starts, reuses, serves databases, stops and reports down on a private port', async () => {
    const port = String(await freePort());
    const env = { PGPORT: port, PGDATA: path.join(scratch, 'data'), FLUXFOLIO_PG_FAST: '1' };
    const marker = path.join(scratch, 'marker-private');
    try {
      expect(pgScript(['status'], env).status).toBe(3);

      const first = pgScript(['start'], { ...env, FLUXFOLIO_PG_MARKER: marker });
      expect(first.status, first.out).toBe(0);
      expect(first.out).toMatch(/initialising a new cluster/);
      expect(readFileSync(marker, 'utf8').trim()).toBe('started');
      expect(pgScript(['status'], env).status).toBe(0);

      const second = pgScript(['start'], { ...env, FLUXFOLIO_PG_MARKER: marker });
      expect(second.status).toBe(0);
      expect(second.out).toMatch(/already running .* nothing to do/);
      expect(readFileSync(marker, 'utf8').trim()).toBe('reused');

      expect(pgScript(['ensure-db', 'ff_pgtest'], env).out).toMatch(/created database ff_pgtest/);
      expect(pgScript(['ensure-db', 'ff_pgtest'], env).out).toMatch(/database ff_pgtest exists/);
      expect(pgScript(['drop-db', 'ff_pgtest'], env).status).toBe(0);
    } finally {
      const stop = pgScript(['stop'], env);
      expect(stop.status, stop.out).toBe(0);
      expect(stop.out).toMatch(/stopped/);
    }
    expect(pgScript(['status'], env).status).toBe(3);
    expect(pgScript(['stop'], env).out).toMatch(/nothing to stop/);
  });
});
