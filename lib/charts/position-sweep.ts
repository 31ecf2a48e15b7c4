// Position-sweep charts: along a path, the levels against the distance walked (one line per tracked level); over a
// region, the energy landscape E0 of the moving tube as a heat map with the force F = -grad E0 as arrows, tubes and wall.
import { energyAxisTitle, energyScale, lengthAxisTitle, lengthScale } from '@/lib/units';
import {
  baseSpec,
  type ChartOptions,
  type ChartSpec,
  layers,
  mapAxesFor,
  mapSize,
  SEQUENTIAL_SCHEME,
  type SpecPart,
  tidy,
  tubeLayer,
  unitsOf,
  withMapAxes,
} from './common';
import { subscript } from './density';
import { fieldCells, heatLayer } from './grid-field';
import { asRecord, ChartDataError, curvesOver, isRecord, numberList, numberMatrix, pick, type Json } from './read-result';
import { outlineLayer, outlinesExtent, wellOutlines } from './well-outline';

export interface PositionSweepOptions extends ChartOptions {
  /** Region mode: which level's landscape (default 0). */
  level?: number;
  /** Region mode: draw the force arrows (default true). */
  forces?: boolean;
}

/** At most this many arrows per axis (the rest of the positions are skipped evenly). */
const ARROWS_PER_AXIS = 14;

function pathSpec(r: Json, options: PositionSweepOptions): ChartSpec {
  const s = numberList(r.s, 's');
  const raw = pick(r, 'tracked', 'sorted', 'levels');
  if (raw === undefined) throw new ChartDataError('position-sweep result has no levels');
  const curves = curvesOver(numberMatrix(raw, 'tracked'), s.length);
  const units = unitsOf(options);
  const es = energyScale(units);
  const ls = lengthScale(units);
  const values: Record<string, unknown>[] = [];
  curves.forEach((curve, level) => curve.forEach((e, i) => Number.isFinite(e) && values.push({ s: tidy(s[i] * ls), E: tidy(e * es), level })));
  return baseSpec(options, {
    data: { values },
    mark: { type: 'line', strokeWidth: 1.6 },
    encoding: {
      x: { field: 's', type: 'quantitative', title: lengthAxisTitle('s', units), scale: { nice: false } },
      y: { field: 'E', type: 'quantitative', title: energyAxisTitle(units), scale: { zero: false } },
      color: { field: 'level', type: 'nominal', title: 'level', legend: curves.length > 1 ? {} : null },
      tooltip: [
        { field: 'level', type: 'nominal' },
        { field: 's', type: 'quantitative', format: '.4g' },
        { field: 'E', type: 'quantitative', format: '.6g' },
      ],
    },
  });
}

/** Arrows as short rules with a small head point: from the position along F, scaled so the longest is ~0.8 spacing. */
function forceLayers(xs: number[], ys: number[], fx: number[], fy: number[], units: ReturnType<typeof unitsOf>): SpecPart[] {
  const stepX = Math.max(1, Math.ceil(xs.length / ARROWS_PER_AXIS));
  const stepY = Math.max(1, Math.ceil(ys.length / ARROWS_PER_AXIS));
  const spacing = Math.min((xs[xs.length - 1] - xs[0]) / Math.max(1, Math.ceil(xs.length / stepX) - 1 || 1), (ys[ys.length - 1] - ys[0]) / Math.max(1, Math.ceil(ys.length / stepY) - 1 || 1)) || 1;
  let fmax = 0;
  for (let k = 0; k < fx.length; k++) if (Number.isFinite(fx[k]) && Number.isFinite(fy[k])) fmax = Math.max(fmax, Math.hypot(fx[k], fy[k]));
  if (fmax === 0) return [];
  const scale = (0.8 * spacing) / fmax;
  const ls = lengthScale(units);
  const values: Record<string, unknown>[] = [];
  for (let j = 0; j < ys.length; j += stepY) {
    for (let i = 0; i < xs.length; i += stepX) {
      const k = i + xs.length * j;
      if (!Number.isFinite(fx[k]) || !Number.isFinite(fy[k])) continue;
      values.push({
        x: tidy(xs[i] * ls),
        y: tidy(ys[j] * ls),
        x2: tidy((xs[i] + fx[k] * scale) * ls),
        y2: tidy((ys[j] + fy[k] * scale) * ls),
        F: tidy(Math.hypot(fx[k], fy[k])),
      });
    }
  }
  return [
    {
      data: { values },
      mark: { type: 'rule', color: '#ffffff', strokeWidth: 1.2 },
      encoding: { x: { field: 'x', type: 'quantitative' }, y: { field: 'y', type: 'quantitative' }, x2: { field: 'x2' }, y2: { field: 'y2' }, tooltip: [{ field: 'F', title: '|F|', format: '.4g' }] },
    },
    {
      data: { values },
      mark: { type: 'point', shape: 'circle', size: 8, filled: true, color: '#ffffff' },
      encoding: { x: { field: 'x2', type: 'quantitative' }, y: { field: 'y2', type: 'quantitative' } },
    },
  ];
}

