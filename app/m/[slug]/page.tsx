// A manuscript's overview: title, status, abstract and members for every member; the details form for authors
// and owners; invitations, role changes, archive and delete for owners.
import type { Metadata } from 'next';
import { listPendingInvitations } from '@/db/queries/invitations';
import { listMembers } from '@/db/queries/members';
import type { MembersBody, PendingInvitationsBody } from '@/lib/api-types';
import { ROLE_LABELS, ROLE_RIGHTS_FOR_YOU } from '@/lib/authz/roles';
import { toJson } from '@/lib/to-json';
import { AdminBadge, ArchivedBadge, RoleBadge, StatusBadge } from '../../_components/badges';
import { Card } from '../../_components/card';
import { RelativeTime } from '../../_components/relative-time';
import { DetailsForm } from './details-form';
import { InvitePanel } from './invite-panel';
import { loadManuscriptPage } from './load-manuscript';
import { ManuscriptTabs } from './manuscript-tabs';
import { MembersPanel } from './members-panel';
import { OwnerActions } from './owner-actions';

type Props = { params: Promise<{ slug: string }> };

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const { slug } = await params;
  const { detail } = await loadManuscriptPage(slug);
  return { title: detail.manuscript.title };
}

export default async function ManuscriptPage({ params }: Props) {
  const { slug } = await params;
  const { user, detail } = await loadManuscriptPage(slug);
  const { manuscript, permissions } = detail;
  const archived = manuscript.archivedAt !== null;
  // The lists the panels' hooks follow, loaded here so their first render needs no request.
  const [members, invitations] = await Promise.all([
    listMembers({ manuscriptId: manuscript.id }),
    permissions.manage ? listPendingInvitations({ manuscriptId: manuscript.id }) : null,
  ]);

  return (
    <div className="space-y-8">
      <header className="space-y-4">
        <div className="flex flex-wrap items-center gap-2">
          <StatusBadge status={manuscript.status} />
          {archived && <ArchivedBadge />}
          {detail.memberRole && <RoleBadge role={detail.memberRole} />}
          {detail.viaAdmin && <AdminBadge />}
        </div>
        <h1 className="text-2xl font-semibold tracking-tight text-balance text-slate-900 sm:text-3xl" data-testid="manuscript-title">
          {manuscript.title}
        </h1>
        <p className="text-xs text-slate-500">
          Started <RelativeTime iso={manuscript.createdAt} /> · last change <RelativeTime iso={manuscript.updatedAt} />
        </p>
        {detail.memberRole && (
          <p className="text-sm text-slate-600" data-testid="my-rights">
            As {ROLE_LABELS[detail.memberRole].toLowerCase()}, you {ROLE_RIGHTS_FOR_YOU[detail.memberRole]}.
          </p>
        )}
        {detail.viaAdmin && (
          <p className="rounded-lg bg-phase-100 px-3 py-2 text-sm text-phase-700 ring-1 ring-phase-300 ring-inset">
            You are not a member of this manuscript; as a site admin you see it and may act as its owner.
          </p>
        )}
        {archived && (
          <p className="rounded-lg bg-slate-100 px-3 py-2 text-sm text-slate-700 ring-1 ring-slate-200 ring-inset">
            This manuscript is archived: it can be read, but not changed until an owner restores it.
          </p>
        )}
        <ManuscriptTabs slug={manuscript.slug} active="" permissions={permissions} />
      </header>

      <div className="grid grid-cols-[minmax(0,1fr)] gap-6 lg:grid-cols-[minmax(0,1fr)_22rem]">
        <div className="space-y-6">
          <Card title="Abstract" id="abstract">
            {manuscript.abstract ? (
              <p className="text-sm leading-relaxed whitespace-pre-line text-slate-700" data-testid="abstract">
                {manuscript.abstract}
              </p>
            ) : (
              <p className="text-sm text-slate-500 italic">No abstract yet.</p>
            )}
          </Card>
          {permissions.edit && (
            <Card title="Edit details" description="Title, abstract and status, seen by every member." id="details">
              <DetailsForm manuscript={manuscript} />
            </Card>
          )}
          {permissions.manage && (
            <Card title="Invite someone" description="They receive a link by e-mail that signs them up into the role you choose." id="invite">
              <InvitePanel manuscriptId={manuscript.id} initial={toJson({ invitations: invitations ?? [] } satisfies PendingInvitationsBody)} />
            </Card>
          )}
          {permissions.manage && (
            <OwnerActions manuscript={manuscript} snapshotCount={detail.snapshotCount} canDelete={permissions.delete} />
          )}
        </div>
        <MembersPanel
          manuscriptId={manuscript.id}
          currentUserId={user.id}
          canManage={permissions.manage}
          isMember={detail.memberRole !== null}
          initial={toJson({ members } satisfies MembersBody)}
        />
      </div>
    </div>
  );
}
