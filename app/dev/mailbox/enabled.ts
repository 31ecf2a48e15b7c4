// Whether the developer mailbox page exists: always outside production, in production only with FLUXFOLIO_DEV_MAILBOX=1.
// Kept out of page.tsx because Next pages may only export their reserved names.
import { getEnv } from '@/lib/env';

export function devMailboxEnabled(): boolean {
  const env = getEnv();
  return env.NODE_ENV !== 'production' || env.FLUXFOLIO_DEV_MAILBOX;
}
