// The manuscript cards of the dashboard: title, status, my role and what it lets me do, members, last change.
// Site admins also get a compact one-row-per-manuscript list of the whole site.
'use client';

import Link from 'next/link';
import type { MemberRole } from '@/db/schema';
import { useManuscripts } from '@/app/_hooks/use-manuscripts';
import type { ManuscriptListItemJson } from '@/lib/api-types';
import { ArchivedBadge, RoleBadge, StatusBadge } from '../_components/badges';
import { ButtonLink } from '../_components/button';
import { EmptyState } from '../_components/empty-state';
import { FormAlert } from '../_components/form-alert';
import { RelativeTime } from '../_components/relative-time';
import { ManuscriptListSkeleton } from './manuscript-list-skeleton';

const WHAT_I_CAN_DO: Record<MemberRole, string> = {
  owner: 'You manage members and can edit, run, archive or delete.',
  author: 'You edit notes and figures and start runs.',
  coauthor: 'You read the notes, figures and snapshots.',
};

export function ManuscriptList({ scope }: { scope: 'mine' | 'all' }) {
  const { manuscripts, error, isLoading } = useManuscripts(scope);

  if (error) return <FormAlert>{error.message}</FormAlert>;
  if (isLoading || !manuscripts) return <ManuscriptListSkeleton />;
  if (manuscripts.length === 0) {
    return scope === 'mine' ? (
      <EmptyState
        title="No manuscripts yet"
        action={<ButtonLink href="/manuscripts/new">Start a manuscript</ButtonLink>}
      >
        Start one yourself, or ask a colleague to invite you to theirs.
      </EmptyState>
    ) : (
      <EmptyState title="No manuscripts on this site yet" />
    );
  }

  if (scope === 'all') return <SiteManuscriptTable manuscripts={manuscripts} />;

  return (
    <ul className="grid gap-4 md:grid-cols-2" data-testid={`manuscripts-${scope}`}>
      {manuscripts.map((item) => (
        <li key={item.id}>
          <Link
            href={`/m/${item.slug}`}
            className="group block h-full rounded-xl bg-white p-5 shadow-sm ring-1 ring-slate-200 transition hover:ring-flux-300 focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-flux-600"
            data-testid="manuscript-card"
          >
            <div className="flex items-start justify-between gap-3">
              <h3 className="font-semibold text-slate-900 group-hover:text-flux-800">{item.title}</h3>
              {item.role && <RoleBadge role={item.role} />}
            </div>
            <div className="mt-2 flex flex-wrap items-center gap-2">
              <StatusBadge status={item.status} />
              {item.archivedAt && <ArchivedBadge />}
            </div>
            <p className="mt-3 text-sm text-slate-600">
              {item.role ? WHAT_I_CAN_DO[item.role] : null}
            </p>
            <p className="mt-3 text-xs text-slate-500">
              {item.memberCount} {item.memberCount === 1 ? 'member' : 'members'} · updated <RelativeTime iso={item.updatedAt} />
            </p>
          </Link>
        </li>
      ))}
    </ul>
  );
}

/** Site admins' compact list of every manuscript: one row each, so that a long list stays scannable. */
function SiteManuscriptTable({ manuscripts }: { manuscripts: ManuscriptListItemJson[] }) {
  return (
    <div className="overflow-hidden rounded-xl bg-white shadow-sm ring-1 ring-slate-200">
      <ul className="divide-y divide-slate-100" data-testid="manuscripts-all">
        {manuscripts.map((item) => (
          <li key={item.id}>
            <Link
              href={`/m/${item.slug}`}
              className="flex flex-wrap items-center gap-x-4 gap-y-1 px-4 py-3 hover:bg-slate-50 focus-visible:outline-2 focus-visible:-outline-offset-2 focus-visible:outline-flux-600 sm:flex-nowrap"
            >
              <span className="min-w-0 flex-1 truncate text-sm font-medium text-slate-900">{item.title}</span>
              <span className="flex shrink-0 items-center gap-2">
                <StatusBadge status={item.status} />
                {item.archivedAt && <ArchivedBadge />}
                {item.role && <RoleBadge role={item.role} />}
              </span>
              <span className="w-40 shrink-0 text-xs text-slate-500 sm:text-right">
                {item.memberCount} {item.memberCount === 1 ? 'member' : 'members'} · <RelativeTime iso={item.updatedAt} />
              </span>
            </Link>
          </li>
        ))}
      </ul>
    </div>
  );
}
