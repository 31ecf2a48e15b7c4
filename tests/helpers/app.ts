// HTTP access to the app under test (APP_URL, served by scripts/test.sh): a fetch wrapper with a cookie jar and
// password sign-in through next-auth's own endpoints (csrf token, then the credentials callback).

/** The served app, without a trailing slash. */
export const APP_URL = (process.env.APP_URL || 'http://127.0.0.1:3100').replace(/\/+$/, '');

export type AppRequestInit = RequestInit & { json?: unknown };

/** A client with its own cookie jar. Redirects are not followed, so tests can look at them. */
export class AppClient {
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
   * A request to APP_URL + path. `json` sends a JSON body (and sets content-type).
   *
   * @example
   * const res = await client.fetch('/api/manuscripts', { method: 'POST', json: { title: 'T' } });
   */
  async fetch(pathname: string, { json, headers, ...init }: AppRequestInit = {}): Promise<Response> {
    const h = new Headers(headers);
    if (this.cookies.size > 0) h.set('cookie', this.cookieHeader());
    // Like a browser on one of the app's pages: mutating requests carry the page's Origin (lib/http/cross-site.ts).
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

  get(pathname: string, init: AppRequestInit = {}): Promise<Response> {
    return this.fetch(pathname, { ...init, method: 'GET' });
  }

  post(pathname: string, json?: unknown, init: AppRequestInit = {}): Promise<Response> {
    return this.fetch(pathname, { ...init, method: 'POST', json });
  }

  /** next-auth's CSRF token (also sets its cookie). */
  async csrfToken(): Promise<string> {
    const response = await this.get('/api/auth/csrf');
    const { csrfToken } = (await response.json()) as { csrfToken: string };
    return csrfToken;
  }

  /**
   * Password sign-in via POST /api/auth/callback/credentials.
   *
   * @returns true when a session cookie was set (false for a wrong password: next-auth redirects to the error page)
   */
  async signInWithPassword(email: string, password: string): Promise<boolean> {
    const csrfToken = await this.csrfToken();
    await this.fetch('/api/auth/callback/credentials', {
      method: 'POST',
      headers: { 'content-type': 'application/x-www-form-urlencoded' },
      body: new URLSearchParams({ csrfToken, email, password, callbackUrl: `${APP_URL}/` }),
    });
    return this.hasSession();
  }

  /** Whether the jar holds a next-auth session cookie. */
  hasSession(): boolean {
    return [...this.cookies.keys()].some((name) => name.endsWith('next-auth.session-token'));
  }

  /** The session next-auth reports (`{}` when signed out). */
  async session(): Promise<{ user?: { id?: string; email?: string; name?: string; isAdmin?: boolean } }> {
    const response = await this.get('/api/auth/session');
    return (await response.json()) as { user?: { id?: string; email?: string; isAdmin?: boolean } };
  }
}

/**
 * A new client signed in with a password; throws when sign-in fails.
 *
 * @example
 * const client = await signInWithPassword(owner.email, owner.password);
 * const res = await client.get('/api/manuscripts');
 */
export async function signInWithPassword(email: string, password: string): Promise<AppClient> {
  const client = new AppClient();
  if (!(await client.signInWithPassword(email, password))) {
    throw new Error(`password sign-in failed for ${email}`);
  }
  return client;
}
