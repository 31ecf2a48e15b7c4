// The header on every page: the word mark (home), the main navigation and the user menu when signed in.
// A server component: it reads the session itself.
import Link from 'next/link';
import { getCurrentUser } from '@/lib/auth/session';
import { Wordmark } from './logo';
import { UserMenu } from './user-menu';

export async function SiteHeader() {
  const user = await getCurrentUser();
  return (
    <header className="sticky top-0 z-30 border-b border-slate-200 bg-white/90 backdrop-blur">
      <div className="mx-auto flex h-14 max-w-6xl items-center justify-between gap-4 px-4 sm:px-6">
        <div className="flex items-center gap-6">
          <Link
            href={user ? '/dashboard' : '/sign-in'}
            className="rounded-md focus-visible:outline-2 focus-visible:outline-offset-4 focus-visible:outline-flux-600"
            aria-label="Fluxfolio home"
          >
            <Wordmark />
          </Link>
          {user && (
            <nav aria-label="Main" className="hidden sm:block">
              <Link
                href="/dashboard"
                className="rounded-md px-2 py-1 text-sm font-medium text-slate-600 hover:text-slate-900 focus-visible:outline-2 focus-visible:outline-flux-600"
              >
                Manuscripts
              </Link>
            </nav>
          )}
        </div>
        {user ? (
          <UserMenu name={user.name} email={user.email} isAdmin={user.isAdmin} />
        ) : (
          <Link href="/sign-in" className="text-sm font-medium text-flux-700 hover:underline">
            Sign in
          </Link>
        )}
      </div>
    </header>
  );
}
