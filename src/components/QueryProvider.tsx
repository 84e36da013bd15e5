/**
 * The one TanStack Query setup of the islands. Each Astro island hydrates on its own, so every
 * island root that reads or writes the API (entries, share, people, members, households) wraps its
 * content in this provider and gets its own client with the same defaults; the client lives in
 * state so a re-render never replaces it.
 *
 * Offline: queries run 'offlineFirst' — the first fetch always goes out, because the service worker
 * may answer it from its cache (the household's crops and staples after one visit) — and only
 * retries wait for the connection. An island given a `queue` (the harvest form, bought food) keeps
 * its entry sends on the device (src/components/entries/entry-queue.ts) and, once they are read
 * back, sends what waits.
 */
import { onlineManager, QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { PersistQueryClientProvider } from '@tanstack/react-query-persist-client';
import { useState, type ReactNode } from 'react';
import type { QueueScope } from '@/lib/entry-queue';
import { ENTRY_SEND_KEY, entryPersister, setEntryQueueDefaults } from './entries/entry-queue';
import { ApiError } from './request';

let onlineKnown = false;

function makeClient(): QueryClient {
  // TanStack Query assumes "online" until an offline event; a page opened with no signal says so at once.
  if (!onlineKnown && typeof navigator !== 'undefined') {
    onlineKnown = true;
    onlineManager.setOnline(navigator.onLine);
  }
  const client = new QueryClient({
    defaultOptions: {
      queries: {
        staleTime: 30_000,
        refetchOnWindowFocus: false,
        networkMode: 'offlineFirst',
        // Retrying a 4xx only repeats the same answer; retry network and server trouble twice.
        retry: (count, err) => count < 2 && (!(err instanceof ApiError) || err.retryable),
      },
      mutations: { retry: false },
    },
  });
  setEntryQueueDefaults(client);
  return client;
}

const isEntrySend = (m: { options: { mutationKey?: readonly unknown[] } }) => m.options.mutationKey?.[0] === ENTRY_SEND_KEY[0];

export function QueryProvider({ children, queue }: { children: ReactNode; queue?: QueueScope }) {
  const [client] = useState(makeClient);
  const [persister] = useState(() => (queue ? entryPersister(queue) : null));
  if (!persister) return <QueryClientProvider client={client}>{children}</QueryClientProvider>;
  return (
    <PersistQueryClientProvider
      client={client}
      persistOptions={{
        persister,
        // A queued entry is kept however long the phone stays without signal.
        maxAge: Infinity,
        dehydrateOptions: { shouldDehydrateQuery: () => false, shouldDehydrateMutation: isEntrySend },
      }}
      onSuccess={() => void client.resumePausedMutations()}
    >
      {children}
    </PersistQueryClientProvider>
  );
}
