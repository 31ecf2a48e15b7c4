// A live figure block inside a note: shows the figure's chart, either following its latest succeeded run (authors
// can start a new run and watch its progress here) or pinned to a frozen snapshot version (immutable, with its link).
'use client';

import { useCallback, useState } from 'react';
import type { NoteFigure, RunResponse } from '@/lib/api-types';
import { FigureChart } from './figure-chart';
import { RunPanel } from './run-panel';

export interface FigureBlockProps {
  label: string;
  /** Pinned snapshot version; absent = follow the latest run. */
  version?: number;
  height?: number;
  showCaption: boolean;
  /** The loaded figure, or null when no figure has this label. */
  entry: NoteFigure | null;
  manuscriptSlug: string;
  canRun: boolean;
}

/** One `<Figure label="…" />` of a note. */
export function FigureBlock({ label, version, height, showCaption, entry, manuscriptSlug, canRun }: FigureBlockProps) {
  const [shown, setShown] = useState(entry?.latestResult ?? null);
  const onResult = useCallback((response: RunResponse) => {
    if (response.result) setShown({ run: response.run, data: response.result.data, params: response.run.params });
  }, []);

  if (!entry) {
    return (
      <div role="note" className="my-6 rounded-lg border border-dashed border-red-300 bg-red-50 p-4 text-sm text-red-800" data-figure={label}>
        This note refers to a figure labelled “{label}”, which this manuscript does not have.
      </div>
    );
  }
  const { figure } = entry;
  const figureHref = `/m/${manuscriptSlug}/figures/${figure.label}`;
  const heading = figure.title || figure.label;

  if (version !== undefined) {
    const pinned = entry.pinned[version];
    if (!pinned) {
      return (
        <div role="note" className="my-6 rounded-lg border border-dashed border-red-300 bg-red-50 p-4 text-sm text-red-800" data-figure={label}>
          Figure “{label}” has no snapshot v{version}.
        </div>
      );
    }
    return (
      <figure className="my-6 rounded-xl border border-slate-200 bg-white p-4 shadow-sm" data-figure={label} data-version={version}>
        <header className="mb-2 flex flex-wrap items-baseline justify-between gap-2">
          <h3 className="text-base font-semibold text-slate-900">{heading}</h3>
          <a href={`/s/${pinned.snapshotId}`} className="rounded-full bg-phase-100 px-2 py-0.5 text-xs font-semibold text-phase-700 hover:underline">
            snapshot v{version}
          </a>
        </header>
        <FigureChart kind={figure.kind} data={pinned.data} params={pinned.params} viewSpec={pinned.viewSpec} height={height} label={`${heading}, snapshot v${version}`} />
        {showCaption && pinned.caption ? <figcaption className="mt-2 text-sm leading-6 text-slate-700">{pinned.caption}</figcaption> : null}
      </figure>
    );
  }

  return (
    <figure className="my-6 rounded-xl border border-slate-200 bg-white p-4 shadow-sm" data-figure={label} data-version="latest">
      <header className="mb-2 flex flex-wrap items-baseline justify-between gap-2">
        <h3 className="text-base font-semibold text-slate-900">{heading}</h3>
        <span className="flex items-center gap-2 text-xs text-slate-500">
          <span className="rounded-full bg-flux-100 px-2 py-0.5 font-semibold text-flux-800">latest run</span>
          <a href={figureHref} className="text-flux-700 hover:underline">
            parameters &amp; snapshots
          </a>
        </span>
      </header>
      {shown ? (
        <FigureChart kind={figure.kind} data={shown.data} params={shown.params ?? figure.params} viewSpec={figure.viewSpec} height={height} label={`${heading}, latest run`} />
      ) : (
        <p className="rounded-md bg-slate-50 p-6 text-center text-sm text-slate-500">No finished run yet{canRun ? ': start one below.' : '.'}</p>
      )}
      {showCaption && figure.caption ? <figcaption className="mt-2 text-sm leading-6 text-slate-700">{figure.caption}</figcaption> : null}
      {canRun || entry.latestRun?.status === 'failed' ? (
        <div className="mt-3 border-t border-slate-100 pt-3">
          <RunPanel figureId={figure.id} initialRun={entry.latestRun} canRun={canRun} onResult={onResult} compact />
        </div>
      ) : null}
    </figure>
  );
}
