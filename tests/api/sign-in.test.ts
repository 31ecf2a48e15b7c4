// Sign-in through next-auth: password (right, wrong, unknown address) and one-time e-mail links read from
// the fake SMTP server's mailbox (link works once; unknown addresses get no mail).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sqlClient } from '@/db';
import { APP_URL, Client, createUser, mailsTo, waitForMailTo, type TestUser } from './web-support';

let person: TestUser;
let admin: TestUser;

beforeAll(async () => {
  person = await createUser({ label: 'signin-person' });
  admin = await createUser({ label: 'signin-admin', isAdmin: true });
});

afterAll(async () => {
  await sqlClient.end({ timeout: 5 });
});

async function requestLink(client: Client, email: string): Promise<Response> {
  const csrfToken = await client.csrfToken();
  const response = await client.request('/api/auth/signin/email', {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ csrfToken, email, callbackUrl: `${APP_URL}/dashboard` }),
  });
  await response.text();
  return response;
}

describe('password sign-in', () => {
  it('signs in with the right password; the session carries id and admin flag', async () => {
    const client = new Client();
    await client.signInWithPassword(person.email);
    const session = await client.session();
    expect(session?.user).toMatchObject({ id: person.id, email: person.email, isAdmin: false });
    const me = await client.json('GET', '/api/me');
    expect(me.status).toBe(200);
    expect(me.body.user).toEqual({ id: person.id, name: person.name, email: person.email, isAdmin: false });
    expect(JSON.stringify(me.body)).not.toMatch(/password/i);
  });

  it('sends / to the dashboard when signed in and to the sign-in page otherwise', async () => {
    const anonymous = await new Client().request('/');
    expect(anonymous.status).toBe(307);
    expect(anonymous.headers.get('location')).toMatch(/\/sign-in$/);
    const client = new Client();
    await client.signInWithPassword(person.email);
    const signedIn = await client.request('/');
    expect(signedIn.headers.get('location')).toMatch(/\/dashboard$/);
    // The dashboard streams its loading state first, so its redirect may arrive inside the body rather than as a header.
    const page = await new Client().request('/dashboard');
    expect(page.headers.get('location') ?? (await page.text())).toMatch(/\/sign-in\?callbackUrl=%2Fdashboard/);
  });

  it('marks site admins in the session', async () => {
    const client = new Client();
    await client.signInWithPassword(admin.email);
    expect((await client.session())?.user?.isAdmin).toBe(true);
  });

  it('accepts the address in any letter case', async () => {
    const client = new Client();
    await client.signInWithPassword(person.email.toUpperCase());
    expect((await client.session())?.user?.id).toBe(person.id);
  });

  it('refuses a wrong password and an unknown address alike', async () => {
    for (const [email, password] of [
      [person.email, 'not the password'],
      [`nobody.${Date.now()}@fluxfolio.test`, 'whatever it is'],
    ]) {
      const client = new Client();
      const location = await client.signInWithPassword(email, password);
      expect(location).toMatch(/error=CredentialsSignin/);
      expect(await client.session()).toBeNull();
      expect((await client.json('GET', '/api/me')).status).toBe(401);
    }
  });

  it('signs out', async () => {
    const client = new Client();
    await client.signInWithPassword(person.email);
    const csrfToken = await client.csrfToken();
    await client.request('/api/auth/signout', {
      method: 'POST',
      headers: { 'content-type': 'application/x-www-form-urlencoded' },
      body: new URLSearchParams({ csrfToken }),
    });
    expect(await client.session()).toBeNull();
  });
});

describe('e-mail link sign-in', () => {
  it('sends a link through SMTP that signs in once', async () => {
    const since = Date.now();
    const client = new Client();
    const response = await requestLink(client, person.email);
    expect(response.headers.get('location') ?? '').toMatch(/verify-request|check-mail/);

    const mail = await waitForMailTo(person.email, since);
    expect(mail.subject).toMatch(/sign-in link/i);
    const link = mail.links.find((url) => url.includes('/api/auth/callback/email'));
    expect(link, mail.raw).toBeTruthy();
    const target = new URL(link!);
    expect(target.origin).toBe(new URL(APP_URL).origin);

    const browser = new Client();
    const callback = await browser.request(`${target.pathname}${target.search}`);
    expect(callback.status).toBe(302);
    expect(callback.headers.get('location')).toMatch(/\/dashboard$/);
    expect((await browser.session())?.user).toMatchObject({ id: person.id, email: person.email });

    const again = new Client();
    const second = await again.request(`${target.pathname}${target.search}`);
    expect(second.headers.get('location') ?? '').toMatch(/error=Verification/);
    expect(await again.session()).toBeNull();
  });

  it('answers an unknown address like a known one, and sends it no mail', async () => {
    const stranger = `stranger.${Date.now()}@fluxfolio.test`;
    const since = Date.now();
    const response = await requestLink(new Client(), stranger);
    expect(response.headers.get('location') ?? '').toMatch(/verify-request|check-mail/);
    // A known address's mail arrives within this time in the test above; give a stranger's the same chance.
    await new Promise((resolve) => setTimeout(resolve, 1_500));
    expect(await mailsTo(stranger, since)).toHaveLength(0);
  });

  it('refuses an invalid address without sending mail', async () => {
    const since = Date.now();
    const response = await requestLink(new Client(), 'not-an-address');
    expect(response.headers.get('location') ?? '').toMatch(/error=/);
    expect(await mailsTo('not-an-address', since)).toHaveLength(0);
  });
});
