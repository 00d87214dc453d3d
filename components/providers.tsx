'use client';

import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { NuqsAdapter } from 'nuqs/adapters/next/app';
import { useState, type ReactNode } from 'react';
import { SideBySideTray } from './side-by-side/side-by-side-tray';

/** Client-side providers for every page: URL state (nuqs), TanStack Query, and the side-by-side tray. */
export function Providers({ children }: { children: ReactNode }) {
  // One client per browser tab; on the server, one per request (useState runs per render tree).
  const [queryClient] = useState(
    () => new QueryClient({ defaultOptions: { queries: { staleTime: 60_000, refetchOnWindowFocus: false, retry: 1 } } }),
  );
  return (
    <NuqsAdapter>
      <QueryClientProvider client={queryClient}>
        {children}
        <SideBySideTray />
      </QueryClientProvider>
    </NuqsAdapter>
  );
}