function regionSpec(r: Json, options: PositionSweepOptions): ChartSpec {
  const xs = numberList(r.xs, 'xs');
  const ys = numberList(r.ys, 'ys');
  const levels = numberMatrix(r.levels, 'levels');
  const level = options.level ?? 0;
  if (!levels[level]) throw new ChartDataError(`level ${level} is not in this result (it has ${levels.length})`);
  const units = unitsOf(options);
  const { cells } = fieldCells({ xs, ys, values: levels[level] }, { units, scale: energyScale(units), maxCells: options.maxCells });
  const dx = xs.length > 1 ? xs[1] - xs[0] : 0;
  const dy = ys.length > 1 ? ys[1] - ys[0] : dx;
  let extent = { min: [xs[0] - dx / 2, ys[0] - dy / 2] as [number, number], max: [xs[xs.length - 1] + dx / 2, ys[ys.length - 1] + dy / 2] as [number, number] };
  const params = options.params;
  if (isRecord(params) && isRecord(params.well)) {
    const wall = outlinesExtent(wellOutlines(params.well as never));
    if (wall) {
      extent = {
        min: [Math.min(extent.min[0], wall.min[0]), Math.min(extent.min[1], wall.min[1])],
        max: [Math.max(extent.max[0], wall.max[0]), Math.max(extent.max[1], wall.max[1])],
      };
    }
  }
  const force = isRecord(r.force) && options.forces !== false && level === 0 ? forceLayers(xs, ys, numberList(r.force.fx, 'force.fx'), numberList(r.force.fy, 'force.fy'), units) : [];
  const axes = mapAxesFor(extent, units);
  return baseSpec(
    options,
    {
      layer: withMapAxes(
        layers(
          heatLayer(cells, { scheme: SEQUENTIAL_SCHEME, title: energyAxisTitle(units, `E${subscript(level)}`) }),
          outlineLayer(params, units),
          ...force,
          tubeLayer(Array.isArray(r.tubes) ? (r.tubes as { at: [number, number]; alpha: number }[]) : [], units),
        ),
        axes.x,
        axes.y,
      ),
    },
    mapSize(options, extent),
  );
}

/**
 * Vega-Lite spec of a position-sweep result: a line chart for `mode: 'path'` (s, tracked) or a landscape for
 * `mode: 'region'` (xs, ys, levels[l] flat x fastest, force {fx, fy}).
 */
export function positionSweepSpec(result: unknown, options: PositionSweepOptions = {}): ChartSpec {
  const r = asRecord(result, 'position-sweep result');
  const mode = r.mode ?? (r.xs !== undefined ? 'region' : 'path');
  return mode === 'region' ? regionSpec(r, options) : pathSpec(r, options);
}
