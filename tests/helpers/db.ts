// Test database access: the app's Drizzle instance on DATABASE_URL (the test database made by scripts/test.sh) and
// helpers that create users, manuscripts and memberships with unique e-mails and slugs, so tests never collide.
import bcrypt from 'bcryptjs';
import { db } from '@/db';
import { databaseUrl } from '@/db';
import { manuscripts, memberships, users, type Manuscript, type ManuscriptStatus, type MemberRole } from '@/db/schema';

/** The test database as the owner role (DATABASE_OWNER_URL from scripts/test.sh), for checks that need the owner. */
export function ownerDatabaseUrl(): string {
  return process.env.DATABASE_OWNER_URL || databaseUrl();
}

/** The dev database that tests must never write to. */
const DEV_DATABASE_NAME = 'fluxfolio';

/** Name of the database the tests use (from DATABASE_URL). */
export function testDatabaseName(): string {
  return decodeURIComponent(new URL(databaseUrl()).pathname.slice(1));
}

if (testDatabaseName() === DEV_DATABASE_NAME && process.env.FLUXFOLIO_ALLOW_DEV_DB !== '1') {
  throw new Error(
    'tests/helpers/db: DATABASE_URL points at the dev database "fluxfolio". Run the tests through `npm test` ' +
      '(it creates fluxfolio_test), or set DATABASE_URL to a test database.',
  );
}

/** The Drizzle instance the tests share with the code under test (same pool). */
export const testDb = db;

/** A tag unique to this test process: a base-36 time stamp and the pid. Rows from earlier runs never collide. */
export const RUN_TAG = `${Date.now().toString(36)}${process.pid.toString(36)}`;
let counter = 0;

/** A fresh unique suffix such as `m3x1k2a9-7`. */
export function uniqueTag(): string {
  counter += 1;
  return `${RUN_TAG}-${counter}`;
}

/** The password every test user gets unless one is given. */
export const TEST_PASSWORD = 'test-password-flux';
// bcrypt cost 4 (its minimum) keeps the suite quick; verification reads the cost from the hash, so the app checks it as usual.
const TEST_BCRYPT_COST = 4;
const hashCache = new Map<string, string>();

function testHash(password: string): string {
  let hash = hashCache.get(password);
  if (!hash) {
    hash = bcrypt.hashSync(password, TEST_BCRYPT_COST);
    hashCache.set(password, hash);
  }
  return hash;
}

export interface TestUser {
  id: string;
  name: string;
  email: string;
  password: string;
  isAdmin: boolean;
}

/**
 * Create a user who can sign in with a password.
 *
 * @param options.role - 'admin' for a site administrator, 'user' (default) otherwise
 * @param options.label - a word put into the e-mail and name (default 'user'), handy when reading failures
 * @param options.password - default {@link TEST_PASSWORD}
 * @example
 * const admin = await createTestUser({ role: 'admin' });
 */
export async function createTestUser({
  role = 'user',
  label = role,
  name,
  password = TEST_PASSWORD,
}: { role?: 'user' | 'admin'; label?: string; name?: string; password?: string } = {}): Promise<TestUser> {
  const tag = uniqueTag();
  const email = `${label}.${tag}@tests.fluxfolio.example.org`.toLowerCase();
  const [row] = await db
    .insert(users)
    .values({
      name: name ?? `${label[0]?.toUpperCase() ?? 'T'}${label.slice(1)} Tester ${tag}`,
      email,
      emailVerified: new Date(),
      passwordHash: testHash(password),
      isAdmin: role === 'admin',
    })
    .returning();
  return { id: row.id, name: row.name ?? '', email: row.email, password, isAdmin: row.isAdmin };
}

/**
 * Create a manuscript with a unique slug; with `owner`, that user becomes its owner (membership + creator).
 *
 * @example
 * const manuscript = await createTestManuscript({ owner });
 */
export async function createTestManuscript({
  owner,
  title = 'Test manuscript',
  status = 'draft',
  archived = false,
}: { owner?: { id: string }; title?: string; status?: ManuscriptStatus; archived?: boolean } = {}): Promise<Manuscript> {
  const tag = uniqueTag();
  const [manuscript] = await db
    .insert(manuscripts)
    .values({
      title: `${title} ${tag}`,
      slug: `${title.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '') || 'manuscript'}-${tag}`,
      abstract: 'An abstract written by a test.',
      status,
      archivedAt: archived ? new Date() : null,
      createdById: owner?.id ?? null,
    })
    .returning();
  if (owner) await addTestMember({ manuscriptId: manuscript.id, userId: owner.id, role: 'owner' });
  return manuscript;
}

/** Make a user a member of a manuscript in a role. */
export async function addTestMember({
  manuscriptId,
  userId,
  role,
}: {
  manuscriptId: string;
  userId: string;
  role: MemberRole;
}): Promise<void> {
  await db.insert(memberships).values({ manuscriptId, userId, role });
}

export interface TestTeam {
  manuscript: Manuscript;
  owner: TestUser;
  author: TestUser;
  coauthor: TestUser;
  /** A site admin who is not a member. */
  admin: TestUser;
  /** Signed-in user with no membership. */
  outsider: TestUser;
}

/**
 * A manuscript with an owner, an author and a coauthor, plus a non-member site admin and an outsider.
 *
 * @example
 * const { manuscript, author } = await createTestTeam();
 */
export async function createTestTeam({ title = 'Team manuscript' }: { title?: string } = {}): Promise<TestTeam> {
  const owner = await createTestUser({ label: 'owner' });
  const author = await createTestUser({ label: 'author' });
  const coauthor = await createTestUser({ label: 'coauthor' });
  const admin = await createTestUser({ role: 'admin', label: 'admin' });
  const outsider = await createTestUser({ label: 'outsider' });
  const manuscript = await createTestManuscript({ owner, title });
  await addTestMember({ manuscriptId: manuscript.id, userId: author.id, role: 'author' });
  await addTestMember({ manuscriptId: manuscript.id, userId: coauthor.id, role: 'coauthor' });
  return { manuscript, owner, author, coauthor, admin, outsider };
}
