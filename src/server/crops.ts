/**
 * The household's crop catalogue in the database. Every function takes the household id and reads
 * or writes only that household's rows.
 */
import { and, asc, count, desc, eq, inArray, isNotNull, max, notInArray, sql } from 'drizzle-orm';
import { getDb } from '@/db/client';
import { crops, datasets, foods, foodWeights, harvests, households, plantings, type Crop } from '@/db/schema';
import type { CropJson, FoodSummary } from '@/lib/api-types';
import { edibleFactor } from '@/lib/edible';
import { EATEN_USES } from '@/lib/entry-schemas';
import { mergeCropPatch, type CropInput, type CropPatch } from '@/lib/crop-schemas';
import type { CropCategory } from '@/lib/crop-categories';
import { referenceCropForName } from '@/lib/crop-name-match';
import { mostUsedSince } from '@/lib/crop-chip-order';
import { todayIn } from '@/lib/months';
import { WEIGHT_UNITS } from '@/lib/units';
import { entryWeight } from '@/lib/count-volume';
import { entryQuantityText } from '@/lib/entry-units';
import { isDuplicateKey, isRowReferenced } from './db-errors';
import { cropDisplayName } from '@/lib/crop-name';
import { loadCropTable } from './crop-table-file';
import { measuredFood, NoUnitWeight } from './unit-weights';
import { HttpError } from './http';
import { fieldError, invalidInput, type Executor, type Tx } from './entry-input';

/** Reference foods by id, with refuse, kcal and protein per 100 g and their household measures. */
export async function foodSummaries(ex: Executor, ids: readonly number[]): Promise<Map<number, FoodSummary>> {
  const unique = [...new Set(ids)];
  if (unique.length === 0) return new Map();
  const nutrient = (key: string) =>
    sql<number | null>`(SELECT fn.amount FROM food_nutrients fn WHERE fn.food_id = ${foods.id} AND fn.nutrient_key = ${key})`;
  const rows = await ex
    .select({
      id: foods.id,
      dataset: datasets.slug,
      code: foods.code,
      name: foods.name,
      refusePct: foods.refusePct,
      kcalPer100g: nutrient('energy_kcal'),
      proteinPer100g: nutrient('protein_g'),
    })
    .from(foods)
    .innerJoin(datasets, eq(datasets.id, foods.datasetId))
    .where(inArray(foods.id, unique));
  const weights = await ex
    .select({ foodId: foodWeights.foodId, description: foodWeights.description, grams: foodWeights.grams })
    .from(foodWeights)
    .where(inArray(foodWeights.foodId, unique))
    .orderBy(asc(foodWeights.foodId), asc(foodWeights.seq));
  const measures = (id: number) => weights.filter((w) => w.foodId === id).map(({ description, grams }) => ({ description, grams }));
  return new Map(
    rows.map((r) => [
      r.id,
      { ...r, kcalPer100g: r.kcalPer100g === null ? null : Number(r.kcalPer100g), proteinPer100g: r.proteinPer100g === null ? null : Number(r.proteinPer100g), measures: measures(r.id) },
    ]),
  );
}

/** 400 unless the reference food exists. */
export async function requireFood(ex: Executor, foodId: number, field = 'foodId'): Promise<{ id: number; refusePct: number | null; name: string }> {
  const [food] = await ex.select({ id: foods.id, refusePct: foods.refusePct, name: foods.name }).from(foods).where(eq(foods.id, foodId)).limit(1);
  if (!food) throw fieldError(field, 'There is no reference food with this id.');
  return food;
}

function toJson(c: Crop, food: FoodSummary | null, stats: { n: number; last: string | null; lastYear: number } | undefined): CropJson {
  const variety = c.variety === '' ? null : c.variety;
  return {
    id: c.id,
    name: c.name,
    variety,
    displayName: cropDisplayName(c.name, variety),
    foodId: c.foodId,
    food,
    category: c.category,
    edibleFraction: c.edibleFraction,
    defaultUse: c.defaultUse,
    defaultSpreadMonths: c.defaultSpreadMonths,
    notFood: c.notFood,
    countGrams: c.countGrams,
    archived: c.archived,
    harvestCount: stats?.n ?? 0,
    lastHarvestDate: stats?.last ?? null,
    harvestsLastYear: stats?.lastYear ?? 0,
    pinRank: c.pinRank,
  };
}

