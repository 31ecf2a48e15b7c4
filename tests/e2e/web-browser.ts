// Browser support for the foundation end-to-end tests: Debian chromium driven by playwright-core (no browser
// download), password sign-in through the real form, and screenshots under test-results/screenshots.
import { mkdir } from 'node:fs/promises';
import path from 'node:path';
import { chromium, type Browser, type Page } from 'playwright-core';
import { APP_URL, PASSWORD } from '../api/web-support';

export const SCREENSHOT_DIR = path.resolve('test-results/screenshots');

export async function launchBrowser(): Promise<Browser> {
  await mkdir(SCREENSHOT_DIR, { recursive: true });
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH || '/usr/bin/chromium',
    headless: true,
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-background-networking',
      '--disable-component-update',
      '--no-first-run',
      '--disable-sync',
      '--disable-quic',
    ],
  });
}

/** Sign in through the password form of /sign-in and wait for the dashboard. */
export async function signInThroughForm(page: Page, email: string, password = PASSWORD): Promise<void> {
  await page.goto(`${APP_URL}/sign-in`);
  const form = page.getByTestId('password-form');
  await form.getByLabel('E-mail').fill(email);
  await form.getByLabel('Password').fill(password);
  await form.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL(/\/dashboard$/);
}

export async function screenshot(page: Page, name: string): Promise<string> {
  const file = path.join(SCREENSHOT_DIR, `${name}.png`);
  await page.screenshot({ path: file, fullPage: true });
  return file;
}
