// Safe-MDX gate for figure notes: every refusal of STACK.md §4 with the line it names, and the accepted forms (math,
// Callout, Figure and SnapshotRef with literal props). Runs the real MDX parser; nothing is mocked.
import { compile } from '@mdx-js/mdx';
import { describe, expect, it } from 'vitest';
import { checkNoteSource } from '@/lib/mdx/check-note';
import { compileNote } from '@/lib/mdx/compile-note';
import { isSafeUrl, MdxSafetyError, readLiteral, remarkSafe } from '@/lib/mdx/remark-safe';
import { rejectionOf } from '../helpers/thrown';

async function errorsOf(source: string) {
  const result = await checkNoteSource(source);
  if (result.ok) throw new Error(`expected a refusal for ${JSON.stringify(source)}`);
  return result.errors;
}

describe('refusals (each names its line)', () => {
  const cases: [string, string, number, RegExp][] = [
    ['import', 'Intro line.\n\nimport fs from "node:fs"\n', 3, /^line 3: imports are not allowed in figure notes$/],
    ['export', '# Title\n\nexport const x = process.exit()\n', 3, /^line 3: exports are not allowed in figure notes$/],
    ['flow expression', 'a\n\n{process.exit()}\n', 3, /^line 3: JavaScript expressions/],
    ['text expression', '# hi {process.exit()}', 1, /^line 1: JavaScript expressions/],
    ['lowercase html element', 'ok\n\n<script>alert(1)</script>\n', 3, /^line 3: <script> is not an allowed component/],
    ['img with handler', '<img src="x" onError="alert(1)" />', 1, /^line 1: <img> is not an allowed component/],
    ['iframe', 'text\n<iframe src="https://example.org" />', 2, /^line 2: <iframe> is not an allowed component/],
    ['unknown component', '<Chart spec="x" />', 1, /^line 1: <Chart> is not an allowed component in figure notes; use one of Figure, Callout, SnapshotRef, Units$/],
    ['member component', '<Figure.Inner label="a" />', 1, /not an allowed component/],
    ['fragment', '<>hi</>', 1, /^line 1: fragments/],
    ['function-call prop', '<Callout title={(() => process.exit())()} />', 1, /^line 1: the value of "title" on <Callout> must be a literal/],
    ['identifier prop', '<Figure label={globalThis} />', 1, /must be a literal/],
    ['template with substitution', '<Callout title={`a${process.env.X}`} />', 1, /must be a literal/],
    ['spread props', '\n<Callout {...globalThis} />', 2, /^line 2: spread props \(\{\.\.\.\}\) are not allowed on <Callout>$/],
    ['undeclared prop', '<Figure label="gap-map" onClick="steal()" />', 1, /^line 1: <Figure> has no prop "onClick"; its props are label, version, height, caption$/],
    ['javascript link', 'see [this](javascript:alert(1))', 1, /^line 1: link URL "javascript:alert\(1\)" is not allowed/],
    ['obfuscated scheme', '[x](<java\tscript:alert(1)>)', 1, /link URL/],
    ['data image', '![x](data:text/html;base64,PHNjcmlwdD4=)', 1, /^line 1: image URL/],
    ['link definition', '[x][r]\n\n[r]: vbscript:msgbox(1)', 3, /^line 3: link URL/],
    ['missing required prop', '<Figure height={300} />', 1, /^line 1: <Figure> needs the prop "label"$/],
    ['invalid literal', '<Figure label="a" version={0} />', 1, /^line 1: <Figure version>: versions start at 1$/],
    ['wrong literal type', '<Figure label="a" version="2" />', 1, /^line 1: <Figure version>:/],
    ['bad label', '<Figure label="Gap Map" />', 1, /lower-case letters, digits and dashes/],
    ['children on a self-closing component', '<Figure label="a">text</Figure>', 1, /^line 1: <Figure> takes no children/],
    ['duplicate prop', '<Figure label="a" label="b" />', 1, /sets "label" twice/],
    ['callout kind outside the enum', '<Callout kind="danger">x</Callout>', 1, /^line 1: <Callout kind>:/],
  ];
  for (const [name, source, line, message] of cases) {
    it(name, async () => {
      const errors = await errorsOf(source);
      expect(errors[0].line).toBe(line);
      expect(errors[0].message).toMatch(message);
      expect(errors[0].column).toBeGreaterThanOrEqual(1);
    });
  }

  it('reports every refusal, in document order', async () => {
    const errors = await errorsOf('import a from "b"\n\ntext {x}\n\n<script />\n');
    expect(errors.map((e) => e.line)).toEqual([1, 3, 5]);
  });

  it('syntax errors come back with their line, not as a throw', async () => {
    const errors = await errorsOf('fine\n\nstill fine\n\na <b');
    expect(errors).toHaveLength(1);
    expect(errors[0].line).toBe(5);
    expect(errors[0].message).toMatch(/^line 5: /);
  });

  it('the compile pipeline itself throws MdxSafetyError with line and column (gate runs before code generation)', async () => {
    await expect(compileNote('x\n\nexport const y = 1')).rejects.toMatchObject({ name: 'MdxSafetyError', line: 3, column: 1 });
    const error = await rejectionOf(compile('import fs from "node:fs"', { remarkPlugins: [remarkSafe] }));
    expect(error).toBeInstanceOf(MdxSafetyError);
    expect((error as MdxSafetyError).message).toBe('line 1: imports are not allowed in figure notes');
  });

  it('non-string input is refused, never thrown', async () => {
    const result = await checkNoteSource(42 as unknown as string);
    expect(result.ok).toBe(false);
  });
});

