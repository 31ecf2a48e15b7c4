// next-auth v4 configuration: password sign-in (bcrypt) and one-time e-mail links (through our SMTP transport),
// JWT sessions carrying the user id and the site-admin flag, and our own sign-in pages.
import { DrizzleAdapter } from '@auth/drizzle-adapter';
import type { NextAuthOptions } from 'next-auth';
import type { Adapter } from 'next-auth/adapters';
import CredentialsProvider from 'next-auth/providers/credentials';
import EmailProvider from 'next-auth/providers/email';
import { db } from '@/db';
import { accounts, sessions, users, verificationTokens } from '@/db/schema';
import { getUserByEmail } from '@/db/queries/users';
import { TIMING_EQUALISER_HASH, verifyPassword } from '@/lib/auth/password';
import { getEnv } from '@/lib/env';
import { signInLinkMail } from '@/lib/auth/sign-in-mail';
import { sendMail } from '@/lib/mail/send-mail';
import { passwordSignInSchema } from '@/lib/validations/auth';

/** One-time sign-in links work for 30 minutes (common practice: short, but long enough to switch devices). */
export const MAGIC_LINK_MAX_AGE_SECONDS = 30 * 60;

export const authOptions: NextAuthOptions = {
  // The @auth/core adapter types differ from next-auth v4's, the runtime contract is the same (STACK.md §4).
  adapter: DrizzleAdapter(db, {
    usersTable: users,
    accountsTable: accounts,
    sessionsTable: sessions,
    verificationTokensTable: verificationTokens,
  }) as unknown as Adapter,
  // Credentials sign-in only works with JWT sessions in next-auth v4.
  session: { strategy: 'jwt', maxAge: 30 * 24 * 60 * 60 },
  secret: getEnv().NEXTAUTH_SECRET,
  pages: { signIn: '/sign-in', verifyRequest: '/sign-in/check-mail', error: '/sign-in' },
  providers: [
    CredentialsProvider({
      id: 'credentials',
      name: 'Password',
      credentials: { email: { label: 'E-mail', type: 'email' }, password: { label: 'Password', type: 'password' } },
      async authorize(credentials) {
        const parsed = passwordSignInSchema.safeParse(credentials ?? {});
        if (!parsed.success) return null;
        const user = await getUserByEmail({ email: parsed.data.email });
        // An unknown account spends the same bcrypt time as a known one, so the answer time does not tell them apart.
        const matches = await verifyPassword(parsed.data.password, user?.passwordHash ?? TIMING_EQUALISER_HASH);
        if (!user?.passwordHash || !matches) return null;
        return { id: user.id, email: user.email, name: user.name, isAdmin: user.isAdmin };
      },
    }),
    EmailProvider({
      // A URL string, not an object: the object form is merged with empty credentials (STACK.md §5.4).
      server: getEnv().SMTP_URL,
      from: getEnv().MAIL_FROM,
      maxAge: MAGIC_LINK_MAX_AGE_SECONDS,
      async sendVerificationRequest({ identifier, url }) {
        // No mail at all to an address without an account (the form answers "check your mail" either way), so the
        // form cannot be used to send mail to strangers.
        const known = await getUserByEmail({ email: identifier });
        if (!known) return;
        const { host } = new URL(url);
        await sendMail({ to: identifier, ...signInLinkMail({ url, host, minutes: MAGIC_LINK_MAX_AGE_SECONDS / 60 }) });
      },
    }),
  ],
  callbacks: {
    async signIn({ user, account, email }) {
      // E-mail links only sign in existing accounts; accounts are created from invitations.
      // At the request step we always say "check your mail"; only known addresses get a mail.
      if (account?.provider !== 'email' || email?.verificationRequest) return true;
      return Boolean(user.email && (await getUserByEmail({ email: user.email })));
    },
    async jwt({ token, user }) {
      if (user) token.isAdmin = Boolean(user.isAdmin);
      return token;
    },
    async session({ session, token }) {
      if (session.user && token.sub) {
        session.user.id = token.sub;
        session.user.isAdmin = Boolean(token.isAdmin);
      }
      return session;
    },
  },
};
