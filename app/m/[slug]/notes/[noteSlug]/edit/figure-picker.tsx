// "Insert figure block": choose one of the manuscript's figures and whether the block follows its latest run or is
// pinned to a snapshot version; inserts the MDX `<Figure … />` line at the caret.
'use client';

import Link from 'next/link';
import { useId, useState } from 'react';
import { Button } from '../../../../../_components/button';

export interface PickableFigure {
  label: string;
  title: string;
  kind: string;
  versions: number[];
}

/** Builds the MDX of a figure block. */
export function figureBlockMdx(label: string, version: number | null): string {
  return version === null ? `<Figure label="${label}" />` : `<Figure label="${label}" version={${version}} />`;
}

export function FigurePicker({
  figures,
  figuresHref,
  onInsert,
}: {
  figures: PickableFigure[];
  figuresHref: string;
  onInsert: (mdx: string) => void;
}) {
  const id = useId();
  const [label, setLabel] = useState(figures[0]?.label ?? '');
  const [version, setVersion] = useState<string>('latest');
  const figure = figures.find((f) => f.label === label);

  if (figures.length === 0) {
    return (
      <p className="text-sm text-slate-600">
        This manuscript has no figures yet.{' '}
        <Link href={figuresHref} className="text-flux-700 underline">
          Create one
        </Link>{' '}
        to insert it here.
      </p>
    );
  }
  return (
    <div className="flex flex-wrap items-end gap-2" data-testid="figure-picker">
      <label className="flex flex-col text-xs text-slate-600" htmlFor={`${id}-f`}>
        Figure
        <select
          id={`${id}-f`}
          value={label}
          onChange={(e) => {
            setLabel(e.target.value);
            setVersion('latest');
          }}
          className="mt-1 h-9 rounded-md border border-slate-300 bg-white px-2 text-sm text-slate-900"
          data-testid="picker-figure"
        >
          {figures.map((f) => (
            <option key={f.label} value={f.label}>
              {f.label} — {f.title || f.kind}
            </option>
          ))}
        </select>
      </label>
      <label className="flex flex-col text-xs text-slate-600" htmlFor={`${id}-v`}>
        Shows
        <select
          id={`${id}-v`}
          value={version}
          onChange={(e) => setVersion(e.target.value)}
          className="mt-1 h-9 rounded-md border border-slate-300 bg-white px-2 text-sm text-slate-900"
          data-testid="picker-version"
        >
          <option value="latest">the latest run</option>
          {(figure?.versions ?? []).map((v) => (
            <option key={v} value={String(v)}>
              snapshot v{v} (pinned)
            </option>
          ))}
        </select>
      </label>
      <Button
        size="sm"
        variant="secondary"
        onClick={() => onInsert(figureBlockMdx(label, version === 'latest' ? null : Number(version)))}
        data-testid="insert-figure"
      >
        Insert figure block
      </Button>
    </div>
  );
}
