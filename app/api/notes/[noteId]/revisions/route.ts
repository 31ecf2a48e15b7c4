// GET /api/notes/[noteId]/revisions: a note's history, newest first (who, when, size). With ?from=&to= the two
// revisions in full, for a diff.
import { getNoteRevisions, getRevisionPair } from '@/db/queries/notes';
import { notFound } from '@/lib/domain-error';
import { route } from '@/lib/http/handler';
import { authorizeNote } from '@/lib/runs/resource-access';
import { noteParamsSchema, revisionsQuerySchema } from '@/lib/validations/note';
import type { RevisionPairBody, RevisionsBody } from '@/lib/api-types';

export const runtime = 'nodejs';
export const dynamic = 'force-dynamic';

export const GET = route({ params: noteParamsSchema, query: revisionsQuerySchema }, async ({ params, query, user }) => {
  const { note } = await authorizeNote({ user, noteId: params.noteId, need: 'read' });
  if (query.from !== undefined && query.to !== undefined) {
    const pair = await getRevisionPair({ noteId: note.id, from: query.from, to: query.to });
    if (!pair) throw notFound('Revision not found');
    return pair satisfies RevisionPairBody;
  }
  return { revisions: await getNoteRevisions({ noteId: note.id }) } satisfies RevisionsBody;
});
