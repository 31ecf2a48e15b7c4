import fs from 'node:fs';
import { parseTaskSpec } from './lib/physics/spec/index';
import { runFluxSweep } from './lib/physics/tasks/flux-sweep';
import { runPositionSweep } from './lib/physics/tasks/position-sweep';
import { runHolonomy } from './lib/physics/tasks/holonomy';
import { runDegeneracy } from './lib/physics/tasks/degeneracy';
import { runNodalLines } from './lib/physics/tasks/nodal-lines';
import { runConvergence } from './lib/physics/tasks/convergence';
import { chartSpecFor } from './lib/charts/index';
import { renderPng } from './lib/export/render-png';
const disk = { disk: { center: [0, 0], radius: 1 } };
const poly = { polygon: { points: [[-1, -0.8], [1.1, -0.9], [0.9, 0.7], [-0.2, 1.0], [-1.0, 0.5]] } };
const jobs: [string, any, (s: any) => Promise<any>][] = [
  ['flux-sweep', { task: 'flux-sweep', well: disk, grid: { h: 1 / 12 }, tubes: [{ at: [0, 0], alpha: 0 }], sweep: { tube: 0, from: 0, to: 1, steps: 21 }, levels: 5 }, runFluxSweep],
  ['position-sweep', { task: 'position-sweep', well: disk, grid: { h: 1 / 10 }, moving: { alpha: 0.5 }, path: { points: [[-0.8, 0], [0.8, 0]] }, levels: 3 }, runPositionSweep],
  ['position-sweep-region', { task: 'position-sweep', well: disk, grid: { h: 1 / 10 }, moving: { alpha: 0.5 }, region: { min: [-0.7, -0.7], max: [0.7, 0.7] }, levels: 2 }, runPositionSweep],
  ['holonomy', { task: 'holonomy', well: disk, grid: { h: 1 / 12 }, moving: { alpha: 0.3 }, loop: { circle: { center: [0, 0], radius: 1.3 } } }, runHolonomy],
  ['holonomy-half', { task: 'holonomy', well: disk, grid: { h: 1 / 12 }, moving: { alpha: 0.5 }, loop: { circle: { center: [0.2, 0.1], radius: 0.4 } } }, runHolonomy],
  ['degeneracy', { task: 'degeneracy', well: poly, grid: { h: 1 / 10 }, moving: { alpha: 0.5 } }, runDegeneracy],
  ['nodal-lines', { task: 'nodal-lines', well: disk, grid: { h: 1 / 24 }, tubes: [{ at: [0.3, 0.2], alpha: 0.5 }, { at: [-0.4, -0.1], alpha: 0.5 }], level: 1 }, runNodalLines],
  ['convergence', { task: 'convergence', of: { well: disk, grid: { h: 1 / 8 }, levels: 3 }, refinements: 3 }, runConvergence],
];
fs.mkdirSync('/tmp/h6charts', { recursive: true });
for (const [name, raw, run] of jobs) {
  const spec = parseTaskSpec(raw);
  const t = Date.now();
  const result = await run(spec);
  fs.writeFileSync(`/tmp/h6charts/${name}.json`, JSON.stringify({ spec, result }));
  const chart = chartSpecFor(spec.task, result, { units: { system: 'dimensionless' }, params: spec });
  const { png } = await renderPng(chart, { width: { px: 900 } });
  fs.writeFileSync(`/tmp/h6charts/${name}.png`, png);
  console.log(name, Date.now() - t, 'ms');
}
