// Password hashing for password sign-in and invitation sign-up: bcrypt (bcryptjs, pure JS) at cost 10.
// bcrypt's own compare is used for verification; it reads only the first 72 bytes of a password.
import bcrypt from 'bcryptjs';

/** bcrypt cost factor (2^10 rounds): the library's default and common practice for interactive sign-in. */
export const BCRYPT_COST = 10;

/**
 * Hash a password for storage in `users.password_hash`.
 *
 * @param password - the plain-text password (bcrypt uses at most its first 72 UTF-8 bytes)
 * @returns a `$2b$10$…` bcrypt hash string (60 characters) with its own random salt
 * @example
 * const hash = await hashPassword('correct horse');
 * await verifyPassword('correct horse', hash); // returns true
 * @see https://www.usenix.org/legacy/events/usenix99/provos/provos.pdf (Provos & Mazières 1999, bcrypt)
 */
export async function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, BCRYPT_COST);
}

/**
 * Check a password against a stored bcrypt hash. A malformed hash counts as a mismatch rather than an error,
 * so that a damaged row can never sign anyone in nor crash the sign-in route.
 *
 * @param password - the plain-text password the user typed
 * @param hash - the stored bcrypt hash
 * @returns true when the password matches
 * @example
 * await verifyPassword('wrong', await hashPassword('right')); // returns false
 */
export async function verifyPassword(password: string, hash: string): Promise<boolean> {
  if (typeof hash !== 'string' || !/^\$2[abxy]\$\d{2}\$/.test(hash)) return false;
  try {
    return await bcrypt.compare(password, hash);
  } catch {
    return false;
  }
}

/**
 * A bcrypt hash at {@link BCRYPT_COST} of a throw-away phrase. Password sign-in for an unknown account (or one without a
 * password) compares against it, so that answering "no" costs the same bcrypt time as for a known account.
 */
export const TIMING_EQUALISER_HASH = '$2b$10$MuU1NXA8sMMMVy7knP9iQegf1XRPiVyrzG24fhMkzI8VCRPHrrY9e';
