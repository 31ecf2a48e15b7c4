// Shared pieces of the Vega-Lite chart builders: colour-blind-safe palettes, chart options, base config, axis titles and the
// marker layers (tubes, degeneracy points) drawn over every map. Pure data; no Vega runtime is imported anywhere in lib/charts.
import type { TopLevelSpec } from 'vega-lite';
import { DIMENSIONLESS, type DisplayUnits, lengthAxisTitle, lengthScale } from '@/lib/units';

/** A Vega-Lite spec as built here (any top-level form: single view, layer, concat). */
export type ChartSpec = TopLevelSpec;
/** A loosely typed layer or view inside a spec (Vega-Lite's unions are too wide to write literally). */
export type SpecPart = Record<string, unknown>;

/**
 * Okabe–Ito palette, distinguishable under the common colour-vision deficiencies (M. Okabe and K. Ito, "Color Universal
 * Design", 2008; B. Wong, Nature Methods 8, 441 (2011)). Ordered so the first lines have the strongest contrast on white.
 */
export const OKABE_ITO = ['#0072B2', '#D55E00', '#009E73', '#CC79A7', '#E69F00', '#56B4E9', '#000000', '#F0E442'] as const;

/** Perceptually uniform sequential schemes readable with colour-vision deficiencies (Nuñez et al., PLoS ONE 13, e0199239 (2018)). */
export const SEQUENTIAL_SCHEME = 'viridis';
export const GAP_SCHEME = 'cividis';

/** Sign maps: orange for psi > 0, sky blue for psi < 0 (Okabe–Ito pair; black nodal lines stay visible on both). */
export const SIGN_COLOURS = { positive: '#E69F00', negative: '#56B4E9' } as const;

/** Marker colours over heat maps: white-rimmed black for tubes, vermillion for degeneracy points, black for loops. */
export const TUBE_COLOUR = '#000000';
export const POINT_COLOUR = '#D55E00';
export const LOOP_COLOUR = '#000000';
export const OUTLINE_COLOUR = '#444444';

/** Fonts: DejaVu Sans first so the server rasteriser (resvg, loaded with DejaVu only) and browsers agree. */
export const CHART_FONT = 'DejaVu Sans, Inter, Helvetica, Arial, sans-serif';

/** Options every chart builder accepts. */
export interface ChartOptions {
  units?: DisplayUnits;
  /** Plot width in CSS px (the whole chart when `fit` is set). Default 480. */
  width?: number;
  /** Plot height in CSS px; maps default to the aspect of the data so that lengths are to scale. */
  height?: number;
  /** Fit axes and legends inside width x height (used by exports at journal widths). */
  fit?: boolean;
  /** The task spec the result came from (well outline, loops, exact levels); optional. */
  params?: unknown;
  /** Title drawn above the chart (figures usually leave it out: the caption says it). */
  title?: string;
  /** Largest number of heat-map cells; larger grids are averaged down by an integer factor. Default 16384. */
  maxCells?: number;
}

export const DEFAULT_WIDTH = 480;
/** Below this width (CSS px) legends go under the plot. */
export const NARROW_WIDTH = 420;
export const DEFAULT_HEIGHT = 320;

/** Resolved units of the options. */
export function unitsOf(options: ChartOptions): DisplayUnits {
  return options.units ?? DIMENSIONLESS;
}

/**
 * The top-level wrapper: schema, size, autosize, config (fonts and sizes suited to print at 8.6 cm). Pass `size: null` for
 * concatenated views, whose panels carry their own sizes (Vega-Lite cannot fit a concatenation to a width).
 */
export function baseSpec(options: ChartOptions, body: SpecPart, size?: { width: number; height: number } | null): ChartSpec {
  const sized =
    size === null
      ? {}
      : {
          width: size?.width ?? options.width ?? DEFAULT_WIDTH,
          // Without an explicit height, keep the default 3:2 frame at any width.
          height: size?.height ?? options.height ?? Math.round(((options.width ?? DEFAULT_WIDTH) * DEFAULT_HEIGHT) / DEFAULT_WIDTH),
          ...(options.fit ? { autosize: { type: 'fit', contains: 'padding' } } : {}),
        };
  const narrow = (options.width ?? DEFAULT_WIDTH) < NARROW_WIDTH;
  const spec: SpecPart = {
    $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
    ...sized,
    background: 'white',
    padding: 6,
    ...(options.title ? { title: options.title } : {}),
    config: {
      font: CHART_FONT,
      axis: { labelFontSize: 10, titleFontSize: 11, titleFontWeight: 'normal', grid: false, tickColor: '#333', domainColor: '#333' },
      legend: {
        labelFontSize: 10,
        titleFontSize: 10,
        titleFontWeight: 'normal',
        labelLimit: 240,
        // At one journal column (about 325 px) a legend on the right would take half the plot: put it underneath.
        ...(narrow ? { orient: 'bottom', direction: 'horizontal', columns: 6, gradientLength: 140 } : {}),
      },
      title: { fontSize: 12, fontWeight: 'normal' },
      view: { stroke: '#333' },
      range: { category: [...OKABE_ITO] },
    },
    ...body,
  };
  return spec as unknown as ChartSpec;
}

/** Round to 12 significant digits so that unit conversions do not leave 0.30000000000000004-style noise in the data. */
export function tidy(value: number): number {
  return Number.isFinite(value) ? Number(value.toPrecision(12)) : value;
}

/** A point in L converted to display units. */
export function toDisplayPoint(p: readonly [number, number], units: DisplayUnits): [number, number] {
  const s = lengthScale(units);
  return [tidy(p[0] * s), tidy(p[1] * s)];
}

