// The figure notes of a manuscript: each note with its revision and last change; authors create new notes here.
// Every member reads the list; the form beside it is shown to authors and owners only.
import type { Metadata } from 'next';
import Link from 'next/link';
import { listNotesByManuscript } from '@/db/queries/notes';
import { Card } from '../../../_components/card';
import { RelativeTime } from '../../../_components/relative-time';
import { ListBesideForm } from '../../../_components/figures/list-beside-form';
import { requireManuscriptPage } from '../../../_components/figures/page-access';
import { SectionHeader } from '../../../_components/figures/section-header';
import { NewNoteForm } from './new-note-form';

type Props = { params: Promise<{ slug: string }> };

export const metadata: Metadata = { title: 'Figure notes' };

export default async function NotesPage({ params }: Props) {
  const { slug } = await params;
  const { manuscript, can } = await requireManuscriptPage({ slug, need: 'read', next: `/m/${slug}/notes` });
  const notes = await listNotesByManuscript({ manuscriptId: manuscript.id });
  return (
    <div>
      <SectionHeader manuscript={manuscript} section="notes" title="Figure notes" />
      <ListBesideForm
        label="Notes"
        testId="note-list"
        empty={
          notes.length === 0
            ? { title: 'No figure notes yet', text: can.edit ? 'Start one with the form beside this list.' : 'Authors of this manuscript write the notes.' }
            : null
        }
        asideClassName="space-y-6"
        aside={
          <>
            {can.edit ? (
              <Card title="New note" description="A title now; write the note in the editor next.">
                <NewNoteForm manuscriptId={manuscript.id} manuscriptSlug={manuscript.slug} />
              </Card>
            ) : null}
            <Card title="Writing notes">
              <p className="text-sm leading-6 text-slate-600">
                Notes are Markdown with LaTeX math and live figure blocks. See the{' '}
                <Link href="/guide" className="text-flux-700 underline">
                  guide for authors
                </Link>
                .
              </p>
            </Card>
          </>
        }
      >
        {notes.map((note) => (
          <li key={note.id} className="flex flex-wrap items-center justify-between gap-3 px-5 py-4">
            <div>
              <Link href={`/m/${manuscript.slug}/notes/${note.slug}`} className="font-medium text-slate-900 hover:text-flux-800 hover:underline">
                {note.title}
              </Link>
              <p className="text-xs text-slate-500">
                revision {note.revision} · changed <RelativeTime iso={note.updatedAt.toISOString()} />
              </p>
            </div>
            {can.edit ? (
              <Link href={`/m/${manuscript.slug}/notes/${note.slug}/edit`} className="text-sm text-flux-700 hover:underline">
                Edit
              </Link>
            ) : null}
          </li>
        ))}
      </ListBesideForm>
    </div>
  );
}
