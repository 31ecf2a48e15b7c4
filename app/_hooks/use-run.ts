// SWR hook for one solver run: polls GET /api/runs/[id] while the run is queued or running (the progress bar),
// stops when it finishes, and exposes start / cancel / freeze mutations that go through the shared typed client.
'use client';

import useSWR from 'swr';
import type { CancelRunResponse, FreezeRunResponse, RunResponse, RunView, StartRunResponse } from '@/lib/api-types';
import { fetcher, sendJson, type ApiError } from '@/lib/fetcher';

/** How often a live run is polled (ms). */
export const RUN_POLL_MS = 600;

/** True while a run may still change (queued or running). */
export function isActive(status: RunView['status'] | undefined): boolean {
  return status === 'queued' || status === 'running';
}

/**
 * Follow one run. Polls while it is active; `null` follows nothing.
 *
 * @example
 * const { run, result } = useRun(runId);
 */
export function useRun(runId: string | null) {
  const { data, error, mutate, isLoading } = useSWR<RunResponse, ApiError>(runId ? `/api/runs/${runId}` : null, fetcher, {
    refreshInterval: (latest) => (latest && !isActive(latest.run.status) ? 0 : RUN_POLL_MS),
    revalidateOnFocus: false,
  });
  return { run: data?.run ?? null, result: data?.result ?? null, error, isLoading, mutate };
}

/** Start a run of a figure with its saved parameters (POST /api/figures/[id]/runs). */
export function startRun(figureId: string): Promise<StartRunResponse> {
  return sendJson(`/api/figures/${figureId}/runs`, { method: 'POST' });
}

/** Cancel a queued or running run. */
export function cancelRun(runId: string): Promise<CancelRunResponse> {
  return sendJson(`/api/runs/${runId}/cancel`, { method: 'POST' });
}

/** Freeze a succeeded run as the figure's next snapshot version. */
export function freezeRun(runId: string): Promise<FreezeRunResponse> {
  return sendJson(`/api/runs/${runId}/freeze`, { method: 'POST' });
}
