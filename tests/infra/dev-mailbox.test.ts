// The dev mailbox page (on in the test command: FLUXFOLIO_DEV_MAILBOX=1) shows the stored mail to site admins only;
// a signed-out visitor and a signed-in member get HTTP 404 and, in the browser, the same page as an unknown path.
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SignInPage } from '../e2e/pages/sign-in-page';
import { launchBrowser, newPage } from '../helpers/browser';
import { uniqueTag } from '../helpers/db';
import { HttpClient, signedInClient } from '../helpers/http-client';
import { waitForMailTo } from '../helpers/mail';
import { createTestUser } from '../helpers/test-users';
import { sendMail } from '@/lib/mail/send-mail';

const subject = `Mailbox check ${uniqueTag()}`;
let browser: Browser;

beforeAll(async () => {
  const since = new Date();
  await sendMail({ to: 'mailbox.reader@tests.fluxfolio.example.org', subject, text: 'A message for the dev mailbox.' });
  await waitForMailTo('mailbox.reader@tests.fluxfolio.example.org', { since, match: (m) => m.subject === subject });
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
});

/** Status and body text as the browser shows them once the page has settled. */
async function shown(page: Page, pathname: string): Promise<{ status: number | undefined; text: string }> {
  const response = await page.goto(pathname, { waitUntil: 'networkidle' });
  await page.getByRole('heading', { name: /Nothing here|Mailbox/ }).first().waitFor();
  return { status: response?.status(), text: (await page.locator('body').innerText()).trim() };
}

/** The raw HTTP answer: its status, and whether the message leaks anywhere in the body (scripts included). */
async function raw(client: HttpClient, pathname: string): Promise<{ status: number; leaks: boolean }> {
  const response = await client.get(pathname);
  return { status: response.status, leaks: (await response.text()).includes(subject) };
}

describe('dev mailbox page', () => {
  it('answers a signed-out visitor with 404 and the not-found page of an unknown path', async () => {
    expect(await raw(new HttpClient(), '/dev/mailbox')).toEqual({ status: 404, leaks: false });
    const page = await newPage(browser);
    const missing = await shown(page, `/no-such-page-${uniqueTag()}`);
    const mailbox = await shown(page, '/dev/mailbox');
    expect(missing.status).toBe(404);
    expect(mailbox.status).toBe(404);
    expect(mailbox.text).toMatch(/Nothing here/);
    expect(mailbox.text).toBe(missing.text);
  });

  it('answers a signed-in member who is not a site admin the same way', async () => {
    const member = await createTestUser({ label: 'mailbox-member' });
    const client = await signedInClient(member);
    expect(await raw(client, '/dev/mailbox')).toEqual({ status: 404, leaks: false });
    const page = await newPage(browser);
    await new SignInPage(page).signIn(member);
    const missing = await shown(page, `/no-such-page-${uniqueTag()}`);
    const mailbox = await shown(page, '/dev/mailbox');
    expect(mailbox.status).toBe(404);
    expect(mailbox.text).toMatch(/Nothing here/);
    expect(mailbox.text).toBe(missing.text);
  });

  it('shows the stored messages to a site admin', async () => {
    const admin = await createTestUser({ role: 'admin', label: 'mailbox-admin' });
    const client = await signedInClient(admin);
    expect(await raw(client, '/dev/mailbox')).toEqual({ status: 200, leaks: true });
    const page = await newPage(browser);
    await new SignInPage(page).signIn(admin);
    const mailbox = await shown(page, '/dev/mailbox');
    expect(mailbox.status).toBe(200);
    expect(mailbox.text).toContain(subject);
  });
});
