// Chart specs for every figure kind: `defaultViewSpec` builds the default Vega-Lite spec of a result (data inline, so the
// same spec renders in the browser and on the server) and `chartSpecFor` merges a figure's stored view spec over it.
import { CHART_VIEWS, FIGURE_KINDS, figureKind, isFigureKind } from '@/lib/figure-kinds/registry';
import { type DisplayUnits } from '@/lib/units';
import type { ChartOptions, ChartSpec } from './common';
import { ChartDataError } from './read-result';
import { mergeViewSpec, splitViewChoice, viewSpecSchema } from './view-spec';

export type { ChartOptions, ChartSpec } from './common';
export { ChartDataError } from './read-result';
export { editableViewSpec, mergeViewSpec, VIEW_CHOICE_KEY, viewSpecSchema } from './view-spec';

export interface DefaultViewOptions extends ChartOptions {
  /** One of the kind's views (CHART_VIEWS in lib/figure-kinds/registry.ts); default the first. */
  view?: string;
  /** Level shown by single-level views (density, landscape). */
  level?: number;
}

/**
 * The default Vega-Lite spec of a result.
 *
 * @param kind - the figure kind (lib/figure-kinds/registry.ts: a solver task name or 'uploaded-data')
 * @param result - the stored result data (without diagnostics is fine)
 * @param options - display units, size, the task spec (`params`) for walls, loops and exact levels, view and level
 * @throws ChartDataError when the result lacks what the chart needs (message names the field); RangeError for an unknown kind
 * @example defaultViewSpec('flux-sweep', result, { units: { system: 'dimensionless' }, params: spec })
 */
export function defaultViewSpec(kind: string, result: unknown, options: DefaultViewOptions = {}): ChartSpec {
  if (!isFigureKind(kind)) throw new RangeError(`no chart for kind "${kind}": kind must be one of ${FIGURE_KINDS.join(', ')}`);
  const views = CHART_VIEWS[kind];
  const view = options.view ?? views[0];
  if (!views.includes(view)) throw new RangeError(`kind "${kind}" has no view "${view}"; its views are ${views.join(', ')}`);
  return figureKind(kind).chartSpec(result, { ...options, view });
}

/** A stored view spec through the same schema as at write time (the allow-list) before it is drawn. */
function checkedViewSpec(viewSpec: unknown): Record<string, unknown> {
  const parsed = viewSpecSchema.safeParse(viewSpec);
  if (!parsed.success) {
    const issues = parsed.error.issues.map((i) => (i.path.length ? `${i.path.join('.')}: ${i.message}` : i.message));
    throw new ChartDataError(`the figure's view spec cannot be used: ${issues.join('; ')}`);
  }
  return parsed.data;
}

export interface ChartSpecForOptions extends Omit<DefaultViewOptions, 'units'> {
  units: DisplayUnits;
  /** The figure's stored view spec (partial Vega-Lite), merged over the default; `fluxfolio.view` / `fluxfolio.level` pick a view. */
  viewSpec?: unknown;
}

/**
 * The spec to draw for a figure: its kind's default for the result, with the stored view spec merged over it.
 *
 * @example chartSpecFor('degeneracy', result, { units: DIMENSIONLESS, params: spec, viewSpec: { width: 360 } })
 */
export function chartSpecFor(kind: string, result: unknown, options: ChartSpecForOptions): ChartSpec {
  const { viewSpec, ...rest } = options;
  const clean = viewSpec === undefined || viewSpec === null ? undefined : checkedViewSpec(viewSpec);
  const choice = clean ? splitViewChoice(clean) : undefined;
  const view = rest.view ?? choice?.view;
  const level = rest.level ?? choice?.level;
  const width = rest.width ?? (clean && typeof clean.width === 'number' ? clean.width : undefined);
  const height = rest.height ?? (clean && typeof clean.height === 'number' ? clean.height : undefined);
  const base = defaultViewSpec(kind, result, { ...rest, view, level, width, height });
  if (!choice) return base;
  // Size options were applied by the builder (maps keep their aspect); do not let the raw numbers undo that.
  const { width: _w, height: _h, ...styling } = choice.styling;
  void _w;
  void _h;
  return mergeViewSpec(base, styling);
}
