import fs from 'node:fs';
import { runTask } from './lib/physics/run-task';
import { parseTaskSpec } from './lib/physics/spec';
import { chartSpecFor } from './lib/charts';
import { renderPng } from './lib/export/render-png';
const spec = parseTaskSpec({ task: 'spectrum', well: { disk: { center: [0, 0], radius: 1 } }, grid: { h: 1 / 20 }, tubes: [{ at: [0.3, 0.1], alpha: 0.5 }], levels: 6, states: true });
const result = await runTask(spec, {});
for (const view of ['levels', 'density']) {
  const chart = chartSpecFor('spectrum', result, { units: { system: 'physical', lengthNm: 50, effectiveMass: 0.067 }, params: spec, view, level: 1 });
  fs.writeFileSync(`/tmp/h6charts/spectrum-${view}.png`, (await renderPng(chart, { width: { px: 800 } })).png);
}
const spec2 = parseTaskSpec({ task: 'spectrum', well: { disk: { center: [0, 0], radius: 1 } }, grid: { h: 1 / 20 }, tubes: [{ at: [0, 0], alpha: 0.5 }], levels: 6 });
const r2 = await runTask(spec2, {});
fs.writeFileSync(`/tmp/h6charts/spectrum-exact.png`, (await renderPng(chartSpecFor('spectrum', r2, { units: { system: 'dimensionless' }, params: spec2 }), { width: { px: 800 } })).png);
