// The note editor: title, MDX source with line numbers, "insert figure block", a live preview that runs the safety
// check as you type, save (a new revision, refused with the offending line when unsafe) and the revision history.
'use client';

import { useEffect, useId, useMemo, useRef, useState } from 'react';
import { ApiError, sendJson } from '@/lib/fetcher';
import type { NoteProblem } from '@/lib/mdx/check-note';
import { fieldMessages } from '@/lib/validation-fields';
import { saveNoteSchema } from '@/lib/validations/note';
import { Button, ButtonLink } from '../../../../../_components/button';
import { Card } from '../../../../../_components/card';
import { TextField } from '../../../../../_components/field';
import { InlineAlert } from '../../../../../_components/form-alert';
import { FigurePicker, type PickableFigure } from './figure-picker';
import { RevisionHistory } from './revision-history';
import { SourceTextarea, type SourceTextareaHandle } from './source-textarea';
import { useNotePreview } from './use-note-preview';

export interface NoteEditorProps {
  note: { id: string; title: string; source: string; revision: number; slug: string };
  manuscript: { id: string; slug: string };
  figures: PickableFigure[];
}

export function NoteEditor({ note, manuscript, figures }: NoteEditorProps) {
  const id = useId();
  const [title, setTitle] = useState(note.title);
  const [source, setSource] = useState(note.source);
  const [saved, setSaved] = useState({ title: note.title, source: note.source, revision: note.revision });
  const [saving, setSaving] = useState(false);
  const [saveProblem, setSaveProblem] = useState<{ message: string; problems: NoteProblem[]; fields: Record<string, string[]> } | null>(null);
  const [savedMessage, setSavedMessage] = useState<string | null>(null);
  const [historyKey, setHistoryKey] = useState(0);
  const editor = useRef<SourceTextareaHandle>(null);
  const preview = useNotePreview(manuscript.id, source);
  const dirty = title !== saved.title || source !== saved.source;

  useEffect(() => {
    if (!dirty) return;
    const warn = (event: BeforeUnloadEvent) => event.preventDefault();
    window.addEventListener('beforeunload', warn);
    return () => window.removeEventListener('beforeunload', warn);
  }, [dirty]);

  const problems = preview.status === 'refused' ? preview.problems : (saveProblem?.problems ?? []);
  const errorLines = useMemo(() => new Set(problems.map((p) => p.line)), [problems]);

  const save = async () => {
    setSavedMessage(null);
    const parsed = saveNoteSchema.safeParse({ title, source, baseRevision: saved.revision });
    if (!parsed.success) {
      setSaveProblem({ message: 'Some fields are not valid', problems: [], fields: fieldMessages(parsed.error.issues) });
      return;
    }
    setSaving(true);
    try {
      const answer = await sendJson<{ note: { revision: number }; warnings: NoteProblem[] }>(`/api/notes/${note.id}`, {
        method: 'PUT',
        body: parsed.data,
      });
      setSaved({ title, source, revision: answer.note.revision });
      setSaveProblem(null);
      setSavedMessage(`Saved as revision ${answer.note.revision}.`);
      setHistoryKey((k) => k + 1);
    } catch (error) {
      if (error instanceof ApiError) {
        const lines = (error.fields.source ?? []).flatMap((message) => {
          const match = /^line (\d+)/.exec(message);
          return match ? [{ line: Number(match[1]), column: 1, message }] : [];
        });
        setSaveProblem({ message: error.message, problems: lines, fields: error.fields });
      } else {
        setSaveProblem({ message: String(error), problems: [], fields: {} });
      }
    } finally {
      setSaving(false);
    }
  };

  const problemsId = `${id}-problems`;
  return (
    <div className="space-y-6">
      <div className="grid gap-6 xl:grid-cols-2">
        <section aria-label="Source" className="space-y-3">
          <TextField label="Title" value={title} onChange={(e) => setTitle(e.target.value)} errors={saveProblem?.fields.title} maxLength={200} />
          <div className="space-y-2">
            <div className="flex flex-wrap items-end justify-between gap-2">
              <label htmlFor={`${id}-source`} className="text-sm font-medium text-slate-800">
                Note source (MDX with $…$ math)
              </label>
              <span className="text-xs text-slate-500">{dirty ? 'Unsaved changes' : `Revision ${saved.revision}, saved`}</span>
            </div>
            <SourceTextarea
              ref={editor}
              id={`${id}-source`}
              value={source}
              onChange={setSource}
              errorLines={errorLines}
              describedBy={problems.length ? problemsId : undefined}
            />
          </div>
          <div className="rounded-lg bg-slate-50 p-3 ring-1 ring-slate-200">
            <FigurePicker figures={figures} figuresHref={`/m/${manuscript.slug}/figures`} onInsert={(mdx) => editor.current?.insertAtCursor(mdx)} />
          </div>
          {problems.length ? (
            <div id={problemsId} role="alert" className="rounded-lg border border-red-200 bg-red-50 p-3 text-sm text-red-800" data-testid="note-problems">
              <p className="font-medium">{preview.status === 'refused' ? 'The note cannot be saved as it is:' : saveProblem?.message}</p>
              <ul className="mt-1 space-y-0.5">
                {problems.map((p, k) => (
                  <li key={k}>
                    <button type="button" className="text-left underline decoration-red-300 hover:decoration-red-700" onClick={() => editor.current?.focusLine(p.line)}>
                      {p.message}
                    </button>
                  </li>
                ))}
              </ul>
            </div>
          ) : null}
          <div className="flex flex-wrap items-center gap-3">
            <Button onClick={save} busy={saving} disabled={!dirty || saving} data-testid="save-note">
              Save revision
            </Button>
            <ButtonLink href={`/m/${manuscript.slug}/notes/${note.slug}`} variant="quiet">
              {dirty ? 'Leave without saving' : 'View note'}
            </ButtonLink>
            {savedMessage ? (
              <p role="status" className="text-sm text-emerald-800" data-testid="save-status">
                {savedMessage}
              </p>
            ) : null}
            <InlineAlert>{saveProblem && !saveProblem.problems.length ? saveProblem.message : null}</InlineAlert>
          </div>
        </section>
        <section aria-label="Live preview" className="space-y-2">
          <div className="flex items-center justify-between">
            <h2 className="text-sm font-medium text-slate-800">Live preview</h2>
            <span className="text-xs text-slate-500" aria-live="polite">
              {preview.status === 'loading' ? 'Checking…' : preview.status === 'refused' ? 'Refused by the safety check' : preview.status === 'ok' ? 'Safe to save' : ''}
            </span>
          </div>
          <div className="h-[40rem] overflow-auto rounded-lg bg-white px-5 py-4 shadow-sm ring-1 ring-slate-200" data-testid="note-preview">
            {preview.status === 'ok' ? (
              // The HTML comes from our server: the note passed the safety gate and was rendered with our components only.
              <div dangerouslySetInnerHTML={{ __html: preview.html }} />
            ) : preview.status === 'error' ? (
              <p className="text-sm text-red-700">The preview is unavailable: {preview.message}</p>
            ) : preview.status === 'refused' ? (
              <p className="text-sm text-slate-600">Fix the lines listed beside the editor to see the preview.</p>
            ) : (
              <p className="text-sm text-slate-500">Rendering…</p>
            )}
          </div>
          {preview.status === 'ok' && preview.warnings.length ? (
            <ul className="text-xs text-phase-700">
              {preview.warnings.map((w, k) => (
                <li key={k}>{w.message}</li>
              ))}
            </ul>
          ) : null}
        </section>
      </div>
      <Card title="Revision history" id="history" description="Who saved each revision, and the lines that changed between two of them.">
        <RevisionHistory noteId={note.id} refreshKey={historyKey} />
      </Card>
    </div>
  );
}
