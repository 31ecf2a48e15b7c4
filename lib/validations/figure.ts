// Figure create/update payloads and URL ids, shared by the figure forms, the route handlers, the worker and the seed.
// Kinds, and the parameter schema of each kind, come from the figure-kind registry; kind and parameters must agree.
import { z } from 'zod';
import { viewSpecSchema } from '@/lib/charts/view-spec';
import { figureKind, figureKindSchema, isFigureKind, type FigureKind, type FigureParams } from '@/lib/figure-kinds/registry';
import { taskSpecSchema, zodIssuesToSpecIssues } from '@/lib/physics/schemas';
import { isTaskName } from '@/lib/physics/task-table';

export const MAX_FIGURE_LABEL = 64;
export const MAX_FIGURE_TITLE = 200;
export const MAX_FIGURE_CAPTION = 2000;

/** A figure label: the handle notes use (`<Figure label="spectral-flow" />`) and LaTeX's `fig:<label>`. */
export const figureLabelSchema = z
  .string({ error: 'Enter a label' })
  .trim()
  .min(1, 'Enter a label')
  .max(MAX_FIGURE_LABEL, `At most ${MAX_FIGURE_LABEL} characters`)
  .regex(/^[a-z0-9]+(?:-[a-z0-9]+)*$/, 'Use lower-case letters, digits and single hyphens (e.g. spectral-flow)');

export const figureTitleSchema = z
  .string({ error: 'The title must be text' })
  .trim()
  .max(MAX_FIGURE_TITLE, `At most ${MAX_FIGURE_TITLE} characters`);

export const figureCaptionSchema = z
  .string({ error: 'The caption must be text' })
  .trim()
  .max(MAX_FIGURE_CAPTION, `At most ${MAX_FIGURE_CAPTION} characters`);

/** A figure's view spec (the one schema in lib/charts/view-spec.ts: validated and sanitised), or null for the kind's default view. */
export const figureViewSpecSchema = viewSpecSchema.nullable();

/** `well.union[1].disk.radius` -> ['well', 'union', 1, 'disk', 'radius'] (the solver reports dotted paths). */
function splitSpecPath(path: string): (string | number)[] {
  const parts: (string | number)[] = [];
  for (const match of path.matchAll(/([^.[\]]+)|\[(\d+)\]/g)) {
    parts.push(match[2] !== undefined ? Number(match[2]) : match[1]);
  }
  return parts;
}

/** The kind a parameter object names itself: its `task` when that is a task; undefined when it names none or an unknown one. */
function kindNamedBy(params: unknown): FigureKind | undefined {
  const task = typeof params === 'object' && params !== null && !Array.isArray(params) ? (params as { task?: unknown }).task : undefined;
  return isTaskName(task) && isFigureKind(task) ? task : undefined;
}

/** Whether the parameters carry a `task` key at all (then they are a solver spec, whatever the task says). */
function hasTask(params: unknown): boolean {
  return typeof params === 'object' && params !== null && !Array.isArray(params) && 'task' in params;
}

/**
 * The kind the parameters are checked against: the figure's kind when given; otherwise the kind the parameters name,
 * the data kind when they carry no task (today uploaded data is the one kind without a solver task), or undefined (an
 * unknown task: the solver's union then says which tasks exist).
 */
function kindForParams(kind: FigureKind | undefined, params: unknown): FigureKind | undefined {
  if (kind !== undefined) return kind;
  if (hasTask(params)) return kindNamedBy(params);
  return 'uploaded-data';
}

/**
 * Check `params` against the schema of `kind` and report each problem at its own path under `params` with the
 * solver's readable messages (a union of well shapes reports the branch the input meant). Returns the parsed
 * parameters (defaults filled in), or undefined when they are not valid.
 */
function checkParams(kind: FigureKind | undefined, params: unknown, ctx: z.RefinementCtx): FigureParams | undefined {
  const named = kindNamedBy(params);
  if (kind !== undefined && hasTask(params) && named !== undefined && named !== kind) {
    ctx.addIssue({ code: 'custom', path: ['params', 'task'], message: `The parameters are for task "${named}" but the figure kind is "${kind}"` });
    return undefined;
  }
  const schema: z.ZodType = kind === undefined ? taskSpecSchema : figureKind(kind).paramsSchema;
  const parsed = schema.safeParse(params);
  if (parsed.success) return parsed.data as FigureParams;
  for (const issue of zodIssuesToSpecIssues(parsed.error.issues)) {
    ctx.addIssue({ code: 'custom', message: issue.message, path: ['params', ...splitSpecPath(issue.path)] });
  }
  return undefined;
}

const figureFields = {
  label: figureLabelSchema,
  title: figureTitleSchema,
  caption: figureCaptionSchema,
  params: z.unknown(),
  viewSpec: figureViewSpecSchema,
};

/**
 * POST /api/manuscripts/[id]/figures. `params` are checked by the schema of `kind` (a solver spec for computed kinds,
 * defaults filled in; a table for uploaded data).
 */
export const createFigureSchema = z
  .object({
    label: figureFields.label,
    kind: figureKindSchema,
    title: figureFields.title.default(''),
    caption: figureFields.caption.default(''),
    params: figureFields.params,
    viewSpec: figureFields.viewSpec.optional(),
  })
  .strict()
  // A refinement (not a transform) so that parameter problems are reported together with those of the other fields.
  .superRefine((value, ctx) => void checkParams(value.kind, value.params, ctx))
  .transform((value, ctx) => {
    const params = checkParams(value.kind, value.params, ctx);
    if (params === undefined) return z.NEVER;
    return { ...value, params };
  });
export type CreateFigure = z.infer<typeof createFigureSchema>;
export type CreateFigureInput = z.input<typeof createFigureSchema>;

/**
 * PATCH /api/figures/[figureId]: any subset. New `params` may change the kind: `kind` is then the kind they are for
 * (their task, or uploaded data for a table) unless given, and the output always carries it beside the new params.
 */
export const updateFigureSchema = z
  .object({
    label: figureFields.label.optional(),
    kind: figureKindSchema.optional(),
    title: figureFields.title.optional(),
    caption: figureFields.caption.optional(),
    params: figureFields.params.optional(),
    viewSpec: figureFields.viewSpec.optional(),
  })
  .strict()
  .superRefine((value, ctx) => {
    if (value.params !== undefined) checkParams(kindForParams(value.kind, value.params), value.params, ctx);
    else if (value.kind !== undefined) ctx.addIssue({ code: 'custom', path: ['kind'], message: 'Change the kind together with parameters for that kind' });
  })
  .refine((value) => Object.values(value).some((field) => field !== undefined), {
    error: 'Change at least one of: label, title, caption, params, viewSpec',
  })
  .transform((value, ctx) => {
    if (value.params === undefined) return { ...value, kind: undefined, params: undefined };
    const kind = kindForParams(value.kind, value.params);
    const params = checkParams(kind, value.params, ctx);
    if (kind === undefined || params === undefined) return z.NEVER;
    return { ...value, kind, params };
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
