// Run controls of a figure: start a run (authors), follow it with a progress bar (SWR polling), cancel it,
// show why it failed, and optionally freeze a succeeded run as the next snapshot version.
'use client';

import { useEffect, useRef, useState } from 'react';
import { ApiError } from '@/lib/fetcher';
import { cancelRun, freezeRun, isActive, startRun, useRun } from '@/app/_hooks/use-run';
import type { RunResponse, RunView } from '@/lib/api-types';
import { ProgressBar } from './progress-bar';

export interface RunPanelProps {
  figureId: string;
  /** The figure's newest run when the page was rendered. */
  initialRun: RunView | null;
  /** Authors and owners: show the run / cancel buttons. */
  canRun: boolean;
  /** Also offer "Freeze as snapshot" for a succeeded run (figure page). */
  canFreeze?: boolean;
  /** Called once per run when it has succeeded, with its result. */
  onResult?: (response: RunResponse) => void;
  /** Called after a freeze with the new snapshot. */
  onFrozen?: (snapshot: { id: string; version: number }) => void;
  /** Called before a run starts (the figure page saves unsaved parameters first); return false to abort. */
  beforeRun?: () => Promise<boolean>;
  compact?: boolean;
}

const STATUS_TEXT: Record<RunView['status'], string> = {
  queued: 'Waiting for a worker',
  running: 'Computing',
  succeeded: 'Finished',
  failed: 'Failed',
  cancelled: 'Cancelled',
};

/** Start / follow / cancel / freeze runs of one figure. */
export function RunPanel({ figureId, initialRun, canRun, canFreeze, onResult, onFrozen, beforeRun, compact }: RunPanelProps) {
  const [runId, setRunId] = useState<string | null>(initialRun?.id ?? null);
  const { run: polled, result, mutate } = useRun(runId);
  const run = polled ?? (initialRun && initialRun.id === runId ? initialRun : null);
  const [busy, setBusy] = useState<null | 'start' | 'cancel' | 'freeze'>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const [frozen, setFrozen] = useState<{ id: string; version: number } | null>(null);
  const reported = useRef<string | null>(initialRun?.status === 'succeeded' ? initialRun.id : null);
  // Marks the panel as interactive once hydrated (browser tests wait for it before clicking).
  const [ready, setReady] = useState(false);
  useEffect(() => setReady(true), []);

  useEffect(() => {
    if (polled && polled.status === 'succeeded' && result && reported.current !== polled.id) {
      reported.current = polled.id;
      onResult?.({ run: polled, result });
    }
  }, [polled, result, onResult]);

  const act = async (kind: 'start' | 'cancel' | 'freeze') => {
    setBusy(kind);
    setProblem(null);
    try {
      if (kind === 'start') {
        if (beforeRun && !(await beforeRun())) return;
        const started = await startRun(figureId);
        setFrozen(null);
        setRunId(started.run.id);
      } else if (kind === 'cancel' && run) {
        await cancelRun(run.id);
        await mutate();
      } else if (kind === 'freeze' && run) {
        const { snapshot } = await freezeRun(run.id);
        setFrozen(snapshot);
        onFrozen?.(snapshot);
      }
    } catch (error) {
      setProblem(error instanceof ApiError ? errorText(error) : String(error));
    } finally {
      setBusy(null);
    }
  };

  const active = isActive(run?.status);
  const tone = run?.status === 'failed' ? 'failed' : run?.status === 'cancelled' ? 'cancelled' : run?.status === 'succeeded' ? 'done' : 'active';
  return (
    <div className={compact ? 'space-y-2' : 'space-y-3'} data-testid="run-panel" data-ready={ready || undefined}>
      {run ? (
        <div aria-live="polite">
          <ProgressBar
            value={run.status === 'succeeded' ? 1 : run.progress}
            tone={tone}
            label={`${STATUS_TEXT[run.status]}${run.fromCache ? ' (served from the stored result)' : ''}`}
            message={run.status === 'failed' ? undefined : run.message}
          />
          {run.status === 'failed' && run.error ? (
            <p role="alert" className="mt-2 rounded-md border border-red-200 bg-red-50 p-2 text-sm text-red-800" data-testid="run-error">
              The run failed: {run.error}
            </p>
          ) : null}
        </div>
      ) : (
        <p className="text-sm text-slate-500">Not run yet.</p>
      )}
      {canRun ? (
        <div className="flex flex-wrap items-center gap-2">
          <button
            type="button"
            onClick={() => act('start')}
            disabled={busy !== null || active}
            className="rounded-md bg-flux-700 px-3 py-1.5 text-sm font-medium text-white shadow-sm hover:bg-flux-800 focus:outline-none focus-visible:ring-2 focus-visible:ring-flux-500 focus-visible:ring-offset-2 disabled:cursor-not-allowed disabled:opacity-50"
            data-testid="run-button"
          >
            {busy === 'start' ? 'Starting…' : run ? 'Run again' : 'Run'}
          </button>
          {active ? (
            <button
              type="button"
              onClick={() => act('cancel')}
              disabled={busy !== null}
              className="rounded-md border border-slate-300 bg-white px-3 py-1.5 text-sm text-slate-700 hover:bg-slate-50 focus:outline-none focus-visible:ring-2 focus-visible:ring-flux-500 disabled:opacity-50"
              data-testid="cancel-button"
            >
              {busy === 'cancel' ? 'Cancelling…' : 'Cancel run'}
            </button>
          ) : null}
          {canFreeze && run?.status === 'succeeded' ? (
            <button
              type="button"
              onClick={() => act('freeze')}
              disabled={busy !== null || frozen !== null}
              className="rounded-md border border-phase-500 bg-phase-100 px-3 py-1.5 text-sm font-medium text-phase-700 hover:bg-phase-300/40 focus:outline-none focus-visible:ring-2 focus-visible:ring-phase-500 disabled:opacity-50"
              data-testid="freeze-button"
            >
              {busy === 'freeze' ? 'Freezing…' : frozen ? `Frozen as v${frozen.version}` : 'Freeze as snapshot'}
            </button>
          ) : null}
        </div>
      ) : null}
      {frozen ? (
        <p className="text-sm text-emerald-800" role="status" data-testid="frozen-message">
          Frozen as{' '}
          <a className="font-semibold underline" href={`/s/${frozen.id}`}>
            v{frozen.version}
          </a>
          .
        </p>
      ) : null}
      {problem ? (
        <p role="alert" className="text-sm text-red-700">
          {problem}
        </p>
      ) : null}
    </div>
  );
}

/** An API error with its per-field messages, for a status line. */
export function errorText(error: ApiError): string {
  const details = Object.entries(error.fields).flatMap(([field, messages]) => messages.map((m) => (field === '_' ? m : `${field}: ${m}`)));
  return details.length ? `${error.message} — ${details.join('; ')}` : error.message;
}
