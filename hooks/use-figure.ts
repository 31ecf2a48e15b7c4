// SWR hook for one figure: GET /api/figures/[id] (the figure, its snapshots and its newest run), plus the
// update mutation (PATCH) used by the parameter form, the caption and the view-spec editor.
'use client';

import useSWR from 'swr';
import { fetcher, sendJson, type ApiError } from '@/lib/fetcher';
import type { FigureView, RunView } from '@/app/_components/notes/load-note-figures';

export interface FigureSnapshotRow {
  id: string;
  version: number;
  frozenAt: string;
  params: unknown;
  resultHash: string;
  solverVersion: string;
  frozenById: string | null;
}

/** What GET /api/figures/[id] answers. */
export interface FigureResponse {
  figure: FigureView & { manuscriptId: string; updatedAt: string };
  snapshots: FigureSnapshotRow[];
  latestRun: RunView | null;
  role: 'owner' | 'author' | 'coauthor';
}

/**
 * Follow one figure; `fallback` is the server-rendered state so the first paint needs no request.
 *
 * @example
 * const { data, mutate } = useFigure(figure.id, initial);
 */
export function useFigure(figureId: string, fallback?: FigureResponse) {
  return useSWR<FigureResponse, ApiError>(`/api/figures/${figureId}`, fetcher, { fallbackData: fallback, revalidateOnFocus: false });
}

/** The editable parts of a figure (any subset). */
export interface FigurePatch {
  label?: string;
  title?: string;
  caption?: string;
  params?: unknown;
  viewSpec?: Record<string, unknown> | null;
}

/** Save changes to a figure (PATCH /api/figures/[id]); per-field errors come back in ApiError.fields. */
export function updateFigure(figureId: string, patch: FigurePatch): Promise<{ figure: FigureResponse['figure'] }> {
  return sendJson(`/api/figures/${figureId}`, { method: 'PATCH', body: patch });
}
