/**
 * The rules of the entry queue, the entries a phone keeps until Selfsown can be reached: where a
 * queue is stored (one per person and household, so another account on the same phone never sends
 * or sees them; harvests and bought food together, so whichever entry page is open sends both), what a failed send means (try again, sign in again, or refused), how long to
 * wait before the next try, which entries the waiting list shows and in what order, and what is
 * written to the device. The queue itself is TanStack Query's persisted mutations
 * (src/components/entries/outbox.ts); this module is the part that needs no browser to be checked.
 */

/** Each entry form keeps its own queue: harvests, or bought food (the form and the staples' one tap). */
export type QueueKind = 'harvests' | 'purchases';

/** Whose queue: the signed-in person and the household. */
export interface QueueScope {
  userId: string;
  householdId: number;
}

/** What one queued entry holds: enough to send it again after a reload, and to name it. */
export interface QueuedSend {
  /** The Idempotency-Key; also the entry's id in the queue. */
  key: string;
  url: string;
  body: unknown;
  /** What the person sees: "12 lb Potatoes — 3 fresh, 9 stored". */
  label: string;
}

const STORAGE_PREFIX = 'selfsown:queue:v1';

/**
 * The device storage key of one queue. The user id is URI-encoded so that no id can reach into
 * another person's key. Example: `queueStorageKey({ userId: 'u1', householdId: 7 })` → 'selfsown:queue:v1:u1:7'
 */
export function queueStorageKey(scope: QueueScope): string {
  if (!scope.userId) throw new Error('A queue needs the signed-in person’s id: none was given.');
  if (!Number.isInteger(scope.householdId) || scope.householdId <= 0) throw new Error(`A queue needs a household id, a whole number above 0: got ${scope.householdId}.`);
  return `${STORAGE_PREFIX}:${encodeURIComponent(scope.userId)}:${scope.householdId}`;
}

/** Where the hand-written outbox before this queue kept a household's waiting entries. Example: 'selfsown:outbox:harvests:7' */
export function legacyOutboxKey(kind: QueueKind, householdId: number): string {
  return `selfsown:outbox:${kind}:${householdId}`;
}

/**
 * The entries still to send in what the old outbox stored (its JSON list), oldest first, so the
 * queue can take them over; refused, malformed and unreadable ones are left out.
 * Example: `legacyOutboxSends('[{"key":"k1","url":"/api/households/7/harvests","body":{},"label":"3 kg Potato","createdAt":"…"}]')`
 */
export function legacyOutboxSends(text: string | null): QueuedSend[] {
  if (!text) return [];
  let list: unknown;
  try {
    list = JSON.parse(text);
  } catch {
    return [];
  }
  if (!Array.isArray(list)) return [];
  return list
    .filter((i): i is QueuedSend & { createdAt?: string; refused?: boolean } => isQueuedSend(i) && !(i as { refused?: unknown }).refused)
    .sort((a, b) => String(a.createdAt ?? '').localeCompare(String(b.createdAt ?? '')))
    .map(({ key, url, body, label }) => ({ key, url, body, label }));
}

/**
 * The send order's scope: entries of one kind and household go one after another, in the order
 * they were logged (TanStack Query runs mutations of one scope id in series).
 * Example: `queueOrderScope('harvests', 7)` → 'entries:harvests:7'
 */
export function queueOrderScope(kind: QueueKind, householdId: number): string {
  return `entries:${kind}:${householdId}`;
}

/**
 * What a failed send means, from its HTTP status (0 = no answer at all):
 * - 'retry': no answer, a timeout, too many requests or the server's fault — send it again later;
 * - 'sign-in': the session has ended (401) — keep it, and send it once the person signs in again;
 * - 'refused': any other 4xx — the server will give the same answer again: show it, do not retry.
 * Example: `failureKind(0)` → 'retry', `failureKind(401)` → 'sign-in', `failureKind(422)` → 'refused'
 */
export function failureKind(status: number): 'retry' | 'sign-in' | 'refused' {
  if (status === 0 || status === 408 || status === 429 || status >= 500) return 'retry';
  if (status === 401) return 'sign-in';
  return 'refused';
}

/** The longest wait between two tries. */
export const MAX_RETRY_DELAY_MS = 30_000;

/**
 * How long to wait before the next try after `failures` failed ones (0 after the first): 2 s,
 * doubling, at most 30 s; a send waiting for sign-in is tried every 30 s (the person may sign in
 * in another tab). Example: `retryDelayMs(0, 0)` → 2000, `retryDelayMs(3, 503)` → 16000
 */
