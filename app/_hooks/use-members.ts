// SWR hook: the members of one manuscript, from GET /api/manuscripts/[id]/members.
// Mutations (role change, removal) call the returned `mutate` to refresh the list.
'use client';

import useSWR from 'swr';
import type { MembersResponse } from '@/lib/api-types';
import { fetcher, type ApiError } from '@/lib/fetcher';

export function membersKey(manuscriptId: string): string {
  return `/api/manuscripts/${manuscriptId}/members`;
}

/** `fallback` is the page's server-loaded list: the first render then issues no request (mutations revalidate). */
export function useMembers(manuscriptId: string, fallback?: MembersResponse) {
  const { data, error, isLoading, mutate } = useSWR<MembersResponse, ApiError>(membersKey(manuscriptId), fetcher, {
    fallbackData: fallback,
    revalidateOnMount: fallback === undefined,
    revalidateIfStale: fallback === undefined,
  });
  return { members: data?.members, error, isLoading, mutate };
}
