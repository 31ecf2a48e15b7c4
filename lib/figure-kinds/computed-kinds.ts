// The figure kinds computed by the solver, one per task of the physics task table: label, starting parameters, chart
// views and default chart of each. Typed over every task name, so a new task without its kind does not compile.
import { convergenceSpec } from '@/lib/charts/convergence';
import { densitySpec } from '@/lib/charts/density';
import { gapMapSpec } from '@/lib/charts/gap-map';
import { holonomySpec } from '@/lib/charts/holonomy';
import { nodalLinesSpec } from '@/lib/charts/nodal-lines';
import { positionSweepSpec } from '@/lib/charts/position-sweep';
import { spectralFlowSpec } from '@/lib/charts/spectral-flow';
import { spectrumSpec } from '@/lib/charts/spectrum';
import type { TaskName, TaskSpecInputOf, TaskSpecOf } from '@/lib/physics/task-table';
import type { FigureKindEntry } from './kind-entry';

/** A computed kind's own parts; its task and parameter schema come from the task table. */
export type ComputedKindParts<T extends TaskName> = Omit<FigureKindEntry<TaskSpecOf<T>, TaskSpecInputOf<T>>, 'task' | 'paramsSchema'>;

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

/**
 * Label, defaults, views and chart of each computed kind. Defaults are small grids that run in seconds, a unit disk or
 * a lopsided polygon, half tubes where the physics needs a real problem.
 */
export const COMPUTED_KINDS: { [T in TaskName]: ComputedKindParts<T> } = {
  spectrum: {
    label: 'Spectrum (levels of one configuration)',
    defaultParams: () => ({ task: 'spectrum', well: unitDisk, grid: { h: 0.05 }, tubes: [{ at: [0, 0], alpha: 0.5 }], levels: 6 }),
    views: ['levels', 'density'],
    chartSpec: (result, options) => (options.view === 'density' ? densitySpec(result, options) : spectrumSpec(result, options)),
    problemAt: '',
  },
  'flux-sweep': {
    label: 'Spectral flow (levels versus flux α)',
    defaultParams: () => ({
      task: 'flux-sweep',
      well: unitDisk,
      grid: { h: 0.05 },
      tubes: [{ at: [0.3, 0.1], alpha: 0 }],
      sweep: { tube: 0, from: 0, to: 1, steps: 21 },
      levels: 6,
    }),
    views: ['spectral-flow'],
    chartSpec: (result, options) => spectralFlowSpec(result, options),
    problemAt: '',
  },
  'position-sweep': {
    label: 'Levels versus tube position (path or landscape)',
    defaultParams: () => ({
      task: 'position-sweep',
      well: unitDisk,
      grid: { h: 0.05 },
      tubes: [],
      moving: { alpha: 0.5 },
      path: { points: [[-0.8, 0], [0.8, 0]] },
      levels: 4,
    }),
    views: ['levels', 'landscape'],
    chartSpec: (result, options) => positionSweepSpec(result, options),
    problemAt: '',
  },
  holonomy: {
    label: 'Loop phase (tube carried around a loop)',
    defaultParams: () => ({
      task: 'holonomy',
      well: unitDisk,
      grid: { h: 0.05 },
      tubes: [],
      moving: { alpha: 0.5 },
      loop: { circle: { center: [0, 0], radius: 0.5 } },
      level: 0,
    }),
    views: ['loop'],
    chartSpec: (result, options) => holonomySpec(result, options),
    problemAt: '',
  },
  degeneracy: {
    label: 'Degeneracy points (gap map)',
    defaultParams: () => ({ task: 'degeneracy', well: lopsided, grid: { h: 0.1 }, tubes: [], moving: { alpha: 0.5 } }),
    views: ['gap-map'],
    chartSpec: (result, options) => gapMapSpec(result, options),
    problemAt: '',
  },
  'nodal-lines': {
    label: 'Nodal lines of a real state',
    defaultParams: () => ({ task: 'nodal-lines', well: unitDisk, grid: { h: 0.05 }, tubes: [{ at: [0.3, 0.2], alpha: 0.5 }], level: 1 }),
    views: ['sign'],
    chartSpec: (result, options) => nodalLinesSpec(result, options),
    problemAt: '',
  },
  convergence: {
    label: 'Grid convergence (h, h/2, h/4)',
    defaultParams: () => ({ task: 'convergence', of: { well: unitDisk, grid: { h: 0.1 }, tubes: [], levels: 3 }, refinements: 3 }),
    views: ['levels'],
    chartSpec: (result, options) => convergenceSpec(result, options),
    problemAt: 'of.',
  },
};
