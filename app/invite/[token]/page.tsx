// An invitation link: what it offers (manuscript, role, inviter) and the way to accept it, which depends on
// whether the visitor is signed in, with which address, and whether that address already has an account.
import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import type { ReactNode } from 'react';
import { getCurrentUser } from '@/lib/auth/session';
import { ROLE_DESCRIPTIONS, ROLE_LABELS } from '@/lib/authz/roles';
import { getInvitationByToken } from '@/lib/invitations/get-invitation';
import { invitationTokenSchema } from '@/lib/validations/invitation';
import { RoleBadge } from '../../_components/badges';
import { ButtonLink } from '../../_components/button';
import { LogoMark } from '../../_components/logo';
import { AcceptInvitation } from './accept-invitation';

export const metadata: Metadata = { title: 'Invitation' };

export default async function InvitationPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  if (!invitationTokenSchema.safeParse(token).success) notFound();
  const invitation = await getInvitationByToken({ token });
  if (!invitation) notFound();
  const user = await getCurrentUser();
  const returnTo = `/invite/${token}`;
  const usedByMe = Boolean(user && invitation.acceptedAt && user.email === invitation.email);

  let body: ReactNode;
  if (usedByMe) {
    body = (
      <div className="text-center">
        <p className="text-sm text-slate-700">You have accepted this invitation.</p>
        <ButtonLink href={`/m/${invitation.manuscriptSlug}`} className="mt-4">
          Open the manuscript
        </ButtonLink>
      </div>
    );
  } else if (invitation.acceptedAt) {
    body = <p className="text-center text-sm text-slate-700">This invitation has already been used.</p>;
  } else if (invitation.expired) {
    body = (
      <p className="text-center text-sm text-slate-700">
        This invitation has expired. Ask {invitation.invitedByName ?? 'an owner of the manuscript'} to invite you again.
      </p>
    );
  } else {
    body = (
      <AcceptInvitation
        token={token}
        invitedEmail={invitation.email}
        accountExists={invitation.accountExists}
        signedInEmail={user?.email ?? null}
        signInHref={`/sign-in?callbackUrl=${encodeURIComponent(returnTo)}&email=${encodeURIComponent(invitation.email)}`}
      />
    );
  }

  return (
    <div className="mx-auto max-w-lg">
      <div className="rounded-2xl bg-white p-6 shadow-sm ring-1 ring-slate-200 sm:p-8">
        <div className="text-center">
          <LogoMark className="mx-auto size-10" />
          <p className="mt-4 text-sm text-slate-600">
            {invitation.invitedByName ?? 'An owner'} invites <strong className="text-slate-900">{invitation.email}</strong> to
          </p>
          <h1 className="mt-2 text-xl font-semibold text-balance text-slate-900" data-testid="invitation-title">
            {invitation.manuscriptTitle}
          </h1>
          <p className="mt-3 flex items-center justify-center gap-2 text-sm text-slate-600">
            as <RoleBadge role={invitation.role} />
          </p>
          <p className="mx-auto mt-2 max-w-sm text-xs text-slate-500">
            {ROLE_LABELS[invitation.role]}s: {ROLE_DESCRIPTIONS[invitation.role]}
          </p>
        </div>
        <div className="mt-6 border-t border-slate-100 pt-6">{body}</div>
      </div>
    </div>
  );
}
