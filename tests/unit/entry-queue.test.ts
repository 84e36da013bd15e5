import { describe, expect, it } from 'vitest';
import {
  failureFacts,
  failureKind,
  legacyOutboxKey,
  legacyOutboxSends,
  MAX_RETRY_DELAY_MS,
  queueItems,
  queueOrderScope,
  queueStorageKey,
  retryDelayMs,
  storedMutations,
  type QueueMutationState,
  type StoredMutation,
} from '@/lib/entry-queue';

const send = (key: string, label = `entry ${key}`) => ({ key, url: '/api/households/7/harvests', body: { quantity: 1 }, label });

function state(over: Partial<QueueMutationState>): QueueMutationState {
  return { status: 'pending', isPaused: false, failureCount: 0, failureReason: null, error: null, submittedAt: 0, ...over };
}

describe('queueStorageKey', () => {
  it('gives each person and household a key of their own', () => {
    const a = queueStorageKey({ userId: 'u1', householdId: 7 });
    expect(a).toBe('selfsown:queue:v1:u1:7');
    expect(queueStorageKey({ userId: 'u2', householdId: 7 })).not.toBe(a);
    expect(queueStorageKey({ userId: 'u1', householdId: 8 })).not.toBe(a);
  });

  it('encodes the user id, so no id can spell out another person’s key', () => {
    // An id holding ':' could otherwise be read as another person's id followed by a household.
    expect(queueStorageKey({ userId: 'u1:7', householdId: 7 })).toBe('selfsown:queue:v1:u1%3A7:7');
    // Person "u1:7" in household 7 is not person "u1" in household 7 … nor anyone's "u1" + "7:7".
    expect(queueStorageKey({ userId: 'u1:7', householdId: 7 })).not.toBe(queueStorageKey({ userId: 'u1', householdId: 77 }));
  });

  it('refuses a queue without a person or with a household id that is not a positive whole number', () => {
    expect(() => queueStorageKey({ userId: '', householdId: 7 })).toThrow(/person/);
    expect(() => queueStorageKey({ userId: 'u1', householdId: 0 })).toThrow(/household id/);
    expect(() => queueStorageKey({ userId: 'u1', householdId: 1.5 })).toThrow(/household id/);
  });


  it('orders the sends of one kind and household together, apart from the others', () => {
    expect(queueOrderScope('harvests', 7)).toBe('entries:harvests:7');
    expect(queueOrderScope('purchases', 7)).not.toBe(queueOrderScope('harvests', 7));
  });
});

describe('the old outbox', () => {
  it('is found where it kept each kind per household', () => {
    expect(legacyOutboxKey('harvests', 7)).toBe('selfsown:outbox:harvests:7');
    expect(legacyOutboxKey('purchases', 7)).toBe('selfsown:outbox:purchases:7');
  });

  it('hands over what it still had to send, oldest first, without refused or broken items', () => {
    const text = JSON.stringify([
      { ...send('late'), createdAt: '2026-11-02T10:00:00.000Z', attempts: 2 },
      { ...send('refused'), createdAt: '2026-11-01T09:00:00.000Z', attempts: 1, refused: true, lastError: 'No such crop.' },
      { key: 'broken', createdAt: '2026-11-01T08:00:00.000Z' },
      { ...send('early'), createdAt: '2026-11-01T10:00:00.000Z', attempts: 0 },
    ]);
    expect(legacyOutboxSends(text)).toEqual([send('early'), send('late')]);
  });

  it('reads nothing from an empty, unreadable or odd store', () => {
    expect(legacyOutboxSends(null)).toEqual([]);
    expect(legacyOutboxSends('{not json')).toEqual([]);
    expect(legacyOutboxSends('{"key":"k"}')).toEqual([]);
  });
});

describe('failureKind and retryDelayMs', () => {
  it('tries again after no answer, a timeout, too many requests and server trouble', () => {
    for (const s of [0, 408, 429, 500, 502, 503]) expect(failureKind(s)).toBe('retry');
  });

  it('waits for a new sign-in after a 401 and gives up on other refusals', () => {
    expect(failureKind(401)).toBe('sign-in');
    for (const s of [400, 403, 404, 409, 413, 422]) expect(failureKind(s)).toBe('refused');
  });

  it('doubles the wait from 2 s up to 30 s, and tries a signed-out send every 30 s', () => {
    expect([0, 1, 2, 3, 4, 5, 9].map((n) => retryDelayMs(n, 0))).toEqual([2000, 4000, 8000, 16000, 30000, 30000, 30000]);
    expect(retryDelayMs(0, 401)).toBe(MAX_RETRY_DELAY_MS);
  });
});

