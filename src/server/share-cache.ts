/**
 * Stored share answers: the JSON of GET …/share as it was sent, kept in share_cache per household
 * and a key naming everything else it rests on (range, current month, zone, records start, creation
 * date, build). An answer is valid while the household's share version — stamped anew by every
 * statement that writes its entries, larder records, crops or people, by triggers in the writer's transaction
 * (drizzle/0009_share_rollup.sql) — and the reference datasets' revision (one more on every food
 * reload) are the ones stored beside it. One query looks an answer up with both; a valid one is
 * sent as stored, without parsing or writing JSON again. Nothing lives in process memory, so every
 * app server sees the same answers and the same invalidation.
 *
 * The version is read before the report is worked out: a write that lands meanwhile leaves the new
 * answer labelled with the older version, so it is never served after that write. A household with
 * no version row yet (nothing written since migration 0009) has the version ''.
 */
import { createHash, randomUUID } from 'node:crypto';
import { sql } from 'drizzle-orm';
import { getDb } from '@/db/client';
import { shareCache } from '@/db/schema';
import { currentMonth } from './people';
import { householdShare, type ShareHousehold } from './share-data';

/** Set at build time (astro.config.mjs); from sources each process gets its own, so no answer outlives its code. */
declare const __SELFSOWN_BUILD__: string | undefined;
const BUILD = typeof __SELFSOWN_BUILD__ === 'string' ? __SELFSOWN_BUILD__ : `source-${randomUUID()}`;

/** The key of an answer: everything besides the household's records and the reference foods that it rests on. */
export function answerKey(household: ShareHousehold, from: string, to: string, now: Date): string {
  const parts = [from, to, currentMonth(household.timezone, now), household.timezone, household.recordsSince ?? '', household.createdAt.toISOString(), BUILD];
  return createHash('sha256').update(parts.join('|')).digest('base64url');
}

interface Lookup {
  body: string | null;
  version: string;
  revision: number;
}

async function lookup(householdId: number, key: string): Promise<Lookup> {
  const [rows] = (await getDb().execute(sql`
    SELECT IF(c.version = COALESCE(v.version, '') AND c.reference_revision = r.revision, c.body, NULL) AS body,
           COALESCE(v.version, '') AS version, r.revision AS revision
      FROM (SELECT COALESCE(SUM(revision), 0) AS revision FROM datasets) r
      LEFT JOIN share_versions v ON v.household_id = ${householdId}
      LEFT JOIN share_cache c ON c.household_id = ${householdId} AND c.answer_key = ${key}`)) as unknown as [{ body: string | null; version: string; revision: number | string }[]];
  const r = rows[0]!;
  return { body: r.body, version: r.version, revision: Number(r.revision) };
}

/** Stores an answer and drops the household's answers of other versions (not awaited by the reader). */
async function store(householdId: number, key: string, found: Lookup, body: string): Promise<void> {
  const db = getDb();
  await db
    .insert(shareCache)
    .values({ householdId, answerKey: key, version: found.version, referenceRevision: found.revision, body })
    .onDuplicateKeyUpdate({ set: { version: found.version, referenceRevision: found.revision, body, createdAt: sql`CURRENT_TIMESTAMP` } });
  await db.execute(sql`DELETE FROM share_cache WHERE household_id = ${householdId} AND version <> ${found.version}`);
}

/**
 * The share report of [from, to] as JSON text: the stored answer when it is still valid, else
 * worked out by householdShare() and stored for the next reader.
 * Throws what householdShare throws (RangeError when the report cannot be computed).
 */
export async function householdShareJson(household: ShareHousehold, from: string, to: string, now: Date = new Date()): Promise<string> {
  const key = answerKey(household, from, to, now);
  const found = await lookup(household.id, key);
  if (found.body !== null) return found.body;
  const body = JSON.stringify(await householdShare(household, from, to, undefined, now));
  store(household.id, key, found, body).catch((e: unknown) => console.error('share cache: could not store an answer', e));
  return body;
}
