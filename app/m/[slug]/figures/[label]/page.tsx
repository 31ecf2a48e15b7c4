// A figure's page: its latest result and runs, snapshots, parameters with a to-scale drawing, caption and view.
// Everyone in the manuscript reads it; authors and owners edit and run.
import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { getFigureByLabel } from '@/db/queries/figures';
import { listMembers } from '@/db/queries/members';
import { getLatestRun } from '@/db/queries/runs';
import { listSnapshotsByFigure } from '@/db/queries/snapshots';
import { getUserById } from '@/db/queries/users';
import type { FigureBody } from '@/lib/api-types';
import { KIND_LABELS, type FigureKind } from '@/lib/figure-kinds/registry';
import { toJson } from '@/lib/to-json';
import { DisplayUnitsProvider } from '../../../../_components/figures/display-units';
import { requireManuscriptPage } from '../../../../_components/figures/page-access';
import { SectionHeader } from '../../../../_components/figures/section-header';
import { loadFigureBlock } from '../../../../_components/notes/load-note-figures';
import { FigureWorkbench } from './figure-workbench';

type Props = { params: Promise<{ slug: string; label: string }> };

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const { label } = await params;
  return { title: `Figure ${label}` };
}

export default async function FigurePage({ params }: Props) {
  const { slug, label } = await params;
  const { manuscript, can, role } = await requireManuscriptPage({ slug, need: 'read', next: `/m/${slug}/figures/${label}` });
  const figure = await getFigureByLabel({ manuscriptId: manuscript.id, label });
  if (!figure) notFound();
  // Each row is read once and passed on: to the block loader and, as GET /api/figures/[id] would send it, to the hook.
  const [snapshots, latestRun] = await Promise.all([listSnapshotsByFigure({ figureId: figure.id }), getLatestRun({ figureId: figure.id })]);
  const loaded = await loadFigureBlock({ figure, snapshots, latestRun, versions: [] });
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
        initial={toJson({ figure, snapshots, latestRun, role } satisfies FigureBody)}
        people={Object.fromEntries(frozenBy)}
        can={{ edit: can.edit, run: can.run }}
      />
    </DisplayUnitsProvider>
  );
}
