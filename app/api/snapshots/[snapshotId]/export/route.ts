// GET /api/snapshots/[snapshotId]/export?format=svg|png|pdf|csv&width=one-column|two-column&units=…: the snapshot's chart for
// the manuscript (vector SVG and PDF with fonts embedded, PNG at 300 dpi) at a journal width, or its data as CSV.
import { getResultById } from '@/db/queries/results';
import { notFound } from '@/lib/domain-error';
import { exportFigure } from '@/lib/export/export-figure';
import { exportQuerySchema } from '@/lib/export/export-query';
import { DEFAULT_ASPECT } from '@/lib/export/widths';
import { route } from '@/lib/http/handler';
import { authorizeSnapshot } from '@/lib/runs/resource-access';
import { snapshotParamsSchema } from '@/lib/validations/figure';

export const runtime = 'nodejs';
export const dynamic = 'force-dynamic';

export const GET = route({ params: snapshotParamsSchema, query: exportQuerySchema }, async ({ params, query, user }) => {
  const { snapshot } = await authorizeSnapshot({ user, snapshotId: params.snapshotId, need: 'read' });
  const result = await getResultById({ id: snapshot.resultId });
  if (!result) throw notFound('Snapshot not found');
  const file = await exportFigure({
    kind: snapshot.kind,
    result: result.data,
    params: snapshot.params,
    viewSpec: snapshot.viewSpec,
    label: snapshot.label,
    version: snapshot.version,
    format: query.format,
    width: query.width,
    units: query.units,
    // Downloads are laid out in the journal's 4:3 frame at the printed size (CSS px at 96 per inch).
    aspect: DEFAULT_ASPECT,
    title: `${snapshot.label} v${snapshot.version}`,
    createdAt: snapshot.frozenAt,
  });
  const body = typeof file.body === 'string' ? file.body : new Uint8Array(file.body);
  return new Response(body, {
    headers: {
      'content-type': file.contentType,
      'content-disposition': `attachment; filename="${file.fileName}"`,
      'cache-control': 'private, max-age=3600',
    },
  });
});
