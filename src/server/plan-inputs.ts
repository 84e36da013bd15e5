/**
 * Gathers what a household's planting plan is worked out from: its need and current home supply per
 * month of the growing year (from the share report), who eats, its frost dates, and the candidate
 * crops of the reference table with their SR28 composition, the household's own measured yield
 * (harvests logged against plantings of the latest earlier season) and the seed it kept last season
 * (harvests used as seed in the previous growing year). The pure planner does the rest.
 */
import { and, eq, gte, inArray, isNotNull, lt, lte, sql } from 'drizzle-orm';
import { getDb } from '@/db/client';
import { crops, datasets, foodNutrients, foods, harvests, plantings, type Household } from '@/db/schema';
import { seasonFrostDates } from '@/lib/growing-season';
import type { CropFood, CropTableRow } from '@/lib/crop-table';
import { addMonths, daysInMonth, formatMonth } from '@/lib/months';
import { SHARE_NUTRIENTS, type NutrientKey, type ShareNutrientKey } from '@/lib/nutrients';
import type { PlanCandidate, PlanInput } from '@/lib/plan-model';
import type { PlanRequest } from '@/lib/plan-schemas';
import { loadCropTable } from './crop-table-file';
import { HttpError } from './http';
import { listPeople } from './people';
import { householdShare } from './share-data';
import { SR28_INFO } from './sr28-source';

/** The 12 months of growing year `year` for a household whose year starts in `startMonth`. Example: (2027, 10) → { from: '2027-10', to: '2028-09' } */
export function planRange(year: number, startMonth: number): { from: string; to: string } {
  const from = formatMonth({ year, month: startMonth });
  return { from, to: addMonths(from, 11) };
}

/** The reference rows the request names (every m² crop when it names none); 400 with a field per unknown or animal key. */
export function candidateRows(keys: readonly string[] | undefined): CropTableRow[] {
  const table = loadCropTable();
  if (!keys) return table.filter((r) => r.yieldBasis === 'm2');
  const fields: Record<string, string> = {};
  const rows: CropTableRow[] = [];
  keys.forEach((key, i) => {
    const row = table.find((r) => r.key === key);
    if (!row) fields[`crops.${i}`] = `"${key}" is not a crop of the reference table: use a key such as potatoes or kale.`;
    else if (row.yieldBasis !== 'm2') fields[`crops.${i}`] = `${row.name} yields per ${row.yieldBasis}, not per m² of bed: the planner leaves animal lines out.`;
    else if (!rows.includes(row)) rows.push(row);
  });
  if (Object.keys(fields).length > 0) throw new HttpError(400, 'invalid_input', 'Some crops cannot be planned: see fields.', fields);
  return rows;
}

/** SR28 refuse and share-nutrient amounts per 100 g for the given NDB numbers. */
async function sr28Foods(codes: readonly string[]): Promise<Map<string, CropFood>> {
  const db = getDb();
  const out = new Map<string, CropFood>();
  if (codes.length === 0) return out;
  const found = await db
    .select({ id: foods.id, code: foods.code, refusePct: foods.refusePct })
    .from(foods)
    .innerJoin(datasets, eq(datasets.id, foods.datasetId))
    .where(and(eq(datasets.slug, SR28_INFO.slug), inArray(foods.code, [...codes])));
  if (found.length === 0) return out;
  const amounts = await db
    .select({ foodId: foodNutrients.foodId, key: foodNutrients.nutrientKey, amount: foodNutrients.amount })
    .from(foodNutrients)
    .where(and(inArray(foodNutrients.foodId, found.map((f) => f.id)), inArray(foodNutrients.nutrientKey, [...SHARE_NUTRIENTS])));
  const byId = new Map(found.map((f) => [f.id, { code: f.code, food: { refusePct: f.refusePct, per100g: {} } as CropFood }]));
  for (const a of amounts) byId.get(a.foodId)!.food.per100g[a.key as NutrientKey] = Number(a.amount);
  for (const { code, food } of byId.values()) out.set(code, food);
  return out;
}

