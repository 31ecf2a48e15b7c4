// Spectral flow of one tube (PHYSICS.md section 5): periodicity in alpha and E(alpha) = E(1 - alpha) (Byers & Yang 1961),
// and tracked levels that cross where the sorted ones touch (half tube at the centre of the disk: exact double
// degeneracy, PHYSICS.md section 2; levels j_{|m - alpha|,n}^2, DLMF section 10.21).
import { describe, expect, it } from 'vitest';
import { parseTaskSpec } from '@/lib/physics/schemas';
import type { FluxSweepSpec } from '@/lib/physics/schemas/flux-sweep';
import { runFluxSweep } from '@/lib/physics/tasks/flux-sweep';

function spec(tubeAt: [number, number], steps: number): FluxSweepSpec {
  return parseTaskSpec({
    task: 'flux-sweep',
    well: { disk: { center: [0, 0], radius: 1 } },
    grid: { h: 1 / 12 },
    tubes: [{ at: tubeAt, alpha: 0 }],
    sweep: { tube: 0, from: 0, to: 1, steps },
    levels: 4,
  }) as FluxSweepSpec;
}

describe('flux sweep (Byers & Yang 1961)', () => {
  it('is periodic and symmetric under alpha -> 1 - alpha for an off-centre tube', async () => {
    const r = await runFluxSweep(spec([0.3, -0.2], 11));
    const last = r.alphas.length - 1;
    expect(r.alphas[0]).toBe(0);
    expect(r.alphas[last]).toBe(1);
    for (let l = 0; l < 4; l++) {
      const scale = Math.max(1, r.sorted[l][0]);
      expect(Math.abs(r.sorted[l][0] - r.sorted[l][last]) / scale).toBeLessThan(1e-8);
      for (let s = 0; s <= last; s++) expect(Math.abs(r.sorted[l][s] - r.sorted[l][last - s]) / scale).toBeLessThan(1e-8);
    }
  });

  it('tracks levels through the crossing at alpha = 1/2 of a centred tube', async () => {
    const r = await runFluxSweep(spec([0, 0], 21));
    const last = r.alphas.length - 1;
    const mid = 10;
    expect(r.alphas[mid]).toBeCloseTo(0.5, 15);
    // Sorted levels touch at alpha = 1/2 (exact double degeneracy of the half tube at the centre).
    expect(Math.abs(r.sorted[1][mid] - r.sorted[0][mid]) / r.sorted[0][mid]).toBeLessThan(1e-8);
    // The ground track (m = 0) rises all the way; at alpha = 1 it is no longer the ground level.
    for (let s = 1; s <= last; s++) expect(r.tracked[0][s]).toBeGreaterThan(r.tracked[0][s - 1]);
    expect(r.tracked[0][last]).toBeGreaterThan(r.sorted[0][last] + 1);
    // One of the m = +-1 tracks falls to become the ground level at alpha = 1, crossing track 0 at alpha = 1/2.
    const falling = [1, 2].find((t) => Math.abs(r.tracked[t][last] - r.sorted[0][last]) < 1e-8 * r.sorted[0][last]);
    expect(falling).toBeDefined();
    const f = falling!;
    for (let s = 0; s < mid; s++) expect(r.tracked[0][s]).toBeLessThan(r.tracked[f][s]);
    for (let s = mid + 1; s <= last; s++) expect(r.tracked[0][s]).toBeGreaterThan(r.tracked[f][s]);
    // Sorted level 0 has a kink there instead (a fake avoided crossing if read as one curve).
    expect(r.sorted[0][mid + 1]).toBeLessThan(r.sorted[0][mid]);
    // At the exact degeneracy (alpha = 1/2) the solver's basis of the doubly degenerate pair is arbitrary, so the
    // best |overlap|^2 of a neighbouring state with one basis vector can fall to about 1/2 (and no lower).
    expect(r.diagnostics.trackOverlap[0]).toBeGreaterThan(0.45);
  });
});
