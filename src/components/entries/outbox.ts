/**
 * The entry queue as the forms use it: `submit` an entry, and it is kept on this device at once
 * (TanStack Query mutation, persisted by the island's QueryProvider) and sent with its
 * Idempotency-Key, so a repeat never stores it twice. The form waits only for the first try:
 * saved, refused (the form shows why), or — offline, no answer, session ended, or no answer within
 * FIRST_TRY_MS — queued, and the form is free for the next entry while the queue goes on sending,
 * in the order logged, when the connection returns.
 *
 * Built on TanStack Query's paused mutations rather than a service-worker background sync
 * because the page must know what waits (to list it), hear a refusal (a 4xx a worker would have
 * to swallow) and hold the queue behind a 401 until the person signs in again.
 */
import { onlineManager, useQueryClient, type Mutation } from '@tanstack/react-query';
import { useCallback, useEffect, useRef, useState } from 'react';
import { legacyOutboxKey, legacyOutboxSends, queueItems, queueOrderScope, type QueuedSend, type QueueKind, type QueueMutationState } from '@/lib/entry-queue';
import { ENTRY_SEND_KEY } from './entry-queue';

/** One line of the waiting list, as the entry forms show it. */
export interface OutboxItem {
  /** The Idempotency-Key; also the item's id. */
  key: string;
  label: string;
  lastError?: string;
  /** The server refused it (4xx): it will not be sent again; the person can discard it. */
  refused?: boolean;
  /** Waits for the person to sign in again (the session ended). */
  signIn?: boolean;
}

/** Which form's queue: each form sends and shows only its own entries. */
export type OutboxKind = QueueKind;

/** How long the form waits for a first answer before it lets the entry wait in the queue. */
export const FIRST_TRY_MS = 8_000;

export type SubmitResult<T> = { status: 'saved'; data: T } | { status: 'queued'; item: OutboxItem };

type EntryMutation = Mutation<unknown, Error, unknown, unknown>;

const sendOf = (m: EntryMutation) => m.state.variables as QueuedSend | undefined;

/**
 * Resolves once the mutation stops being a quick first try — paused, failed once, or too slow —
 * calling `release` first, at that very moment, so that a success heard later is known to be the
 * queue's to report and not the form's.
 */
function whenQueued(cache: ReturnType<ReturnType<typeof useQueryClient>['getMutationCache']>, m: EntryMutation, release: () => void): { promise: Promise<void>; stop: () => void } {
  let stop = () => {};
  const promise = new Promise<void>((resolve) => {
    const letGo = () => {
      if (m.state.status !== 'pending') return;
      release();
      resolve();
    };
    const check = () => {
      if (m.state.isPaused || m.state.failureCount > 0) letGo();
    };
    const unsubscribe = cache.subscribe((e) => {
      if (e.mutation === m) check();
    });
    const timer = window.setTimeout(letGo, FIRST_TRY_MS);
    stop = () => {
      unsubscribe();
      window.clearTimeout(timer);
    };
    check();
  });
  return { promise, stop };
}

/**
 * The queue of one household and kind as React state, with `submit`, `flush` (send what waits
 * now) and `discard` (drop a refused entry). `onSent` hears of entries sent after the form had
 * let them wait (or left from an earlier visit).
 */
