// Compiling and rendering a figure note on the server: function-body code, HTML with KaTeX output through
// react-dom/server, allow-listed components receiving their literal props, and the list of figures a note uses.
import { createElement, type ReactNode } from 'react';
import { renderToString } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import { compileNote, extractFigureRefs, renderableNote } from '@/lib/mdx/compile-note';

const NOTE = [
  '# Levels of a disk with a half tube',
  '',
  'The ground level is $E_0 = \\pi^2$ (DLMF 10.16.1).',
  '',
  '$$',
  'E_{m,n} = j_{|m-\\alpha|,n}^2',
  '$$',
  '',
  '<Callout kind="warn" title="Staircase walls">Levels converge like h.</Callout>',
  '',
  '<Figure label="spectral-flow" version={2} height={320} caption />',
].join('\n');

describe('compileNote / renderableNote', () => {
  it('compiles to a function body without imports of user code', async () => {
    const code = await compileNote(NOTE);
    expect(code).toContain('arguments[0]');
    expect(code).not.toMatch(/\bimport\s/);
    expect(code).toContain('katex');
  });

  it('renders to HTML with KaTeX markup and the allowed components', async () => {
    const { Content } = await renderableNote(NOTE);
    const seen: Record<string, unknown>[] = [];
    const components = {
      Callout: (props: { kind: string; title?: string; children?: ReactNode }) =>
        createElement('aside', { 'data-kind': props.kind, 'data-title': props.title }, props.children),
      Figure: (props: Record<string, unknown>) => {
        seen.push(props);
        return createElement('figure', { 'data-label': String(props.label) });
      },
    };
    const html = renderToString(createElement(Content, { components }));
    expect(html).toContain('<h1>Levels of a disk with a half tube</h1>');
    expect(html).toContain('class="katex"');
    expect(html).toContain('class="katex-display"');
    expect(html).toContain('<annotation encoding="application/x-tex">E_0 = \\pi^2</annotation>');
    expect(html).toContain('<aside data-kind="warn" data-title="Staircase walls">');
    expect(html).toContain('<figure data-label="spectral-flow">');
    expect(seen).toEqual([{ label: 'spectral-flow', version: 2, height: 320, caption: true }]);
  });

  it('refuses unsafe notes before anything runs', async () => {
    await expect(renderableNote('ok\n\n{globalThis.process.exit(1)}')).rejects.toThrow(/^line 3: JavaScript expressions/);
  });
});

describe('extractFigureRefs', () => {
  it('lists Figure blocks and SnapshotRef citations with versions and lines', () => {
    const refs = extractFigureRefs(`${NOTE}\n\nSee <SnapshotRef label="gap-map" version={1} /> and\n\n<Figure label="gap-map" />\n\n<Figure label="spectral-flow" version={2} />`);
    expect(refs).toEqual([
      { label: 'spectral-flow', version: 2, component: 'Figure', line: 11 },
      { label: 'gap-map', version: 1, component: 'SnapshotRef', line: 13 },
      { label: 'gap-map', version: null, component: 'Figure', line: 15 },
    ]);
  });
});
