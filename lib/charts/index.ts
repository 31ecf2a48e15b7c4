// Chart specs for every figure kind: `defaultViewSpec` builds the default Vega-Lite spec of a result (data inline, so the
// same spec renders in the browser and on the server) and `chartSpecFor` merges a figure's stored view spec over it.
import { z } from 'zod';
import { type DisplayUnits } from '@/lib/units';
import type { ChartOptions, ChartSpec } from './common';
import { convergenceSpec } from './convergence';
import { densitySpec } from './density';
import { gapMapSpec } from './gap-map';
import { holonomySpec } from './holonomy';
import { nodalLinesSpec } from './nodal-lines';
import { positionSweepSpec } from './position-sweep';
import { isRecord } from './read-result';
import { spectralFlowSpec } from './spectral-flow';
import { spectrumSpec } from './spectrum';
import { uploadedDataSpec } from './uploaded-data';
import { mergeViewSpec, sanitizeViewSpec } from './view-spec';

export type { ChartOptions, ChartSpec } from './common';
export { ChartDataError } from './read-result';
export { editableViewSpec, mergeViewSpec, sanitizeViewSpec, viewSpecSchema } from './view-spec';

/** Figure kinds: one per solver task, plus uploaded data. */
export const FIGURE_KINDS = ['spectrum', 'flux-sweep', 'position-sweep', 'holonomy', 'degeneracy', 'nodal-lines', 'convergence', 'upload'] as const;
export const figureKindSchema = z.enum(FIGURE_KINDS, { error: `kind must be one of ${FIGURE_KINDS.join(', ')}` });
export type FigureKind = z.infer<typeof figureKindSchema>;

/** Alternative views a kind offers (chosen with `view`, or `usermeta.view` in the stored view spec). */
export const CHART_VIEWS: Record<FigureKind, readonly string[]> = {
  spectrum: ['levels', 'density'],
  'flux-sweep': ['spectral-flow'],
  'position-sweep': ['levels', 'landscape'],
  holonomy: ['loop'],
  degeneracy: ['gap-map'],
  'nodal-lines': ['sign'],
  convergence: ['levels'],
  upload: ['lines'],
};

export interface DefaultViewOptions extends ChartOptions {
  /** One of CHART_VIEWS[kind]; default the first. */
  view?: string;
  /** Level shown by single-level views (density, landscape). */
  level?: number;
}

/**
 * The default Vega-Lite spec of a result.
 *
 * @param kind - the figure kind (a solver task name or 'upload')
 * @param result - the stored result data (without diagnostics is fine)
 * @param options - display units, size, the task spec (`params`) for walls, loops and exact levels, view and level
 * @throws ChartDataError when the result lacks what the chart needs (message names the field); RangeError for an unknown kind
 * @example defaultViewSpec('flux-sweep', result, { units: { system: 'dimensionless' }, params: spec })
 */
export function defaultViewSpec(kind: string, result: unknown, options: DefaultViewOptions = {}): ChartSpec {
  const parsedKind = figureKindSchema.safeParse(kind);
  if (!parsedKind.success) throw new RangeError(`no chart for kind "${kind}": kind must be one of ${FIGURE_KINDS.join(', ')}`);
  const views = CHART_VIEWS[parsedKind.data];
  const view = options.view ?? views[0];
  if (!views.includes(view)) throw new RangeError(`kind "${kind}" has no view "${view}"; its views are ${views.join(', ')}`);
  switch (parsedKind.data) {
    case 'spectrum':
      return view === 'density' ? densitySpec(result, options) : spectrumSpec(result, options);
    case 'flux-sweep':
      return spectralFlowSpec(result, options);
    case 'position-sweep':
      return positionSweepSpec(result, options);
    case 'holonomy':
      return holonomySpec(result, options);
    case 'degeneracy':
      return gapMapSpec(result, options);
    case 'nodal-lines':
      return nodalLinesSpec(result, options);
    case 'convergence':
      return convergenceSpec(result, options);
    case 'upload':
      return uploadedDataSpec(result, options);
  }
}

export interface ChartSpecForOptions extends Omit<DefaultViewOptions, 'units'> {
  units: DisplayUnits;
  /** The figure's stored view spec (partial Vega-Lite), merged over the default; `usermeta.view` / `usermeta.level` pick a view. */
  viewSpec?: unknown;
}

/**
 * The spec to draw for a figure: its kind's default for the result, with the stored view spec merged over it.
 *
 * @example chartSpecFor('degeneracy', result, { units: DIMENSIONLESS, params: spec, viewSpec: { width: 360 } })
 */
export function chartSpecFor(kind: string, result: unknown, options: ChartSpecForOptions): ChartSpec {
  const { viewSpec, ...rest } = options;
  const clean = viewSpec === undefined || viewSpec === null ? undefined : (sanitizeViewSpec(viewSpec) as Record<string, unknown>);
  const meta = clean && isRecord(clean.usermeta) ? clean.usermeta : {};
  const view = rest.view ?? (typeof meta.view === 'string' ? meta.view : undefined);
  const level = rest.level ?? (typeof meta.level === 'number' ? meta.level : undefined);
  const width = rest.width ?? (clean && typeof clean.width === 'number' ? clean.width : undefined);
  const height = rest.height ?? (clean && typeof clean.height === 'number' ? clean.height : undefined);
  const base = defaultViewSpec(kind, result, { ...rest, view, level, width, height });
  if (!clean) return base;
  // Size options were applied by the builder (maps keep their aspect); do not let the raw numbers undo that.
  const { width: _w, height: _h, ...styling } = clean;
  void _w;
  void _h;
  return mergeViewSpec(base, styling);
}
