// The test database is migrated: every table of db/schema.ts exists, drizzle recorded every committed migration,
// and the snapshot immutability triggers are installed.
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { sql } from 'drizzle-orm';
import postgres from 'postgres';
import { describe, expect, it } from 'vitest';
import { ownerDatabaseUrl, testDb } from '../helpers/db';

const TABLES = [
  'users',
  'accounts',
  'sessions',
  'verification_tokens',
  'manuscripts',
  'memberships',
  'invitations',
  'notes',
  'note_revisions',
  'figures',
  'results',
  'runs',
  'snapshots',
];

describe('migrations', () => {
  it('created every table of the schema', async () => {
    const rows = await testDb.execute<{ table_name: string }>(
      sql`SELECT table_name FROM information_schema.tables WHERE table_schema = 'public'`,
    );
    const names = rows.map((r) => r.table_name);
    for (const table of TABLES) expect(names).toContain(table);
  });

  it('recorded every migration listed in the journal', async () => {
    const journal = JSON.parse(readFileSync(path.resolve('db/migrations/meta/_journal.json'), 'utf8')) as {
      entries: unknown[];
    };
    // drizzle's bookkeeping belongs to the owner role; the app role cannot read it.
    const owner = postgres(ownerDatabaseUrl(), { max: 1, onnotice: () => {} });
    try {
      const [row] = await owner<{ n: number }[]>`SELECT count(*)::int AS n FROM drizzle.__drizzle_migrations`;
      expect(row.n).toBe(journal.entries.length);
    } finally {
      await owner.end({ timeout: 5 });
    }
  });

  it('installed the snapshot immutability triggers', async () => {
    const rows = await testDb.execute<{ tgname: string }>(
      sql`SELECT tgname FROM pg_trigger WHERE tgrelid = 'public.snapshots'::regclass AND NOT tgisinternal`,
    );
    expect(rows.map((r) => r.tgname).sort()).toEqual(['snapshots_immutable', 'snapshots_no_truncate']);
  });
});
