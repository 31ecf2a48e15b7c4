// Queries about frozen snapshots (read-only: rows are inserted by lib/snapshots/freeze.ts and the database
// refuses UPDATE and DELETE on them). Look-ups by id, by figure and version, and with their citation context.
import { and, asc, desc, eq } from 'drizzle-orm';
import { db, type Db } from '@/db';
import { figures, manuscripts, snapshots, users, type Snapshot } from '@/db/schema';

/** A snapshot by id, or null. */
export async function getSnapshotById({ id, database = db }: { id: string; database?: Db }): Promise<Snapshot | null> {
  const [row] = await database.select().from(snapshots).where(eq(snapshots.id, id)).limit(1);
  return row ?? null;
}

/** The snapshots of a figure, v1 first. */
export async function listSnapshotsByFigure({ figureId, database = db }: { figureId: string; database?: Db }): Promise<Snapshot[]> {
  return database.select().from(snapshots).where(eq(snapshots.figureId, figureId)).orderBy(asc(snapshots.version));
}

/** The snapshots of a manuscript, newest first. */
export async function listSnapshotsByManuscript({ manuscriptId, database = db }: { manuscriptId: string; database?: Db }): Promise<Snapshot[]> {
  return database
    .select()
    .from(snapshots)
    .where(eq(snapshots.manuscriptId, manuscriptId))
    .orderBy(desc(snapshots.frozenAt), asc(snapshots.label), desc(snapshots.version));
}

/** Version `version` of a figure, or null. */
export async function getSnapshotByVersion({
  figureId,
  version,
  database = db,
}: {
  figureId: string;
  version: number;
  database?: Db;
}): Promise<Snapshot | null> {
  const [row] = await database
    .select()
    .from(snapshots)
    .where(and(eq(snapshots.figureId, figureId), eq(snapshots.version, version)))
    .limit(1);
  return row ?? null;
}

/** The newest snapshot of a figure, or null. */
export async function getLatestSnapshot({ figureId, database = db }: { figureId: string; database?: Db }): Promise<Snapshot | null> {
  const [row] = await database
    .select()
    .from(snapshots)
    .where(eq(snapshots.figureId, figureId))
    .orderBy(desc(snapshots.version))
    .limit(1);
  return row ?? null;
}

/** A snapshot with what a citation or a bundle names: the manuscript, the figure's title, who froze it. */
export interface SnapshotContext {
  snapshot: Snapshot;
  manuscript: { id: string; title: string; slug: string };
  figureTitle: string;
  frozenBy: { id: string; name: string | null } | null;
}

/** A snapshot with its citation context, or null. */
export async function getSnapshotContext({ id, database = db }: { id: string; database?: Db }): Promise<SnapshotContext | null> {
  const [row] = await database
    .select({
      snapshot: snapshots,
      manuscript: { id: manuscripts.id, title: manuscripts.title, slug: manuscripts.slug },
      figureTitle: figures.title,
      frozenById: users.id,
      frozenByName: users.name,
    })
    .from(snapshots)
    .innerJoin(manuscripts, eq(manuscripts.id, snapshots.manuscriptId))
    .innerJoin(figures, eq(figures.id, snapshots.figureId))
    .leftJoin(users, eq(users.id, snapshots.frozenById))
    .where(eq(snapshots.id, id))
    .limit(1);
  if (!row) return null;
  return {
    snapshot: row.snapshot,
    manuscript: row.manuscript,
    figureTitle: row.figureTitle,
    frozenBy: row.frozenById ? { id: row.frozenById, name: row.frozenByName } : null,
  };
}