async function cropsJson(ex: Executor, householdId: number, rows: Crop[]): Promise<CropJson[]> {
  if (rows.length === 0) return [];
  const ids = rows.map((c) => c.id);
  // "Most used" counts the household's harvests of the last 365 days up to its own today.
  const [home] = await ex.select({ timezone: households.timezone }).from(households).where(eq(households.id, householdId));
  const since = mostUsedSince(todayIn(home?.timezone ?? 'UTC'));
  const statRows = await ex
    .select({ cropId: harvests.cropId, n: count(), last: max(harvests.date), lastYear: sql<string | number>`SUM(${harvests.date} >= ${since})` })
    .from(harvests)
    .where(and(eq(harvests.householdId, householdId), inArray(harvests.cropId, ids)))
    .groupBy(harvests.cropId);
  const stats = new Map(statRows.map((s) => [s.cropId, { n: Number(s.n), last: s.last, lastYear: Number(s.lastYear ?? 0) }]));
  const foodsById = await foodSummaries(ex, rows.flatMap((c) => (c.foodId === null ? [] : [c.foodId])));
  return rows.map((c) => toJson(c, c.foodId === null ? null : (foodsById.get(c.foodId) ?? null), stats.get(c.id)));
}

/**
 * The household's crops, recently harvested first, then by name; archived ones only when asked.
 * Example: `(await listCrops(7)).map((c) => c.displayName)` → ['Potato (Pink Fir)', 'Kale', …]
 */
export async function listCrops(householdId: number, options: { includeArchived?: boolean } = {}): Promise<CropJson[]> {
  const db = getDb();
  const where = options.includeArchived ? eq(crops.householdId, householdId) : and(eq(crops.householdId, householdId), eq(crops.archived, false));
  const rows = await db.select().from(crops).where(where).orderBy(asc(crops.name), asc(crops.variety));
  const list = await cropsJson(db, householdId, rows);
  // Most recent harvest first; never-harvested crops after, by name (the sort is stable).
  return list.sort((a, b) => (b.lastHarvestDate ?? '').localeCompare(a.lastHarvestDate ?? ''));
}

/** One crop row of the household, or 404. */
export async function cropRow(ex: Executor, householdId: number, cropId: number, forUpdate = false): Promise<Crop> {
  const q = ex
    .select()
    .from(crops)
    .where(and(eq(crops.householdId, householdId), eq(crops.id, cropId)))
    .limit(1);
  const [row] = forUpdate ? await q.for('update') : await q;
  if (!row) throw new HttpError(404, 'not_found', 'No such crop in this household.');
  return row;
}

/** One crop as JSON, or 404. */
export async function getCrop(householdId: number, cropId: number, ex: Executor = getDb()): Promise<CropJson> {
  const row = await cropRow(ex, householdId, cropId);
  return (await cropsJson(ex, householdId, [row]))[0]!;
}

function duplicate(name: string, variety: string | null | undefined): HttpError {
  return new HttpError(409, 'duplicate', `There is already a crop ${cropDisplayName(name, variety)} in this household.`, {
    name: 'This household already has a crop with this name and variety.',
  });
}

/**
 * A new crop's category: the one given, else that of the reference crop its name matches
 * ("Potatoes" → roots and tubers), else 'other'.
 * Example: `newCropCategory({ name: 'Potato' })` → 'root_tuber'
 */
export function newCropCategory(input: { name: string; category?: CropCategory | undefined }): CropCategory {
  return input.category ?? referenceCropForName(input.name, loadCropTable())?.category ?? 'other';
}

/** Inserts a crop inside a transaction and returns its id (409 when name + variety exist). */
export async function insertCrop(tx: Tx, householdId: number, input: CropInput): Promise<number> {
  if (input.foodId != null) await requireFood(tx, input.foodId);
  try {
    const [res] = await tx.insert(crops).values({
      householdId,
      name: input.name,
      variety: input.variety ?? '',
      foodId: input.foodId ?? null,
      category: newCropCategory(input),
      edibleFraction: input.edibleFraction ?? null,
      defaultUse: input.defaultUse ?? null,
      defaultSpreadMonths: input.defaultSpreadMonths ?? null,
      notFood: input.notFood,
      countGrams: input.countGrams ?? null,
    });
    return res.insertId;
  } catch (e) {
    if (isDuplicateKey(e)) throw duplicate(input.name, input.variety);
    throw e;
  }
}

/** Adds a crop to the household. Example: `await createCrop(7, cropInput.parse({ name: 'Kale', category: 'leafy_green' }))` */
export async function createCrop(householdId: number, input: CropInput): Promise<CropJson> {
  return getDb().transaction(async (tx) => getCrop(householdId, await insertCrop(tx, householdId, input), tx));
}

