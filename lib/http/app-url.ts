// The public base URL of the app, for links in e-mails: APP_URL, else NEXTAUTH_URL, else the request's own origin.
// Used for invitation links; next-auth builds its own sign-in links from NEXTAUTH_URL.
import { getEnv } from '@/lib/env';

/** @example appUrl(request) + '/invite/' + token */
export function appUrl(request: Request): string {
  const configured = getEnv().APP_URL || process.env.NEXTAUTH_URL;
  return (configured || new URL(request.url).origin).replace(/\/+$/, '');
}
