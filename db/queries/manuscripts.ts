// Queries about manuscripts: look-ups, lists with the caller's role, creation (at the caller's address, with the
// creator as owner), detail updates, archiving, and deletion (refused while frozen snapshots exist).
import { and, count, desc, eq, inArray, sql } from 'drizzle-orm';
import { db } from '@/db';
import { manuscripts, memberships, snapshots, type Manuscript, type MemberRole } from '@/db/schema';
import { conflict, notFound } from '@/lib/domain-error';
import type { Executor } from './executor';
import { pgErrorCode, UNIQUE_VIOLATION } from './pg-errors';

/** A manuscript as listed on the dashboard, with the caller's role (null: visible to a site admin only). */
export interface ManuscriptListItem {
  id: string;
  slug: string;
  title: string;
  status: Manuscript['status'];
  archivedAt: Date | null;
  updatedAt: Date;
  role: MemberRole | null;
  memberCount: number;
}

/** A manuscript by id, or null. */
export async function getManuscriptById({ id }: { id: string }): Promise<Manuscript | null> {
  const [row] = await db.select().from(manuscripts).where(eq(manuscripts.id, id)).limit(1);
  return row ?? null;
}

/** A manuscript by slug, or null. */
export async function getManuscriptBySlug({ slug }: { slug: string }): Promise<Manuscript | null> {
  const [row] = await db.select().from(manuscripts).where(eq(manuscripts.slug, slug)).limit(1);
  return row ?? null;
}

const memberCountSql = sql<number>`(select count(*)::int from ${memberships} m2 where m2.manuscript_id = ${manuscripts.id})`;

/** The columns of a ManuscriptListItem (the caller's role comes from the joined membership row). */
const listItemColumns = {
  id: manuscripts.id,
  slug: manuscripts.slug,
  title: manuscripts.title,
  status: manuscripts.status,
  archivedAt: manuscripts.archivedAt,
  updatedAt: manuscripts.updatedAt,
  role: memberships.role,
  memberCount: memberCountSql,
};

/** The manuscripts `userId` is a member of, most recently updated first. */
export async function listManuscriptsForUser({ userId }: { userId: string }): Promise<ManuscriptListItem[]> {
  return db
    .select(listItemColumns)
    .from(memberships)
    .innerJoin(manuscripts, eq(manuscripts.id, memberships.manuscriptId))
    .where(eq(memberships.userId, userId))
    .orderBy(desc(manuscripts.updatedAt));
}

/** Every manuscript (site admins), with `userId`'s role where they are a member. */
export async function listAllManuscripts({ userId }: { userId: string }): Promise<ManuscriptListItem[]> {
  return db
    .select(listItemColumns)
    .from(manuscripts)
    .leftJoin(memberships, and(eq(memberships.manuscriptId, manuscripts.id), eq(memberships.userId, userId)))
    .orderBy(desc(manuscripts.updatedAt));
}

/**
 * Create a manuscript with `ownerId` as its first owner, at the address `slug` (chosen by the caller).
 *
 * @throws DomainError `conflict` when another manuscript already has that address
 */
export async function createManuscript({
  ownerId,
  title,
  slug,
  abstract = '',
}: {
  ownerId: string;
  title: string;
  slug: string;
  abstract?: string;
}): Promise<Manuscript> {
  try {
    return await db.transaction(async (tx) => {
      const [manuscript] = await tx.insert(manuscripts).values({ title, abstract, slug, createdById: ownerId }).returning();
      await tx.insert(memberships).values({ manuscriptId: manuscript.id, userId: ownerId, role: 'owner' });
      return manuscript;
    });
  } catch (error) {
    if (pgErrorCode(error) === UNIQUE_VIOLATION) throw conflict('This address is taken; try again');
    throw error;
  }
}

/** Change title, abstract and/or status; bumps updatedAt. */
export async function updateManuscript({
  id,
  title,
  abstract,
  status,
}: {
  id: string;
  title?: string;
  abstract?: string;
  status?: Manuscript['status'];
}): Promise<Manuscript> {
  const [row] = await db
    .update(manuscripts)
    .set({
      ...(title !== undefined && { title }),
      ...(abstract !== undefined && { abstract }),
      ...(status !== undefined && { status }),
      updatedAt: new Date(),
    })
    .where(eq(manuscripts.id, id))
    .returning();
  if (!row) throw notFound('Manuscript not found');
  return row;
}

/** Mark a manuscript as changed at `at` (its place in "recently updated" lists). */
export async function touchManuscript({ id, at = new Date(), tx = db }: { id: string; at?: Date; tx?: Executor }): Promise<void> {
  await tx.update(manuscripts).set({ updatedAt: at }).where(eq(manuscripts.id, id));
}

/** Archive (sets archivedAt to now) or restore (clears it). Archiving an archived manuscript keeps its date. */
export async function setManuscriptArchived({ id, archived }: { id: string; archived: boolean }): Promise<Manuscript> {
  const [row] = await db
    .update(manuscripts)
    .set({
      archivedAt: archived ? sql`coalesce(${manuscripts.archivedAt}, now())` : null,
      updatedAt: new Date(),
    })
    .where(eq(manuscripts.id, id))
    .returning();
  if (!row) throw notFound('Manuscript not found');
  return row;
}

/** How many frozen snapshots the manuscript has (a manuscript with any cannot be deleted). */
export async function countSnapshotsForManuscript({ id }: { id: string }): Promise<number> {
  const [row] = await db.select({ n: count() }).from(snapshots).where(eq(snapshots.manuscriptId, id));
  return row?.n ?? 0;
}

/** Counts of snapshots for several manuscripts at once (id -> count; absent = 0). */
export async function countSnapshotsForManuscripts({ ids }: { ids: string[] }): Promise<Map<string, number>> {
  if (ids.length === 0) return new Map();
  const rows = await db
    .select({ id: snapshots.manuscriptId, n: count() })
    .from(snapshots)
    .where(inArray(snapshots.manuscriptId, ids))
    .groupBy(snapshots.manuscriptId);
  return new Map(rows.map((row) => [row.id, row.n]));
}

/**
 * Delete a manuscript and everything that cascades from it. Throws a `conflict` while it has a frozen snapshot:
 * snapshots are cited by others and must stay resolvable.
 */
export async function deleteManuscriptById({ id }: { id: string }): Promise<void> {
  await db.transaction(async (tx) => {
    const [locked] = await tx.select({ id: manuscripts.id }).from(manuscripts).where(eq(manuscripts.id, id)).for('update');
    if (!locked) throw notFound('Manuscript not found');
    const [row] = await tx.select({ n: count() }).from(snapshots).where(eq(snapshots.manuscriptId, id));
    if ((row?.n ?? 0) > 0) {
      throw conflict('This manuscript has frozen snapshots, which others may cite; archive it instead');
    }
    await tx.delete(manuscripts).where(eq(manuscripts.id, id));
  });
}
