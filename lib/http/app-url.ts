// The public base URL of the app, for links in e-mails: APP_URL, else NEXTAUTH_URL, else the request's own origin.
/** @example appUrl(request) + '/invite/' + token */
export function appUrl(request: Request): string {
  const configured = process.env.APP_URL || process.env.NEXTAUTH_URL;
  return (configured || new URL(request.url).origin).replace(/\/+$/, '');
}
