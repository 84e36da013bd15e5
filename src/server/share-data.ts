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
import { and, eq, gte, inArray, lte, min, sql } from 'drizzle-orm';
import type { Pool } from 'mysql2/promise';
import { getDb, type Db } from '@/db/client';
import { crops, datasets, foodNutrients, foods, harvests, larderOutcomes, purchases, type Household } from '@/db/schema';
import { ENTRY_LIMITS } from '@/lib/entry-schemas';
import { lotGroupRows } from '@/lib/larder-share';
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
import { countsAsFood, cropOfHarvest, foodOfHarvest, harvestNameSql } from './harvest-sql';
import { outcomesOf } from './larder';
import { harvestGroupRows, purchaseGroupRows } from './share-rollup';
import { currentMonth, listPeople, personFields } from './people';
import { loadRetention } from './retention-file';

function lastDay(month: string): string {
  return `${month}-${String(daysInMonth(month)).padStart(2, '0')}`;
}

/** First day of the earliest month whose stored or bought food can still be eaten in `from`. */
const lookback = (from: string) => `${addMonths(from, -ENTRY_LIMITS.maxSpreadMonths)}-01`;

/**
 * The stored and preserved lots with larder records that can fall in [from, to], one by one, each
 * turned into its eaten segments and lost parts (src/lib/larder-share.ts). No lot lasts longer
 * than ENTRY_LIMITS.maxSpreadMonths (larder.ts), so the same look-back as the grouped query holds.
 */
async function outcomeLotGroups(db: Db, householdId: number, from: string, to: string): Promise<GroupRow[]> {
  const lots = await db
    .select({
      id: harvests.id,
      date: harvests.date,
      use: harvests.use,
      spread: sql<number>`GREATEST(${harvests.spreadMonths}, 1)`.mapWith(Number),
      preserveMethod: harvests.preserveMethod,
      cropId: harvests.cropId,
      foodId: harvests.foodId,
      name: harvestNameSql(),
      grams: harvests.grams,
      edibleGrams: harvests.edibleGrams,
    })
    .from(harvests)
    .leftJoin(crops, cropOfHarvest())
    .leftJoin(foods, foodOfHarvest())
    .where(
      and(
        eq(harvests.householdId, householdId),
        gte(harvests.date, lookback(from)),
        lte(harvests.date, lastDay(to)),
        countsAsFood(),
        // Driven from the household's records (a few lots), not by probing every harvest in the range.
        inArray(harvests.id, db.selectDistinct({ id: larderOutcomes.harvestId }).from(larderOutcomes).where(eq(larderOutcomes.householdId, householdId))),
      ),
    );
  if (lots.length === 0) return [];
  const outcomes = await outcomesOf(db, householdId, lots.map((l) => l.id));
  return lots.flatMap(({ id, ...lot }) => lotGroupRows(lot, outcomes.get(id) ?? []));
}

/** The date of the household's first harvest or purchase, or null when it has logged nothing. */
async function firstEntryDate(db: Db, householdId: number): Promise<string | null> {
  const [[h], [p]] = await Promise.all([
    db.select({ d: min(harvests.date) }).from(harvests).where(eq(harvests.householdId, householdId)),
    db.select({ d: min(purchases.date) }).from(purchases).where(eq(purchases.householdId, householdId)),
  ]);
  const dates = [h?.d, p?.d].filter((d): d is string => typeof d === 'string');
  return dates.length === 0 ? null : dates.sort()[0]!;
}

/**
 * The share nutrients of the foods behind the groups, in one query over the distinct foods
 * (a handful), instead of joining every group to its nutrients in SQL.
 */
async function foodAmounts(db: Db, foodIds: readonly number[]): Promise<FoodAmounts> {
  const out: FoodAmounts = new Map();
  if (foodIds.length === 0) return out;
  const rows = await db
    .select({ foodId: foodNutrients.foodId, key: foodNutrients.nutrientKey, amount: foodNutrients.amount })
    .from(foodNutrients)
    .where(and(inArray(foodNutrients.foodId, [...foodIds]), inArray(foodNutrients.nutrientKey, [...SHARE_NUTRIENTS])));
  for (const r of rows) {
    let m = out.get(r.foodId);
    if (!m) out.set(r.foodId, (m = {}));
    m[r.key as ShareNutrientKey] = Number(r.amount);
  }
  return out;
}

/** The food composition datasets the foods come from, by slug. */
async function datasetsOf(db: Db, foodIds: readonly number[]): Promise<DatasetRef[]> {
  if (foodIds.length === 0) return [];
  return db
    .selectDistinct({ slug: datasets.slug, name: datasets.name, release: datasets.release })
    .from(foods)
    .innerJoin(datasets, eq(datasets.id, foods.datasetId))
    .where(inArray(foods.id, [...foodIds]))
    .orderBy(datasets.slug);
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
  const [grouped, withOutcomes, bought, rows, first] = await Promise.all([
    harvestGroupRows(db, household.id, from, to),
    outcomeLotGroups(db, household.id, from, to),
    purchaseGroupRows(db, household.id, from, to),
    listPeople(household.id),
    household.recordsSince ? Promise.resolve(null) : firstEntryDate(db, household.id),
  ]);
  const home = [...grouped, ...withOutcomes];
  const ids = foodIdsOf([...home, ...bought]);
  const [amounts, sources] = await Promise.all([foodAmounts(db, ids), datasetsOf(db, ids)]);
  const groups = shareGroups(home, bought, amounts, loadRetention());
  const people = rows.map((r) => needsPerson(personFields(r)));
  const recordsSince = household.recordsSince ?? defaultRecordsSince(todayIn(household.timezone, household.createdAt), first);
  const report = computeShare({
    from,
    to,
    entries: groups.map(groupEntry),
    people,
    nutrients: SHARE_NUTRIENTS,
    recordsSince,
    currentMonth: currentMonth(household.timezone, now),
  });
  return {
    ...report,
    topCrops: topCrops(groups, from, to),
    uses: useTotals(groups, from, to),
    peopleCount: people.length,
    datasets: sources,
  };
}
