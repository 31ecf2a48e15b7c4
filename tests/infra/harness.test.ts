// The test harness itself, as scripts/test.sh sets it up: the app answers on APP_URL, password sign-in works for a
// fresh test user, chromium (playwright-core) opens the app and saves a screenshot, and the mailbox folder exists.
import { existsSync, statSync } from 'node:fs';
import type { Browser } from 'playwright-core';
import { afterAll, describe, expect, it } from 'vitest';
import { APP_URL, AppClient, signInWithPassword } from '../helpers/app';
import { launchBrowser, newPage, screenshot } from '../helpers/browser';
import { createTestUser } from '../helpers/db';

const served = Boolean(process.env.APP_URL);
let browser: Browser | undefined;

afterAll(async () => {
  await browser?.close();
});

describe.skipIf(!served)('test harness (needs `npm test`: APP_URL, MAIL_DIR, CHROMIUM_PATH)', () => {
  it('serves the app on APP_URL', async () => {
    const response = await fetch(APP_URL, { redirect: 'manual' });
    expect(response.status).toBeLessThan(500);
  });

  it('has a mailbox folder for the fake SMTP server', () => {
    expect(existsSync(process.env.MAIL_DIR!)).toBe(true);
  });

  it('signs a fresh user in with a password, and refuses a wrong one', async () => {
    const user = await createTestUser({ label: 'harness' });
    const client = await signInWithPassword(user.email, user.password);
    const session = await client.session();
    expect(session.user?.email).toBe(user.email);
    expect(await new AppClient().signInWithPassword(user.email, 'wrong password')).toBe(false);
  });

  it('opens the app in chromium and saves a screenshot', async () => {
    browser = await launchBrowser();
    const page = await newPage(browser);
    const response = await page.goto('/', { waitUntil: 'load' });
    expect(response?.status()).toBeLessThan(500);
    const file = await screenshot(page, 'harness-home');
    expect(statSync(file).size).toBeGreaterThan(1000);
  });
});
