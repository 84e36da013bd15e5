/**
 * The share report of a household over a range of months: a few aggregate queries (harvests,
 * purchases, people, nutrients, datasets) feeding the pure code of src/lib (share-groups.ts,
 * shares.ts, top-crops.ts, use-totals.ts). Used by the share endpoint, the dashboard and later the
 * monthly e-mail and the planner.
 *
 * Entries come grouped by (month, use, spread, crop, food, preserving method) from the rollup that
 * triggers keep with every write (share-rollup.ts), so the rows grow with the variety of what was
 * logged, not with the number of weighings; a lot eaten over 2 months or more is grouped by its
 * day instead of its month, because it is spread by day. Lots with larder records are read one by
 * one. Queries go through Drizzle's builder and `sql` templates that name the schema's columns.
 */
import { and, eq, gte, inArray, lte, min, sql, type SQL } from 'drizzle-orm';
import type { Pool } from 'mysql2/promise';
import { getDb, getPool, type Db } from '@/db/client';
import { crops, datasets, foodNutrients, foods, harvestGroups, harvests, larderOutcomes, purchaseGroups, purchases, type Household } from '@/db/schema';
import { ENTRY_LIMITS } from '@/lib/entry-schemas';
import type { OutcomeRecord } from '@/lib/larder';
import { lotGroupRows, type OutcomeLot } from '@/lib/larder-share';
import type { LarderOutcomeKind } from '@/lib/larder-outcomes';
import { addMonths, daysInMonth, todayIn } from '@/lib/months';
import { SHARE_NUTRIENTS, type ShareNutrientKey } from '@/lib/nutrients';
import { needsPerson } from '@/lib/people-schemas';
import { defaultRecordsSince } from '@/lib/records-start';
import { foodIdsOf, groupEntry, shareGroups, type FoodAmounts, type GroupRow } from '@/lib/share-groups';
import type { DatasetRef, ShareResponse } from '@/lib/share-types';
import { computeShare } from '@/lib/shares';
import { topCrops } from '@/lib/top-crops';
import { useTotals } from '@/lib/use-totals';
import { dbOn } from './db-on';
import { rawQuery } from './raw-query';
import { countsAsFood, cropOfHarvest, foodOfHarvest, harvestNameSql } from './harvest-sql';
import { harvestGroupRows, purchaseGroupRows } from './share-rollup';
import { currentMonth, listPeople, personFields } from './people';
import { loadRetention } from './retention-file';

function lastDay(month: string): string {
  return `${month}-${String(daysInMonth(month)).padStart(2, '0')}`;
}

/** First day of the earliest month whose stored or bought food can still be eaten in `from`. */
const lookback = (from: string) => `${addMonths(from, -ENTRY_LIMITS.maxSpreadMonths)}-01`;

/**
 * The stored and preserved lots with larder records that can fall in [from, to], one by one (read
 * with their records in one query), each turned into its eaten segments and lost parts
 * (src/lib/larder-share.ts). No lot lasts longer
 * than ENTRY_LIMITS.maxSpreadMonths (larder.ts), so the same look-back as the grouped query holds.
 */
async function outcomeLotGroups(pool: Pool, householdId: number, from: string, to: string): Promise<GroupRow[]> {
  const rows = await lotRecords.run(pool, { householdId, start: lookback(from), end: lastDay(to) });
  const out: GroupRow[] = [];
  // One row per lot and record: a lot's rows come together, its records in date order.
  for (let i = 0; i < rows.length; ) {
    const { id, date, use, spread, preserveMethod, cropId, foodId, name, grams, edibleGrams } = rows[i]!;
    const records: OutcomeRecord[] = [];
    for (; i < rows.length && rows[i]!.id === id; i++) {
      const r = rows[i]!;
      records.push({ id: r.outcomeId, kind: r.kind, date: r.outcomeDate, lostFraction: r.lostFraction, until: r.until });
    }
    out.push(...lotGroupRows({ date, use, spread, preserveMethod, cropId, foodId, name, grams, edibleGrams }, records));
  }
  return out;
}

/** The lots with larder records and their records, in one query (lot columns repeated per record). */
const lotRecords = rawQuery<
  OutcomeLot & { id: number; outcomeId: number; kind: LarderOutcomeKind; outcomeDate: string; lostFraction: number | null; until: string | null }
