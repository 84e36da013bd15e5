/**
 * The entry queue's TanStack Query parts: the one mutation that sends an entry (registered as a
 * mutation default, so a mutation read back from the device after a reload knows how to send
 * itself) and the persister that keeps a queue in localStorage under its person and household.
 * The rules (retry, storage key, what is stored) are pure code in src/lib/entry-queue.ts; the hook
 * the forms use is outbox.ts.
 */
import type { PersistedClient, Persister } from '@tanstack/react-query-persist-client';
import type { QueryClient } from '@tanstack/react-query';
import { failureFacts, failureKind, queueStorageKey, retryDelayMs, storedMutations, type QueuedSend, type QueueScope, type StoredMutation } from '@/lib/entry-queue';
import { request } from '@/components/request';
import type { HouseholdInfo } from './api';

/** The mutation key of every queued entry send. */
export const ENTRY_SEND_KEY = ['entry-send'] as const;

/** Sends one entry with its Idempotency-Key; the server answers a repeat with the first answer. */
function sendEntry(v: QueuedSend): Promise<unknown> {
  return request('POST', v.url, v.body, { 'Idempotency-Key': v.key });
}

const statusOf = (e: unknown) => failureFacts(e)?.status ?? 0;

/**
 * Registers the entry send on a client. Network trouble and 5xx are tried again (2 s, doubling to
 * 30 s), a 401 every 30 s until the person signs in again (entries after it wait behind it, in
 * order), any other 4xx ends the entry as refused. networkMode 'online': while the browser says it
 * is offline, a send does not even start — it is paused and resumed when the connection returns.
 * gcTime Infinity: a refused entry stays listed until the person discards it.
 */
export function setEntryQueueDefaults(client: QueryClient): void {
  client.setMutationDefaults(ENTRY_SEND_KEY, {
    mutationFn: (v: unknown) => sendEntry(v as QueuedSend),
    retry: (_count, err) => failureKind(statusOf(err)) !== 'refused',
    retryDelay: (count, err) => retryDelayMs(count, statusOf(err)),
    networkMode: 'online',
    gcTime: Infinity,
  });
}

/** The queue of one household for the person signed in; none when the page gave no person. */
export function queueScopeOf(household: HouseholdInfo): QueueScope | undefined {
  return household.userId ? { userId: household.userId, householdId: household.id } : undefined;
}

function readStorage(key: string): string | null {
  try {
    return localStorage.getItem(key);
  } catch {
    return null;
  }
}

/**
 * A persister that writes a queue to localStorage at once (no throttle: an entry is on the device
 * before its first try ends) and only when it changed; an empty queue removes its key.
 * Storage that is full or switched off loses the device copy, never the send in progress.
 */
export function entryPersister(scope: QueueScope): Persister {
  const key = queueStorageKey(scope);
  let last: string | null = null;
  return {
    persistClient(client: PersistedClient) {
      const mutations = storedMutations(client.clientState.mutations as unknown as StoredMutation[]);
      const text = mutations.length === 0 ? null : JSON.stringify({ ...client, clientState: { mutations, queries: [] } });
      if (text === last) return;
      last = text;
      try {
        if (text === null) localStorage.removeItem(key);
        else localStorage.setItem(key, text);
      } catch {
        /* private mode or full storage: the entry is still being sent, just not kept */
      }
    },
    restoreClient() {
      const text = readStorage(key);
      if (!text) return undefined;
      last = text;
      return JSON.parse(text) as PersistedClient;
    },
    removeClient() {
      last = null;
      try {
        localStorage.removeItem(key);
      } catch {
        /* nothing to remove */
      }
    },
  };
}
