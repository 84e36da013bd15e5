/**
 * The share report's rollup: harvests and purchases already summed as the report groups them
 * (harvest_groups, purchase_groups; see src/db/schema.ts), so a report reads a few rows per month
 * and crop instead of grouping every weighing again. Triggers on the entry tables keep the rollup
 * in step with every write in the writer's own transaction (drizzle/0009_share_rollup.sql): an
 * insert adds its entry to its group, a delete takes it off (a group with no entries left goes), an
 * edit does both, and a lot's first larder record takes it out (the report reads such lots one by
 * one) until its last record goes.
 *
 * `rebuildShareRollup` computes one household's groups again from its raw entries — the
 * recomputation the tests compare the kept rollup with, and a repair should one ever drift.
 */
import { and, eq, gte, inArray, lte, notExists, or, sql, type SQL } from 'drizzle-orm';
import type { Db } from '@/db/client';
import { crops, harvestGroups, harvests, larderOutcomes, purchaseGroups, purchases } from '@/db/schema';
import { cropDisplayName } from '@/lib/crop-name';
import { ENTRY_LIMITS } from '@/lib/entry-schemas';
import { addMonths, daysInMonth } from '@/lib/months';
import { isPreserveMethod } from '@/lib/retention';
import type { GroupRow } from '@/lib/share-groups';
import type { Use } from '@/lib/uses';
import type { Pool } from 'mysql2/promise';
import { rawQuery } from './raw-query';

function lastDay(month: string): string {
  return `${month}-${String(daysInMonth(month)).padStart(2, '0')}`;
}

/** 'YYYY-MM' → 'YYYYMM', the period format of MariaDB's PERIOD_DIFF. */
const period = (month: string) => month.replace('-', '');

/** First day of the earliest month whose stored or bought food can still be eaten in `from`. */
const lookback = (from: string) => `${addMonths(from, -ENTRY_LIMITS.maxSpreadMonths)}-01`;

/** Subtracting an entry from its group can leave a rounding crumb below zero: never a negative weight. */
const weight = (v: number) => (v > 0 ? v : 0);

const at = {
  household: sql.placeholder('householdId'),
  /** lookback(from): the first day a group can be dated and still be eaten in the range. */
  start: sql.placeholder('start'),
  /** lastDay(to) */
  end: sql.placeholder('end'),
  /** The range's first day. */
  first: sql.placeholder('first'),
  /** period(from) */
  period: sql.placeholder('period'),
};

/**
 * A group's day as 'YYYY-MM-DD' text, the form the report reads it in: sent as text, mysql2 decodes
 * it as it is, where a DATE in the binary protocol is rebuilt from its parts and padded digit by
 * digit (0.1–0.2 ms of a 12-month report's 538 harvest groups; over 10 years the query's own time
 * varied more than that).
 */
const dayText = (day: typeof harvestGroups.day | typeof purchaseGroups.day) => sql`CAST(${day} AS CHAR(10))`;

/** The placeholders' values for [from, to]. */
function rangeValues(householdId: number, from: string, to: string) {
  return { householdId, start: lookback(from), end: lastDay(to), first: `${from}-01`, period: period(from) };
}

const harvestGroupsIn = rawQuery<RawGroup>(sql`
    SELECT ${dayText(harvestGroups.day)} AS date, ${harvestGroups.use} AS \`use\`, ${harvestGroups.spread} AS spread, ${harvestGroups.preserveMethod} AS preserveMethod,
           ${harvestGroups.cropId} AS cropId, ${harvestGroups.foodId} AS foodId,
           ${harvestGroups.grams} AS grams, ${harvestGroups.edibleGrams} AS edibleGrams, ${harvestGroups.entries} AS entries
      FROM ${harvestGroups}
     WHERE ${and(
       eq(harvestGroups.householdId, at.household),
       gte(harvestGroups.day, at.start),
       lte(harvestGroups.day, at.end),
       or(
         gte(harvestGroups.day, at.first),
         // ≤: a lot spread by day from late in a month reaches one month further than its spread.
         and(inArray(harvestGroups.use, ['stored', 'preserved']), sql`PERIOD_DIFF(${at.period}, DATE_FORMAT(${harvestGroups.day}, '%Y%m')) <= ${harvestGroups.spread}`),
       ),
     )}`);

