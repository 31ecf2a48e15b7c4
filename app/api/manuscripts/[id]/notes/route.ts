// GET /api/manuscripts/[id]/notes: the manuscript's figure notes (without their sources) for readers. POST: create a
// note (authors); its MDX must pass the safety gate, else 400 naming the line.
import { createNote, listNotesByManuscript } from '@/db/queries/notes';
import { route } from '@/lib/http/handler';
import { checkNoteSource } from '@/lib/mdx/check-note';
import { unsafeNoteResponse } from '@/lib/http/unsafe-note-response';
import { manuscriptParamsSchema } from '@/lib/validations/manuscript';
import { createNoteSchema, slugify } from '@/lib/validations/note';

export const runtime = 'nodejs';
export const dynamic = 'force-dynamic';

export const GET = route({ params: manuscriptParamsSchema, manuscript: 'read' }, async ({ access }) => {
  const notes = await listNotesByManuscript({ manuscriptId: access.manuscript.id });
  return {
    notes: notes.map(({ source: _source, ...note }) => note),
  };
});

export const POST = route(
  { params: manuscriptParamsSchema, body: createNoteSchema, manuscript: 'edit' },
  async ({ access, body, user }) => {
    const check = await checkNoteSource(body.source);
    if (!check.ok) return unsafeNoteResponse(check.errors);
    const note = await createNote({
      manuscriptId: access.manuscript.id,
      title: body.title,
      slug: body.slug ?? slugify(body.title),
      slugIsExplicit: body.slug !== undefined,
      source: body.source,
      userId: user.id,
    });
    return Response.json({ note, warnings: check.warnings }, { status: 201 });
  },
);
