// The test harness itself, as scripts/test.sh sets it up: the app answers on APP_URL, password sign-in works for a
// fresh test user, chromium (playwright-core) opens the app and saves a screenshot, and the mailbox folder exists.
import { existsSync, statSync } from 'node:fs';
import type { Browser } from 'playwright-core';
import { afterAll, describe, expect, it } from 'vitest';
import { sqlClient } from '@/db';
import { launchBrowser, newPage, screenshot } from '../helpers/browser';
import { harnessEnv } from '../helpers/harness-env';
import { APP_URL, HttpClient, signedInClient } from '../helpers/http-client';
import { createTestUser } from '../helpers/test-users';

let browser: Browser | undefined;

afterAll(async () => {
  await browser?.close();
  await sqlClient.end({ timeout: 5 });
});

describe('test harness (`npm test` sets APP_URL, MAIL_DIR and CHROMIUM_PATH)', () => {
  it('serves the app on APP_URL: / sends a visitor without a session to the sign-in page', async () => {
    const response = await fetch(APP_URL, { redirect: 'manual' });
    expect(response.status).toBe(307);
    expect(response.headers.get('location')).toMatch(/\/sign-in$/);
  });

  it('has a mailbox folder for the fake SMTP server', () => {
    expect(existsSync(harnessEnv('MAIL_DIR'))).toBe(true);
  });

  it('signs a fresh user in with a password, and refuses a wrong one', async () => {
    const user = await createTestUser({ label: 'harness' });
    const client = await signedInClient(user);
    expect((await client.session())?.user?.email).toBe(user.email);
    const refused = await new HttpClient().signInWithPassword(user.email, 'wrong password');
    expect(refused.signedIn).toBe(false);
    expect(refused.location).toMatch(/error=CredentialsSignin/);
  });

  it('opens the app in chromium and saves a screenshot', async () => {
    browser = await launchBrowser();
    const page = await newPage(browser);
    const response = await page.goto('/', { waitUntil: 'load' });
    expect(response?.status()).toBe(200);
    expect(new URL(page.url()).pathname).toBe('/sign-in');
    const file = await screenshot(page, 'harness-home');
    expect(statSync(file).size).toBeGreaterThan(1000);
  });
});
