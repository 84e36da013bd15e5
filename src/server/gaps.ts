/**
 * Gathers what the gap finder (src/lib/gaps.ts) weighs for one household and growing year: the
 * share report of that year, the reference crops grown on ground with their USDA SR28 composition
 * (foods and food_nutrients by the crop's sr28_code), the household's own measured yields (harvests
 * that name their planting), and the frost dates that place each crop's harvest window in the year.
 */
import { and, eq, inArray, isNotNull, sql } from 'drizzle-orm';
import { getDb } from '@/db/client';
import { crops, datasets, foodNutrients, foods, harvests, plantings, type Household } from '@/db/schema';
import { nutrientPerM2, type CropFood } from '@/lib/crop-table';
import { defaultFrostDates, eatingMonths, type FrostDates } from '@/lib/eating-months';
import type { GapsResponse } from '@/lib/gap-types';
import { findGaps, type GapCrop } from '@/lib/gaps';
import { growingYear, growingYearLabel } from '@/lib/growing-year';
import { addMonths, formatMonth, parseMonth } from '@/lib/months';
import { SHARE_NUTRIENTS, type ShareNutrientKey } from '@/lib/nutrients';
import { ownYields } from '@/lib/own-yield';
import { loadCropTable } from './crop-table-file';
import { currentMonth } from './people';
import { householdShare } from './share-data';
import { SR28_INFO } from './sr28-source';

/**
 * The growing year a gaps report covers: the one starting in `year` (the household's start month),
 * or the one containing today in the household's time zone,
 * e.g. gapsRange({ yearStartMonth: 10, … }, 2026) → { year: 2026, from: '2026-10', to: '2027-09' }.
 */
export function gapsRange(household: Pick<Household, 'timezone' | 'yearStartMonth'>, year?: number): { year: number; from: string; to: string } {
  if (year !== undefined) {
    const from = formatMonth({ year, month: household.yearStartMonth });
    return { year, from, to: addMonths(from, 11) };
  }
  const r = growingYear(currentMonth(household.timezone), household.yearStartMonth);
  return { year: parseMonth(r.from).year, ...r };
}

/** SR28 refuse and share nutrients of the given food codes, by code. */
async function sr28Foods(codes: readonly string[]): Promise<Map<string, CropFood>> {
  const db = getDb();
  const rows = await db
    .select({ code: foods.code, refusePct: foods.refusePct, key: foodNutrients.nutrientKey, amount: foodNutrients.amount })
    .from(foods)
    .innerJoin(datasets, eq(datasets.id, foods.datasetId))
    .leftJoin(foodNutrients, and(eq(foodNutrients.foodId, foods.id), inArray(foodNutrients.nutrientKey, [...SHARE_NUTRIENTS])))
    .where(and(eq(datasets.slug, SR28_INFO.slug), inArray(foods.code, [...codes])));
  const out = new Map<string, CropFood>();
  for (const r of rows) {
    let f = out.get(r.code);
    if (!f) out.set(r.code, (f = { refusePct: r.refusePct, per100g: {} }));
    if (r.key !== null && r.amount !== null) f.per100g[r.key as ShareNutrientKey] = Number(r.amount);
  }
  return out;
}

/** Each of the household's plantings of a reference crop with the weight harvested from it. */
async function plantingHarvests(householdId: number) {
  const db = getDb();
  return db
    .select({
      referenceKey: sql<string>`MAX(${crops.referenceKey})`,
      areaM2: sql<number>`MAX(${plantings.areaM2})`.mapWith(Number),
      grams: sql<number>`SUM(${harvests.grams})`.mapWith(Number),
    })
    .from(plantings)
    .innerJoin(crops, and(eq(crops.id, plantings.cropId), eq(crops.householdId, plantings.householdId)))
    .innerJoin(harvests, and(eq(harvests.plantingId, plantings.id), eq(harvests.householdId, plantings.householdId)))
    .where(and(eq(plantings.householdId, householdId), isNotNull(crops.referenceKey)))
    .groupBy(plantings.id);
}

/** The household's frost dates, or its hemisphere's default. */
export function frostDatesOf(household: Pick<Household, 'timezone' | 'lastSpringFrost' | 'firstAutumnFrost'>): FrostDates & { defaulted: boolean } {
  const d = defaultFrostDates(household.timezone);
  return {
    lastSpringFrost: household.lastSpringFrost ?? d.lastSpringFrost,
    firstAutumnFrost: household.firstAutumnFrost ?? d.firstAutumnFrost,
    defaulted: household.lastSpringFrost === null || household.firstAutumnFrost === null,
  };
}

/**
 * The gaps of a household's growing year: per key nutrient need, home supply, shortfall, lean
 * months, least-area crops and crops that carry food into the lean months.
 * Throws RangeError when the share report cannot be computed (the route answers 422).
 */
export async function householdGaps(household: Household, year?: number): Promise<GapsResponse> {
  const range = gapsRange(household, year);
  const table = loadCropTable().filter((r) => r.yieldBasis === 'm2');
  const [share, composition, planted] = await Promise.all([
    householdShare(household, range.from, range.to),
    sr28Foods([...new Set(table.map((r) => r.sr28Code))]),
    plantingHarvests(household.id),
  ]);
  const own = ownYields(planted);
  const frostDates = frostDatesOf(household);
  const gapCrops: GapCrop[] = [];
  for (const row of table) {
    const food = composition.get(row.sr28Code);
    if (!food) continue; // the reference food is not loaded: nothing to weigh it by
    const ownKg = own.get(row.key);
    const yieldKgM2 = ownKg ?? row.yieldKg.typical;
    const perM2 = nutrientPerM2(row, food, { yieldKg: yieldKgM2 });
    const months = eatingMonths(row, frostDates);
    gapCrops.push({ key: row.key, name: row.name, perM2, yieldSource: ownKg === undefined ? 'reference' : 'own', yieldKgM2, harvestMonths: months.harvest, storedMonths: months.stored });
  }
  const report = findGaps({ nutrients: share.nutrients, months: share.months, crops: gapCrops });
  return {
    ...report,
    year: range.year,
    from: range.from,
    to: range.to,
    label: growingYearLabel(range),
    frostDates,
    peopleCount: share.peopleCount,
    cropCount: gapCrops.length,
    ownYieldCrops: gapCrops.filter((c) => c.yieldSource === 'own').map((c) => c.key),
    datasets: share.datasets,
    crops: gapCrops,
  };
}
