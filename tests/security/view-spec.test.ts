// Stored chart views are an allow-list: usermeta (embed options), patch, data, config loaders and URL strings are refused
// with a message naming their path, at the schema and through the figure API, and a normal styling view is accepted.
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sqlClient } from '@/db';
import { figures } from '@/db/schema';
import { MAX_EXPRESSION_CHARS, MAX_VIEW_SPEC_DEPTH, viewSpecSchema } from '@/lib/charts/view-spec';
import { fieldMessages } from '@/lib/validation-fields';
import { testDb, RUN_TAG } from '../helpers/db';
import { HttpClient, signedInClient } from '../helpers/http-client';
import { createTestTeam } from '../helpers/test-manuscripts';

/** The per-field messages the schema gives for a view spec (keys are dotted paths under `viewSpec`). */
function refusal(spec: unknown): Record<string, string[]> {
  const parsed = viewSpecSchema.safeParse(spec);
  expect(parsed.success).toBe(false);
  return fieldMessages(parsed.error!.issues, { prefix: 'viewSpec' });
}

describe('view-spec schema', () => {
  const refused: [string, unknown, string][] = [
    ['usermeta', { usermeta: { view: 'levels' } }, 'viewSpec.usermeta'],
    ['usermeta.embedOptions', { title: 'T', usermeta: { embedOptions: { actions: true } } }, 'viewSpec.usermeta'],
    ['patch', { patch: [{ op: 'add', path: '/data', value: {} }] }, 'viewSpec.patch'],
    ['config loader', { config: { loader: { baseURL: 'https://example.org/' } } }, 'viewSpec.config.loader'],
    ['config with a URL string', { config: { title: { font: 'https://example.org/font.woff' } } }, 'viewSpec.config.title.font'],
    ['data url', { data: { url: 'https://example.org/x.csv' } }, 'viewSpec.data'],
    ['data values', { data: { values: [{ a: 1 }] } }, 'viewSpec.data'],
    ['data in a layer', { layer: [{}, { mark: 'rule', data: { values: [{ y: 1 }] } }] }, 'viewSpec.layer.1.data'],
    ['nested data URL string', { layer: [{ encoding: { color: { value: 'data:text/html,<script>x</script>' } } }] }, 'viewSpec.layer.0.encoding.color.value'],
    ['javascript URL', { title: { text: 'javascript:alert(1)' } }, 'viewSpec.title.text'],
    ['protocol-relative URL', { description: '//evil.example/x' }, 'viewSpec.description'],
    ['href channel', { encoding: { href: { field: 'a' } } }, 'viewSpec.encoding.href'],
    ['image url', { mark: { type: 'image', url: 'x.png' } }, 'viewSpec.mark.url'],
    ['other $schema', { $schema: 'https://example.org/schema.json' }, 'viewSpec.$schema'],
    ['unknown top-level key', { datasets: { x: [1] } }, 'viewSpec.datasets'],
    ['bound param', { params: [{ name: 'p', value: 1, bind: { input: 'range', element: '#main' } }] }, 'viewSpec.params.0.bind'],
    ['long expression', { transform: [{ calculate: `1${'+1'.repeat(MAX_EXPRESSION_CHARS)}`, as: 'x' }] }, 'viewSpec.transform.0.calculate'],
    ['unknown view choice key', { fluxfolio: { view: 'density', url: 'x' } }, 'viewSpec.fluxfolio.url'],
  ];
  for (const [name, spec, path] of refused) {
    it(`refuses ${name} at ${path}`, () => {
      expect(Object.keys(refusal(spec))).toContain(path);
    });
  }

  it('refuses nesting deeper than the limit and too many keys', () => {
    let deep: Record<string, unknown> = { x: 1 };
    for (let i = 0; i < MAX_VIEW_SPEC_DEPTH + 2; i += 1) deep = { a: deep };
    expect(JSON.stringify(refusal({ encoding: deep }))).toMatch(/nest at most/);
    const many = Object.fromEntries(Array.from({ length: 2_100 }, (_, i) => [`k${i}`, 1]));
    expect(refusal({ encoding: many })).toHaveProperty('viewSpec', [expect.stringMatching(/at most 2000 keys/)]);
  });

  it('accepts a normal styling view and keeps it as written (without $schema)', () => {
    const view = {
      $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
      title: { text: 'Spectral flow: lowest levels', subtitle: 'E in units of ħ²/(2mR²)' },
      width: 320,
      height: 240,
      config: { axis: { labelFontSize: 11, gridColor: '#e5e7eb' }, legend: { orient: 'bottom' }, font: 'DejaVu Sans' },
      layer: [{ mark: { type: 'line', strokeWidth: 2 } }, { mark: 'rule', encoding: { y: { datum: 0 } } }],
      transform: [{ filter: 'datum.level < 4' }],
      fluxfolio: { view: 'density', level: 1 },
    };
    const { $schema: _s, ...rest } = view;
    void _s;
    expect(viewSpecSchema.parse(view)).toEqual(rest);
  });

  it("accepts the editor's example and view choices", () => {
    expect(viewSpecSchema.safeParse({ height: 400, title: 'Spectral flow' }).success).toBe(true);
    for (const view of ['levels', 'density', 'landscape']) expect(viewSpecSchema.safeParse({ fluxfolio: { view } }).success).toBe(true);
  });
});

describe('PATCH /api/figures/<id> with a hostile view', () => {
  let client: HttpClient;
  let figureId: string;
  const stored = { title: 'Kept view' };

  beforeAll(async () => {
    const { manuscript, author } = await createTestTeam({ title: 'View spec allow-list' });
    client = await signedInClient(author);
    const [figure] = await testDb
      .insert(figures)
      .values({
        manuscriptId: manuscript.id,
        label: `view-${RUN_TAG}`,
        kind: 'spectrum',
        params: { task: 'spectrum', well: { disk: { center: [0, 0], radius: 1 } }, grid: { h: 0.25 }, tubes: [], levels: 4 },
        viewSpec: stored,
      })
      .returning();
    figureId = figure.id;
  });

  afterAll(async () => {
    await sqlClient.end({ timeout: 5 });
  });

  it('answers 400 naming viewSpec.usermeta and leaves the stored view unchanged', async () => {
    const answer = await client.json('PATCH', `/api/figures/${figureId}`, { viewSpec: { usermeta: { embedOptions: { actions: true, ast: false } } } });
    expect(answer.status).toBe(400);
    expect(Object.keys(answer.body.fields)).toContain('viewSpec.usermeta');
    const [row] = await testDb.select({ viewSpec: figures.viewSpec }).from(figures).where(eq(figures.id, figureId));
    expect(row.viewSpec).toEqual(stored);
  });

  it('accepts a styling view through the same route', async () => {
    const answer = await client.json('PATCH', `/api/figures/${figureId}`, { viewSpec: { title: 'New title', fluxfolio: { view: 'density' } } });
    expect(answer.status).toBe(200);
    const [row] = await testDb.select({ viewSpec: figures.viewSpec }).from(figures).where(eq(figures.id, figureId));
    expect(row.viewSpec).toEqual({ title: 'New title', fluxfolio: { view: 'density' } });
  });
});