/** kg per m² per reference crop from the latest season before `year` with harvests logged against its plantings. */
async function ownYields(householdId: number, year: number): Promise<Map<string, number>> {
  const rows = await getDb()
    .select({
      key: crops.referenceKey,
      season: plantings.seasonYear,
      area: plantings.areaM2,
      grams: sql<number>`COALESCE(SUM(${harvests.grams}), 0)`.mapWith(Number),
    })
    .from(plantings)
    .innerJoin(crops, and(eq(crops.id, plantings.cropId), eq(crops.householdId, plantings.householdId)))
    .innerJoin(harvests, and(eq(harvests.plantingId, plantings.id), eq(harvests.householdId, plantings.householdId)))
    .where(and(eq(plantings.householdId, householdId), lt(plantings.seasonYear, year), isNotNull(crops.referenceKey)))
    .groupBy(crops.referenceKey, plantings.seasonYear, plantings.id, plantings.areaM2);
  const latest = new Map<string, { season: number; grams: number; area: number }>();
  for (const r of rows) {
    if (!r.key || !(r.area > 0) || !(r.grams > 0)) continue;
    const seen = latest.get(r.key);
    if (!seen || r.season > seen.season) latest.set(r.key, { season: r.season, grams: r.grams, area: r.area });
    else if (r.season === seen.season) latest.set(r.key, { season: r.season, grams: seen.grams + r.grams, area: seen.area + r.area });
  }
  return new Map([...latest].map(([key, v]) => [key, v.grams / 1000 / v.area]));
}

/** Grams harvested for seed per reference crop in [from, to] (the previous growing year). */
async function seedKept(householdId: number, from: string, to: string): Promise<Map<string, number>> {
  const rows = await getDb()
    .select({ key: crops.referenceKey, grams: sql<number>`SUM(${harvests.grams})`.mapWith(Number) })
    .from(harvests)
    .innerJoin(crops, and(eq(crops.id, harvests.cropId), eq(crops.householdId, harvests.householdId)))
    .where(
      and(
        eq(harvests.householdId, householdId),
        eq(harvests.use, 'seed'),
        isNotNull(crops.referenceKey),
        gte(harvests.date, `${from}-01`),
        lte(harvests.date, `${to}-${String(daysInMonth(to)).padStart(2, '0')}`),
      ),
    )
    .groupBy(crops.referenceKey);
  return new Map(rows.filter((r) => r.key).map((r) => [r.key!, r.grams]));
}

/**
 * The planner's input for a household and a validated request. Throws HttpError 422 when nobody
 * eats in the household (there is no need to plan for).
 */
export async function planInputFor(household: Household, request: PlanRequest): Promise<PlanInput> {
  const rows = candidateRows(request.crops);
  const range = planRange(request.year, household.yearStartMonth);
  const lastYear = planRange(request.year - 1, household.yearStartMonth);
  const [share, people, composition, yields, kept] = await Promise.all([
    householdShare(household, range.from, range.to),
    listPeople(household.id),
    sr28Foods([...new Set(rows.map((r) => r.sr28Code))]),
    ownYields(household.id, request.year),
    seedKept(household.id, lastYear.from, lastYear.to),
  ]);
  if (people.length === 0) {
    throw new HttpError(422, 'no_people', 'Nobody eats in this household yet, so there is no need to plan for: add the people who eat first.');
  }
  const need: Partial<Record<ShareNutrientKey, number[]>> = {};
  const homeSupply: Partial<Record<ShareNutrientKey, number[]>> = {};
  for (const key of SHARE_NUTRIENTS) {
    need[key] = share.months.map((m) => m.values[key]?.need ?? 0);
    homeSupply[key] = share.months.map((m) => m.values[key]?.home ?? 0);
  }
  const candidates: PlanCandidate[] = [];
  for (const row of rows) {
    const food = composition.get(row.sr28Code);
    if (!food) continue; // the reference foods are not loaded: nothing to count this crop with
    candidates.push({ row, food, ownYieldKgM2: yields.get(row.key) ?? null, seedKeptG: kept.get(row.key) ?? 0 });
  }
  const season = seasonFrostDates({ lastSpringFrost: household.lastSpringFrost ?? null, firstAutumnFrost: household.firstAutumnFrost ?? null }, household.timezone);
  return {
    year: request.year,
    months: share.months.map((m) => m.month),
    targets: request.targets,
    basis: request.basis,
    maxAreaM2: request.maxAreaM2 ?? null,
    maxShareOfEnergyPerCrop: request.maxShareOfEnergyPerCrop,
    need,
    homeSupply,
    people: people.length,
    frost: { lastSpringFrost: season.lastSpringFrost, firstAutumnFrost: season.firstAutumnFrost },
    candidates,
  };
}
