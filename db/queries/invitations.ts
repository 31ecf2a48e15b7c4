// Queries about invitations: an owner invites an e-mail address into a role; the link carries a random token
// of which only the SHA-256 is stored. Accepting joins an existing account or creates one, in one transaction.
import { createHash, randomBytes } from 'node:crypto';
import { and, desc, eq, gt, isNull } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import { db } from '@/db';
import { invitations, manuscripts, memberships, users, type Invitation, type MemberRole } from '@/db/schema';
import { conflict, forbidden, HttpError, notFound } from '@/lib/http/errors';
import { addOrRaiseMember } from './members';
import { createUserWithPassword } from './users';

/** Invitations stay valid for 14 days (common practice for invitation links). */
export const INVITATION_LIFETIME_MS = 14 * 24 * 60 * 60 * 1000;

/** SHA-256 (hex) of an invitation token: what the database stores. */
export function hashInvitationToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}

/** A fresh token: 32 random bytes in base64url (43 characters). */
export function newInvitationToken(): string {
  return randomBytes(32).toString('base64url');
}

export interface PendingInvitation {
  id: string;
  email: string;
  role: MemberRole;
  invitedByName: string | null;
  createdAt: Date;
  expiresAt: Date;
}

/** What the invitation page shows before accepting. */
export interface InvitationDetails {
  id: string;
  email: string;
  role: MemberRole;
  manuscriptId: string;
  manuscriptSlug: string;
  manuscriptTitle: string;
  invitedByName: string | null;
  expiresAt: Date;
  acceptedAt: Date | null;
  expired: boolean;
  accountExists: boolean;
}

/**
 * Invite `email` into `role`. Replaces any pending invitation of the same address to the same manuscript
 * (the old link stops working). Throws 409 when the address already belongs to a member.
 *
 * @returns the stored invitation and the clear-text token (to put in the e-mail only; it is not stored)
 */
export async function createInvitation({
  manuscriptId,
  email,
  role,
  invitedById,
  now = new Date(),
}: {
  manuscriptId: string;
  email: string;
  role: MemberRole;
  invitedById: string;
  now?: Date;
}): Promise<{ invitation: Invitation; token: string }> {
  const address = email.trim().toLowerCase();
  return db.transaction(async (tx) => {
    const [member] = await tx
      .select({ userId: memberships.userId })
      .from(memberships)
      .innerJoin(users, eq(users.id, memberships.userId))
      .where(and(eq(memberships.manuscriptId, manuscriptId), eq(users.email, address)))
      .limit(1);
    if (member) throw conflict('This person is already a member of the manuscript', { email: ['Already a member'] });
    await tx
      .delete(invitations)
      .where(
        and(eq(invitations.manuscriptId, manuscriptId), eq(invitations.email, address), isNull(invitations.acceptedAt)),
      );
    const token = newInvitationToken();
    const [invitation] = await tx
      .insert(invitations)
      .values({
        manuscriptId,
        email: address,
        role,
        tokenHash: hashInvitationToken(token),
        invitedById,
        createdAt: now,
        expiresAt: new Date(now.getTime() + INVITATION_LIFETIME_MS),
      })
      .returning();
    return { invitation, token };
  });
}

/** Pending (not accepted, not expired) invitations of a manuscript, newest first. */
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

/** The invitation behind a token, with what the acceptance page shows; null when the token is unknown. */
export async function getInvitationByToken({
  token,
  now = new Date(),
}: {
  token: string;
  now?: Date;
}): Promise<InvitationDetails | null> {
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
    .where(eq(invitations.tokenHash, hashInvitationToken(token)))
    .limit(1);
  if (!row) return null;
  const { inviteeId, ...details } = row;
  return { ...details, expired: row.expiresAt.getTime() <= now.getTime(), accountExists: inviteeId !== null };
}

export interface AcceptedInvitation {
  manuscriptId: string;
  manuscriptSlug: string;
  role: MemberRole;
  userId: string;
  email: string;
  accountCreated: boolean;
}

/**
 * Accept an invitation, in one transaction.
 * - `user` given (signed in): its e-mail must be the invited one (403 otherwise); the user joins.
 * - `signUp` given (no session): creates the account with the invited e-mail (409 if one exists) and joins.
 * The membership gets the invited role, or keeps a higher one the person already has.
 * Unknown token: 404. Expired, or already accepted by someone else: 409. Accepting again as the same person is a no-op.
 */
export async function acceptInvitation({
  token,
  user,
  signUp,
  now = new Date(),
}: {
  token: string;
  user?: { id: string; email: string };
  signUp?: { name: string; passwordHash: string };
  now?: Date;
}): Promise<AcceptedInvitation> {
  return db.transaction(async (tx) => {
    const [invitation] = await tx
      .select()
      .from(invitations)
      .where(eq(invitations.tokenHash, hashInvitationToken(token)))
      .for('update');
    if (!invitation) throw notFound('This invitation does not exist or was replaced by a newer one');
    const [manuscript] = await tx
      .select({ id: manuscripts.id, slug: manuscripts.slug })
      .from(manuscripts)
      .where(eq(manuscripts.id, invitation.manuscriptId));
    if (!manuscript) throw notFound('This invitation does not exist or was replaced by a newer one');

    if (invitation.acceptedAt) {
      if (user && invitation.acceptedById === user.id) {
        const [membership] = await tx
          .select({ role: memberships.role })
          .from(memberships)
          .where(and(eq(memberships.manuscriptId, manuscript.id), eq(memberships.userId, user.id)));
        if (membership) {
          return {
            manuscriptId: manuscript.id,
            manuscriptSlug: manuscript.slug,
            role: membership.role,
            userId: user.id,
            email: user.email,
            accountCreated: false,
          };
        }
      }
      throw conflict('This invitation has already been used');
    }
    if (invitation.expiresAt.getTime() <= now.getTime()) {
      throw conflict('This invitation has expired; ask an owner of the manuscript to invite you again');
    }

    let userId: string;
    let accountCreated = false;
    if (user) {
      if (user.email.toLowerCase() !== invitation.email) {
        throw forbidden(`This invitation was sent to ${invitation.email}; sign in with that address to accept it`);
      }
      userId = user.id;
    } else if (signUp) {
      const created = await createUserWithPassword({
        tx,
        email: invitation.email,
        name: signUp.name,
        passwordHash: signUp.passwordHash,
        // Opening the link sent to this address proves the address.
        emailVerified: now,
      }).catch((error: unknown) => {
        if (error instanceof HttpError && error.status === 409) {
          throw conflict('An account already uses this e-mail address; sign in to accept the invitation');
        }
        throw error;
      });
      userId = created.id;
      accountCreated = true;
    } else {
      throw new Error('acceptInvitation needs either user or signUp');
    }

    const role = await addOrRaiseMember({ tx, manuscriptId: manuscript.id, userId, role: invitation.role });
    await tx
      .update(invitations)
      .set({ acceptedAt: now, acceptedById: userId })
      .where(eq(invitations.id, invitation.id));
    await tx.update(manuscripts).set({ updatedAt: now }).where(eq(manuscripts.id, manuscript.id));
    return {
      manuscriptId: manuscript.id,
      manuscriptSlug: manuscript.slug,
      role,
      userId,
      email: invitation.email,
      accountCreated,
    };
  });
}

/** Delete one invitation (used when its e-mail could not be sent, so no dead invitation stays pending). */
export async function deleteInvitationById({ id }: { id: string }): Promise<void> {
  await db.delete(invitations).where(eq(invitations.id, id));
}
