// Sensible starting parameters for a new figure of each kind: small grids that run in seconds, a unit disk or a
// lopsided polygon, half tubes where the physics needs a real problem. Every value is a valid solver spec.
import type { FigureKind } from '@/lib/validations/figure';
import type { TaskSpecInput } from '@/lib/physics/schemas';

const unitDisk = { disk: { center: [0, 0] as [number, number], radius: 1 } };
/** A quadrilateral with no symmetry (so degeneracy points are not forced onto a mirror line). */
const lopsided = {
  polygon: {
    points: [
      [-1, -0.8],
      [1.1, -0.6],
      [0.7, 0.9],
      [-0.9, 0.7],
    ] as [number, number][],
  },
};

/** Human names of the figure kinds, for menus and headings. */
export const KIND_LABELS: Record<FigureKind, string> = {
  spectrum: 'Spectrum (levels of one configuration)',
  'flux-sweep': 'Spectral flow (levels versus flux α)',
  'position-sweep': 'Levels versus tube position (path or landscape)',
  holonomy: 'Loop phase (tube carried around a loop)',
  degeneracy: 'Degeneracy points (gap map)',
  'nodal-lines': 'Nodal lines of a real state',
  convergence: 'Grid convergence (h, h/2, h/4)',
};

/**
 * Starting parameters for a new figure of `kind`.
 *
 * @example
 * defaultParams('holonomy').loop // { circle: { center: [0, 0], radius: 0.5 } }
 */
export function defaultParams(kind: FigureKind): TaskSpecInput {
  switch (kind) {
    case 'spectrum':
      return { task: 'spectrum', well: unitDisk, grid: { h: 0.05 }, tubes: [{ at: [0, 0], alpha: 0.5 }], levels: 6 };
    case 'flux-sweep':
      return {
        task: 'flux-sweep',
        well: unitDisk,
        grid: { h: 0.05 },
        tubes: [{ at: [0.3, 0.1], alpha: 0 }],
        sweep: { tube: 0, from: 0, to: 1, steps: 21 },
        levels: 6,
      };
    case 'position-sweep':
      return {
        task: 'position-sweep',
        well: unitDisk,
        grid: { h: 0.05 },
        tubes: [],
        moving: { alpha: 0.5 },
        path: { points: [[-0.8, 0], [0.8, 0]] },
        levels: 4,
      };
    case 'holonomy':
      return {
        task: 'holonomy',
        well: unitDisk,
        grid: { h: 0.05 },
        tubes: [],
        moving: { alpha: 0.5 },
        loop: { circle: { center: [0, 0], radius: 0.5 } },
        level: 0,
      };
    case 'degeneracy':
      return { task: 'degeneracy', well: lopsided, grid: { h: 0.1 }, tubes: [], moving: { alpha: 0.5 } };
    case 'nodal-lines':
      return { task: 'nodal-lines', well: unitDisk, grid: { h: 0.05 }, tubes: [{ at: [0.3, 0.2], alpha: 0.5 }], level: 1 };
    case 'convergence':
      return { task: 'convergence', of: { well: unitDisk, grid: { h: 0.1 }, tubes: [], levels: 3 }, refinements: 3 };
  }
}
