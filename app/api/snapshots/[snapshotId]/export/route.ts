// GET /api/snapshots/[snapshotId]/export?format=svg|png|pdf|csv&width=one|two&units=…: the snapshot's chart for the
// manuscript (vector SVG and PDF with fonts embedded, PNG at 300 dpi) at a journal width, or its data as CSV.
import { getResultById } from '@/db/queries/results';
import { getSnapshotById } from '@/db/queries/snapshots';
import { chartSpecFor } from '@/lib/charts';
import { snapshotFileName } from '@/lib/cite/citation';
import { resultCsv } from '@/lib/export/csv';
import { renderPdf } from '@/lib/export/render-pdf';
import { renderPng } from '@/lib/export/render-png';
import { renderSvg } from '@/lib/export/render-svg';
import { cmToCssPx, DEFAULT_ASPECT, FIGURE_WIDTH_CM, type FigureWidth } from '@/lib/export/widths';
import { notFound } from '@/lib/domain-error';
import { zodErrorResponse } from '@/lib/http/errors';
import { route } from '@/lib/http/handler';
import { authorizeSnapshot } from '@/lib/runs/resource-access';
import { displayUnitsQuerySchema } from '@/lib/units';
import { snapshotParamsSchema } from '@/lib/validations/figure';
import { exportQuerySchema } from './schema';

export const runtime = 'nodejs';
export const dynamic = 'force-dynamic';

const CONTENT_TYPES = {
  svg: 'image/svg+xml; charset=utf-8',
  png: 'image/png',
  pdf: 'application/pdf',
  csv: 'text/csv; charset=utf-8',
} as const;

export const GET = route({ params: snapshotParamsSchema, query: exportQuerySchema }, async ({ params, query, user }) => {
  const units = displayUnitsQuerySchema.safeParse({ units: query.units, L: query.L, mass: query.mass });
  if (!units.success) return zodErrorResponse(units.error, 'The query string is not valid');
  await authorizeSnapshot({ user, snapshotId: params.snapshotId, need: 'read' });
  const snapshot = await getSnapshotById({ id: params.snapshotId });
  const result = snapshot ? await getResultById({ id: snapshot.resultId }) : null;
  if (!snapshot || !result) throw notFound('Snapshot not found');

  const width: FigureWidth = query.width === 'two' ? 'two-column' : 'one-column';
  const headers = {
    'content-type': CONTENT_TYPES[query.format],
    'content-disposition': `attachment; filename="${snapshotFileName(snapshot.label, snapshot.version, query.format)}"`,
    'cache-control': 'private, max-age=3600',
  };
  if (query.format === 'csv') return new Response(resultCsv(result.data), { headers });

  // Lay the chart out at the printed size (CSS px at 96 per inch), so that its 10-11 pt text prints at that size.
  const cssWidth = Math.round(cmToCssPx(FIGURE_WIDTH_CM[width]));
  const spec = chartSpecFor(snapshot.kind as Parameters<typeof chartSpecFor>[0], result.data as Parameters<typeof chartSpecFor>[1], {
    viewSpec: (snapshot.viewSpec as Record<string, unknown> | null) ?? undefined,
    units: units.data,
    params: snapshot.params,
    width: cssWidth,
    height: Math.round(cssWidth * DEFAULT_ASPECT),
    fit: true,
  });
  if (query.format === 'svg') {
    const { svg } = await renderSvg(spec, { width });
    return new Response(svg, { headers });
  }
  if (query.format === 'png') {
    const { png } = await renderPng(spec, { width });
    return new Response(new Uint8Array(png), { headers });
  }
  const { pdf } = await renderPdf(spec, { width, title: `${snapshot.label} v${snapshot.version}`, createdAt: snapshot.frozenAt });
  return new Response(new Uint8Array(pdf), { headers });
});
