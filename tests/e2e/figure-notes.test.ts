// Figure notes in the browser, against the built app and a running worker (scripts/test.sh): an author edits a note,
// adds a figure block, starts a run and watches the progress bar, freezes v1, changes a parameter, freezes v2 and
// compares the two; a coauthor sees neither editing nor run controls and the API refuses them (403).
// Screenshots: test-results/screenshots/notes-*.png.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { sqlClient } from '@/db';
import { APP_URL, signInWithPassword, type AppClient } from '../helpers/app';
import { launchBrowser, newPage, screenshot as saveScreenshot } from '../helpers/browser';
import { createTestTeam, type TestTeam } from '../helpers/db';

/** A small spectral flow (unit disk, off-centre tube, h = 1/20): a few seconds of solver time. */
const FLOW_PARAMS = {
  task: 'flux-sweep',
  well: { disk: { center: [0, 0], radius: 1 } },
  grid: { h: 0.05 },
  tubes: [{ at: [0.3, 0.1], alpha: 0 }],
  sweep: { tube: 0, from: 0, to: 1, steps: 11 },
  levels: 6,
};

const NOTE_SOURCE = `# Spectral flow of an off-centre tube

As the flux $\\alpha$ of the tube grows from $0$ to $1$, each level returns to the spectrum it started from
(Byers and Yang): $E_n(\\alpha + 1) = E_n(\\alpha)$.

<Callout kind="note" title="Reading the figure">Lines are levels followed through their crossings.</Callout>
`;

const RUN_TIMEOUT = 120_000;

let browser: Browser;
let team: TestTeam;
let author: AppClient;
let figureId: string;
let noteId: string;
let noteSlug: string;
const label = 'flux-flow';

beforeAll(async () => {
  browser = await launchBrowser();
  team = await createTestTeam({ title: 'Figure notes e2e' });
  author = await signInWithPassword(team.author.email, team.author.password);
  const figure = await author.post(`/api/manuscripts/${team.manuscript.id}/figures`, {
    label,
    kind: 'flux-sweep',
    title: 'Spectral flow of an off-centre tube',
    caption: 'Levels of the unit disk versus the flux of a tube at (0.3, 0.1).',
    params: FLOW_PARAMS,
  });
  expect(figure.status).toBe(201);
  figureId = ((await figure.json()) as { figure: { id: string } }).figure.id;
  const note = await author.post(`/api/manuscripts/${team.manuscript.id}/notes`, { title: 'Spectral flow', source: NOTE_SOURCE });
  expect(note.status).toBe(201);
  const created = (await note.json()) as { note: { id: string; slug: string } };
  noteId = created.note.id;
  noteSlug = created.note.slug;
});

afterAll(async () => {
  await browser?.close();
  await sqlClient.end({ timeout: 5 });
});

/** A full-page screenshot taken from the top (a sticky header would otherwise be drawn mid-page). */
async function screenshot(page: Page, name: string): Promise<void> {
  await page.evaluate(() => window.scrollTo(0, 0));
  await saveScreenshot(page, name);
}

function base(): string {
  return `/m/${team.manuscript.slug}`;
}

/** A page signed in through next-auth's credentials endpoint (the browser context keeps the session cookie). */
async function signedIn(email: string, password: string): Promise<Page> {
  const page = await newPage(browser, { viewport: { width: 1360, height: 900 } });
  const { csrfToken } = (await (await page.request.get('/api/auth/csrf')).json()) as { csrfToken: string };
  const answer = await page.request.post('/api/auth/callback/credentials', {
    form: { csrfToken, email, password, callbackUrl: `${APP_URL}/` },
    // As the sign-in page's own post would: next-auth's posts must come from our origin (lib/auth/guard-auth-post.ts).
    headers: { origin: new URL(APP_URL).origin },
  });
  expect(answer.ok()).toBe(true);
  const session = (await (await page.request.get('/api/auth/session')).json()) as { user?: { email?: string } };
  expect(session.user?.email).toBe(email);
  return page;
}

