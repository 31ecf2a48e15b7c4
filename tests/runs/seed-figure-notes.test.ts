// The demo figure notes: four notes with figures of four kinds, each computed by the real solver and frozen as v1;
// seeding again adds nothing; every demo snapshot's bundle recomputes to the same hash.
import { afterAll, describe, expect, it } from 'vitest';
import { db, sqlClient } from '@/db';
import { listFiguresByManuscript } from '@/db/queries/figures';
import { listNotesByManuscript } from '@/db/queries/notes';
import { getResultById } from '@/db/queries/results';
import { getSnapshotContext, listSnapshotsByManuscript } from '@/db/queries/snapshots';
import { DEMO_NOTES, seedFigureNotes } from '@/lib/demo/seed-figure-notes';
import { extractFigureRefs } from '@/lib/mdx/compile-note';
import { snapshotBundle } from '@/lib/snapshots/bundle';
import { parseBundle, verifyBundle } from '@/lib/snapshots/verify-bundle';
import { createWorld } from './fixtures';

afterAll(async () => {
  await sqlClient.end({ timeout: 5 });
});

describe('demo figure notes', () => {
  it('seeds four notes with computed, frozen figures of different kinds, once', async () => {
    const world = await createWorld('author');
    const lines: string[] = [];
    const first = await seedFigureNotes({ db, manuscriptId: world.manuscript.id, authorId: world.user.id, log: (l) => lines.push(l) });
    expect(first).toEqual({ notes: 4, snapshots: 4 });

    const figures = await listFiguresByManuscript({ manuscriptId: world.manuscript.id });
    expect(new Set(figures.map((f) => f.kind))).toEqual(new Set(['flux-sweep', 'degeneracy', 'holonomy', 'nodal-lines']));
    const notes = await listNotesByManuscript({ manuscriptId: world.manuscript.id });
    expect(notes.map((n) => n.slug)).toEqual(DEMO_NOTES.map((d) => d.slug));
    for (const note of notes) {
      const labels = extractFigureRefs(note.source).map((ref) => ref.label);
      expect(labels.length).toBeGreaterThan(0);
      for (const label of labels) expect(figures.map((f) => f.label)).toContain(label);
    }
    const snapshots = await listSnapshotsByManuscript({ manuscriptId: world.manuscript.id });
    expect(snapshots).toHaveLength(4);
    expect(snapshots.every((s) => s.version === 1 && s.frozenById === world.user.id)).toBe(true);

    const again = await seedFigureNotes({ db, manuscriptId: world.manuscript.id, authorId: world.user.id, log: () => {} });
    expect(again).toEqual({ notes: 0, snapshots: 0 });

    // Physics sanity of the demo results (sources in the note texts): the half tube's degeneracy count is odd
    // (Longuet-Higgins 1975) and the loop around the disk gives the phase -2 pi alpha (Berry 1984).
    const byKind = new Map(snapshots.map((s) => [s.kind, s]));
    const gap = await getResultById({ id: byKind.get('degeneracy')!.resultId });
    expect((gap!.data as { parity: string }).parity).toBe('odd');
    const loop = await getResultById({ id: byKind.get('holonomy')!.resultId });
    expect((loop!.data as { phase: number }).phase).toBeCloseTo(-2 * Math.PI * 0.3, 6);

    for (const snapshot of snapshots) {
      const context = await getSnapshotContext({ id: snapshot.id });
      const result = await getResultById({ id: snapshot.resultId });
      const bundle = parseBundle(JSON.parse(JSON.stringify(snapshotBundle(snapshot, result!, context!))));
      const check = await verifyBundle(bundle);
      expect(check.identical, `${snapshot.label}: ${check.summary}`).toBe(true);
    }
  });
});
