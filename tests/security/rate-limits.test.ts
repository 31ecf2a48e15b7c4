// Rate limits against the running app and the real database: the limit module itself, wrong passwords (the 21st within a
// minute gets 429; an unknown account costs the same bcrypt time), sign-in link mail (none to unknown addresses, a limit per
// address), and invitations per manuscript per day.
import { and, count, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sqlClient } from '@/db';
import { invitations, users } from '@/db/schema';
import { hashPassword } from '@/lib/auth/password';
import { clientKey, DIRECT_CLIENT_KEY } from '@/lib/rate-limit/client-key';
import { forgetHit, hit } from '@/lib/rate-limit/hit';
import { INVITATIONS_PER_MANUSCRIPT, PASSWORD_PER_ACCOUNT, SIGN_IN_LINK_PER_ADDRESS } from '@/lib/rate-limit/limits';
import { RateLimitedError } from '@/lib/rate-limit/rate-limited-error';
import { listMessages } from '@/lib/mail/mailbox';
import { testDb, uniqueTag } from '../helpers/db';
import { APP_URL, HttpClient, signedInClient } from '../helpers/http-client';
import { createTestTeam } from '../helpers/test-manuscripts';
import { createTestUser } from '../helpers/test-users';
import { rejectionOf } from '../helpers/thrown';
import { waitForMailTo } from '../helpers/mail';

afterAll(async () => {
  await sqlClient.end({ timeout: 5 });
});

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length / 2)];
}

/** One password attempt through next-auth's form post; returns the response (302 on an answer, 429 when limited). */
async function passwordAttempt(email: string, password: string): Promise<{ response: Response; ms: number }> {
  const client = new HttpClient();
  const csrfToken = await client.csrfToken();
  const started = performance.now();
  const response = await client.fetch('/api/auth/callback/credentials', {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ csrfToken, email, password, callbackUrl: `${APP_URL}/` }),
  });
  const ms = performance.now() - started;
  await response.arrayBuffer();
  return { response, ms };
}

async function requestSignInLink(email: string): Promise<Response> {
  const client = new HttpClient();
  const csrfToken = await client.csrfToken();
  const response = await client.fetch('/api/auth/signin/email', {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ csrfToken, email, callbackUrl: `${APP_URL}/dashboard` }),
  });
  await response.arrayBuffer();
  return response;
}

describe('the limit module (lib/rate-limit, PostgreSQL)', () => {
  it('admits `limit` attempts per window, then refuses with a Retry-After within the window', async () => {
    const key = `unit-${uniqueTag()}`;
    for (let i = 0; i < 3; i += 1) await hit({ bucket: 'test-unit', key, limit: 3, windowSeconds: 60 });
    const refused = hit({ bucket: 'test-unit', key, limit: 3, windowSeconds: 60, message: 'slow down' });
    await expect(refused).rejects.toBeInstanceOf(RateLimitedError);
    await expect(hit({ bucket: 'test-unit', key, limit: 3, windowSeconds: 60 })).rejects.toMatchObject({
      retryAfterSeconds: expect.any(Number),
    });
    const error = await rejectionOf(hit({ bucket: 'test-unit', key, limit: 3, windowSeconds: 60 }));
    expect(error).toBeInstanceOf(RateLimitedError);
    expect((error as RateLimitedError).retryAfterSeconds).toBeGreaterThanOrEqual(1);
    expect((error as RateLimitedError).retryAfterSeconds).toBeLessThanOrEqual(60);
    // Another key and another bucket are counted apart.
    await expect(hit({ bucket: 'test-unit', key: `${key}-other`, limit: 3, windowSeconds: 60 })).resolves.toHaveProperty('id');
    await expect(hit({ bucket: 'test-unit-other', key, limit: 3, windowSeconds: 60 })).resolves.toHaveProperty('id');
    // A hostile key (NUL bytes, great length) is counted, not a crash.
    await expect(hit({ bucket: 'test-unit', key: `${key}\u0000${'x'.repeat(5000)}`, limit: 3, windowSeconds: 60 })).resolves.toHaveProperty('id');
  });

  it('frees a slot when an attempt is forgotten, and counts concurrent attempts exactly', async () => {
    const key = `unit-${uniqueTag()}`;
    const results = await Promise.allSettled(
      Array.from({ length: 8 }, () => hit({ bucket: 'test-unit', key, limit: 5, windowSeconds: 60 })),
    );
    expect(results.filter((r) => r.status === 'fulfilled')).toHaveLength(5);
    expect(results.filter((r) => r.status === 'rejected')).toHaveLength(3);
    const first = results.find((r) => r.status === 'fulfilled') as PromiseFulfilledResult<{ id: string }>;
    await forgetHit(first.value);
    await expect(hit({ bucket: 'test-unit', key, limit: 5, windowSeconds: 60 })).resolves.toHaveProperty('id');
    await expect(hit({ bucket: 'test-unit', key, limit: 5, windowSeconds: 60 })).rejects.toBeInstanceOf(RateLimitedError);
  });

  it('takes the client from X-Forwarded-For only behind a trusted proxy', () => {
    const request = new Request('http://127.0.0.1/', { headers: { 'x-forwarded-for': '203.0.113.7, 10.0.0.1' } });
    expect(clientKey(request, {})).toBe(DIRECT_CLIENT_KEY);
    expect(clientKey(request, { FLUXFOLIO_TRUST_PROXY: '1' })).toBe('203.0.113.7');
    const forged = new Request('http://127.0.0.1/', { headers: { 'x-forwarded-for': '<script>' } });
    expect(clientKey(forged, { FLUXFOLIO_TRUST_PROXY: '1' })).toBe(DIRECT_CLIENT_KEY);
  });
});

