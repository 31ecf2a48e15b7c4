// Client-side providers for every page: SWR defaults (our fetcher, no retry on 4xx) and the toaster.
// Mounted once in the root layout.
'use client';

import type { ReactNode } from 'react';
import { SWRConfig } from 'swr';
import { ApiError, fetcher } from '@/lib/fetcher';
import { Toaster } from './toaster';

export function Providers({ children }: { children: ReactNode }) {
  return (
    <SWRConfig
      value={{
        fetcher,
        revalidateOnFocus: true,
        // A 4xx will not fix itself by asking again.
        shouldRetryOnError: (error: unknown) => !(error instanceof ApiError && error.status >= 400 && error.status < 500),
      }}
    >
      <Toaster>{children}</Toaster>
    </SWRConfig>
  );
}
