// Invitation link tokens: 32 random bytes in base64url travel in the e-mail; the database keeps only their SHA-256,
// so a leaked table cannot be turned back into working links.
import { createHash, randomBytes } from 'node:crypto';

/** SHA-256 (hex) of an invitation token: what the database stores. */
export function hashInvitationToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}

/** A fresh token: 32 random bytes in base64url (43 characters). */
export function newInvitationToken(): string {
  return randomBytes(32).toString('base64url');
}
