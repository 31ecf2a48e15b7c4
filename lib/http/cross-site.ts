// Cross-site request checks for mutating requests made with the browser's cookies: the request must come from our
// own origin (Origin header or Sec-Fetch-Site: same-origin) and, where a JSON route is called, carry application/json.
import { appUrl } from './app-url';
import { jsonError } from './errors';

/** Methods that change state; GET and HEAD never do in this app. */
export const MUTATING_METHODS = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

const SESSION_COOKIE = /(?:^|;\s*)(?:__Secure-)?next-auth\.session-token(?:\.\d+)?=/;

/** Whether the request carries a next-auth session cookie (the browser sends it on its own: the CSRF risk). */
export function hasSessionCookie(request: Request): boolean {
  return SESSION_COOKIE.test(request.headers.get('cookie') ?? '');
}

/**
 * Whether the request is authenticated by an `Authorization: Bearer …` header and no session cookie. Such a request
 * cannot be forged by another site (browsers never add the header by themselves), so the cross-site checks skip it.
 * API tokens do not exist yet: authentication then finds no session and answers 401.
 */
export function isBearerWithoutCookie(request: Request): boolean {
  return /^Bearer\s+\S/i.test(request.headers.get('authorization') ?? '') && !hasSessionCookie(request);
}

/** Same origin: the Origin header equals the app's configured origin, or the browser says Sec-Fetch-Site: same-origin. */
export function isSameOrigin(request: Request): boolean {
  if (request.headers.get('sec-fetch-site') === 'same-origin') return true;
  const origin = request.headers.get('origin');
  if (!origin || origin === 'null') return false;
  return origin === new URL(appUrl(request)).origin;
}

/** Whether the request carries a body (declared length above 0, a chunked stream, or a declared content type). */
function hasBody(request: Request): boolean {
  const length = request.headers.get('content-length');
  if (length !== null && length.trim() !== '0') return true;
  return request.headers.has('transfer-encoding') || request.headers.has('content-type');
}

function isJsonContentType(request: Request): boolean {
  return (request.headers.get('content-type') ?? '').split(';')[0].trim().toLowerCase() === 'application/json';
}

/**
 * The refusal for a forged or non-JSON mutating request, or null when it may proceed.
 *
 * - Only mutating methods with a session cookie are checked; a bearer request without a cookie is exempt.
 * - Cross-origin (or no Origin and no Sec-Fetch-Site): 403.
 * - `json: true` and a body that is not `application/json` (text/plain and form posts are what another site can send
 *   without asking): 415. A request without any body passes.
 *
 * @example
 * const refusal = crossSiteRefusal(request, { json: true });
 * if (refusal) return refusal;
 */
export function crossSiteRefusal(request: Request, { json }: { json: boolean }): Response | null {
  if (!MUTATING_METHODS.has(request.method.toUpperCase())) return null;
  if (!hasSessionCookie(request) || isBearerWithoutCookie(request)) return null;
  if (!isSameOrigin(request)) {
    return jsonError(403, 'This request did not come from a Fluxfolio page (cross-site requests are refused)');
  }
  if (json && hasBody(request) && !isJsonContentType(request)) {
    return jsonError(415, 'Send the request body as application/json');
  }
  return null;
}
