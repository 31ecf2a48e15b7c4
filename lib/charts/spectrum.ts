// Level diagram of one configuration: a short horizontal bar per computed level (degenerate groups labelled ×2, ×3…) and,
// where a closed form exists (disk with centred tubes, rectangle), the exact levels in a second column for comparison.
import { energyAxisTitle, energyScale } from '@/lib/units';
import { exactCaseFor, exactLevelsOf } from './exact-levels';
import { baseSpec, type ChartOptions, type ChartSpec, tidy, unitsOf } from './common';
import { asRecord, isRecord, numberList, tubesOf } from './read-result';

/** Levels closer than this (relative) are drawn as one bar with a multiplicity label (common practice for plotting). */
const SAME_LEVEL = 1e-6;

function groups(levels: number[]): { energy: number; count: number; first: number }[] {
  const out: { energy: number; count: number; first: number }[] = [];
  levels.forEach((e, i) => {
    const last = out[out.length - 1];
    if (last && Math.abs(e - last.energy) <= SAME_LEVEL * Math.max(1, Math.abs(e))) last.count += 1;
    else out.push({ energy: e, count: 1, first: i });
  });
  return out;
}

/** Column label of the exact levels for an exact case. */
function exactLabel(kind: 'disk' | 'rectangle'): string {
  return kind === 'disk' ? 'exact (Bessel zeros)' : 'exact (rectangle)';
}

/**
 * Vega-Lite spec of a spectrum result as a level diagram.
 *
 * @param result - `{ levels: number[] }` (ascending, with multiplicity) and `tubes` (snapped)
 * @param options - units, size; `params` (the spectrum spec) enables the exact column
 */
export function spectrumSpec(result: unknown, options: ChartOptions = {}): ChartSpec {
  const r = asRecord(result, 'spectrum result');
  const levels = numberList(r.levels, 'levels');
  const units = unitsOf(options);
  const scale = energyScale(units);
  const values: Record<string, unknown>[] = [];
  for (const g of groups(levels)) {
    values.push({ column: 'lattice', E: tidy(g.energy * scale), level: g.first, label: g.count > 1 ? `×${g.count}` : '' });
  }
  const params = options.params;
  if (isRecord(params) && isRecord(params.well)) {
    const exact = exactCaseFor({
      well: params.well as never,
      tubes: tubesOf(r).length > 0 ? tubesOf(r) : ((params.tubes as { at: [number, number]; alpha: number }[]) ?? []),
      potential: params.potential as string | undefined,
    });
    if (exact) {
      const ex = exactLevelsOf(exact, levels.length).map((l) => l.energy);
      for (const g of groups(ex)) {
        values.push({ column: exactLabel(exact.kind), E: tidy(g.energy * scale), level: g.first, label: g.count > 1 ? `×${g.count}` : '' });
      }
    }
  }
  const columns = Array.from(new Set(values.map((v) => v.column as string)));
  const encodingX = { field: 'column', type: 'nominal', title: null, axis: { labelAngle: 0 }, sort: columns };
  const encodingY = { field: 'E', type: 'quantitative', title: energyAxisTitle(units), scale: { zero: false } };
  return baseSpec(options, {
    data: { values },
    layer: [
      {
        mark: { type: 'tick', thickness: 2, bandSize: 0.7 },
        encoding: {
          x: encodingX,
          y: encodingY,
          color: { field: 'column', type: 'nominal', legend: null },
          tooltip: [
            { field: 'level', title: 'first level index' },
            { field: 'E', type: 'quantitative', title: energyAxisTitle(units), format: '.6g' },
            { field: 'label', title: 'multiplicity' },
          ],
        },
      },
      {
        mark: { type: 'text', align: 'center', baseline: 'bottom', dy: -3, fontSize: 10 },
        encoding: { x: encodingX, y: encodingY, text: { field: 'label' } },
      },
    ],
  });
}