/**
 * Edible grams of a harvest from its crop (or food): 0 for a crop marked not food (it is never
 * counted as food), the grams themselves when weighed trimmed, else grams × the crop's edible
 * fraction or × (1 − refuse/100). Example: `harvestEdibleGrams(1000, false, { refusePct: 25 })` → 750
 */
export function harvestEdibleGrams(
  grams: number,
  trimmed: boolean,
  basis: { refusePct?: number | null; edibleFraction?: number | null; notFood?: boolean },
): number {
  if (basis.notFood) return 0;
  return grams * edibleFactor({ refusePercent: basis.refusePct, edibleFraction: basis.edibleFraction, trimmed });
}

/**
 * Changes a crop. A new food match or edible fraction is carried into the crop's harvests in the
 * same transaction (their food and edible grams), so no entry keeps counting the old match.
 */
export async function updateCrop(householdId: number, cropId: number, patch: CropPatch): Promise<CropJson> {
  return getDb().transaction(async (tx) => {
    const current = await cropRow(tx, householdId, cropId, true);
    const merged = mergeCropPatch(
      {
        name: current.name,
        variety: current.variety === '' ? null : current.variety,
        foodId: current.foodId,
        category: current.category,
        edibleFraction: current.edibleFraction,
        defaultUse: current.defaultUse,
        defaultSpreadMonths: current.defaultSpreadMonths,
        notFood: current.notFood,
        countGrams: current.countGrams,
      },
      patch,
    );
    if (!merged.success) throw invalidInput(merged.error);
    const next = merged.data;
    const food = next.foodId != null ? await requireFood(tx, next.foodId) : null;
    if (next.notFood && !current.notFood) {
      const [eaten] = await tx
        .select({ n: count() })
        .from(harvests)
        .where(and(eq(harvests.householdId, householdId), eq(harvests.cropId, cropId), inArray(harvests.use, [...EATEN_USES])));
      if (Number(eaten?.n ?? 0) > 0) {
        throw new HttpError(409, 'in_use', `${cropDisplayName(current.name, current.variety)} has harvests logged as eaten; change their use before marking it not food.`);
      }
    }
    try {
      await tx
        .update(crops)
        .set({
          name: next.name,
          variety: next.variety ?? '',
          foodId: next.foodId ?? null,
          category: next.category,
          edibleFraction: next.edibleFraction ?? null,
          defaultUse: next.defaultUse ?? null,
          defaultSpreadMonths: next.defaultSpreadMonths ?? null,
          notFood: next.notFood,
          countGrams: next.countGrams ?? null,
          ...(patch.archived !== undefined ? { archived: patch.archived } : {}),
        })
        .where(and(eq(crops.householdId, householdId), eq(crops.id, cropId)));
    } catch (e) {
      if (isDuplicateKey(e)) throw duplicate(next.name, next.variety);
      throw e;
    }
    const edibleChanged =
      (next.foodId ?? null) !== current.foodId || (next.edibleFraction ?? null) !== current.edibleFraction || next.notFood !== current.notFood;
    const basis = { refusePct: food?.refusePct ?? null, edibleFraction: next.edibleFraction ?? null, notFood: next.notFood };
    if (edibleChanged) {
      const factor = harvestEdibleGrams(1, false, basis);
      const trimmedFactor = harvestEdibleGrams(1, true, basis);
      await tx
        .update(harvests)
        .set({
          foodId: next.foodId ?? null,
          edibleGrams: sql`${harvests.grams} * CASE WHEN ${harvests.trimmed} THEN ${trimmedFactor} ELSE ${factor} END`,
        })
        .where(and(eq(harvests.householdId, householdId), eq(harvests.cropId, cropId), inArray(harvests.unit, [...WEIGHT_UNITS])));
    }
    if (edibleChanged || (next.countGrams ?? null) !== current.countGrams) {
      await reweighCounted(tx, householdId, { id: cropId, name: cropDisplayName(next.name, next.variety), foodId: next.foodId ?? null, countGrams: next.countGrams ?? null }, basis);
    }
    return getCrop(householdId, cropId, tx);
  });
}

/**
 * Weighs a crop's harvests logged as counts or volumes again after its food, edible share or weight
 * of one changed, so they follow the crop as its weighed harvests do; 422 when one no longer has a
 * weight (the change is then not made).
 */
