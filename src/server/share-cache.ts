/**
 * Stored share answers: the JSON of GET …/share as it was sent, kept in share_cache per household
 * and a key naming the request as asked (its range, or none for the default, and the build),
 * beside the context it was worked out in (the range that meant, current month, zone, records
 * start, creation date). An answer is valid while its context is still the household's, and the
 * household's share version — stamped anew by every statement that writes its entries, larder
 * records, crops or people, by triggers in the writer's transaction (drizzle/0009_share_rollup.sql)
 * — and the reference datasets' revision (one more on every food reload) are the ones stored
 * beside it. The key needs nothing but the URL, so the lookup rides on the household gate's own
 * query (storedAnswerColumns, read by householdRouteWith in authz.ts): a valid answer costs one
 * query after the session and is sent as stored, without parsing or writing JSON again. Nothing
 * lives in process memory, so every app server sees the same answers and the same invalidation.
 *
 * The version is read before the report is worked out: a write that lands meanwhile leaves the new
 * answer labelled with the older version, so it is never served after that write. A household with
 * no version row yet (nothing written since migration 0009) has the version ''.
 */
import { createHash, randomUUID } from 'node:crypto';
import { promisify } from 'node:util';
import { gzip as gzipCallback } from 'node:zlib';
import { and, eq, ne, sql, type SQL } from 'drizzle-orm';
import type { AnyMySqlColumn } from 'drizzle-orm/mysql-core';
import { getDb, getPool } from '@/db/client';
import { datasets, shareCache, shareVersions } from '@/db/schema';
import { householdShare, type ShareHousehold } from './share-data';

const gzipAsync = promisify(gzipCallback);

/** Set at build time (astro.config.mjs); from sources each process gets its own, so no answer outlives its code. */
declare const __SELFSOWN_BUILD__: string | undefined;
const BUILD = typeof __SELFSOWN_BUILD__ === 'string' ? __SELFSOWN_BUILD__ : `source-${randomUUID()}`;

/**
 * The key of a request: its range as asked and the build, e.g. '2026-01|2026-12|<build>' ('||<build>'
 * for the default range). Unchecked: a bad range is refused before anything is stored under it, and
 * a key too long for the column is hashed (it can only miss).
 */
export function requestKey(from: string | null, to: string | null): string {
  const key = `${from ?? ''}|${to ?? ''}|${BUILD}`;
  return key.length <= 190 ? key : createHash('sha256').update(key).digest('base64url');
}

/** What else an answer rests on besides the household's records and the reference foods (`currentMonth`: now in the household's zone). */
export function answerContext(household: ShareHousehold, range: { from: string; to: string; currentMonth: string }): string {
  return [range.from, range.to, range.currentMonth, household.timezone, household.recordsSince ?? '', household.createdAt.toISOString()].join('|');
}

/** The stored answer of a request as the gate's query found it, with the version and revision it read. */
export interface StoredAnswer {
  /**
   * The stored answer when its version and revision are current, else null, in one value (one
   * lookup instead of one per part): '1' when the bytes are the gzip copy (asked for with `gzip`
   * = 1 and stored) or '0', its context, a NUL byte, then the bytes (storedParts reads it).
   */
  storedAnswer: Buffer | null;
  shareVersion: string;
  referenceRevision: number | string;
}

/** A stored answer's parts: its JSON bytes (sent without decoding), whether they are gzip, and its context. */
export interface StoredParts {
  body: Buffer;
  gzip: boolean;
  context: string;
}

/**
 * The parts of StoredAnswer.storedAnswer, null for none; a context never holds a NUL, so the first
 * one ends it. A value without one cannot be read: null too, so the answer is worked out afresh.
 */
export function storedParts(stored: Buffer | null): StoredParts | null {
  if (stored === null) return null;
  const end = stored.indexOf(0, 1);
  if (end < 0) return null;
  return { gzip: stored[0] === 0x31, context: stored.toString('utf8', 1, end), body: stored.subarray(end + 1) };
}

