// GET /api/figures/[figureId]: a figure with its snapshots and newest run. PATCH: edit label, title, caption,
// parameters or view spec (authors). DELETE: remove it with its runs, refused (409) once it has a snapshot.
import { deleteFigureById, updateFigure } from '@/db/queries/figures';
import { getLatestRun } from '@/db/queries/runs';
import { listSnapshotsByFigure } from '@/db/queries/snapshots';
import { notFound } from '@/lib/domain-error';
import { route } from '@/lib/http/handler';
import { authorizeFigure } from '@/lib/runs/resource-access';
import { figureParamsSchema, updateFigureSchema } from '@/lib/validations/figure';
import type { FigureBody, UpdateFigureBody } from '@/lib/api-types';

export const runtime = 'nodejs';
export const dynamic = 'force-dynamic';

export const GET = route({ params: figureParamsSchema }, async ({ params, user }) => {
  const { figure, access } = await authorizeFigure({ user, figureId: params.figureId, need: 'read' });
  const [snapshots, latestRun] = await Promise.all([
    listSnapshotsByFigure({ figureId: figure.id }),
    getLatestRun({ figureId: figure.id }),
  ]);
  return { figure, snapshots, latestRun, role: access.role } satisfies FigureBody;
});

export const PATCH = route({ params: figureParamsSchema, body: updateFigureSchema }, async ({ params, body, user }) => {
  const { figure } = await authorizeFigure({ user, figureId: params.figureId, need: 'edit' });
  const updated = await updateFigure({ id: figure.id, patch: body });
  if (!updated) throw notFound('Figure not found');
  return { figure: updated } satisfies UpdateFigureBody;
});

export const DELETE = route({ params: figureParamsSchema }, async ({ params, user }) => {
  const { figure } = await authorizeFigure({ user, figureId: params.figureId, need: 'edit' });
  if (!(await deleteFigureById({ id: figure.id }))) throw notFound('Figure not found');
  return { ok: true };
});
