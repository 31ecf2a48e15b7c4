// Each role's view, in the browser: sign in as owner, author, coauthor and site admin, take screenshots of the
// dashboard and the manuscript page (test-results/screenshots/<role>-*.png), and check the controls each may use.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { sqlClient } from '@/db';
import { APP_URL, createManuscript, createUser, type TestUser } from '../api/web-support';
import { launchBrowser, screenshot, signInThroughForm } from './web-browser';

type Role = 'owner' | 'author' | 'coauthor' | 'admin';

let browser: Browser;
const people = {} as Record<Role, TestUser>;
let shared: { slug: string; title: string };

beforeAll(async () => {
  browser = await launchBrowser();
  people.owner = await createUser({ label: 'olga' });
  people.author = await createUser({ label: 'arvid' });
  people.coauthor = await createUser({ label: 'chiara' });
  people.admin = await createUser({ label: 'site-admin', isAdmin: true });
  shared = await createManuscript({
    title: 'Flux-forced degeneracies in a two-well trap',
    members: [
      { user: people.owner, role: 'owner' },
      { user: people.author, role: 'author' },
      { user: people.coauthor, role: 'coauthor' },
    ],
  });
  await createManuscript({ title: 'Geometric phases on a flux lattice', members: [{ user: people.owner, role: 'owner' }] });
});

afterAll(async () => {
  await browser?.close();
  await sqlClient.end({ timeout: 5 });
});

async function count(page: Page, testId: string): Promise<number> {
  return page.getByTestId(testId).count();
}

const EXPECTED: Record<Role, { badge: string | null; details: boolean; invite: boolean; ownerActions: boolean; roleSelects: boolean; admin: boolean }> = {
  owner: { badge: 'Owner', details: true, invite: true, ownerActions: true, roleSelects: true, admin: false },
  author: { badge: 'Author', details: true, invite: false, ownerActions: false, roleSelects: false, admin: false },
  coauthor: { badge: 'Coauthor', details: false, invite: false, ownerActions: false, roleSelects: false, admin: false },
  admin: { badge: null, details: true, invite: true, ownerActions: true, roleSelects: true, admin: true },
};

describe.each(['owner', 'author', 'coauthor', 'admin'] as const)('%s', (role) => {
  it('sees a dashboard and a manuscript page with exactly the controls of the role', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    await signInThroughForm(page, people[role].email);
    const expectation = EXPECTED[role];

    // Dashboard: my manuscripts with my role; everyone may start one; admins also see every manuscript.
    await page.getByTestId(role === 'admin' ? 'manuscripts-all' : 'manuscripts-mine').waitFor();
    expect(await count(page, 'new-manuscript')).toBe(1);
    expect(await count(page, 'admin-section')).toBe(expectation.admin ? 1 : 0);
    if (expectation.badge) {
      const card = page.getByTestId('manuscripts-mine').getByTestId('manuscript-card').filter({ hasText: shared.title });
      await expect(card.getByTestId('role-badge').textContent()).resolves.toBe(expectation.badge);
    } else {
      await page.getByText('No manuscripts yet').waitFor();
    }
    await screenshot(page, `${role}-dashboard`);

    // Manuscript page.
    await page.goto(`${APP_URL}/m/${shared.slug}`);
    await page.getByTestId('members').waitFor();
    expect(await count(page, 'details-form')).toBe(expectation.details ? 1 : 0);
    expect(await count(page, 'invite-form')).toBe(expectation.invite ? 1 : 0);
    expect(await page.locator('#owner-actions').count()).toBe(expectation.ownerActions ? 1 : 0);
    expect((await count(page, 'member-role-select')) > 0).toBe(expectation.roleSelects);
    if (role === 'admin') await page.locator('main').getByText('Site admin', { exact: true }).waitFor();
    await screenshot(page, `${role}-manuscript`);
    await context.close();
  });
});

describe('small screens', () => {
  it('the manuscript page fits 375 px without sideways scrolling', async () => {
    const context = await browser.newContext({ viewport: { width: 375, height: 812 } });
    const page = await context.newPage();
    await signInThroughForm(page, people.owner.email);
    await page.goto(`${APP_URL}/m/${shared.slug}`);
    await page.getByTestId('members').waitFor();
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    await screenshot(page, 'owner-manuscript-375px');
    await context.close();
  });

  it('fields are reachable and labelled from the keyboard', async () => {
    const context = await browser.newContext({ viewport: { width: 375, height: 812 } });
    const page = await context.newPage();
    await page.goto(`${APP_URL}/sign-in`);
    // Tab from the top of the page (skip link, header links) until a form field has focus.
    for (let step = 0; step < 6; step++) {
      await page.keyboard.press('Tab');
      if (await page.evaluate(() => document.activeElement?.tagName === 'INPUT')) break;
    }
    const focused = await page.evaluate(() => {
      const element = document.activeElement as HTMLInputElement | null;
      return element ? { tag: element.tagName, name: element.name, label: element.labels?.[0]?.textContent ?? null } : null;
    });
    expect(focused).toMatchObject({ tag: 'INPUT', name: 'email', label: 'E-mail' });
    await context.close();
  });
});