>(sql`
    SELECT ${harvests.id} AS id, ${harvests.date} AS date, ${harvests.use} AS \`use\`, GREATEST(${harvests.spreadMonths}, 1) AS spread,
           ${harvests.preserveMethod} AS preserveMethod, ${harvests.cropId} AS cropId, ${harvests.foodId} AS foodId,
           ${harvestNameSql()} AS name, ${harvests.grams} AS grams, ${harvests.edibleGrams} AS edibleGrams,
           ${larderOutcomes.id} AS outcomeId, ${larderOutcomes.kind} AS kind, ${larderOutcomes.date} AS outcomeDate,
           ${larderOutcomes.lostFraction} AS lostFraction, ${larderOutcomes.until} AS \`until\`
      FROM ${larderOutcomes}
      JOIN ${harvests} ON ${harvests.id} = ${larderOutcomes.harvestId}
      LEFT JOIN ${crops} ON ${cropOfHarvest()}
      LEFT JOIN ${foods} ON ${foodOfHarvest()}
     WHERE ${and(
       // Driven from the household's records (a few lots), not by probing every harvest in the range.
       eq(larderOutcomes.householdId, sql.placeholder('householdId')),
       eq(harvests.householdId, sql.placeholder('householdId')),
       gte(harvests.date, sql.placeholder('start')),
       lte(harvests.date, sql.placeholder('end')),
       countsAsFood(),
     )}
     ORDER BY ${harvests.id}, ${larderOutcomes.date}, ${larderOutcomes.id}`);

/** The date of the household's first harvest or purchase, or null when it has logged nothing. */
async function firstEntryDate(db: Db, householdId: number): Promise<string | null> {
  const [[h], [p]] = await Promise.all([
    db.select({ d: min(harvests.date) }).from(harvests).where(eq(harvests.householdId, householdId)),
    db.select({ d: min(purchases.date) }).from(purchases).where(eq(purchases.householdId, householdId)),
  ]);
  const dates = [h?.d, p?.d].filter((d): d is string => typeof d === 'string');
  return dates.length === 0 ? null : dates.sort()[0]!;
}

/** What the report needs of a reference food: its share nutrients per 100 g and its dataset. */
interface FoodFacts {
  amounts: FoodAmounts;
  datasets: Map<number, DatasetRef>;
}

/** A food's share nutrient (one row per food and nutrient; a food with none comes once, with nulls) and its dataset. */
interface FoodFactRow {
  foodId: number;
  slug: string;
  datasetName: string;
  release: string;
  nutrientKey: ShareNutrientKey | null;
  amount: string | number | null;
}

/** The facts of the foods a subquery names (its column `food_id`). */
function foodFactsOf(chosen: SQL): SQL {
  return sql`
    SELECT ${foods.id} AS foodId, ${datasets.slug} AS slug, ${datasets.name} AS datasetName, ${datasets.release} AS \`release\`,
           ${foodNutrients.nutrientKey} AS nutrientKey, ${foodNutrients.amount} AS amount
      FROM (${chosen}) chosen
      JOIN ${foods} ON ${foods.id} = chosen.food_id
      JOIN ${datasets} ON ${datasets.id} = ${foods.datasetId}
      LEFT JOIN ${foodNutrients} ON ${foodNutrients.foodId} = ${foods.id} AND ${inArray(foodNutrients.nutrientKey, [...SHARE_NUTRIENTS])}`;
}

/**
 * The foods the report of [from, to] can meet: those of the household's groups in the groups'
 * own look-back window and of its lots with larder records (a superset of what the group queries
 * return), so their facts are read beside the groups instead of after them.
 */
const factsOfFoodsNear = rawQuery<FoodFactRow>(
  foodFactsOf(sql`SELECT ${harvestGroups.foodId} AS food_id FROM ${harvestGroups}
      WHERE ${and(eq(harvestGroups.householdId, sql.placeholder('householdId')), gte(harvestGroups.day, sql.placeholder('start')), lte(harvestGroups.day, sql.placeholder('end')))}
    UNION SELECT ${purchaseGroups.foodId} FROM ${purchaseGroups}
      WHERE ${and(eq(purchaseGroups.householdId, sql.placeholder('householdId')), gte(purchaseGroups.day, sql.placeholder('start')), lte(purchaseGroups.day, sql.placeholder('end')))}
    UNION SELECT ${harvests.foodId} FROM ${larderOutcomes} JOIN ${harvests} ON ${harvests.id} = ${larderOutcomes.harvestId}
      WHERE ${eq(larderOutcomes.householdId, sql.placeholder('householdId'))}`),
);

