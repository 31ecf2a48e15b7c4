// Levels versus the position of a moving tube (PHYSICS.md section 5). Checks use symmetries of the disk: a mirror x -> -x
// followed by time reversal maps a tube of flux alpha at (x, 0) to one at (-x, 0), so E(x) = E(-x) for every alpha
// (Byers & Yang 1961 for alpha -> -alpha); the force F = -grad E0 is then odd in x and vanishes at the centre.
import { describe, expect, it } from 'vitest';
import { parseTaskSpec } from '@/lib/physics/schemas';
import type { PositionSweepSpec } from '@/lib/physics/schemas/position-sweep';
import { type PathSweepResult, type RegionSweepResult, runPositionSweep, walkPolyline } from '@/lib/physics/tasks/position-sweep';

const disk = { disk: { center: [0, 0], radius: 1 } };
const h = 1 / 12;

function spec(extra: Record<string, unknown>): PositionSweepSpec {
  return parseTaskSpec({ task: 'position-sweep', well: disk, grid: { h }, levels: 3, ...extra }) as PositionSweepSpec;
}

describe('position sweep along a path', () => {
  it('walks polylines through adjacent plaquette centres', () => {
    const walk = walkPolyline([[0, 0], [0.3, 0.2], [0.3, -0.1]], false, { h: 0.1, offset: [0, 0] });
    for (let i = 1; i < walk.length; i++) {
      expect(Math.abs(walk[i][0] - walk[i - 1][0]) + Math.abs(walk[i][1] - walk[i - 1][1])).toBe(1);
    }
    expect(walk[0]).toEqual([-1, -1]);
    expect(walk[walk.length - 1]).toEqual([2, -2]);
    const closed = walkPolyline([[0, 0], [0.2, 0], [0.2, 0.2]], true, { h: 0.1, offset: [0, 0] });
    expect(closed.length).toBe(8); // 2 right, 2 up, then 4 staircase steps back (start not repeated)
  });

  it('gives E(x) = E(-x) along a diameter at alpha = 0.3 and alpha = 0.5', async () => {
    for (const alpha of [0.3, 0.5]) {
      const r = (await runPositionSweep(spec({ moving: { alpha }, path: { points: [[-0.5, 0], [0.5, 0]] } }))) as PathSweepResult;
      expect(r.mode).toBe('path');
      const n = r.positions.length;
      expect(n).toBe(13);
      expect(r.positions[6][0]).toBeCloseTo(0, 12);
      for (let l = 0; l < 3; l++) {
        for (let s = 0; s < n; s++) expect(Math.abs(r.sorted[l][s] - r.sorted[l][n - 1 - s]) / r.sorted[l][s]).toBeLessThan(1e-8);
      }
      if (alpha === 0.5) expect(Math.abs(r.sorted[1][6] - r.sorted[0][6]) / r.sorted[0][6]).toBeLessThan(1e-8);
      // Each track sits on one level at every step: a reported one, or one above the reported window.
      expect(r.tracked.length).toBeGreaterThan(0);
      for (let s = 0; s < n; s++) {
        for (const row of r.tracked) {
          const hit = r.sorted.some((level) => Math.abs(level[s] - row[s]) < 1e-9 * row[s]) || row[s] >= r.sorted[2][s];
          expect(hit).toBe(true);
        }
      }
    }
  });
});

describe('position sweep over a region', () => {
  it('gives a mirror-symmetric landscape, an odd force in x, and agrees with the path sweep', async () => {
    const r = (await runPositionSweep(spec({ moving: { alpha: 0.3 }, region: { min: [-0.25, -0.1], max: [0.25, 0.1] } }))) as RegionSweepResult;
    expect(r.mode).toBe('region');
    const na = r.xs.length;
    const nb = r.ys.length;
    expect(na).toBe(7);
    expect(nb).toBe(3);
    const e0 = r.levels[0];
    for (let q = 0; q < nb; q++) {
      for (let p = 0; p < na; p++) {
        const i = p + na * q;
        const j = na - 1 - p + na * q;
        expect(Math.abs(e0[i] - e0[j]) / e0[i]).toBeLessThan(1e-8);
        expect(r.force.fx[i] + r.force.fx[j]).toBeCloseTo(0, 6);
      }
    }
    const centre = 3 + na * 1;
    expect(r.xs[3]).toBeCloseTo(0, 12);
    expect(r.ys[1]).toBeCloseTo(0, 12);
    expect(Math.abs(r.force.fx[centre])).toBeLessThan(1e-6);
    // Central difference by hand at an interior point.
    const i = 4 + na * 1;
    expect(r.force.fx[i]).toBeCloseTo(-(e0[i + 1] - e0[i - 1]) / (2 * h), 10);
    expect(r.force.fy[i]).toBeCloseTo(-(e0[i + na] - e0[i - na]) / (2 * h), 10);
    // Same levels as the path sweep at the same positions.
    const path = (await runPositionSweep(spec({ moving: { alpha: 0.3 }, path: { points: [[-0.25, 0], [0.25, 0]] } }))) as PathSweepResult;
    for (let p = 0; p < na; p++) expect(path.sorted[0][p]).toBeCloseTo(e0[p + na * 1], 8);
  });
});
