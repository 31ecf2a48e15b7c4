// Body of POST /api/notes/preview: the manuscript whose figures the note refers to, and the MDX source being edited.
// The source obeys the same size limit as a saved note (lib/validations/note.ts).
import { z } from 'zod';
import { noteSourceSchema } from '@/lib/validations/note';

export const notePreviewSchema = z
  .object({
    manuscriptId: z.uuid({ error: 'Not a valid manuscript id' }),
    source: noteSourceSchema,
  })
  .strict();
export type NotePreview = z.infer<typeof notePreviewSchema>;
