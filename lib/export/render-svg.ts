// Server-side SVG of a Vega-Lite chart: vega-lite compile, a headless vega View (renderer 'none', no canvas), toSVG.
// Data must be inline; every load is refused. Output is deterministic (element ids renumbered) and can carry a size in cm.
import type { ChartSpec } from '@/lib/charts/common';
import { vegaLiteToSvg } from './vega-svg.mjs';
import { FIGURE_WIDTH_CM, type FigureWidth } from './widths';

/** An SVG document with its intrinsic size in CSS px (the viewBox). */
export interface RenderedSvg {
  svg: string;
  /** Intrinsic width and height in CSS px. */
  width: number;
  height: number;
}

export interface RenderSvgOptions {
  /** Give the SVG a physical width (journal column or cm) with the height in proportion; the viewBox is kept. */
  width?: FigureWidth | { cm: number };
}

/** Throw when any part of a spec refers to a URL (data.url, lookup sources, image url channels): data must be inline. */
export function assertInlineData(spec: unknown, path = 'spec'): void {
  if (Array.isArray(spec)) {
    spec.forEach((item, i) => assertInlineData(item, `${path}[${i}]`));
    return;
  }
  if (typeof spec !== 'object' || spec === null) return;
  for (const [key, value] of Object.entries(spec)) {
    if (key === 'url') throw new Error(`chart specs may not load external data (${path}.url); data must be inline`);
    assertInlineData(value, `${path}.${key}`);
  }
}

/** Width in cm of a width option. */
export function widthInCm(width: FigureWidth | { cm: number }): number {
  return typeof width === 'string' ? FIGURE_WIDTH_CM[width] : width.cm;
}

/**
 * Make ids stable: vega numbers clip paths and gradients with process-wide counters, so the same chart rendered twice would
 * differ. Rename every id="…" in order of appearance and update its url(#…) / href="#…" references.
 */
function renumberIds(svg: string): string {
  const ids: string[] = [];
  svg.replace(/\sid="([^"]+)"/g, (_m, id: string) => {
    if (!ids.includes(id)) ids.push(id);
    return _m;
  });
  if (ids.length === 0) return svg;
  const map = new Map(ids.map((id, i) => [id, `ff${i + 1}`]));
  const escaped = ids.map((id) => id.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')).sort((a, b) => b.length - a.length);
  const pattern = new RegExp(`(\\sid="|url\\(#|href="#)(${escaped.join('|')})(?=["\\)])`, 'g');
  return svg.replace(pattern, (_m, prefix: string, id: string) => `${prefix}${map.get(id)}`);
}

function intrinsicSize(svg: string): { width: number; height: number } {
  const viewBox = /<svg[^>]*\sviewBox="([-\d.e\s]+)"/.exec(svg);
  if (viewBox) {
    const [, , w, h] = viewBox[1].trim().split(/\s+/).map(Number);
    return { width: w, height: h };
  }
  const w = /<svg[^>]*\swidth="([\d.]+)"/.exec(svg);
  const h = /<svg[^>]*\sheight="([\d.]+)"/.exec(svg);
  return { width: Number(w?.[1] ?? 0), height: Number(h?.[1] ?? 0) };
}

/** Replace the root's width/height attributes (e.g. by "8.6cm"), keeping the viewBox so the drawing scales. */
function setRootSize(svg: string, width: string, height: string): string {
  return svg.replace(/<svg\b([^>]*)>/, (_m, attrs: string) => {
    const rest = attrs.replace(/\s(width|height)="[^"]*"/g, '');
    return `<svg${rest} width="${width}" height="${height}">`;
  });
}

/**
 * Render a Vega-Lite spec to an SVG string on the server.
 *
 * @param spec - a Vega-Lite spec with inline data (see lib/charts)
 * @param options - optional physical width ('one-column' = 8.6 cm, 'two-column' = 17.8 cm, or { cm })
 * @returns the SVG (starts with `<svg`, includes an XML namespace) and its intrinsic size in CSS px
 * @throws Error when the spec does not compile or asks to load data
 * @example
 * const { svg } = await renderSvg({ mark: 'point', data: { values: [{ a: 1 }] }, encoding: { x: { field: 'a', type: 'quantitative' } } })
 * svg.startsWith('<svg') // returns true
 * @see /work/shared/STACK.md §4 "Server-side chart"
 */
export async function renderSvg(spec: ChartSpec, options: RenderSvgOptions = {}): Promise<RenderedSvg> {
  assertInlineData(spec);
  return finishSvg(await vegaLiteToSvg(spec), options);
}

/**
 * Vega's raw SVG made deterministic (ids renumbered), measured, and given a physical width when asked. Shared by
 * renderSvg (in process) and renderSvgInChild (export child process), so both give the same bytes.
 */
export function finishSvg(raw: string, options: RenderSvgOptions = {}): RenderedSvg {
  let svg = renumberIds(raw);
  const { width, height } = intrinsicSize(svg);
  if (options.width) {
    const cm = widthInCm(options.width);
    const heightCm = width > 0 ? (cm * height) / width : cm;
    svg = setRootSize(svg, `${cm}cm`, `${Number(heightCm.toFixed(4))}cm`);
  }
  return { svg, width, height };
}
