// Each role's view, in the browser: sign in as owner, author, coauthor and site admin, take screenshots of the
// dashboard and the manuscript page (test-results/screenshots/<role>-*.png), and check the controls each may use.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { sqlClient } from '@/db';
import { launchBrowser, newPage, screenshot } from '../helpers/browser';
import { createTestManuscript } from '../helpers/test-manuscripts';
import { createTestUser, type TestUser } from '../helpers/test-users';
import { DashboardPage } from './pages/dashboard-page';
import { ManuscriptPage } from './pages/manuscript-page';
import { SignInPage } from './pages/sign-in-page';

type Role = 'owner' | 'author' | 'coauthor' | 'admin';

let browser: Browser;
const people = {} as Record<Role, TestUser>;
let shared: { slug: string; title: string };

beforeAll(async () => {
  browser = await launchBrowser();
  people.owner = await createTestUser({ label: 'olga' });
  people.author = await createTestUser({ label: 'arvid' });
  people.coauthor = await createTestUser({ label: 'chiara' });
  people.admin = await createTestUser({ label: 'site-admin', role: 'admin' });
  shared = await createTestManuscript({
    title: 'Flux-forced degeneracies in a two-well trap',
    members: [
      { user: people.owner, role: 'owner' },
      { user: people.author, role: 'author' },
      { user: people.coauthor, role: 'coauthor' },
    ],
  });
  await createTestManuscript({ title: 'Geometric phases on a flux lattice', owner: people.owner });
});

afterAll(async () => {
  await browser?.close();
  await sqlClient.end({ timeout: 5 });
});

const EXPECTED: Record<Role, { badge: string | null; details: boolean; invite: boolean; ownerActions: boolean; roleSelects: boolean; admin: boolean }> = {
  owner: { badge: 'Owner', details: true, invite: true, ownerActions: true, roleSelects: true, admin: false },
  author: { badge: 'Author', details: true, invite: false, ownerActions: false, roleSelects: false, admin: false },
  coauthor: { badge: 'Coauthor', details: false, invite: false, ownerActions: false, roleSelects: false, admin: false },
  admin: { badge: null, details: true, invite: true, ownerActions: true, roleSelects: true, admin: true },
};

describe.each(['owner', 'author', 'coauthor', 'admin'] as const)('%s', (role) => {
  it('sees a dashboard and a manuscript page with exactly the controls of the role', async () => {
    const page = await newPage(browser);
    await new SignInPage(page).signIn(people[role]);
    const expectation = EXPECTED[role];

    // Dashboard: my manuscripts with my role; everyone may start one; admins also see every manuscript.
    const dashboard = new DashboardPage(page);
    await dashboard.waitForList(role === 'admin' ? 'all' : 'mine');
    expect(await dashboard.controls()).toEqual({ newManuscript: 1, adminSection: expectation.admin ? 1 : 0 });
    if (expectation.badge === null) await dashboard.waitForNoManuscripts();
    else expect(await dashboard.myRoleOn(shared.title)).toBe(expectation.badge);
    await screenshot(page, `${role}-dashboard`);

    // Manuscript page.
    const manuscript = new ManuscriptPage(page);
    await manuscript.open(shared.slug);
    const controls = await manuscript.controls();
    expect(controls).toMatchObject({
      details: expectation.details ? 1 : 0,
      invite: expectation.invite ? 1 : 0,
      ownerActions: expectation.ownerActions ? 1 : 0,
    });
    expect(controls.roleSelects > 0).toBe(expectation.roleSelects);
    if (role === 'admin') await manuscript.waitForSiteAdminMarker();
    await screenshot(page, `${role}-manuscript`);
    await page.context().close();
  });
});

describe('small screens', () => {
  it('the manuscript page fits 375 px without sideways scrolling', async () => {
    const page = await newPage(browser, { viewport: { width: 375, height: 812 } });
    await new SignInPage(page).signIn(people.owner);
    const manuscript = new ManuscriptPage(page);
    await manuscript.open(shared.slug);
    expect(await manuscript.sidewaysOverflow()).toBeLessThanOrEqual(0);
    await screenshot(page, 'owner-manuscript-375px');
    await page.context().close();
  });

  it('fields are reachable and labelled from the keyboard', async () => {
    const page = await newPage(browser, { viewport: { width: 375, height: 812 } });
    const signIn = new SignInPage(page);
    await signIn.open();
    expect(await signIn.tabToFirstField()).toMatchObject({ tag: 'INPUT', name: 'email', label: 'E-mail' });
    await page.context().close();
  });
});
