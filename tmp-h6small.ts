import { parseTaskSpec } from './lib/physics/spec/index';
import { runFluxSweep } from './lib/physics/tasks/flux-sweep';
import { runPositionSweep } from './lib/physics/tasks/position-sweep';
import { runHolonomy } from './lib/physics/tasks/holonomy';
import { runDegeneracy } from './lib/physics/tasks/degeneracy';
import { runNodalLines } from './lib/physics/tasks/nodal-lines';
import { runConvergence } from './lib/physics/tasks/convergence';
const disk = { disk: { center: [0, 0], radius: 1 } };
const jobs: [string, any, (s: any) => Promise<any>][] = [
  ['flux-sweep', { task: 'flux-sweep', well: disk, grid: { h: 0.2 }, tubes: [{ at: [0, 0], alpha: 0 }], sweep: { tube: 0, from: 0, to: 1, steps: 9 }, levels: 4 }, runFluxSweep],
  ['position-sweep path', { task: 'position-sweep', well: disk, grid: { h: 0.2 }, moving: { alpha: 0.5 }, path: { points: [[-0.6, 0], [0.6, 0]] }, levels: 2 }, runPositionSweep],
  ['position-sweep region', { task: 'position-sweep', well: disk, grid: { h: 0.2 }, moving: { alpha: 0.5 }, region: { min: [-0.5, -0.5], max: [0.5, 0.5] }, levels: 2 }, runPositionSweep],
  ['holonomy', { task: 'holonomy', well: disk, grid: { h: 0.2 }, moving: { alpha: 0.3 }, loop: { circle: { center: [0, 0], radius: 1.3 } } }, runHolonomy],
  ['degeneracy', { task: 'degeneracy', well: disk, grid: { h: 0.25 }, moving: { alpha: 0.5 } }, runDegeneracy],
  ['nodal-lines', { task: 'nodal-lines', well: disk, grid: { h: 0.1 }, tubes: [{ at: [0.3, 0.2], alpha: 0.5 }] }, runNodalLines],
  ['convergence', { task: 'convergence', of: { well: disk, grid: { h: 0.25 }, levels: 2 }, refinements: 3 }, runConvergence],
];
for (const [name, raw, run] of jobs) {
  const t = Date.now();
  await run(parseTaskSpec(raw));
  console.log(name, Date.now() - t, 'ms');
}
