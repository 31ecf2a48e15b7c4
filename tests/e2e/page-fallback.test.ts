// Pages hand their server-loaded data to the client hooks as SWR fallback: opening a manuscript page or a figure page
// issues no GET for the members, the pending invitations or the figure, until a mutation asks the hook to revalidate.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { sqlClient } from '@/db';
import { launchBrowser, newPage } from '../helpers/browser';
import { signedInClient } from '../helpers/http-client';
import { createTestTeam, type TestTeam } from '../helpers/test-manuscripts';
import { SignInPage } from './pages/sign-in-page';

let browser: Browser;
let team: TestTeam;
let figureId: string;
const label = 'fallback-levels';

beforeAll(async () => {
  browser = await launchBrowser();
  team = await createTestTeam({ title: 'Fallback data' });
  const owner = await signedInClient(team.owner);
  const created = await owner.post(`/api/manuscripts/${team.manuscript.id}/figures`, {
    label,
    kind: 'spectrum',
    title: 'Levels of the unit disk',
    caption: 'Four levels with a half tube at the centre.',
    params: { task: 'spectrum', well: { disk: { center: [0, 0], radius: 1 } }, grid: { h: 0.2 }, tubes: [{ at: [0, 0], alpha: 0.5 }], levels: 4 },
  });
  expect(created.status).toBe(201);
  figureId = ((await created.json()) as { figure: { id: string } }).figure.id;
});

afterAll(async () => {
  await browser?.close();
  await sqlClient.end({ timeout: 5 });
});

/** The paths of the GET requests a page sends to /api (recorded from now on). */
function recordApiGets(page: Page): string[] {
  const seen: string[] = [];
  page.on('request', (request) => {
    const url = new URL(request.url());
    if (request.method() === 'GET' && url.pathname.startsWith('/api/')) seen.push(url.pathname);
  });
  return seen;
}

describe('server-loaded data as SWR fallback', () => {
  it('the manuscript page does not fetch its members or invitations until a role changes', async () => {
    const page = await newPage(browser);
    await new SignInPage(page).signIn(team.owner);
    const gets = recordApiGets(page);
    await page.goto(`/m/${team.manuscript.slug}`);
    await page.getByTestId('members').waitFor();
    await page.getByTestId('invite-form').waitFor();
    await page.waitForLoadState('networkidle');
    await page.waitForTimeout(500);
    const membersPath = `/api/manuscripts/${team.manuscript.id}/members`;
    expect(gets).not.toContain(membersPath);
    expect(gets).not.toContain(`/api/manuscripts/${team.manuscript.id}/invitations`);
    expect(await page.getByTestId('member').count()).toBe(3);

    // A mutation revalidates through the same hook: now the GET is sent.
    const refetched = page.waitForRequest((request) => request.method() === 'GET' && new URL(request.url()).pathname === membersPath);
    await page.locator(`[data-testid="member"][data-email="${team.coauthor.email}"]`).getByTestId('member-role-select').selectOption('author');
    await refetched;
    expect(gets).toContain(membersPath);
    await page.context().close();
  });

  it('the figure page does not fetch the figure it rendered', async () => {
    const page = await newPage(browser);
    await new SignInPage(page).signIn(team.author);
    const gets = recordApiGets(page);
    await page.goto(`/m/${team.manuscript.slug}/figures/${label}`);
    await page.getByText('No finished run yet.').waitFor();
    await page.waitForLoadState('networkidle');
    await page.waitForTimeout(500);
    expect(gets).not.toContain(`/api/figures/${figureId}`);
    await page.context().close();
  });
});
