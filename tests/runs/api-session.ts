// Test helper for the runs API tests: a signed-in HTTP client with a cookie jar against APP_URL (next-auth
// credentials flow: csrf token, then the credentials callback), and users with passwords in the test database.
import { randomUUID } from 'node:crypto';
import bcrypt from 'bcryptjs';
import { db } from '@/db';
import { memberships, users, type MemberRole } from '@/db/schema';

export const APP_URL = process.env.APP_URL ?? '';

export interface ApiClient {
  user: { id: string; email: string };
  fetch: (path: string, init?: RequestInit & { json?: unknown }) => Promise<Response>;
}

/** A user with a password (bcrypt cost 4: test-only speed; the app's own hashes use cost 10). */
export async function createPasswordUser(): Promise<{ id: string; email: string; password: string }> {
  const tag = randomUUID().slice(0, 8);
  const password = `pw-${randomUUID()}`;
  const [user] = await db
    .insert(users)
    .values({ email: `api-${tag}@lab.example.org`, name: `API Tester ${tag}`, passwordHash: bcrypt.hashSync(password, 4) })
    .returning({ id: users.id, email: users.email });
  return { ...user, password };
}

export async function addMember(manuscriptId: string, userId: string, role: MemberRole): Promise<void> {
  await db.insert(memberships).values({ manuscriptId, userId, role });
}

/** Sign in through next-auth's credentials callback and return a client that sends the session cookie. */
export async function signIn(user: { id: string; email: string; password: string }): Promise<ApiClient> {
  const jar = new Map<string, string>();
  const remember = (response: Response) => {
    for (const header of response.headers.getSetCookie()) {
      const [pair] = header.split(';');
      const index = pair.indexOf('=');
      jar.set(pair.slice(0, index), pair.slice(index + 1));
    }
  };
  const cookie = () => [...jar].map(([k, v]) => `${k}=${v}`).join('; ');

  const csrfResponse = await fetch(`${APP_URL}/api/auth/csrf`);
  remember(csrfResponse);
  const { csrfToken } = (await csrfResponse.json()) as { csrfToken: string };
  const login = await fetch(`${APP_URL}/api/auth/callback/credentials`, {
    method: 'POST',
    redirect: 'manual',
    headers: { 'content-type': 'application/x-www-form-urlencoded', cookie: cookie() },
    body: new URLSearchParams({ csrfToken, email: user.email, password: user.password, json: 'true' }),
  });
  remember(login);
  if (![...jar.keys()].some((name) => name.includes('session-token'))) {
    throw new Error(`sign-in failed for ${user.email}: HTTP ${login.status}`);
  }

  return {
    user: { id: user.id, email: user.email },
    fetch: (path, init = {}) => {
      const { json, headers, ...rest } = init;
      return fetch(`${APP_URL}${path}`, {
        ...rest,
        redirect: 'manual',
        headers: {
          ...(json !== undefined ? { 'content-type': 'application/json' } : {}),
          ...(headers as Record<string, string> | undefined),
          cookie: cookie(),
        },
        body: json !== undefined ? JSON.stringify(json) : rest.body,
      });
    },
  };
}
