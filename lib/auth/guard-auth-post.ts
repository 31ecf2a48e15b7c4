// The checks in front of next-auth's POST endpoints: same origin for every POST (its CSRF token applies too), and rate
// limits on password attempts (per account and per client; a sign-in that succeeds is not counted) and sign-in link mail.
import { appUrl } from '@/lib/http/app-url';
import { isSameOrigin } from '@/lib/http/cross-site';
import { jsonError } from '@/lib/http/errors';
import { readBodyText } from '@/lib/http/read-body';
import { clientKey } from '@/lib/rate-limit/client-key';
import { forgetHit, hit, type RateLimitHit } from '@/lib/rate-limit/hit';
import {
  PASSWORD_PER_ACCOUNT,
  PASSWORD_PER_CLIENT,
  SIGN_IN_LINK_PER_ADDRESS,
  SIGN_IN_LINK_PER_CLIENT,
  type RateLimit,
} from '@/lib/rate-limit/limits';
import { RateLimitedError } from '@/lib/rate-limit/rate-limited-error';

/** next-auth's form posts are a few hundred bytes; anything above this is not one of them. */
export const MAX_AUTH_FORM_BYTES = 16_384;
/** The `?error=` code the sign-in page turns into a "too many attempts" message. */
export const RATE_LIMITED_ERROR_CODE = 'RateLimited';

type Step = { limit: RateLimit; key: string; message: string };

/** The e-mail a form names, trimmed and lower-cased (accounts are matched case-insensitively), or null. */
function formEmail(form: URLSearchParams): string | null {
  const email = form.get('email')?.trim().toLowerCase() ?? '';
  return email ? email : null;
}

/** Count every step in order; when one is full, take back the ones already counted and rethrow. */
async function hitAll(steps: Step[]): Promise<RateLimitHit[]> {
  const counted: RateLimitHit[] = [];
  try {
    for (const step of steps) counted.push(await hit({ ...step.limit, key: step.key, message: step.message }));
    return counted;
  } catch (error) {
    await Promise.all(counted.map(forgetHit));
    throw error;
  }
}

function signedIn(response: Response): boolean {
  return response.headers.getSetCookie().some((line) => /^(?:__Secure-)?next-auth\.session-token(?:\.\d+)?=[^;]+/.test(line));
}

/**
 * A 429 that next-auth's browser client understands: its `signIn()` reads `url` and takes `?error=` from it.
 * Plain form posts get the same JSON with a message and Retry-After.
 */
function rateLimitedResponse(request: Request, error: RateLimitedError): Response {
  const url = `${appUrl(request)}/sign-in?error=${RATE_LIMITED_ERROR_CODE}`;
  return Response.json(
    { error: error.message, url },
    { status: 429, headers: { 'retry-after': String(error.retryAfterSeconds) } },
  );
}

function steps(action: string, form: URLSearchParams, client: string): Step[] | null {
  const email = formEmail(form);
  if (action === 'callback/credentials') {
    const tooMany = 'Too many sign-in attempts; wait a few minutes and try again';
    return [
      { limit: PASSWORD_PER_CLIENT, key: client, message: tooMany },
      ...(email ? [{ limit: PASSWORD_PER_ACCOUNT, key: email, message: tooMany }] : []),
    ];
  }
  if (action === 'signin/email') {
    const tooMany = 'Too many sign-in links asked for; wait a few minutes and try again';
    return [
      { limit: SIGN_IN_LINK_PER_CLIENT, key: client, message: tooMany },
      ...(email ? [{ limit: SIGN_IN_LINK_PER_ADDRESS, key: email, message: tooMany }] : []),
    ];
  }
  return null;
}

/**
 * Run next-auth's POST handler behind the checks.
 *
 * @param request - the incoming POST to /api/auth/…
 * @param run - calls next-auth with the untouched request (its body is read here from a clone)
 * @example
 * export const POST = (request, context) => guardAuthPost(request, () => handler(request, context));
 */
export async function guardAuthPost(request: Request, run: () => Promise<Response>): Promise<Response> {
  if (!isSameOrigin(request)) {
    return jsonError(403, 'This request did not come from a Fluxfolio page (cross-site requests are refused)');
  }
  const action = new URL(request.url).pathname.replace(/^.*\/api\/auth\//, '').replace(/\/+$/, '');
  if (action !== 'callback/credentials' && action !== 'signin/email') return run();

  const body = await readBodyText(request.clone(), MAX_AUTH_FORM_BYTES);
  if (!body.ok) return jsonError(body.reason === 'too-large' ? 413 : 400, 'The sign-in form could not be read');
  const planned = steps(action, new URLSearchParams(body.text), clientKey(request)) ?? [];
  let counted: RateLimitHit[];
  try {
    counted = await hitAll(planned);
  } catch (error) {
    if (error instanceof RateLimitedError) return rateLimitedResponse(request, error);
    throw error;
  }
  const response = await run();
  // Only failed password attempts count: a person who signs in often is never locked out by their own successes.
  if (action === 'callback/credentials' && signedIn(response)) await Promise.all(counted.map(forgetHit));
  return response;
}
