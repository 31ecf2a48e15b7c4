// The manuscript's section navigation. Each later step adds its section here (figure notes, figures,
// snapshots, review) with the action its readers need; only sections that exist are listed.
import Link from 'next/link';
import type { ManuscriptAction } from '@/lib/authz/manuscript-access';

interface Tab {
  /** Path below /m/[slug]; '' is the overview. */
  segment: string;
  label: string;
  need: ManuscriptAction;
}

export const MANUSCRIPT_TABS: Tab[] = [
  { segment: '', label: 'Overview', need: 'read' },
  { segment: 'notes', label: 'Figure notes', need: 'read' },
  { segment: 'figures', label: 'Figures', need: 'read' },
];

export function ManuscriptTabs({
  slug,
  active,
  permissions,
}: {
  slug: string;
  active: string;
  permissions: Record<ManuscriptAction, boolean>;
}) {
  const tabs = MANUSCRIPT_TABS.filter((tab) => permissions[tab.need]);
  return (
    <nav aria-label="Manuscript sections" className="-mb-px flex gap-1 overflow-x-auto border-b border-slate-200">
      {tabs.map((tab) => {
        const current = tab.segment === active;
        return (
          <Link
            key={tab.segment || 'overview'}
            href={`/m/${slug}${tab.segment ? `/${tab.segment}` : ''}`}
            aria-current={current ? 'page' : undefined}
            className={
              'border-b-2 px-3 py-2 text-sm font-medium whitespace-nowrap focus-visible:outline-2 focus-visible:outline-flux-600 ' +
              (current ? 'border-flux-700 text-flux-800' : 'border-transparent text-slate-600 hover:text-slate-900')
            }
          >
            {tab.label}
          </Link>
        );
      })}
    </nav>
  );
}
