// GET: the caller's manuscripts with their role (site admins: ?scope=all for every manuscript).
// POST: create a manuscript with the caller as owner (201).
import { listAllManuscripts, listManuscriptsForUser } from '@/db/queries/manuscripts';
import { forbidden } from '@/lib/domain-error';
import { route } from '@/lib/http/handler';
import { newManuscript } from '@/lib/manuscripts/new-manuscript';
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
  const manuscript = await newManuscript({ ownerId: user.id, title: body.title, abstract: body.abstract });
  return { manuscript };
});