/** x and y axis titles for maps in the chosen units. */
export function mapAxes(units: DisplayUnits): { x: string; y: string } {
  return { x: lengthAxisTitle('x', units), y: lengthAxisTitle('y', units) };
}

/** A tube marker as drawn over maps. */
export interface TubeMarker {
  at: [number, number];
  alpha: number;
}

/** Vega-Lite layer of tube markers (white-rimmed black crosses with the flux in the tooltip). */
export function tubeLayer(tubes: TubeMarker[], units: DisplayUnits, xField = 'x', yField = 'y'): SpecPart | null {
  if (tubes.length === 0) return null;
  const values = tubes.map((t, i) => {
    const [x, y] = toDisplayPoint(t.at, units);
    return { [xField]: x, [yField]: y, tube: i, alpha: t.alpha };
  });
  return {
    data: { values },
    mark: { type: 'point', shape: 'cross', size: 90, filled: true, color: TUBE_COLOUR, stroke: 'white', strokeWidth: 0.8, opacity: 1 },
    encoding: {
      x: { field: xField, type: 'quantitative' },
      y: { field: yField, type: 'quantitative' },
      tooltip: [
        { field: 'tube', title: 'tube' },
        { field: 'alpha', title: 'α (h/e)' },
      ],
    },
  };
}

/** Vega-Lite layer of marked points (degeneracy points) as vermillion diamonds. */
export function pointLayer(points: { at: [number, number]; label?: string; value?: number }[], units: DisplayUnits, title = 'point'): SpecPart | null {
  if (points.length === 0) return null;
  const values = points.map((p, i) => {
    const [x, y] = toDisplayPoint(p.at, units);
    return { x, y, index: i, label: p.label ?? `${title} ${i + 1}`, value: p.value ?? null };
  });
  return {
    data: { values },
    mark: { type: 'point', shape: 'diamond', size: 110, filled: true, color: POINT_COLOUR, stroke: 'white', strokeWidth: 1 },
    encoding: {
      x: { field: 'x', type: 'quantitative' },
      y: { field: 'y', type: 'quantitative' },
      tooltip: [{ field: 'label', title }, { field: 'value', title: 'value' }],
    },
  };
}

/** Vega-Lite layer of polylines (loops, outlines, nodal lines) from a list of point lists, drawn in order. */
export function polylineLayer(
  lines: { points: readonly (readonly [number, number])[]; id: string }[],
  units: DisplayUnits,
  mark: SpecPart,
): SpecPart | null {
  const values: SpecPart[] = [];
  for (const line of lines) {
    line.points.forEach((p, order) => {
      const [x, y] = toDisplayPoint(p as [number, number], units);
      values.push({ x, y, line: line.id, order });
    });
  }
  if (values.length === 0) return null;
  return {
    data: { values },
    mark: { type: 'line', ...mark },
    encoding: {
      x: { field: 'x', type: 'quantitative' },
      y: { field: 'y', type: 'quantitative' },
      detail: { field: 'line', type: 'nominal' },
      order: { field: 'order', type: 'quantitative' },
    },
  };
}

/** Drop null layers. */
export function layers(...parts: (SpecPart | null | undefined)[]): SpecPart[] {
  return parts.filter((p): p is SpecPart => Boolean(p));
}

/** Size of a map plot whose axes are to scale (equal length per pixel on x and y). */
export function mapSize(options: ChartOptions, extent: { min: [number, number]; max: [number, number] }): { width: number; height: number } {
  const width = options.width ?? DEFAULT_WIDTH;
  if (options.height) return { width, height: options.height };
  const dx = extent.max[0] - extent.min[0];
  const dy = extent.max[1] - extent.min[1];
  const ratio = dx > 0 && dy > 0 ? dy / dx : 1;
  return { width, height: Math.round(Math.min(Math.max(width * ratio, 80), width * 3)) };
}

/** Quantitative scale domain for a map axis in display units. */
export function axisDomain(min: number, max: number, units: DisplayUnits): [number, number] {
  const s = lengthScale(units);
  return [tidy(min * s), tidy(max * s)];
}

/** Axis title and fixed domain (display units) of one map axis. */
export interface MapAxis {
  title: string;
  domain: [number, number];
}

/**
 * Give every layer of a map the same x/y titles and fixed domains (layer encodings replace a parent's channel wholesale in
 * Vega-Lite, so the axes are set on each layer rather than once on top).
 */
export function withMapAxes(parts: SpecPart[], x: MapAxis, y: MapAxis): SpecPart[] {
  return parts.map((part) => {
    const encoding = { ...((part.encoding as SpecPart | undefined) ?? {}) };
    for (const [channel, axis] of [
      ['x', x],
      ['y', y],
    ] as const) {
      const current = encoding[channel] as SpecPart | undefined;
      if (!current) continue;
      encoding[channel] = { ...current, title: axis.title, scale: { domain: axis.domain, nice: false, zero: false } };
    }
    return { ...part, encoding };
  });
}

/** Map axes for an extent in L, converted to display units. */
export function mapAxesFor(extent: { min: [number, number]; max: [number, number] }, units: DisplayUnits): { x: MapAxis; y: MapAxis } {
  const titles = mapAxes(units);
  return {
    x: { title: titles.x, domain: axisDomain(extent.min[0], extent.max[0], units) },
    y: { title: titles.y, domain: axisDomain(extent.min[1], extent.max[1], units) },
  };
}
