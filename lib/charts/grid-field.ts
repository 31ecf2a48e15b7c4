// Heat-map cells from a field sampled on a uniform grid (flat array, x fastest): one rectangle per sample, averaged down by
// an integer block factor when the grid has more cells than a chart should draw.
import { type DisplayUnits, lengthScale } from '@/lib/units';
import { tidy } from './common';

/** A field on a uniform grid: sample (i, j) is at (xs[i], ys[j]) and stored at values[i + xs.length * j]. */
export interface GridField {
  xs: ArrayLike<number>;
  ys: ArrayLike<number>;
  values: ArrayLike<number | null>;
}

/** One heat-map rectangle in display units. */
export interface FieldCell {
  x: number;
  x2: number;
  y: number;
  y2: number;
  v: number;
}

export interface FieldCellOptions {
  units: DisplayUnits;
  /** Samples for which this is true are left out (e.g. exact zeros outside the well). */
  skip?: (value: number) => boolean;
  /** Largest number of cells (default 16384). */
  maxCells?: number;
  /** Applied to each (block-averaged) value, e.g. an energy unit conversion. */
  scale?: number;
}

/** Fraction of a cell by which heat-map cells overlap (hides anti-aliasing seams; invisible otherwise). */
const SEAM_OVERLAP = 0.02;

function spacing(coords: ArrayLike<number>, fallback: number): number {
  return coords.length > 1 ? (coords[coords.length - 1] - coords[0]) / (coords.length - 1) : fallback;
}

/**
 * Axis positions of a lattice: `n` sites starting at `origin` with spacing `h`.
 * @example latticeAxis(0.5, 0.25, 3) // returns [0.5, 0.75, 1]
 */
export function latticeAxis(origin: number, h: number, n: number): number[] {
  return Array.from({ length: n }, (_, i) => origin + i * h);
}

/**
 * Cells for a rect-mark heat map. Each sample becomes the rectangle of one grid spacing centred on it; when there are more than
 * `maxCells` samples, blocks of f x f samples are averaged (skipped samples do not count; a block with none is dropped).
 *
 * @returns cells and the block factor used (1 when no averaging)
 */
export function fieldCells(field: GridField, options: FieldCellOptions): { cells: FieldCell[]; factor: number } {
  const nx = field.xs.length;
  const ny = field.ys.length;
  if (field.values.length !== nx * ny) {
    throw new RangeError(`field has ${field.values.length} values for a ${nx} x ${ny} grid`);
  }
  const maxCells = options.maxCells ?? 16384;
  const factor = Math.max(1, Math.ceil(Math.sqrt((nx * ny) / maxCells)));
  const dx = spacing(field.xs, spacing(field.ys, 1));
  const dy = spacing(field.ys, dx);
  const s = lengthScale(options.units);
  const scale = options.scale ?? 1;
  const cells: FieldCell[] = [];
  for (let bj = 0; bj < ny; bj += factor) {
    for (let bi = 0; bi < nx; bi += factor) {
      let sum = 0;
      let count = 0;
      const iEnd = Math.min(bi + factor, nx);
      const jEnd = Math.min(bj + factor, ny);
      for (let j = bj; j < jEnd; j++) {
        for (let i = bi; i < iEnd; i++) {
          const v = field.values[i + nx * j];
          if (v === null || v === undefined || !Number.isFinite(v) || options.skip?.(v)) continue;
          sum += v;
          count += 1;
        }
      }
      if (count === 0) continue;
      // Cells overlap their neighbours by a hair so anti-aliasing leaves no light seams between them.
      const x0 = field.xs[bi] - dx * (0.5 + SEAM_OVERLAP);
      const x1 = field.xs[iEnd - 1] + dx * (0.5 + SEAM_OVERLAP);
      const y0 = field.ys[bj] - dy * (0.5 + SEAM_OVERLAP);
      const y1 = field.ys[jEnd - 1] + dy * (0.5 + SEAM_OVERLAP);
      cells.push({ x: tidy(x0 * s), x2: tidy(x1 * s), y: tidy(y0 * s), y2: tidy(y1 * s), v: tidy((sum / count) * scale) });
    }
  }
  return { cells, factor };
}

/** Where a cell's rectangle is drawn: from (x, y) to (x2, y2) in data units. */
const CELL_POSITION = {
  x: { field: 'x', type: 'quantitative' },
  x2: { field: 'x2' },
  y: { field: 'y', type: 'quantitative' },
  y2: { field: 'y2' },
} as const;

/** A rect-mark heat-map layer over `cells` with a colour scheme and legend title. */
export function heatLayer(
  cells: FieldCell[],
  colour: { scheme: string; title: string; domainMid?: number; domain?: [number, number] },
): Record<string, unknown> {
  return {
    data: { values: cells },
    mark: { type: 'rect', strokeWidth: 0 },
    encoding: {
      ...CELL_POSITION,
      color: {
        field: 'v',
        type: 'quantitative',
        title: colour.title,
        scale: {
          scheme: colour.scheme,
          ...(colour.domainMid !== undefined ? { domainMid: colour.domainMid } : {}),
          ...(colour.domain ? { domain: colour.domain } : {}),
        },
      },
      tooltip: [{ field: 'v', type: 'quantitative', title: colour.title, format: '.4g' }],
    },
  };
}

/** A rect-mark map of categories (e.g. the sign of a real state): `v` values mapped to colours with labels in the legend. */
export function categoryLayer(
  cells: FieldCell[],
  categories: { value: number; label: string; colour: string }[],
  title: string,
): Record<string, unknown> {
  const labelExpr = categories.map((c) => `datum.value == ${c.value} ? ${JSON.stringify(c.label)} : `).join('') + "''";
  return {
    data: { values: cells },
    mark: { type: 'rect', strokeWidth: 0 },
    encoding: {
      ...CELL_POSITION,
      color: {
        field: 'v',
        type: 'ordinal',
        title,
        scale: { domain: categories.map((c) => c.value), range: categories.map((c) => c.colour) },
        legend: { labelExpr },
      },
    },
  };
}
