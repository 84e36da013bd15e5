/**
 * Idempotency-Key for entry-creating requests (harvests, bought food, logging a staple): a phone
 * that lost its answer sends the same request again with the same key and gets the first answer
 * back, and no second entry is stored.
 *
 * A key belongs to one member in one household: the same key sent by another member (or in another
 * household) is another key. It also stands for one request: the SHA-256 of the path and the body
 * (keys sorted, so their order does not matter) is stored with it, and the key sent again with a
 * different body is refused with 422 `idempotency_key_reused` — replaying the first answer would
 * silently lose the second entry.
 *
 * How it holds under races: the key row (primary key household_id + user_id + key) is inserted
 * first, in the same transaction as the entries. A second request with the same key blocks on that
 * row until the first commits, then gets a duplicate-key error, rolls back everything it did and
 * reads the stored answer instead. If the first one fails and rolls back, the second simply goes
 * ahead. Only successful answers are stored: a refused request wrote nothing, so repeating it is
 * harmless.
 */
import { createHash } from 'node:crypto';
import { and, eq } from 'drizzle-orm';
import { getDb } from '@/db/client';
import { idempotencyKeys } from '@/db/schema';
import { isDuplicateKey } from './db-errors';
import { HttpError, json } from './http';
import { lockHousehold, type Tx } from './entry-input';
import { withWriteRetry } from './write-retry';

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

/** Who sent a keyed request, what kind it is and what it asked: the key's scope and its fingerprint. */
export interface KeyedRequest {
  householdId: number;
  userId: string;
  /** The kind of request ('harvests', 'purchases'): a key cannot be reused across kinds. */
  route: string;
  /** The request's path and JSON body, fingerprinted by requestHash(). */
  path: string;
  body: unknown;
}

/** JSON with object keys in sorted order, so that `{a,b}` and `{b,a}` are one request. */
function canonicalJson(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(canonicalJson).join(',')}]`;
  if (value !== null && typeof value === 'object') {
    const entries = Object.entries(value as Record<string, unknown>).filter(([, v]) => v !== undefined);
    entries.sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
    return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${canonicalJson(v)}`).join(',')}}`;
  }
  return JSON.stringify(value) ?? 'null';
}

/**
 * SHA-256 (hex) of a request's path and body. Example:
 * `requestHash('/api/households/7/harvests', { quantity: 1, date: '2026-07-01' }) === requestHash('/api/households/7/harvests', { date: '2026-07-01', quantity: 1 })` → true
 */
export function requestHash(path: string, body: unknown): string {
  return createHash('sha256').update(`${path}\n${canonicalJson(body)}`).digest('hex');
}

interface Stored {
  route: string;
  hash: string;
  answer: Answer;
}

const keyRow = (r: KeyedRequest, key: string) =>
  and(eq(idempotencyKeys.householdId, r.householdId), eq(idempotencyKeys.userId, r.userId), eq(idempotencyKeys.key, key));

async function storedAnswer(r: KeyedRequest, key: string): Promise<Stored | undefined> {
  const [row] = await getDb().select().from(idempotencyKeys).where(keyRow(r, key)).limit(1);
  if (!row || row.status === 0) return undefined;
  return { route: row.route, hash: row.requestHash, answer: { status: row.status, body: JSON.parse(row.response) as unknown } };
}

function replay(found: Stored, r: KeyedRequest, hash: string): Answer & { replayed: true } {
  if (found.route !== r.route) {
    throw new HttpError(422, 'idempotency_key_reused', 'This Idempotency-Key was already used for a different kind of request; send a new key.', {
      [IDEMPOTENCY_HEADER]: 'Use a new key for a new request.',
    });
  }
  // '' = a key stored before request hashes were recorded: replayed as before.
  if (found.hash !== '' && found.hash !== hash) {
    throw new HttpError(422, 'idempotency_key_reused', 'This Idempotency-Key was already used for a request with a different body; send a new key for a new entry.', {
      [IDEMPOTENCY_HEADER]: 'Use a new key for a new request.',
    });
  }
  return { ...found.answer, replayed: true };
}

/**
 * Runs `work` in one transaction, at most once per (household, member, key): with a key already
 * answered it returns the stored answer (`replayed: true`) without running, or 422 when the stored
 * request was of another kind or had another body.
 * Example: `await idempotent({ householdId: 7, userId, route: 'harvests', path, body }, key, (tx) => createOne(tx))` → { status: 201, body, replayed: false }
 */
export async function idempotent(r: KeyedRequest, key: string | undefined, work: (tx: Tx) => Promise<Answer>): Promise<Answer & { replayed: boolean }> {
  const lockedWork = async (tx: Tx) => {
    // First the household's row (shared): a deletion racing this write waits, or wins and we answer 404.
    await lockHousehold(tx, r.householdId);
    return work(tx);
  };
  if (key === undefined) return { ...(await getDb().transaction(lockedWork)), replayed: false };
  const hash = requestHash(r.path, r.body);
  // Twins waiting on a key whose first request rolled back can deadlock each other, and on Galera a
  // twin through another node fails certification: both start over from the stored-answer lookup.
  return withWriteRetry(() => claimAndRun(r, key, hash, lockedWork));
}

async function claimAndRun(r: KeyedRequest, key: string, hash: string, work: (tx: Tx) => Promise<Answer>): Promise<Answer & { replayed: boolean }> {
  const before = await storedAnswer(r, key);
  if (before) return replay(before, r, hash);
  try {
    const answer = await getDb().transaction(async (tx) => {
      // Claim the key first: a concurrent twin waits here until this transaction ends.
      await tx.insert(idempotencyKeys).values({ householdId: r.householdId, userId: r.userId, key, route: r.route, requestHash: hash, status: 0, response: '' });
      const result = await work(tx);
      await tx.update(idempotencyKeys).set({ status: result.status, response: JSON.stringify(result.body) }).where(keyRow(r, key));
      return result;
    });
    return { ...answer, replayed: false };
  } catch (e) {
    if (!isDuplicateKey(e)) throw e;
    // The twin committed first (its duplicate-key error rolled back everything we wrote).
    const after = await storedAnswer(r, key);
    if (after) return replay(after, r, hash);
    throw new HttpError(409, 'idempotency_conflict', 'The same request is still being saved; try again in a moment.');
  }
}

/** The JSON response for an answer; a replay says so in the Idempotency-Replayed header. */
export function answerResponse(a: Answer & { replayed: boolean }): Response {
  return json(a.body, a.status, a.replayed ? { 'idempotency-replayed': 'true' } : {});
}
