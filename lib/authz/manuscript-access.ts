// THE authorisation helper for everything scoped to one manuscript: every route handler, server action and page
// asks it, with the action it wants to perform, and gets the manuscript and the caller's effective role, or a DomainError.
import type { Manuscript, MemberRole } from '@/db/schema';
import { getManuscriptById, getManuscriptBySlug } from '@/db/queries/manuscripts';
import { getMembership } from '@/db/queries/members';
import { conflict, forbidden, notFound, unauthenticated } from '@/lib/domain-error';
import { roleAtLeast } from './roles';

/**
 * The one table of manuscript-scoped actions: the least role that may perform each, and whether the action
 * changes content (refused while the manuscript is archived).
 */
export const MANUSCRIPT_ACTIONS = {
  /** See the manuscript, its members, notes, figures and snapshots. */
  read: { minimum: 'coauthor', changesContent: false },
  /** Comment on notes, figures and snapshots. */
  comment: { minimum: 'coauthor', changesContent: true },
  /** Edit the manuscript's details, its figure notes and figures. */
  edit: { minimum: 'author', changesContent: true },
  /** Start solver runs. */
  run: { minimum: 'author', changesContent: true },
  /** Freeze a succeeded run as the figure's next snapshot. */
  freeze: { minimum: 'author', changesContent: true },
  /** Invite, change roles, remove members, archive and restore. */
  manage: { minimum: 'owner', changesContent: false },
  /** Delete the manuscript (only while it has no frozen snapshot; checked by the query). */
  delete: { minimum: 'owner', changesContent: false },
} as const satisfies Record<string, { minimum: MemberRole; changesContent: boolean }>;

export type ManuscriptAction = keyof typeof MANUSCRIPT_ACTIONS;

/** The signed-in caller as the helper needs it. */
export interface Caller {
  id: string;
  isAdmin: boolean;
}

export interface ManuscriptAccess {
  manuscript: Manuscript;
  /** The caller's effective role: their membership role, or 'owner' for a site admin acting on any manuscript. */
  role: MemberRole;
  /** The caller's own membership role (null when the access comes from being a site admin). */
  memberRole: MemberRole | null;
  /** True when the effective role comes from being a site admin (admins read every manuscript and act as owner). */
  viaAdmin: boolean;
}

/** Which actions a role may perform (for showing or hiding controls; the server still asks {@link authorizeManuscript}). */
export function allowedActions(role: MemberRole | null, archived: boolean): Record<ManuscriptAction, boolean> {
  const result = {} as Record<ManuscriptAction, boolean>;
  for (const [action, rule] of Object.entries(MANUSCRIPT_ACTIONS) as [ManuscriptAction, (typeof MANUSCRIPT_ACTIONS)[ManuscriptAction]][]) {
    result[action] = roleAtLeast(role, rule.minimum) && !(archived && rule.changesContent);
  }
  return result;
}

/**
 * Decide a manuscript-scoped request.
 *
 * - no caller: throws `unauthenticated`;
 * - manuscript missing, or the caller is neither a member nor a site admin: throws `not-found` (the same answer,
 *   so that outsiders cannot learn which manuscripts exist);
 * - member whose role is below the action's minimum: throws `forbidden`;
 * - content-changing action on an archived manuscript: throws `conflict`.
 *
 * Site admins get the effective role 'owner' on every manuscript, or their own role if they are an owner already.
 *
 * @example
 * const { manuscript, role } = await authorizeManuscript({ user, manuscriptId: id, need: 'edit' });
 */
export async function authorizeManuscript({
  user,
  manuscriptId,
  slug,
  need,
}: {
  user: Caller | null | undefined;
  manuscriptId?: string;
  slug?: string;
  need: ManuscriptAction;
}): Promise<ManuscriptAccess> {
  if (!user) throw unauthenticated();
  const manuscript = manuscriptId
    ? await getManuscriptById({ id: manuscriptId })
    : slug
      ? await getManuscriptBySlug({ slug })
      : null;
  if (!manuscript) throw notFound('Manuscript not found');

  const membership = await getMembership({ manuscriptId: manuscript.id, userId: user.id });
  const memberRole = membership?.role ?? null;
  if (!memberRole && !user.isAdmin) throw notFound('Manuscript not found');

  const role: MemberRole = user.isAdmin ? 'owner' : (memberRole as MemberRole);
  const rule = MANUSCRIPT_ACTIONS[need];
  if (!roleAtLeast(role, rule.minimum)) {
    throw forbidden(`Only ${rule.minimum === 'owner' ? 'owners' : `${rule.minimum}s and above`} may do this`);
  }
  if (rule.changesContent && manuscript.archivedAt) {
    throw conflict('This manuscript is archived; an owner can restore it to make changes');
  }
  return { manuscript, role, memberRole, viaAdmin: user.isAdmin && memberRole !== 'owner' };
}
