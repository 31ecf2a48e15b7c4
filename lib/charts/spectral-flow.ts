// Spectral flow chart: levels versus the flux alpha of one tube, one line per tracked level (Okabe–Ito colours), with the
// exact levels of a disk with the swept tube at its centre (Bessel zeros) drawn dashed over them when they exist.
import { energyAxisTitle, energyScale, FLUX_AXIS_TITLE } from '@/lib/units';
import { diskLevelsBelow, exactCaseFor } from './exact-levels';
import { baseSpec, type ChartOptions, type ChartSpec, tidy, unitsOf } from './common';
import { asRecord, ChartDataError, curvesOver, isRecord, numberList, numberMatrix, pick, point, type Json } from './read-result';

/** At most this many flux values are used for the exact overlay (the curves are smooth; each point costs a Bessel root search). */
const EXACT_SAMPLES = 61;
/** Exact curves are drawn up to this factor times the highest computed level. */
const EXACT_WINDOW = 1.15;

interface SweepParams {
  well: unknown;
  tubes?: { at: [number, number]; alpha: number }[];
  potential?: string;
  sweep?: { tube?: number };
}

/** The exact overlay for a sweep, or null: the well must be a disk and the swept tube sit at its centre (see exactCaseFor). */
function exactCurves(params: unknown, result: Json, alphas: number[], levelCount: number, energyMax: number): { label: string; points: { alpha: number; E: number }[] }[] | null {
  if (!isRecord(params) || !isRecord(params.well)) return null;
  const p = params as unknown as SweepParams;
  const swept = typeof result.tube === 'number' ? result.tube : (p.sweep?.tube ?? 0);
  const tubes = (Array.isArray(result.tubes) ? result.tubes : p.tubes ?? []) as { at: unknown; alpha: number }[];
  if (!tubes[swept]) return null;
  const others = tubes.filter((_, i) => i !== swept).map((t, i) => ({ at: point(t.at, `tubes[${i}].at`), alpha: Number(t.alpha) }));
  const sweptAt = point(tubes[swept].at, `tubes[${swept}].at`);
  const base = exactCaseFor({ well: p.well as never, tubes: others, potential: p.potential });
  if (!base || base.kind !== 'disk') return null;
  if (Math.hypot(sweptAt[0] - base.centre[0], sweptAt[1] - base.centre[1]) > 1e-9) return null;
  const stride = Math.max(1, Math.ceil(alphas.length / EXACT_SAMPLES));
  const picked: number[] = [];
  for (let i = 0; i < alphas.length; i += stride) picked.push(i);
  if (picked[picked.length - 1] !== alphas.length - 1) picked.push(alphas.length - 1);
  // All exact levels inside the plotted energy window at each sampled flux, joined into curves by (m, n); only the pairs
  // that are among the lowest `levelCount` somewhere in the sweep are drawn. A curve E_{m,n}(alpha) is V-shaped around
  // alpha = m, so the part inside the window is one piece.
  const curves = new Map<string, { m: number; n: number; points: { alpha: number; E: number }[]; low: boolean }>();
  for (const i of picked) {
    const levels = diskLevelsBelow(base.alpha + alphas[i], base.radius, energyMax);
    levels.forEach((l, rank) => {
      const key = `${l.quantum.m},${l.quantum.n}`;
      let curve = curves.get(key);
      if (!curve) {
        curve = { m: l.quantum.m, n: l.quantum.n, points: [], low: false };
        curves.set(key, curve);
      }
      curve.points.push({ alpha: alphas[i], E: l.energy });
      if (rank < levelCount) curve.low = true;
    });
  }
  return Array.from(curves.values())
    .filter((c) => c.low)
    .sort((a, b) => a.n - b.n || a.m - b.m)
    .map((c) => ({ label: `m = ${c.m}, n = ${c.n}`, points: c.points }));
}

/**
 * Vega-Lite spec of a flux sweep: E(α) per tracked level, with the exact disk levels dashed when they exist.
 *
 * @param result - a flux-sweep result: `alphas` and `tracked[level][step]` (levels followed through crossings); `sorted` when absent
 * @param options - units, size, and `params` (the task spec) for the exact overlay
 * @example spectralFlowSpec({ alphas: [0, 0.5, 1], tracked: [[5.78, 9.87, 5.78]] }).layer // one line layer
 */
export function spectralFlowSpec(result: unknown, options: ChartOptions = {}): ChartSpec {
  const r = asRecord(result, 'flux-sweep result');
  const alphas = numberList(pick(r, 'alphas', 'alpha'), 'alphas');
  const raw = pick(r, 'tracked', 'levels', 'sorted');
  if (raw === undefined) throw new ChartDataError('flux-sweep result has no levels');
  const curves = curvesOver(numberMatrix(raw, 'levels'), alphas.length);
  const units = unitsOf(options);
  const scale = energyScale(units);
  const values: Record<string, unknown>[] = [];
  curves.forEach((curve, level) =>
    curve.forEach((e, i) => {
      if (Number.isFinite(e)) values.push({ alpha: alphas[i], E: tidy(e * scale), level, source: 'lattice' });
    }),
  );
  let highest = 0;
  for (const curve of curves) for (const e of curve) if (Number.isFinite(e)) highest = Math.max(highest, e);
  // Exact curves are drawn up to a little above the highest computed level (the plotted window).
  const exact = exactCurves(options.params, r, alphas, curves.length, highest * EXACT_WINDOW);
  if (exact) {
    for (const curve of exact) {
      for (const p of curve.points) values.push({ alpha: p.alpha, E: tidy(p.E * scale), level: curve.label, source: 'exact (Bessel zeros)' });
    }
  }
  const sources = exact ? ['lattice', 'exact (Bessel zeros)'] : ['lattice'];
  return baseSpec(options, {
    data: { values },
    layer: [
      {
        mark: { type: 'line', strokeWidth: 1.6, interpolate: 'linear' },
        transform: [{ filter: "datum.source === 'lattice'" }],
        encoding: {
          x: { field: 'alpha', type: 'quantitative', title: FLUX_AXIS_TITLE, scale: { nice: false, zero: false } },
          y: { field: 'E', type: 'quantitative', title: energyAxisTitle(units), scale: { zero: false } },
          color: { field: 'level', type: 'nominal', title: 'level', legend: curves.length > 1 ? {} : null },
          detail: { field: 'level', type: 'nominal' },
          tooltip: [
            { field: 'level', type: 'nominal' },
            { field: 'alpha', type: 'quantitative', title: 'α', format: '.4f' },
            { field: 'E', type: 'quantitative', title: energyAxisTitle(units), format: '.6g' },
          ],
        },
      },
      ...(exact
        ? [
            {
              mark: { type: 'line', strokeWidth: 1, strokeDash: [4, 3], color: '#000000' },
              transform: [{ filter: "datum.source !== 'lattice'" }],
              encoding: {
                x: { field: 'alpha', type: 'quantitative' },
                y: { field: 'E', type: 'quantitative' },
                detail: { field: 'level', type: 'nominal' },
                strokeDash: { field: 'source', type: 'nominal', title: null, scale: { domain: sources, range: [[1, 0], [4, 3]] }, legend: { orient: 'top', direction: 'horizontal' } },
              },
            },
          ]
        : []),
    ],
  });
}
