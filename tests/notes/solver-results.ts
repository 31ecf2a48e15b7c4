// Small real solver results for the chart and export tests, one per figure kind, on coarse grids so the suite stays quick.
// Computed through lib/physics runTask exactly as the worker does.
import { runTask } from '@/lib/physics/run-task';
import { parseTaskSpec, type TaskSpec } from '@/lib/physics/schemas';

const disk = { disk: { center: [0, 0], radius: 1 } };

/** One small spec per figure kind (unit disk, coarse grids). */
export const SMALL_SPECS: Record<string, unknown> = {
  spectrum: { task: 'spectrum', well: disk, grid: { h: 0.125 }, tubes: [{ at: [0, 0], alpha: 0.5 }], levels: 4, states: true },
  'flux-sweep': { task: 'flux-sweep', well: disk, grid: { h: 0.2 }, tubes: [{ at: [0, 0], alpha: 0 }], sweep: { tube: 0, from: 0, to: 1, steps: 9 }, levels: 4 },
  'position-sweep': { task: 'position-sweep', well: disk, grid: { h: 0.2 }, moving: { alpha: 0.5 }, path: { points: [[-0.6, 0], [0.6, 0]] }, levels: 2 },
  'position-sweep-region': { task: 'position-sweep', well: disk, grid: { h: 0.2 }, moving: { alpha: 0.5 }, region: { min: [-0.5, -0.5], max: [0.5, 0.5] }, levels: 2 },
  holonomy: { task: 'holonomy', well: disk, grid: { h: 0.2 }, moving: { alpha: 0.3 }, loop: { circle: { center: [0, 0], radius: 1.3 } } },
  degeneracy: { task: 'degeneracy', well: disk, grid: { h: 0.25 }, moving: { alpha: 0.5 } },
  'nodal-lines': { task: 'nodal-lines', well: disk, grid: { h: 0.1 }, tubes: [{ at: [0.3, 0.2], alpha: 0.5 }] },
  convergence: { task: 'convergence', of: { well: disk, grid: { h: 0.25 }, levels: 2 }, refinements: 3 },
};

/** Compute the result of one of SMALL_SPECS with the real solver (lib/physics runTask). */
export async function smallResult(name: keyof typeof SMALL_SPECS): Promise<{ spec: TaskSpec; result: unknown }> {
  const spec = parseTaskSpec(SMALL_SPECS[name]);
  return { spec, result: await runTask(spec, {}) };
}
