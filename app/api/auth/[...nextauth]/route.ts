// next-auth's endpoints (sign-in, callbacks, session, CSRF, sign-out), configured in lib/auth/options.ts.
// Kept to one handler so that exactly one live auth route exists.
import NextAuth from 'next-auth';
import { authOptions } from '@/lib/auth/options';

const handler = NextAuth(authOptions);
export { handler as GET, handler as POST };
