// How a Figure block looks in the editor's live preview (static HTML): the figure's title, what the block shows
// (latest run or a pinned version), its state, and the well drawn to scale. Missing figures or versions are flagged.
import { WellDrawing } from '../figures/well-drawing';
import type { NoteFigureData } from '@/lib/api-types';

export interface FigurePlaceholderProps {
  label: string;
  version?: number;
  data: NoteFigureData;
}

/** The preview card of a figure block. */
export function FigurePlaceholder({ label, version, data }: FigurePlaceholderProps) {
  const entry = data.figures[label];
  if (!entry) {
    return (
      <div className="my-5 rounded-lg border border-dashed border-red-300 bg-red-50 p-4 text-sm text-red-800" data-figure-preview={label}>
        No figure is labelled “{label}” in this manuscript yet. Create it on the Figures page, then refer to it here.
      </div>
    );
  }
  const pinned = version !== undefined ? entry.pinned[version] : undefined;
  let state: string;
  if (version !== undefined) {
    state = pinned ? `pinned to snapshot v${version}` : `snapshot v${version} does not exist (latest is ${entry.snapshots.length ? `v${entry.snapshots.at(-1)!.version}` : 'none'})`;
  } else if (entry.latestRun) {
    state = `follows the latest run (now ${entry.latestRun.status})`;
  } else {
    state = 'follows the latest run (not run yet)';
  }
  return (
    <figure className="my-5 rounded-lg border border-slate-200 bg-white p-4" data-figure-preview={label}>
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <p className="font-semibold text-slate-900">{entry.figure.title || entry.figure.label}</p>
        <p className="text-xs text-slate-500">
          {entry.figure.kind} · {label} · {state}
        </p>
      </div>
      <WellDrawing params={pinned?.params ?? entry.figure.params} idPrefix={`preview-${label}-${version ?? 'live'}`} className="mt-3 max-w-[15rem]" />
      <figcaption className="mt-2 text-sm text-slate-600">{pinned?.caption ?? entry.figure.caption}</figcaption>
    </figure>
  );
}
