/**
 * Reads a household's larder: its stored and preserved harvests that can still hold food today
 * (dated at most ENTRY_LIMITS.maxSpreadMonths back, since no lot lasts longer), each with its
 * food's energy and protein, its recorded outcomes and the crop table's typical winter loss, and
 * hands them to the pure larderReport() (src/lib/larder-report.ts). Also read by the monthly letter.
 */
import { and, asc, eq, gt, gte, inArray, lte } from 'drizzle-orm';
import { getDb } from '@/db/client';
import { crops, foodNutrients, foods, harvests, larderOutcomes, type Household } from '@/db/schema';
import { ENTRY_LIMITS } from '@/lib/entry-schemas';
import { larderReport, expectedLossOf, type LarderLotInput } from '@/lib/larder-report';
import type { LarderOutcomeJson, LarderResponse } from '@/lib/larder-types';
import { addMonths, monthOf, todayIn } from '@/lib/months';
import { cropByKey } from './crop-table-file';
import type { Executor } from './entry-input';
import { countsAsFood, cropOfHarvest, foodOfHarvest, harvestNameSql } from './harvest-sql';

/** Stored and preserved lots that can hold food on `today`, or the given harvests only. */
export async function larderLotRows(db: Executor, householdId: number, today: string, onlyIds?: readonly number[]) {
  const since = `${addMonths(monthOf(today), -ENTRY_LIMITS.maxSpreadMonths)}-01`;
  return db
    .select({
      harvestId: harvests.id,
      cropId: harvests.cropId,
      foodId: harvests.foodId,
      name: harvestNameSql(),
      category: crops.category,
      referenceKey: crops.referenceKey,
      use: harvests.use,
      preserveMethod: harvests.preserveMethod,
      date: harvests.date,
      spreadMonths: harvests.spreadMonths,
      quantity: harvests.quantity,
      unit: harvests.unit,
      grams: harvests.grams,
      edibleGrams: harvests.edibleGrams,
    })
    .from(harvests)
    .leftJoin(crops, cropOfHarvest())
    .leftJoin(foods, foodOfHarvest())
    .where(
      and(
        eq(harvests.householdId, householdId),
        inArray(harvests.use, ['stored', 'preserved']),
        onlyIds ? inArray(harvests.id, [...onlyIds]) : and(gte(harvests.date, since), lte(harvests.date, today)),
        gt(harvests.edibleGrams, 0),
        countsAsFood(),
      ),
    )
    .orderBy(asc(harvests.date), asc(harvests.id));
}

/** The outcomes of some harvests of a household, by harvest id, in date order. */
export async function outcomesOf(db: Executor, householdId: number, harvestIds: readonly number[]): Promise<Map<number, LarderOutcomeJson[]>> {
  const out = new Map<number, LarderOutcomeJson[]>();
  if (harvestIds.length === 0) return out;
  const rows = await db
    .select()
    .from(larderOutcomes)
    .where(and(eq(larderOutcomes.householdId, householdId), inArray(larderOutcomes.harvestId, [...harvestIds])))
    .orderBy(asc(larderOutcomes.date), asc(larderOutcomes.id));
  for (const r of rows) {
    let list = out.get(r.harvestId);
    if (!list) out.set(r.harvestId, (list = []));
    list.push(outcomeJson(r));
  }
  return out;
}

/** A stored outcome row as the API answers it. */
export function outcomeJson(r: typeof larderOutcomes.$inferSelect): LarderOutcomeJson {
  return { id: r.id, kind: r.kind, date: r.date, lostFraction: r.lostFraction, until: r.until, note: r.note };
}

/** Energy and protein per 100 g of some foods; a food without a row for a nutrient has none (unknown). */
async function energyProtein(db: Executor, foodIds: readonly number[]): Promise<Map<number, LarderLotInput['per100g']>> {
  const out = new Map<number, LarderLotInput['per100g']>();
  if (foodIds.length === 0) return out;
  const rows = await db
    .select({ foodId: foodNutrients.foodId, key: foodNutrients.nutrientKey, amount: foodNutrients.amount })
    .from(foodNutrients)
    .where(and(inArray(foodNutrients.foodId, [...foodIds]), inArray(foodNutrients.nutrientKey, ['energy_kcal', 'protein_g'])));
  for (const r of rows) {
    let m = out.get(r.foodId);
    if (!m) out.set(r.foodId, (m = {}));
    if (r.amount !== null) m[r.key as 'energy_kcal' | 'protein_g'] = Number(r.amount);
  }
  return out;
}

/** The rows of larderLotRows() with their foods' values, outcomes and expected loss, as the pure code takes them. */
export async function larderInputs(db: Executor, householdId: number, rows: Awaited<ReturnType<typeof larderLotRows>>): Promise<LarderLotInput[]> {
  const foodIds = [...new Set(rows.map((r) => r.foodId).filter((id): id is number => id != null))];
  const [values, outcomes] = await Promise.all([energyProtein(db, foodIds), outcomesOf(db, householdId, rows.map((r) => r.harvestId))]);
  return rows.map((r) => ({
    harvestId: r.harvestId,
    cropId: r.cropId,
    name: r.name ?? 'Unnamed harvest',
    category: r.category,
    use: r.use as 'stored' | 'preserved',
    preserveMethod: r.preserveMethod,
    date: r.date,
    spreadMonths: Math.max(1, r.spreadMonths),
    quantity: r.quantity,
    unit: r.unit,
    grams: r.grams,
    edibleGrams: r.edibleGrams,
    per100g: r.foodId == null ? {} : (values.get(r.foodId) ?? {}),
    outcomes: outcomes.get(r.harvestId) ?? [],
    expectedLoss: expectedLossOf(r.referenceKey ? cropByKey(r.referenceKey) : undefined),
  }));
}

/**
 * What the household still has in store on its own today (time zone of the household): lots,
 * sums by crop and category, totals and the empty months of the next twelve.
 * Example: `(await householdLarder(household)).totals.energyKcal`
 */
export async function householdLarder(household: Household, now: Date = new Date()): Promise<LarderResponse> {
  const db = getDb();
  const today = todayIn(household.timezone, now);
  const rows = await larderLotRows(db, household.id, today);
  return larderReport(await larderInputs(db, household.id, rows), today, household.units);
}
