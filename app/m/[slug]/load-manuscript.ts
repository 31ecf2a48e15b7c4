// Load a manuscript for a page under /m/[slug] through the authorisation helper: 401 redirects to sign-in,
// 404 (missing or not a member) shows the not-found page; the result is plain JSON for client components.
import { notFound, redirect } from 'next/navigation';
import { countSnapshotsForManuscript } from '@/db/queries/manuscripts';
import type { ManuscriptDetailJson } from '@/lib/api-types';
import { getCurrentUser, type CurrentUser } from '@/lib/auth/session';
import { allowedActions, authorizeManuscript } from '@/lib/authz/manuscript-access';
import { isDomainError } from '@/lib/domain-error';

export async function loadManuscriptPage(slug: string): Promise<{ user: CurrentUser; detail: ManuscriptDetailJson }> {
  const user = await getCurrentUser();
  if (!user) redirect(`/sign-in?callbackUrl=${encodeURIComponent(`/m/${slug}`)}`);
  try {
    const access = await authorizeManuscript({ user, slug, need: 'read' });
    const { manuscript } = access;
    const snapshotCount = await countSnapshotsForManuscript({ id: manuscript.id });
    return {
      user,
      detail: {
        manuscript: {
          id: manuscript.id,
          slug: manuscript.slug,
          title: manuscript.title,
          abstract: manuscript.abstract,
          status: manuscript.status,
          archivedAt: manuscript.archivedAt?.toISOString() ?? null,
          createdAt: manuscript.createdAt.toISOString(),
          updatedAt: manuscript.updatedAt.toISOString(),
        },
        role: access.role,
        memberRole: access.memberRole,
        viaAdmin: access.viaAdmin,
        snapshotCount,
        permissions: allowedActions(access.role, manuscript.archivedAt !== null),
      },
    };
  } catch (error) {
    if (isDomainError(error, 'not-found')) notFound();
    throw error;
  }
}
