// Figure create/update payloads and URL ids, shared by the figure forms, the route handlers, the worker and the seed.
// A figure's parameters are a solver task spec validated by the solver's own schema (lib/physics/schemas), kind === params.task.
import { z } from 'zod';
import { taskSpecSchema, zodIssuesToSpecIssues, type TaskSpec } from '@/lib/physics/schemas';

/** The figure kinds: one per solver task (lib/physics/run-task.ts `TASK_NAMES`; tests/runs checks they agree). */
export const FIGURE_KINDS = [
  'spectrum',
  'flux-sweep',
  'position-sweep',
  'holonomy',
  'degeneracy',
  'nodal-lines',
  'convergence',
] as const;
export type FigureKind = (typeof FIGURE_KINDS)[number];

export const MAX_FIGURE_LABEL = 64;
export const MAX_FIGURE_TITLE = 200;
export const MAX_FIGURE_CAPTION = 2000;
/** A Vega-Lite view spec is small; this bounds what one request can store (serialised JSON, characters). */
export const MAX_VIEW_SPEC_CHARS = 100_000;

/** A figure label: the handle notes use (`<Figure label="spectral-flow" />`) and LaTeX's `fig:<label>`. */
export const figureLabelSchema = z
  .string({ error: 'Enter a label' })
  .trim()
  .min(1, 'Enter a label')
  .max(MAX_FIGURE_LABEL, `At most ${MAX_FIGURE_LABEL} characters`)
  .regex(/^[a-z0-9]+(?:-[a-z0-9]+)*$/, 'Use lower-case letters, digits and single hyphens (e.g. spectral-flow)');

export const figureKindSchema = z.enum(FIGURE_KINDS, { error: `Choose one of: ${FIGURE_KINDS.join(', ')}` });

export const figureTitleSchema = z
  .string({ error: 'The title must be text' })
  .trim()
  .max(MAX_FIGURE_TITLE, `At most ${MAX_FIGURE_TITLE} characters`);

export const figureCaptionSchema = z
  .string({ error: 'The caption must be text' })
  .trim()
  .max(MAX_FIGURE_CAPTION, `At most ${MAX_FIGURE_CAPTION} characters`);

/** An editable Vega-Lite view spec (an object), or null to go back to the kind's default view. */
export const viewSpecSchema = z
  .record(z.string(), z.unknown(), { error: 'The view spec must be a JSON object' })
  .refine((value) => JSON.stringify(value).length <= MAX_VIEW_SPEC_CHARS, {
    error: `The view spec must be at most ${MAX_VIEW_SPEC_CHARS} characters of JSON`,
  })
  .nullable();

/** `well.union[1].disk.radius` -> ['well', 'union', 1, 'disk', 'radius'] (the solver reports dotted paths). */
function splitSpecPath(path: string): (string | number)[] {
  const parts: (string | number)[] = [];
  for (const match of path.matchAll(/([^.[\]]+)|\[(\d+)\]/g)) {
    parts.push(match[2] !== undefined ? Number(match[2]) : match[1]);
  }
  return parts;
}

/**
 * A figure's parameters: the solver's task spec, with the solver's own readable per-field messages (a union of
 * well shapes reports the branch the input meant, not every branch). The output has the defaults filled in.
 */
export const taskParamsSchema = z.unknown().transform((value, ctx): TaskSpec => {
  const parsed = taskSpecSchema.safeParse(value);
  if (parsed.success) return parsed.data;
  for (const issue of zodIssuesToSpecIssues(parsed.error.issues)) {
    ctx.addIssue({ code: 'custom', message: issue.message, path: splitSpecPath(issue.path) });
  }
  return z.NEVER;
});

function kindMatchesTask(value: { kind?: string; params?: { task: string } }, ctx: z.RefinementCtx) {
  if (value.kind !== undefined && value.params !== undefined && value.kind !== value.params.task) {
    ctx.addIssue({
      code: 'custom',
      path: ['params', 'task'],
      message: `The parameters are for task "${value.params.task}" but the figure kind is "${value.kind}"`,
    });
  }
}

/** POST /api/manuscripts/[id]/figures. `params` is the solver spec (defaults filled in by the solver's schema). */
export const createFigureSchema = z
  .object({
    label: figureLabelSchema,
    kind: figureKindSchema,
    title: figureTitleSchema.default(''),
    caption: figureCaptionSchema.default(''),
    params: taskParamsSchema,
    viewSpec: viewSpecSchema.optional(),
  })
  .strict()
  .superRefine(kindMatchesTask);
export type CreateFigure = z.infer<typeof createFigureSchema>;
export type CreateFigureInput = z.input<typeof createFigureSchema>;

/** PATCH /api/figures/[figureId]: any subset; a new `params` may change the kind (then `kind` must agree with it). */
export const updateFigureSchema = z
  .object({
    label: figureLabelSchema.optional(),
    kind: figureKindSchema.optional(),
    title: figureTitleSchema.optional(),
    caption: figureCaptionSchema.optional(),
    params: taskParamsSchema.optional(),
    viewSpec: viewSpecSchema.optional(),
  })
  .strict()
  .superRefine(kindMatchesTask)
  .superRefine((value, ctx) => {
    if (value.kind !== undefined && value.params === undefined) {
      ctx.addIssue({ code: 'custom', path: ['kind'], message: 'Change the kind together with parameters for that kind' });
    }
  })
  .refine((value) => Object.values(value).some((field) => field !== undefined), {
    error: 'Change at least one of: label, title, caption, params, viewSpec',
  });
export type UpdateFigure = z.infer<typeof updateFigureSchema>;

export const figureIdSchema = z.uuid({ error: 'Not a valid figure id' });
export const runIdSchema = z.uuid({ error: 'Not a valid run id' });
export const snapshotIdSchema = z.uuid({ error: 'Not a valid snapshot id' });

export const figureParamsSchema = z.object({ figureId: figureIdSchema });
export const runParamsSchema = z.object({ runId: runIdSchema });
export const snapshotParamsSchema = z.object({ snapshotId: snapshotIdSchema });

/** GET /api/snapshots/[snapshotId]/bundle?format=json|csv */
export const bundleQuerySchema = z.object({
  format: z.enum(['json', 'csv'], { error: 'format must be json or csv' }).default('json'),
});
