// Figure notes with revision history: creation makes revision 1; each save bumps the revision and records who and
// what in the same transaction; a stale baseRevision is refused; two revisions come back as a pair for a diff.
import { eq } from 'drizzle-orm';
import { afterAll, describe, expect, it } from 'vitest';
import { db, sqlClient } from '@/db';
import { createNote, getNoteRevisions, getRevisionPair, listNotesByManuscript, saveNote } from '@/db/queries/notes';
import { noteRevisions } from '@/db/schema';
import { createNoteSchema, saveNoteSchema, slugify } from '@/lib/validations/note';
import { createWorld } from './fixtures';
import { refusalOf } from '../helpers/refusal';

afterAll(async () => {
  await sqlClient.end({ timeout: 5 });
});

describe('notes and revisions', () => {
  it('creates revision 1, then one revision per save with its author', async () => {
    const world = await createWorld('author');
    const note = await createNote({
      manuscriptId: world.manuscript.id,
      title: 'Spectral flow',
      slug: slugify('Spectral flow'),
      source: 'First draft with $\\alpha$.',
      userId: world.user.id,
    });
    expect(note).toMatchObject({ revision: 1, slug: 'spectral-flow', position: 0 });

    const saved = await saveNote({ noteId: note.id, title: 'Spectral flow', source: 'Second draft.', user: world.user, baseRevision: 1 });
    expect(saved?.revision).toBe(2);
    const unchanged = await saveNote({ noteId: note.id, title: 'Spectral flow', source: 'Second draft.', user: world.user });
    expect(unchanged?.revision).toBe(2);
    const third = await saveNote({ noteId: note.id, title: 'Spectral flow of a half tube', source: 'Third.', user: world.user });
    expect(third?.revision).toBe(3);

    const history = await getNoteRevisions({ noteId: note.id });
    expect(history.map((r) => r.number)).toEqual([3, 2, 1]);
    expect(history.every((r) => r.author?.id === world.user.id)).toBe(true);
    const stored = await db.select().from(noteRevisions).where(eq(noteRevisions.noteId, note.id));
    expect(stored).toHaveLength(3);

    const pair = await getRevisionPair({ noteId: note.id, from: 1, to: 3 });
    expect(pair?.from.source).toBe('First draft with $\\alpha$.');
    expect(pair?.to.title).toBe('Spectral flow of a half tube');
    expect(await getRevisionPair({ noteId: note.id, from: 1, to: 9 })).toBeNull();
  });

  it('refuses a save based on an old revision (409) and leaves the note as it was', async () => {
    const world = await createWorld('author');
    const note = await createNote({ manuscriptId: world.manuscript.id, title: 'Gap map', slug: 'gap-map', source: 'a', userId: world.user.id });
    await saveNote({ noteId: note.id, title: 'Gap map', source: 'b', user: world.user, baseRevision: 1 });
    await expect(saveNote({ noteId: note.id, title: 'Gap map', source: 'c', user: world.user, baseRevision: 1 })).rejects.toMatchObject({
      code: 'conflict',
    });
    const history = await getNoteRevisions({ noteId: note.id });
    expect(history.map((r) => r.number)).toEqual([2, 1]);
  });

  it('picks a free slug when none is given, and refuses a taken explicit one', async () => {
    const world = await createWorld('author');
    const base = { manuscriptId: world.manuscript.id, title: 'Loop phase', source: '', userId: world.user.id };
    const a = await createNote({ ...base, slug: 'loop-phase' });
    const b = await createNote({ ...base, slug: 'loop-phase' });
    expect([a.slug, b.slug]).toEqual(['loop-phase', 'loop-phase-2']);
    expect(b.position).toBe(1);
    await expect(createNote({ ...base, slug: 'loop-phase', slugIsExplicit: true })).rejects.toMatchObject({ code: 'conflict' });
    expect((await listNotesByManuscript({ manuscriptId: world.manuscript.id })).map((n) => n.slug)).toEqual([
      'loop-phase',
      'loop-phase-2',
    ]);
  });

  it('validates titles, sizes and slugs with per-field messages', () => {
    expect(createNoteSchema.safeParse({ title: '' }).success).toBe(false);
    expect(createNoteSchema.safeParse({ title: 'x'.repeat(201) }).success).toBe(false);
    expect(createNoteSchema.safeParse({ title: 'ok', slug: 'Not A Slug' }).success).toBe(false);
    const big = saveNoteSchema.safeParse({ title: 'ok', source: 'é'.repeat(110 * 1024) });
    expect(refusalOf(big).issues[0].path).toEqual(['source']);
    expect(slugify('Énergie — niveaux α!')).toBe('energie-niveaux');
  });
});
