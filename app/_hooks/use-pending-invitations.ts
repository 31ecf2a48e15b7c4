// SWR hook: the pending invitations of one manuscript (owners only), from GET /api/manuscripts/[id]/invitations.
// The invite form calls the returned `mutate` after sending an invitation.
'use client';

import useSWR from 'swr';
import type { PendingInvitationsResponse } from '@/lib/api-types';
import { fetcher, type ApiError } from '@/lib/fetcher';

export function pendingInvitationsKey(manuscriptId: string): string {
  return `/api/manuscripts/${manuscriptId}/invitations`;
}

/** `fallback` is the page's server-loaded list: the first render then issues no request (mutations revalidate). */
export function usePendingInvitations(manuscriptId: string, fallback?: PendingInvitationsResponse) {
  const { data, error, isLoading, mutate } = useSWR<PendingInvitationsResponse, ApiError>(pendingInvitationsKey(manuscriptId), fetcher, {
    fallbackData: fallback,
    revalidateOnMount: fallback === undefined,
    revalidateIfStale: fallback === undefined,
  });
  return { invitations: data?.invitations, error, isLoading, mutate };
}
