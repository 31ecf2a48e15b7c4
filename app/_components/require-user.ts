// For server pages that need a session: the current user, or a redirect to sign-in that comes back here.
// Authorisation for manuscript pages still goes through lib/authz/manuscript-access.ts.
import { redirect } from 'next/navigation';
import { getCurrentUser, type CurrentUser } from '@/lib/auth/session';

export async function requireUser(returnTo: string): Promise<CurrentUser> {
  const user = await getCurrentUser();
  if (!user) redirect(`/sign-in?callbackUrl=${encodeURIComponent(returnTo)}`);
  return user;
}
