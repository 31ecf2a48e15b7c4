// Convergence chart: each level against the grid spacing h for the grids h, h/2, h/4, the Richardson-extrapolated value at
// h = 0 (diamond) with the extrapolation curve E_ext + c h^p dashed, and exact levels as rules where a closed form exists.
import { energyAxisTitle, energyScale, lengthAxisTitle, lengthScale } from '@/lib/units';
import { exactCaseFor, exactLevelsOf } from './exact-levels';
import { baseSpec, type ChartOptions, type ChartSpec, OKABE_ITO, tidy, unitsOf } from './common';
import { asRecord, ChartDataError, isRecord, numberList, pick, type Json } from './read-result';

/** Points on each dashed extrapolation curve. */
const CURVE_POINTS = 24;

interface GridLevels {
  h: number;
  levels: number[];
}

function gridsOf(r: Json): GridLevels[] {
  const list = pick(r, 'grids', 'runs', 'refinements');
  if (!Array.isArray(list) || list.length === 0) throw new ChartDataError('convergence result has no grids');
  return list.map((g, i) => {
    const rec = asRecord(g, `grids[${i}]`);
    const h = Number(pick(rec, 'h') ?? (isRecord(rec.grid) ? rec.grid.h : undefined));
    if (!(h > 0)) throw new ChartDataError(`grids[${i}] has no spacing h`);
    return { h, levels: numberList(rec.levels, `grids[${i}].levels`) };
  });
}

/**
 * Vega-Lite spec of a convergence study.
 *
 * @param result - `{ grids: [{ h, levels }], extrapolated?: number[], order?: number, observedOrder?: number[] }`
 * @param options - units, size; `params` (the convergence spec) for exact rules
 */
export function convergenceSpec(result: unknown, options: ChartOptions = {}): ChartSpec {
  const r = asRecord(result, 'convergence result');
  const grids = gridsOf(r);
  const units = unitsOf(options);
  const es = energyScale(units);
  const ls = lengthScale(units);
  const levelCount = Math.min(...grids.map((g) => g.levels.length));
  const rawExtrapolated = pick(r, 'extrapolated', 'richardson');
  const extrapolated = rawExtrapolated === undefined ? null : numberList(isRecord(rawExtrapolated) ? rawExtrapolated.levels : rawExtrapolated, 'extrapolated');
  const rawOrder = pick(r, 'order', 'theoreticalOrder');
  const order = typeof rawOrder === 'number' ? rawOrder : isRecord(rawOrder) && typeof rawOrder.value === 'number' ? rawOrder.value : 1;
  const points: Record<string, unknown>[] = [];
  const curves: Record<string, unknown>[] = [];
  const finest = grids.reduce((a, b) => (b.h < a.h ? b : a));
  for (let level = 0; level < levelCount; level++) {
    for (const g of grids) points.push({ h: tidy(g.h * ls), E: tidy(g.levels[level] * es), level, kind: 'lattice' });
    const ext = extrapolated?.[level];
    if (ext !== undefined && Number.isFinite(ext)) {
      points.push({ h: 0, E: tidy(ext * es), level, kind: 'extrapolated' });
      const c = (finest.levels[level] - ext) / finest.h ** order;
      for (let k = 0; k <= CURVE_POINTS; k++) {
        const h = (finest.h * k) / CURVE_POINTS;
        curves.push({ h: tidy(h * ls), E: tidy((ext + c * h ** order) * es), level });
      }
    }
  }
  const exactRules: Record<string, unknown>[] = [];
  const params = options.params;
  const of = isRecord(params) && isRecord(params.of) ? params.of : isRecord(params) ? params : null;
  if (of && isRecord(of.well)) {
    const exact = exactCaseFor({ well: of.well as never, tubes: (of.tubes as never) ?? [], potential: of.potential as string | undefined });
    if (exact) exactLevelsOf(exact, levelCount).forEach((l, level) => exactRules.push({ E: tidy(l.energy * es), level }));
  }
  const x = { field: 'h', type: 'quantitative', title: lengthAxisTitle('h', units), scale: { zero: true, nice: false } };
  const y = { field: 'E', type: 'quantitative', title: energyAxisTitle(units), scale: { zero: false } };
  const colour = { field: 'level', type: 'nominal', title: 'level', scale: { range: [...OKABE_ITO] } };
  return baseSpec(options, {
    layer: [
      ...(exactRules.length
        ? [{ data: { values: exactRules }, mark: { type: 'rule', strokeDash: [2, 2], color: '#777777', strokeWidth: 1 }, encoding: { y: { field: 'E', type: 'quantitative' } } }]
        : []),
      ...(curves.length
        ? [{ data: { values: curves }, mark: { type: 'line', strokeDash: [4, 3], strokeWidth: 1 }, encoding: { x, y, color: colour, detail: { field: 'level' } } }]
        : []),
      {
        data: { values: points },
        mark: { type: 'point', filled: true, size: 50 },
        encoding: {
          x,
          y,
          color: colour,
          shape: { field: 'kind', type: 'nominal', title: null, scale: { domain: ['lattice', 'extrapolated'], range: ['circle', 'diamond'] } },
          tooltip: [
            { field: 'level', type: 'nominal' },
            { field: 'kind', type: 'nominal' },
            { field: 'h', type: 'quantitative', format: '.4g' },
            { field: 'E', type: 'quantitative', format: '.7g' },
          ],
        },
      },
    ],
  });
}
