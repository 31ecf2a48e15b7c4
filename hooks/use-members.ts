// SWR hook: the members of one manuscript, from GET /api/manuscripts/[id]/members.
// Mutations (role change, removal) call the returned `mutate` to refresh the list.
'use client';

import useSWR from 'swr';
import type { MemberJson } from '@/lib/api-types';
import { fetcher, type ApiError } from '@/lib/fetcher';

export function membersKey(manuscriptId: string): string {
  return `/api/manuscripts/${manuscriptId}/members`;
}

export function useMembers(manuscriptId: string, fallback?: MemberJson[]) {
  const { data, error, isLoading, mutate } = useSWR<{ members: MemberJson[] }, ApiError>(
    membersKey(manuscriptId),
    fetcher,
    fallback ? { fallbackData: { members: fallback } } : undefined,
  );
  return { members: data?.members, error, isLoading, mutate };
}
