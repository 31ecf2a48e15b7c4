// The MDX source field of the note editor: a plain, accessible textarea with a line-number gutter that scrolls with
// it and marks the lines the safety check refused; `focusLine` moves the caret to a line (from an error link).
'use client';

import { forwardRef, useImperativeHandle, useRef, useState } from 'react';

export interface SourceTextareaHandle {
  focusLine: (line: number) => void;
  insertAtCursor: (text: string) => void;
}

export interface SourceTextareaProps {
  id: string;
  value: string;
  onChange: (value: string) => void;
  errorLines: Set<number>;
  describedBy?: string;
}

/** Textarea with line numbers; the gutter is decorative (screen readers get the textarea and the error list). */
export const SourceTextarea = forwardRef<SourceTextareaHandle, SourceTextareaProps>(function SourceTextarea(
  { id, value, onChange, errorLines, describedBy },
  ref,
) {
  const area = useRef<HTMLTextAreaElement>(null);
  const gutter = useRef<HTMLDivElement>(null);
  const [, force] = useState(0);
  const lines = value.split('\n').length;

  useImperativeHandle(ref, () => ({
    focusLine(line: number) {
      const el = area.current;
      if (!el) return;
      const starts = value.split('\n');
      let offset = 0;
      for (let i = 0; i < Math.min(line - 1, starts.length); i++) offset += starts[i].length + 1;
      el.focus();
      el.setSelectionRange(offset, offset + (starts[line - 1]?.length ?? 0));
      const lineHeight = parseFloat(getComputedStyle(el).lineHeight) || 20;
      el.scrollTop = Math.max(0, (line - 4) * lineHeight);
      force((n) => n + 1);
    },
    insertAtCursor(text: string) {
      const el = area.current;
      const start = el?.selectionStart ?? value.length;
      const end = el?.selectionEnd ?? value.length;
      const before = value.slice(0, start);
      const padded = (before.length && !before.endsWith('\n\n') ? (before.endsWith('\n') ? '\n' : '\n\n') : '') + text + '\n';
      const next = before + padded + value.slice(end);
      onChange(next);
      requestAnimationFrame(() => {
        if (!el) return;
        el.focus();
        const caret = before.length + padded.length;
        el.setSelectionRange(caret, caret);
      });
    },
  }));

  return (
    <div className="flex h-[32rem] overflow-hidden rounded-lg bg-white shadow-sm ring-1 ring-slate-300 focus-within:ring-2 focus-within:ring-flux-600">
      <div
        ref={gutter}
        aria-hidden="true"
        className="select-none overflow-hidden border-r border-slate-200 bg-slate-50 px-2 py-2 text-right font-mono text-xs leading-5 text-slate-400"
      >
        {Array.from({ length: lines }, (_, i) => (
          <div key={i} className={errorLines.has(i + 1) ? 'rounded bg-red-100 font-semibold text-red-700' : undefined}>
            {i + 1}
          </div>
        ))}
      </div>
      <textarea
        ref={area}
        id={id}
        value={value}
        onChange={(e) => onChange(e.target.value)}
        onScroll={(e) => {
          if (gutter.current) gutter.current.scrollTop = e.currentTarget.scrollTop;
        }}
        spellCheck={false}
        aria-describedby={describedBy}
        aria-invalid={errorLines.size > 0 || undefined}
        className="h-full w-full resize-none border-0 bg-transparent px-3 py-2 font-mono text-xs leading-5 text-slate-900 focus:outline-none"
        data-testid="note-source"
        wrap="off"
      />
    </div>
  );
});
