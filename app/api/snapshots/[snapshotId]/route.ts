// GET /api/snapshots/[snapshotId]: one frozen snapshot with its manuscript, who froze it and its result data
// (readers); the comparison page fetches two of these and draws them together.
import { getResultById } from '@/db/queries/results';
import { getSnapshotContext } from '@/db/queries/snapshots';
import { notFound } from '@/lib/domain-error';
import { route } from '@/lib/http/handler';
import { authorizeSnapshot } from '@/lib/runs/resource-access';
import { snapshotParamsSchema } from '@/lib/validations/figure';

export const runtime = 'nodejs';
export const dynamic = 'force-dynamic';

export const GET = route({ params: snapshotParamsSchema }, async ({ params, user }) => {
  const { snapshot } = await authorizeSnapshot({ user, snapshotId: params.snapshotId, need: 'read' });
  const [context, result] = await Promise.all([
    getSnapshotContext({ id: snapshot.id }),
    getResultById({ id: snapshot.resultId }),
  ]);
  if (!context || !result) throw notFound('Snapshot not found');
  return {
    snapshot,
    manuscript: context.manuscript,
    figureTitle: context.figureTitle,
    frozenBy: context.frozenBy,
    result: { data: result.data, diagnostics: result.diagnostics },
  };
});
