// Queries about people: look-ups by id and e-mail, and account creation from an accepted invitation.
// E-mail addresses are stored lower-cased (the zod schema and next-auth both normalise them).
import { eq } from 'drizzle-orm';
import { db } from '@/db';
import { users, type User } from '@/db/schema';
import { conflict } from '@/lib/domain-error';
import type { Executor } from './executor';
import { pgErrorCode, UNIQUE_VIOLATION } from './pg-errors';

/** The public face of a user: never the password hash. */
export interface PublicUser {
  id: string;
  name: string | null;
  email: string;
  isAdmin: boolean;
}

export function toPublicUser(user: User): PublicUser {
  return { id: user.id, name: user.name, email: user.email, isAdmin: user.isAdmin };
}

/** A user by id, or null. */
export async function getUserById({ id }: { id: string }): Promise<User | null> {
  const [row] = await db.select().from(users).where(eq(users.id, id)).limit(1);
  return row ?? null;
}

/** A user by e-mail (compared lower-cased), or null. */
export async function getUserByEmail({ email }: { email: string }): Promise<User | null> {
  const [row] = await db.select().from(users).where(eq(users.email, email.trim().toLowerCase())).limit(1);
  return row ?? null;
}

/**
 * Create a password account. Throws a `conflict` when the address is taken.
 *
 * @param emailVerified - when the address was proven (an invitation link opened from the mailbox proves it)
 */
export async function createUserWithPassword({
  email,
  name,
  passwordHash,
  emailVerified = null,
  tx = db,
}: {
  email: string;
  name: string;
  passwordHash: string;
  emailVerified?: Date | null;
  tx?: Executor;
}): Promise<User> {
  try {
    const [row] = await tx
      .insert(users)
      .values({ email: email.trim().toLowerCase(), name, passwordHash, emailVerified })
      .returning();
    return row;
  } catch (error) {
    if (pgErrorCode(error) === UNIQUE_VIOLATION) throw conflict('An account already uses this e-mail address');
    throw error;
  }
}
