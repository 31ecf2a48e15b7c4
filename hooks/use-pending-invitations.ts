// SWR hook: the pending invitations of one manuscript (owners only), from GET /api/manuscripts/[id]/invitations.
// The invite form calls the returned `mutate` after sending an invitation.
'use client';

import useSWR from 'swr';
import type { PendingInvitationJson } from '@/lib/api-types';
import { fetcher, type ApiError } from '@/lib/fetcher';

export function pendingInvitationsKey(manuscriptId: string): string {
  return `/api/manuscripts/${manuscriptId}/invitations`;
}

export function usePendingInvitations(manuscriptId: string) {
  const { data, error, isLoading, mutate } = useSWR<{ invitations: PendingInvitationJson[] }, ApiError>(
    pendingInvitationsKey(manuscriptId),
    fetcher,
  );
  return { invitations: data?.invitations, error, isLoading, mutate };
}
