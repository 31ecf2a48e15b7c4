// Chart expressions run through Vega's interpreter, never through generated code: on the server (SVG export, with the
// Function constructor disabled for the render) and in the browser under the app's CSP without unsafe-eval.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { sqlClient } from '@/db';
import type { ChartSpec } from '@/lib/charts/common';
import { renderSvg } from '@/lib/export/render-svg';
import { SignInPage } from '../e2e/pages/sign-in-page';
import { launchBrowser, newPage, screenshot } from '../helpers/browser';
import { uniqueTag } from '../helpers/db';
import { signedInClient } from '../helpers/http-client';
import { createTestTeam, type TestTeam } from '../helpers/test-manuscripts';

/** A chart whose only way to show "calc42" is a calculate transform evaluated at render time. */
const CALCULATED: ChartSpec = {
  data: { values: [{ a: 6, b: 7 }] },
  transform: [{ calculate: "'calc' + (datum.a * datum.b)", as: 'tag' }],
  mark: 'text',
  encoding: { text: { field: 'tag', type: 'nominal' } },
} as ChartSpec;

describe('server-side rendering', () => {
  it('evaluates a calculate transform without generating code (Function disabled during the render)', async () => {
    const original = globalThis.Function;
    const refuse = () => {
      throw new EvalError('code generation is disabled in this test');
    };
    globalThis.Function = new Proxy(original, { apply: refuse, construct: refuse }) as FunctionConstructor;
    let svg: string;
    try {
      ({ svg } = await renderSvg(CALCULATED));
    } finally {
      globalThis.Function = original;
    }
    expect(svg).toContain('calc42');
  });
});

describe('in the browser under the CSP', () => {
  let browser: Browser;
  let team: TestTeam;
  const label = `calc-${uniqueTag()}`.toLowerCase().replace(/[^a-z0-9-]/g, '-');

  beforeAll(async () => {
    browser = await launchBrowser();
    team = await createTestTeam({ title: 'Vega interpreter' });
    const author = await signedInClient(team.author);
    const created = await author.post(`/api/manuscripts/${team.manuscript.id}/figures`, {
      label,
      kind: 'flux-sweep',
      title: 'Calculated labels',
      caption: 'A spectral flow with a text layer computed by a calculate transform.',
      params: {
        task: 'flux-sweep',
        well: { disk: { center: [0, 0], radius: 1 } },
        grid: { h: 0.2 },
        tubes: [{ at: [0, 0], alpha: 0 }],
        sweep: { tube: 0, from: 0, to: 1, steps: 9 },
        levels: 4,
      },
      // An extra layer after the default one: text computed in the browser from each datum.
      viewSpec: {
        layer: [
          {},
          {
            transform: [{ filter: 'datum.level === 0' }, { calculate: "'calc' + (6 * 7)", as: 'tag' }],
            mark: 'text',
            encoding: { x: { field: 'alpha', type: 'quantitative' }, y: { field: 'E', type: 'quantitative' }, text: { field: 'tag' } },
          },
        ],
      },
    });
    expect(created.status, await created.clone().text()).toBe(201);
    const figureId = ((await created.json()) as { figure: { id: string } }).figure.id;
    const started = await author.fetch(`/api/figures/${figureId}/runs`, { method: 'POST' });
    expect(started.status).toBe(202);
  }, 120_000);

  afterAll(async () => {
    await browser?.close();
    await sqlClient.end({ timeout: 5 });
  });

  it('draws the calculated text with no CSP violation and no console error', async () => {
    const page = await newPage(browser);
    const problems: string[] = [];
    page.on('console', (message) => {
      // Chromium asks for /favicon.ico on its own; the app has none (a 404 that is not the page's doing).
      if (message.type() === 'error' && !message.location().url.endsWith('/favicon.ico')) problems.push(`console: ${message.text()}`);
    });
    page.on('pageerror', (error) => problems.push(`pageerror: ${error.message}`));
    page.on('response', (response) => {
      if (response.status() >= 400) problems.push(`response ${response.status()}: ${response.url()}`);
    });
    await page.addInitScript(() => {
      document.addEventListener('securitypolicyviolation', (event) => {
        console.error(`CSP violation: ${event.violatedDirective} ${event.blockedURI} at ${event.sourceFile}:${event.lineNumber}:${event.columnNumber} ${event.sample}`);
      });
    });
    await new SignInPage(page).signIn(team.author);
    await page.goto(`/m/${team.manuscript.slug}/figures/${label}`);
    const chart = page.locator('[data-testid="chart"] svg').first();
    await chart.waitFor({ timeout: 120_000 });
    await expect.poll(async () => (await chart.textContent()) ?? '', { timeout: 20_000 }).toContain('calc42');
    await screenshot(page, 'security-vega-interpreter');
    expect(await page.locator('[data-testid="chart"] [role="alert"]').count()).toBe(0);
    // The app's own embed options (stored usermeta is refused, tests/security/view-spec.test.ts): no action menu.
    expect(await page.locator('.vega-actions, details[title="Click to view actions"]').count()).toBe(0);
    expect(problems).toEqual([]);
  }, 180_000);
});