/** The facts of the foods near [from, to] (factsOfFoodsNear), or of a list of foods. */
async function foodFacts(pool: Pool, foodsOf: { householdId: number; from: string; to: string } | readonly number[]): Promise<FoodFacts> {
  const out: FoodFacts = { amounts: new Map(), datasets: new Map() };
  let rows: FoodFactRow[];
  if ('householdId' in foodsOf) rows = await factsOfFoodsNear.run(pool, { householdId: foodsOf.householdId, start: lookback(foodsOf.from), end: lastDay(foodsOf.to) });
  else if (foodsOf.length === 0) return out;
  else rows = await rawQuery<FoodFactRow>(foodFactsOf(sql`SELECT ${foods.id} AS food_id FROM ${foods} WHERE ${inArray(foods.id, [...foodsOf])}`)).run(pool);
  for (const r of rows) {
    if (!out.datasets.has(r.foodId)) out.datasets.set(r.foodId, { slug: r.slug, name: r.datasetName, release: r.release });
    let m = out.amounts.get(r.foodId);
    if (!m) out.amounts.set(r.foodId, (m = {}));
    if (r.nutrientKey !== null && r.amount !== null) m[r.nutrientKey] = Number(r.amount);
  }
  return out;
}

/** The datasets of the foods behind a report, by slug, each once. */
function datasetsOf(facts: FoodFacts, foodIds: readonly number[]): DatasetRef[] {
  const bySlug = new Map<string, DatasetRef>();
  for (const id of foodIds) {
    const d = facts.datasets.get(id);
    if (d) bySlug.set(`${d.slug}|${d.name}|${d.release}`, d);
  }
  return [...bySlug.values()].sort((a, b) => (a.slug < b.slug ? -1 : a.slug > b.slug ? 1 : 0));
}

function mergeFacts(a: FoodFacts, b: FoodFacts): FoodFacts {
  return { amounts: new Map([...a.amounts, ...b.amounts]), datasets: new Map([...a.datasets, ...b.datasets]) };
}

/** What the report needs of a household: its id, zone (for "now"), creation and records start. */
export type ShareHousehold = Pick<Household, 'id' | 'timezone' | 'createdAt' | 'recordsSince'>;

/** The month a household's records start: its own `recordsSince`, else the default rule. */
export async function effectiveRecordsSince(household: ShareHousehold): Promise<string> {
  if (household.recordsSince) return household.recordsSince;
  return defaultRecordsSince(todayIn(household.timezone, household.createdAt), await firstEntryDate(getDb(), household.id));
}

/**
 * The share report of a household for [from, to] ('YYYY-MM', at most 120 months): per month and
 * nutrient home, bought, need and shares, totals, the headline over the year so far, the FAO
 * ratio, top crops and the harvest's uses. Months before the records start (the household's
 * `recordsSince`, else the earlier of its creation month and its first entry's month) are not
 * charged; "now" is the household's time zone's.
 * `pool` is for callers with their own pool (the benchmark); the app's shared client otherwise.
 * Throws RangeError when the range or a person's data cannot be computed.
 */
export async function householdShare(household: ShareHousehold, from: string, to: string, pool?: Pool, now: Date = new Date()): Promise<ShareResponse> {
  const db = pool ? dbOn(pool) : getDb();
  const raw = pool ?? getPool();
  // Every query at once: the foods' facts come by a subquery on the groups, not after them.
  const [grouped, withOutcomes, bought, rows, first, near] = await Promise.all([
    harvestGroupRows(raw, household.id, from, to),
    outcomeLotGroups(raw, household.id, from, to),
    purchaseGroupRows(raw, household.id, from, to),
    listPeople(household.id),
    household.recordsSince ? Promise.resolve(null) : firstEntryDate(db, household.id),
    foodFacts(raw, { householdId: household.id, from, to }),
  ]);
  const home = [...grouped, ...withOutcomes];
  const ids = foodIdsOf([...home, ...bought]);
  // A write between those queries can bring a food the subquery did not see: read it now.
  const missing = ids.filter((id) => !near.datasets.has(id));
  const facts = missing.length === 0 ? near : mergeFacts(near, await foodFacts(raw, missing));
  const groups = shareGroups(home, bought, facts.amounts, loadRetention());
  const people = rows.map((r) => needsPerson(personFields(r)));
  const recordsSince = household.recordsSince ?? defaultRecordsSince(todayIn(household.timezone, household.createdAt), first);
  const entries = groups.map(groupEntry);
  const report = computeShare({
    from,
    to,
    entries,
    people,
    nutrients: SHARE_NUTRIENTS,
    recordsSince,
    currentMonth: currentMonth(household.timezone, now),
  });
  return {
    ...report,
    topCrops: topCrops(groups, from, to, entries),
    uses: useTotals(groups, from, to),
    peopleCount: people.length,
    datasets: datasetsOf(facts, ids),
  };
}
