// GET /api/figures/[figureId]/snapshots: the figure's frozen snapshots, v1 first (readers).
// Each snapshot is immutable; its download bundle lives under /api/snapshots/[snapshotId]/bundle.
import { listSnapshotsByFigure } from '@/db/queries/snapshots';
import { route } from '@/lib/http/handler';
import { authorizeFigure } from '@/lib/runs/resource-access';
import { figureParamsSchema } from '@/lib/validations/figure';

export const runtime = 'nodejs';
export const dynamic = 'force-dynamic';

export const GET = route({ params: figureParamsSchema }, async ({ params, user }) => {
  const { figure } = await authorizeFigure({ user, figureId: params.figureId, need: 'read' });
  return { snapshots: await listSnapshotsByFigure({ figureId: figure.id }) };
});
