// Demo figure notes for the invented manuscript: four notes (MDX in content/demo-notes) with live figures of
// different kinds, each computed by the real solver at seed time on a small grid and frozen as v1.
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import type { Db } from '@/db';
import { createFigure, getFigureByLabel } from '@/db/queries/figures';
import { createNote, getNoteBySlug } from '@/db/queries/notes';
import { getLatestSnapshot } from '@/db/queries/snapshots';
import { executeRun } from '@/lib/jobs/run-job';
import { checkNoteSource } from '@/lib/mdx/check-note';
import { startRun } from '@/lib/runs/start-run';
import { freezeRun } from '@/lib/snapshots/freeze';
import { createFigureSchema, type CreateFigureInput } from '@/lib/validations/figure';

const NOTES_DIR = new URL('../../content/demo-notes/', import.meta.url);

/** One demo note and the figure it shows. Grids are coarse so that the whole seed stays well under a minute. */
interface DemoNote {
  slug: string;
  title: string;
  file: string;
  figure: CreateFigureInput;
}

/** An irregular pentagon (no mirror symmetry), so the degeneracy point is not fixed by symmetry. */
const PENTAGON: [number, number][] = [
  [-1, -0.8],
  [0.9, -0.95],
  [1.15, 0.35],
  [0.1, 1.05],
  [-0.95, 0.55],
];

export const DEMO_NOTES: DemoNote[] = [
  {
    slug: 'spectral-flow',
    title: 'Spectral flow of an off-centre flux tube',
    file: 'spectral-flow.mdx',
    figure: {
      label: 'spectral-flow',
      kind: 'flux-sweep',
      title: 'Levels of the unit disk versus the flux of one tube',
      caption: 'Lowest six levels of the unit disk as the flux of a tube at (0.25, 0) goes from 0 to 1 flux quantum.',
      params: {
        task: 'flux-sweep',
        well: { disk: { center: [0, 0], radius: 1 } },
        grid: { h: 1 / 16 },
        tubes: [{ at: [0.25, 0], alpha: 0 }],
        sweep: { tube: 0, from: 0, to: 1, steps: 41 },
        levels: 6,
      },
    },
  },
  {
    slug: 'gap-map',
    title: 'A forced degeneracy in a pentagonal well',
    file: 'gap-map.mdx',
    figure: {
      label: 'gap-map',
      kind: 'degeneracy',
      title: 'Gap between the two lowest levels versus the position of a half tube',
      caption: 'Gap E1 - E0 over the positions of a half tube in an irregular pentagon, with the degeneracy point found.',
      params: {
        task: 'degeneracy',
        well: { polygon: { points: PENTAGON } },
        grid: { h: 0.1 },
        tubes: [],
        moving: { alpha: 0.5 },
      },
    },
  },
  {
    slug: 'loop-phase',
    title: 'The phase picked up by a carried tube',
    file: 'loop-phase.mdx',
    figure: {
      label: 'loop-phase',
      kind: 'holonomy',
      title: 'Phase of the ground state after carrying a tube around the disk',
      caption: 'A tube of flux 0.3 carried counter-clockwise on a circle of radius 1.3 around the unit disk.',
      params: {
        task: 'holonomy',
        well: { disk: { center: [0, 0], radius: 1 } },
        grid: { h: 1 / 16 },
        tubes: [],
        moving: { alpha: 0.3 },
        loop: { circle: { center: [0, 0], radius: 1.3 } },
        level: 0,
      },
    },
  },
  {
    slug: 'nodal-lines',
    title: 'Nodal lines ending on a half tube',
    file: 'nodal-lines.mdx',
    figure: {
      label: 'nodal-lines',
      kind: 'nodal-lines',
      title: 'Sign of the second state of a stadium with a half tube',
      caption: 'Sign of the first excited state of a stadium well with a half tube at (0.35, 0.2), and its nodal lines.',
      params: {
        task: 'nodal-lines',
        well: { stadium: { center: [0, 0], length: 1, radius: 0.8, angle: 0 } },
        grid: { h: 0.05 },
        tubes: [{ at: [0.35, 0.2], alpha: 0.5 }],
        level: 1,
      },
    },
  },
];

/** The MDX source of a demo note, checked by the same safety gate as notes saved in the browser. */
async function demoSource(file: string): Promise<string> {
  const source = readFileSync(fileURLToPath(new URL(file, NOTES_DIR)), 'utf8');
  const check = await checkNoteSource(source);
  if (!check.ok) throw new Error(`content/demo-notes/${file} is refused: ${check.errors.map((e) => e.message).join('; ')}`);
  return source;
}

/**
 * Seed the demo notes into a manuscript: for each, create the figure, compute it with the real solver (in this
 * process, no queue), freeze the run as v1 and create the note. Idempotent: a figure or note that already exists
 * (by label or slug) is left as it is, and a figure that already has a snapshot is not frozen again.
 *
 * @param db - the database to seed (the seed's own connection)
 * @param manuscriptId - the demo manuscript
 * @param authorId - the demo author, recorded as creator, run starter and freezer
 * @example
 * await seedFigureNotes({ db, manuscriptId: manuscript.id, authorId: author.id });
 */
export async function seedFigureNotes({
  db,
  manuscriptId,
  authorId,
  log = (line: string) => console.log(line),
}: {
  db: Db;
  manuscriptId: string;
  authorId: string;
  log?: (line: string) => void;
}): Promise<{ notes: number; snapshots: number }> {
  const user = { id: authorId };
  let notes = 0;
  let snapshots = 0;
  for (const demo of DEMO_NOTES) {
    const source = await demoSource(demo.file);
    let figure = await getFigureByLabel({ manuscriptId, label: demo.figure.label, database: db });
    if (!figure) {
      figure = await createFigure({ manuscriptId, input: createFigureSchema.parse(demo.figure), userId: authorId, database: db });
    }
    if (!(await getLatestSnapshot({ figureId: figure.id, database: db }))) {
      const started = Date.now();
      const { run, fromCache } = await startRun({ figure, user, database: db, enqueue: null });
      if (!fromCache) {
        const outcome = await executeRun(run.id, { database: db, canRetry: false });
        if (outcome.status !== 'succeeded') {
          throw new Error(`demo figure "${demo.figure.label}" did not compute: ${outcome.status === 'failed' ? outcome.error : outcome.status}`);
        }
      }
      const snapshot = await freezeRun({ runId: run.id, user, database: db });
      snapshots += 1;
      log(`[seed] figure ${demo.figure.label}: computed in ${((Date.now() - started) / 1000).toFixed(1)} s, frozen as v${snapshot.version}`);
    }
    if (!(await getNoteBySlug({ manuscriptId, slug: demo.slug, database: db }))) {
      await createNote({ manuscriptId, title: demo.title, slug: demo.slug, slugIsExplicit: true, source, userId: authorId, database: db });
      notes += 1;
    }
  }
  return { notes, snapshots };
}
