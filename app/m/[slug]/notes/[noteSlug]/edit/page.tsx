// Editing a figure note (authors and owners): the editor with live preview, figure-block picker and history.
// Only authors and owners reach it; coauthors are sent back to the rendered note.
import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { listFiguresByManuscript } from '@/db/queries/figures';
import { getNoteBySlug } from '@/db/queries/notes';
import { listSnapshotsByManuscript } from '@/db/queries/snapshots';
import { requireManuscriptPage } from '../../../../../_components/figures/page-access';
import { SectionHeader } from '../../../../../_components/figures/section-header';
import { NoteEditor } from './note-editor';

type Props = { params: Promise<{ slug: string; noteSlug: string }> };

export const metadata: Metadata = { title: 'Edit note' };

export default async function EditNotePage({ params }: Props) {
  const { slug, noteSlug } = await params;
  const { manuscript } = await requireManuscriptPage({ slug, need: 'edit', next: `/m/${slug}/notes/${noteSlug}/edit`, deniedRedirect: `/m/${slug}/notes/${noteSlug}` });
  const note = await getNoteBySlug({ manuscriptId: manuscript.id, slug: noteSlug });
  if (!note) notFound();
  const [figures, snapshots] = await Promise.all([
    listFiguresByManuscript({ manuscriptId: manuscript.id }),
    listSnapshotsByManuscript({ manuscriptId: manuscript.id }),
  ]);
  const pickable = figures.map((f) => ({
    label: f.label,
    title: f.title,
    kind: f.kind,
    versions: snapshots.filter((s) => s.figureId === f.id).map((s) => s.version).sort((a, b) => a - b),
  }));
  return (
    <div>
      <SectionHeader manuscript={manuscript} section="notes" title={`Editing: ${note.title}`} />
      <NoteEditor
        note={{ id: note.id, title: note.title, source: note.source, revision: note.revision, slug: note.slug }}
        manuscript={{ id: manuscript.id, slug: manuscript.slug }}
        figures={pickable}
      />
    </div>
  );
}
