// Queries about manuscript members: look-up of one membership, the member list, role changes and removal
// (never leaving a manuscript without an owner), and the plain reads and writes joining from an invitation needs.
import { and, asc, eq } from 'drizzle-orm';
import { db } from '@/db';
import { manuscripts, memberships, users, type MemberRole, type Membership } from '@/db/schema';
import { conflict, notFound } from '@/lib/domain-error';
import type { Executor } from './executor';

export interface MemberListItem {
  userId: string;
  name: string | null;
  email: string;
  role: MemberRole;
  joinedAt: Date;
}

/** One membership, or null when `userId` is not a member. */
export async function getMembership({
  manuscriptId,
  userId,
}: {
  manuscriptId: string;
  userId: string;
}): Promise<Membership | null> {
  const [row] = await db
    .select()
    .from(memberships)
    .where(and(eq(memberships.manuscriptId, manuscriptId), eq(memberships.userId, userId)))
    .limit(1);
  return row ?? null;
}

const ROLE_ORDER = { owner: 0, author: 1, coauthor: 2 } as const;

/** Members of a manuscript: owners first, then authors, then coauthors; by name within a role. */
export async function listMembers({ manuscriptId }: { manuscriptId: string }): Promise<MemberListItem[]> {
  const rows = await db
    .select({
      userId: memberships.userId,
      name: users.name,
      email: users.email,
      role: memberships.role,
      joinedAt: memberships.createdAt,
    })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.manuscriptId, manuscriptId))
    .orderBy(asc(users.name), asc(users.email));
  return rows.sort((a, b) => ROLE_ORDER[a.role] - ROLE_ORDER[b.role]);
}

/** Lock the manuscript's memberships and return them, so that owner counting is safe against concurrent changes. */
async function lockMemberships(tx: Executor, manuscriptId: string): Promise<Membership[]> {
  return tx.select().from(memberships).where(eq(memberships.manuscriptId, manuscriptId)).for('update');
}

function assertKeepsAnOwner(rows: Membership[], userId: string, nextRole: MemberRole | null): void {
  const target = rows.find((row) => row.userId === userId);
  if (!target) throw notFound('Member not found');
  if (target.role !== 'owner' || nextRole === 'owner') return;
  const owners = rows.filter((row) => row.role === 'owner').length;
  if (owners <= 1) {
    throw conflict(
      nextRole === null
        ? 'The last owner cannot leave; make another member owner first'
        : 'The last owner cannot be demoted; make another member owner first',
    );
  }
}

/** Change a member's role. `not-found` when not a member; `conflict` when it would leave no owner. */
export async function updateMemberRole({
  manuscriptId,
  userId,
  role,
}: {
  manuscriptId: string;
  userId: string;
  role: MemberRole;
}): Promise<Membership> {
  return db.transaction(async (tx) => {
    const rows = await lockMemberships(tx, manuscriptId);
    assertKeepsAnOwner(rows, userId, role);
    const [row] = await tx
      .update(memberships)
      .set({ role })
      .where(and(eq(memberships.manuscriptId, manuscriptId), eq(memberships.userId, userId)))
      .returning();
    await tx.update(manuscripts).set({ updatedAt: new Date() }).where(eq(manuscripts.id, manuscriptId));
    return row;
  });
}

/** Remove a member. `not-found` when not a member; `conflict` when it would leave no owner. */
export async function removeMember({ manuscriptId, userId }: { manuscriptId: string; userId: string }): Promise<void> {
  await db.transaction(async (tx) => {
    const rows = await lockMemberships(tx, manuscriptId);
    assertKeepsAnOwner(rows, userId, null);
    await tx
      .delete(memberships)
      .where(and(eq(memberships.manuscriptId, manuscriptId), eq(memberships.userId, userId)));
  });
}

/** One membership locked (`FOR UPDATE`) until the caller's transaction ends, or null when not a member. */
export async function lockMembership({
  tx,
  manuscriptId,
  userId,
}: {
  tx: Executor;
  manuscriptId: string;
  userId: string;
}): Promise<Membership | null> {
  const [row] = await tx
    .select()
    .from(memberships)
    .where(and(eq(memberships.manuscriptId, manuscriptId), eq(memberships.userId, userId)))
    .for('update');
  return row ?? null;
}

/** Store `userId`'s role in a manuscript: inserts the membership, or sets the role of the existing one. */
export async function saveMembership({
  tx = db,
  manuscriptId,
  userId,
  role,
}: {
  tx?: Executor;
  manuscriptId: string;
  userId: string;
  role: MemberRole;
}): Promise<void> {
  await tx
    .insert(memberships)
    .values({ manuscriptId, userId, role })
    .onConflictDoUpdate({ target: [memberships.manuscriptId, memberships.userId], set: { role } });
}
