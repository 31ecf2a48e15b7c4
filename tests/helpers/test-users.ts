// The one test-user type of the API, browser and runs tests, and the factory that creates such a user in the test
// database with a password hash, so every test can sign in as its own fresh person.
import bcrypt from 'bcryptjs';
import { users } from '@/db/schema';
import { testDb, uniqueTag } from './db';

/** A site role: 'admin' is a site administrator (who may act as owner everywhere), 'user' everyone else. */
export type SiteRole = 'user' | 'admin';

/** A person the tests created; `password` is the clear text they sign in with. */
export interface TestUser {
  id: string;
  email: string;
  password: string;
  name: string;
  role: SiteRole;
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

/**
 * Create a user who can sign in with a password, with a unique e-mail address.
 *
 * @param options.role - 'admin' for a site administrator, 'user' (default) otherwise
 * @param options.label - a word put into the e-mail and name (default the role), handy when reading failures
 * @param options.password - default {@link TEST_PASSWORD}
 * @example
 * const admin = await createTestUser({ role: 'admin', label: 'matrix-admin' });
 */
export async function createTestUser({
  role = 'user',
  label = role,
  name,
  password = TEST_PASSWORD,
}: { role?: SiteRole; label?: string; name?: string; password?: string } = {}): Promise<TestUser> {
  const tag = uniqueTag();
  const email = `${label}.${tag}@tests.fluxfolio.example.org`.toLowerCase();
  const [row] = await testDb
    .insert(users)
    .values({
      name: name ?? `${label[0]?.toUpperCase() ?? 'T'}${label.slice(1)} Tester ${tag}`,
      email,
      emailVerified: new Date(),
      passwordHash: testHash(password),
      isAdmin: role === 'admin',
    })
    .returning();
  return { id: row.id, email: row.email, password, name: row.name ?? '', role: row.isAdmin ? 'admin' : 'user' };
}
