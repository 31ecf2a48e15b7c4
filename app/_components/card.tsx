// A white panel with a heading row, the building block of the manuscript and dashboard pages.
// With an id, the section is labelled by its heading for screen readers.
import type { ReactNode } from 'react';
import { cn } from './cn';

export function Card({
  title,
  description,
  actions,
  children,
  className,
  tone = 'default',
  id,
}: {
  title?: ReactNode;
  description?: ReactNode;
  actions?: ReactNode;
  children: ReactNode;
  className?: string;
  tone?: 'default' | 'danger';
  id?: string;
}) {
  const headingId = id ? `${id}-title` : undefined;
  return (
    <section
      id={id}
      aria-labelledby={headingId}
      className={cn(
        'rounded-xl bg-white p-5 shadow-sm ring-1 sm:p-6',
        tone === 'danger' ? 'ring-red-200' : 'ring-slate-200',
        className,
      )}
    >
      {(title || actions) && (
        <div className="mb-4 flex flex-wrap items-start justify-between gap-3">
          <div>
            {title && (
              <h2 id={headingId} className="text-base font-semibold text-slate-900">
                {title}
              </h2>
            )}
            {description && <p className="mt-0.5 text-sm text-slate-600">{description}</p>}
          </div>
          {actions}
        </div>
      )}
      {children}
    </section>
  );
}
