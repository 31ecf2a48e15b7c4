// Editable view specs: a figure stores a partial Vega-Lite spec (titles, sizes, scales, marks, extra annotation layers)
// checked against an allow-list and merged over the default chart of its kind. Data always comes from the result.
import { z } from 'zod';
import type { SpecPart } from './common';

/** Largest stored view spec, in characters of JSON (common practice: keep settings small; data never lives here). */
export const MAX_VIEW_SPEC_CHARS = 100_000;
/** Deepest nesting of objects and arrays in a view spec (the kinds' defaults reach 9). */
export const MAX_VIEW_SPEC_DEPTH = 16;
/** Most keys in a view spec, counted over every nested object (the kinds' defaults have under 300). */
export const MAX_VIEW_SPEC_KEYS = 2_000;
/** Longest Vega expression (`expr`, `signal`, `calculate`, `filter`, `test` strings) in a view spec. */
export const MAX_EXPRESSION_CHARS = 500;

/** Our own key of a view spec: which of the kind's views to draw and the level of single-level views. */
export const VIEW_CHOICE_KEY = 'fluxfolio';

/** The only `$schema` a view spec may name (Vega-Lite's; it is dropped, the default spec carries its own). */
const VEGA_LITE_SCHEMA = /^https:\/\/vega\.github\.io\/schema\/vega-lite\/v\d+(\.\d+)*\.json$/;

/** Keys an author may set at the top of a view spec. */
const TOP_LEVEL_KEYS = new Set([
  '$schema', 'title', 'description', 'name', 'width', 'height', 'padding', 'autosize', 'background', 'mark', 'encoding',
  'layer', 'hconcat', 'vconcat', 'concat', 'columns', 'spacing', 'align', 'bounds', 'center', 'transform', 'params',
  'projection', 'resolve', 'view', 'config', VIEW_CHOICE_KEY,
]);

/** Keys of a layer or panel (an element of `layer`, `hconcat`, `vconcat`, `concat`). */
const PART_KEYS = new Set([
  'title', 'description', 'name', 'width', 'height', 'mark', 'encoding', 'layer', 'hconcat', 'vconcat', 'concat', 'columns',
  'spacing', 'align', 'bounds', 'center', 'transform', 'params', 'projection', 'resolve', 'view',
]);

/** Style keys of `config` (no loader, no custom format types, no locale files). */
const CONFIG_KEYS = new Set([
  'axis', 'axisX', 'axisY', 'axisBand', 'axisBottom', 'axisLeft', 'axisRight', 'axisTop', 'axisQuantitative', 'axisTemporal',
  'axisDiscrete', 'axisPoint', 'axisXBand', 'axisYBand', 'axisXQuantitative', 'axisYQuantitative', 'legend', 'header',
  'headerColumn', 'headerRow', 'headerFacet', 'title', 'mark', 'line', 'point', 'rect', 'text', 'rule', 'area', 'bar',
  'circle', 'square', 'tick', 'trail', 'geoshape', 'arc', 'range', 'scale', 'font', 'view', 'style', 'background',
  'padding', 'autosize', 'numberFormat', 'concat', 'facet', 'aria',
]);

/** Keys of a `params` entry: a named value or selection, never bound to page elements (`bind` could target any element). */
const PARAM_KEYS = new Set(['name', 'value', 'expr', 'select', 'views']);

/** Keys refused anywhere: they load or link out (url, href, image, loader), carry data or patch the compiled spec. */
const REFUSED_KEYS: Record<string, string> = {
  usermeta: 'usermeta is not allowed in a view spec (embed options and other metadata are fixed by the app)',
  patch: 'patch is not allowed in a view spec',
  data: 'data is not allowed in a view spec: the data always comes from the result',
  datasets: 'datasets is not allowed in a view spec: the data always comes from the result',
  url: 'url is not allowed in a view spec: charts load nothing from outside',
  href: 'href is not allowed in a view spec: charts do not link out',
  image: 'image is not allowed in a view spec',
  loader: 'loader is not allowed in a view spec',
  bind: 'bind is not allowed in a view spec: parameters cannot be bound to page elements',
};

/** Keys whose string values are Vega expressions. */
const EXPRESSION_KEYS = new Set(['expr', 'signal', 'calculate', 'filter', 'test']);

