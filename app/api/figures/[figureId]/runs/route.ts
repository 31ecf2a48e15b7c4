// GET /api/figures/[figureId]/runs: the figure's runs, newest first. POST: start a run with the figure's current
// parameters (authors) -> 202 { run, fromCache }; an identical earlier input is served from its stored result.
import { listRunsByFigure } from '@/db/queries/runs';
import { route } from '@/lib/http/handler';
import { authorizeFigure } from '@/lib/runs/resource-access';
import { startRun } from '@/lib/runs/start-run';
import { figureParamsSchema } from '@/lib/validations/figure';
import type { StartRunBody } from '@/lib/api-types';

export const runtime = 'nodejs';
export const dynamic = 'force-dynamic';

export const GET = route({ params: figureParamsSchema }, async ({ params, user }) => {
  const { figure } = await authorizeFigure({ user, figureId: params.figureId, need: 'read' });
  return { runs: await listRunsByFigure({ figureId: figure.id }) };
});

export const POST = route({ params: figureParamsSchema, status: 202 }, async ({ params, user }) => {
  const { figure } = await authorizeFigure({ user, figureId: params.figureId, need: 'run' });
  const { run, fromCache } = await startRun({ figure, user });
  return { run, fromCache } satisfies StartRunBody;
});
