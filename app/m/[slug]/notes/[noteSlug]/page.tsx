// A rendered figure note: MDX with KaTeX math compiled on the server through the safe gate, live figure blocks that
// follow their latest run or a pinned snapshot, and the display-units switch. Authors see the edit link and run controls.
import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { getNoteBySlug } from '@/db/queries/notes';
import { getUserById } from '@/db/queries/users';
import { renderableNote } from '@/lib/mdx/compile-note';
import { ButtonLink } from '../../../../_components/button';
import { RelativeTime } from '../../../../_components/relative-time';
import { DisplayUnitsProvider, DisplayUnitsSwitch } from '../../../../_components/figures/display-units';
import { requireManuscriptPage } from '../../../../_components/figures/page-access';
import { SectionHeader } from '../../../../_components/figures/section-header';
import { loadNoteFigures } from '../../../../_components/notes/load-note-figures';
import { liveNoteComponents } from '../../../../_components/notes/note-components';

type Props = { params: Promise<{ slug: string; noteSlug: string }> };

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const { slug, noteSlug } = await params;
  const { manuscript } = await requireManuscriptPage({ slug, need: 'read', next: `/m/${slug}/notes/${noteSlug}` });
  const note = await getNoteBySlug({ manuscriptId: manuscript.id, slug: noteSlug });
  return { title: note?.title ?? 'Figure note' };
}

export default async function NotePage({ params }: Props) {
  const { slug, noteSlug } = await params;
  const { manuscript, can } = await requireManuscriptPage({ slug, need: 'read', next: `/m/${slug}/notes/${noteSlug}` });
  const note = await getNoteBySlug({ manuscriptId: manuscript.id, slug: noteSlug });
  if (!note) notFound();
  const editor = note.updatedById ? await getUserById({ id: note.updatedById }) : null;

  let body: React.ReactNode;
  try {
    const data = await loadNoteFigures({ manuscriptId: manuscript.id, manuscriptSlug: manuscript.slug, source: note.source });
    const { Content } = await renderableNote(note.source);
    body = <Content components={liveNoteComponents(data, { canRun: can.run })} />;
  } catch (error) {
    // Saved notes passed the gate; a note that no longer compiles (e.g. after a gate change) is shown as a problem.
    body = (
      <p role="alert" className="rounded-md border border-red-200 bg-red-50 p-4 text-sm text-red-800">
        This note cannot be shown: {error instanceof Error ? error.message : String(error)}
      </p>
    );
  }

  return (
    <DisplayUnitsProvider>
      <SectionHeader
        manuscript={manuscript}
        section="notes"
        title={note.title}
        actions={
          can.edit ? (
            <ButtonLink href={`/m/${manuscript.slug}/notes/${note.slug}/edit`} variant="secondary" data-testid="edit-note">
              Edit note
            </ButtonLink>
          ) : null
        }
      >
        <div className="flex flex-wrap items-center justify-between gap-3">
          <p className="text-xs text-slate-500">
            Revision {note.revision} · saved <RelativeTime iso={note.updatedAt.toISOString()} />
            {editor ? ` by ${editor.name ?? editor.email}` : ''} ·{' '}
            <Link href={`/m/${manuscript.slug}/notes/${note.slug}/edit#history`} className="underline">
              history
            </Link>
          </p>
          <DisplayUnitsSwitch />
        </div>
      </SectionHeader>
      <article className="mx-auto max-w-3xl rounded-xl bg-white px-5 py-6 shadow-sm ring-1 ring-slate-200 sm:px-8" data-testid="note-body">
        {body}
      </article>
    </DisplayUnitsProvider>
  );
}
