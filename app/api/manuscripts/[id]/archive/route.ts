// POST: archive a manuscript (owners), or restore it with `{ "archived": false }`. Archived manuscripts stay readable.
// Archiving keeps the first archive date; content-changing actions then answer 409.
import { setManuscriptArchived } from '@/db/queries/manuscripts';
import { route } from '@/lib/http/handler';
import { archiveManuscriptSchema, manuscriptParamsSchema } from '@/lib/validations/manuscript';

export const POST = route(
  { params: manuscriptParamsSchema, body: archiveManuscriptSchema, manuscript: 'manage' },
  async ({ access, body }) => ({
    manuscript: await setManuscriptArchived({ id: access.manuscript.id, archived: body.archived }),
  }),
);
