// Inviting someone: an owner invites an e-mail address into a role. The rules: a member cannot be invited again,
// a new invitation replaces the address's pending one (the old link stops working), and links expire after 14 days.
import { db } from '@/db';
import { deletePendingInvitations, insertInvitation, isMemberEmail } from '@/db/queries/invitations';
import type { Invitation, MemberRole } from '@/db/schema';
import { conflict } from '@/lib/domain-error';
import { hashInvitationToken, newInvitationToken } from './invitation-token';

/** Invitations stay valid for 14 days (common practice for invitation links). */
export const INVITATION_LIFETIME_MS = 14 * 24 * 60 * 60 * 1000;

/**
 * Invite `email` into `role`, in one transaction. Throws a `conflict` (with a message on `email`) when the address
 * already belongs to a member.
 *
 * @returns the stored invitation and the clear-text token (to put in the e-mail only; it is not stored)
 * @example
 * const { invitation, token } = await createInvitation({ manuscriptId, email, role: 'coauthor', invitedById });
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
    if (await isMemberEmail({ tx, manuscriptId, email: address })) {
      throw conflict('This person is already a member of the manuscript', { email: ['Already a member'] });
    }
    await deletePendingInvitations({ tx, manuscriptId, email: address });
    const token = newInvitationToken();
    const invitation = await insertInvitation({
      tx,
      values: {
        manuscriptId,
        email: address,
        role,
        tokenHash: hashInvitationToken(token),
        invitedById,
        createdAt: now,
        expiresAt: new Date(now.getTime() + INVITATION_LIFETIME_MS),
      },
    });
    return { invitation, token };
  });
}
