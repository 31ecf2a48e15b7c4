// SWR hook: the signed-in user's manuscripts (or, for site admins, every manuscript) from GET /api/manuscripts.
// The key helper lets mutations elsewhere refresh the same list (`mutate(manuscriptsKey())`).
'use client';

import useSWR from 'swr';
import type { ManuscriptsResponse } from '@/lib/api-types';
import { fetcher, type ApiError } from '@/lib/fetcher';

export function manuscriptsKey(scope: 'mine' | 'all' = 'mine'): string {
  return scope === 'all' ? '/api/manuscripts?scope=all' : '/api/manuscripts';
}

export function useManuscripts(scope: 'mine' | 'all' = 'mine') {
  const { data, error, isLoading, mutate } = useSWR<ManuscriptsResponse, ApiError>(
    manuscriptsKey(scope),
    fetcher,
  );
  return { manuscripts: data?.manuscripts, error, isLoading, mutate };
}
