// Runs before every request (pages, API routes, static files, 404s): a fresh CSP nonce for the page Next renders, and the
// security headers on the response. It only sets headers; authentication and authorisation stay in the handlers.
import { NextResponse, type NextRequest } from 'next/server';
import { newNonce, securityHeaders, servedOverHttps } from '@/lib/http/security-headers';

/**
 * Next reads the nonce from the request's Content-Security-Policy header and puts it on its own scripts when it renders
 * the page (every page here is rendered per request: they read the session).
 */
export function proxy(request: NextRequest): NextResponse {
  const nonce = newNonce();
  const headers = securityHeaders({
    nonce,
    development: process.env.NODE_ENV === 'development',
    https: servedOverHttps(request),
  });
  const forwarded = new Headers(request.headers);
  forwarded.set('x-nonce', nonce);
  forwarded.set('content-security-policy', headers['content-security-policy']);
  const response = NextResponse.next({ request: { headers: forwarded } });
  for (const [name, value] of Object.entries(headers)) response.headers.set(name, value);
  return response;
}
