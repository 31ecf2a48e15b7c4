// Shown while the dashboard's server part loads.
// Built from the list skeleton so that the page does not jump when data arrives.
import { ManuscriptListSkeleton } from './manuscript-list-skeleton';

export default function DashboardLoading() {
  return (
    <div className="space-y-10">
      <div className="h-14 w-64 animate-pulse rounded-lg bg-slate-200/70" />
      <ManuscriptListSkeleton />
    </div>
  );
}
