// Chart specs for every figure kind, built from REAL solver results on coarse grids: each compiles with vega-lite without
// warnings and renders to SVG on the server; exact overlays, units, markers and view-spec merging are checked.
import { beforeAll, describe, expect, it } from 'vitest';
import { chartSpecFor, ChartDataError, defaultViewSpec, editableViewSpec, mergeViewSpec, viewSpecSchema } from '@/lib/charts';
import { diskLevels } from '@/lib/charts/exact-levels';
import { renderSvg } from '@/lib/export/render-svg';
import { DIMENSIONLESS, energyUnitMeV } from '@/lib/units';
import { SMALL_SPECS, smallResult } from './solver-results';
import { vegaLiteWarnings as compileQuietly } from '../helpers/vega-lite-warnings';

type Computed = Awaited<ReturnType<typeof smallResult>>;
const results: Record<string, Computed> = {};

beforeAll(async () => {
  for (const name of Object.keys(SMALL_SPECS)) results[name] = await smallResult(name);
}, 600_000);


/** All inline data values of a spec (top level, layers, concatenated panels). */
function dataOf(spec: unknown): Record<string, unknown>[] {
  const out: Record<string, unknown>[] = [];
  const walk = (node: unknown) => {
    if (Array.isArray(node)) return node.forEach(walk);
    if (typeof node !== 'object' || node === null) return;
    const rec = node as Record<string, unknown>;
    if (rec.data && typeof rec.data === 'object' && Array.isArray((rec.data as { values?: unknown }).values)) {
      out.push(...((rec.data as { values: Record<string, unknown>[] }).values));
    }
    Object.entries(rec).forEach(([k, v]) => k !== 'data' && walk(v));
  };
  walk(spec);
  return out;
}

const CASES: [string, string, RegExp[]][] = [
  ['spectrum', 'spectrum', [/E \(ħ²\/2mL²\)/, /exact \(Bessel zeros\)/]],
  ['flux-sweep', 'flux-sweep', [/α \(flux quanta h\/e\)/, /E \(ħ²\/2mL²\)/]],
  ['position-sweep', 'position-sweep', [/s \(L\)/]],
  ['position-sweep-region', 'position-sweep', [/x \(L\)/, /y \(L\)/, /E₀/]],
  ['holonomy', 'holonomy', [/Re W/, /Im W/, /arg W = −0\.600π/, /counter-clockwise loop/]],
  ['degeneracy', 'degeneracy', [/ΔE \(ħ²\/2mL²\)/, /x \(L\)/]],
  ['nodal-lines', 'nodal-lines', [/ψ &gt; 0|ψ > 0/, /sign \(cut gauge\)/]],
  ['convergence', 'convergence', [/h \(L\)/, /extrapolated/]],
];