/** A string that starts with a URL scheme (`https:`, `data:`, `javascript:` …) or is protocol-relative (`//host`). */
const URL_LIKE = /^\s*(?:[a-z][a-z0-9+.-]*:(?!\s|$)|\/\/|\\\\)/i;

function isPlainObject(value: unknown): value is SpecPart {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

type Path = (string | number)[];
type Report = (path: Path, message: string) => void;

/** Every problem of a view spec (path and message); empty when it may be stored and drawn. */
export function viewSpecProblems(spec: Record<string, unknown>): { path: Path; message: string }[] {
  const problems: { path: Path; message: string }[] = [];
  const report: Report = (path, message) => {
    if (problems.length < 20) problems.push({ path, message });
  };
  let keys = 0;
  let tooDeep = false;

  const walk = (value: unknown, path: Path, depth: number, allowed: Set<string> | null): void => {
    if (depth > MAX_VIEW_SPEC_DEPTH) {
      if (!tooDeep) report(path, `The view spec may nest at most ${MAX_VIEW_SPEC_DEPTH} levels deep`);
      tooDeep = true;
      return;
    }
    if (typeof value === 'string') {
      if (URL_LIKE.test(value)) report(path, 'URLs and data URLs are not allowed in a view spec');
      const key = path[path.length - 1];
      if (typeof key === 'string' && EXPRESSION_KEYS.has(key) && value.length > MAX_EXPRESSION_CHARS) {
        report(path, `Expressions may have at most ${MAX_EXPRESSION_CHARS} characters`);
      }
      return;
    }
    if (Array.isArray(value)) {
      value.forEach((item, i) => walk(item, [...path, i], depth + 1, childAllowed(path, allowed)));
      return;
    }
    if (!isPlainObject(value)) return;
    for (const [key, v] of Object.entries(value)) {
      keys += 1;
      const at = [...path, key];
      if (key in REFUSED_KEYS) report(at, REFUSED_KEYS[key]);
      else if (allowed && !allowed.has(key)) report(at, `${key} is not one of the settings a view spec may change`);
      else walk(v, at, depth + 1, allowedBelow(path, key));
    }
  };

  for (const [key, value] of Object.entries(spec)) {
    keys += 1;
    if (key === '$schema') {
      if (typeof value !== 'string' || !VEGA_LITE_SCHEMA.test(value)) report([key], '$schema may only name the Vega-Lite schema');
    } else if (key === VIEW_CHOICE_KEY) {
      checkViewChoice(value, report);
    } else if (key in REFUSED_KEYS) {
      report([key], REFUSED_KEYS[key]);
    } else if (!TOP_LEVEL_KEYS.has(key)) {
      report([key], `${key} is not one of the settings a view spec may change`);
    } else {
      walk(value, [key], 1, allowedBelow([], key));
    }
  }
  if (keys > MAX_VIEW_SPEC_KEYS) report([], `The view spec may have at most ${MAX_VIEW_SPEC_KEYS} keys`);
  return problems;
}

/** The allow-list for the object under `key` at `path` (null: any key but the refused ones). */
function allowedBelow(path: Path, key: string): Set<string> | null {
  if (path.length === 0 && key === 'config') return CONFIG_KEYS;
  return null;
}

/** The allow-list for the elements of the array at `path`: layers and panels, or params. */
function childAllowed(path: Path, parentAllowed: Set<string> | null): Set<string> | null {
  void parentAllowed;
  const key = path[path.length - 1];
  if (key === 'layer' || key === 'hconcat' || key === 'vconcat' || key === 'concat') return PART_KEYS;
  if (key === 'params') return PARAM_KEYS;
  return null;
}

function checkViewChoice(value: unknown, report: Report): void {
  if (!isPlainObject(value)) {
    report([VIEW_CHOICE_KEY], `${VIEW_CHOICE_KEY} must be an object such as { "view": "density", "level": 1 }`);
    return;
  }
  for (const [key, v] of Object.entries(value)) {
    if (key === 'view') {
      if (typeof v !== 'string' || !/^[a-z][a-z-]{0,39}$/.test(v)) report([VIEW_CHOICE_KEY, key], 'view must be the name of one of the kind\'s views');
    } else if (key === 'level') {
      if (!Number.isInteger(v) || (v as number) < 0 || (v as number) > 10_000) report([VIEW_CHOICE_KEY, key], 'level must be a whole number from 0');
    } else {
      report([VIEW_CHOICE_KEY, key], `${VIEW_CHOICE_KEY} takes only "view" and "level"`);
    }
  }
}

/**
 * The one view-spec schema: a JSON object (a partial Vega-Lite spec) of at most MAX_VIEW_SPEC_CHARS characters whose keys
 * are on the allow-lists above; anything else is refused with its path (usermeta, patch, data, URLs, bound params, long
 * expressions, deep nesting). The output leaves out `$schema`. Used when a figure is written (API, forms, seed) and again
 * by chartSpecFor before a stored spec is drawn.
 */
export const viewSpecSchema = z
  .record(z.string(), z.unknown(), { error: 'The view spec must be a JSON object (a partial Vega-Lite spec)' })
  .superRefine((spec, ctx) => {
    if (JSON.stringify(spec).length > MAX_VIEW_SPEC_CHARS) {
      ctx.addIssue({ code: 'custom', message: `The view spec must be at most ${MAX_VIEW_SPEC_CHARS} characters of JSON` });
      return;
    }
    for (const problem of viewSpecProblems(spec)) ctx.addIssue({ code: 'custom', path: problem.path, message: problem.message });
  })
  .transform((spec) => {
    const { $schema: _schema, ...rest } = spec;
    void _schema;
    return rest;
  });

export type ViewSpec = z.infer<typeof viewSpecSchema>;

/** The view choice of a checked view spec (`fluxfolio.view`, `fluxfolio.level`), and the spec without it. */
export function splitViewChoice(spec: Record<string, unknown>): { view?: string; level?: number; styling: Record<string, unknown> } {
  const { [VIEW_CHOICE_KEY]: choice, ...styling } = spec;
  const c = isPlainObject(choice) ? choice : {};
  return {
    view: typeof c.view === 'string' ? c.view : undefined,
    level: typeof c.level === 'number' ? c.level : undefined,
    styling,
  };
}

/**
 * Merge a view spec (checked by viewSpecSchema) over a default spec. Objects merge key by key; arrays of objects (layers, concatenated
 * panels) merge element by element, so an override can restyle layer 2 without repeating the others; extra elements are
 * appended; other arrays and values replace. `data` of an element that merges into a default element is ignored, so the
 * computed data always wins.
 *
 * @example
 * mergeViewSpec({ width: 480, layer: [{ mark: 'line' }] }, { width: 300, layer: [{ mark: { type: 'line', strokeWidth: 3 } }] })
 * // returns { width: 300, layer: [{ mark: { type: 'line', strokeWidth: 3 } }] }
 */
export function mergeViewSpec<T>(base: T, override: unknown): T {
  return mergeValue(base, override, true) as T;
}

function mergeValue(base: unknown, over: unknown, dropData: boolean): unknown {
  if (over === undefined) return base;
  if (isPlainObject(base) && isPlainObject(over)) {
    const out: SpecPart = { ...base };
    for (const [key, v] of Object.entries(over)) {
      if (key === 'data' && dropData) continue;
      out[key] = mergeValue(base[key], v, dropData);
    }
    return out;
  }
  if (Array.isArray(base) && Array.isArray(over) && base.every(isPlainObject) && over.every(isPlainObject) && base.length > 0) {
    const merged = base.map((b, i) => (i < over.length ? mergeValue(b, over[i], true) : b));
    return [...merged, ...over.slice(base.length)];
  }
  return over;
}

/**
 * A spec as an author edits it: every inline data set removed, so the editor shows the settings only.
 */
export function editableViewSpec(spec: unknown): unknown {
  if (Array.isArray(spec)) return spec.map(editableViewSpec);
  if (!isPlainObject(spec)) return spec;
  const out: SpecPart = {};
  for (const [key, v] of Object.entries(spec)) {
    if (key === 'data' && isPlainObject(v) && Array.isArray(v.values)) continue;
    out[key] = editableViewSpec(v);
  }
  return out;
}
