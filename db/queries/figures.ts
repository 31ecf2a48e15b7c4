// Queries about figures: list per manuscript, look-ups, create, update and delete (refused once a snapshot exists).
// Labels are unique per manuscript: a duplicate becomes a `conflict` with a message naming the label.
import { and, asc, eq, sql } from 'drizzle-orm';
import { db, type Db } from '@/db';
import { figures, snapshots, type Figure } from '@/db/schema';
import { conflict } from '@/lib/domain-error';
import { pgErrorCode, UNIQUE_VIOLATION } from './pg-errors';

type NewFigure = typeof figures.$inferInsert;

/** What a figure is created from: validated by the caller (kind and params agree, defaults filled in). */
export type FigureValues = Pick<NewFigure, 'label' | 'kind' | 'title' | 'caption' | 'params' | 'viewSpec'>;

/** The fields a patch may change; new `params` come with their `kind` (validated by the caller). */
export type FigurePatch = Partial<Pick<NewFigure, 'label' | 'kind' | 'title' | 'caption' | 'params' | 'viewSpec'>>;

/** The figures of a manuscript, by label. */
export async function listFiguresByManuscript({ manuscriptId, database = db }: { manuscriptId: string; database?: Db }): Promise<Figure[]> {
  return database.select().from(figures).where(eq(figures.manuscriptId, manuscriptId)).orderBy(asc(figures.label));
}

/** A figure by id, or null. */
export async function getFigureById({ id, database = db }: { id: string; database?: Db }): Promise<Figure | null> {
  const [row] = await database.select().from(figures).where(eq(figures.id, id)).limit(1);
  return row ?? null;
}

/** A figure by its label within a manuscript, or null (MDX blocks refer to figures by label). */
export async function getFigureByLabel({
  manuscriptId,
  label,
  database = db,
}: {
  manuscriptId: string;
  label: string;
  database?: Db;
}): Promise<Figure | null> {
  const [row] = await database
    .select()
    .from(figures)
    .where(and(eq(figures.manuscriptId, manuscriptId), eq(figures.label, label)))
    .limit(1);
  return row ?? null;
}

function duplicateLabel(error: unknown, label: string | undefined): never {
  if (pgErrorCode(error) === UNIQUE_VIOLATION) {
    throw conflict(`A figure labelled "${label}" already exists in this manuscript`);
  }
  throw error;
}

/**
 * Create a figure from validated input (the caller's schema checked that kind and params agree). `conflict` on a
 * duplicate label.
 */
export async function createFigure({
  manuscriptId,
  input,
  userId,
  database = db,
}: {
  manuscriptId: string;
  input: FigureValues;
  userId: string | null;
  database?: Db;
}): Promise<Figure> {
  try {
    const [row] = await database
      .insert(figures)
      .values({
        manuscriptId,
        label: input.label,
        kind: input.kind,
        title: input.title,
        caption: input.caption,
        params: input.params,
        viewSpec: input.viewSpec ?? null,
        createdById: userId,
      })
      .returning();
    return row;
  } catch (error) {
    duplicateLabel(error, input.label);
  }
}

/** Apply a validated patch; new params come with their kind (the schema sets it). `conflict` on a duplicate label. */
export async function updateFigure({ id, patch, database = db }: { id: string; patch: FigurePatch; database?: Db }): Promise<Figure | null> {
  const values: Partial<NewFigure> = { updatedAt: new Date() };
  if (patch.label !== undefined) values.label = patch.label;
  if (patch.title !== undefined) values.title = patch.title;
  if (patch.caption !== undefined) values.caption = patch.caption;
  if (patch.viewSpec !== undefined) values.viewSpec = patch.viewSpec;
  if (patch.params !== undefined) {
    values.params = patch.params;
    values.kind = patch.kind;
  }
  try {
    const [row] = await database.update(figures).set(values).where(eq(figures.id, id)).returning();
    return row ?? null;
  } catch (error) {
    duplicateLabel(error, patch.label);
  }
}

/** How many snapshots a figure has (a figure with any cannot be deleted). */
export async function countSnapshotsOfFigure({ figureId, database = db }: { figureId: string; database?: Db }): Promise<number> {
  const [row] = await database
    .select({ n: sql<number>`count(*)::int` })
    .from(snapshots)
    .where(eq(snapshots.figureId, figureId));
  return row?.n ?? 0;
}

/**
 * Delete a figure and its runs (cascade). Refused with a `conflict` when the figure has a frozen snapshot: snapshots
 * are cited, so their figure stays (the foreign key also refuses it).
 */
export async function deleteFigureById({ id, database = db }: { id: string; database?: Db }): Promise<boolean> {
  return database.transaction(async (tx) => {
    const [locked] = await tx.select({ id: figures.id }).from(figures).where(eq(figures.id, id)).for('update');
    if (!locked) return false;
    const [count] = await tx
      .select({ n: sql<number>`count(*)::int` })
      .from(snapshots)
      .where(eq(snapshots.figureId, id));
    if ((count?.n ?? 0) > 0) {
      throw conflict('This figure has frozen snapshots, which are cited and cannot be removed; the figure stays');
    }
    await tx.delete(figures).where(eq(figures.id, id));
    return true;
  });
}
