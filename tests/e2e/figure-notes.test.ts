// Figure notes in the browser, against the built app and a running worker (scripts/test.sh): an author edits a note,
// adds a figure block, starts a run and watches the progress bar, freezes v1, changes a parameter, freezes v2 and
// compares the two; a coauthor sees neither editing nor run controls and the API refuses them (403).
// Screenshots: test-results/screenshots/notes-*.png.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { sqlClient } from '@/db';
import { launchBrowser, newPage, screenshot as saveScreenshot } from '../helpers/browser';
import { signedInClient, type HttpClient } from '../helpers/http-client';
import { createTestTeam, type TestTeam } from '../helpers/test-manuscripts';
import type { TestUser } from '../helpers/test-users';
import { FigurePage } from './pages/figure-page';
import { NoteEditorPage } from './pages/note-editor-page';
import { NotePage } from './pages/note-page';
import { SignInPage } from './pages/sign-in-page';
import { SnapshotPage } from './pages/snapshot-page';

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
let author: HttpClient;
let figureId: string;
let noteId: string;
let noteSlug: string;
const label = 'flux-flow';

beforeAll(async () => {
  browser = await launchBrowser();
  team = await createTestTeam({ title: 'Figure notes e2e' });
  author = await signedInClient(team.author);
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

/** A fresh browser page signed in as `user` through the sign-in form. */
async function signedIn(user: TestUser): Promise<Page> {
  const page = await newPage(browser, { viewport: { width: 1360, height: 900 } });
  await new SignInPage(page).signIn(user);
  return page;
}

describe('figure notes in the browser', () => {
  it('an author edits a note, adds a block, runs, freezes v1 and v2 and compares them', async () => {
    const page = await signedIn(team.author);
    const slug = team.manuscript.slug;

    // Edit: the live preview renders the math; an import is refused with its line; the picker inserts a block.
    const editor = new NoteEditorPage(page);
    await editor.open(slug, noteSlug);
    await editor.waitForMathInPreview();
    await editor.writeSource(`${NOTE_SOURCE}\nimport data from "./levels.json"\n`);
    await expect.poll(() => editor.problems(), { timeout: 20_000 }).toMatch(/line 8: imports are not allowed/);
    await editor.writeSource(NOTE_SOURCE);
    await editor.waitForNoProblems();
    await editor.insertFigure(label);
    expect(await editor.source()).toContain(`<Figure label="${label}" />`);
    await editor.save();
    await expect.poll(() => editor.saveStatus()).toMatch(/revision 2/);
    await screenshot(page, 'notes-editor');

    // The history shows both revisions and the inserted line in the diff.
    expect(await editor.revisionDiff()).toContain(`<Figure label="${label}" />`);

    // Read: the block has not run yet; start a run from the note and watch it.
    const note = new NotePage(page);
    await note.open(slug, noteSlug);
    await note.runBlock(label, RUN_TIMEOUT);
    await screenshot(page, 'notes-live-block');

    // Figure page: freeze the finished run as v1.
    const figure = new FigurePage(page);
    await figure.open(slug, label);
    await figure.waitForRunPanel();
    await figure.freeze();
    await expect.poll(() => figure.frozenMessage()).toMatch(/v1/);
    const v1Href = await figure.frozenSnapshotHref();
    expect(v1Href).toMatch(/^\/s\/[0-9a-f-]{36}$/);

    // Change a parameter (4 levels instead of 6); Run saves it first, then computes anew; freeze v2.
    await figure.setParameter('Levels', '4');
    await figure.runAndWait(RUN_TIMEOUT);
    await figure.freeze();
    await expect.poll(() => figure.frozenMessage()).toMatch(/v2/);
    await figure.waitForSnapshot(2);
    await screenshot(page, 'notes-figure');

    // Compare v1 with v2: the changed parameter is listed and both results are drawn in one chart.
    await figure.compare();
    expect(page.url()).toMatch(/\/compare\?a=1&b=2$/);
    expect(await figure.parameterDiff()).toContain('levels');
    await screenshot(page, 'notes-compare');

    // The snapshot page: hash, citation and BibTeX.
    const snapshot = new SnapshotPage(page);
    await snapshot.open(v1Href!);
    expect(await snapshot.resultHash()).toMatch(/^[0-9a-f]{64}$/);
    expect(await snapshot.bibtex()).toMatch(/^@misc\{/);
    await screenshot(page, 'notes-snapshot');

    // Pin v1 in the note next to the live block; the note shows both.
    const saved = await author.fetch(`/api/notes/${noteId}`, {
      method: 'PUT',
      json: { title: 'Spectral flow', source: `${NOTE_SOURCE}\n<Figure label="${label}" />\n\nAs frozen for the draft:\n\n<Figure label="${label}" version={1} />\n` },
    });
    expect(saved.status).toBe(200);
    await note.open(slug, noteSlug);
    await note.waitForChart(label, 1);
    await note.waitForChart(label, 'latest');
    await screenshot(page, 'notes-note');
    await page.context().close();
  });

  it('a coauthor reads notes and figures but has no editing or run controls, and the API refuses them', async () => {
    const page = await signedIn(team.coauthor);
    const slug = team.manuscript.slug;
    const note = new NotePage(page);
    await note.open(slug, noteSlug);
    expect(await note.controls()).toEqual({ edit: 0, run: 0 });

    const figure = new FigurePage(page);
    await figure.open(slug, label);
    await figure.waitForReadOnlyParameters();
    expect(await figure.controls()).toEqual({ form: 0, readonly: 1, run: 0, freeze: 0 });
    await screenshot(page, 'notes-coauthor-figure');

    // The editor sends a coauthor back to the note.
    await new NoteEditorPage(page).open(slug, noteSlug);
    await page.waitForURL(new RegExp(`/notes/${noteSlug}$`));
    await page.context().close();

    const coauthor = await signedInClient(team.coauthor);
    expect((await coauthor.post(`/api/figures/${figureId}/runs`)).status).toBe(403);
    expect((await coauthor.fetch(`/api/notes/${noteId}`, { method: 'PUT', json: { title: 'x', source: 'y' } })).status).toBe(403);
    expect((await coauthor.post('/api/notes/preview', { manuscriptId: team.manuscript.id, source: '# x' })).status).toBe(403);
    // Reading is allowed: exports of a snapshot.
    const snapshots = await coauthor.json('GET', `/api/figures/${figureId}/snapshots`);
    expect(snapshots.status).toBe(200);
    expect(snapshots.body.snapshots).toHaveLength(2);
    const svg = await coauthor.get(`/api/snapshots/${snapshots.body.snapshots[0].id}/export?format=svg&width=one-column`);
    expect(svg.status).toBe(200);
    expect(await svg.text()).toMatch(/^<svg[\s\S]*width="8.6cm"/);
  });
});
