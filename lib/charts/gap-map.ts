// Gap map of a degeneracy search: the gap E1 - E0 over tube positions as a heat map (cividis), the degeneracy points found
// (diamonds), the loop around the scanned region (dashed), fixed tubes (crosses) and the wall.
import { energyAxisTitle, energyScale } from '@/lib/units';
import {
  baseSpec,
  type ChartOptions,
  type ChartSpec,
  GAP_SCHEME,
  layers,
  LOOP_COLOUR,
  mapAxesFor,
  mapSize,
  pointLayer,
  polylineLayer,
  tubeLayer,
  unitsOf,
  withMapAxes,
} from './common';
import { fieldCells, heatLayer } from './grid-field';
import { asRecord, ChartDataError, isRecord, numberList, pick, point, tubesOf } from './read-result';
import { outlineLayer, outlinesExtent, wellOutlines } from './well-outline';

type Extent = { min: [number, number]; max: [number, number] };

function union(a: Extent, b: Extent | null): Extent {
  if (!b) return a;
  return { min: [Math.min(a.min[0], b.min[0]), Math.min(a.min[1], b.min[1])], max: [Math.max(a.max[0], b.max[0]), Math.max(a.max[1], b.max[1])] };
}

/**
 * Vega-Lite spec of a degeneracy result.
 *
 * @param result - `{ gapMap: { xs, ys, gap (flat, x fastest) }, points: [{ at, gap }], region, tubes, count, parity }`
 * @param options - units, size; `params` (the degeneracy spec) for the wall and the region loop
 */
export function gapMapSpec(result: unknown, options: ChartOptions = {}): ChartSpec {
  const r = asRecord(result, 'degeneracy result');
  const map = asRecord(pick(r, 'gapMap', 'gaps'), 'gapMap');
  const xs = numberList(map.xs, 'gapMap.xs');
  const ys = numberList(map.ys, 'gapMap.ys');
  const gap = numberList(pick(map, 'gap', 'values'), 'gapMap.gap');
  if (xs.length === 0 || ys.length === 0) throw new ChartDataError('gapMap has no positions');
  const units = unitsOf(options);
  const { cells } = fieldCells({ xs, ys, values: gap }, { units, scale: energyScale(units), maxCells: options.maxCells });
  const dx = xs.length > 1 ? xs[1] - xs[0] : 0;
  const dy = ys.length > 1 ? ys[1] - ys[0] : dx;
  let extent: Extent = { min: [xs[0] - dx / 2, ys[0] - dy / 2], max: [xs[xs.length - 1] + dx / 2, ys[ys.length - 1] + dy / 2] };
  const params = options.params;
  const wellOk = isRecord(params) && isRecord(params.well);
  if (wellOk) extent = union(extent, outlinesExtent(wellOutlines(params.well as never)));
  // The scanned region: as asked for, or as the solver reports it (the well's bounding box by default).
  const region = isRecord(params) && isRecord(params.region) ? params.region : isRecord(r.region) ? r.region : null;
  const regionLoop = region
    ? (() => {
        const min = point(region.min, 'region.min');
        const max = point(region.max, 'region.max');
        return polylineLayer(
          [{ id: 'region', points: [min, [max[0], min[1]], max, [min[0], max[1]], min] }],
          units,
          { stroke: LOOP_COLOUR, strokeWidth: 1, strokeDash: [5, 3] },
        );
      })()
    : null;
  const pointsRaw = Array.isArray(r.points) ? r.points : [];
  const points = pointsRaw.filter(isRecord).map((p, i) => ({
    at: point(p.at, `points[${i}].at`),
    value: typeof p.gap === 'number' ? p.gap * energyScale(units) : undefined,
    label: `degeneracy ${i + 1}`,
  }));
  const axes = mapAxesFor(extent, units);
  return baseSpec(
    options,
    {
      layer: withMapAxes(
        layers(
          heatLayer(cells, { scheme: GAP_SCHEME, title: energyAxisTitle(units, 'ΔE') }),
          outlineLayer(params, units),
          regionLoop,
          tubeLayer(tubesOf(r), units),
          pointLayer(points, units, 'degeneracy'),
        ),
        axes.x,
        axes.y,
      ),
    },
    mapSize(options, extent),
  );
}
