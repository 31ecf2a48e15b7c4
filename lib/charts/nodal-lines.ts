// Nodal-line chart of a real state: the sign of psi as a diverging blue/orange map, the zero lines as black polylines
// (they end on half tubes or on the wall), tube markers and the wall.
import {
  baseSpec,
  type ChartOptions,
  type ChartSpec,
  SIGN_COLOURS,
  layers,
  mapAxesFor,
  mapSize,
  polylineLayer,
  tubeLayer,
  unitsOf,
  withMapAxes,
} from './common';
import { categoryLayer, fieldCells, latticeAxis } from './grid-field';
import { outlineLayer } from './well-outline';
import { asRecord, ChartDataError, gridOf, isRecord, numberList, point, tubesOf, type Json } from './read-result';

/** The sign field of a result: `sign.values` on the lattice box described by `grid` (x fastest, 0 on wall sites). */
function signField(r: Json): { xs: number[]; ys: number[]; values: number[] } {
  const raw = asRecord(r.sign, 'sign');
  const grid = gridOf(r.grid);
  const values = numberList(raw.values, 'sign.values');
  return { xs: latticeAxis(grid.origin[0], grid.h, grid.nx), ys: latticeAxis(grid.origin[1], grid.h, grid.ny), values };
}

/** A half-odd-integer flux: the real state changes sign across the tube's cut. */
function isHalfOdd(alpha: number): boolean {
  return Math.abs(Math.abs(alpha % 1) - 0.5) < 1e-12;
}

/**
 * Vega-Lite spec of a nodal-lines result.
 *
 * @param result - `{ lines: [{ points: [[x, y], …], ends }], sign: { values (x fastest) }, tubes, grid }`
 * @param options - units, size; `params` for the wall outline
 */
export function nodalLinesSpec(result: unknown, options: ChartOptions = {}): ChartSpec {
  const r = asRecord(result, 'nodal-lines result');
  if (!Array.isArray(r.lines)) throw new ChartDataError('nodal-lines result has no lines');
  const units = unitsOf(options);
  const field = signField(r);
  // Colour by the sign only: the amplitude would hide the lines near small lobes.
  const signs = field.values.map((v) => (v > 0 ? 1 : v < 0 ? -1 : 0));
  const { cells } = fieldCells({ xs: field.xs, ys: field.ys, values: signs }, { units, skip: (v) => v === 0, maxCells: options.maxCells });
  const h = field.xs.length > 1 ? field.xs[1] - field.xs[0] : 1;
  const extent = {
    min: [field.xs[0] - h / 2, field.ys[0] - h / 2] as [number, number],
    max: [field.xs[field.xs.length - 1] + h / 2, field.ys[field.ys.length - 1] + h / 2] as [number, number],
  };
  const lines = r.lines.filter(isRecord).map((line, i) => ({
    id: `nodal ${i}`,
    points: (Array.isArray(line.points) ? line.points : []).map((p, k) => point(p, `lines[${i}].points[${k}]`)),
  }));
  // In the cut gauge the sign flips across each half tube's cut (the ray towards +x) without a zero there: draw the cuts
  // dotted so the colour change along them is not read as a nodal line (PHYSICS.md §5).
  const tubes = tubesOf(r);
  const cuts = tubes
    .filter((t) => isHalfOdd(t.alpha))
    .map((t, i) => ({ id: `cut ${i}`, points: [t.at, [extent.max[0], t.at[1]]] as [number, number][] }));
  const axes = mapAxesFor(extent, units);
  return baseSpec(
    options,
    {
      layer: withMapAxes(
        layers(
          categoryLayer(
            cells,
            [
              { value: 1, label: 'ψ > 0', colour: SIGN_COLOURS.positive },
              { value: -1, label: 'ψ < 0', colour: SIGN_COLOURS.negative },
            ],
            'sign (cut gauge)',
          ),
          outlineLayer(options.params, units),
          polylineLayer(cuts, units, { stroke: '#ffffff', strokeWidth: 1.2, strokeDash: [2, 2] }),
          polylineLayer(lines, units, { stroke: '#000000', strokeWidth: 1.6 }),
          tubeLayer(tubes, units),
        ),
        axes.x,
        axes.y,
      ),
    },
    mapSize(options, extent),
  );
}
