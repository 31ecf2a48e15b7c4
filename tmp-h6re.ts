import fs from 'node:fs';
import { chartSpecFor } from './lib/charts/index';
import { renderPng } from './lib/export/render-png';
const names = process.argv.slice(2);
for (const name of names) {
  const { spec, result } = JSON.parse(fs.readFileSync(`/tmp/h6charts/${name}.json`, 'utf8'));
  const t = Date.now();
  const chart = chartSpecFor(spec.task ?? 'spectrum', result, { units: { system: 'dimensionless' }, params: spec, view: process.env.VIEW });
  const { png } = await renderPng(chart, { width: { px: 900 } });
  fs.writeFileSync(`/tmp/h6charts/${name}.png`, png);
  console.log(name, Date.now() - t, 'ms');
}
