// Browser tests: Debian's chromium driven by playwright-core (no browser download), pages at APP_URL and
// screenshots under test-results/screenshots/.
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';
import { APP_URL } from './http-client';

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
