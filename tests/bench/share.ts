/**
 * The share rows of `npm run bench`: GET /share through HTTP (the built server, signed in) against
 * the bare SQL grouping of the raw entries it rests on, run through mysql2 with no further work —
 * the harvests and purchases dated in the range summed by (month, use, spread, crop, food), the
 * grouping the issue measured before any change. Rounds alternate bare and HTTP. Every HTTP round
 * is cold: the household's cached answer is voided first (as any write does), so the rows time
 * the report's own work, never a stored answer.
 */
import type { Pool } from 'mysql2/promise';
import { addMonths, monthOf } from '@/lib/months';
import { median, ratioRow, since, type BenchRow } from './rows';
import type { BenchServer } from './server';

/** The bare aggregate: the same grouping of entries, with no further work. */
export async function bareAggregate(pool: Pool, householdId: number, from: string, to: string): Promise<number> {
  const [a] = await pool.query(
    `SELECT DATE_FORMAT(h.date, '%Y-%m') AS m, h.use, h.spread_months, h.crop_id, h.food_id, SUM(h.edible_grams) AS g
       FROM harvests h WHERE h.household_id = ? AND h.date BETWEEN ? AND ?
      GROUP BY m, h.use, h.spread_months, h.crop_id, h.food_id`,
    [householdId, `${from}-01`, `${to}-31`],
  );
  const [b] = await pool.query(
    `SELECT DATE_FORMAT(p.date, '%Y-%m') AS m, p.spread_months, p.food_id, SUM(p.edible_grams) AS g
       FROM purchases p WHERE p.household_id = ? AND p.date BETWEEN ? AND ?
      GROUP BY m, p.spread_months, p.food_id`,
    [householdId, `${from}-01`, `${to}-31`],
  );
  return (a as unknown[]).length + (b as unknown[]).length;
}

/** Entries (harvests and purchases) dated in the range. */
async function entriesIn(pool: Pool, householdId: number, from: string, to: string): Promise<number> {
  const [rows] = await pool.query(
    `SELECT (SELECT COUNT(*) FROM harvests WHERE household_id = ? AND date BETWEEN ? AND ?)
          + (SELECT COUNT(*) FROM purchases WHERE household_id = ? AND date BETWEEN ? AND ?) AS n`,
    [householdId, `${from}-01`, `${to}-31`, householdId, `${from}-01`, `${to}-31`],
  );
  return Number((rows as { n: number }[])[0]!.n);
}

/**
 * Voids the household's stored share answers, as every write to its records does (the version
 * table of src/server/share-cache.ts); a database from before that table has nothing to void.
 */
export async function voidCachedShare(pool: Pool, householdId: number): Promise<void> {
  try {
    await pool.query("INSERT INTO share_versions (household_id, version) VALUES (?, CONCAT(UNIX_TIMESTAMP(NOW(6)), '.bench')) ON DUPLICATE KEY UPDATE version = VALUES(version)", [householdId]);
  } catch (e) {
    if ((e as { code?: string }).code !== 'ER_NO_SUCH_TABLE') throw e;
  }
}

/** One cold GET of the share report; throws unless 200. */
async function getShare(server: BenchServer, pool: Pool, householdId: number, range?: { from: string; to: string }): Promise<number> {
  await voidCachedShare(pool, householdId);
  const q = range ? `?from=${range.from}&to=${range.to}` : '';
  const t0 = performance.now();
  const r = await fetch(`${server.base}/api/households/${householdId}/share${q}`, { headers: { cookie: server.cookie } });
  const body = await r.text();
  const ms = since(t0);
  if (r.status !== 200) throw new Error(`GET share answered ${r.status}: ${body.slice(0, 200)}`);
  return ms;
}

/** Untimed rounds of both paths before the timed ones (BENCH_WARMUP, default 20). */
const WARMUP_ROUNDS = Number(process.env.BENCH_WARMUP || 20);

/** Medians of alternating rounds after WARMUP_ROUNDS untimed ones: bare SQL, then the report through HTTP. */
async function sideBySide(server: BenchServer, pool: Pool, householdId: number, range: { from: string; to: string }, rounds: number) {
  const bare: number[] = [];
  const http: number[] = [];
  // Untimed rounds first: a running service has its code compiled by V8's optimising tiers and
  // MariaDB's pages in memory, and a fresh bench server has neither for its first few reports.
  for (let i = 0; i < WARMUP_ROUNDS; i++) {
    await bareAggregate(pool, householdId, range.from, range.to);
    await getShare(server, pool, householdId, range);
  }
  for (let i = 0; i < rounds; i++) {
    const t0 = performance.now();
    await bareAggregate(pool, householdId, range.from, range.to);
    bare.push(since(t0));
    http.push(await getShare(server, pool, householdId, range));
  }
  return { bare: median(bare), http: median(http) };
}

export interface ShareBenchInput {
  server: BenchServer;
  smallServer: BenchServer;
  pool: Pool;
  smallPool: Pool;
  heavyId: number;
  smallId: number;
  smallAloneId: number;
  anchor: string;
  rounds: number;
}

/** share-10y, share-12m, share-growth and share-service. */
export async function benchShare(input: ShareBenchInput): Promise<BenchRow[]> {
  const { server, pool, heavyId, rounds } = input;
  const to = monthOf(input.anchor);
  const tenYears = { from: addMonths(to, -119), to };
  const oneYear = { from: addMonths(to, -11), to };
  const ten = await sideBySide(server, pool, heavyId, tenYears, rounds);
  const one = await sideBySide(server, pool, heavyId, oneYear, rounds);
  const n10 = await entriesIn(pool, heavyId, tenYears.from, tenYears.to);
  const n1 = await entriesIn(pool, heavyId, oneYear.from, oneYear.to);
  console.log(`  share over 10 years: ${n10} entries; over 12 months: ${n1}`);

  // The small household's default range (its growing year), beside 2,000 others and alone.
  const loaded: number[] = [];
  const alone: number[] = [];
  for (let i = 0; i < WARMUP_ROUNDS; i++) {
    await getShare(server, pool, input.smallId);
    await getShare(input.smallServer, input.smallPool, input.smallAloneId);
  }
  for (let i = 0; i < rounds; i++) {
    loaded.push(await getShare(server, pool, input.smallId));
    alone.push(await getShare(input.smallServer, input.smallPool, input.smallAloneId));
  }
  return [
    ratioRow('share-10y', ten.http, ten.bare, 1.5),
    ratioRow('share-12m', one.http, one.bare, 1.5),
    ratioRow('share-growth', ten.http / one.http, n10 / n1, 1.0),
    ratioRow('share-service', median(loaded), median(alone), 1.2),
  ];
}
