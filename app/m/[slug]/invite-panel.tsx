// Owners' invite form (POST /api/manuscripts/[id]/members) and the list of invitations still pending.
// Shown only to owners (and site admins acting as owners).
'use client';

import { useState } from 'react';
import { usePendingInvitations } from '@/app/_hooks/use-pending-invitations';
import type { PendingInvitationsResponse } from '@/lib/api-types';
import { ROLE_DESCRIPTIONS, ROLE_LABELS, ROLES } from '@/lib/authz/roles';
import { sendJson } from '@/lib/fetcher';
import { MAX_EMAIL } from '@/lib/validations/common';
import { createInvitationSchema } from '@/lib/validations/invitation';
import { RoleBadge } from '../../_components/badges';
import { Button } from '../../_components/button';
import { SelectField, TextField } from '../../_components/field';
import { FormAlert } from '../../_components/form-alert';
import { RelativeTime } from '../../_components/relative-time';
import { useToast } from '../../_components/toaster';
import { useJsonForm } from '../../_components/use-json-form';

export function InvitePanel({
  manuscriptId,
  initial,
}: {
  manuscriptId: string;
  /** The pending invitations as the page loaded them (the hook's fallback). */
  initial?: PendingInvitationsResponse;
}) {
  const toast = useToast();
  const { invitations, mutate } = usePendingInvitations(manuscriptId, initial);
  const [role, setRole] = useState<(typeof ROLES)[number]>('coauthor');
  const { fields, message, busy, onSubmit } = useJsonForm(createInvitationSchema, async (data, form) => {
    await sendJson(`/api/manuscripts/${manuscriptId}/members`, { method: 'POST', body: data });
    toast(`Invitation sent to ${data.email}`);
    form.reset();
    setRole('coauthor');
    await mutate();
  });

  return (
    <div className="space-y-6">
      <form onSubmit={onSubmit} noValidate className="space-y-4" data-testid="invite-form">
        {message && <FormAlert>{message}</FormAlert>}
        <div className="grid gap-4 sm:grid-cols-[minmax(0,1fr)_12rem]">
          <TextField
            label="E-mail address"
            name="email"
            type="email"
            autoComplete="off"
            maxLength={MAX_EMAIL}
            required
            errors={fields.email}
          />
          <SelectField
            label="Role"
            name="role"
            value={role}
            onChange={(event) => setRole(event.target.value as (typeof ROLES)[number])}
            errors={fields.role}
          >
            {ROLES.map((value) => (
              <option key={value} value={value}>
                {ROLE_LABELS[value]}
              </option>
            ))}
          </SelectField>
        </div>
        <p className="text-xs text-slate-500" aria-live="polite">
          {ROLE_LABELS[role]}: {ROLE_DESCRIPTIONS[role]}
        </p>
        <div className="flex justify-end">
          <Button type="submit" busy={busy}>
            Send invitation
          </Button>
        </div>
      </form>

      {invitations && invitations.length > 0 && (
        <div>
          <h3 className="text-sm font-semibold text-slate-900">Waiting for an answer</h3>
          <ul className="mt-2 divide-y divide-slate-100" data-testid="pending-invitations">
            {invitations.map((invitation) => (
              <li key={invitation.id} className="flex flex-wrap items-center justify-between gap-2 py-2 text-sm">
                <span className="min-w-0 truncate text-slate-800">{invitation.email}</span>
                <span className="flex items-center gap-2 text-xs text-slate-500">
                  <RoleBadge role={invitation.role} />
                  expires <RelativeTime iso={invitation.expiresAt} />
                </span>
              </li>
            ))}
          </ul>
        </div>
      )}
    </div>
  );
}
