// Everything the snapshot page shows, loaded in ONE function, so that its access check sits in one place:
// the snapshot, its manuscript and authors, who froze it, its result data, its sibling versions and its citations.
import { headers } from 'next/headers';
import { notFound, redirect } from 'next/navigation';
import { listMembers } from '@/db/queries/members';
import { getResultById } from '@/db/queries/results';
import { getSnapshotContext, listSnapshotsByFigure } from '@/db/queries/snapshots';
import type { SnapshotPageData } from '@/lib/api-types';
import { getCurrentUser } from '@/lib/auth/session';
import { latexFigureBlock, snapshotBibtex, snapshotCitation, type SnapshotCitationInput } from '@/lib/cite/citation';
import { isDomainError } from '@/lib/domain-error';
import { authorizeSnapshot } from '@/lib/runs/resource-access';

/** The app's public origin for stable URLs: APP_URL, NEXTAUTH_URL, else the request's host. */
async function publicOrigin(): Promise<string> {
  const configured = process.env.APP_URL || process.env.NEXTAUTH_URL;
  if (configured) return configured.replace(/\/+$/, '');
  const h = await headers();
  const host = h.get('x-forwarded-host') ?? h.get('host') ?? '127.0.0.1:3000';
  const proto = h.get('x-forwarded-proto') ?? 'http';
  return `${proto}://${host}`;
}

/**
 * Load a snapshot page for the signed-in reader (manuscript members; site admins). Unknown ids and foreign
 * manuscripts are a 404 page; no session redirects to sign-in.
 */
export async function loadSnapshotPage({ snapshotId }: { snapshotId: string }): Promise<SnapshotPageData> {
  if (!/^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i.test(snapshotId)) notFound();
  const user = await getCurrentUser();
  if (!user) redirect(`/sign-in?callbackUrl=${encodeURIComponent(`/s/${snapshotId}`)}`);
  try {
    await authorizeSnapshot({ user, snapshotId, need: 'read' });
  } catch (error) {
    if (isDomainError(error, 'not-found')) notFound();
    throw error;
  }
  const context = await getSnapshotContext({ id: snapshotId });
  if (!context) notFound();
  const { snapshot, manuscript } = context;
  const [result, siblings, members, origin] = await Promise.all([
    getResultById({ id: snapshot.resultId }),
    listSnapshotsByFigure({ figureId: snapshot.figureId }),
    listMembers({ manuscriptId: manuscript.id }),
    publicOrigin(),
  ]);
  if (!result) notFound();
  const url = `${origin}/s/${snapshot.id}`;
  const frozenBy = context.frozenBy?.name ?? null;
  const citeInput: SnapshotCitationInput = {
    manuscript: {
      slug: manuscript.slug,
      title: manuscript.title,
      // Every member is an author of the manuscript (owners first, as listMembers orders them).
      authors: members.map((m) => m.name ?? m.email),
    },
    figure: { label: snapshot.label, caption: snapshot.caption },
    snapshot: {
      version: snapshot.version,
      frozenAt: snapshot.frozenAt,
      resultHash: snapshot.resultHash,
      solverVersion: snapshot.solverVersion,
      gitCommit: snapshot.gitCommit,
      frozenBy,
    },
    url,
  };
  return {
    snapshot: {
      id: snapshot.id,
      version: snapshot.version,
      kind: snapshot.kind,
      label: snapshot.label,
      caption: snapshot.caption,
      params: snapshot.params,
      viewSpec: (snapshot.viewSpec as Record<string, unknown> | null) ?? null,
      solverVersion: snapshot.solverVersion,
      gitCommit: snapshot.gitCommit,
      resultHash: snapshot.resultHash,
      frozenAt: snapshot.frozenAt.toISOString(),
      runId: snapshot.runId,
    },
    manuscript,
    figureTitle: context.figureTitle,
    frozenBy,
    data: result.data,
    siblings: siblings.map((s) => ({ id: s.id, version: s.version })),
    url,
    citation: snapshotCitation(citeInput),
    bibtex: snapshotBibtex(citeInput),
    latex: { one: latexFigureBlock(citeInput), two: latexFigureBlock(citeInput, { width: 'two-column' }) },
  };
}
