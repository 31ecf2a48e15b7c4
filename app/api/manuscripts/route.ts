// GET: the caller's manuscripts with their role (site admins: ?scope=all for every manuscript).
// POST: create a manuscript with the caller as owner (201).
import { createManuscript, listAllManuscripts, listManuscriptsForUser } from '@/db/queries/manuscripts';
import { forbidden } from '@/lib/domain-error';
import { route } from '@/lib/http/handler';
import { slugFromTitle } from '@/lib/validations/common';
import { createManuscriptSchema, manuscriptListQuerySchema } from '@/lib/validations/manuscript';
import type { ManuscriptsBody } from '@/lib/api-types';

export const GET = route({ query: manuscriptListQuerySchema }, async ({ user, query }) => {
  if (query.scope === 'all') {
    if (!user.isAdmin) throw forbidden('Only site admins may list every manuscript');
    return { manuscripts: await listAllManuscripts({ userId: user.id }) } satisfies ManuscriptsBody;
  }
  return { manuscripts: await listManuscriptsForUser({ userId: user.id }) } satisfies ManuscriptsBody;
});

export const POST = route({ body: createManuscriptSchema, status: 201 }, async ({ user, body }) => {
  const manuscript = await createManuscript({
    ownerId: user.id,
    title: body.title,
    slug: slugFromTitle(body.title, 'manuscript'),
    abstract: body.abstract,
  });
  return { manuscript };
});
