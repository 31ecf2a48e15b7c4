// Server-side loading of everything a note's figure blocks and citations show: each referenced figure, its snapshots,
// its newest run, the newest succeeded result, and the pinned snapshot results. Plain JSON, ready for client components.
import { getFigureByLabel } from '@/db/queries/figures';
import { getResultById } from '@/db/queries/results';
import { getLatestRun } from '@/db/queries/runs';
import { listSnapshotsByFigure } from '@/db/queries/snapshots';
import type { Figure, Run, Snapshot } from '@/db/schema';
import type { FigureView, NoteFigure, NoteFigureData, PinnedView, RunView } from '@/lib/api-types';
import { extractFigureRefs } from '@/lib/mdx/compile-note';

/** A run row as {@link RunView}. */
export function runView(run: Run): RunView {
  return {
    id: run.id,
    figureId: run.figureId,
    status: run.status,
    progress: run.progress,
    message: run.message,
    error: run.error,
    fromCache: run.fromCache,
    createdAt: run.createdAt.toISOString(),
    finishedAt: run.finishedAt ? run.finishedAt.toISOString() : null,
    params: run.params,
  };
}

/** A figure row as {@link FigureView}. */
export function figureView(figure: Pick<Figure, 'id' | 'label' | 'kind' | 'title' | 'caption' | 'params' | 'viewSpec'>): FigureView {
  return {
    id: figure.id,
    label: figure.label,
    kind: figure.kind,
    title: figure.title,
    caption: figure.caption,
    params: figure.params,
    viewSpec: (figure.viewSpec as Record<string, unknown> | null) ?? null,
  };
}

/**
 * Everything one figure block needs, from rows already loaded: the figure, its snapshots and its newest run.
 *
 * @param versions - snapshot versions to load with their data (pinned blocks)
 */
export async function loadFigureBlock({
  figure,
  snapshots,
  latestRun,
  versions,
}: {
  figure: Figure;
  snapshots: Snapshot[];
  latestRun: Run | null;
  versions: number[];
}): Promise<NoteFigure> {
  const latestOk = latestRun?.status === 'succeeded' ? latestRun : await getLatestRun({ figureId: figure.id, statuses: ['succeeded'] });
  let latestResult: NoteFigure['latestResult'] = null;
  if (latestOk?.resultId) {
    const result = await getResultById({ id: latestOk.resultId });
    if (result) latestResult = { run: runView(latestOk), data: result.data, params: result.params };
  }
  const pinned: Record<number, PinnedView> = {};
  for (const version of versions) {
    const snapshot = snapshots.find((s) => s.version === version);
    if (!snapshot) continue;
    const result = await getResultById({ id: snapshot.resultId });
    if (!result) continue;
    pinned[version] = {
      snapshotId: snapshot.id,
      version,
      params: snapshot.params,
      caption: snapshot.caption,
      viewSpec: (snapshot.viewSpec as Record<string, unknown> | null) ?? null,
      data: result.data,
    };
  }
  return {
    figure: figureView(figure),
    snapshots: snapshots.map((s) => ({ id: s.id, version: s.version, frozenAt: s.frozenAt.toISOString() })),
    latestRun: latestRun ? runView(latestRun) : null,
    latestResult,
    pinned,
  };
}

/**
 * Everything one figure block needs, for a figure of the manuscript (null when no figure has that label).
 *
 * @param versions - snapshot versions to load with their data (pinned blocks)
 */
export async function loadNoteFigure({
  manuscriptId,
  label,
  versions,
}: {
  manuscriptId: string;
  label: string;
  versions: number[];
}): Promise<NoteFigure | null> {
  const figure = await getFigureByLabel({ manuscriptId, label });
  if (!figure) return null;
  const [snapshots, latestRun] = await Promise.all([listSnapshotsByFigure({ figureId: figure.id }), getLatestRun({ figureId: figure.id })]);
  return loadFigureBlock({ figure, snapshots, latestRun, versions });
}

/**
 * Load the figures a note refers to (Figure blocks and SnapshotRef citations). The source must already have passed
 * the safety check (it is parsed here).
 */
export async function loadNoteFigures({
  manuscriptId,
  manuscriptSlug,
  source,
}: {
  manuscriptId: string;
  manuscriptSlug: string;
  source: string;
}): Promise<NoteFigureData> {
  const refs = extractFigureRefs(source);
  const versionsByLabel = new Map<string, Set<number>>();
  for (const ref of refs) {
    const set = versionsByLabel.get(ref.label) ?? new Set<number>();
    if (ref.version !== null && ref.component === 'Figure') set.add(ref.version);
    versionsByLabel.set(ref.label, set);
  }
  const figures: Record<string, NoteFigure> = {};
  for (const [label, versions] of versionsByLabel) {
    const loaded = await loadNoteFigure({ manuscriptId, label, versions: [...versions] });
    if (loaded) figures[label] = loaded;
  }
  return { manuscriptId, manuscriptSlug, figures };
}