export function retryDelayMs(failures: number, status: number): number {
  if (failureKind(status) === 'sign-in') return MAX_RETRY_DELAY_MS;
  return Math.min(2_000 * 2 ** Math.max(0, failures), MAX_RETRY_DELAY_MS);
}

/** The facts of a failure that are kept and shown: a live ApiError, or one read back from storage. */
export interface FailureFacts {
  status: number;
  code: string;
  message: string;
}

/**
 * The status, code and message of a failure, whatever its form (an Error with `status` and
 * `code`, or the plain object it was stored as); null for nothing. A failure without a status
 * counts as no answer (0).
 */
export function failureFacts(e: unknown): FailureFacts | null {
  if (e === null || e === undefined) return null;
  if (typeof e !== 'object') return { status: 0, code: 'network', message: String(e) };
  const o = e as { status?: unknown; code?: unknown; message?: unknown };
  return {
    status: typeof o.status === 'number' ? o.status : 0,
    code: typeof o.code === 'string' ? o.code : 'network',
    message: typeof o.message === 'string' && o.message ? o.message : 'Could not reach Selfsown.',
  };
}

/** The parts of a TanStack Query mutation's state the queue reads (a subset of MutationState). */
export interface QueueMutationState {
  status: 'idle' | 'pending' | 'success' | 'error';
  isPaused: boolean;
  failureCount: number;
  failureReason: unknown;
  error: unknown;
  submittedAt: number;
  variables?: unknown;
}

/** One line of the waiting list. */
export interface QueueItem {
  key: string;
  label: string;
  /** 'waiting': will be sent; 'sign-in': waits for the person to sign in again; 'refused': the server said no. */
  state: 'waiting' | 'sign-in' | 'refused';
  /** The server's or the network's last word on it. */
  message?: string;
}

function isQueuedSend(v: unknown): v is QueuedSend {
  const o = v as Partial<QueuedSend> | null | undefined;
  return typeof o?.key === 'string' && typeof o.url === 'string' && typeof o.label === 'string';
}

/**
 * The waiting list: every entry still to send (pending) or refused (error), oldest first, without
 * those in `hidden` (the entry whose first try the form is still waiting for shows as "Saving…",
 * not as waiting). Sent entries are not listed.
 */
export function queueItems(states: readonly QueueMutationState[], hidden: ReadonlySet<string> = new Set()): QueueItem[] {
  return states
    .map((s, order) => ({ s, order }))
    .filter(({ s }) => (s.status === 'pending' || s.status === 'error') && isQueuedSend(s.variables) && !hidden.has(s.variables.key))
    .sort((a, b) => a.s.submittedAt - b.s.submittedAt || a.order - b.order)
    .map(({ s }) => {
      const v = s.variables as QueuedSend;
      if (s.status === 'error') return { key: v.key, label: v.label, state: 'refused' as const, message: failureFacts(s.error)?.message };
      const last = failureFacts(s.failureReason);
      const state = last && failureKind(last.status) === 'sign-in' ? ('sign-in' as const) : ('waiting' as const);
      return { key: v.key, label: v.label, state, ...(last ? { message: last.message } : {}) };
    });
}

/** A mutation as TanStack Query dehydrates it (the parts the queue stores). */
export interface StoredMutation {
  mutationKey?: readonly unknown[];
  scope?: { id: string };
  state: QueueMutationState & Record<string, unknown>;
}

/**
 * What is written to the device for the queue's mutations: only entries still to send or refused;
 * one still to send is stored as paused, so that after a reload TanStack Query's
 * resumePausedMutations() sends it again (a request in flight when the page closed may have
 * reached the server: its Idempotency-Key makes the second send harmless); a failure is stored as
 * its plain facts (an Error's message does not survive JSON).
 */
export function storedMutations(mutations: readonly StoredMutation[]): StoredMutation[] {
  return mutations
    .filter((m) => (m.state.status === 'pending' || m.state.status === 'error') && isQueuedSend(m.state.variables))
    .map((m) => ({
      ...m,
      state: {
        ...m.state,
        isPaused: m.state.status === 'pending' ? true : m.state.isPaused,
        error: failureFacts(m.state.error),
        failureReason: failureFacts(m.state.failureReason),
      },
    }));
}
