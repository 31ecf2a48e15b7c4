// next-auth's endpoints (sign-in, callbacks, session, CSRF, sign-out), configured in lib/auth/options.ts.
import NextAuth from 'next-auth';
import { authOptions } from '@/lib/auth/options';

const handler = NextAuth(authOptions);
export { handler as GET, handler as POST };
