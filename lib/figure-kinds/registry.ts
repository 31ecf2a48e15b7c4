// The figure-kind registry: every kind with its label, solver task, parameter schema, starting parameters, chart views
// and default chart. FIGURE_KINDS, the kind schema, labels, views and defaults are all read from here.
import { z } from 'zod';
import { TASK_NAMES, TASK_TABLE, type TaskName, type TaskSpecInputOf, type TaskSpecOf } from '@/lib/physics/task-table';
import { COMPUTED_KINDS } from './computed-kinds';
import type { FigureKindEntry } from './kind-entry';
import { UPLOADED_DATA_KIND, type UploadedTable, type UploadedTableInput } from './uploaded-data';

export type { FigureKindEntry, KindChartOptions } from './kind-entry';

/** A computed kind: its own parts plus the task and spec schema of the task table's row of the same name. */
export type ComputedKindEntry<T extends TaskName> = FigureKindEntry<TaskSpecOf<T>, TaskSpecInputOf<T>> & { task: T };

function computedKind<T extends TaskName>(task: T): ComputedKindEntry<T> {
  // TASK_TABLE[task].schema is the schema of TaskSpecOf<T>; TypeScript cannot see through the generic index.
  const paramsSchema = TASK_TABLE[task].schema as unknown as ComputedKindEntry<T>['paramsSchema'];
  return { ...COMPUTED_KINDS[task], task, paramsSchema };
}

/** Every figure kind: one per solver task (same name), then the data kinds. */
export const FIGURE_KIND_REGISTRY = {
  ...(Object.fromEntries(TASK_NAMES.map((task) => [task, computedKind(task)])) as { [T in TaskName]: ComputedKindEntry<T> }),
  'uploaded-data': UPLOADED_DATA_KIND,
};

export type FigureKind = keyof typeof FIGURE_KIND_REGISTRY;

/** Every kind, in menu order: the solver tasks in the task table's order, then uploaded data. */
export const FIGURE_KINDS = [...TASK_NAMES, 'uploaded-data'] as readonly FigureKind[];

export const figureKindSchema = z.enum(FIGURE_KINDS as [FigureKind, ...FigureKind[]], { error: `Choose one of: ${FIGURE_KINDS.join(', ')}` });

/** The validated parameters of a figure of kind K. */
export type FigureParamsOf<K extends FigureKind> = K extends TaskName ? TaskSpecOf<K> : UploadedTable;
/** The parameters of a figure of kind K as written, before defaults. */
export type FigureParamsInputOf<K extends FigureKind> = K extends TaskName ? TaskSpecInputOf<K> : UploadedTableInput;
/** The validated parameters of any figure (the `params` column of figures and snapshots). */
export type FigureParams = FigureParamsOf<FigureKind>;
export type FigureParamsInput = FigureParamsInputOf<FigureKind>;

/** The registry entry of a kind, loosely typed (for code that handles every kind alike). */
export function figureKind(kind: FigureKind): FigureKindEntry {
  return FIGURE_KIND_REGISTRY[kind] as FigureKindEntry;
}

/** Whether `value` names a figure kind (own keys only). */
export function isFigureKind(value: unknown): value is FigureKind {
  return typeof value === 'string' && Object.prototype.hasOwnProperty.call(FIGURE_KIND_REGISTRY, value);
}

/** Human names of the kinds, for menus and headings. */
export const KIND_LABELS = Object.fromEntries(FIGURE_KINDS.map((kind) => [kind, figureKind(kind).label])) as Record<FigureKind, string>;

/** The chart views each kind offers (chosen with `view`, or `fluxfolio.view` in a stored view spec); the first is the default. */
export const CHART_VIEWS = Object.fromEntries(FIGURE_KINDS.map((kind) => [kind, figureKind(kind).views])) as unknown as Record<FigureKind, readonly string[]>;

/** The kinds a new figure can be computed for (data kinds get their figures from an upload). */
export const COMPUTED_FIGURE_KINDS = FIGURE_KINDS.filter((kind) => figureKind(kind).task !== null);

/**
 * Starting parameters for a new figure of `kind` (valid for the kind's schema).
 *
 * @example
 * defaultParams('holonomy').loop // { circle: { center: [0, 0], radius: 0.5 } }
 */
export function defaultParams<K extends FigureKind>(kind: K): FigureParamsInputOf<K> {
  return figureKind(kind).defaultParams() as FigureParamsInputOf<K>;
}
