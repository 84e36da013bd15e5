/**
 * The entry outbox: entries the phone could not send yet, kept in localStorage per household and
 * sent again later with the same Idempotency-Key, so a retry never stores an entry twice.
 *
 * An entry is written to the outbox *before* it is sent, so closing the tab mid-request loses
 * nothing; it leaves the outbox when the server has answered (saved, or refused with a reason).
 */
import { useMutation } from '@tanstack/react-query';
import { useCallback, useEffect, useRef, useState } from 'react';
import { ApiError, request } from './api';

export interface OutboxItem {
  /** The Idempotency-Key; also the item's id. */
  key: string;
  url: string;
  body: unknown;
  /** What the person sees: "12 lb Potatoes — 3 fresh, 9 stored". */
  label: string;
  createdAt: string;
  attempts: number;
  lastError?: string;
  /** The server refused it (4xx): it will not be sent again; the person can discard it. */
  refused?: boolean;
}

/** How often waiting entries are tried again while the page is open. */
export const RETRY_EVERY_MS = 20_000;

/** Which form's outbox: each form sends and shows only its own entries. */
export type OutboxKind = 'harvests' | 'purchases';

// The household id and kind are folded into one "scope" string: 'harvests:7'.
const storageKey = (scope: string) => `selfsown:outbox:${scope}`;
const scopeOf = (kind: OutboxKind, householdId: number) => `${kind}:${householdId}`;

/** The waiting entries of one scope ('harvests:7') (empty when storage is unavailable or unreadable). */
export function loadOutbox(scope: string): OutboxItem[] {
  try {
    const raw = localStorage.getItem(storageKey(scope));
    const list = raw ? (JSON.parse(raw) as unknown) : [];
    return Array.isArray(list) ? (list as OutboxItem[]) : [];
  } catch {
    return [];
  }
}

function saveOutbox(scope: string, items: OutboxItem[]): void {
  try {
    if (items.length === 0) localStorage.removeItem(storageKey(scope));
    else localStorage.setItem(storageKey(scope), JSON.stringify(items));
  } catch {
    /* private mode or full storage: the entry is still sent, just not kept */
  }
}

function upsert(scope: string, item: OutboxItem): void {
  const items = loadOutbox(scope).filter((i) => i.key !== item.key);
  saveOutbox(scope, [...items, item]);
}

function removeItem(scope: string, key: string): void {
  saveOutbox(
    scope,
    loadOutbox(scope).filter((i) => i.key !== key),
  );
}

// Keys being sent right now, in this tab: the interval and the 'online' event never send one twice at once.
const inFlight = new Set<string>();

async function send<T>(item: OutboxItem): Promise<T> {
  return request<T>('POST', item.url, item.body, { 'Idempotency-Key': item.key });
}

export type SubmitResult<T> = { status: 'saved'; data: T } | { status: 'queued'; item: OutboxItem };

/**
 * The outbox of one household as React state, with `submit` (send now, keep if it fails),
 * `flush` (send what waits) and `discard`. Waiting entries are sent on page load, when the
 * browser comes back online, and every RETRY_EVERY_MS. `onSent` hears of entries sent later.
 */
export function useOutbox<T>(kind: OutboxKind, household: number, onSent: (item: OutboxItem, data: T) => void) {
  const scope = scopeOf(kind, household);
  const [items, setItems] = useState<OutboxItem[]>([]);
  const onSentRef = useRef(onSent);
  onSentRef.current = onSent;
  // An entry on its first try is "saving", not "waiting": it shows once a try has failed (or when
  // it was left from an earlier visit).
  const refresh = useCallback(() => setItems(loadOutbox(scope).filter((i) => !(i.attempts === 0 && inFlight.has(i.key)))), [scope]);

  const mutation = useMutation({ mutationFn: (item: OutboxItem) => send<T>(item) });
  const { mutateAsync } = mutation;

  const attempt = useCallback(
    async (item: OutboxItem): Promise<{ ok: true; data: T } | { ok: false; error: ApiError }> => {
      inFlight.add(item.key);
      refresh();
      try {
        const data = await mutateAsync(item);
        removeItem(scope, item.key);
        return { ok: true, data };
      } catch (e) {
        const error = e instanceof ApiError ? e : new ApiError(0, { code: 'network', message: String(e) }, null);
        if (error.retryable) upsert(scope, { ...item, attempts: item.attempts + 1, lastError: error.message });
        else upsert(scope, { ...item, attempts: item.attempts + 1, lastError: error.message, refused: true });
        return { ok: false, error };
      } finally {
        inFlight.delete(item.key);
        refresh();
      }
    },
    [scope, mutateAsync, refresh],
  );

  /** Sends a new entry now; when it cannot reach the server it stays in the outbox. A refusal is thrown. */
  const submit = useCallback(
    async (url: string, body: unknown, label: string, key: string): Promise<SubmitResult<T>> => {
      const item: OutboxItem = { key, url, body, label, createdAt: new Date().toISOString(), attempts: 0 };
      upsert(scope, item);
      const r = await attempt(item);
      if (r.ok) return { status: 'saved', data: r.data };
      if (r.error.retryable) return { status: 'queued', item: loadOutbox(scope).find((i) => i.key === key) ?? item };
      // Refused on the first try: the form still holds the values, so the person fixes them there.
      removeItem(scope, key);
      refresh();
      throw r.error;
    },
    [attempt, scope, refresh],
  );

  /** Sends every waiting entry once more (not the refused ones). */
  const flush = useCallback(async () => {
    for (const listed of loadOutbox(scope)) {
      // Read it again: another hook or tab may have sent it while this loop waited.
      const item = loadOutbox(scope).find((i) => i.key === listed.key);
      if (!item || item.refused || inFlight.has(item.key)) continue;
      const r = await attempt(item);
      if (r.ok) onSentRef.current(item, r.data);
    }
  }, [attempt, scope]);

  const discard = useCallback(
    (key: string) => {
      removeItem(scope, key);
      refresh();
    },
    [scope, refresh],
  );

  useEffect(() => {
    refresh();
    void flush();
    const online = () => void flush();
    const storage = (e: StorageEvent) => {
      if (e.key === storageKey(scope)) refresh();
    };
    window.addEventListener('online', online);
    window.addEventListener('storage', storage);
    const timer = window.setInterval(() => {
      if (loadOutbox(scope).some((i) => !i.refused)) void flush();
    }, RETRY_EVERY_MS);
    return () => {
      window.removeEventListener('online', online);
      window.removeEventListener('storage', storage);
      window.clearInterval(timer);
    };
  }, [flush, scope, refresh]);

  return { items, submit, flush, discard, sending: mutation.isPending };
}

/** What useOutbox returns, for components that are handed the outbox of their island. */
export type Outbox<T> = ReturnType<typeof useOutbox<T>>;
