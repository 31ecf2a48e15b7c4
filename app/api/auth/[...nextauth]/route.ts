// next-auth's endpoints (sign-in, callbacks, session, CSRF, sign-out), configured in lib/auth/options.ts.
// Kept to one handler so that exactly one live auth route exists; its POSTs pass the origin and rate-limit checks first.
import NextAuth from 'next-auth';
import type { NextRequest } from 'next/server';
import { guardAuthPost } from '@/lib/auth/guard-auth-post';
import { authOptions } from '@/lib/auth/options';

const handler = NextAuth(authOptions);

type Context = { params: Promise<{ nextauth: string[] }> };

export function GET(request: NextRequest, context: Context): Promise<Response> {
  return handler(request, context);
}

export function POST(request: NextRequest, context: Context): Promise<Response> {
  return guardAuthPost(request, () => handler(request, context));
}
