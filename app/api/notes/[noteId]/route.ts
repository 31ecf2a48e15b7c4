// GET /api/notes/[noteId]: a figure note with its MDX source (readers). PUT: save a new revision (authors); MDX the
// safety gate refuses is a 400 naming the line and nothing is saved; a stale baseRevision is a 409.
import { saveNote } from '@/db/queries/notes';
import { notFound } from '@/lib/domain-error';
import { route } from '@/lib/http/handler';
import { checkNoteSource } from '@/lib/mdx/check-note';
import { authorizeNote } from '@/lib/runs/resource-access';
import { unsafeNoteResponse } from '@/lib/http/unsafe-note-response';
import { noteParamsSchema, saveNoteSchema } from '@/lib/validations/note';

export const runtime = 'nodejs';
export const dynamic = 'force-dynamic';

export const GET = route({ params: noteParamsSchema }, async ({ params, user }) => {
  const { note, access } = await authorizeNote({ user, noteId: params.noteId, need: 'read' });
  return { note, role: access.role };
});

export const PUT = route({ params: noteParamsSchema, body: saveNoteSchema }, async ({ params, body, user }) => {
  const { note } = await authorizeNote({ user, noteId: params.noteId, need: 'edit' });
  const check = await checkNoteSource(body.source);
  if (!check.ok) return unsafeNoteResponse(check.errors);
  const saved = await saveNote({
    noteId: note.id,
    title: body.title,
    source: body.source,
    user,
    baseRevision: body.baseRevision,
  });
  if (!saved) throw notFound('Note not found');
  return { note: saved, warnings: check.warnings };
});