describe('default chart of every kind (real solver results)', () => {
  for (const [name, kind, patterns] of CASES) {
    it(`${name}: compiles without warnings and renders to SVG`, async () => {
      const { spec, result } = results[name];
      const chart = defaultViewSpec(kind, result, { units: DIMENSIONLESS, params: spec });
      expect(compileQuietly(chart)).toEqual([]);
      const { svg, width, height } = await renderSvg(chart);
      expect(svg.startsWith('<svg')).toBe(true);
      expect(width).toBeGreaterThan(100);
      expect(height).toBeGreaterThan(80);
      for (const p of patterns) expect(svg).toMatch(p);
      expect(dataOf(chart).length).toBeGreaterThan(0);
    });
  }

  it('spectrum density view: one cell per unknown inside the well, tubes marked', async () => {
    const { spec, result } = results.spectrum;
    const chart = defaultViewSpec('spectrum', result, { view: 'density', level: 0, params: spec });
    expect(compileQuietly(chart)).toEqual([]);
    const r = result as { unknowns: number };
    const cells = dataOf(chart).filter((d) => 'x2' in d);
    expect(cells.length).toBe(r.unknowns);
    const { svg } = await renderSvg(chart);
    expect(svg).toContain('|ψ₀|²');
  });

  it('spectrum: the exact column holds the Bessel levels of the centred half tube (DLMF 10.16.1)', () => {
    const { spec, result } = results.spectrum;
    const values = dataOf(defaultViewSpec('spectrum', result, { params: spec }));
    const exact = values.filter((v) => v.column === 'exact (Bessel zeros)').map((v) => v.E as number);
    expect(exact[0]).toBeCloseTo(Math.PI ** 2, 9);
    expect(exact[1]).toBeCloseTo(4.493409457909064 ** 2, 9);
    expect(values.find((v) => v.column === 'exact (Bessel zeros)')?.label).toBe('×2');
  });

  it('flux sweep: dashed exact curves from Bessel zeros, lattice lines per tracked level', () => {
    const { spec, result } = results['flux-sweep'];
    const values = dataOf(defaultViewSpec('flux-sweep', result, { params: spec }));
    const lattice = values.filter((v) => v.source === 'lattice');
    const exact = values.filter((v) => v.source !== 'lattice');
    expect(new Set(lattice.map((v) => v.level)).size).toBe(4);
    const atZero = exact.filter((v) => v.alpha === 0).map((v) => v.E as number).sort((a, b) => a - b);
    expect(atZero[0]).toBeCloseTo(5.783185962946784, 9); // j01², DLMF §10.21
    const atHalf = exact.filter((v) => v.alpha === 0.5).map((v) => v.E as number).sort((a, b) => a - b);
    expect(atHalf[0]).toBeCloseTo(diskLevels(0.5, 1, 1)[0].energy, 9);
    expect(atHalf[0]).toBeCloseTo(Math.PI ** 2, 9);
  });

  it('display units: energies in meV and lengths in nm', () => {
    const units = { system: 'physical' as const, lengthNm: 40, effectiveMass: 0.067 };
    const { spec, result } = results['flux-sweep'];
    const plain = dataOf(defaultViewSpec('flux-sweep', result, { params: spec })).filter((v) => v.source === 'lattice');
    const physical = dataOf(defaultViewSpec('flux-sweep', result, { params: spec, units })).filter((v) => v.source === 'lattice');
    expect(physical[0].E as number).toBeCloseTo((plain[0].E as number) * energyUnitMeV(40, 0.067), 9);
    const region = results['position-sweep-region'];
    const map = defaultViewSpec('position-sweep', region.result, { params: region.spec, units });
    const svgValues = dataOf(map).filter((d) => 'x2' in d && 'v' in d);
    const xs = svgValues.map((d) => d.x as number);
    expect(Math.min(...xs)).toBeLessThan(-15);
    expect(JSON.stringify(map)).toContain('x (nm)');
  });

  it('gap map: the degeneracy point of the disk is at its centre (PHYSICS.md §1) and drawn as a marker', () => {
    const { spec, result } = results.degeneracy;
    const points = dataOf(defaultViewSpec('degeneracy', result, { params: spec })).filter((d) => typeof d.label === 'string' && String(d.label).startsWith('degeneracy'));
    expect(points).toHaveLength(1);
    expect(Math.hypot(points[0].x as number, points[0].y as number)).toBeLessThan(0.25);
  });

  it('nodal lines: a line ends at the half tube, the cut is drawn, the sign map is two-valued', () => {
    const { spec, result } = results['nodal-lines'];
    const chart = defaultViewSpec('nodal-lines', result, { params: spec });
    const values = dataOf(chart);
    const signs = new Set(values.filter((d) => 'x2' in d).map((d) => d.v));
    expect([...signs].sort()).toEqual([-1, 1]);
    expect(values.some((d) => String(d.line ?? '').startsWith('nodal'))).toBe(true);
    expect(values.some((d) => String(d.line ?? '').startsWith('cut'))).toBe(true);
  });

  it('holonomy: W/|W| on the unit circle at phase -2 pi alpha (Berry 1984; PHYSICS.md §3 orientation)', () => {
    const { spec, result } = results.holonomy;
    const w = dataOf(defaultViewSpec('holonomy', result, { params: spec })).find((d) => d.what === 'W/|W|')!;
    expect(Math.atan2(w.im as number, w.re as number)).toBeCloseTo(-2 * Math.PI * 0.3, 6);
  });
});