async function reweighCounted(
  tx: Tx,
  householdId: number,
  crop: { id: number; name: string; foodId: number | null; countGrams: number | null },
  edible: { refusePct: number | null; edibleFraction: number | null; notFood: boolean },
): Promise<void> {
  const rows = await tx
    .select({ id: harvests.id, date: harvests.date, quantity: harvests.quantity, unit: harvests.unit, trimmed: harvests.trimmed })
    .from(harvests)
    .where(and(eq(harvests.householdId, householdId), eq(harvests.cropId, crop.id), notInArray(harvests.unit, [...WEIGHT_UNITS])))
    .for('update');
  if (rows.length === 0) return;
  const food = await measuredFood(tx, crop.foodId);
  for (const h of rows) {
    const w = entryWeight(h.quantity, h.unit, { crop: { name: crop.name, countGrams: crop.countGrams }, food });
    if (!w.ok) {
      const logged = `${entryQuantityText(h.quantity, h.unit)} on ${h.date}`;
      throw new NoUnitWeight(`${crop.name} has a harvest logged as ${logged}, which would then have no weight: keep a weight of one (or a food with one), or change that harvest to a weight first.`, 'countGrams');
    }
    await tx
      .update(harvests)
      .set({ foodId: crop.foodId, grams: w.grams, weightSource: w.weightSource, edibleGrams: harvestEdibleGrams(w.grams, h.trimmed || w.edibleAsLogged, edible) })
      .where(eq(harvests.id, h.id));
  }
}

/**
 * Why a crop cannot be deleted, naming what points at it: harvests, plantings or both.
 * Example: `cropInUseMessage(0, 2)` → 'This crop has plantings; …'
 */
export function cropInUseMessage(harvestCount: number, plantingCount: number): string {
  if (harvestCount > 0 && plantingCount > 0) {
    return 'This crop has harvests logged and plantings; archive it instead (its harvests stay counted and its plantings stay listed).';
  }
  if (plantingCount > 0) return 'This crop has plantings; delete them on the Beds page first, or archive the crop instead.';
  return 'This crop has harvests logged; archive it instead (its harvests stay counted).';
}

/** Deletes a crop; 409 `in_use` while harvests or plantings point at it (archive it instead). */
export async function deleteCrop(householdId: number, cropId: number): Promise<void> {
  await getDb().transaction(async (tx) => {
    await cropRow(tx, householdId, cropId, true);
    const uses = async () => {
      const [h] = await tx.select({ n: count() }).from(harvests).where(and(eq(harvests.householdId, householdId), eq(harvests.cropId, cropId)));
      const [p] = await tx.select({ n: count() }).from(plantings).where(and(eq(plantings.householdId, householdId), eq(plantings.cropId, cropId)));
      return { harvests: Number(h?.n ?? 0), plantings: Number(p?.n ?? 0) };
    };
    const inUse = (u: { harvests: number; plantings: number }) => new HttpError(409, 'in_use', cropInUseMessage(u.harvests, u.plantings));
    const before = await uses();
    if (before.harvests > 0 || before.plantings > 0) throw inUse(before);
    try {
      await tx.delete(crops).where(and(eq(crops.householdId, householdId), eq(crops.id, cropId)));
    } catch (e) {
      // A harvest or planting added meanwhile: say which, as above.
      if (isRowReferenced(e)) throw inUse(await uses());
      throw e;
    }
  });
}

/** All crops of a household as rows (for import matching and export), archived included. */
export async function cropRows(ex: Executor, householdId: number): Promise<Crop[]> {
  return ex.select().from(crops).where(eq(crops.householdId, householdId)).orderBy(asc(crops.name), asc(crops.variety), desc(crops.id));
}

/**
 * Sets the household's pinned crops in one transaction: the crops listed get ranks 1, 2, … in the
 * order given and every other crop is unpinned. 400 naming the first id that is not a crop of the
 * household. Answers the crop list as GET …/crops does.
 */
export async function setCropPins(householdId: number, cropIds: readonly number[]): Promise<CropJson[]> {
  await getDb().transaction(async (tx) => {
    // Locks the household's crop rows, so two arrangers one after the other each see a whole list.
    const own = await tx.select({ id: crops.id }).from(crops).where(eq(crops.householdId, householdId)).for('update');
    const ids = new Set(own.map((c) => c.id));
    const stranger = cropIds.find((id) => !ids.has(id));
    if (stranger !== undefined) throw fieldError('cropIds', `There is no crop #${stranger} in this household.`);
    await tx.update(crops).set({ pinRank: null }).where(and(eq(crops.householdId, householdId), isNotNull(crops.pinRank)));
    for (const [i, id] of cropIds.entries()) {
      await tx.update(crops).set({ pinRank: i + 1 }).where(and(eq(crops.householdId, householdId), eq(crops.id, id)));
    }
  });
  return listCrops(householdId);
}
