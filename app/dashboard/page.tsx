// Dashboard: my manuscripts with my role in each (fetched through the API with SWR), a button to start a new one,
// and for site admins every manuscript on the site.
import type { Metadata } from 'next';
import { ButtonLink } from '../_components/button';
import { requireUser } from '../_components/require-user';
import { ManuscriptList } from './manuscript-list';

export const metadata: Metadata = { title: 'My manuscripts' };

export default async function DashboardPage() {
  const user = await requireUser('/dashboard');
  return (
    <div className="space-y-10">
      <div className="flex flex-wrap items-end justify-between gap-4">
        <div>
          <p className="text-sm text-slate-500">Welcome back{user.name ? `, ${user.name}` : ''}</p>
          <h1 className="mt-1 text-2xl font-semibold tracking-tight text-slate-900">My manuscripts</h1>
        </div>
        <ButtonLink href="/manuscripts/new" data-testid="new-manuscript">
          <span aria-hidden>+</span> New manuscript
        </ButtonLink>
      </div>
      <ManuscriptList scope="mine" />
      {user.isAdmin && (
        <section aria-labelledby="all-manuscripts" className="space-y-4" data-testid="admin-section">
          <div>
            <h2 id="all-manuscripts" className="text-lg font-semibold text-slate-900">
              Every manuscript on this site
            </h2>
            <p className="text-sm text-slate-600">
              As a site admin you can open any manuscript, and act as its owner where needed.
            </p>
          </div>
          <ManuscriptList scope="all" />
        </section>
      )}
    </div>
  );
}
