// The public base URL of the app, for links in e-mails: APP_URL, else NEXTAUTH_URL, else the request's own origin.
import { getEnv } from '@/lib/env';

/** @example appUrl(request) + '/invite/' + token */
export function appUrl(request: Request): string {
  const configured = getEnv().APP_URL || process.env.NEXTAUTH_URL;
  return (configured || new URL(request.url).origin).replace(/\/+$/, '');
}
