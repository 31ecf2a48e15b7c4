// The one HTTP client of the API and browser tests: the app's address from the harness (APP_URL), a cookie jar, JSON
// helpers answering { status, body, headers }, and next-auth's CSRF dance for password sign-in, e-mail links and sign-out.
import { harnessEnv } from './harness-env';
import type { TestUser } from './test-users';

/** The app served by scripts/test.sh, without a trailing slash (throws at import when the harness did not set it). */
export const APP_URL = harnessEnv('APP_URL').replace(/\/+$/, '');

export type HttpRequestInit = RequestInit & { json?: unknown };

/** A JSON answer: the status, the parsed body (the text when it is not JSON, null when empty) and the headers. */
export interface JsonAnswer {
  status: number;
  /** Tests read arbitrary response shapes, so the body is untyped. */
  body: any;
  headers: Headers;
}

/** The session next-auth reports for a signed-in client. */
export interface SessionAnswer {
  user?: { id?: string; email?: string; name?: string; isAdmin?: boolean };
}

/** A client with its own cookie jar. Redirects are not followed, so tests can look at them. */
export class HttpClient {
  readonly cookies = new Map<string, string>();

  /** The `cookie` header value for the jar's contents. */
  cookieHeader(): string {
    return [...this.cookies].map(([name, value]) => `${name}=${value}`).join('; ');
  }

  private remember(response: Response): void {
    for (const line of response.headers.getSetCookie()) {
      const [pair, ...attributes] = line.split(';');
      const at = pair.indexOf('=');
      const name = pair.slice(0, at).trim();
      const value = pair.slice(at + 1).trim();
      const expired = attributes.some((a) => /^\s*(max-age=0|expires=thu, 01 jan 1970)/i.test(a));
      if (expired || value === '') this.cookies.delete(name);
      else this.cookies.set(name, value);
    }
  }

  /**
   * A request to APP_URL + path (or an absolute URL). `json` sends a JSON body and sets content-type.
   *
   * @example
   * const response = await client.fetch(`/api/notes/${id}`, { method: 'PUT', json: { title: 'T', source: 'S' } });
   */
  async fetch(pathname: string, { json, headers, ...init }: HttpRequestInit = {}): Promise<Response> {
    const h = new Headers(headers);
    if (this.cookies.size > 0) h.set('cookie', this.cookieHeader());
    // Like a browser on one of the app's pages: requests carry the page's Origin (lib/http/cross-site.ts).
    if (!h.has('origin')) h.set('origin', new URL(APP_URL).origin);
    let body = init.body;
    if (json !== undefined) {
      h.set('content-type', 'application/json');
      body = JSON.stringify(json);
    }
    const url = /^https?:\/\//.test(pathname) ? pathname : `${APP_URL}${pathname}`;
    const response = await fetch(url, { redirect: 'manual', ...init, headers: h, body });
    this.remember(response);
    return response;
  }

  get(pathname: string, init: HttpRequestInit = {}): Promise<Response> {
    return this.fetch(pathname, { ...init, method: 'GET' });
  }

  post(pathname: string, json?: unknown, init: HttpRequestInit = {}): Promise<Response> {
    return this.fetch(pathname, { ...init, method: 'POST', json });
  }

  /**
   * A JSON request answered as { status, body, headers }. A string `body` is sent as it is (for malformed JSON).
   *
   * @example
   * const { status, body } = await client.json('PATCH', `/api/manuscripts/${id}`, { title: 'Renamed' });
   */
  async json(method: string, pathname: string, body?: unknown): Promise<JsonAnswer> {
    const response = await this.fetch(pathname, {
      method,
      headers: body === undefined ? {} : { 'content-type': 'application/json' },
      body: body === undefined ? undefined : typeof body === 'string' ? body : JSON.stringify(body),
    });
    const text = await response.text();
    let parsed: unknown = null;
    try {
      parsed = text ? JSON.parse(text) : null;
    } catch {
      parsed = text; // not JSON (an HTML error page, a CSV): the test sees the text
    }
    return { status: response.status, body: parsed, headers: response.headers };
  }

  /** next-auth's CSRF token (also sets its cookie). */
  async csrfToken(): Promise<string> {
    const response = await this.get('/api/auth/csrf');
    const { csrfToken } = (await response.json()) as { csrfToken: string };
    return csrfToken;
  }

  /** A form POST to a next-auth endpoint with a fresh CSRF token; answers with the redirect location ('' when none). */
  private async authForm(pathname: string, fields: Record<string, string>): Promise<string> {
    const csrfToken = await this.csrfToken();
    const response = await this.fetch(pathname, {
      method: 'POST',
      headers: { 'content-type': 'application/x-www-form-urlencoded' },
      body: new URLSearchParams({ csrfToken, ...fields }),
    });
    await response.text();
    return response.headers.get('location') ?? '';
  }

  /**
   * Password sign-in through next-auth's credentials callback.
   *
   * @returns the redirect location, and whether a session cookie was set (false for a wrong password)
   */
  async signInWithPassword(email: string, password: string): Promise<{ location: string; signedIn: boolean }> {
    const location = await this.authForm('/api/auth/callback/credentials', { email, password, callbackUrl: `${APP_URL}/dashboard` });
    return { location, signedIn: this.hasSession() };
  }

  /** Ask for a one-time sign-in link by e-mail; returns the redirect location (the check-your-mail page or an error). */
  requestSignInLink(email: string): Promise<string> {
    return this.authForm('/api/auth/signin/email', { email, callbackUrl: `${APP_URL}/dashboard` });
  }

  /** Sign out through next-auth (clears the session cookie). */
  async signOut(): Promise<void> {
    await this.authForm('/api/auth/signout', {});
  }

  /** Whether the jar holds a next-auth session cookie. */
  hasSession(): boolean {
    return [...this.cookies.keys()].some((name) => name.endsWith('next-auth.session-token'));
  }

  /** The session next-auth reports, or null when signed out. */
  async session(): Promise<SessionAnswer | null> {
    const response = await this.get('/api/auth/session');
    const body = (await response.json()) as SessionAnswer;
    return Object.keys(body).length > 0 ? body : null;
  }
}

/**
 * A new client signed in as `user` with their password; throws when sign-in fails.
 *
 * @example
 * const author = await signedInClient(team.author);
 * const { status } = await author.json('GET', '/api/manuscripts');
 */
export async function signedInClient(user: Pick<TestUser, 'email' | 'password'>): Promise<HttpClient> {
  const client = new HttpClient();
  const { signedIn, location } = await client.signInWithPassword(user.email, user.password);
  if (!signedIn) throw new Error(`password sign-in failed for ${user.email} (redirected to ${location || 'nowhere'})`);
  return client;
}
