// next-auth type augmentation: the session and the JWT carry the user id and the site-admin flag.
// Read them through lib/auth/session.ts#getCurrentUser rather than from the session directly.
import type { DefaultSession } from 'next-auth';

declare module 'next-auth' {
  interface Session {
    user: { id: string; isAdmin: boolean } & DefaultSession['user'];
  }
  interface User {
    isAdmin?: boolean;
  }
}

declare module 'next-auth/jwt' {
  interface JWT {
    isAdmin?: boolean;
  }
}
