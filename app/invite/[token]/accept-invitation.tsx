// Accepting an invitation. Signed in with the invited address: one button. Signed in as someone else: sign out
// first. Not signed in: sign in (the address has an account) or sign up with a name and a password, then sign in.
'use client';

import { signIn, signOut } from 'next-auth/react';
import { useRouter } from 'next/navigation';
import type { AcceptedInvitationJson } from '@/lib/api-types';
import { ApiError, sendJson } from '@/lib/fetcher';
import { MAX_NAME, MIN_PASSWORD } from '@/lib/validations/common';
import { signUpFromInvitationSchema } from '@/lib/validations/invitation';
import { Button, ButtonLink } from '../../_components/button';
import { TextField } from '../../_components/field';
import { FormAlert } from '../../_components/form-alert';
import { useJsonForm } from '../../_components/use-json-form';

export function AcceptInvitation({
  token,
  invitedEmail,
  accountExists,
  signedInEmail,
  signInHref,
}: {
  token: string;
  invitedEmail: string;
  accountExists: boolean;
  signedInEmail: string | null;
  signInHref: string;
}) {
  const router = useRouter();
  const url = `/api/invitations/${token}`;
  const { fields, message, setMessage, busy, setBusy, onSubmit: signUp } = useJsonForm(
    signUpFromInvitationSchema,
    async (data) => {
      const { accepted } = await sendJson<{ accepted: AcceptedInvitationJson }>(url, { method: 'POST', body: data });
      const result = await signIn('credentials', { email: accepted.email, password: data.password, redirect: false });
      if (!result || result.error) {
        router.push(`/sign-in?email=${encodeURIComponent(accepted.email)}&callbackUrl=${encodeURIComponent(`/m/${accepted.manuscriptSlug}`)}`);
        return;
      }
      router.push(`/m/${accepted.manuscriptSlug}`);
      router.refresh();
    },
    { staysBusyOnSuccess: true, fallbackMessage: 'The account could not be created' },
  );

  async function join() {
    setBusy(true);
    setMessage(null);
    try {
      const { accepted } = await sendJson<{ accepted: AcceptedInvitationJson }>(url, { method: 'POST', body: {} });
      router.push(`/m/${accepted.manuscriptSlug}`);
      router.refresh();
    } catch (error) {
      setBusy(false);
      setMessage(error instanceof ApiError ? error.message : 'The invitation could not be accepted');
    }
  }

  if (signedInEmail && signedInEmail === invitedEmail) {
    return (
      <div className="space-y-4 text-center">
        {message && <FormAlert>{message}</FormAlert>}
        <p className="text-sm text-slate-700">You are signed in as {signedInEmail}.</p>
        <Button onClick={join} busy={busy} data-testid="accept-invitation">
          Join the manuscript
        </Button>
      </div>
    );
  }

  if (signedInEmail) {
    return (
      <div className="space-y-4 text-center">
        <p className="text-sm text-slate-700">
          You are signed in as <strong>{signedInEmail}</strong>, but this invitation is for <strong>{invitedEmail}</strong>.
          Sign out, then open the link again.
        </p>
        <Button variant="secondary" onClick={() => signOut({ callbackUrl: `/invite/${token}` })}>
          Sign out
        </Button>
      </div>
    );
  }

  if (accountExists) {
    return (
      <div className="space-y-4 text-center">
        <p className="text-sm text-slate-700">{invitedEmail} already has a Fluxfolio account. Sign in to accept.</p>
        <ButtonLink href={signInHref} data-testid="sign-in-to-accept">
          Sign in to accept
        </ButtonLink>
      </div>
    );
  }

  return (
    <form onSubmit={signUp} noValidate className="space-y-4" data-testid="sign-up-form">
      <p className="text-sm text-slate-700">Create your account to accept. You will sign in with {invitedEmail}.</p>
      {message && <FormAlert>{message}</FormAlert>}
      <TextField label="E-mail" name="invited-email" value={invitedEmail} readOnly disabled />
      <TextField label="Your name" name="name" autoComplete="name" maxLength={MAX_NAME} required errors={fields.name} />
      <TextField
        label="Choose a password"
        name="password"
        type="password"
        autoComplete="new-password"
        required
        hint={`At least ${MIN_PASSWORD} characters.`}
        errors={fields.password}
      />
      <Button type="submit" className="w-full" busy={busy}>
        Create account and join
      </Button>
    </form>
  );
}