describe('failureFacts', () => {
  it('reads a live error and the plain object it is stored as alike', () => {
    const live = Object.assign(new Error('Choose a crop.'), { status: 422, code: 'invalid_input' });
    expect(failureFacts(live)).toEqual({ status: 422, code: 'invalid_input', message: 'Choose a crop.' });
    const stored = JSON.parse(JSON.stringify(failureFacts(live)));
    expect(failureFacts(stored)).toEqual({ status: 422, code: 'invalid_input', message: 'Choose a crop.' });
  });

  it('counts a failure without a status as no answer', () => {
    expect(failureFacts(new TypeError('Failed to fetch'))?.status).toBe(0);
    expect(failureFacts(null)).toBeNull();
  });
});

describe('queueItems', () => {
  it('lists what waits oldest first, whatever order the cache holds them in', () => {
    const list = queueItems([
      state({ submittedAt: 30, variables: send('c') }),
      state({ submittedAt: 10, variables: send('a') }),
      state({ submittedAt: 20, variables: send('b') }),
    ]);
    expect(list.map((i) => i.key)).toEqual(['a', 'b', 'c']);
  });

  it('keeps the cache order for entries logged in the same millisecond', () => {
    const list = queueItems([state({ submittedAt: 5, variables: send('first') }), state({ submittedAt: 5, variables: send('second') })]);
    expect(list.map((i) => i.key)).toEqual(['first', 'second']);
  });

  it('leaves out sent entries and the one whose first try the form still awaits', () => {
    const list = queueItems(
      [state({ status: 'success', variables: send('sent') }), state({ variables: send('trying'), submittedAt: 2 }), state({ variables: send('waits'), isPaused: true, submittedAt: 1 })],
      new Set(['trying']),
    );
    expect(list).toEqual([{ key: 'waits', label: 'entry waits', state: 'waiting' }]);
  });

  it('says which wait for sign-in and which the server refused, with its reason', () => {
    const list = queueItems([
      state({ variables: send('a'), submittedAt: 1, failureCount: 1, failureReason: { status: 401, code: 'unauthenticated', message: 'Sign in first.' } }),
      state({ variables: send('b'), submittedAt: 2, failureCount: 2, failureReason: { status: 0, code: 'network', message: 'Could not reach Selfsown.' } }),
      state({ variables: send('c'), submittedAt: 3, status: 'error', error: { status: 422, code: 'invalid_input', message: 'The date is after today.' } }),
    ]);
    expect(list.map((i) => [i.key, i.state, i.message])).toEqual([
      ['a', 'sign-in', 'Sign in first.'],
      ['b', 'waiting', 'Could not reach Selfsown.'],
      ['c', 'refused', 'The date is after today.'],
    ]);
  });
});

describe('storedMutations', () => {
  const m = (s: Partial<QueueMutationState>): StoredMutation => ({ mutationKey: ['entry-send'], scope: { id: 'entries:harvests:7' }, state: state(s) as StoredMutation['state'] });

  it('stores entries to send as paused, so a reload sends them again, and keeps their order', () => {
    const out = storedMutations([m({ variables: send('a'), isPaused: false }), m({ variables: send('b'), isPaused: true })]);
    expect(out.map((x) => [(x.state.variables as { key: string }).key, x.state.isPaused])).toEqual([
      ['a', true],
      ['b', true],
    ]);
    expect(out[0]!.scope).toEqual({ id: 'entries:harvests:7' });
  });

  it('keeps refused entries with their reason as plain facts, and drops sent ones', () => {
    const refused = Object.assign(new Error('No such crop.'), { status: 404, code: 'not_found' });
    const out = storedMutations([m({ variables: send('sent'), status: 'success' }), m({ variables: send('no'), status: 'error', error: refused })]);
    expect(out).toHaveLength(1);
    const back = JSON.parse(JSON.stringify(out[0]));
    expect(back.state.error).toEqual({ status: 404, code: 'not_found', message: 'No such crop.' });
    expect(back.state.isPaused).toBe(false);
  });

  it('stores nothing that is not an entry send', () => {
    expect(storedMutations([m({ variables: { something: 'else' } })])).toEqual([]);
  });
});
