// Figure-note payloads (create, save) and URL ids, shared by the note editor, the route handlers and the seed.
// Limits: title 200 characters, MDX source 200 kB (UTF-8 bytes), slug lower-case with hyphens.
import { z } from 'zod';
import { slugFromTitle } from './common';

export const MAX_NOTE_TITLE = 200;
export const MAX_NOTE_SOURCE_BYTES = 200 * 1024;
export const MAX_NOTE_SLUG = 80;

export const noteTitleSchema = z
  .string({ error: 'Enter a title' })
  .trim()
  .min(1, 'Enter a title')
  .max(MAX_NOTE_TITLE, `At most ${MAX_NOTE_TITLE} characters`);

/** MDX source; the safety gate (lib/mdx/check-note.ts) runs after this shape check. */
export const noteSourceSchema = z
  .string({ error: 'The note source must be text' })
  .refine((value) => new TextEncoder().encode(value).length <= MAX_NOTE_SOURCE_BYTES, {
    error: `The note is too long: at most ${MAX_NOTE_SOURCE_BYTES / 1024} kB`,
  });

export const noteSlugSchema = z
  .string({ error: 'The slug must be text' })
  .trim()
  .min(1, 'Enter a slug')
  .max(MAX_NOTE_SLUG, `At most ${MAX_NOTE_SLUG} characters`)
  .regex(/^[a-z0-9]+(?:-[a-z0-9]+)*$/, 'Use lower-case letters, digits and single hyphens');

/** POST /api/manuscripts/[id]/notes. Without a slug one is made from the title. */
export const createNoteSchema = z
  .object({
    title: noteTitleSchema,
    slug: noteSlugSchema.optional(),
    source: noteSourceSchema.default(''),
  })
  .strict();
export type CreateNote = z.infer<typeof createNoteSchema>;

/**
 * PUT /api/notes/[noteId]: a new revision. `baseRevision` (the revision the editor started from) turns a
 * concurrent edit into a 409 instead of silently overwriting it.
 */
export const saveNoteSchema = z
  .object({
    title: noteTitleSchema,
    source: noteSourceSchema,
    baseRevision: z.int({ error: 'baseRevision must be a whole number' }).min(1).optional(),
  })
  .strict();
export type SaveNote = z.infer<typeof saveNoteSchema>;

export const noteIdSchema = z.uuid({ error: 'Not a valid note id' });
export const noteParamsSchema = z.object({ noteId: noteIdSchema });

/** GET /api/notes/[noteId]/revisions?from=&to= (both given: the pair for a diff). */
export const revisionsQuerySchema = z
  .object({
    from: z.coerce.number({ error: 'from must be a revision number' }).int().min(1).optional(),
    to: z.coerce.number({ error: 'to must be a revision number' }).int().min(1).optional(),
  })
  .refine((value) => (value.from === undefined) === (value.to === undefined), {
    error: 'Give both from and to, or neither',
  });

/**
 * A slug from a title: lower-case ASCII letters and digits joined by single hyphens (at most 60 characters).
 *
 * @example
 * slugify('Spectral flow of a half tube'); // 'spectral-flow-of-a-half-tube'
 */
export function slugify(title: string): string {
  return slugFromTitle(title, 'note');
}
