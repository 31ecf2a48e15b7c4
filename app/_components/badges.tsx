// Small labels: a member's role, a manuscript's status, and "archived" / "site admin" markers.
// Role badges carry the role description as a tooltip.
import type { ManuscriptStatus, MemberRole } from '@/db/schema';
import { ROLE_DESCRIPTIONS, ROLE_LABELS } from '@/lib/authz/roles';
import { cn } from './cn';

const PILL = 'inline-flex items-center rounded-full px-2 py-0.5 text-xs font-medium ring-1 ring-inset whitespace-nowrap';

const ROLE_STYLES: Record<MemberRole, string> = {
  owner: 'bg-flux-700 text-white ring-flux-700',
  author: 'bg-flux-50 text-flux-800 ring-flux-200',
  coauthor: 'bg-slate-50 text-slate-700 ring-slate-300',
};

export function RoleBadge({ role, className }: { role: MemberRole; className?: string }) {
  return (
    <span className={cn(PILL, ROLE_STYLES[role], className)} title={ROLE_DESCRIPTIONS[role]} data-testid="role-badge">
      {ROLE_LABELS[role]}
    </span>
  );
}

const STATUS_LABELS: Record<ManuscriptStatus, string> = { draft: 'Draft', submitted: 'Submitted', published: 'Published' };
const STATUS_STYLES: Record<ManuscriptStatus, string> = {
  draft: 'bg-white text-slate-600 ring-slate-300',
  submitted: 'bg-phase-100 text-phase-700 ring-phase-300',
  published: 'bg-emerald-50 text-emerald-800 ring-emerald-200',
};

export function StatusBadge({ status }: { status: ManuscriptStatus }) {
  return <span className={cn(PILL, STATUS_STYLES[status])}>{STATUS_LABELS[status]}</span>;
}

export function ArchivedBadge() {
  return <span className={cn(PILL, 'bg-slate-200 text-slate-700 ring-slate-300')}>Archived</span>;
}

export function AdminBadge() {
  return <span className={cn(PILL, 'bg-phase-100 text-phase-700 ring-phase-300')}>Site admin</span>;
}

export { STATUS_LABELS };