describe('accepted notes', () => {
  it('math, Callout, Figure and SnapshotRef with literal props', async () => {
    const source = [
      '# Spectral flow around a half tube',
      '',
      'Inline math $E = \\pi^2$ and a display:',
      '',
      '$$',
      'E_{m,n} = j_{|m-\\alpha|,n}^2 / R^2',
      '$$',
      '',
      '<Callout kind="result" title={`Degeneracy`}>The gap closes at the centre.</Callout>',
      '',
      '<Figure label="spectral-flow" />',
      '<Figure label="gap-map" version={2} height={360} caption />',
      '<Figure label="gap-map" caption={false} height={-0 + 200} />'.replace('-0 + 200', '200'),
      '',
      'As in <SnapshotRef label="gap-map" version={1} />, see [the paper](https://doi.org/10.1103/PhysRev.115.485),',
      '[below](#results), [mail](mailto:someone@example.org) and [a page](../guide).',
      '',
      '<Units />',
    ].join('\n');
    const result = await checkNoteSource(source);
    expect(result).toEqual({ ok: true, warnings: [] });
  });

  it('math that KaTeX cannot typeset is a warning with its line, not a refusal', async () => {
    const result = await checkNoteSource('fine\n\nbroken $\\frac{1$ math');
    expect(result).toMatchObject({ ok: true, warnings: [{ line: 3, message: expect.stringMatching(/^line 3: .*KaTeX/) }] });
  });
});

describe('literal reader and URL rule', () => {
  it('reads JSON-like literals and refuses everything else', () => {
    const lit = (v: unknown) => ({ type: 'Literal', value: v });
    expect(readLiteral(lit('a'))).toEqual({ ok: true, value: 'a' });
    expect(readLiteral({ type: 'UnaryExpression', operator: '-', argument: lit(2) })).toEqual({ ok: true, value: -2 });
    expect(readLiteral({ type: 'UnaryExpression', operator: '!', argument: lit(2) })).toEqual({ ok: false });
    expect(readLiteral({ type: 'ArrayExpression', elements: [lit(1), lit(null)] })).toEqual({ ok: true, value: [1, null] });
    const prop = (key: string, value: unknown) => ({ type: 'Property', kind: 'init', computed: false, method: false, shorthand: false, key: { type: 'Identifier', name: key }, value });
    expect(readLiteral({ type: 'ObjectExpression', properties: [prop('mark', lit('line'))] })).toEqual({ ok: true, value: { mark: 'line' } });
    expect(readLiteral({ type: 'ObjectExpression', properties: [prop('__proto__', lit(1))] })).toEqual({ ok: false });
    expect(readLiteral({ type: 'Literal', value: null, regex: { pattern: 'a', flags: '' } })).toEqual({ ok: false });
    expect(readLiteral({ type: 'CallExpression' })).toEqual({ ok: false });
    expect(readLiteral({ type: 'Identifier', name: 'x' })).toEqual({ ok: false });
  });

  it('allows http(s), mailto, relative and anchors only', () => {
    for (const ok of ['https://example.org', 'http://a.b/c', 'mailto:a@b.c', '/notes/1', 'figures/a.svg', '#sec-2', '?q=1']) expect(isSafeUrl(ok)).toBe(true);
    for (const bad of ['javascript:alert(1)', 'JAVASCRIPT:x', ' javascript:x', 'java\nscript:x', 'data:text/html,x', 'vbscript:x', 'file:///etc/passwd']) {
      expect(isSafeUrl(bad)).toBe(false);
    }
  });
});