describe('password sign-in', () => {
  it('answers the 21st wrong password for one account within a minute with 429, and then refuses even the right one', async () => {
    const person = await createTestUser({ label: 'guessed' });
    const started = Date.now();
    for (let i = 0; i < PASSWORD_PER_ACCOUNT.limit; i += 1) {
      const { response } = await passwordAttempt(person.email, `wrong guess ${i}`);
      expect(response.status, `attempt ${i + 1}`).toBe(302);
      expect(response.headers.get('location')).toMatch(/error=CredentialsSignin/);
    }
    const { response: limited } = await passwordAttempt(person.email.toUpperCase(), 'wrong guess 21');
    expect(Date.now() - started).toBeLessThan(60_000);
    expect(limited.status).toBe(429);
    expect(Number(limited.headers.get('retry-after'))).toBeGreaterThan(0);
    const { response: right } = await passwordAttempt(person.email, person.password);
    expect(right.status).toBe(429);
    expect(right.headers.getSetCookie().some((line) => /session-token=[^;]+/.test(line))).toBe(false);
    // Other accounts are not affected.
    const other = await createTestUser({ label: 'unaffected' });
    await expect(signedInClient(other)).resolves.toBeInstanceOf(HttpClient);
  });

  it('does not count successful sign-ins', async () => {
    const person = await createTestUser({ label: 'frequent' });
    for (let i = 0; i < PASSWORD_PER_ACCOUNT.limit + 2; i += 1) {
      const { response } = await passwordAttempt(person.email, person.password);
      expect(response.status, `sign-in ${i + 1}`).toBe(302);
      expect(response.headers.get('location')).not.toMatch(/error=/);
    }
  });

  it('spends about the same time on an unknown account as on a known one', async () => {
    const known = await createTestUser({ label: 'timed' });
    // The app's own cost (10), not the test helper's quick cost-4 hash.
    await testDb.update(users).set({ passwordHash: await hashPassword(known.password) }).where(eq(users.id, known.id));
    const knownTimes: number[] = [];
    const unknownTimes: number[] = [];
    for (let i = 0; i < 5; i += 1) {
      knownTimes.push((await passwordAttempt(known.email, `wrong ${i}`)).ms);
      unknownTimes.push((await passwordAttempt(`nobody.${uniqueTag()}@tests.fluxfolio.example.org`, `wrong ${i}`)).ms);
    }
    // Loose: without the equalising hash an unknown account answers several times faster than a known one.
    expect(median(unknownTimes)).toBeGreaterThan(0.5 * median(knownTimes));
    expect(median(knownTimes)).toBeGreaterThan(0.5 * median(unknownTimes));
  });
});

