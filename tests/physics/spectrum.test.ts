// Tests of the spectrum task on the unit disk against Bessel zeros (DLMF section 10.21; half orders DLMF 10.16.1),
// the flux symmetries of Byers & Yang (1961), the exact lattice degeneracies, states and determinism.
import { describe, expect, it } from 'vitest';
import { canonicalJson, resultHash } from '@/lib/physics/canonical';
import { parseTaskSpec } from '@/lib/physics/schemas';
import type { SpectrumSpec } from '@/lib/physics/schemas/spectrum';
import { runSpectrum } from '@/lib/physics/tasks/spectrum';

const J01_SQ = 2.404825557695773 ** 2; // DLMF 10.21, j_{0,1}
const J11_SQ = 3.831705970207512 ** 2; // DLMF 10.21, j_{1,1}
const HALF_1_SQ = Math.PI ** 2; // j_{1/2,1} = pi (DLMF 10.16.1)
const HALF_2_SQ = 4.493409457909064 ** 2; // first zero of J_{3/2}: tan x = x (DLMF 10.16.1)

function spec(h: number, tubes: { at: [number, number]; alpha: number }[], levels = 4, extra: object = {}): SpectrumSpec {
  return parseTaskSpec({ task: 'spectrum', well: { disk: { center: [0, 0], radius: 1 } }, grid: { h }, tubes, levels, ...extra }) as SpectrumSpec;
}

const rel = (a: number, b: number) => Math.abs(a - b) / b;

describe('unit disk without a tube (DLMF 10.21)', () => {
  it('levels approach j01^2 and j11^2 (twice) with O(h) staircase error', async () => {
    const coarse = await runSpectrum(spec(1 / 20, []));
    const fine = await runSpectrum(spec(1 / 40, []));
    const expected = [J01_SQ, J11_SQ, J11_SQ];
    for (let i = 0; i < 3; i++) {
      expect(rel(fine.levels[i], expected[i])).toBeLessThan(0.03);
      // Error halves (roughly) when h halves: first order.
      expect(rel(coarse.levels[i], expected[i]) / rel(fine.levels[i], expected[i])).toBeGreaterThan(1.5);
    }
    // m = +-1 stay exactly degenerate on the square lattice (PHYSICS.md section 2).
    expect(fine.degenerate).toContainEqual([1, 2]);
    expect(rel(fine.levels[2], fine.levels[1])).toBeLessThan(1e-10);
  });
});

describe('unit disk with a centred half tube (DLMF 10.16.1)', () => {
  it('levels approach pi^2 (twice) and 4.493409457909064^2 (twice), each exactly doubly degenerate', async () => {
    const coarse = await runSpectrum(spec(1 / 20, [{ at: [0, 0], alpha: 0.5 }]));
    const fine = await runSpectrum(spec(1 / 40, [{ at: [0, 0], alpha: 0.5 }]));
    const expected = [HALF_1_SQ, HALF_1_SQ, HALF_2_SQ, HALF_2_SQ];
    for (let i = 0; i < 4; i++) {
      expect(rel(fine.levels[i], expected[i])).toBeLessThan(0.04);
      expect(rel(coarse.levels[i], expected[i]) / rel(fine.levels[i], expected[i])).toBeGreaterThan(1.5);
    }
    // Antiunitary symmetry squaring to -1 at the centre of an inversion-symmetric well: exact pairs.
    expect(rel(fine.levels[1], fine.levels[0])).toBeLessThan(1e-10);
    expect(rel(fine.levels[3], fine.levels[2])).toBeLessThan(1e-10);
    expect(fine.degenerate).toEqual([
      [0, 1],
      [2, 3],
    ]);
    expect(fine.tubes).toEqual([{ at: [0, 0], alpha: 0.5, requested: [0, 0] }]);
  });
});

describe('flux symmetries through the task (Byers & Yang 1961)', () => {
  const h = 1 / 16;
  const at: [number, number] = [0.23, -0.31];
  it('alpha and alpha + 1 are identical; E(alpha) = E(1 - alpha)', async () => {
    const a = await runSpectrum(spec(h, [{ at, alpha: 0.3 }]));
    const b = await runSpectrum(spec(h, [{ at, alpha: 1.3 }]));
    const c = await runSpectrum(spec(h, [{ at, alpha: 0.7 }]));
    for (let i = 0; i < 4; i++) {
      expect(b.levels[i]).toBeCloseTo(a.levels[i], 8);
      expect(c.levels[i]).toBeCloseTo(a.levels[i], 8);
    }
  });

  it('two half tubes at one point equal no tube', async () => {
    const none = await runSpectrum(spec(h, []));
    const two = await runSpectrum(spec(h, [{ at, alpha: 0.5 }, { at, alpha: 0.5 }]));
    for (let i = 0; i < 4; i++) expect(two.levels[i]).toBeCloseTo(none.levels[i], 9);
  });
});

describe('states and determinism', () => {
  it('real problems give real, sign-fixed states; densities sum to 1', async () => {
    const r = await runSpectrum(spec(1 / 12, [{ at: [0.2, 0.1], alpha: 0.5 }], 3, { states: true }));
    const states = r.states!;
    expect(states.real).toEqual(states.re);
    expect(states.im).toBeNull();
    expect(states.phase).toBeNull();
    expect(states.re).toHaveLength(3);
    expect(states.re[0]).toHaveLength(r.grid.nx * r.grid.ny);
    expect(states.density).toHaveLength(3);
    for (const d of states.density) expect(d.reduce((s, v) => s + v, 0)).toBeCloseTo(1, 10);
    // Outside the well every value is 0 (box site 0 is in the margin).
    expect(states.re[0][0]).toBe(0);
    // Largest-modulus component positive.
    const v = states.re[0];
    const big = v.reduce((m, x) => Math.max(m, Math.abs(x)), 0);
    expect(v.find((x) => Math.abs(x) >= big * (1 - 1e-8))).toBeGreaterThan(0);
  });

  it('complex problems give phases in (-pi, pi]', async () => {
    const r = await runSpectrum(spec(1 / 12, [{ at: [0.2, 0.1], alpha: 0.3 }], 2, { states: true }));
    const states = r.states!;
    expect(states.real).toBeUndefined();
    expect(states.im).not.toBeNull();
    for (const p of states.phase![0]) expect(p > -Math.PI && p <= Math.PI).toBe(true);
  });

  it('two runs give identical canonical JSON and hash (diagnostics aside)', async () => {
    const s = spec(1 / 24, [{ at: [0.1, 0.2], alpha: 0.25 }], 4, { states: true });
    const a = await runSpectrum(s);
    const b = await runSpectrum(s);
    const strip = ({ diagnostics: _d, ...rest }: typeof a) => rest;
    expect(canonicalJson(strip(a))).toBe(canonicalJson(strip(b)));
    expect(resultHash(a)).toBe(resultHash(b));
  });

  it('asking for more levels than sites is an input error', async () => {
    await expect(runSpectrum(spec(0.9, [], 10))).rejects.toThrow(/holds only 4 grid sites/);
  });
});
