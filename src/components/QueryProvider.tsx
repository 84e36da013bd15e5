/**
 * The one TanStack Query setup of the islands. Each Astro island hydrates on its own, so every
 * island root that reads or writes the API (entries, share, people, members, households) wraps its
 * content in this provider and gets its own client with the same defaults; the client lives in
 * state so a re-render never replaces it.
 */
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { useState, type ReactNode } from 'react';
import { ApiError } from './request';

function makeClient(): QueryClient {
  return new QueryClient({
    defaultOptions: {
      queries: {
        staleTime: 30_000,
        refetchOnWindowFocus: false,
        // Retrying a 4xx only repeats the same answer; retry network and server trouble twice.
        retry: (count, err) => count < 2 && (!(err instanceof ApiError) || err.retryable),
      },
      mutations: { retry: false },
    },
  });
}

export function QueryProvider({ children }: { children: ReactNode }) {
  const [client] = useState(makeClient);
  return <QueryClientProvider client={client}>{children}</QueryClientProvider>;
}
