/**
 * Gathers what the gap finder (src/lib/gaps.ts) weighs for one household and growing year: the
 * share report of that year, the reference crops grown on ground with their USDA SR28 composition
 * (foods and food_nutrients by the crop's sr28_code), the household's own measured yields (harvests
 * that name their planting), and the frost dates that place each crop's harvest window and storage
 * in the months of the year (src/lib/crop-months.ts, the planner's own rule).
 */
import { and, eq, inArray, isNotNull, sql } from 'drizzle-orm';
import { getDb } from '@/db/client';
import { crops, datasets, foodNutrients, foods, harvests, plantings, type Household } from '@/db/schema';
import { nutrientPerM2, type CropFood } from '@/lib/crop-table';
import { eatingMonths, harvestMonths } from '@/lib/crop-months';
import type { GapsResponse } from '@/lib/gap-types';
import { findGaps, type GapCrop } from '@/lib/gaps';
import { growingYear, growingYearLabel } from '@/lib/growing-year';
import { parseMonth } from '@/lib/months';
import { SHARE_NUTRIENTS, type ShareNutrientKey } from '@/lib/nutrients';
import { seasonFrostDates, type FrostDates } from '@/lib/growing-season';
import { ownYields } from '@/lib/own-yield';
import { loadCropTable } from './crop-table-file';
import { currentMonth } from './people';
import { planRange } from './plan-inputs';
import { householdShare } from './share-data';
import { SR28_INFO } from './sr28-source';

/**
 * The growing year a gaps report covers: the one starting in `year` (the household's start month),
 * or the one containing today in the household's time zone,
 * e.g. gapsRange({ yearStartMonth: 10, … }, 2026) → { year: 2026, from: '2026-10', to: '2027-09' }.
 */
export function gapsRange(household: Pick<Household, 'timezone' | 'yearStartMonth'>, year?: number, now: Date = new Date()): { year: number; from: string; to: string } {
  // The same growing year the planner reads for POST …/plan with this `year`.
  if (year !== undefined) return { year, ...planRange(year, household.yearStartMonth) };
  const r = growingYear(currentMonth(household.timezone, now), household.yearStartMonth);
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

/**
 * The household's own measured yield per reference crop (kg per m²), over every season with
 * harvests naming their planting: Σ kg ÷ Σ m² of the per-season yields of src/lib/own-yield.ts.
 */
async function ownYieldByReference(householdId: number): Promise<Map<string, number>> {
  const db = getDb();
  const [planted, picked] = await Promise.all([
    db
      .select({ id: plantings.id, cropId: plantings.cropId, seasonYear: plantings.seasonYear, areaM2: plantings.areaM2, referenceKey: crops.referenceKey })
      .from(plantings)
      .innerJoin(crops, and(eq(crops.id, plantings.cropId), eq(crops.householdId, plantings.householdId)))
      .where(and(eq(plantings.householdId, householdId), isNotNull(crops.referenceKey))),
    db
      .select({ plantingId: harvests.plantingId, grams: sql<number>`SUM(${harvests.grams})`.mapWith(Number) })
      .from(harvests)
      .where(and(eq(harvests.householdId, householdId), isNotNull(harvests.plantingId)))
      .groupBy(harvests.plantingId),
  ]);
  const referenceOf = new Map(planted.map((p) => [p.cropId, p.referenceKey!]));
  const sums = new Map<string, { kg: number; m2: number }>();
  const yields = ownYields(planted, picked.map((h) => ({ plantingId: h.plantingId!, grams: h.grams })));
  for (const y of yields) {
    const key = referenceOf.get(y.cropId)!;
    const s = sums.get(key) ?? { kg: 0, m2: 0 };
    s.kg += y.harvestedKg;
    s.m2 += y.areaM2;
    sums.set(key, s);
  }
  return new Map([...sums].map(([key, s]) => [key, s.kg / s.m2]));
}

/** The household's frost dates, or its hemisphere's default (see src/lib/growing-season.ts). */
export function frostDatesOf(household: Pick<Household, 'timezone' | 'lastSpringFrost' | 'firstAutumnFrost'>): FrostDates & { defaulted: boolean } {
  const s = seasonFrostDates(household, household.timezone);
  return { lastSpringFrost: s.lastSpringFrost, firstAutumnFrost: s.firstAutumnFrost, defaulted: !s.own.lastSpringFrost || !s.own.firstAutumnFrost };
}

/**
 * The gaps of a household's growing year: per key nutrient need, home supply, shortfall, lean
 * months, least-area crops and crops that carry food into the lean months.
 * `now` places "this month" (the monthly letter passes the instant it reports at).
 * Throws RangeError when the share report cannot be computed (the route answers 422).
 */
export async function householdGaps(household: Household, year?: number, now: Date = new Date()): Promise<GapsResponse> {
  const range = gapsRange(household, year, now);
  const table = loadCropTable().filter((r) => r.yieldBasis === 'm2');
  const [share, composition, own] = await Promise.all([
    householdShare(household, range.from, range.to, undefined, now),
    sr28Foods([...new Set(table.map((r) => r.sr28Code))]),
    ownYieldByReference(household.id),
  ]);
  const frostDates = frostDatesOf(household);
  const gapCrops: GapCrop[] = [];
  for (const row of table) {
    const food = composition.get(row.sr28Code);
    if (!food) continue; // the reference food is not loaded: nothing to weigh it by
    const ownKg = own.get(row.key);
    const yieldKgM2 = ownKg ?? row.yieldKg.typical;
    const perM2 = nutrientPerM2(row, food, { yieldKg: yieldKgM2 });
    const harvest = harvestMonths(row, frostDates);
    const stored = eatingMonths(row, frostDates).slice(harvest.length);
    gapCrops.push({ key: row.key, name: row.name, perM2, yieldSource: ownKg === undefined ? 'reference' : 'own', yieldKgM2, harvestMonths: harvest, storedMonths: stored });
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
