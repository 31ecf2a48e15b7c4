// The signed-in user's menu in the header: who I am (and whether I am a site admin), and sign out.
// Built on <details>/<summary>, so it opens with Enter/Space and closes with Escape without extra code.
'use client';

import { signOut } from 'next-auth/react';
import { useEffect, useRef, useState } from 'react';
import { AdminBadge } from './badges';

export function UserMenu({ name, email, isAdmin }: { name: string | null; email: string; isAdmin: boolean }) {
  const ref = useRef<HTMLDetailsElement>(null);
  const [signingOut, setSigningOut] = useState(false);
  const initials = (name || email)
    .split(/[\s@.]+/)
    .filter(Boolean)
    .slice(0, 2)
    .map((part) => part[0]?.toUpperCase())
    .join('');

  useEffect(() => {
    const details = ref.current;
    if (!details) return;
    const onKey = (event: KeyboardEvent) => {
      if (event.key === 'Escape' && details.open) {
        details.open = false;
        details.querySelector('summary')?.focus();
      }
    };
    const onClick = (event: MouseEvent) => {
      if (details.open && !details.contains(event.target as Node)) details.open = false;
    };
    document.addEventListener('keydown', onKey);
    document.addEventListener('click', onClick);
    return () => {
      document.removeEventListener('keydown', onKey);
      document.removeEventListener('click', onClick);
    };
  }, []);

  return (
    <details ref={ref} className="relative" data-testid="user-menu">
      <summary
        className="flex cursor-pointer list-none items-center gap-2 rounded-full p-1 pr-2 hover:bg-slate-100 focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-flux-600 [&::-webkit-details-marker]:hidden"
        aria-label={`Account menu for ${name || email}`}
      >
        <span className="flex size-8 items-center justify-center rounded-full bg-flux-100 text-xs font-semibold text-flux-800">
          {initials}
        </span>
        <span className="hidden max-w-40 truncate text-sm font-medium text-slate-700 sm:inline">{name || email}</span>
        <svg viewBox="0 0 20 20" className="size-4 text-slate-500" aria-hidden>
          <path d="M5 8l5 5 5-5" fill="none" stroke="currentColor" strokeWidth="1.8" />
        </svg>
      </summary>
      <div className="absolute right-0 z-40 mt-2 w-64 rounded-xl bg-white p-2 shadow-lg ring-1 ring-slate-200">
        <div className="px-3 py-2">
          <p className="truncate text-sm font-medium text-slate-900">{name || 'No name set'}</p>
          <p className="truncate text-xs text-slate-500" data-testid="user-email">
            {email}
          </p>
          {isAdmin && (
            <p className="mt-2">
              <AdminBadge />
            </p>
          )}
        </div>
        <hr className="my-1 border-slate-100" />
        <button
          type="button"
          disabled={signingOut}
          onClick={async () => {
            setSigningOut(true);
            await signOut({ callbackUrl: '/sign-in' });
          }}
          className="w-full rounded-lg px-3 py-2 text-left text-sm text-slate-700 hover:bg-slate-100 focus-visible:outline-2 focus-visible:outline-flux-600"
        >
          {signingOut ? 'Signing out…' : 'Sign out'}
        </button>
      </div>
    </details>
  );
}
