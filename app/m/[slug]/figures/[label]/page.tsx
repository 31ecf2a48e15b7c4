// A figure's page: its latest result and runs, snapshots, parameters with a to-scale drawing, caption and view.
// Everyone in the manuscript reads it; authors and owners edit and run.
import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { getFigureByLabel } from '@/db/queries/figures';
import { listMembers } from '@/db/queries/members';
import { listSnapshotsByFigure } from '@/db/queries/snapshots';
import { getUserById } from '@/db/queries/users';
import { KIND_LABELS, type FigureKind } from '@/lib/figure-kinds/registry';
import { DisplayUnitsProvider } from '../../../../_components/figures/display-units';
import { requireManuscriptPage } from '../../../../_components/figures/page-access';
import { SectionHeader } from '../../../../_components/figures/section-header';
import { loadNoteFigure } from '../../../../_components/notes/load-note-figures';
import { FigureWorkbench } from './figure-workbench';

type Props = { params: Promise<{ slug: string; label: string }> };

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const { label } = await params;
  return { title: `Figure ${label}` };
}

export default async function FigurePage({ params }: Props) {
  const { slug, label } = await params;
  const { manuscript, can } = await requireManuscriptPage({ slug, need: 'read', next: `/m/${slug}/figures/${label}` });
  const figure = await getFigureByLabel({ manuscriptId: manuscript.id, label });
  if (!figure) notFound();
  const [loaded, snapshots] = await Promise.all([
    loadNoteFigure({ manuscriptId: manuscript.id, label, versions: [] }),
    listSnapshotsByFigure({ figureId: figure.id }),
  ]);
  if (!loaded) notFound();
  // Names of whoever froze a snapshot: the members, plus former members or admins who froze one.
  const frozenBy = new Map<string, string>();
  for (const member of await listMembers({ manuscriptId: manuscript.id })) frozenBy.set(member.userId, member.name ?? member.email);
  for (const id of new Set(snapshots.map((s) => s.frozenById).filter((x): x is string => !!x && !frozenBy.has(x)))) {
    const user = await getUserById({ id });
    if (user) frozenBy.set(id, user.name ?? user.email);
  }
  return (
    <DisplayUnitsProvider>
      <SectionHeader manuscript={manuscript} section="figures" title={figure.title || figure.label}>
        <p className="text-sm text-slate-600">
          <code className="rounded bg-slate-100 px-1 font-mono text-xs">{`<Figure label="${figure.label}" />`}</code> ·{' '}
          {KIND_LABELS[figure.kind as FigureKind] ?? figure.kind}
        </p>
      </SectionHeader>
      <FigureWorkbench
        figure={loaded.figure}
        manuscriptSlug={manuscript.slug}
        latestRun={loaded.latestRun}
        latestResult={loaded.latestResult}
        snapshots={snapshots.map((s) => ({
          id: s.id,
          version: s.version,
          frozenAt: s.frozenAt.toISOString(),
          frozenBy: s.frozenById ? (frozenBy.get(s.frozenById) ?? null) : null,
          resultHash: s.resultHash,
        }))}
        people={Object.fromEntries(frozenBy)}
        can={{ edit: can.edit, run: can.run }}
      />
    </DisplayUnitsProvider>
  );
}
