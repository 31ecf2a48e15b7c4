// The figures of a manuscript: label, kind, newest run and snapshot count; authors create new figures here.
// Every member reads the list; the form beside it is shown to authors and owners only.
import type { Metadata } from 'next';
import Link from 'next/link';
import { listFiguresByManuscript } from '@/db/queries/figures';
import { getLatestRun } from '@/db/queries/runs';
import { listSnapshotsByManuscript } from '@/db/queries/snapshots';
import { Card } from '../../../_components/card';
import { ListBesideForm } from '../../../_components/figures/list-beside-form';
import { requireManuscriptPage } from '../../../_components/figures/page-access';
import { SectionHeader } from '../../../_components/figures/section-header';
import { KIND_LABELS, type FigureKind } from '@/lib/figure-kinds/registry';
import { NewFigureForm } from './new-figure-form';

type Props = { params: Promise<{ slug: string }> };

export const metadata: Metadata = { title: 'Figures' };

const STATUS_STYLE: Record<string, string> = {
  succeeded: 'bg-emerald-50 text-emerald-800',
  failed: 'bg-red-50 text-red-800',
  running: 'bg-flux-50 text-flux-800',
  queued: 'bg-slate-100 text-slate-700',
  cancelled: 'bg-slate-100 text-slate-600',
};

export default async function FiguresPage({ params }: Props) {
  const { slug } = await params;
  const { manuscript, can } = await requireManuscriptPage({ slug, need: 'read', next: `/m/${slug}/figures` });
  const [figures, snapshots] = await Promise.all([
    listFiguresByManuscript({ manuscriptId: manuscript.id }),
    listSnapshotsByManuscript({ manuscriptId: manuscript.id }),
  ]);
  const runs = await Promise.all(figures.map((f) => getLatestRun({ figureId: f.id })));
  return (
    <div>
      <SectionHeader manuscript={manuscript} section="figures" title="Figures" />
      <ListBesideForm
        label="Figures"
        testId="figure-list"
        empty={
          figures.length === 0
            ? { title: 'No figures yet', text: can.edit ? 'Create one with the form beside this list.' : 'Authors of this manuscript create the figures.' }
            : null
        }
        aside={
          can.edit ? (
            <Card title="New figure" description="Pick a kind; it starts with small, quick parameters you can change.">
              <NewFigureForm manuscriptId={manuscript.id} manuscriptSlug={manuscript.slug} />
            </Card>
          ) : null
        }
      >
        {figures.map((figure, k) => {
          const run = runs[k];
          const versions = snapshots.filter((s) => s.figureId === figure.id).length;
          return (
            <li key={figure.id} className="flex flex-wrap items-center justify-between gap-3 px-5 py-4">
              <div className="min-w-0">
                <Link
                  href={`/m/${manuscript.slug}/figures/${figure.label}`}
                  className="font-medium text-slate-900 hover:text-flux-800 hover:underline"
                >
                  {figure.title || figure.label}
                </Link>
                <p className="text-xs text-slate-500">
                  <code className="font-mono">{figure.label}</code> · {KIND_LABELS[figure.kind as FigureKind] ?? figure.kind}
                </p>
              </div>
              <div className="flex items-center gap-2 text-xs">
                {run ? <span className={`rounded-full px-2 py-0.5 ${STATUS_STYLE[run.status]}`}>last run {run.status}</span> : null}
                <span className="rounded-full bg-phase-100 px-2 py-0.5 text-phase-700">
                  {versions} snapshot{versions === 1 ? '' : 's'}
                </span>
              </div>
            </li>
          );
        })}
      </ListBesideForm>
    </div>
  );
}
