// Accepting an invitation, in one transaction, with its rules: the link must be known, unused and not expired; a
// signed-in person must be the invited address; the member gets the invited role but never loses a higher one.
import { db } from '@/db';
import { lockInvitationByTokenHash, markInvitationAccepted } from '@/db/queries/invitations';
import { touchManuscript } from '@/db/queries/manuscripts';
import { lockMembership, saveMembership } from '@/db/queries/members';
import { createUserWithPassword } from '@/db/queries/users';
import type { MemberRole } from '@/db/schema';
import { higherRole } from '@/lib/authz/roles';
import { conflict, forbidden, isDomainError, notFound } from '@/lib/domain-error';
import { getInvitationByToken, invitationExpired } from './get-invitation';
import { hashInvitationToken } from './invitation-token';

export interface AcceptedInvitation {
  manuscriptId: string;
  manuscriptSlug: string;
  role: MemberRole;
  userId: string;
  email: string;
  accountCreated: boolean;
}

const UNKNOWN = 'This invitation does not exist or was replaced by a newer one';
const USED = 'This invitation has already been used';
const EXPIRED = 'This invitation has expired; ask an owner of the manuscript to invite you again';
const ACCOUNT_EXISTS = 'An account already uses this e-mail address; sign in to accept the invitation';

/**
 * Whether a sign-up through this link could succeed, checked before any password is hashed (so an unknown or spent
 * token costs no bcrypt time). The same rules hold again inside {@link acceptInvitation}'s transaction.
 *
 * @throws DomainError `not-found` for an unknown token; `conflict` when used, expired or the address has an account
 */
export async function assertOpenForSignUp({ token, now = new Date() }: { token: string; now?: Date }): Promise<void> {
  const invitation = await getInvitationByToken({ token, now });
  if (!invitation) throw notFound(UNKNOWN);
  if (invitation.acceptedAt) throw conflict(USED);
  if (invitation.expired) throw conflict(EXPIRED);
  if (invitation.accountExists) throw conflict(ACCOUNT_EXISTS);
}

/**
 * Accept an invitation.
 * - `user` given (signed in): its e-mail must be the invited one (`forbidden` otherwise); the user joins.
 * - `signUp` given (no session): creates the account with the invited e-mail (`conflict` if one exists) and joins.
 * The membership gets the invited role, or keeps a higher one the person already has.
 * Unknown token: `not-found`. Expired, or already accepted by someone else: `conflict`. Accepting again as the same
 * person who accepted it is a no-op that answers with their membership.
 *
 * @example
 * const accepted = await acceptInvitation({ token, user: { id: user.id, email: user.email } });
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
    const locked = await lockInvitationByTokenHash({ tx, tokenHash: hashInvitationToken(token) });
    if (!locked) throw notFound(UNKNOWN);
    const { invitation, manuscriptSlug } = locked;
    const manuscriptId = invitation.manuscriptId;

    if (invitation.acceptedAt) {
      if (user && invitation.acceptedById === user.id) {
        const membership = await lockMembership({ tx, manuscriptId, userId: user.id });
        if (membership) {
          return { manuscriptId, manuscriptSlug, role: membership.role, userId: user.id, email: user.email, accountCreated: false };
        }
      }
      throw conflict(USED);
    }
    if (invitationExpired(invitation.expiresAt, now)) {
      throw conflict(EXPIRED);
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
        if (isDomainError(error, 'conflict')) {
          throw conflict(ACCOUNT_EXISTS);
        }
        throw error;
      });
      userId = created.id;
      accountCreated = true;
    } else {
      throw new Error('acceptInvitation needs either user or signUp');
    }

    // An invitation never lowers a role the person already has.
    const existing = await lockMembership({ tx, manuscriptId, userId });
    const role = existing ? higherRole(existing.role, invitation.role) : invitation.role;
    if (role !== existing?.role) await saveMembership({ tx, manuscriptId, userId, role });
    await markInvitationAccepted({ tx, id: invitation.id, userId, at: now });
    await touchManuscript({ tx, id: manuscriptId, at: now });
    return { manuscriptId, manuscriptSlug, role, userId, email: invitation.email, accountCreated };
  });
}