describe('figure notes in the browser', () => {
  it('an author edits a note, adds a block, runs, freezes v1 and v2 and compares them', async () => {
    const page = await signedIn(team.author.email, team.author.password);

    // Edit: the live preview renders the math; an import is refused with its line; the picker inserts a block.
    await page.goto(`${base()}/notes/${noteSlug}/edit`);
    const preview = page.getByTestId('note-preview');
    await preview.locator('.katex').first().waitFor();
    const source = page.getByTestId('note-source');
    await source.fill(`${NOTE_SOURCE}\nimport data from "./levels.json"\n`);
    await expect.poll(async () => page.getByTestId('note-problems').textContent(), { timeout: 20_000 }).toMatch(
      /line 8: imports are not allowed/,
    );
    await source.fill(NOTE_SOURCE);
    await page.getByTestId('note-problems').waitFor({ state: 'detached' });
    await page.getByTestId('picker-figure').selectOption(label);
    await page.getByTestId('insert-figure').click();
    expect(await source.inputValue()).toContain(`<Figure label="${label}" />`);
    await preview.locator(`[data-figure-preview="${label}"]`).waitFor();
    await page.getByTestId('save-note').click();
    await expect.poll(async () => page.getByTestId('save-status').textContent()).toMatch(/revision 2/);
    await screenshot(page, 'notes-editor');

    // The history shows both revisions and the inserted line in the diff.
    await page.getByTestId('revision-diff').waitFor();
    expect(await page.getByTestId('revision-diff').textContent()).toContain(`<Figure label="${label}" />`);

    // Read: the block has not run yet; start a run from the note and watch it.
    await page.goto(`${base()}/notes/${noteSlug}`);
    const block = page.locator(`[data-figure="${label}"]`);
    await block.locator('[data-testid="run-panel"][data-ready]').waitFor();
    await block.getByTestId('run-button').click();
    await block.getByTestId('run-progress').waitFor();
    await block.locator('[data-testid="chart"] svg').first().waitFor({ timeout: RUN_TIMEOUT });
    await screenshot(page, 'notes-live-block');

    // Figure page: freeze the finished run as v1.
    await page.goto(`${base()}/figures/${label}`);
    await page.locator('[data-testid="run-panel"][data-ready]').waitFor();
    await page.getByTestId('freeze-button').click();
    await expect.poll(async () => page.getByTestId('frozen-message').textContent()).toMatch(/v1/);
    const v1Href = await page.getByTestId('frozen-message').locator('a').getAttribute('href');
    expect(v1Href).toMatch(/^\/s\/[0-9a-f-]{36}$/);

    // Change a parameter (4 levels instead of 6); Run saves it first, then computes anew; freeze v2.
    const form = page.getByTestId('params-form');
    await form.getByLabel('Levels', { exact: true }).fill('4');
    await page.getByTestId('run-button').click();
    await page.getByTestId('run-progress').waitFor();
    await page.getByTestId('freeze-button').filter({ hasText: 'Freeze as snapshot' }).waitFor({ timeout: RUN_TIMEOUT });
    await page.getByTestId('freeze-button').click();
    await expect.poll(async () => page.getByTestId('frozen-message').textContent()).toMatch(/v2/);
    await page.getByTestId('snapshot-v2').waitFor();
    await screenshot(page, 'notes-figure');

    // Compare v1 with v2: the changed parameter is listed and both results are drawn in one chart.
    await page.getByTestId('compare-link').click();
    await page.waitForURL(/\/compare\?a=1&b=2$/);
    expect(await page.getByTestId('param-diff').textContent()).toContain('levels');
    await page.locator('[data-testid="chart"] svg').first().waitFor();
    await screenshot(page, 'notes-compare');

    // The snapshot page: hash, citation and BibTeX.
    await page.goto(v1Href!);
    expect(await page.getByTestId('result-hash').textContent()).toMatch(/^[0-9a-f]{64}$/);
    expect(await page.getByTestId('bibtex').textContent()).toMatch(/^@misc\{/);
    await page.locator('[data-testid="chart"] svg').first().waitFor();
    await screenshot(page, 'notes-snapshot');

    // Pin v1 in the note next to the live block; the note shows both.
    const saved = await author.fetch(`/api/notes/${noteId}`, {
      method: 'PUT',
      json: { title: 'Spectral flow', source: `${NOTE_SOURCE}\n<Figure label="${label}" />\n\nAs frozen for the draft:\n\n<Figure label="${label}" version={1} />\n` },
    });
    expect(saved.status).toBe(200);
    await page.goto(`${base()}/notes/${noteSlug}`);
    await page.locator(`[data-figure="${label}"][data-version="1"] [data-testid="chart"] svg`).first().waitFor();
    await page.locator(`[data-figure="${label}"][data-version="latest"] [data-testid="chart"] svg`).first().waitFor();
    await screenshot(page, 'notes-note');
    await page.context().close();
  });

  it('a coauthor reads notes and figures but has no editing or run controls, and the API refuses them', async () => {
    const page = await signedIn(team.coauthor.email, team.coauthor.password);
    await page.goto(`${base()}/notes/${noteSlug}`);
    await page.getByTestId('note-body').waitFor();
    expect(await page.getByTestId('edit-note').count()).toBe(0);
    expect(await page.getByTestId('run-button').count()).toBe(0);

    await page.goto(`${base()}/figures/${label}`);
    await page.getByTestId('params-readonly').waitFor();
    expect(await page.getByTestId('params-form').count()).toBe(0);
    expect(await page.getByTestId('run-button').count()).toBe(0);
    expect(await page.getByTestId('freeze-button').count()).toBe(0);
    await screenshot(page, 'notes-coauthor-figure');

    // The editor sends a coauthor back to the note.
    await page.goto(`${base()}/notes/${noteSlug}/edit`);
    await page.waitForURL(new RegExp(`/notes/${noteSlug}$`));
    await page.context().close();

    const coauthor = await signInWithPassword(team.coauthor.email, team.coauthor.password);
    expect((await coauthor.post(`/api/figures/${figureId}/runs`)).status).toBe(403);
    expect((await coauthor.fetch(`/api/notes/${noteId}`, { method: 'PUT', json: { title: 'x', source: 'y' } })).status).toBe(403);
    expect((await coauthor.post('/api/notes/preview', { manuscriptId: team.manuscript.id, source: '# x' })).status).toBe(403);
    // Reading is allowed: exports of a snapshot.
    const snapshots = (await (await coauthor.get(`/api/figures/${figureId}/snapshots`)).json()) as { snapshots: { id: string }[] };
    expect(snapshots.snapshots.length).toBe(2);
    const svg = await coauthor.get(`/api/snapshots/${snapshots.snapshots[0].id}/export?format=svg&width=one`);
    expect(svg.status).toBe(200);
    expect(await svg.text()).toMatch(/^<svg[\s\S]*width="8.6cm"/);
  });
});
