// The member list (SWR, GET /api/manuscripts/[id]/members). Owners change roles and remove members;
// anyone may leave. The server refuses to leave a manuscript without an owner, and the message is shown.
'use client';

import { useRouter } from 'next/navigation';
import type { MemberRole } from '@/db/schema';
import { useMembers } from '@/app/_hooks/use-members';
import type { MembersResponse } from '@/lib/api-types';
import { ROLE_LABELS, ROLES } from '@/lib/authz/roles';
import { ApiError, sendJson } from '@/lib/fetcher';
import { RoleBadge } from '../../_components/badges';
import { Card } from '../../_components/card';
import { ConfirmButton } from '../../_components/confirm-button';
import { FormAlert } from '../../_components/form-alert';
import { useToast } from '../../_components/toaster';

export function MembersPanel({
  manuscriptId,
  currentUserId,
  canManage,
  isMember,
  initial,
}: {
  manuscriptId: string;
  currentUserId: string;
  canManage: boolean;
  isMember: boolean;
  /** The list as the page loaded it (the hook's fallback). */
  initial?: MembersResponse;
}) {
  const router = useRouter();
  const toast = useToast();
  const { members, error, isLoading, mutate } = useMembers(manuscriptId, initial);

  async function changeRole(userId: string, role: MemberRole) {
    try {
      await sendJson(`/api/manuscripts/${manuscriptId}/members/${userId}`, { method: 'PATCH', body: { role } });
      toast(`Role changed to ${ROLE_LABELS[role].toLowerCase()}`);
      if (userId === currentUserId) router.refresh();
    } catch (caught) {
      toast(caught instanceof ApiError ? caught.message : 'The role could not be changed', 'error');
    } finally {
      await mutate();
    }
  }

  async function remove(userId: string) {
    try {
      await sendJson(`/api/manuscripts/${manuscriptId}/members/${userId}`, { method: 'DELETE' });
      if (userId === currentUserId) {
        toast('You left the manuscript');
        router.push('/dashboard');
        return;
      }
      toast('Member removed');
      await mutate();
    } catch (caught) {
      toast(caught instanceof ApiError ? caught.message : 'The member could not be removed', 'error');
    }
  }

  return (
    <Card title="Members" id="members" className="min-w-0 self-start">
      {error && <FormAlert>{error.message}</FormAlert>}
      {isLoading && !members && (
        <ul className="space-y-3" aria-busy="true" aria-label="Loading members">
          {[0, 1, 2].map((index) => (
            <li key={index} className="h-10 animate-pulse rounded-lg bg-slate-100" />
          ))}
        </ul>
      )}
      {members && (
        <ul className="divide-y divide-slate-100" data-testid="members">
          {members.map((member) => {
            const self = member.userId === currentUserId;
            const display = member.name || member.email;
            return (
              <li key={member.userId} className="py-3 first:pt-0 last:pb-0" data-testid="member" data-email={member.email}>
                <div className="flex items-start justify-between gap-3">
                  <div className="min-w-0">
                    <p className="truncate text-sm font-medium text-slate-900">
                      {display}
                      {self && <span className="ml-1 text-xs font-normal text-slate-500">(you)</span>}
                    </p>
                    {member.name && <p className="truncate text-xs text-slate-500">{member.email}</p>}
                  </div>
                  {!canManage && <RoleBadge role={member.role} />}
                </div>
                {canManage && (
                  <div className="mt-2 flex flex-wrap items-center gap-2">
                    <label className="sr-only" htmlFor={`role-${member.userId}`}>
                      Role of {display}
                    </label>
                    <select
                      id={`role-${member.userId}`}
                      value={member.role}
                      onChange={(event) => changeRole(member.userId, event.target.value as MemberRole)}
                      className="h-8 rounded-lg border-0 bg-white py-0 pr-8 pl-2 text-sm text-slate-800 ring-1 ring-slate-300 ring-inset focus:ring-2 focus:ring-flux-600 focus:outline-none"
                      data-testid="member-role-select"
                    >
                      {ROLES.map((role) => (
                        <option key={role} value={role}>
                          {ROLE_LABELS[role]}
                        </option>
                      ))}
                    </select>
                    <ConfirmButton
                      question={self ? 'Leave?' : `Remove ${display}?`}
                      confirmLabel={self ? 'Leave' : 'Remove'}
                      onConfirm={() => remove(member.userId)}
                      testId="remove-member"
                    >
                      {self ? 'Leave' : 'Remove'}
                    </ConfirmButton>
                  </div>
                )}
                {!canManage && self && isMember && (
                  <div className="mt-2">
                    <ConfirmButton question="Leave this manuscript?" confirmLabel="Leave" onConfirm={() => remove(member.userId)} variant="secondary" testId="leave">
                      Leave
                    </ConfirmButton>
                  </div>
                )}
              </li>
            );
          })}
        </ul>
      )}
    </Card>
  );
}
