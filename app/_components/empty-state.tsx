// An empty list, said plainly, with an optional next step.
// The ring-and-flux-line drawing echoes the logo.
import type { ReactNode } from 'react';

export function EmptyState({ title, children, action }: { title: string; children?: ReactNode; action?: ReactNode }) {
  return (
    <div className="rounded-xl border border-dashed border-slate-300 bg-white/60 px-6 py-10 text-center">
      <svg viewBox="0 0 40 40" className="mx-auto mb-3 size-10 text-slate-300" aria-hidden>
        <circle cx="20" cy="20" r="15" fill="none" stroke="currentColor" strokeWidth="2" strokeDasharray="4 3" />
        <circle cx="20" cy="20" r="3" fill="currentColor" />
      </svg>
      <h3 className="text-sm font-semibold text-slate-800">{title}</h3>
      {children && <div className="mx-auto mt-1 max-w-md text-sm text-slate-600">{children}</div>}
      {action && <div className="mt-4">{action}</div>}
    </div>
  );
}
