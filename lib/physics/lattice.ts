// The square lattice over a well: box of sites, unknown numbering, site coordinates, tube snapping (PHYSICS.md section 2).
// Sites sit at ((I + 1/2 + fx) h, (J + 1/2 + fy) h); plaquette centres at ((a + 1 + fx) h, (b + 1 + fy) h).
import { SpecError } from './errors';
import type { Lattice, SnappedTube, Vec2 } from './types';
import type { Well } from './wells/well';

/** Slack (in units of h) that makes exact ties and box edges immune to rounding of x / h. */
const INDEX_SLACK = 1e-9;

export interface GridFrame {
  h: number;
  offset: Vec2;
}

export interface BuildLatticeOptions {
  well: Well;
  /** Grid spacing (units of L), > 0. */
  h: number;
  /** Site offset (fx, fy) in units of h. Default [0, 0]: plaquette centres on integer multiples of h. */
  offset?: Vec2;
  /** Extra boxes the lattice box must cover (e.g. positions of tubes that move outside the well). */
  cover?: { min: Vec2; max: Vec2 }[];
  /** Potential V(x, y) in energy units hbar^2/(2 m L^2), evaluated at every unknown. */
  potential?: (x: number, y: number) => number;
}

/**
 * Rounds half up: the nearest integer, ties going to the larger one, with a tiny slack so that a tie computed
 * as 2.4999999999999996 still goes up.
 * @example
 * roundHalfUp(-0.5); // 0
 */
export function roundHalfUp(t: number): number {
  return Math.floor(t + 0.5 + INDEX_SLACK);
}

/**
 * Builds the lattice: the box of sites covering the well's bounding box and every cover box, plus one wall row of
 * margin on every side; a site is an unknown when `well.contains` is true at its point.
 *
 * Unknowns are numbered in box order (x fastest), so unknown index = rank of box index `i + nx * j`.
 *
 * @returns the Lattice (see lib/physics/types.ts for the index conventions)
 * @throws SpecError when the potential is not finite at some unknown
 * @example
 * const lat = buildLattice({ well: compileWell({ rectangle: { min: [0, 0], max: [1, 1] } }), h: 0.25 });
 * lat.n; // 16 (sites at 0.125, 0.375, 0.625, 0.875 on each axis)
 */
export function buildLattice(options: BuildLatticeOptions): Lattice {
  const { well, h } = options;
  const offset: Vec2 = options.offset ? [options.offset[0], options.offset[1]] : [0, 0];
  const [fx, fy] = offset;
  const min: Vec2 = [well.bbox.min[0], well.bbox.min[1]];
  const max: Vec2 = [well.bbox.max[0], well.bbox.max[1]];
  for (const box of options.cover ?? []) {
    min[0] = Math.min(min[0], box.min[0]);
    min[1] = Math.min(min[1], box.min[1]);
    max[0] = Math.max(max[0], box.max[0]);
    max[1] = Math.max(max[1], box.max[1]);
  }
  const i0 = Math.ceil(min[0] / h - 0.5 - fx - INDEX_SLACK) - 1;
  const j0 = Math.ceil(min[1] / h - 0.5 - fy - INDEX_SLACK) - 1;
  const i1 = Math.floor(max[0] / h - 0.5 - fx + INDEX_SLACK) + 1;
  const j1 = Math.floor(max[1] / h - 0.5 - fy + INDEX_SLACK) + 1;
  const nx = i1 - i0 + 1;
  const ny = j1 - j0 + 1;
  const unknownOf = new Int32Array(nx * ny).fill(-1);
  let n = 0;
  for (let j = 0; j < ny; j++) {
    const y = (j + j0 + 0.5 + fy) * h;
    for (let i = 0; i < nx; i++) {
      const x = (i + i0 + 0.5 + fx) * h;
      if (well.contains(x, y)) unknownOf[i + nx * j] = n++;
    }
  }
  const siteOf = new Int32Array(n);
  for (let b = 0; b < nx * ny; b++) if (unknownOf[b] >= 0) siteOf[unknownOf[b]] = b;
  const lattice: Lattice = { h, offset, i0, j0, nx, ny, unknownOf, siteOf, n, potential: null };
  if (options.potential) {
    const v = new Float64Array(n);
    for (let u = 0; u < n; u++) {
      const [x, y] = siteXY(lattice, siteOf[u]);
      const value = options.potential(x, y);
      if (!Number.isFinite(value)) {
        throw new SpecError(`the potential is not a finite real number at (${x}, ${y})`, 'potential');
      }
      v[u] = value;
    }
    lattice.potential = v;
  }
  return lattice;
}

/**
 * Coordinates (units of L) of a box site.
 * @param boxIndex - `i + nx * j` with (i, j) local to the box
 * @example
 * siteXY(lattice, 0); // position of box site (0, 0) = ((i0 + 1/2 + fx) h, (j0 + 1/2 + fy) h)
 */
export function siteXY(lattice: Lattice, boxIndex: number): Vec2 {
  const i = boxIndex % lattice.nx;
  const j = (boxIndex - i) / lattice.nx;
  return [(i + lattice.i0 + 0.5 + lattice.offset[0]) * lattice.h, (j + lattice.j0 + 0.5 + lattice.offset[1]) * lattice.h];
}

/**
 * Centre of plaquette (a, b) (global indices; lower-left site (a, b)).
 * @example
 * plaquetteCentre({ h: 0.1, offset: [0, 0] }, -1, -1); // [0, 0]
 */
export function plaquetteCentre(grid: GridFrame, a: number, b: number): Vec2 {
  return [(a + 1 + grid.offset[0]) * grid.h, (b + 1 + grid.offset[1]) * grid.h];
}

/**
 * Snaps a requested tube position to the nearest plaquette centre, ties going to the larger coordinate (per axis).
 * @param grid - spacing and offset (a Lattice will do)
 * @param at - requested position (units of L)
 * @param alpha - flux in units of h/e (echoed)
 * @example
 * snapTube({ h: 0.1, offset: [0, 0] }, [0.05, 0], 0.5).at; // [0.1, 0] (tie goes up)
 */
export function snapTube(grid: GridFrame, at: Vec2, alpha: number): SnappedTube {
  const a = roundHalfUp(at[0] / grid.h - 1 - grid.offset[0]);
  const b = roundHalfUp(at[1] / grid.h - 1 - grid.offset[1]);
  return { at: plaquetteCentre(grid, a, b), alpha, plaquette: [a, b], requested: [at[0], at[1]] };
}

/** The plaquette (global indices) whose centre is nearest to a point, by the same rule as snapTube. */
export function nearestPlaquette(grid: GridFrame, at: Vec2): [number, number] {
  return [roundHalfUp(at[0] / grid.h - 1 - grid.offset[0]), roundHalfUp(at[1] / grid.h - 1 - grid.offset[1])];
}
