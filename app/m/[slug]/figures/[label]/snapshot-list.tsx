// The frozen snapshots of a figure (v1, v2, …) with who froze each and the start of its hash, linking to their
// stable pages, and a picker that opens the side-by-side comparison of two versions.
'use client';

import Link from 'next/link';
import { useState } from 'react';
import { buttonClasses } from '../../../../_components/button';
import { RelativeTime } from '../../../../_components/relative-time';

export interface SnapshotRow {
  id: string;
  version: number;
  frozenAt: string;
  frozenBy: string | null;
  resultHash: string;
}

export function SnapshotList({ snapshots, compareHref }: { snapshots: SnapshotRow[]; compareHref: string }) {
  const newest = snapshots.at(-1)?.version ?? 0;
  // Until the reader picks, compare the two newest versions (this list grows after each freeze).
  const [picked, setPicked] = useState<{ a?: number; b?: number }>({});
  const a = picked.a ?? Math.max(1, newest - 1);
  const b = picked.b ?? newest;
  const setA = (v: number) => setPicked((p) => ({ ...p, a: v }));
  const setB = (v: number) => setPicked((p) => ({ ...p, b: v }));
  if (snapshots.length === 0) {
    return <p className="text-sm text-slate-500">No snapshot yet. Freeze a finished run to make v1.</p>;
  }
  return (
    <div className="space-y-4">
      <ol className="divide-y divide-slate-100 text-sm" data-testid="snapshot-list">
        {[...snapshots].reverse().map((s) => (
          <li key={s.id} className="flex flex-wrap items-center justify-between gap-2 py-2">
            <span>
              <Link href={`/s/${s.id}`} className="font-semibold text-flux-800 hover:underline" data-testid={`snapshot-v${s.version}`}>
                v{s.version}
              </Link>{' '}
              <span className="text-slate-600">
                frozen <RelativeTime iso={s.frozenAt} />
                {s.frozenBy ? ` by ${s.frozenBy}` : ''}
              </span>
            </span>
            <code className="font-mono text-xs text-slate-500" title={`SHA-256 ${s.resultHash}`}>
              {s.resultHash.slice(0, 12)}…
            </code>
          </li>
        ))}
      </ol>
      {snapshots.length > 1 ? (
        <div className="flex flex-wrap items-end gap-2">
          {([
            ['Compare', a, setA],
            ['with', b, setB],
          ] as const).map(([label, value, set]) => (
            <label key={label} className="flex flex-col text-xs text-slate-600">
              {label}
              <select
                className="mt-1 h-9 rounded-md border border-slate-300 bg-white px-2 text-sm text-slate-900"
                value={value}
                onChange={(e) => set(Number(e.target.value))}
                data-testid={`compare-${label === 'with' ? 'b' : 'a'}`}
              >
                {snapshots.map((s) => (
                  <option key={s.version} value={s.version}>
                    v{s.version}
                  </option>
                ))}
              </select>
            </label>
          ))}
          <Link href={`${compareHref}?a=${a}&b=${b}`} className={buttonClasses('secondary', 'sm')} data-testid="compare-link">
            Compare side by side
          </Link>
        </div>
      ) : null}
    </div>
  );
}
