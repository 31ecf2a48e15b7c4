// Reading back what the foundation routes wrote (row counts, a manuscript, a membership), so tests can prove that a
// refused request changed nothing and an accepted one changed exactly what it should.
import { and, count, eq } from 'drizzle-orm';
import { invitations, manuscripts, memberships, users, type MemberRole } from '@/db/schema';
import { testDb } from './db';

/** Row counts of the tables the foundation routes write. */
export async function tableCounts(): Promise<{ users: number; manuscripts: number; memberships: number; invitations: number }> {
  const [u] = await testDb.select({ n: count() }).from(users);
  const [m] = await testDb.select({ n: count() }).from(manuscripts);
  const [ms] = await testDb.select({ n: count() }).from(memberships);
  const [i] = await testDb.select({ n: count() }).from(invitations);
  return { users: u.n, manuscripts: m.n, memberships: ms.n, invitations: i.n };
}

/** The manuscript row, or null when there is none. */
export async function getManuscriptRow(id: string) {
  const [row] = await testDb.select().from(manuscripts).where(eq(manuscripts.id, id));
  return row ?? null;
}

/** The user's role in the manuscript, or null when they are not a member. */
export async function getMembershipRole(manuscriptId: string, userId: string): Promise<MemberRole | null> {
  const [row] = await testDb
    .select({ role: memberships.role })
    .from(memberships)
    .where(and(eq(memberships.manuscriptId, manuscriptId), eq(memberships.userId, userId)));
  return row?.role ?? null;
}
