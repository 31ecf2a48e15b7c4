// Queries about invitations: read and write rows only (links carry a token; only its SHA-256 is stored). The rules
// (who may accept, expiry, which role the member gets, replacing a pending invitation) live in lib/invitations.
import { and, desc, eq, gt, isNull } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import { db } from '@/db';
import { invitations, manuscripts, memberships, users, type Invitation, type MemberRole } from '@/db/schema';
import type { Executor } from './executor';

export interface PendingInvitation {
  id: string;
  email: string;
  role: MemberRole;
  invitedByName: string | null;
  createdAt: Date;
  expiresAt: Date;
}

/** An invitation as stored, with its manuscript, inviter and whether the invited address has an account. */
export interface InvitationRow {
  id: string;
  email: string;
  role: MemberRole;
  manuscriptId: string;
  manuscriptSlug: string;
  manuscriptTitle: string;
  invitedByName: string | null;
  expiresAt: Date;
  acceptedAt: Date | null;
  accountExists: boolean;
}

/** True when `email` (lower-cased) belongs to a member of the manuscript. */
export async function isMemberEmail({
  manuscriptId,
  email,
  tx = db,
}: {
  manuscriptId: string;
  email: string;
  tx?: Executor;
}): Promise<boolean> {
  const [member] = await tx
    .select({ userId: memberships.userId })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.manuscriptId, manuscriptId), eq(users.email, email)))
    .limit(1);
  return Boolean(member);
}

/** Delete the not yet accepted invitations of `email` to a manuscript. */
export async function deletePendingInvitations({
  manuscriptId,
  email,
  tx = db,
}: {
  manuscriptId: string;
  email: string;
  tx?: Executor;
}): Promise<void> {
  await tx
    .delete(invitations)
    .where(and(eq(invitations.manuscriptId, manuscriptId), eq(invitations.email, email), isNull(invitations.acceptedAt)));
}

/** Insert an invitation row. */
export async function insertInvitation({
  values,
  tx = db,
}: {
  values: typeof invitations.$inferInsert;
  tx?: Executor;
}): Promise<Invitation> {
  const [invitation] = await tx.insert(invitations).values(values).returning();
  return invitation;
}

/** Invitations of a manuscript not accepted and expiring after `now`, newest first. */
export async function listPendingInvitations({
  manuscriptId,
  now = new Date(),
}: {
  manuscriptId: string;
  now?: Date;
}): Promise<PendingInvitation[]> {
  return db
    .select({
      id: invitations.id,
      email: invitations.email,
      role: invitations.role,
      invitedByName: users.name,
      createdAt: invitations.createdAt,
      expiresAt: invitations.expiresAt,
    })
    .from(invitations)
    .leftJoin(users, eq(users.id, invitations.invitedById))
    .where(
      and(eq(invitations.manuscriptId, manuscriptId), isNull(invitations.acceptedAt), gt(invitations.expiresAt, now)),
    )
    .orderBy(desc(invitations.createdAt));
}

/** The invitation stored under a token hash, with what the acceptance page shows; null when there is none. */
export async function getInvitationByTokenHash({ tokenHash }: { tokenHash: string }): Promise<InvitationRow | null> {
  const inviter = alias(users, 'inviter');
  const invitee = alias(users, 'invitee');
  const [row] = await db
    .select({
      id: invitations.id,
      email: invitations.email,
      role: invitations.role,
      manuscriptId: manuscripts.id,
      manuscriptSlug: manuscripts.slug,
      manuscriptTitle: manuscripts.title,
      invitedByName: inviter.name,
      expiresAt: invitations.expiresAt,
      acceptedAt: invitations.acceptedAt,
      inviteeId: invitee.id,
    })
    .from(invitations)
    .innerJoin(manuscripts, eq(manuscripts.id, invitations.manuscriptId))
    .leftJoin(inviter, eq(inviter.id, invitations.invitedById))
    .leftJoin(invitee, eq(invitee.email, invitations.email))
    .where(eq(invitations.tokenHash, tokenHash))
    .limit(1);
  if (!row) return null;
  const { inviteeId, ...details } = row;
  return { ...details, accountExists: inviteeId !== null };
}

/**
 * The invitation under a token hash and its manuscript's slug, with the invitation row locked (`FOR UPDATE`) until
 * the caller's transaction ends; null when there is none.
 */
export async function lockInvitationByTokenHash({
  tokenHash,
  tx,
}: {
  tokenHash: string;
  tx: Executor;
}): Promise<{ invitation: Invitation; manuscriptSlug: string } | null> {
  const [row] = await tx
    .select({ invitation: invitations, manuscriptSlug: manuscripts.slug })
    .from(invitations)
    .innerJoin(manuscripts, eq(manuscripts.id, invitations.manuscriptId))
    .where(eq(invitations.tokenHash, tokenHash))
    .for('update', { of: invitations });
  return row ?? null;
}

/** Record who accepted an invitation and when. */
export async function markInvitationAccepted({
  id,
  userId,
  at,
  tx = db,
}: {
  id: string;
  userId: string;
  at: Date;
  tx?: Executor;
}): Promise<void> {
  await tx.update(invitations).set({ acceptedAt: at, acceptedById: userId }).where(eq(invitations.id, id));
}

/** Delete one invitation (used when its e-mail could not be sent, so no dead invitation stays pending). */
export async function deleteInvitationById({ id }: { id: string }): Promise<void> {
  await db.delete(invitations).where(eq(invitations.id, id));
}
