// Browser support for the foundation end-to-end tests (on top of tests/helpers/browser): password sign-in through
// the password form of /sign-in, which shares its page with the e-mail-link form.
import type { Page } from 'playwright-core';
import { APP_URL, PASSWORD } from '../api/web-support';

export { launchBrowser, screenshot } from '../helpers/browser';

/** Sign in through the password form of /sign-in and wait for the dashboard. */
export async function signInThroughForm(page: Page, email: string, password = PASSWORD): Promise<void> {
  await page.goto(`${APP_URL}/sign-in`);
  const form = page.getByTestId('password-form');
  await form.getByLabel('E-mail').fill(email);
  await form.getByLabel('Password').fill(password);
  await form.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL(/\/dashboard$/);
}
