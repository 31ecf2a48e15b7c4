// Authorisation of figure, run, snapshot and note ids: load the row, then ask the one manuscript helper about its
// manuscript. An unknown id and a foreign one give the same not-found, so ids of other groups' work reveal nothing.
import { getFigureById } from '@/db/queries/figures';
import { getNoteById } from '@/db/queries/notes';
import { getRunById } from '@/db/queries/runs';
import { getSnapshotById } from '@/db/queries/snapshots';
import type { Figure, Note, Run, Snapshot } from '@/db/schema';
import type { CurrentUser } from '@/lib/auth/session';
import { authorizeManuscript, type ManuscriptAccess, type ManuscriptAction } from '@/lib/authz/manuscript-access';
import { isDomainError, notFound, unauthenticated } from '@/lib/domain-error';

type Caller = Pick<CurrentUser, 'id' | 'isAdmin'> | null;

/** Ask the manuscript helper, answering its not-found with the resource's own not-found message. */
async function authorizeVia(user: Caller, manuscriptId: string, need: ManuscriptAction, missing: string): Promise<ManuscriptAccess> {
  try {
    return await authorizeManuscript({ user, manuscriptId, need });
  } catch (error) {
    if (isDomainError(error, 'not-found')) throw notFound(missing);
    throw error;
  }
}

/**
 * A figure and the caller's access to its manuscript.
 *
 * @throws DomainError `unauthenticated` without a session, `not-found` for an unknown or foreign figure, `forbidden`
 *   when the role is too low
 */
export async function authorizeFigure({
  user,
  figureId,
  need,
}: {
  user: Caller;
  figureId: string;
  need: ManuscriptAction;
}): Promise<{ figure: Figure; access: ManuscriptAccess }> {
  if (!user) throw unauthenticated();
  const figure = await getFigureById({ id: figureId });
  if (!figure) throw notFound('Figure not found');
  return { figure, access: await authorizeVia(user, figure.manuscriptId, need, 'Figure not found') };
}

/** A run, its figure and the caller's access (same errors as {@link authorizeFigure}, not-found "Run not found"). */
export async function authorizeRun({
  user,
  runId,
  need,
}: {
  user: Caller;
  runId: string;
  need: ManuscriptAction;
}): Promise<{ run: Run; figure: Figure; access: ManuscriptAccess }> {
  if (!user) throw unauthenticated();
  const run = await getRunById({ id: runId });
  const figure = run ? await getFigureById({ id: run.figureId }) : null;
  if (!run || !figure) throw notFound('Run not found');
  return { run, figure, access: await authorizeVia(user, figure.manuscriptId, need, 'Run not found') };
}

/** A snapshot and the caller's access (not-found "Snapshot not found" for unknown or foreign ids). */
export async function authorizeSnapshot({
  user,
  snapshotId,
  need,
}: {
  user: Caller;
  snapshotId: string;
  need: ManuscriptAction;
}): Promise<{ snapshot: Snapshot; access: ManuscriptAccess }> {
  if (!user) throw unauthenticated();
  const snapshot = await getSnapshotById({ id: snapshotId });
  if (!snapshot) throw notFound('Snapshot not found');
  return { snapshot, access: await authorizeVia(user, snapshot.manuscriptId, need, 'Snapshot not found') };
}

/** A note and the caller's access (not-found "Note not found" for unknown or foreign ids). */
export async function authorizeNote({
  user,
  noteId,
  need,
}: {
  user: Caller;
  noteId: string;
  need: ManuscriptAction;
}): Promise<{ note: Note; access: ManuscriptAccess }> {
  if (!user) throw unauthenticated();
  const note = await getNoteById({ id: noteId });
  if (!note) throw notFound('Note not found');
  return { note, access: await authorizeVia(user, note.manuscriptId, need, 'Note not found') };
}
