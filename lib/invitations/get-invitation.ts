// Reading an invitation link: what it offers (manuscript, role, inviter), whether it has expired or been used, and
// whether the invited address already has an account (which decides between signing in and signing up).
import { getInvitationByTokenHash, type InvitationRow } from '@/db/queries/invitations';
import { hashInvitationToken } from './invitation-token';

/** What the invitation page and `GET /api/invitations/[token]` show before accepting. */
export interface InvitationDetails extends InvitationRow {
  expired: boolean;
}

/** True when the invitation can no longer be accepted because its time is up. */
export function invitationExpired(expiresAt: Date, now: Date): boolean {
  return expiresAt.getTime() <= now.getTime();
}

/**
 * The invitation behind a token; null when the token is unknown (or was replaced by a newer invitation).
 *
 * @example
 * const invitation = await getInvitationByToken({ token });
 */
export async function getInvitationByToken({
  token,
  now = new Date(),
}: {
  token: string;
  now?: Date;
}): Promise<InvitationDetails | null> {
  const row = await getInvitationByTokenHash({ tokenHash: hashInvitationToken(token) });
  if (!row) return null;
  return { ...row, expired: invitationExpired(row.expiresAt, now) };
}
