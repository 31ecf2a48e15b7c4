// Whether the developer mailbox page exists for this visitor: only when turned on (FLUXFOLIO_DEV_MAILBOX=1, or
// `next dev`) and only for a signed-in site admin. Everyone else gets the app's ordinary not-found page.
import { getCurrentUser } from '@/lib/auth/session';
import { getEnv } from '@/lib/env';

/** The page is turned on: FLUXFOLIO_DEV_MAILBOX=1 (the test command sets it) or the development server. */
export function devMailboxTurnedOn(): boolean {
  const env = getEnv();
  return env.FLUXFOLIO_DEV_MAILBOX || env.NODE_ENV === 'development';
}

/** Turned on and the visitor is a signed-in site admin (read from the database, not only the session cookie). */
export async function devMailboxVisible(): Promise<boolean> {
  if (!devMailboxTurnedOn()) return false;
  const user = await getCurrentUser();
  return user?.isAdmin === true;
}
