// Loop rasterisation (PHYSICS.md section 3): sites strictly inside, boundary of the union of squares walked
// counter-clockwise through adjacent plaquette centres, refusal of empty, disconnected and holed sets.
import { describe, expect, it } from 'vitest';
import { SpecError } from '@/lib/physics/errors';
import { boundaryOfSites, rasteriseLoop, signedArea2, siteSetProblem, sitesInsideLoop } from '@/lib/physics/loop-path';
import { thrownBy } from '../helpers/thrown';

const grid = { h: 0.1, offset: [0, 0] as [number, number] };

describe('loop rasterisation', () => {
  it('walks the boundary of one site counter-clockwise through its four corners', () => {
    expect(boundaryOfSites([[0, 0]])).toEqual([
      [-1, -1],
      [0, -1],
      [0, 0],
      [-1, 0],
    ]);
  });

  it('rasterises a circle: the 12 sites within 0.2 of the origin, 16 unit steps, counter-clockwise', () => {
    const path = rasteriseLoop({ circle: { center: [0, 0], radius: 0.2 } }, grid);
    expect(path.sites).toHaveLength(12);
    expect(path.plaquettes).toHaveLength(16);
    expect(path.orientation).toBe('ccw');
    for (let k = 0; k < path.plaquettes.length; k++) {
      const [a, b] = path.plaquettes[k];
      const [a2, b2] = path.plaquettes[(k + 1) % path.plaquettes.length];
      expect(Math.abs(a2 - a) + Math.abs(b2 - b)).toBe(1);
    }
    expect(signedArea2(path.points)).toBeGreaterThan(0);
    // Enclosed area equals the number of sites times h^2.
    expect(signedArea2(path.points) / 2).toBeCloseTo(12 * 0.01, 12);
  });

  it('reverses the walk for clockwise loops and follows a polygon vertex order', () => {
    const cw = rasteriseLoop({ circle: { center: [0, 0], radius: 0.2 } }, grid, 'cw');
    expect(cw.orientation).toBe('cw');
    expect(signedArea2(cw.points)).toBeLessThan(0);
    const poly = rasteriseLoop({ polygon: [[0, 0], [0, 0.5], [0.5, 0.5], [0.5, 0]] }, grid);
    expect(poly.orientation).toBe('cw');
    expect(poly.sites).toHaveLength(25);
  });

  it('counts sites on the curve (within 1e-9) as outside', () => {
    // Sites at x = 0.05 + 0.1 i: the square [0.05, 0.25] has sites 0.15 strictly inside only on each axis.
    const sites = sitesInsideLoop({ polygon: [[0.05, 0.05], [0.25, 0.05], [0.25, 0.25], [0.05, 0.25]] }, grid);
    expect(sites).toEqual([[1, 1]]);
  });

  it('refuses empty, disconnected and holed site sets with a SpecError on "loop"', () => {
    expect(() => rasteriseLoop({ circle: { center: [0, 0], radius: 0.05 } }, grid)).toThrow(SpecError);
    const error = thrownBy(() => rasteriseLoop({ circle: { center: [0, 0], radius: 0.05 } }, grid)) as SpecError;
    expect(error.issues[0].path).toBe('loop');
    expect(error.message).toMatch(/encloses no grid site/);
    expect(siteSetProblem([[0, 0], [1, 1]])).toMatch(/not connected/);
    const ring: [number, number][] = [];
    for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) if (i !== 1 || j !== 1) ring.push([i, j]);
    expect(siteSetProblem(ring)).toMatch(/hole/);
    // A thin diagonal polygon gives diagonally touching sites only.
    expect(() => rasteriseLoop({ polygon: [[0, 0], [0.02, 0], [0.42, 0.4], [0.4, 0.4]] }, grid)).toThrow(/not connected|encloses no grid site/);
  });
});
