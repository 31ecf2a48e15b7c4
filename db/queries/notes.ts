// Queries about figure notes and their revision history: list, create (revision 1), save (a new revision in the
// same transaction as the note), revisions list and a pair of revisions for a diff.
import { and, asc, desc, eq, inArray, like, or } from 'drizzle-orm';
import { db, type Db } from '@/db';
import { noteRevisions, notes, users, type Note, type NoteRevision } from '@/db/schema';
import { conflict } from '@/lib/domain-error';
import { pgErrorCode, UNIQUE_VIOLATION } from './pg-errors';

/** The notes of a manuscript in reading order (position, then title). */
export async function listNotesByManuscript({ manuscriptId, database = db }: { manuscriptId: string; database?: Db }): Promise<Note[]> {
  return database
    .select()
    .from(notes)
    .where(eq(notes.manuscriptId, manuscriptId))
    .orderBy(asc(notes.position), asc(notes.title));
}

/** A note by id, or null. */
export async function getNoteById({ id, database = db }: { id: string; database?: Db }): Promise<Note | null> {
  const [row] = await database.select().from(notes).where(eq(notes.id, id)).limit(1);
  return row ?? null;
}

/** A note by its slug within a manuscript, or null. */
export async function getNoteBySlug({ manuscriptId, slug, database = db }: { manuscriptId: string; slug: string; database?: Db }): Promise<Note | null> {
  const [row] = await database
    .select()
    .from(notes)
    .where(and(eq(notes.manuscriptId, manuscriptId), eq(notes.slug, slug)))
    .limit(1);
  return row ?? null;
}

/** `base`, or `base-2`, `base-3`… whichever is free in the manuscript. */
async function freeSlug(database: Db, manuscriptId: string, base: string): Promise<string> {
  const taken = await database
    .select({ slug: notes.slug })
    .from(notes)
    .where(and(eq(notes.manuscriptId, manuscriptId), or(eq(notes.slug, base), like(notes.slug, `${base}-%`))));
  const used = new Set(taken.map((row) => row.slug));
  if (!used.has(base)) return base;
  for (let n = 2; ; n++) if (!used.has(`${base}-${n}`)) return `${base}-${n}`;
}

/**
 * Create a note with its first revision. With `slugIsExplicit` a taken slug is a `conflict`; otherwise a free variant
 * (`slug-2`, …) is chosen. The note goes after the manuscript's other notes.
 */
export async function createNote({
  manuscriptId,
  title,
  slug,
  slugIsExplicit = false,
  source,
  userId,
  database = db,
}: {
  manuscriptId: string;
  title: string;
  slug: string;
  slugIsExplicit?: boolean;
  source: string;
  userId: string | null;
  database?: Db;
}): Promise<Note> {
  const finalSlug = slugIsExplicit ? slug : await freeSlug(database, manuscriptId, slug);
  try {
    return await database.transaction(async (tx) => {
      const existing = await tx.select({ position: notes.position }).from(notes).where(eq(notes.manuscriptId, manuscriptId));
      const position = existing.reduce((max, row) => Math.max(max, row.position + 1), 0);
      const [note] = await tx
        .insert(notes)
        .values({ manuscriptId, slug: finalSlug, title, source, position, revision: 1, updatedById: userId })
        .returning();
      await tx.insert(noteRevisions).values({ noteId: note.id, number: 1, title, source, authorId: userId });
      return note;
    });
  } catch (error) {
    if (pgErrorCode(error) === UNIQUE_VIOLATION) throw conflict(`A note with the slug "${finalSlug}" already exists`);
    throw error;
  }
}

/**
 * Save a note: bump its revision and record the new revision (who, when, what) in ONE transaction.
 * An identical title and source make no new revision. With `baseRevision`, a note changed since that revision
 * is a `conflict` (someone else saved first) rather than a silent overwrite.
 *
 * @returns the note after saving, or null when it does not exist
 */
export async function saveNote({
  noteId,
  title,
  source,
  user,
  baseRevision,
  database = db,
}: {
  noteId: string;
  title: string;
  source: string;
  user: { id: string } | null;
  baseRevision?: number;
  database?: Db;
}): Promise<Note | null> {
  return database.transaction(async (tx) => {
    const [current] = await tx.select().from(notes).where(eq(notes.id, noteId)).for('update');
    if (!current) return null;
    if (baseRevision !== undefined && baseRevision !== current.revision) {
      throw conflict(
        `This note was saved by someone else meanwhile (revision ${current.revision}; you edited revision ${baseRevision}). Reload it and apply your changes again.`,
      );
    }
    if (current.title === title && current.source === source) return current;
    const number = current.revision + 1;
    const [note] = await tx
      .update(notes)
      .set({ title, source, revision: number, updatedById: user?.id ?? null, updatedAt: new Date() })
      .where(eq(notes.id, noteId))
      .returning();
    await tx.insert(noteRevisions).values({ noteId, number, title, source, authorId: user?.id ?? null });
    return note;
  });
}

/** One line of a note's history, without the source (cheap to list). */
export interface NoteRevisionSummary {
  number: number;
  title: string;
  createdAt: Date;
  author: { id: string; name: string | null } | null;
  bytes: number;
}

/** The revisions of a note, newest first, with who saved each. */
export async function getNoteRevisions({ noteId, database = db }: { noteId: string; database?: Db }): Promise<NoteRevisionSummary[]> {
  const rows = await database
    .select({
      number: noteRevisions.number,
      title: noteRevisions.title,
      createdAt: noteRevisions.createdAt,
      authorId: noteRevisions.authorId,
      authorName: users.name,
      source: noteRevisions.source,
    })
    .from(noteRevisions)
    .leftJoin(users, eq(users.id, noteRevisions.authorId))
    .where(eq(noteRevisions.noteId, noteId))
    .orderBy(desc(noteRevisions.number));
  return rows.map((row) => ({
    number: row.number,
    title: row.title,
    createdAt: row.createdAt,
    author: row.authorId ? { id: row.authorId, name: row.authorName } : null,
    bytes: new TextEncoder().encode(row.source).length,
  }));
}

/** Two revisions of a note (for a diff), or null when either is missing. */
export async function getRevisionPair({
  noteId,
  from,
  to,
  database = db,
}: {
  noteId: string;
  from: number;
  to: number;
  database?: Db;
}): Promise<{ from: NoteRevision; to: NoteRevision } | null> {
  const rows = await database
    .select()
    .from(noteRevisions)
    .where(and(eq(noteRevisions.noteId, noteId), inArray(noteRevisions.number, [from, to])));
  const a = rows.find((row) => row.number === from);
  const b = rows.find((row) => row.number === to);
  return a && b ? { from: a, to: b } : null;
}
