// A note's revision history: who saved each revision and when, and a line diff between any two revisions
// (GET /api/notes/[id]/revisions, and ?from=&to= for the pair).
'use client';

import { useEffect, useState } from 'react';
import useSWR from 'swr';
import type { RevisionPairResponse, RevisionsResponse } from '@/lib/api-types';
import { fetcher, type ApiError } from '@/lib/fetcher';
import { RelativeTime } from '../../../../../_components/relative-time';
import { diffStats, lineDiff } from './line-diff';

/** The history list and the diff of two chosen revisions. `refreshKey` changes after each save. */
export function RevisionHistory({ noteId, refreshKey }: { noteId: string; refreshKey: number }) {
  const { data, error, mutate } = useSWR<RevisionsResponse, ApiError>(`/api/notes/${noteId}/revisions`, fetcher);
  useEffect(() => {
    if (refreshKey > 0) void mutate();
  }, [refreshKey, mutate]);
  const revisions = data?.revisions ?? [];
  const [pick, setPick] = useState<{ from: number; to: number } | null>(null);
  const newest = revisions[0]?.number;
  const chosen = pick ?? (newest && newest > 1 ? { from: newest - 1, to: newest } : null);
  const pairKey = chosen && chosen.from !== chosen.to ? `/api/notes/${noteId}/revisions?from=${chosen.from}&to=${chosen.to}` : null;
  const pair = useSWR<RevisionPairResponse, ApiError>(pairKey, fetcher);

  if (error) return <p className="text-sm text-red-700">The history could not be loaded: {error.message}</p>;
  if (!data) return <p className="text-sm text-slate-500">Loading the history…</p>;

  const diff = pair.data ? lineDiff(pair.data.from.source, pair.data.to.source) : null;
  const stats = diff ? diffStats(diff) : null;
  return (
    <div className="space-y-4" data-testid="revision-history">
      <ol className="divide-y divide-slate-100 text-sm">
        {revisions.map((r) => (
          <li key={r.number} className="flex flex-wrap items-center justify-between gap-2 py-2">
            <span>
              <span className="font-semibold text-slate-900">r{r.number}</span>{' '}
              <span className="text-slate-600">
                by {r.author?.name ?? 'a former member'} · <RelativeTime iso={r.createdAt} />
              </span>
            </span>
            <span className="text-xs text-slate-500">{(r.bytes / 1024).toFixed(1)} kB</span>
          </li>
        ))}
      </ol>
      {revisions.length > 1 ? (
        <div className="space-y-3">
          <div className="flex flex-wrap items-end gap-3 text-sm">
            {(['from', 'to'] as const).map((side) => (
              <label key={side} className="flex flex-col text-xs text-slate-600">
                {side === 'from' ? 'Compare revision' : 'with revision'}
                <select
                  className="mt-1 h-9 rounded-md border border-slate-300 bg-white px-2 text-sm text-slate-900"
                  value={chosen?.[side] ?? ''}
                  onChange={(e) => setPick({ from: chosen?.from ?? 1, to: chosen?.to ?? 1, [side]: Number(e.target.value) })}
                  data-testid={`diff-${side}`}
                >
                  {revisions.map((r) => (
                    <option key={r.number} value={r.number}>
                      r{r.number}
                    </option>
                  ))}
                </select>
              </label>
            ))}
            {stats ? (
              <p className="pb-2 text-xs text-slate-600">
                <span className="text-emerald-700">+{stats.added}</span> <span className="text-red-700">−{stats.removed}</span> lines
              </p>
            ) : null}
          </div>
          {pair.error ? <p className="text-sm text-red-700">{pair.error.message}</p> : null}
          {diff ? (
            <div className="max-h-96 overflow-auto rounded-lg ring-1 ring-slate-200" data-testid="revision-diff">
              <table className="w-full border-collapse font-mono text-xs">
                <caption className="sr-only">
                  Line differences between revision {chosen?.from} and revision {chosen?.to}
                </caption>
                <tbody>
                  {diff.map((line, k) => (
                    <tr
                      key={k}
                      className={line.kind === 'added' ? 'bg-emerald-50' : line.kind === 'removed' ? 'bg-red-50' : undefined}
                    >
                      <td className="w-10 select-none px-2 text-right text-slate-400">{line.oldLine ?? ''}</td>
                      <td className="w-10 select-none px-2 text-right text-slate-400">{line.newLine ?? ''}</td>
                      <td className="w-4 select-none text-center text-slate-500" aria-label={line.kind}>
                        {line.kind === 'added' ? '+' : line.kind === 'removed' ? '−' : ''}
                      </td>
                      <td className="whitespace-pre px-2 text-slate-800">{line.text}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
          ) : null}
        </div>
      ) : (
        <p className="text-sm text-slate-500">One revision so far; save again to compare.</p>
      )}
    </div>
  );
}
