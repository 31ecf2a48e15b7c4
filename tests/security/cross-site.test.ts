// Cross-site request checks against the running app: a browser session's mutations need our Origin (or Sec-Fetch-Site:
// same-origin) and a JSON body; next-auth's posts need our Origin; a bearer request without a cookie skips the origin
// check and is then refused as unauthenticated (API tokens do not exist yet).
import { eq, count } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sqlClient } from '@/db';
import { manuscripts } from '@/db/schema';
import { testDb, uniqueTag } from '../helpers/db';
import { APP_URL, signedInClient, type HttpClient } from '../helpers/http-client';
import { createTestUser, type TestUser } from '../helpers/test-users';

let user: TestUser;
let client: HttpClient;

beforeAll(async () => {
  user = await createTestUser({ label: 'cross-site' });
  client = await signedInClient(user);
});

afterAll(async () => {
  await sqlClient.end({ timeout: 5 });
});

async function manuscriptsTitled(title: string): Promise<number> {
  const [{ n }] = await testDb.select({ n: count() }).from(manuscripts).where(eq(manuscripts.title, title));
  return n;
}

/** POST /api/manuscripts with exactly these headers plus the session cookie (no Origin unless given). */
function createWithHeaders(title: string, headers: Record<string, string>, body = JSON.stringify({ title })): Promise<Response> {
  return fetch(`${APP_URL}/api/manuscripts`, {
    method: 'POST',
    headers: { cookie: client.cookieHeader(), ...headers },
    body,
    redirect: 'manual',
  });
}

describe('mutations with a session cookie', () => {
  it('creates with our Origin and application/json (the control case)', async () => {
    const title = `Same origin ${uniqueTag()}`;
    const response = await createWithHeaders(title, { origin: new URL(APP_URL).origin, 'content-type': 'application/json' });
    expect(response.status).toBe(201);
    expect(await manuscriptsTitled(title)).toBe(1);
  });

  it('accepts Sec-Fetch-Site: same-origin without an Origin header', async () => {
    const title = `Fetch metadata ${uniqueTag()}`;
    const response = await createWithHeaders(title, { 'sec-fetch-site': 'same-origin', 'content-type': 'application/json' });
    expect(response.status).toBe(201);
    expect(await manuscriptsTitled(title)).toBe(1);
  });

  it('refuses a text/plain body with 415 and stores nothing', async () => {
    const title = `Text plain ${uniqueTag()}`;
    const response = await createWithHeaders(title, { origin: new URL(APP_URL).origin, 'content-type': 'text/plain' });
    expect(response.status).toBe(415);
    expect(((await response.json()) as { error: string }).error).toMatch(/application\/json/);
    expect(await manuscriptsTitled(title)).toBe(0);
  });

  it('refuses a form-encoded body with 415 and stores nothing', async () => {
    const title = `Form post ${uniqueTag()}`;
    const response = await createWithHeaders(
      title,
      { origin: new URL(APP_URL).origin, 'content-type': 'application/x-www-form-urlencoded' },
      new URLSearchParams({ title }).toString(),
    );
    expect(response.status).toBe(415);
    expect(await manuscriptsTitled(title)).toBe(0);
  });

  it('refuses another Origin with 403 and stores nothing', async () => {
    const title = `Cross origin ${uniqueTag()}`;
    const response = await createWithHeaders(title, { origin: 'https://elsewhere.example.net', 'content-type': 'application/json' });
    expect(response.status).toBe(403);
    expect(((await response.json()) as { error: string }).error).toMatch(/cross-site/);
    expect(await manuscriptsTitled(title)).toBe(0);
  });

  it('refuses Sec-Fetch-Site: cross-site with a foreign Origin', async () => {
    const title = `Cross site ${uniqueTag()}`;
    const response = await createWithHeaders(title, {
      origin: 'https://elsewhere.example.net',
      'sec-fetch-site': 'cross-site',
      'content-type': 'application/json',
    });
    expect(response.status).toBe(403);
    expect(await manuscriptsTitled(title)).toBe(0);
  });

  it('refuses a request with neither Origin nor Sec-Fetch-Site with 403', async () => {
    const title = `No origin ${uniqueTag()}`;
    const response = await createWithHeaders(title, { 'content-type': 'application/json' });
    expect(response.status).toBe(403);
    expect(await manuscriptsTitled(title)).toBe(0);
  });

  it('checks DELETE too', async () => {
    const response = await fetch(`${APP_URL}/api/manuscripts/00000000-0000-4000-8000-000000000000`, {
      method: 'DELETE',
      headers: { cookie: client.cookieHeader(), origin: 'https://elsewhere.example.net' },
    });
    expect(response.status).toBe(403);
  });
});

describe('requests without a session cookie', () => {
  it('a bearer token skips the origin check and is refused as unauthenticated (401) until API tokens exist', async () => {
    const title = `Bearer ${uniqueTag()}`;
    const response = await fetch(`${APP_URL}/api/manuscripts`, {
      method: 'POST',
      headers: { authorization: 'Bearer not-a-token-yet', origin: 'https://elsewhere.example.net', 'content-type': 'application/json' },
      body: JSON.stringify({ title }),
    });
    expect(response.status).toBe(401);
    expect(await manuscriptsTitled(title)).toBe(0);
  });

  it('a bearer header next to a session cookie is still checked', async () => {
    const title = `Bearer and cookie ${uniqueTag()}`;
    const response = await createWithHeaders(title, {
      authorization: 'Bearer not-a-token-yet',
      origin: 'https://elsewhere.example.net',
      'content-type': 'application/json',
    });
    expect(response.status).toBe(403);
    expect(await manuscriptsTitled(title)).toBe(0);
  });
});

describe("next-auth's posts", () => {
  it('refuses a password sign-in posted from another origin (before next-auth runs)', async () => {
    const csrf = await fetch(`${APP_URL}/api/auth/csrf`);
    const { csrfToken } = (await csrf.json()) as { csrfToken: string };
    const cookie = csrf.headers.getSetCookie().map((line) => line.split(';')[0]).join('; ');
    const post = (origin: string) =>
      fetch(`${APP_URL}/api/auth/callback/credentials`, {
        method: 'POST',
        redirect: 'manual',
        headers: { cookie, origin, 'content-type': 'application/x-www-form-urlencoded' },
        body: new URLSearchParams({ csrfToken, email: user.email, password: user.password, callbackUrl: `${APP_URL}/` }),
      });
    const foreign = await post('https://elsewhere.example.net');
    expect(foreign.status).toBe(403);
    expect(foreign.headers.getSetCookie().some((line) => line.includes('session-token='))).toBe(false);
    // The same form from our own origin signs in (a form post, exempt from the JSON rule).
    const own = await post(new URL(APP_URL).origin);
    expect(own.status).toBe(302);
    expect(own.headers.getSetCookie().some((line) => /session-token=[^;]+/.test(line))).toBe(true);
  });
});
