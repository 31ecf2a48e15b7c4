// Download links of a snapshot: the reproducibility bundle (JSON) and its CSV, and the chart as SVG, PNG or PDF at
// one-column (8.6 cm) and two-column (17.8 cm) width, in the display units currently chosen on the page.
'use client';

import { CHART_FORMATS, exportQueryString, FIGURE_WIDTHS, figureWidthLabel } from '@/lib/export/export-query';
import { useDisplayUnits } from '../../_components/figures/display-units';

const LINK = 'rounded-md px-2 py-1 text-sm text-flux-700 ring-1 ring-inset ring-flux-200 hover:bg-flux-50';

export function SnapshotDownloads({ snapshotId }: { snapshotId: string }) {
  const { units } = useDisplayUnits();
  const exportHref = (format: (typeof CHART_FORMATS)[number], width: (typeof FIGURE_WIDTHS)[number]) =>
    `/api/snapshots/${snapshotId}/export?${exportQueryString({ format, width, units })}`;
  return (
    <div className="space-y-3 text-sm" data-testid="snapshot-downloads">
      <div className="flex flex-wrap items-center gap-2">
        <span className="w-28 text-slate-600">Reproduce</span>
        <a className={LINK} href={`/api/snapshots/${snapshotId}/bundle`} download>
          Bundle (JSON)
        </a>
        <a className={LINK} href={`/api/snapshots/${snapshotId}/bundle?format=csv`} download>
          Data (CSV)
        </a>
      </div>
      {FIGURE_WIDTHS.map((width) => (
        <div key={width} className="flex flex-wrap items-center gap-2">
          <span className="w-28 text-slate-600">{figureWidthLabel(width)}</span>
          {CHART_FORMATS.map((format) => (
            <a key={format} className={LINK} href={exportHref(format, width)} download data-testid={`export-${format}-${width}`}>
              {format.toUpperCase()}
            </a>
          ))}
        </div>
      ))}
      <p className="text-xs text-slate-500">
        <code className="font-mono">npm run -s reproduce -- bundle.json</code> recomputes the result and checks its SHA-256.
      </p>
    </div>
  );
}
