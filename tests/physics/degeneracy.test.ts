// Forced degeneracies of a moving half tube (PHYSICS.md section 4): the unit disk has exactly one point, at its centre
// (PHYSICS.md section 1; Longuet-Higgins 1975 for the sign argument), parity odd and loop product -1; a non-symmetric
// polygon well has an odd count with its points where the gap is smallest; complex problems are refused.
import { describe, expect, it } from 'vitest';
import { SpecError } from '@/lib/physics/errors';
import { fitGapSquaredVertex, resolveLoops } from '@/lib/physics/degeneracy-refine';
import { parseTaskSpec } from '@/lib/physics/schemas';
import type { DegeneracySpec } from '@/lib/physics/schemas/degeneracy';
import { runDegeneracy } from '@/lib/physics/tasks/degeneracy';

/** An invented non-symmetric pentagon inside the unit box (test geometry, not a check value). */
const pentagon = { polygon: { points: [[0, 0], [1, 0.12], [1.05, 0.75], [0.45, 1.05], [-0.08, 0.62]] } };

function spec(extra: Record<string, unknown>): DegeneracySpec {
  return parseTaskSpec({ task: 'degeneracy', moving: { alpha: 0.5 }, ...extra }) as DegeneracySpec;
}

describe('degeneracy of the unit disk (Longuet-Higgins 1975; PHYSICS.md section 1)', () => {
  it('finds exactly one point, at the centre, parity odd, loop product -1', async () => {
    const r = await runDegeneracy(spec({ well: { disk: { center: [0, 0], radius: 1 } }, grid: { h: 1 / 10 } }));
    expect(r.count).toBe(1);
    expect(r.parity).toBe('odd');
    expect(r.loopProduct).toBe(-1);
    expect(r.regionSign).toBe(-1);
    expect(r.parityConsistent).toBe(true);
    // Default anchoring puts a plaquette centre on the disk centre: the scan lands on the (exact) degeneracy.
    expect(r.points[0].at[0]).toBeCloseTo(0, 12);
    expect(r.points[0].at[1]).toBeCloseTo(0, 12);
    expect(r.points[0].method).toBe('landing');
    expect(r.points[0].gap).toBeLessThan(1e-6);
    expect(r.gapMap.gap.length).toBe(r.gapMap.xs.length * r.gapMap.ys.length);
    expect(r.diagnostics.unconverged).toBe(0);
  });

  it('scans the plaquette centres inside a given region; the parity follows the loop around it', async () => {
    const around = await runDegeneracy(spec({ well: { disk: { center: [0, 0], radius: 1 } }, grid: { h: 1 / 10 }, region: { min: [-0.35, -0.35], max: [0.35, 0.35] } }));
    expect(around.region.min[0]).toBeCloseTo(-0.3, 12);
    expect(around.region.max[1]).toBeCloseTo(0.3, 12);
    expect(around.gapMap.xs).toHaveLength(7);
    expect(around.count).toBe(1);
    expect(around.regionSign).toBe(-1);
    expect(around.parityConsistent).toBe(true);
    const beside = await runDegeneracy(spec({ well: { disk: { center: [0, 0], radius: 1 } }, grid: { h: 1 / 10 }, region: { min: [0.2, 0.1], max: [0.6, 0.5] } }));
    expect(beside.count).toBe(0);
    expect(beside.parity).toBe('even');
    expect(beside.loopProduct).toBe(1);
    expect(beside.regionSign).toBe(1);
    expect(beside.parityConsistent).toBe(true);
  });

  it('refines an off-grid point with the gap^2 fit when the disk centre is not a plaquette centre', async () => {
    const r = await runDegeneracy(spec({ well: { disk: { center: [0.03, -0.02], radius: 1 } }, grid: { h: 1 / 10 } }));
    expect(r.count).toBe(1);
    expect(r.parityConsistent).toBe(true);
    const p = r.points[0];
    // The symmetry point of the disk is its centre; the fit must land within a fraction of h of it.
    expect(Math.hypot(p.at[0] - 0.03, p.at[1] + 0.02)).toBeLessThan(0.02);
    expect(['fit', 'scan']).toContain(p.method);
  });
});

describe('degeneracy on mirror lines (PHYSICS.md section 3 pitfall: opposite parities overlap exactly 0)', () => {
  it('merges across the undefined edges and places the pair-[1, 2] points on the mirror line, count even', async () => {
    // For pair [1, 2] the loop sign is that of det over levels 0..1: (-1)(-1) = +1 around the whole well, so the count is even.
    const r = await runDegeneracy(spec({ well: { rectangle: { min: [-1, -0.7], max: [1, 0.7] } }, grid: { h: 1 / 10 }, pair: [1, 2] }));
    expect(r.parity).toBe('even');
    expect(r.loopProduct).toBe(1);
    expect(r.parityConsistent).toBe(true);
    expect(r.count).toBe(2);
    for (const p of r.points) {
      expect(p.method).toBe('edge');
      expect(Math.abs(p.at[1])).toBeLessThan(1e-12);
    }
    // Mirror x -> -x maps one point onto the other.
    expect(r.points[0].at[0]).toBeCloseTo(-r.points[1].at[0], 8);
    expect(r.blocks.length).toBeGreaterThan(0);
    expect(r.blocks.every((b) => b.reasons.includes('overlap'))).toBe(true);
  });
});

