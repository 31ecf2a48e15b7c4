// Editable view specs: a figure stores a partial Vega-Lite spec (titles, sizes, scales, marks, extra annotation layers)
// that is merged over the default chart of its kind. Data always comes from the result; URLs and links are stripped.
import { z } from 'zod';
import type { SpecPart } from './common';

/** Largest stored view spec, in characters of JSON (common practice: keep settings small; data never lives here). */
export const MAX_VIEW_SPEC_CHARS = 100_000;

/** Keys never taken from a stored view spec: they could load data, link out or replace the computed data. */
const STRIPPED_KEYS = new Set(['url', 'href', 'datasets', '$schema']);

function isPlainObject(value: unknown): value is SpecPart {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

/** Recursively remove URL-bearing keys and `data` other than inline `values`. */
export function sanitizeViewSpec(value: unknown): unknown {
  if (Array.isArray(value)) return value.map(sanitizeViewSpec);
  if (!isPlainObject(value)) return value;
  const out: SpecPart = {};
  for (const [key, v] of Object.entries(value)) {
    if (STRIPPED_KEYS.has(key)) continue;
    if (key === 'data') {
      if (isPlainObject(v) && Array.isArray(v.values)) out.data = { values: sanitizeViewSpec(v.values) };
      continue;
    }
    out[key] = sanitizeViewSpec(v);
  }
  return out;
}

/**
 * The one view-spec schema: a JSON object (a partial Vega-Lite spec) of at most MAX_VIEW_SPEC_CHARS characters, returned
 * sanitised (no URLs, links or data other than inline values). Used when a figure is written (API, forms, seed) and again
 * by chartSpecFor before a stored spec is drawn.
 */
export const viewSpecSchema = z
  .record(z.string(), z.unknown(), { error: 'The view spec must be a JSON object (a partial Vega-Lite spec)' })
  .refine((v) => JSON.stringify(v).length <= MAX_VIEW_SPEC_CHARS, { error: `The view spec must be at most ${MAX_VIEW_SPEC_CHARS} characters of JSON` })
  .transform((v) => sanitizeViewSpec(v) as Record<string, unknown>);

export type ViewSpec = z.infer<typeof viewSpecSchema>;

/**
 * Merge a (sanitised) view spec over a default spec. Objects merge key by key; arrays of objects (layers, concatenated
 * panels) merge element by element, so an override can restyle layer 2 without repeating the others; extra elements are
 * appended; other arrays and values replace. `data` of an element that merges into a default element is ignored, so the
 * computed data always wins.
 *
 * @example
 * mergeViewSpec({ width: 480, layer: [{ mark: 'line' }] }, { width: 300, layer: [{ mark: { type: 'line', strokeWidth: 3 } }] })
 * // returns { width: 300, layer: [{ mark: { type: 'line', strokeWidth: 3 } }] }
 */
export function mergeViewSpec<T>(base: T, override: unknown): T {
  const clean = sanitizeViewSpec(override);
  return mergeValue(base, clean, true) as T;
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
