// Density map |psi|^2 of one level on the lattice (viridis), with the well outline and tube markers; sites outside the
// well (stored as exact zeros) are left blank so the wall shows.
import {
  baseSpec,
  type ChartOptions,
  type ChartSpec,
  layers,
  mapAxesFor,
  mapSize,
  SEQUENTIAL_SCHEME,
  tubeLayer,
  unitsOf,
  withMapAxes,
} from './common';
import { fieldCells, heatLayer, latticeAxis } from './grid-field';
import { asRecord, ChartDataError, gridOf, isRecord, numberList, numberMatrix, tubesOf } from './read-result';
import { outlineLayer } from './well-outline';

export interface DensityOptions extends ChartOptions {
  /** Which level's density (default 0). */
  level?: number;
}

/**
 * Vega-Lite spec of |psi|^2 for a spectrum result computed with `states: true`.
 *
 * @param result - spectrum result with `grid` {h, nx, ny, origin} and `states.density` (one flat array per level, x fastest)
 * @param options - units, size, `level`, `params` (for the wall outline)
 */
export function densitySpec(result: unknown, options: DensityOptions = {}): ChartSpec {
  const r = asRecord(result, 'spectrum result');
  if (!isRecord(r.states)) throw new ChartDataError('this result has no states: compute the spectrum with "states": true');
  const grid = gridOf(r.grid);
  const level = options.level ?? 0;
  const densities = numberMatrix(r.states.density, 'states.density');
  if (!densities[level]) throw new ChartDataError(`level ${level} has no density (the result has ${densities.length})`);
  const values = numberList(densities[level], `states.density[${level}]`);
  const units = unitsOf(options);
  const xs = latticeAxis(grid.origin[0], grid.h, grid.nx);
  const ys = latticeAxis(grid.origin[1], grid.h, grid.ny);
  const { cells } = fieldCells({ xs, ys, values }, { units, skip: (v) => v === 0, maxCells: options.maxCells });
  const extent = { min: [xs[0] - grid.h / 2, ys[0] - grid.h / 2] as [number, number], max: [xs[xs.length - 1] + grid.h / 2, ys[ys.length - 1] + grid.h / 2] as [number, number] };
  const axes = mapAxesFor(extent, units);
  return baseSpec(
    options,
    {
      layer: withMapAxes(
        layers(
          heatLayer(cells, { scheme: SEQUENTIAL_SCHEME, title: `|ψ${subscript(level)}|²` }),
          outlineLayer(options.params, units),
          tubeLayer(tubesOf(r), units),
        ),
        axes.x,
        axes.y,
      ),
      resolve: { scale: { color: 'independent' } },
    },
    mapSize(options, extent),
  );
}

const SUBSCRIPTS = '₀₁₂₃₄₅₆₇₈₉';

/** Unicode subscript digits for a level index. @example subscript(12) // returns '₁₂' */
export function subscript(n: number): string {
  return String(n)
    .split('')
    .map((d) => SUBSCRIPTS[Number(d)] ?? d)
    .join('');
}
