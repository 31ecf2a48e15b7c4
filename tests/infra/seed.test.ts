// The demo seed on scratch databases of their own (made and migrated as the owner role, seeded as the app role): four
// invented people with working passwords, one draft manuscript with three memberships (the site admin is not a member);
// a second run and a database that already has any user are left untouched.
import { spawnSync } from 'node:child_process';
import { and, count, eq } from 'drizzle-orm';
import { drizzle } from 'drizzle-orm/postgres-js';
import postgres from 'postgres';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Db } from '@/db';
import { DEMO_ACCOUNTS, DEMO_MANUSCRIPT, demoAccount } from '@/db/demo-accounts';
import { dropDatabase, ensureDatabase } from '@/db/ensure-database';
import { migrateDatabase } from '@/db/migrate';
import * as schema from '@/db/schema';
import { manuscripts, memberships, users } from '@/db/schema';
import { roleOf } from '@/db/app-role';
import { databaseUrl } from '@/db';
import { seedDemo } from '@/db/seed';
import { verifyPassword } from '@/lib/auth/password';
import { ownerDatabaseUrl, testDatabaseName } from '../helpers/db';

/** The test server's URL for another database, as the owner (create, migrate) or as the app role (seed). */
function scratch(name: string, base: string): string {
  const url = new URL(base);
  url.pathname = `/${name}`;
  return url.toString();
}
const scratchName = `fluxfolio_seedtest_${process.pid}`;
const scratchUrl = scratch(scratchName, databaseUrl());
const scratchOwnerUrl = scratch(scratchName, ownerDatabaseUrl());
const inUseName = `fluxfolio_seedinuse_${process.pid}`;
const inUseUrl = scratch(inUseName, databaseUrl());
const inUseOwnerUrl = scratch(inUseName, ownerDatabaseUrl());
const appRole = roleOf(databaseUrl());

let client: postgres.Sql;
let db: Db;

async function counts() {
  const [u] = await db.select({ n: count() }).from(users);
  const [m] = await db.select({ n: count() }).from(manuscripts);
  const [ms] = await db.select({ n: count() }).from(memberships);
  return { users: u.n, manuscripts: m.n, memberships: ms.n };
}

beforeAll(async () => {
  expect(testDatabaseName()).not.toBe(scratchName);
  await ensureDatabase(scratchOwnerUrl, { recreate: true });
  await migrateDatabase(scratchOwnerUrl, { appRole });
  client = postgres(scratchUrl, { max: 2, onnotice: () => {} });
  db = drizzle(client, { schema }) as unknown as Db;
});

afterAll(async () => {
  await client?.end({ timeout: 5 });
  await dropDatabase(scratchOwnerUrl);
  await dropDatabase(inUseOwnerUrl);
});

describe('demo seed', () => {
  it('seeds four people, one draft manuscript and three memberships into an empty database', async () => {
    const summary = await seedDemo(db, { notes: false });
    expect(summary.seeded).toBe(true);
    expect(await counts()).toEqual({ users: 4, manuscripts: 1, memberships: 3 });

    const [manuscript] = await db.select().from(manuscripts);
    expect(manuscript).toMatchObject({ slug: DEMO_MANUSCRIPT.slug, status: 'draft', title: DEMO_MANUSCRIPT.title });
    expect(manuscript.abstract).toMatch(/Aharonov–Bohm/);

    for (const role of ['owner', 'author', 'coauthor'] as const) {
      const [row] = await db
        .select({ role: memberships.role })
        .from(memberships)
        .innerJoin(users, eq(users.id, memberships.userId))
        .where(and(eq(users.email, demoAccount(role).email), eq(memberships.manuscriptId, manuscript.id)));
      expect(row?.role).toBe(role);
    }
    const admin = summary.people!['site-admin'];
    expect(admin.isAdmin).toBe(true);
    expect(await db.select().from(memberships).where(eq(memberships.userId, admin.id))).toEqual([]);
    expect(manuscript.createdById).toBe(summary.people!.owner.id);
  });

  it('stores bcrypt hashes that accept the demo passwords and nothing else', async () => {
    for (const account of DEMO_ACCOUNTS) {
      const [row] = await db.select().from(users).where(eq(users.email, account.email));
      expect(row.passwordHash).toMatch(/^\$2[aby]\$10\$/);
      expect(await verifyPassword(account.password, row.passwordHash!)).toBe(true);
      expect(await verifyPassword(`${account.password}x`, row.passwordHash!)).toBe(false);
    }
  });

  it('does nothing the second time', async () => {
    const before = await counts();
    const again = await seedDemo(db, { notes: false });
    expect(again.seeded).toBe(false);
    expect(again.reason).toMatch(/already has 4 user\(s\)/);
    expect(await counts()).toEqual(before);
  });

  it('never seeds a database in use: one ordinary user is enough to leave it untouched', async () => {
    await ensureDatabase(inUseOwnerUrl, { recreate: true });
    await migrateDatabase(inUseOwnerUrl, { appRole });
    const inUse = postgres(inUseUrl, { max: 1, onnotice: () => {} });
    try {
      const inUseDb = drizzle(inUse, { schema }) as unknown as Db;
      await inUseDb.insert(users).values({ email: 'someone.real@research.example.org', name: 'Someone Real' });
      const summary = await seedDemo(inUseDb, { notes: false });
      expect(summary.seeded).toBe(false);
      expect(summary.reason).toMatch(/already has 1 user\(s\)/);
      const [u] = await inUseDb.select({ n: count() }).from(users);
      const [m] = await inUseDb.select({ n: count() }).from(manuscripts);
      expect({ users: u.n, manuscripts: m.n }).toEqual({ users: 1, manuscripts: 0 });
      const demo = await inUseDb.select().from(users).where(eq(users.email, DEMO_ACCOUNTS[0].email));
      expect(demo).toEqual([]);
    } finally {
      await inUse.end({ timeout: 5 });
    }
  });

  it('the command line skips a database that has users and rejects unknown options with exit 2', () => {
    const env = { ...process.env, DATABASE_URL: scratchUrl };
    const skipped = spawnSync('node_modules/.bin/tsx', ['db/seed.ts', '--no-notes'], { env, encoding: 'utf8' });
    expect(skipped.status).toBe(0);
    expect(skipped.stdout).toMatch(/\[seed\] skipped/);
    const bad = spawnSync('node_modules/.bin/tsx', ['db/seed.ts', '--bogus'], { env, encoding: 'utf8' });
    expect(bad.status).toBe(2);
    expect(bad.stderr).toMatch(/unknown option --bogus/);
    // There is no way to force the demo into a database that has users.
    const forced = spawnSync('node_modules/.bin/tsx', ['db/seed.ts', '--force'], { env, encoding: 'utf8' });
    expect(forced.status).toBe(2);
    expect(forced.stderr).toMatch(/unknown option --force/);
  });
});
