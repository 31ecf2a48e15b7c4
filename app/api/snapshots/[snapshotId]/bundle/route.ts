// GET /api/snapshots/[snapshotId]/bundle: the snapshot's reproducibility bundle as a JSON download
// (`npm run -s reproduce -- <file>` verifies it), or with ?format=csv its data as CSV.
import { getResultById } from '@/db/queries/results';
import { getSnapshotContext } from '@/db/queries/snapshots';
import { notFound } from '@/lib/domain-error';
import { route } from '@/lib/http/handler';
import { authorizeSnapshot } from '@/lib/runs/resource-access';
import { bundleFileName, snapshotBundle, snapshotBundleCsv } from '@/lib/snapshots/bundle';
import { bundleQuerySchema, snapshotParamsSchema } from '@/lib/validations/figure';

export const runtime = 'nodejs';
export const dynamic = 'force-dynamic';

export const GET = route({ params: snapshotParamsSchema, query: bundleQuerySchema }, async ({ params, query, user }) => {
  const { snapshot } = await authorizeSnapshot({ user, snapshotId: params.snapshotId, need: 'read' });
  const [context, result] = await Promise.all([
    getSnapshotContext({ id: snapshot.id }),
    getResultById({ id: snapshot.resultId }),
  ]);
  if (!context || !result) throw notFound('Snapshot not found');
  const bundle = snapshotBundle(snapshot, result, context);
  const name = bundleFileName(snapshot, snapshot.version, query.format);
  const headers = {
    'content-disposition': `attachment; filename="${name}"`,
    'cache-control': 'private, max-age=31536000, immutable',
  };
  if (query.format === 'csv') {
    return new Response(snapshotBundleCsv(bundle), { headers: { ...headers, 'content-type': 'text/csv; charset=utf-8' } });
  }
  return new Response(`${JSON.stringify(bundle, null, 2)}\n`, {
    headers: { ...headers, 'content-type': 'application/json; charset=utf-8' },
  });
});
