// Sign-in page: password form and "e-mail me a sign-in link" form; next-auth's ?error= codes shown in words.
// Already signed in: straight on to where the visitor was going.
import type { Metadata } from 'next';
import { redirect } from 'next/navigation';
import { getCurrentUser } from '@/lib/auth/session';
import { LogoMark } from '../_components/logo';
import { safeCallbackPath } from './safe-callback';
import { signInErrorMessage } from './sign-in-errors';
import { SignInForms } from './sign-in-forms';

export const metadata: Metadata = { title: 'Sign in' };

export default async function SignInPage({
  searchParams,
}: {
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const params = await searchParams;
  const callbackPath = safeCallbackPath(params.callbackUrl);
  if (await getCurrentUser()) redirect(callbackPath);
  const errorCode = typeof params.error === 'string' ? params.error : undefined;
  const email = typeof params.email === 'string' ? params.email : '';

  return (
    <div className="mx-auto max-w-md">
      <div className="mb-8 text-center">
        <LogoMark className="mx-auto size-12" />
        <h1 className="mt-4 text-2xl font-semibold tracking-tight text-slate-900">Sign in to Fluxfolio</h1>
        <p className="mt-2 text-sm text-slate-600">Figure notes, live spectra and frozen snapshots for your manuscripts.</p>
      </div>
      <SignInForms callbackPath={callbackPath} initialError={signInErrorMessage(errorCode)} initialEmail={email} />
      <p className="mt-6 text-center text-xs text-slate-500">
        New here? Accounts are created from an invitation: ask an owner of your manuscript to invite your address.
      </p>
    </div>
  );
}
