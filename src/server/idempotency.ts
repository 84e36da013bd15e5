/**
 * Idempotency-Key for entry-creating requests (harvests, bought food, logging a staple): a phone
 * that lost its answer sends the same request again with the same key and gets the first answer
 * back, and no second entry is stored.
 *
 * How it holds under races: the key row (primary key household_id + key) is inserted first, in the
 * same transaction as the entries. A second request with the same key blocks on that row until the
 * first commits, then gets a duplicate-key error, rolls back everything it did and reads the stored
 * answer instead. If the first one fails and rolls back, the second simply goes ahead.
 * Only successful answers are stored: a refused request wrote nothing, so repeating it is harmless.
 */
import { and, eq } from 'drizzle-orm';
import { getDb } from '@/db/client';
import { idempotencyKeys } from '@/db/schema';
import { HttpError, json } from './http';
import { isDuplicateKey, isRetryableLock, type Tx } from './entry-input';

/** The request header. */
export const IDEMPOTENCY_HEADER = 'Idempotency-Key';

const KEY_PATTERN = /^[A-Za-z0-9_.:-]{1,100}$/;

/** A stored or fresh answer: HTTP status and JSON body. */
export interface Answer {
  status: number;
  body: unknown;
}

/**
 * The request's Idempotency-Key, undefined when it sends none; 400 when it is malformed.
 * Example: `idempotencyKey(request)` → '3f1c…' for `Idempotency-Key: 3f1c…`
 */
export function idempotencyKey(request: Request): string | undefined {
  const raw = request.headers.get(IDEMPOTENCY_HEADER);
  if (raw === null) return undefined;
  const key = raw.trim();
  if (!KEY_PATTERN.test(key)) {
    throw new HttpError(400, 'invalid_idempotency_key', 'The Idempotency-Key header must be 1–100 letters, digits or . _ : -', {
      [IDEMPOTENCY_HEADER]: 'Use 1–100 letters, digits or . _ : -',
    });
  }
  return key;
}

async function storedAnswer(householdId: number, key: string): Promise<{ route: string; answer: Answer } | undefined> {
  const [row] = await getDb()
    .select()
    .from(idempotencyKeys)
    .where(and(eq(idempotencyKeys.householdId, householdId), eq(idempotencyKeys.key, key)))
    .limit(1);
  if (!row || row.status === 0) return undefined;
  return { route: row.route, answer: { status: row.status, body: JSON.parse(row.response) as unknown } };
}

function replay(found: { route: string; answer: Answer }, route: string): Answer & { replayed: true } {
  if (found.route !== route) {
    throw new HttpError(422, 'idempotency_key_reused', 'This Idempotency-Key was already used for a different kind of request; send a new key.');
  }
  return { ...found.answer, replayed: true };
}

/**
 * Runs `work` in one transaction, at most once per (household, key): with a key already answered it
 * returns the stored answer (`replayed: true`) without running. `route` names the kind of request
 * ('harvests', 'purchases', …) so a key cannot be reused across kinds.
 * Example: `await idempotent(7, key, 'harvests', (tx) => createOne(tx))` → { status: 201, body, replayed: false }
 */
export async function idempotent(
  householdId: number,
  key: string | undefined,
  route: string,
  work: (tx: Tx) => Promise<Answer>,
): Promise<Answer & { replayed: boolean }> {
  if (key === undefined) return { ...(await getDb().transaction(work)), replayed: false };

  // Twins waiting on a key whose first request rolled back can deadlock each other: try again.
  for (let attempt = 1; ; attempt++) {
    try {
      return await claimAndRun(householdId, key, route, work);
    } catch (e) {
      if (!isRetryableLock(e) || attempt >= 3) throw e;
    }
  }
}

async function claimAndRun(householdId: number, key: string, route: string, work: (tx: Tx) => Promise<Answer>): Promise<Answer & { replayed: boolean }> {
  const before = await storedAnswer(householdId, key);
  if (before) return replay(before, route);
  try {
    const answer = await getDb().transaction(async (tx) => {
      // Claim the key first: a concurrent twin waits here until this transaction ends.
      await tx.insert(idempotencyKeys).values({ householdId, key, route, status: 0, response: '' });
      const result = await work(tx);
      await tx
        .update(idempotencyKeys)
        .set({ status: result.status, response: JSON.stringify(result.body) })
        .where(and(eq(idempotencyKeys.householdId, householdId), eq(idempotencyKeys.key, key)));
      return result;
    });
    return { ...answer, replayed: false };
  } catch (e) {
    if (!isDuplicateKey(e)) throw e;
    // The twin committed first (its duplicate-key error rolled back everything we wrote).
    const after = await storedAnswer(householdId, key);
    if (after) return replay(after, route);
    throw new HttpError(409, 'idempotency_conflict', 'The same request is still being saved; try again in a moment.');
  }
}

/** The JSON response for an answer; a replay says so in the Idempotency-Replayed header. */
export function answerResponse(a: Answer & { replayed: boolean }): Response {
  return json(a.body, a.status, a.replayed ? { 'idempotency-replayed': 'true' } : {});
}