/** The household's crops as a group names and filters them (a few dozen rows). */
const householdCrops = rawQuery<{ id: number; name: string; variety: string | null; notFood: number }>(sql`
    SELECT ${crops.id} AS id, ${crops.name} AS name, ${crops.variety} AS variety, ${crops.notFood} AS notFood
      FROM ${crops} WHERE ${eq(crops.householdId, at.household)}`);

/**
 * Harvest groups whose eating can fall in [from, to] or that are dated in it: dated in the range,
 * or stored/preserved earlier with a spread reaching `from`. Not-food crops never count as food,
 * nor a crop of another household. Names: the crop with its variety; null for a group with no crop
 * (the caller names it after its food, from the foods' facts it reads anyway: see share-data.ts).
 * The report reads thousands of groups: the groups come from the rollup alone (one index range,
 * no join per row) beside the household's few crops, read in parallel and matched here; the
 * query is written once (raw-query.ts) and its rows read as mysql2 gives them.
 */
export async function harvestGroupRows(pool: Pool, householdId: number, from: string, to: string): Promise<GroupRow[]> {
  const [rows, cropRows] = await Promise.all([harvestGroupsIn.run(pool, rangeValues(householdId, from, to)), householdCrops.run(pool, { householdId })]);
  const cropsById = new Map(cropRows.map((c) => [c.id, { name: cropDisplayName(c.name, c.variety), notFood: Boolean(c.notFood) }]));
  const out: GroupRow[] = [];
  // Each row made a GroupRow in place: thousands of rows, no copies.
  for (const r of rows) {
    const crop = r.cropId === 0 ? null : cropsById.get(r.cropId);
    // A crop not (or no longer) the household's, or one that is not food, never counts.
    if (crop === undefined || crop?.notFood) continue;
    const g = r as unknown as GroupRow;
    g.month = r.date.slice(0, 7);
    g.preserveMethod = isPreserveMethod(r.preserveMethod) ? r.preserveMethod : null;
    g.cropId = r.cropId === 0 ? null : r.cropId;
    g.foodId = r.foodId === 0 ? null : r.foodId;
    g.name = crop?.name ?? null;
    g.grams = weight(r.grams);
    g.edibleGrams = weight(r.edibleGrams);
    out.push(g);
  }
  return out;
}

/** A harvest group as mysql2 reads it (its day as 'YYYY-MM-DD' text: dayText). */
interface RawGroup {
  date: string;
  use: Use;
  spread: number;
  preserveMethod: string;
  cropId: number;
  foodId: number;
  grams: number;
  edibleGrams: number;
  entries: number;
}

const purchaseGroupsIn = rawQuery<Omit<RawGroup, 'use' | 'preserveMethod' | 'cropId'>>(sql`
    SELECT ${dayText(purchaseGroups.day)} AS date, ${purchaseGroups.spread} AS spread, ${purchaseGroups.foodId} AS foodId,
           ${purchaseGroups.grams} AS grams, ${purchaseGroups.edibleGrams} AS edibleGrams, ${purchaseGroups.entries} AS entries
      FROM ${purchaseGroups}
     WHERE ${and(
       eq(purchaseGroups.householdId, at.household),
       gte(purchaseGroups.day, at.start),
       lte(purchaseGroups.day, at.end),
       or(gte(purchaseGroups.day, at.first), sql`PERIOD_DIFF(${at.period}, DATE_FORMAT(${purchaseGroups.day}, '%Y%m')) <= ${purchaseGroups.spread}`),
     )}`);

