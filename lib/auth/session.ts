// The signed-in user for server code (pages, route handlers, actions): the session cookie says who,
// the database says what they are now (so a removed account or a changed admin flag takes effect at once).
import { getServerSession } from 'next-auth';
import { getUserById, toPublicUser, type PublicUser } from '@/db/queries/users';
import { authOptions } from './options';

export type CurrentUser = PublicUser;

/**
 * The signed-in user, or null without a valid session (or when the account no longer exists).
 *
 * @example
 * const user = await getCurrentUser();
 * if (!user) redirect('/sign-in');
 */
export async function getCurrentUser(): Promise<CurrentUser | null> {
  const session = await getServerSession(authOptions);
  const id = session?.user?.id;
  if (!id) return null;
  const user = await getUserById({ id });
  return user ? toPublicUser(user) : null;
}