describe('sign-in link mail', () => {
  it('sends no mail to an unknown address, answering as for a known one', async () => {
    const known = await createTestUser({ label: 'linked' });
    const stranger = `stranger.${uniqueTag()}@tests.fluxfolio.example.org`;
    const since = new Date();
    const strangerResponse = await requestSignInLink(stranger);
    const knownResponse = await requestSignInLink(known.email);
    expect(strangerResponse.status).toBe(302);
    expect(knownResponse.status).toBe(302);
    expect(strangerResponse.headers.get('location')).toBe(knownResponse.headers.get('location'));
    // The known address's mail arrives; by then the stranger's would have too (sent first).
    await waitForMailTo(known.email, { since });
    const toStranger = (await listMessages()).filter((m) => m.to.some((to) => to.toLowerCase() === stranger));
    expect(toStranger).toHaveLength(0);
  });

  it('refuses more than the per-address number of link requests with 429', async () => {
    const address = `often.${uniqueTag()}@tests.fluxfolio.example.org`;
    for (let i = 0; i < SIGN_IN_LINK_PER_ADDRESS.limit; i += 1) {
      expect((await requestSignInLink(address)).status, `request ${i + 1}`).toBe(302);
    }
    const client = new HttpClient();
    const csrfToken = await client.csrfToken();
    const limited = await client.fetch('/api/auth/signin/email', {
      method: 'POST',
      headers: { 'content-type': 'application/x-www-form-urlencoded' },
      body: new URLSearchParams({ csrfToken, email: address, callbackUrl: `${APP_URL}/dashboard`, json: 'true' }),
    });
    expect(limited.status).toBe(429);
    // next-auth's browser client reads `url` and shows the sign-in page's message for ?error=RateLimited.
    const body = (await limited.json()) as { error: string; url: string };
    expect(new URL(body.url).searchParams.get('error')).toBe('RateLimited');
    expect(body.error).toMatch(/too many/i);
  });
});

describe('invitations', () => {
  it('refuses invitations beyond the daily number per manuscript with 429 and stores none', async () => {
    const team = await createTestTeam({ title: 'Invitation limit' });
    const owner = await signedInClient(team.owner);
    const invite = (email: string) => owner.post(`/api/manuscripts/${team.manuscript.id}/members`, { email, role: 'coauthor' });
    expect((await invite(`first.${uniqueTag()}@tests.fluxfolio.example.org`)).status).toBe(201);
    // Fill the rest of the day's allowance in the same bucket the route counts in (sending 49 mails adds nothing).
    for (let i = 1; i < INVITATIONS_PER_MANUSCRIPT.limit; i += 1) {
      await hit({ ...INVITATIONS_PER_MANUSCRIPT, key: team.manuscript.id });
    }
    const refusedEmail = `one-too-many.${uniqueTag()}@tests.fluxfolio.example.org`;
    const refused = await invite(refusedEmail);
    expect(refused.status).toBe(429);
    expect(Number(refused.headers.get('retry-after'))).toBeGreaterThan(0);
    expect(((await refused.json()) as { error: string }).error).toMatch(/invitations/);
    const [{ n }] = await testDb
      .select({ n: count() })
      .from(invitations)
      .where(and(eq(invitations.manuscriptId, team.manuscript.id), eq(invitations.email, refusedEmail)));
    expect(n).toBe(0);
    // Another manuscript is not affected.
    const other = await createTestTeam({ title: 'Invitation limit other' });
    const otherOwner = await signedInClient(other.owner);
    const ok = await otherOwner.post(`/api/manuscripts/${other.manuscript.id}/members`, {
      email: `fine.${uniqueTag()}@tests.fluxfolio.example.org`,
      role: 'coauthor',
    });
    expect(ok.status).toBe(201);
  });
});
