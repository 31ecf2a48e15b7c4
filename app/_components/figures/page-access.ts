// Access check for the figure-notes pages (server only): the signed-in user and their role on a manuscript by slug,
// through the one authorisation helper. No session -> sign-in; not a member / unknown -> 404; too low a role -> 403 page.
import { notFound, redirect } from 'next/navigation';
import { getCurrentUser, type CurrentUser } from '@/lib/auth/session';
import {
  allowedActions,
  authorizeManuscript,
  type ManuscriptAccess,
  type ManuscriptAction,
} from '@/lib/authz/manuscript-access';
import { isDomainError } from '@/lib/domain-error';

export interface PageAccess extends ManuscriptAccess {
  user: CurrentUser;
  /** What the caller may do here (to show or hide controls; handlers check again). */
  can: Record<ManuscriptAction, boolean>;
}

/**
 * Resolve a manuscript page for the current user, or leave the page: redirect to sign-in without a session,
 * `notFound()` for unknown or foreign manuscripts (the same answer, as in the API), and an error for 403/409.
 *
 * @example
 * const { manuscript, can } = await requireManuscriptPage({ slug, need: 'read', next: `/m/${slug}/notes` });
 */
export async function requireManuscriptPage({
  slug,
  need,
  next,
  deniedRedirect,
}: {
  slug: string;
  need: ManuscriptAction;
  next: string;
  /** Where a member whose role is too low is sent (e.g. the read-only view of an editor page). */
  deniedRedirect?: string;
}): Promise<PageAccess> {
  const user = await getCurrentUser();
  if (!user) redirect(`/sign-in?callbackUrl=${encodeURIComponent(next)}`);
  try {
    const access = await authorizeManuscript({ user, slug, need });
    return { ...access, user, can: allowedActions(access.role, access.manuscript.archivedAt !== null) };
  } catch (error) {
    if (isDomainError(error, 'not-found')) notFound();
    if ((isDomainError(error, 'forbidden') || isDomainError(error, 'conflict')) && deniedRedirect) redirect(deniedRedirect);
    throw error;
  }
}
