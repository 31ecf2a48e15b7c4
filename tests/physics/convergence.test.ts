// Refinement study h, h/2, h/4 (PHYSICS.md section 2): staircase walls converge like h (observed order noisy, 0.6-0.8 is
// acceptable), a rectangle whose walls lie on sites like h^2 (closed-form lattice levels, LaplacianNd formula); the
// Richardson value (Richardson 1911) is closer to the exact level than the finest grid: j01^2 (DLMF section 10.21) and
// 2 pi^2 for the unit square (E = pi^2 (n^2/a^2 + m^2/b^2)).
import { describe, expect, it } from 'vitest';
import { parseTaskSpec } from '@/lib/physics/schemas';
import type { ConvergenceSpec } from '@/lib/physics/schemas/convergence';
import { observedOrder, richardson, runConvergence } from '@/lib/physics/tasks/convergence';

const J01 = 2.404825557695773; // DLMF section 10.21

describe('convergence study', () => {
  it('computes Richardson values and observed orders', () => {
    expect(richardson(10.4, 10.2, 1)).toBeCloseTo(10, 12);
    expect(observedOrder(10.4, 10.1, 10.025)).toBeCloseTo(2, 12);
    expect(observedOrder(10, 10.1, 10.05)).toBeNull();
  });

  it('unit disk: observed order near 1, Richardson closer to j01^2 than the finest grid', async () => {
    const spec = parseTaskSpec({
      task: 'convergence',
      of: { well: { disk: { center: [0, 0], radius: 1 } }, grid: { h: 1 / 10 }, levels: 1 },
    }) as ConvergenceSpec;
    const r = await runConvergence(spec);
    expect(r.grids.map((g) => g.h)).toEqual([1 / 10, 1 / 20, 1 / 40]);
    expect(r.order).toEqual({ value: 1, source: 'staircase walls or flux tubes' });
    const exact = J01 * J01;
    const finest = r.grids[2].levels[0];
    expect(Math.abs(r.extrapolated[0] - exact)).toBeLessThan(Math.abs(finest - exact));
    const p = r.observedOrder[0];
    // Staircase walls: order 1 in theory, noisy from three grids (PHYSICS.md section 2).
    expect(p).not.toBeNull();
    expect(p!).toBeGreaterThan(0.3);
    expect(p!).toBeLessThan(2.5);
    expect(r.tubesMoved).toBe(false);
  });

  it('square with walls on sites: observed order ~2 and Richardson near 2 pi^2', async () => {
    const spec = parseTaskSpec({
      task: 'convergence',
      of: { well: { rectangle: { min: [0, 0], max: [1, 1] } }, grid: { h: 1 / 8, offset: [-0.5, -0.5] }, levels: 1 },
    }) as ConvergenceSpec;
    const r = await runConvergence(spec);
    expect(r.order.source).toBe('rectangle with walls on sites');
    expect(r.order.value).toBe(2);
    // Lattice levels equal the closed form (8/h^2) sin^2(pi h / 2) with Nx + 1 = 1/h (PHYSICS.md section 2).
    expect(r.grids).toHaveLength(3);
    for (const g of r.grids) expect(g.levels[0]).toBeCloseTo((8 / g.h ** 2) * Math.sin((Math.PI * g.h) / 2) ** 2, 8);
    expect(r.observedOrder[0]!).toBeGreaterThan(1.9);
    expect(r.observedOrder[0]!).toBeLessThan(2.1);
    const exact = 2 * Math.PI ** 2;
    expect(Math.abs(r.extrapolated[0] - exact)).toBeLessThan(Math.abs(r.grids[2].levels[0] - exact) / 10);
  });

  it('keeps tube positions identical on every grid', async () => {
    const spec = parseTaskSpec({
      task: 'convergence',
      of: { well: { disk: { center: [0, 0], radius: 1 } }, grid: { h: 1 / 8 }, tubes: [{ at: [0.26, -0.1], alpha: 0.5 }], levels: 2 },
      refinements: 2,
    }) as ConvergenceSpec;
    const r = await runConvergence(spec);
    expect(r.grids).toHaveLength(2);
    expect(r.tubesMoved).toBe(false);
    expect(r.grids[1].tubes[0]).toEqual(r.grids[0].tubes[0]);
    expect(r.observedOrder).toEqual([null, null]);
  });

  it('skips h/4, with the reason from the budget, when it exceeds the unknown limit', async () => {
    const saved = process.env.FLUXFOLIO_MAX_UNKNOWNS;
    process.env.FLUXFOLIO_MAX_UNKNOWNS = '2000';
    try {
      const spec = parseTaskSpec({
        task: 'convergence',
        of: { well: { disk: { center: [0, 0], radius: 1 } }, grid: { h: 1 / 10 }, levels: 1 },
      }) as ConvergenceSpec;
      const r = await runConvergence(spec);
      expect(r.grids).toHaveLength(2);
      expect(r.skipped).toHaveLength(1);
      expect(r.skipped[0].h).toBeCloseTo(1 / 40, 15);
      expect(r.skipped[0].reason).toMatch(/limit is 2,000/);
      expect(r.extrapolated).toHaveLength(1);
    } finally {
      if (saved === undefined) delete process.env.FLUXFOLIO_MAX_UNKNOWNS;
      else process.env.FLUXFOLIO_MAX_UNKNOWNS = saved;
    }
  });
});
