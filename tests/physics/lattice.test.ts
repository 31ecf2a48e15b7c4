// Tests of the lattice: anchoring of sites and plaquette centres, box margin, unknown numbering, tube snapping
// (round half up per axis, PHYSICS.md section 2) and potential sampling.
import { describe, expect, it } from 'vitest';
import { buildLattice, plaquetteCentre, roundHalfUp, siteXY, snapTube } from '@/lib/physics/lattice';
import { compilePotential } from '@/lib/physics/potential';
import { compileWell } from '@/lib/physics/wells';

const square = compileWell({ rectangle: { min: [0, 0], max: [1, 1] } });

describe('buildLattice', () => {
  it('default anchoring: sites at ((i + 1/2) h, (j + 1/2) h), one wall row of margin', () => {
    const lat = buildLattice({ well: square, h: 0.25 });
    expect(lat.n).toBe(16);
    expect(lat.nx).toBe(6);
    expect(lat.ny).toBe(6);
    // Box site (0, 0) is the margin site left of and below x = 0.125.
    const [x0, y0] = siteXY(lat, 0);
    expect(x0).toBeCloseTo(-0.125, 15);
    expect(y0).toBeCloseTo(-0.125, 15);
    for (let i = 0; i < lat.nx; i++) expect(lat.unknownOf[i]).toBe(-1);
    // Unknowns are numbered in box order, x fastest.
    expect(siteXY(lat, lat.siteOf[0])).toEqual([0.125, 0.125]);
    expect(siteXY(lat, lat.siteOf[1])).toEqual([0.375, 0.125]);
    expect(siteXY(lat, lat.siteOf[4])).toEqual([0.125, 0.375]);
  });

  it('offset in units of h moves sites onto the walls (which then hold no unknowns)', () => {
    const lat = buildLattice({ well: square, h: 0.25, offset: [-0.5, -0.5] });
    // Sites at 0, 0.25, ..., 1: only 0.25, 0.5, 0.75 are strictly inside.
    expect(lat.n).toBe(9);
    expect(siteXY(lat, lat.siteOf[0])).toEqual([0.25, 0.25]);
  });

  it('cover boxes enlarge the box', () => {
    const lat = buildLattice({ well: square, h: 0.25, cover: [{ min: [-1, 0], max: [0, 0.5] }] });
    expect(lat.n).toBe(16);
    expect(siteXY(lat, 0)[0]).toBeCloseTo(-1.125, 12);
  });

  it('samples the potential at every unknown', () => {
    const lat = buildLattice({ well: square, h: 0.25, potential: compilePotential('x + 10 * y') });
    expect(lat.potential?.[0]).toBeCloseTo(0.125 + 1.25, 14);
    expect(lat.potential?.[5]).toBeCloseTo(0.375 + 3.75, 14);
  });
});

describe('snapTube', () => {
  const grid = { h: 0.1, offset: [0, 0] as [number, number] };
  it('(0, 0) is a plaquette centre with the default anchoring', () => {
    const t = snapTube(grid, [0, 0], 0.5);
    expect(t.at).toEqual([0, 0]);
    expect(t.plaquette).toEqual([-1, -1]);
    expect(t.requested).toEqual([0, 0]);
    expect(plaquetteCentre(grid, -1, -1)).toEqual([0, 0]);
  });

  it('rounds half up per axis and reports both positions', () => {
    expect(snapTube(grid, [0.05, -0.05], 0.5).at).toEqual([0.1, 0]);
    expect(snapTube(grid, [-0.05, 0.15], 0.5).at[0]).toBe(0);
    expect(snapTube(grid, [-0.05, 0.15], 0.5).at[1]).toBeCloseTo(0.2, 15);
    expect(snapTube(grid, [0.049, 0.151], 0.5).at[0]).toBe(0);
    expect(snapTube(grid, [0.049, 0.151], 0.5).requested).toEqual([0.049, 0.151]);
    expect(roundHalfUp(-0.5)).toBe(0);
    expect(roundHalfUp(2.5)).toBe(3);
    expect(roundHalfUp(2.4999999999999996)).toBe(3);
  });

  it('follows the grid offset', () => {
    const shifted = { h: 0.1, offset: [0.5, 0] as [number, number] };
    const t = snapTube(shifted, [0, 0], 0.25);
    // Centres at (a + 1.5) h: the tie between -0.05 and 0.05 goes up.
    expect(t.at[0]).toBeCloseTo(0.05, 15);
    expect(t.at[1]).toBe(0);
  });
});