const householdId = sql.placeholder('householdId');
const answerKey = sql.placeholder('answerKey');
const gzip = sql.placeholder('gzip');
const version = sql`COALESCE((SELECT ${shareVersions.version} FROM ${shareVersions} WHERE ${shareVersions.householdId} = ${householdId}), '')`;
const revision = sql`(SELECT COALESCE(SUM(${datasets.revision}), 0) FROM ${datasets})`;
/** Whether the gzip copy goes out: the client takes it and it is stored. */
const zipped = sql`${gzip} = 1 AND ${shareCache.bodyGzip} IS NOT NULL`;
const current = sql`FROM ${shareCache} WHERE ${shareCache.householdId} = ${householdId} AND ${shareCache.answerKey} = ${answerKey}
    AND ${shareCache.version} = ${version} AND ${shareCache.referenceRevision} = ${revision}`;

/**
 * The lookup as columns of the gate's query (subqueries on constants, evaluated once), on the
 * placeholders `householdId`, `answerKey` (requestKey) and `gzip` (1 when the client accepts it).
 */
export const storedAnswerColumns: { [K in keyof StoredAnswer]: SQL<StoredAnswer[K]> } = {
  // As bytes: the answer goes out as it is stored, never decoded into a string and encoded again;
  // compressed when the client takes gzip and the copy is there (a quarter of the bytes to read and send).
  // One subquery for flag, context and bytes: MariaDB's work per request was 145 µs against 170–205 µs
  // with one subquery per part (measured here, 2 cores).
  storedAnswer: sql<Buffer | null>`(SELECT CONCAT(IF(${zipped}, '1', '0'), ${shareCache.context}, CHAR(0), IF(${zipped}, ${shareCache.bodyGzip}, CAST(${shareCache.body} AS BINARY))) ${current})`,
  shareVersion: sql<string>`${version}`,
  referenceRevision: sql<number | string>`${revision}`,
};

/**
 * Stores an answer and drops the household's answers of other versions. Written by the builder,
 * sent as a prepared statement: the body goes as it is (the text protocol escapes every
 * character of a 500 KB answer first), and only once (the update reads it back with VALUES()).
 */
async function store(householdId: number, key: string, found: StoredAnswer, context: string, body: string): Promise<void> {
  const db = getDb();
  // Compressed once here, on libuv's thread pool, instead of on every request that takes gzip.
  const bodyGzip = await gzipAsync(body);
  const again = (column: AnyMySqlColumn) => sql`VALUES(${column})`;
  const insert = db
    .insert(shareCache)
    .values({ householdId, answerKey: key, version: found.shareVersion, referenceRevision: Number(found.referenceRevision), context, body, bodyGzip })
    .onDuplicateKeyUpdate({
      set: {
        version: again(shareCache.version),
        referenceRevision: again(shareCache.referenceRevision),
        context: again(shareCache.context),
        body: again(shareCache.body),
        bodyGzip: again(shareCache.bodyGzip),
        createdAt: sql`CURRENT_TIMESTAMP`,
      },
    })
    .toSQL();
  const drop = db.delete(shareCache).where(and(eq(shareCache.householdId, householdId), ne(shareCache.version, found.shareVersion))).toSQL();
  await getPool().execute(insert.sql, insert.params as (string | number | Buffer)[]);
  await getPool().execute(drop.sql, drop.params as (string | number)[]);
}

/**
 * The share report of [from, to] as JSON: the stored answer `found` by the gate when it is still
 * valid (its bytes; `gzip` when they are the compressed copy the gate was asked for), else worked
 * out by householdShare() (text, never compressed: that would cost the waiting client) with
 * `store`, which the caller runs once the answer has gone out (compressing and writing it while
 * the answer is being sent would delay it). Throws what householdShare throws (RangeError when it
 * cannot be computed).
 */
export async function householdShareJson(
  household: ShareHousehold,
  range: { from: string; to: string; currentMonth: string },
  key: string,
  found: StoredAnswer,
  now: Date = new Date(),
): Promise<{ body: string | Buffer; gzip: boolean; store?: () => void }> {
  const { from, to } = range;
  const context = answerContext(household, range);
  const stored = storedParts(found.storedAnswer);
  if (stored && stored.context === context) return { body: stored.body, gzip: stored.gzip };
  const body = JSON.stringify(await householdShare(household, from, to, undefined, now, found.referenceRevision));
  const keep = () => void store(household.id, key, found, context, body).catch((e: unknown) => console.error('share cache: could not store an answer', e));
  return { body, gzip: false, store: keep };
}