/** Purchase groups whose eating can fall in [from, to] (bought food is always spread). */
export async function purchaseGroupRows(pool: Pool, householdId: number, from: string, to: string): Promise<GroupRow[]> {
  const rows = await purchaseGroupsIn.run(pool, rangeValues(householdId, from, to));
  return rows.map((r) => ({
    month: r.date.slice(0, 7),
    date: r.date,
    use: 'fresh',
    spread: r.spread,
    cropId: null,
    foodId: r.foodId,
    name: null,
    grams: weight(r.grams),
    edibleGrams: weight(r.edibleGrams),
    entries: r.entries,
  }));
}

/** A new share version, as the triggers stamp it (drizzle/0009_share_rollup.sql). */
export const versionStamp = sql`CONCAT(UNIX_TIMESTAMP(NOW(6)), '.', @@server_id, '.', CONNECTION_ID())`;

/** The group day of an entry: its own day for a lot eaten by day, else its month's first day. */
function groupDay(date: typeof harvests.date | typeof purchases.date, byDay: SQL): SQL<string> {
  return sql<string>`IF(${byDay}, ${date}, ${date} - INTERVAL (DAYOFMONTH(${date}) - 1) DAY)`;
}

/**
 * Rebuilds one household's rollup from its raw entries (the same grouping the triggers keep), in
 * one transaction that first takes the household's share version row, as every writer does.
 */
export async function rebuildShareRollup(db: Db, householdId: number): Promise<void> {
  await db.transaction(async (tx) => {
    await tx.execute(sql`INSERT INTO share_versions (household_id, version) VALUES (${householdId}, ${versionStamp}) ON DUPLICATE KEY UPDATE version = VALUES(version)`);
    await tx.delete(harvestGroups).where(eq(harvestGroups.householdId, householdId));
    await tx.delete(purchaseGroups).where(eq(purchaseGroups.householdId, householdId));
    const h = harvests;
    const hDay = groupDay(h.date, sql`${h.use} IN ('stored', 'preserved') AND ${h.spreadMonths} >= 2`);
    const hSpread = sql<number>`GREATEST(${h.spreadMonths}, 1)`;
    const hMethod = sql<string>`COALESCE(${h.preserveMethod}, '')`;
    const hCrop = sql<number>`COALESCE(${h.cropId}, 0)`;
    const hFood = sql<number>`COALESCE(${h.foodId}, 0)`;
    await tx.insert(harvestGroups).select(
      tx
        .select({
          householdId: h.householdId,
          day: hDay.as('day'),
          use: h.use,
          spread: hSpread.as('spread'),
          preserveMethod: hMethod.as('preserve_method'),
          cropId: hCrop.as('crop_id'),
          foodId: hFood.as('food_id'),
          grams: sql<number>`SUM(${h.grams})`.as('grams'),
          edibleGrams: sql<number>`SUM(${h.edibleGrams})`.as('edible_grams'),
          entries: sql<number>`COUNT(*)`.as('entries'),
        })
        .from(h)
        .where(and(eq(h.householdId, householdId), notExists(tx.select({ one: sql`1` }).from(larderOutcomes).where(eq(larderOutcomes.harvestId, h.id)))))
        .groupBy(h.householdId, hDay, h.use, hSpread, hMethod, hCrop, hFood),
    );
    const p = purchases;
    const pDay = groupDay(p.date, sql`${p.spreadMonths} >= 2`);
    const pSpread = sql<number>`GREATEST(${p.spreadMonths}, 1)`;
    await tx.insert(purchaseGroups).select(
      tx
        .select({
          householdId: p.householdId,
          day: pDay.as('day'),
          spread: pSpread.as('spread'),
          foodId: p.foodId,
          grams: sql<number>`SUM(${p.grams})`.as('grams'),
          edibleGrams: sql<number>`SUM(${p.edibleGrams})`.as('edible_grams'),
          entries: sql<number>`COUNT(*)`.as('entries'),
        })
        .from(p)
        .where(eq(p.householdId, householdId))
        .groupBy(p.householdId, pDay, pSpread, p.foodId),
    );
  });
}
