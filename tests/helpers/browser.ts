// Browser tests: Debian's chromium driven by playwright-core (no browser download), pages at APP_URL and
// screenshots under test-results/screenshots/.
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';
import { APP_URL } from './app';

/** Flags that make chromium run headless as root in a container without network chatter (STACK.md §4). */
export const CHROMIUM_ARGS = [
  '--no-sandbox',
  '--disable-gpu',
  '--disable-dev-shm-usage',
  '--disable-background-networking',
  '--disable-component-update',
  '--no-first-run',
  '--disable-sync',
  '--disable-quic',
];

export const SCREENSHOT_DIR = path.resolve('test-results', 'screenshots');

/**
 * Launch headless chromium (CHROMIUM_PATH, default /usr/bin/chromium). Close it in `afterAll`.
 *
 * @example
 * const browser = await launchBrowser();
 * const page = await newPage(browser);
 */
export async function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH || '/usr/bin/chromium',
    headless: true,
    args: CHROMIUM_ARGS,
  });
}

/**
 * A page in a fresh context (own cookies) whose relative `goto('/path')` resolves against APP_URL.
 *
 * @param options.viewport - default 1280×900; pass e.g. { width: 390, height: 844 } for a phone
 */
export async function newPage(
  browser: Browser,
  { viewport = { width: 1280, height: 900 } }: { viewport?: { width: number; height: number } } = {},
): Promise<Page> {
  const context: BrowserContext = await browser.newContext({ baseURL: APP_URL, viewport, locale: 'en-GB' });
  context.setDefaultTimeout(20_000);
  return context.newPage();
}

/**
 * Save a full-page screenshot as test-results/screenshots/<name>.png and return its path.
 *
 * @example
 * await screenshot(page, 'owner-dashboard');
 */
export async function screenshot(page: Page, name: string): Promise<string> {
  mkdirSync(SCREENSHOT_DIR, { recursive: true });
  const file = path.join(SCREENSHOT_DIR, `${name.replace(/[^a-zA-Z0-9._-]+/g, '-')}.png`);
  await page.screenshot({ path: file, fullPage: true });
  return file;
}

/**
 * Sign in through the app's own sign-in page by filling the password form's e-mail and password fields and
 * submitting; waits until the URL leaves /sign-in.
 */
export async function signInInBrowser(page: Page, email: string, password: string): Promise<void> {
  await page.goto('/sign-in');
  // Scope to the password form: the form itself is labelled by its heading, which also mentions the password.
  const form = page.getByTestId('password-form');
  await form.getByRole('textbox', { name: /e-?mail/i }).fill(email);
  await form.locator('input[type="password"]').fill(password);
  await form.getByRole('button', { name: /sign in/i }).click();
  await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
}
