// GET /api/manuscripts/[id]/figures: the manuscript's figures (readers). POST: create a figure (authors and owners);
// its parameters are validated by the solver's schema and must be for the task named by `kind`.
import { createFigure, listFiguresByManuscript } from '@/db/queries/figures';
import { route } from '@/lib/http/handler';
import { createFigureSchema } from '@/lib/validations/figure';
import { manuscriptParamsSchema } from '@/lib/validations/manuscript';

export const runtime = 'nodejs';
export const dynamic = 'force-dynamic';

export const GET = route({ params: manuscriptParamsSchema, manuscript: 'read' }, async ({ access }) => ({
  figures: await listFiguresByManuscript({ manuscriptId: access.manuscript.id }),
}));

export const POST = route(
  { params: manuscriptParamsSchema, body: createFigureSchema, manuscript: 'edit', status: 201 },
  async ({ access, body, user }) => ({
    figure: await createFigure({ manuscriptId: access.manuscript.id, input: body, userId: user.id }),
  }),
);