describe('view specs', () => {
  it('chartSpecFor merges a stored view spec over the default and keeps the computed data', async () => {
    const { spec, result } = results['flux-sweep'];
    const viewSpec = viewSpecSchema.parse({
      title: 'Spectral flow',
      width: 300,
      layer: [{ mark: { strokeWidth: 3 } }],
      config: { axis: { labelFontSize: 12 } },
    });
    const spec2 = chartSpecFor('flux-sweep', result, { units: DIMENSIONLESS, params: spec, viewSpec });
    const chart = spec2 as unknown as Record<string, unknown>;
    expect(chart.title).toBe('Spectral flow');
    expect(chart.width).toBe(300);
    const layer0 = (chart.layer as Record<string, unknown>[])[0];
    expect((layer0.mark as Record<string, unknown>).strokeWidth).toBe(3);
    expect((layer0.mark as Record<string, unknown>).type).toBe('line');
    expect(dataOf(chart).length).toBe(dataOf(defaultViewSpec('flux-sweep', result, { params: spec })).length);
    expect(compileQuietly(chart)).toEqual([]);
    await expect(renderSvg(spec2)).resolves.toMatchObject({ width: expect.any(Number) });
  });

  it('the fluxfolio key picks a view; editable specs drop data; merge appends extra layers', () => {
    const { spec, result } = results.spectrum;
    const density = chartSpecFor('spectrum', result, { units: DIMENSIONLESS, params: spec, viewSpec: { fluxfolio: { view: 'density', level: 1 } } });
    expect(JSON.stringify(density)).toContain('|ψ₁|²');
    expect(JSON.stringify(editableViewSpec(density))).not.toContain('"values"');
    const merged = mergeViewSpec({ layer: [{ mark: 'line' }] }, { layer: [{}, { mark: 'rule', data: { values: [{ y: 1 }] } }] });
    expect(merged).toEqual({ layer: [{ mark: 'line' }, { mark: 'rule', data: { values: [{ y: 1 }] } }] });
  });

  it('refuses oversized or non-object view specs', () => {
    expect(viewSpecSchema.safeParse([1, 2]).success).toBe(false);
    expect(viewSpecSchema.safeParse({ big: 'x'.repeat(100_001) }).success).toBe(false);
  });

  it('chartSpecFor validates a stored view spec again before drawing', () => {
    const { spec, result } = results['flux-sweep'];
    expect(() => chartSpecFor('flux-sweep', result, { units: DIMENSIONLESS, params: spec, viewSpec: [1, 2] })).toThrow(/view spec cannot be used/);
    // A row stored before the allow-list (data sets, a foreign $schema) is refused when drawn, not drawn half-cleaned.
    expect(() =>
      chartSpecFor('flux-sweep', result, { units: DIMENSIONLESS, params: spec, viewSpec: { title: 'T', datasets: { x: [1] }, $schema: 'x' } }),
    ).toThrow(/view spec cannot be used/);
    const drawn = chartSpecFor('flux-sweep', result, { units: DIMENSIONLESS, params: spec, viewSpec: { title: 'T' } });
    expect((drawn as unknown as Record<string, unknown>).title).toBe('T');
  });

  it('clear errors for unknown kinds, views and incomplete results', () => {
    expect(() => defaultViewSpec('pie', {})).toThrow(/no chart for kind "pie"/);
    expect(() => defaultViewSpec('spectrum', { levels: [1] }, { view: 'bars' })).toThrow(/has no view "bars"/);
    expect(() => defaultViewSpec('flux-sweep', { tracked: [[1]] })).toThrow(ChartDataError);
    expect(() => defaultViewSpec('holonomy', { holonomy: { re: 1, im: 0 } })).toThrow(/no path/);
    expect(() => defaultViewSpec('spectrum', { levels: [1, 2] }, { view: 'density' })).toThrow(/"states": true/);
  });

  it('uploaded data: columns against the first', async () => {
    const chart = defaultViewSpec('uploaded-data', { columns: ['alpha', 'E0', 'E1'], rows: [[0, 5.8, 14.7], [0.5, 9.9, 9.9]] });
    expect(compileQuietly(chart)).toEqual([]);
    expect((await renderSvg(chart)).svg).toContain('alpha');
  });
});
