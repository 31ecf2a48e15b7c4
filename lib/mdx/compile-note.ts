// Server-side compilation of a figure note (MDX + LaTeX) through the safe gate: function-body code, a renderable component,
// and the list of figures a note refers to. User MDX never runs unless it passed remarkSafe first.
import { compile, createProcessor, run } from '@mdx-js/mdx';
import type { Root } from 'mdast';
import type { MDXContent } from 'mdx/types';
// The JSX runtime is the only React piece here: run() needs it to build elements. No component code lives in lib/.
import * as jsxRuntime from 'react/jsx-runtime';
import rehypeKatex from 'rehype-katex';
import remarkMath from 'remark-math';
import type { Node } from 'unist';
import { visit } from 'unist-util-visit';
import { KATEX_OPTIONS } from './math-limits';
import { remarkSafe } from './remark-safe';

/** The remark/rehype set every figure note is compiled with (also used by checkNoteSource). */
export const noteCompileOptions = {
  format: 'mdx' as const,
  outputFormat: 'function-body' as const,
  development: false,
  remarkPlugins: [remarkSafe, remarkMath],
  rehypePlugins: [[rehypeKatex, KATEX_OPTIONS]] as [typeof rehypeKatex, typeof KATEX_OPTIONS][],
};

/**
 * Compile a note's MDX source to a function body (a string) after the safety gate.
 *
 * @param source - MDX with $…$ / $$…$$ math and allowed components only
 * @returns JavaScript function-body code for `run` (or for shipping to a client that runs it with its own runtime)
 * @throws MdxSafetyError when the gate refuses the note (message names the line); a VFileMessage on a syntax error
 * @example
 * const code = await compileNote('The ground level is $E_0 = \\pi^2$.')
 * // returns a string containing "katex"
 * @see lib/mdx/remark-safe.ts
 */
export async function compileNote(source: string): Promise<string> {
  const file = await compile(source, noteCompileOptions);
  return String(file);
}

/**
 * Compile and evaluate a note on the server, returning its component. Render it with the allow-listed components:
 * `<Content components={{ Figure, Callout, SnapshotRef, Units }} />`.
 *
 * @example
 * const { Content } = await renderableNote('# Levels\n\n$E = \\pi^2$')
 * renderToString(<Content />) // returns '<h1>Levels</h1>…<span class="katex">…'
 */
export async function renderableNote(source: string): Promise<{ Content: MDXContent }> {
  const code = await compileNote(source);
  // Safe to evaluate: the gate refused every import, export, expression and non-literal prop before code generation.
  const module = await run(code, { ...jsxRuntime, baseUrl: import.meta.url });
  return { Content: module.default };
}

/** A figure a note refers to: a live block (`Figure`) or an inline citation (`SnapshotRef`). */
export interface FigureRef {
  label: string;
  /** Pinned snapshot version, or null for a block that follows the latest run. */
  version: number | null;
  component: 'Figure' | 'SnapshotRef';
  line: number;
}

/** Parse MDX to mdast with the same syntax extensions as compileNote, without running any transform. */
export function parseNote(source: string): Root {
  const processor = createProcessor({ format: 'mdx', remarkPlugins: [remarkMath] });
  return processor.parse(source) as Root;
}

/**
 * The figures a note uses, in document order (duplicates kept once per label and version). String-valued or literal-number
 * props are read; other values are ignored here (the gate refuses them at save time).
 *
 * @throws a VFileMessage when the source does not parse
 * @example
 * extractFigureRefs('<Figure label="gap-map" version={2} />')
 * // returns [{ label: 'gap-map', version: 2, component: 'Figure', line: 1 }]
 */
export function extractFigureRefs(source: string): FigureRef[] {
  const tree = parseNote(source);
  const refs: FigureRef[] = [];
  const seen = new Set<string>();
  visit(tree as Node, (node: Node) => {
    if (node.type !== 'mdxJsxFlowElement' && node.type !== 'mdxJsxTextElement') return;
    const el = node as Node & {
      name: string | null;
      attributes: { type: string; name?: string; value?: unknown }[];
      position?: { start: { line: number } };
    };
    if (el.name !== 'Figure' && el.name !== 'SnapshotRef') return;
    let label: string | null = null;
    let version: number | null = null;
    for (const attr of el.attributes) {
      if (attr.type !== 'mdxJsxAttribute') continue;
      const raw = attr.value;
      const text = typeof raw === 'string' ? raw : raw && typeof raw === 'object' ? String((raw as { value: string }).value) : null;
      if (attr.name === 'label' && text !== null) label = text.replace(/^["'`](.*)["'`]$/, '$1');
      if (attr.name === 'version' && text !== null && /^\s*\d+\s*$/.test(text)) version = Number(text);
    }
    if (!label) return;
    const key = `${el.name}:${label}:${version}`;
    if (seen.has(key)) return;
    seen.add(key);
    refs.push({ label, version, component: el.name, line: el.position?.start.line ?? 1 });
  });
  return refs;
}
