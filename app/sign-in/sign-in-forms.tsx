// The two ways to sign in, side by side in one card: e-mail + password, or a one-time link by e-mail.
// Both validate with the shared zod schemas before calling next-auth.
'use client';

import { signIn } from 'next-auth/react';
import { useRouter } from 'next/navigation';
import { useState, type FormEvent } from 'react';
import { magicLinkSchema, passwordSignInSchema } from '@/lib/validations/auth';
import { Button } from '../_components/button';
import { TextField } from '../_components/field';
import { FormAlert } from '../_components/form-alert';
import { parseSubmit, type FieldErrors } from '../_components/form-fields';
import { signInErrorMessage } from './sign-in-errors';

export function SignInForms({
  callbackPath,
  initialError,
  initialEmail,
}: {
  callbackPath: string;
  initialError: string | null;
  initialEmail: string;
}) {
  const router = useRouter();
  const [passwordErrors, setPasswordErrors] = useState<FieldErrors>({});
  const [linkErrors, setLinkErrors] = useState<FieldErrors>({});
  const [message, setMessage] = useState<string | null>(initialError);
  const [busy, setBusy] = useState<'password' | 'link' | null>(null);

  async function onPasswordSubmit(event: FormEvent<HTMLFormElement>) {
    setMessage(null);
    const data = parseSubmit(event, passwordSignInSchema, setPasswordErrors);
    if (!data) return;
    setBusy('password');
    const result = await signIn('credentials', { ...data, redirect: false });
    if (!result || result.error) {
      setBusy(null);
      setMessage(signInErrorMessage(result?.error ?? 'CredentialsSignin'));
      return;
    }
    router.replace(callbackPath);
    router.refresh();
  }

  async function onLinkSubmit(event: FormEvent<HTMLFormElement>) {
    setMessage(null);
    const data = parseSubmit(event, magicLinkSchema, setLinkErrors);
    if (!data) return;
    setBusy('link');
    const result = await signIn('email', { email: data.email, callbackUrl: callbackPath, redirect: false });
    if (!result || result.error) {
      setBusy(null);
      setMessage(signInErrorMessage(result?.error ?? 'EmailSignin'));
      return;
    }
    router.push(`/sign-in/check-mail?email=${encodeURIComponent(data.email)}`);
  }

  const emailField = (errors: string[] | undefined) => (
    <TextField label="E-mail" name="email" type="email" autoComplete="email" defaultValue={initialEmail} required errors={errors} />
  );

  return (
    <div className="rounded-2xl bg-white shadow-sm ring-1 ring-slate-200">
      {message && (
        <div className="p-5 pb-0 sm:px-8">
          <FormAlert>{message}</FormAlert>
        </div>
      )}
      <form onSubmit={onPasswordSubmit} noValidate className="space-y-4 p-5 sm:p-8" aria-labelledby="password-heading" data-testid="password-form">
        <h2 id="password-heading" className="text-sm font-semibold text-slate-900">
          With your password
        </h2>
        {emailField(passwordErrors.email)}
        <TextField
          label="Password"
          name="password"
          type="password"
          autoComplete="current-password"
          required
          errors={passwordErrors.password}
        />
        <Button type="submit" className="w-full" busy={busy === 'password'} disabled={busy !== null}>
          Sign in
        </Button>
      </form>
      <div className="flex items-center gap-3 px-5 sm:px-8" aria-hidden>
        <span className="h-px flex-1 bg-slate-200" />
        <span className="text-xs font-medium text-slate-400 uppercase">or</span>
        <span className="h-px flex-1 bg-slate-200" />
      </div>
      <form onSubmit={onLinkSubmit} noValidate className="space-y-4 p-5 sm:p-8" aria-labelledby="link-heading" data-testid="magic-link-form">
        <div>
          <h2 id="link-heading" className="text-sm font-semibold text-slate-900">
            With a link sent to your inbox
          </h2>
          <p className="mt-1 text-xs text-slate-500">No password needed; the link works once, for 30 minutes.</p>
        </div>
        {emailField(linkErrors.email)}
        <Button type="submit" variant="secondary" className="w-full" busy={busy === 'link'} disabled={busy !== null}>
          E-mail me a sign-in link
        </Button>
      </form>
    </div>
  );
}