describe('degeneracy of a non-symmetric polygon well', () => {
  it('has an odd count, consistent parity, and its points where the gap is smallest', async () => {
    const r = await runDegeneracy(spec({ well: pentagon, grid: { h: 1 / 12 } }));
    expect(r.count % 2).toBe(1);
    expect(r.parity).toBe('odd');
    expect(r.loopProduct).toBe(-1);
    expect(r.parityConsistent).toBe(true);
    const { xs, ys, gap } = r.gapMap;
    const h = 1 / 12;
    expect(r.points.length).toBeGreaterThan(0);
    for (const p of r.points) {
      // The scanned position next to the point has the smallest gap of its 5 x 5 neighbourhood.
      const pi = xs.findIndex((x) => Math.abs(x - p.scanned[0]) < 1e-9);
      const qi = ys.findIndex((y) => Math.abs(y - p.scanned[1]) < 1e-9);
      const here = gap[pi + xs.length * qi];
      for (let dq = -2; dq <= 2; dq++) {
        for (let dp = -2; dp <= 2; dp++) {
          const q = qi + dq;
          const pp = pi + dp;
          if (q < 0 || pp < 0 || q >= ys.length || pp >= xs.length) continue;
          expect(here).toBeLessThanOrEqual(gap[pp + xs.length * q] + 1e-9);
        }
      }
      expect(Math.hypot(p.at[0] - p.scanned[0], p.at[1] - p.scanned[1])).toBeLessThan(1.5 * h);
      expect(p.gap).toBeLessThanOrEqual(here + 1e-9);
    }
    // The smallest gap of the whole map sits next to a point.
    let best = 0;
    for (let i = 1; i < gap.length; i++) if (gap[i] < gap[best]) best = i;
    const bx = xs[best % xs.length];
    const by = ys[Math.floor(best / xs.length)];
    expect(Math.min(...r.points.map((p) => Math.hypot(p.at[0] - bx, p.at[1] - by)))).toBeLessThan(1.5 * h);
  });

  it('refuses a moving or fixed tube whose flux is neither integer nor half-integer', async () => {
    expect(() => spec({ well: pentagon, grid: { h: 1 / 12 }, moving: { alpha: 0.3 } })).toThrow(SpecError);
    expect(() => spec({ well: pentagon, grid: { h: 1 / 12 }, tubes: [{ at: [0.5, 0.5], alpha: 0.25 }] })).toThrow(/integer or half-integer/);
    const raw = { ...spec({ well: pentagon, grid: { h: 1 / 12 } }), moving: { alpha: 0.3 } } as DegeneracySpec;
    await expect(runDegeneracy(raw)).rejects.toThrow(/needs a real problem/);
  });
});

describe('degeneracy bookkeeping', () => {
  it('fits gap^2 of a cone and returns its vertex (Herzberg & Longuet-Higgins 1963)', () => {
    const samples = [];
    for (let i = -2; i <= 1; i++) for (let j = -2; j <= 1; j++) {
      const x = i * 0.1;
      const y = j * 0.1;
      samples.push({ at: [x, y] as [number, number], gap: Math.sqrt(4 * (x - 0.013) ** 2 + (y + 0.021) ** 2 + (x - 0.013) * (y + 0.021)) });
    }
    const fit = fitGapSquaredVertex(samples, { min: [-0.1, -0.1], max: [0.1, 0.1] });
    expect(fit.ok).toBe(true);
    expect(fit.at[0]).toBeCloseTo(0.013, 10);
    expect(fit.at[1]).toBeCloseTo(-0.021, 10);
  });

  it('merges the four loops around an exact landing and the two sites beside an undefined overlap', () => {
    const na = 4;
    const nb = 4;
    const ones = (n: number) => new Float64Array(n).fill(1);
    const gap = ones(na * nb);
    gap[1 + na * 1] = 0; // landing at position (1, 1)
    const hRe = ones((na - 1) * nb);
    const vRe = ones(na * nb);
    hRe[2 + (na - 1) * 2] = 0; // undefined edge (2, 2) -> (3, 2)
    const blocks = resolveLoops({ na, nb, gap, hRe, hIm: new Float64Array(hRe.length), vRe, vIm: new Float64Array(vRe.length) }, { landingGap: 1e-6 });
    const merged = blocks.filter((b) => b.sites.length > 1);
    expect(merged.map((b) => b.reasons)).toEqual([['landing'], ['overlap']]);
    expect(merged[0].sites).toHaveLength(4);
    expect(merged[1].sites).toEqual([
      [3, 2],
      [3, 3],
    ]);
    expect(blocks.every((b) => b.sign === 1)).toBe(true);
  });
});
