// Shown after asking for a sign-in link: where to look, and what to do when nothing arrives.
// next-auth sends visitors here (pages.verifyRequest) after a link was requested.
import type { Metadata } from 'next';
import Link from 'next/link';
import { LogoMark } from '../../_components/logo';

export const metadata: Metadata = { title: 'Check your e-mail' };

export default async function CheckMailPage({
  searchParams,
}: {
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const { email } = await searchParams;
  const address = typeof email === 'string' && email.length <= 254 ? email : null;
  return (
    <div className="mx-auto max-w-md rounded-2xl bg-white p-8 text-center shadow-sm ring-1 ring-slate-200">
      <LogoMark className="mx-auto size-10" />
      <h1 className="mt-4 text-xl font-semibold text-slate-900">Check your e-mail</h1>
      <p className="mt-3 text-sm text-slate-600" role="status">
        If an account uses {address ? <strong className="text-slate-900">{address}</strong> : 'your address'}, we sent it
        a sign-in link. Open the link to sign in; it works once, within 30 minutes.
      </p>
      <p className="mt-4 text-xs text-slate-500">
        Nothing after a few minutes? Look in the spam folder, make sure this is the address you were invited with,
        or{' '}
        <Link href="/sign-in" className="font-medium text-flux-700 underline-offset-2 hover:underline">
          ask for another link
        </Link>
        .
      </p>
    </div>
  );
}
