// SWR hook for one figure: GET /api/figures/[id] (the figure, its snapshots and its newest run), plus the
// update mutation (PATCH) used by the parameter form, the caption and the view-spec editor.
'use client';

import useSWR from 'swr';
import type { FigurePatch, FigureResponse, UpdateFigureResponse } from '@/lib/api-types';
import { fetcher, sendJson, type ApiError } from '@/lib/fetcher';

export function figureKey(figureId: string): string {
  return `/api/figures/${figureId}`;
}

/**
 * Follow one figure; `fallback` is the server-rendered state, so the first render issues no request (it is revalidated
 * after a mutation, not on mount).
 *
 * @example
 * const { data, mutate } = useFigure(figure.id, initial);
 */
export function useFigure(figureId: string, fallback?: FigureResponse) {
  return useSWR<FigureResponse, ApiError>(figureKey(figureId), fetcher, {
    fallbackData: fallback,
    revalidateOnMount: fallback === undefined,
    revalidateIfStale: fallback === undefined,
    revalidateOnFocus: false,
  });
}

/** Save changes to a figure (PATCH /api/figures/[id]); per-field errors come back in ApiError.fields. */
export function updateFigure(figureId: string, patch: FigurePatch): Promise<UpdateFigureResponse> {
  return sendJson(figureKey(figureId), { method: 'PATCH', body: patch });
}
