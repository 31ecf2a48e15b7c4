// Small real solver results for the chart and export tests, one per figure kind, on coarse grids so the suite stays quick.
// Uses lib/physics runTask when it is present; otherwise the task runners, and for 'spectrum' the lattice + eigensolver.
import { lowestEigenpairs } from '@/lib/physics/eigen';
import { prepareProblem } from '@/lib/physics/problem';
import { parseTaskSpec, type TaskSpec } from '@/lib/physics/spec';
import { runConvergence } from '@/lib/physics/tasks/convergence';
import { runDegeneracy } from '@/lib/physics/tasks/degeneracy';
import { runFluxSweep } from '@/lib/physics/tasks/flux-sweep';
import { runHolonomy } from '@/lib/physics/tasks/holonomy';
import { runNodalLines } from '@/lib/physics/tasks/nodal-lines';
import { runPositionSweep } from '@/lib/physics/tasks/position-sweep';

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

type RunTask = (spec: TaskSpec, ctx?: object) => Promise<unknown>;

async function findRunTask(): Promise<RunTask | null> {
  try {
    const path = '@/lib/physics/run-task';
    const mod = (await import(/* @vite-ignore */ path)) as { runTask?: RunTask };
    return mod.runTask ?? null;
  } catch {
    return null;
  }
}

/** The spectrum result shape (lib/physics/tasks/spectrum.ts) built from the same lattice and eigensolver. */
function spectrumByHand(spec: Extract<TaskSpec, { task: 'spectrum' }>) {
  const problem = prepareProblem(spec);
  const { lattice } = problem;
  const eig = lowestEigenpairs(problem.matrix(), spec.levels, { seed: 1 });
  const density: number[][] = [];
  for (let k = 0; k < spec.levels; k++) {
    const field = new Array(lattice.nx * lattice.ny).fill(0);
    for (let u = 0; u < lattice.n; u++) {
      const re = eig.vectors.re[k * lattice.n + u];
      const im = eig.vectors.im ? eig.vectors.im[k * lattice.n + u] : 0;
      field[lattice.siteOf[u]] = (re * re + im * im) / (lattice.h * lattice.h);
    }
    density.push(field);
  }
  return {
    task: 'spectrum',
    levels: Array.from(eig.values),
    tubes: problem.tubes.map((t) => ({ at: t.at, alpha: t.alpha, requested: t.requested })),
    unknowns: lattice.n,
    grid: { h: lattice.h, offset: lattice.offset, nx: lattice.nx, ny: lattice.ny, origin: [(lattice.i0 + 0.5 + lattice.offset[0]) * lattice.h, (lattice.j0 + 0.5 + lattice.offset[1]) * lattice.h] },
    states: { density },
    diagnostics: { iterations: eig.iterations, method: eig.method },
  };
}

/** Compute the result of one of SMALL_SPECS with the real solver. */
export async function smallResult(name: keyof typeof SMALL_SPECS): Promise<{ spec: TaskSpec; result: unknown }> {
  const spec = parseTaskSpec(SMALL_SPECS[name]);
  const runTask = await findRunTask();
  if (runTask) return { spec, result: await runTask(spec, {}) };
  switch (spec.task) {
    case 'spectrum':
      return { spec, result: spectrumByHand(spec) };
    case 'flux-sweep':
      return { spec, result: await runFluxSweep(spec) };
    case 'position-sweep':
      return { spec, result: await runPositionSweep(spec) };
    case 'holonomy':
      return { spec, result: await runHolonomy(spec) };
    case 'degeneracy':
      return { spec, result: await runDegeneracy(spec) };
    case 'nodal-lines':
      return { spec, result: await runNodalLines(spec) };
    case 'convergence':
      return { spec, result: await runConvergence(spec) };
  }
}
