// The 400 answer (an edge response, like lib/http/errors.ts) for a note the safe-MDX gate refuses: the first problem
// as the message (it names its line), every problem with line and column, and the messages under `fields.source`.
import type { NoteProblem } from '@/lib/mdx/check-note';

/** 400 `{ error, lines, fields: { source } }` for refused MDX. */
export function unsafeNoteResponse(errors: NoteProblem[]): Response {
  const error =
    errors.length === 1 ? errors[0].message : `${errors.length} problems in the note; the first is ${errors[0].message}`;
  return Response.json({ error, lines: errors, fields: { source: errors.map((problem) => problem.message) } }, { status: 400 });
}
