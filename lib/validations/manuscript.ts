// Manuscript create/update/archive payloads and the list query, shared by forms, route handlers and scripts.
// Limits: title 200 characters, abstract 5000.
import { z } from 'zod';
import type { ManuscriptStatus } from '@/db/schema';
import { MAX_ABSTRACT, MAX_TITLE, manuscriptIdSchema } from './common';

export const manuscriptTitleSchema = z
  .string({ error: 'Enter a title' })
  .trim()
  .min(1, 'Enter a title')
  .max(MAX_TITLE, `At most ${MAX_TITLE} characters`);

export const manuscriptAbstractSchema = z
  .string({ error: 'The abstract must be text' })
  .trim()
  .max(MAX_ABSTRACT, `At most ${MAX_ABSTRACT} characters`);

/** The values of the database enum `manuscript_status` (listed here so client bundles need not load the schema). */
export const MANUSCRIPT_STATUSES = ['draft', 'submitted', 'published'] as const satisfies readonly ManuscriptStatus[];
const everyStatusListed: Exclude<ManuscriptStatus, (typeof MANUSCRIPT_STATUSES)[number]> extends never ? true : false = true;
void everyStatusListed;

export const manuscriptStatusSchema = z.enum(MANUSCRIPT_STATUSES, {
  error: `Choose one of: ${MANUSCRIPT_STATUSES.join(', ')}`,
});

export const createManuscriptSchema = z.object({
  title: manuscriptTitleSchema,
  abstract: manuscriptAbstractSchema.default(''),
});
export type CreateManuscript = z.infer<typeof createManuscriptSchema>;

export const updateManuscriptSchema = z
  .object({
    title: manuscriptTitleSchema.optional(),
    abstract: manuscriptAbstractSchema.optional(),
    status: manuscriptStatusSchema.optional(),
  })
  .strict()
  .refine((value) => value.title !== undefined || value.abstract !== undefined || value.status !== undefined, {
    error: 'Change at least one of: title, abstract, status',
  });
export type UpdateManuscript = z.infer<typeof updateManuscriptSchema>;

/** POST /archive: `{ archived: false }` restores an archived manuscript; an empty body archives it. */
export const archiveManuscriptSchema = z.object({
  archived: z.boolean({ error: 'archived must be true or false' }).default(true),
});
export type ArchiveManuscript = z.infer<typeof archiveManuscriptSchema>;

export const manuscriptParamsSchema = z.object({ id: manuscriptIdSchema });

/** GET /api/manuscripts?scope=all lists every manuscript (site admins only). */
export const manuscriptListQuerySchema = z.object({
  scope: z.enum(['mine', 'all'], { error: 'scope must be mine or all' }).default('mine'),
});
