// Demo data for a fresh install: the invented group's four people, their draft manuscript with three memberships,
// and the demo figure notes. Runs only on a database without any user (the demo accounts have published passwords).
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import { count, eq, sql } from 'drizzle-orm';
import { drizzle } from 'drizzle-orm/postgres-js';
import postgres from 'postgres';
import { hashPassword } from '@/lib/auth/password';
import { DEMO_ACCOUNTS, DEMO_MANUSCRIPT, type DemoAccount } from './demo-accounts';
import type { Db } from './index';
import * as schema from './schema';
import { manuscripts, memberships, users, type Manuscript, type User } from './schema';

const DEFAULT_DATABASE_URL = 'postgres://fluxfolio_app@127.0.0.1:54329/fluxfolio';

/** The seeded demo people, by their demo role. */
export type DemoPeople = Record<DemoAccount['role'], User>;

export interface SeedSummary {
  seeded: boolean;
  reason?: string;
  people?: DemoPeople;
  manuscript?: Manuscript;
  notes?: number;
  snapshots?: number;
}

/** How many users the database has (the seed runs only on an empty one). */
export async function countUsers(db: Db): Promise<number> {
  const [row] = await db.select({ n: count() }).from(users);
  return row?.n ?? 0;
}

/**
 * Create the four demo people (looked up by e-mail: existing rows are left untouched).
 *
 * @param db - the database to seed
 * @returns the rows keyed by demo role ('owner', 'author', 'coauthor', 'site-admin')
 */
export async function seedPeople(db: Db): Promise<DemoPeople> {
  const people = {} as DemoPeople;
  for (const account of DEMO_ACCOUNTS) {
    const email = account.email.toLowerCase();
    const [existing] = await db.select().from(users).where(eq(users.email, email)).limit(1);
    if (existing) {
      people[account.role] = existing;
      continue;
    }
    const [created] = await db
      .insert(users)
      .values({
        name: account.name,
        email,
        emailVerified: new Date(),
        passwordHash: await hashPassword(account.password),
        isAdmin: account.isAdmin,
      })
      .onConflictDoNothing({ target: users.email })
      .returning();
    people[account.role] = created ?? (await db.select().from(users).where(eq(users.email, email)).limit(1))[0];
  }
  return people;
}

/**
 * Create the demo manuscript (looked up by slug) and the owner, author and coauthor memberships.
 * The site admin is deliberately not a member.
 *
 * @param db - the database to seed
 * @param people - from {@link seedPeople}
 */
export async function seedManuscript(db: Db, people: DemoPeople): Promise<Manuscript> {
  let [manuscript] = await db.select().from(manuscripts).where(eq(manuscripts.slug, DEMO_MANUSCRIPT.slug)).limit(1);
  if (!manuscript) {
    [manuscript] = await db
      .insert(manuscripts)
      .values({ ...DEMO_MANUSCRIPT, createdById: people.owner.id })
      .onConflictDoNothing({ target: manuscripts.slug })
      .returning();
    manuscript ??= (await db.select().from(manuscripts).where(eq(manuscripts.slug, DEMO_MANUSCRIPT.slug)).limit(1))[0];
  }
  await seedMemberships(db, manuscript, people);
  return manuscript;
}

async function seedMemberships(db: Db, manuscript: Manuscript, people: DemoPeople): Promise<void> {
  const roles = ['owner', 'author', 'coauthor'] as const;
  await db
    .insert(memberships)
    .values(roles.map((role) => ({ manuscriptId: manuscript.id, userId: people[role].id, role })))
    .onConflictDoNothing();
}

/**
 * The demo figure notes, computed by the real solver and frozen as v1 (module of the figure-notes step).
 * Imported lazily so that people and manuscript are seeded even while that module is unavailable.
 */
export async function seedNotes(db: Db, manuscript: Manuscript, people: DemoPeople): Promise<{ notes: number; snapshots: number }> {
  const { seedFigureNotes } = await import('@/lib/demo/seed-figure-notes');
  return seedFigureNotes({ db, manuscriptId: manuscript.id, authorId: people.author.id });
}

/** Advisory lock key of the seed ('ffseed' in ASCII), so that two starts at once cannot both seed. */
const SEED_LOCK_KEY = 0x666673656564;

/**
 * Seed the whole demo, only into a database without users: a database in use is never touched, because the demo
 * accounts (a site admin among them) have passwords printed in the README. People and manuscript are written in one
 * transaction under an advisory lock; the figure notes follow.
 *
 * @param db - the database to seed
 * @param options.notes - also seed the demo figure notes (default true)
 * @example
 * const summary = await seedDemo(db); // { seeded: true, people, manuscript, notes: 4, snapshots: 4 }
 */
export async function seedDemo(db: Db, { notes = true } = {}): Promise<SeedSummary> {
  const base = await db.transaction(async (tx) => {
    await tx.execute(sql`SELECT pg_advisory_xact_lock(${SEED_LOCK_KEY})`);
    const existing = await countUsers(tx as unknown as Db);
    if (existing > 0) return { existing };
    const people = await seedPeople(tx as unknown as Db);
    const manuscript = await seedManuscript(tx as unknown as Db, people);
    return { people, manuscript };
  });
  if ('existing' in base) {
    return { seeded: false, reason: `the database already has ${base.existing} user(s); the demo is only seeded into an empty one` };
  }
  const { people, manuscript } = base;
  if (!notes) return { seeded: true, people, manuscript };
  try {
    const counts = await seedNotes(db, manuscript, people);
    return { seeded: true, people, manuscript, ...counts };
  } catch (error) {
    const reason = error instanceof Error ? error.message : String(error);
    throw new Error(
      `demo figure notes failed: ${reason}\n(people and manuscript are seeded; after fixing, drop the demo database ` +
        '(`bash scripts/pg.sh drop-db fluxfolio`) and run `npm run app` again)',
      { cause: error },
    );
  }
}

const OPTIONS = ['--no-notes'];

async function main(argv: string[]): Promise<number> {
  const unknown = argv.filter((a) => !OPTIONS.includes(a));
  if (unknown.length > 0) {
    console.error(`db/seed: unknown option ${unknown.join(' ')} (use ${OPTIONS.join(', ')})`);
    return 2;
  }
  const client = postgres(process.env.DATABASE_URL || DEFAULT_DATABASE_URL, { max: 2, onnotice: () => {} });
  try {
    const db = drizzle(client, { schema }) as unknown as Db;
    const summary = await seedDemo(db, { notes: !argv.includes('--no-notes') });
    if (!summary.seeded) {
      console.log(`[seed] skipped: ${summary.reason}`);
      return 0;
    }
    console.log(`[seed] demo manuscript "${summary.manuscript?.title}" (/m/${summary.manuscript?.slug})`);
    if (summary.notes !== undefined) console.log(`[seed] figure notes added: ${summary.notes}, snapshots frozen: ${summary.snapshots}`);
    for (const account of DEMO_ACCOUNTS) console.log(`[seed]   ${account.role.padEnd(10)} ${account.email}  password: ${account.password}`);
    return 0;
  } finally {
    await client.end({ timeout: 5 });
  }
}

if (process.argv[1] && import.meta.url === pathToFileURL(path.resolve(process.argv[1])).href) {
  main(process.argv.slice(2)).then(
    (code) => process.exit(code),
    (error: unknown) => {
      console.error(`[seed] failed: ${error instanceof Error ? error.message : String(error)}`);
      if (error instanceof Error && error.cause instanceof Error && error.cause.stack) console.error(error.cause.stack);
      process.exit(1);
    },
  );
}
