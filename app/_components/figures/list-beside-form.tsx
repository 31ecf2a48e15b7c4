// A manuscript section's page body: its list (or an empty state) on the left, the side column (the "new" form
// for authors, notes for readers) on the right. Shared by the figures and figure-notes pages.
import type { ReactNode } from 'react';
import { EmptyState } from '../empty-state';

export function ListBesideForm({
  label,
  testId,
  empty,
  aside,
  asideClassName,
  children,
}: {
  /** The list section's accessible name. */
  label: string;
  /** `data-testid` of the list. */
  testId: string;
  /** Shown instead of the list when set (the list has no items). */
  empty: { title: string; text: ReactNode } | null;
  aside: ReactNode;
  asideClassName?: string;
  /** The list items. */
  children: ReactNode;
}) {
  return (
    <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_20rem]">
      <section aria-label={label}>
        {empty ? (
          <EmptyState title={empty.title}>{empty.text}</EmptyState>
        ) : (
          <ul className="divide-y divide-slate-200 rounded-xl bg-white shadow-sm ring-1 ring-slate-200" data-testid={testId}>
            {children}
          </ul>
        )}
      </section>
      <aside className={asideClassName}>{aside}</aside>
    </div>
  );
}
