// Header of the figure-notes pages: breadcrumb back to the manuscript, the page title, and links between the
// manuscript's overview, its figure notes and its figures (the sections this step adds).
import Link from 'next/link';
import type { ReactNode } from 'react';

export type Section = 'notes' | 'figures' | 'snapshot';

const LINKS: { section: Section | 'overview'; label: string; path: string }[] = [
  { section: 'overview', label: 'Overview', path: '' },
  { section: 'notes', label: 'Figure notes', path: '/notes' },
  { section: 'figures', label: 'Figures', path: '/figures' },
];

/** Page header with the manuscript breadcrumb and section links. */
export function SectionHeader({
  manuscript,
  section,
  title,
  actions,
  children,
}: {
  manuscript: { slug: string; title: string };
  section: Section;
  title: ReactNode;
  actions?: ReactNode;
  children?: ReactNode;
}) {
  return (
    <header className="mb-6 space-y-3">
      <p className="text-sm text-slate-500">
        <Link href={`/m/${manuscript.slug}`} className="hover:text-slate-800 hover:underline">
          {manuscript.title}
        </Link>
      </p>
      <nav aria-label="Manuscript sections" className="-mb-px flex gap-1 overflow-x-auto border-b border-slate-200">
        {LINKS.map((link) => {
          const current = link.section === section;
          return (
            <Link
              key={link.section}
              href={`/m/${manuscript.slug}${link.path}`}
              aria-current={current ? 'page' : undefined}
              className={
                'border-b-2 px-3 py-2 text-sm font-medium whitespace-nowrap focus-visible:outline-2 focus-visible:outline-flux-600 ' +
                (current ? 'border-flux-700 text-flux-800' : 'border-transparent text-slate-600 hover:text-slate-900')
              }
            >
              {link.label}
            </Link>
          );
        })}
      </nav>
      <div className="flex flex-wrap items-start justify-between gap-3 pt-2">
        <h1 className="text-2xl font-semibold tracking-tight text-slate-900">{title}</h1>
        {actions}
      </div>
      {children}
    </header>
  );
}
