// The manuscript cards of the dashboard: title, status, my role and what it lets me do, members, last change.
'use client';

import Link from 'next/link';
import type { MemberRole } from '@/db/schema';
import { useManuscripts } from '@/hooks/use-manuscripts';
import { ArchivedBadge, RoleBadge, StatusBadge } from '../_components/badges';
import { ButtonLink } from '../_components/button';
import { EmptyState } from '../_components/empty-state';
import { FormAlert } from '../_components/form-alert';
import { RelativeTime } from '../_components/relative-time';

const WHAT_I_CAN_DO: Record<MemberRole, string> = {
  owner: 'You manage members and can edit, run, archive or delete.',
  author: 'You edit notes and figures and start runs.',
  coauthor: 'You read, comment and approve.',
};

export function ManuscriptList({ scope }: { scope: 'mine' | 'all' }) {
  const { manuscripts, error, isLoading } = useManuscripts(scope);

  if (error) return <FormAlert>{error.message}</FormAlert>;
  if (isLoading || !manuscripts) return <ManuscriptList.Skeleton />;
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
              {item.role ? (
                <RoleBadge role={item.role} />
              ) : (
                <span className="text-xs whitespace-nowrap text-slate-500">not a member</span>
              )}
            </div>
            <div className="mt-2 flex flex-wrap items-center gap-2">
              <StatusBadge status={item.status} />
              {item.archivedAt && <ArchivedBadge />}
            </div>
            <p className="mt-3 text-sm text-slate-600">
              {item.role ? WHAT_I_CAN_DO[item.role] : 'You can read it, and act as owner, as a site admin.'}
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

ManuscriptList.Skeleton = function ManuscriptListSkeleton() {
  return (
    <ul className="grid gap-4 md:grid-cols-2" aria-busy="true" aria-label="Loading manuscripts">
      {[0, 1].map((index) => (
        <li key={index} className="h-36 animate-pulse rounded-xl bg-white p-5 ring-1 ring-slate-200">
          <div className="h-4 w-2/3 rounded bg-slate-200" />
          <div className="mt-3 h-3 w-1/4 rounded bg-slate-100" />
          <div className="mt-5 h-3 w-5/6 rounded bg-slate-100" />
        </li>
      ))}
    </ul>
  );
};
