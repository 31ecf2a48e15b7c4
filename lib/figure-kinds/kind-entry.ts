// What the registry knows about one figure kind: its label, solver task (none for data kinds), parameter schema and
// defaults, chart views and default chart, and where the form's problem fields go. No React: app/ maps kinds to form parts.
import type { z } from 'zod';
import type { ChartOptions, ChartSpec } from '@/lib/charts/common';
import type { TaskName } from '@/lib/physics/task-table';

/** Options of a kind's default chart: the chart options plus the view (one of the kind's views) and a level. */
export interface KindChartOptions extends ChartOptions {
  /** One of the kind's `views`. */
  view: string;
  /** Level shown by single-level views (density, landscape). */
  level?: number;
}

/**
 * One figure kind.
 *
 * @typeParam Params - the validated parameters (defaults filled in)
 * @typeParam ParamsInput - the parameters as a person or the API writes them
 */
export interface FigureKindEntry<Params = unknown, ParamsInput = Params> {
  /** Human name, for menus and headings. */
  label: string;
  /** The solver task that computes the figure, or null for a kind whose data is not computed (uploaded data). */
  task: TaskName | null;
  /** The one schema of the kind's parameters, shared by forms, route handlers, worker and seed. */
  paramsSchema: z.ZodType<Params, ParamsInput>;
  /** Starting parameters of a new figure: small and quick, always valid for `paramsSchema`. */
  defaultParams: () => ParamsInput;
  /** The chart views the kind offers; the first is the default. */
  views: readonly [string, ...string[]];
  /** The default Vega-Lite spec of a result (a table for data kinds) in the chosen view. */
  chartSpec: (result: unknown, options: KindChartOptions) => ChartSpec;
  /**
   * Where the well, grid and tubes sit in the parameters, as a form field prefix ('' at the top, 'of.' inside a
   * convergence study), or null when the kind has none (data kinds); the parameter form puts its problem fields there.
   */
  problemAt: string | null;
}
