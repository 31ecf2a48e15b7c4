// The Callout of figure notes: a boxed remark of kind note, warn or result, with an optional title.
// Pure markup; rendered on the note page and in the editor's live preview.
import type { ReactNode } from 'react';

const STYLES = {
  note: { box: 'border-flux-200 bg-flux-50', title: 'text-flux-800', label: 'Note' },
  warn: { box: 'border-phase-300 bg-phase-100', title: 'text-phase-700', label: 'Caution' },
  result: { box: 'border-emerald-200 bg-emerald-50', title: 'text-emerald-800', label: 'Result' },
} as const;

export interface CalloutProps {
  kind?: 'note' | 'warn' | 'result';
  title?: string;
  children?: ReactNode;
}

/** A boxed remark inside a note. Unknown kinds were refused by the safety gate; 'note' is the default. */
export function Callout({ kind = 'note', title, children }: CalloutProps) {
  const style = STYLES[kind] ?? STYLES.note;
  return (
    <aside className={`my-5 rounded-lg border px-4 py-3 ${style.box}`} data-callout={kind}>
      <p className={`mb-1 text-sm font-semibold ${style.title}`}>{title ?? style.label}</p>
      <div className="text-[0.95rem] leading-relaxed text-slate-800 [&>p]:my-1">{children}</div>
    </aside>
  );
}
