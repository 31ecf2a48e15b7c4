// Plain-language messages for the error codes next-auth puts in ?error= on the sign-in page.
// Unknown codes get a general message rather than the raw code.
const MESSAGES: Record<string, string> = {
  CredentialsSignin: 'That e-mail and password do not match an account.',
  Verification: 'This sign-in link has expired or was already used. Ask for a new one below.',
  EmailSignin: 'The sign-in e-mail could not be sent. Try again in a moment.',
  AccessDenied: 'This address cannot sign in. Accounts are created from an invitation to a manuscript.',
  SessionRequired: 'Sign in to see that page.',
  RateLimited: 'Too many attempts. Wait a few minutes, then try again.',
};

export function signInErrorMessage(code: string | undefined): string | null {
  if (!code) return null;
  return MESSAGES[code] ?? 'Signing in did not work. Try again.';
}
