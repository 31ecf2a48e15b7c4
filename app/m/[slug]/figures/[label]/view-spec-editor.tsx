// Editing a figure's Vega-Lite view spec: a JSON object laid over the kind's default view (size, titles, scales,
// colours…), checked as JSON and by the shared schema before saving; "use the default" clears it.
'use client';

import { useId, useState } from 'react';
import { updateFigure } from '@/app/_hooks/use-figure';
import { ApiError } from '@/lib/fetcher';
import { viewSpecSchema } from '@/lib/charts/view-spec';
import { Button } from '../../../../_components/button';

export interface ViewSpecEditorProps {
  figureId: string;
  viewSpec: Record<string, unknown> | null;
  /** The kind's default view for this result (data values left out), shown for reference. */
  defaultView: unknown;
  /** The alternative views this kind offers (chosen with fluxfolio.view). */
  views?: readonly string[];
  onSaved: (viewSpec: Record<string, unknown> | null) => void;
}

export function ViewSpecEditor({ figureId, viewSpec, defaultView, views = [], onSaved }: ViewSpecEditorProps) {
  const id = useId();
  const [text, setText] = useState(viewSpec ? JSON.stringify(viewSpec, null, 2) : '');
  const [problem, setProblem] = useState<string | null>(null);
  const [status, setStatus] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  const parse = (): { ok: true; value: Record<string, unknown> | null } | { ok: false; message: string } => {
    if (text.trim() === '') return { ok: true, value: null };
    let json: unknown;
    try {
      json = JSON.parse(text);
    } catch (error) {
      return { ok: false, message: `Not valid JSON: ${error instanceof Error ? error.message : String(error)}` };
    }
    const checked = viewSpecSchema.safeParse(json);
    if (checked.success) return { ok: true, value: checked.data };
    const issue = checked.error.issues[0];
    return { ok: false, message: issue ? `${issue.path.length ? `${issue.path.join('.')}: ` : ''}${issue.message}` : 'Not a valid view spec' };
  };

  const save = async (value: Record<string, unknown> | null) => {
    setBusy(true);
    setStatus(null);
    try {
      await updateFigure(figureId, { viewSpec: value });
      onSaved(value);
      setStatus(value ? 'View saved.' : 'Back to the default view.');
      if (!value) setText('');
    } catch (error) {
      setProblem(error instanceof ApiError ? [error.message, ...Object.values(error.fields).flat()].join(' ') : String(error));
    } finally {
      setBusy(false);
    }
  };

  return (
    <div className="space-y-3" data-testid="view-spec-editor">
      <label htmlFor={id} className="block text-sm text-slate-700">
        A JSON object laid over the default Vega-Lite view, e.g.{' '}
        <code className="rounded bg-slate-100 px-1 font-mono text-xs">{'{"height": 400, "title": "Spectral flow"}'}</code>. Leave empty for
        the default.
      </label>
      {views.length > 1 ? (
        <p className="text-xs text-slate-600">
          Views of this kind: {views.map((v, k) => (
            <span key={v}>
              {k > 0 ? ', ' : ''}
              <code className="rounded bg-slate-100 px-1 font-mono">{`{"fluxfolio": {"view": "${v}"}}`}</code>
            </span>
          ))}
          {views.includes('density') || views.includes('landscape') ? ' (add "level": n for another level).' : '.'}
        </p>
      ) : null}
      <textarea
        id={id}
        rows={8}
        spellCheck={false}
        value={text}
        onChange={(e) => {
          setText(e.target.value);
          const parsed = (() => {
            try {
              return e.target.value.trim() === '' ? null : JSON.parse(e.target.value);
            } catch (error) {
              return error as Error;
            }
          })();
          setProblem(parsed instanceof Error ? `Not valid JSON: ${parsed.message}` : null);
          setStatus(null);
        }}
        aria-invalid={problem ? true : undefined}
        className="block w-full rounded-md border-0 bg-white px-3 py-2 font-mono text-xs text-slate-900 shadow-sm ring-1 ring-inset ring-slate-300 focus:ring-2 focus:ring-flux-600 focus:outline-none aria-[invalid=true]:ring-red-400"
      />
      {problem ? (
        <p role="alert" className="text-xs font-medium text-red-700">
          {problem}
        </p>
      ) : null}
      <div className="flex flex-wrap items-center gap-3">
        <Button
          size="sm"
          busy={busy}
          onClick={() => {
            const parsed = parse();
            if (!parsed.ok) setProblem(parsed.message);
            else void save(parsed.value);
          }}
        >
          Save view
        </Button>
        <Button size="sm" variant="quiet" onClick={() => void save(null)} disabled={busy || viewSpec === null}>
          Use the default view
        </Button>
        {status ? (
          <p role="status" className="text-sm text-emerald-800">
            {status}
          </p>
        ) : null}
      </div>
      {defaultView ? (
        <details className="text-xs text-slate-600">
          <summary className="cursor-pointer">The default view for this kind (data values left out)</summary>
          <pre className="mt-2 max-h-72 overflow-auto rounded-md bg-slate-900 p-3 text-slate-100">{JSON.stringify(defaultView, null, 2)}</pre>
        </details>
      ) : null}
    </div>
  );
}
