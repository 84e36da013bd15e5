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
 * one. Queries go through Drizzle's builder and `sql` templates that name the schema's columns;
 * the hot ones are written once and run as mysql2 gives the rows (raw-query.ts), all at once, and
 * the foods' nutrients come from those kept at the datasets' revision (food-facts.ts).
 */
import { and, eq, gte, lte, min, sql } from 'drizzle-orm';
import type { Pool } from 'mysql2/promise';
import { getDb, getPool, type Db } from '@/db/client';
import { crops, foods, harvests, larderOutcomes, purchases, type Household } from '@/db/schema';
import { ENTRY_LIMITS } from '@/lib/entry-schemas';
import type { OutcomeRecord } from '@/lib/larder';
import { lotGroupRows, type OutcomeLot } from '@/lib/larder-share';
import type { LarderOutcomeKind } from '@/lib/larder-outcomes';
import { addMonths, daysInMonth, todayIn } from '@/lib/months';
import { SHARE_NUTRIENTS } from '@/lib/nutrients';
import { needsPerson } from '@/lib/people-schemas';
import { defaultRecordsSince } from '@/lib/records-start';
import { foodIdsOf, groupEntry, shareGroups, type FoodAmounts, type GroupRow } from '@/lib/share-groups';
import type { DatasetRef, ShareResponse } from '@/lib/share-types';
import { computeShare } from '@/lib/shares';
import { topCrops } from '@/lib/top-crops';
import { useTotals } from '@/lib/use-totals';
import { dbOn } from './db-on';
import { foodFacts, referenceRevision, type FoodFact } from './food-facts';
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

/** The datasets of the foods behind a report, by slug, each once. */
function datasetsOf(facts: Map<number, FoodFact>, foodIds: readonly number[]): DatasetRef[] {
  const bySlug = new Map<string, DatasetRef>();
  for (const id of foodIds) {
    const d = facts.get(id)?.dataset;
    if (d) bySlug.set(`${d.slug}|${d.name}|${d.release}`, d);
  }
  return [...bySlug.values()].sort((a, b) => (a.slug < b.slug ? -1 : a.slug > b.slug ? 1 : 0));
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
 * `revision` is the datasets' revision when the caller has read it already (the share endpoint's
 * gate); else it is read beside the groups.
 * Throws RangeError when the range or a person's data cannot be computed.
 */
export async function householdShare(
  household: ShareHousehold,
  from: string,
  to: string,
  pool?: Pool,
  now: Date = new Date(),
  revision?: number | string,
): Promise<ShareResponse> {
  const db = pool ? dbOn(pool) : getDb();
  const raw = pool ?? getPool();
  // Every query at once; the foods' facts come from those kept at the datasets' revision (food-facts.ts).
  const [grouped, withOutcomes, bought, rows, first, atRevision] = await Promise.all([
    harvestGroupRows(raw, household.id, from, to),
    outcomeLotGroups(raw, household.id, from, to),
    purchaseGroupRows(raw, household.id, from, to),
    listPeople(household.id),
    household.recordsSince ? Promise.resolve(null) : firstEntryDate(db, household.id),
    revision === undefined ? referenceRevision(raw) : Promise.resolve(Number(revision)),
  ]);
  const home = [...grouped, ...withOutcomes];
  const ids = foodIdsOf([...home, ...bought]);
  const facts = await foodFacts(raw, ids, atRevision);
  // A harvest group with no crop is named after its food (harvestGroupRows leaves it to us).
  for (const g of grouped) if (g.name === null && g.foodId !== null) g.name = facts.get(g.foodId)?.name ?? null;
  const amounts: FoodAmounts = new Map([...facts].map(([id, f]) => [id, f.amounts]));
  const groups = shareGroups(home, bought, amounts, loadRetention());
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
