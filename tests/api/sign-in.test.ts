// Sign-in through next-auth: password (right, wrong, unknown address) and one-time e-mail links read from
// the fake SMTP server's mailbox (link works once; unknown addresses get no mail).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sqlClient } from '@/db';
import { APP_URL, HttpClient } from '../helpers/http-client';
import { linkIn, linksIn, mailsTo, waitForMailTo } from '../helpers/mail';
import { createTestUser, type TestUser } from '../helpers/test-users';

let person: TestUser;
let admin: TestUser;

beforeAll(async () => {
  person = await createTestUser({ label: 'signin-person' });
  admin = await createTestUser({ label: 'signin-admin', role: 'admin' });
});

afterAll(async () => {
  await sqlClient.end({ timeout: 5 });
});

/** A fresh client signed in as `user` (or trying to, with another password). */
async function signIn(email: string, password: string): Promise<{ client: HttpClient; location: string }> {
  const client = new HttpClient();
  const { location } = await client.signInWithPassword(email, password);
  return { client, location };
}

describe('password sign-in', () => {
  it('signs in with the right password; the session carries id and admin flag', async () => {
    const { client } = await signIn(person.email, person.password);
    const session = await client.session();
    expect(session?.user).toMatchObject({ id: person.id, email: person.email, isAdmin: false });
    const me = await client.json('GET', '/api/me');
    expect(me.status).toBe(200);
    expect(me.body.user).toEqual({ id: person.id, name: person.name, email: person.email, isAdmin: false });
    expect(JSON.stringify(me.body)).not.toMatch(/password/i);
  });

  it('sends / to the dashboard when signed in and to the sign-in page otherwise', async () => {
    const anonymous = await new HttpClient().fetch('/');
    expect(anonymous.status).toBe(307);
    expect(anonymous.headers.get('location')).toMatch(/\/sign-in$/);
    const { client } = await signIn(person.email, person.password);
    const signedIn = await client.fetch('/');
    expect(signedIn.status).toBe(307);
    expect(signedIn.headers.get('location')).toMatch(/\/dashboard$/);
    // The dashboard streams its loading state first, so its redirect may arrive inside the body rather than as a header.
    const page = await new HttpClient().fetch('/dashboard');
    expect(page.headers.get('location') ?? (await page.text())).toMatch(/\/sign-in\?callbackUrl=%2Fdashboard/);
  });

  it('marks site admins in the session', async () => {
    const { client } = await signIn(admin.email, admin.password);
    expect((await client.session())?.user?.isAdmin).toBe(true);
  });

  it('accepts the address in any letter case', async () => {
    const { client } = await signIn(person.email.toUpperCase(), person.password);
    expect((await client.session())?.user?.id).toBe(person.id);
  });

  it('refuses a wrong password and an unknown address alike', async () => {
    for (const [email, password] of [
      [person.email, 'not the password'],
      [`nobody.${Date.now()}@fluxfolio.test`, 'whatever it is'],
    ]) {
      const { client, location } = await signIn(email, password);
      expect(location).toMatch(/error=CredentialsSignin/);
      expect(await client.session()).toBeNull();
      expect((await client.json('GET', '/api/me')).status).toBe(401);
    }
  });

  it('signs out', async () => {
    const { client } = await signIn(person.email, person.password);
    expect((await client.session())?.user?.id).toBe(person.id);
    await client.signOut();
    expect(await client.session()).toBeNull();
  });
});

describe('e-mail link sign-in', () => {
  it('sends a link through SMTP that signs in once', async () => {
    const since = new Date();
    expect(await new HttpClient().requestSignInLink(person.email)).toMatch(/verify-request|check-mail/);

    const mail = await waitForMailTo(person.email, { since });
    expect(mail.subject).toMatch(/sign-in link/i);
    const target = new URL(linkIn(mail, '/api/auth/callback/email'));
    expect(target.origin).toBe(new URL(APP_URL).origin);

    const browser = new HttpClient();
    const callback = await browser.fetch(`${target.pathname}${target.search}`);
    expect(callback.status).toBe(302);
    expect(callback.headers.get('location')).toMatch(/\/dashboard$/);
    expect((await browser.session())?.user).toMatchObject({ id: person.id, email: person.email });

    const again = new HttpClient();
    const second = await again.fetch(`${target.pathname}${target.search}`);
    expect(second.headers.get('location') ?? '').toMatch(/error=Verification/);
    expect(await again.session()).toBeNull();
  });

  it('answers an unknown address like a known one, and sends it no mail', async () => {
    const stranger = `stranger.${Date.now()}@fluxfolio.test`;
    const since = new Date();
    expect(await new HttpClient().requestSignInLink(stranger)).toMatch(/verify-request|check-mail/);
    // A known address's mail arrives within this time in the test above; give a stranger's the same chance.
    await new Promise((resolve) => setTimeout(resolve, 1_500));
    expect(await mailsTo(stranger, { since })).toHaveLength(0);
  });

  it('refuses an invalid address without sending mail', async () => {
    const since = new Date();
    expect(await new HttpClient().requestSignInLink('not-an-address')).toMatch(/error=/);
    expect(await mailsTo('not-an-address', { since })).toHaveLength(0);
  });
});