export function useOutbox<T>(kind: OutboxKind, household: number, onSent: (item: OutboxItem, data: T) => void) {
  const client = useQueryClient();
  const cache = client.getMutationCache();
  const scope = queueOrderScope(kind, household);
  const [items, setItems] = useState<OutboxItem[]>([]);
  const onSentRef = useRef(onSent);
  onSentRef.current = onSent;
  // Entries whose first try the form is waiting for ("Saving…", not yet "waiting"), those it let go
  // to wait in the queue, and those whose answer the form itself showed.
  const firstTry = useRef(new Set<string>());
  const released = useRef(new Set<string>());
  const answered = useRef(new Set<string>());

  const mine = useCallback(() => cache.findAll({ mutationKey: ENTRY_SEND_KEY }).filter((m) => m.options.scope?.id === scope), [cache, scope]);

  const refresh = useCallback(() => {
    const list = queueItems(
      mine().map((m) => m.state as QueueMutationState),
      firstTry.current,
    );
    setItems(list.map((i) => ({ key: i.key, label: i.label, ...(i.message ? { lastError: i.message } : {}), ...(i.state === 'refused' ? { refused: true } : {}), ...(i.state === 'sign-in' ? { signIn: true } : {}) })));
  }, [mine]);

  // Entries the hand-written outbox before this queue still held join the queue (same keys: never twice).
  useEffect(() => {
    const old = legacyOutboxKey(kind, household);
    let sends: QueuedSend[] = [];
    try {
      sends = legacyOutboxSends(localStorage.getItem(old));
      localStorage.removeItem(old);
    } catch {
      return;
    }
    for (const send of sends) void cache.build(client, { mutationKey: ENTRY_SEND_KEY, scope: { id: scope } }).execute(send).catch(() => undefined);
  }, [cache, client, kind, household, scope]);

  useEffect(() => {
    refresh();
    return cache.subscribe((e) => {
      const m = e.mutation as EntryMutation | undefined;
      if (!m || m.options.scope?.id !== scope) return;
      if (e.type === 'updated' && e.action.type === 'success') {
        const v = sendOf(m);
        // The form reports its own first try's success (whether it hears of it before or after this).
        const formsOwn = v ? answered.current.delete(v.key) || (firstTry.current.has(v.key) && !released.current.has(v.key)) : true;
        if (v && !formsOwn) onSentRef.current({ key: v.key, label: v.label }, m.state.data as T);
        // Sent: it leaves the queue (and the device).
        cache.remove(m);
      }
      refresh();
    });
  }, [cache, scope, refresh]);

  /** Keeps an entry on the device and sends it; resolves on the first answer, or as soon as it has to wait. A refusal is thrown. */
  const submit = useCallback(
    async (url: string, body: unknown, label: string, key: string): Promise<SubmitResult<T>> => {
      const send: QueuedSend = { key, url, body, label };
      firstTry.current.add(key);
      const m = cache.build(client, { mutationKey: ENTRY_SEND_KEY, scope: { id: scope } }) as EntryMutation;
      const done = m.execute(send);
      const queued = whenQueued(cache, m, () => released.current.add(key));
      try {
        const outcome = await Promise.race([done.then((data) => ({ saved: true as const, data: data as T })), queued.promise.then(() => ({ saved: false as const }))]);
        if (outcome.saved) {
          // Not yet heard by the cache listener (it removes what it heard): tell it this one is the form's.
          if (cache.has(m)) answered.current.add(key);
          return { status: 'saved', data: outcome.data };
        }
        return { status: 'queued', item: { key, label } };
      } catch (err) {
        // Refused on the first try: the form still holds the values, so the person fixes them there.
        cache.remove(m);
        throw err;
      } finally {
        queued.stop();
        firstTry.current.delete(key);
        released.current.delete(key);
        refresh();
      }
    },
    [cache, client, scope, refresh],
  );

  /** Sends what waits now (a paused queue; a try already scheduled keeps its time). */
  const flush = useCallback(async () => {
    if (typeof navigator !== 'undefined' && navigator.onLine) onlineManager.setOnline(true);
    await client.resumePausedMutations();
  }, [client]);

  const discard = useCallback(
    (key: string) => {
      const m = mine().find((x) => sendOf(x)?.key === key);
      if (m) cache.remove(m);
      refresh();
    },
    [cache, mine, refresh],
  );

  return { items, submit, flush, discard };
}

/** What useOutbox returns, for components that are handed the queue of their island. */
export type Outbox<T> = ReturnType<typeof useOutbox<T>>;
