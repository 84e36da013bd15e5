/**
 * The household's plantings in the database: which crop grows in which bed, on how much ground, in
 * which season and succession slot, and when it is expected to be harvested. A planting may name a
 * reference crop instead of a household crop; the household's crop of that row is found or added.
 * The planner's "turn into plantings" (fromPlan) adds every crop and planting of a plan in one
 * transaction. Harvests that name a planting give the household's own measured yield
 * (src/lib/own-yield.ts). Every function takes the household and touches only its rows.
 */
import { and, asc, eq, inArray, isNull, sql } from 'drizzle-orm';
import { getDb } from '@/db/client';
import { beds, crops, datasets, foods, harvests, plantings, type Household } from '@/db/schema';
import { areaUnitFor, fromM2, plantingInput, type FromPlanInput, type PlantingInput, type PlantingPatch } from '@/lib/bed-schemas';
import type { CropYieldJson, PlantingJson, PlantingListJson } from '@/lib/bed-types';
import type { CropTableRow } from '@/lib/crop-table';
import { harvestWindow, seasonFrostDates } from '@/lib/growing-season';
import { todayIn } from '@/lib/months';
import { ownYields } from '@/lib/own-yield';
import { areaM2Of, bedRow } from './beds';
import { cropByKey } from './crop-table-file';
import { cropDisplayName } from '@/lib/crop-name';
import { cropRow } from './crops';
import { fieldError, invalidInput, type Executor, type Tx } from './entry-input';
import { HttpError } from './http';
import { SR28_INFO } from './sr28-source';

type H = Pick<Household, 'id' | 'units' | 'timezone' | 'lastSpringFrost' | 'firstAutumnFrost'>;
type PlantingRow = typeof plantings.$inferSelect;

const NOT_FOUND = 'No such planting in this household.';

function joined(ex: Executor) {
  return ex
    .select({
      p: plantings,
      cropName: crops.name,
      cropVariety: crops.variety,
      referenceKey: crops.referenceKey,
      bedName: beds.name,
      harvestedGrams: sql<number | null>`(SELECT SUM(${harvests.grams}) FROM ${harvests} WHERE ${harvests.plantingId} = ${plantings.id})`,
    })
    .from(plantings)
    .innerJoin(crops, eq(crops.id, plantings.cropId))
    .leftJoin(beds, eq(beds.id, plantings.bedId));
}

type Joined = Awaited<ReturnType<ReturnType<typeof joined>['where']>>[number];

function toJson(r: Joined, h: Pick<Household, 'units'>): PlantingJson {
  const p = r.p;
  const unit = areaUnitFor(h.units);
  return {
    id: p.id,
    cropId: p.cropId,
    cropName: cropDisplayName(r.cropName, r.cropVariety),
    referenceKey: r.referenceKey,
    bedId: p.bedId,
    bedName: r.bedName,
    areaM2: p.areaM2,
    area: fromM2(p.areaM2, unit),
    areaUnit: unit,
    seasonYear: p.seasonYear,
    slot: p.slot,
    sowDate: p.sowDate,
    harvestFrom: p.harvestFrom,
    harvestTo: p.harvestTo,
    notes: p.notes,
    fromPlan: p.fromPlan,
    harvestedKg: Number(r.harvestedGrams ?? 0) / 1000,
  };
}

/** One planting of the household as JSON, or 404. */
export async function getPlanting(h: H, plantingId: number, ex: Executor = getDb()): Promise<PlantingJson> {
  const [row] = await joined(ex).where(and(eq(plantings.householdId, h.id), eq(plantings.id, plantingId))).limit(1);
  if (!row) throw new HttpError(404, 'not_found', NOT_FOUND);
  return toJson(row, h);
}

async function plantingRow(ex: Executor, householdId: number, plantingId: number): Promise<PlantingRow> {
  const [row] = await ex.select().from(plantings).where(and(eq(plantings.householdId, householdId), eq(plantings.id, plantingId))).limit(1).for('update');
  if (!row) throw new HttpError(404, 'not_found', NOT_FOUND);
  return row;
}

/** The season year the household is in today. */
export function currentSeasonYear(h: Pick<Household, 'timezone'>): number {
  return Number(todayIn(h.timezone).slice(0, 4));
}

/**
 * The plantings of one season, by bed, slot and crop, and per crop the own measured yield beside
 * the reference typical yield. Example: `(await listPlantings(h, 2027)).plantings.length`
 */
export async function listPlantings(h: H, year: number): Promise<PlantingListJson> {
  const db = getDb();
  const rows = await joined(db)
    .where(and(eq(plantings.householdId, h.id), eq(plantings.seasonYear, year)))
    .orderBy(sql`${beds.name} IS NULL`, asc(beds.name), asc(plantings.slot), asc(crops.name), asc(plantings.id));
  const list = rows.map((r) => toJson(r, h));
  const ids = list.map((p) => p.id);
  const named = ids.length === 0 ? [] : await db
    .select({ plantingId: harvests.plantingId, grams: harvests.grams })
    .from(harvests)
    .where(and(eq(harvests.householdId, h.id), inArray(harvests.plantingId, ids)));
  const measured = ownYields(
    list.map((p) => ({ id: p.id, cropId: p.cropId, seasonYear: p.seasonYear, areaM2: p.areaM2 })),
    named.flatMap((n) => (n.plantingId === null ? [] : [{ plantingId: n.plantingId, grams: n.grams }])),
  );
  const yields: CropYieldJson[] = [];
  for (const p of list) {
    if (yields.some((y) => y.cropId === p.cropId)) continue;
    const own = measured.find((m) => m.cropId === p.cropId);
    const ref = p.referenceKey ? cropByKey(p.referenceKey) : undefined;
    yields.push({
      cropId: p.cropId,
      cropName: p.cropName,
      referenceKey: p.referenceKey,
      ownKgPerM2: own?.kgPerM2 ?? null,
      harvestedKg: own?.harvestedKg ?? 0,
      measuredAreaM2: own?.areaM2 ?? 0,
      referenceKgPerM2: ref && ref.yieldBasis === 'm2' ? ref.yieldKg.typical : null,
      referenceSource: ref?.source ?? null,
    });
  }
  return { year, plantings: list, yields };
}

/** A reference crop row by key, or a 400 on `field`. Animal lines (per hen or hive) have no planting area. */
function referenceRow(key: string, field: string): CropTableRow {
  const row = cropByKey(key);
  if (!row) throw fieldError(field, `There is no reference crop ${key}: choose one from the list.`);
  if (row.yieldBasis !== 'm2') throw fieldError(field, `${row.name} yields per ${row.yieldBasis}, not per m² of bed: it cannot be planted.`);
  return row;
}

/**
 * The household's crop of a reference row: the one linked to it, else one of the same name without
 * a link (which gets the link), else a new crop named after the row, matched to the row's SR28 food
 * when the foods table has it, with the row's category, edible fraction and spread.
 */
async function ensureReferenceCrop(tx: Tx, householdId: number, row: CropTableRow): Promise<number> {
  const [linked] = await tx.select({ id: crops.id }).from(crops).where(and(eq(crops.householdId, householdId), eq(crops.referenceKey, row.key))).orderBy(asc(crops.id)).limit(1);
  if (linked) return linked.id;
  const [sameName] = await tx
    .select({ id: crops.id })
    .from(crops)
    .where(and(eq(crops.householdId, householdId), eq(crops.name, row.name), eq(crops.variety, ''), isNull(crops.referenceKey)))
    .limit(1);
  if (sameName) {
    await tx.update(crops).set({ referenceKey: row.key }).where(eq(crops.id, sameName.id));
    return sameName.id;
  }
  const [food] = await tx
    .select({ id: foods.id })
    .from(foods)
    .innerJoin(datasets, eq(datasets.id, foods.datasetId))
    .where(and(eq(datasets.slug, SR28_INFO.slug), eq(foods.code, row.sr28Code)))
    .limit(1);
  const [res] = await tx.insert(crops).values({
    householdId,
    name: row.name,
    foodId: food?.id ?? null,
    category: row.category,
    edibleFraction: row.edibleFraction,
    defaultSpreadMonths: row.defaultSpreadMonths,
    referenceKey: row.key,
  });
  return res.insertId;
}

/** The harvest window of a crop's reference row in a season, or nulls when the crop has none. */
function expectedWindow(h: H, referenceKey: string | null, year: number): { harvestFrom: string | null; harvestTo: string | null } {
  const row = referenceKey ? cropByKey(referenceKey) : undefined;
  if (!row || row.yieldBasis !== 'm2') return { harvestFrom: null, harvestTo: null };
  const w = harvestWindow(row, year, seasonFrostDates(h, h.timezone));
  return { harvestFrom: w.from, harvestTo: w.to };
}

async function requireBed(tx: Tx, householdId: number, bedId: number | null): Promise<void> {
  if (bedId === null) return;
  await bedRow(tx, householdId, bedId).catch((e: unknown) => {
    if (e instanceof HttpError && e.status === 404) throw fieldError('bedId', 'There is no such bed in this household.');
    throw e;
  });
}

async function requireCrop(tx: Tx, householdId: number, cropId: number) {
  return cropRow(tx, householdId, cropId).catch((e: unknown) => {
    if (e instanceof HttpError && e.status === 404) throw fieldError('cropId', 'There is no such crop in this household.');
    throw e;
  });
}

/**
 * Adds a planting. Without a harvest window, one is worked out from the crop's reference row and
 * the household's frost dates. Example: `await createPlanting(h, plantingInput.parse({ referenceKey: 'garlic', area: 3, seasonYear: 2027 }))`
 */
export async function createPlanting(h: H, input: PlantingInput): Promise<PlantingJson> {
  return getDb().transaction(async (tx) => {
    const cropId = input.cropId !== undefined ? (await requireCrop(tx, h.id, input.cropId)).id : await ensureReferenceCrop(tx, h.id, referenceRow(input.referenceKey!, 'referenceKey'));
    const crop = await cropRow(tx, h.id, cropId);
    await requireBed(tx, h.id, input.bedId);
    const window = input.harvestFrom === undefined && input.harvestTo === undefined ? expectedWindow(h, crop.referenceKey, input.seasonYear) : { harvestFrom: input.harvestFrom ?? null, harvestTo: input.harvestTo ?? null };
    const [res] = await tx.insert(plantings).values({
      householdId: h.id,
      cropId,
      bedId: input.bedId,
      areaM2: areaM2Of(input.area, input.areaUnit, h.units),
      seasonYear: input.seasonYear,
      slot: input.slot,
      sowDate: input.sowDate ?? null,
      ...window,
      notes: input.notes ?? null,
    });
    return getPlanting(h, res.insertId, tx);
  });
}

/** Changes a planting; the result is checked as a whole (dates in order, crop and bed of the household). */
export async function updatePlanting(h: H, plantingId: number, patch: PlantingPatch): Promise<PlantingJson> {
  return getDb().transaction(async (tx) => {
    const row = await plantingRow(tx, h.id, plantingId);
    const unit = areaUnitFor(h.units);
    const merged = {
      cropId: patch.cropId ?? row.cropId,
      bedId: patch.bedId !== undefined ? patch.bedId : row.bedId,
      area: patch.area ?? fromM2(row.areaM2, unit),
      areaUnit: patch.area !== undefined ? (patch.areaUnit ?? unit) : unit,
      seasonYear: patch.seasonYear ?? row.seasonYear,
      slot: patch.slot ?? row.slot,
      sowDate: (patch.sowDate !== undefined ? patch.sowDate : row.sowDate) ?? undefined,
      harvestFrom: (patch.harvestFrom !== undefined ? patch.harvestFrom : row.harvestFrom) ?? undefined,
      harvestTo: (patch.harvestTo !== undefined ? patch.harvestTo : row.harvestTo) ?? undefined,
      notes: (patch.notes !== undefined ? patch.notes : row.notes) ?? undefined,
    };
    const checked = plantingInput.safeParse(merged);
    if (!checked.success) throw invalidInput(checked.error);
    const next = checked.data;
    if (next.cropId !== row.cropId) {
      await requireCrop(tx, h.id, next.cropId!);
      const [named] = await tx.select({ id: harvests.id }).from(harvests).where(and(eq(harvests.householdId, h.id), eq(harvests.plantingId, plantingId))).limit(1);
      if (named) throw new HttpError(409, 'in_use', 'Harvests of this planting are logged for its crop: change the crop of a new planting instead.', { cropId: 'Harvests name this planting with its present crop.' });
    }
    await requireBed(tx, h.id, next.bedId);
    await tx
      .update(plantings)
      .set({
        cropId: next.cropId!,
        bedId: next.bedId,
        // Keep the stored m² exactly when the area was not sent (no round trip through ft²).
        areaM2: patch.area !== undefined ? areaM2Of(patch.area, patch.areaUnit, h.units) : row.areaM2,
        seasonYear: next.seasonYear,
        slot: next.slot,
        sowDate: next.sowDate ?? null,
        harvestFrom: next.harvestFrom ?? null,
        harvestTo: next.harvestTo ?? null,
        notes: next.notes ?? null,
      })
      .where(and(eq(plantings.householdId, h.id), eq(plantings.id, plantingId)));
    return getPlanting(h, plantingId, tx);
  });
}

/** Deletes a planting; harvests that named it keep their weight and lose the link. 404 when the household has none with this id. */
export async function deletePlanting(householdId: number, plantingId: number): Promise<void> {
  const [res] = await getDb().delete(plantings).where(and(eq(plantings.householdId, householdId), eq(plantings.id, plantingId)));
  if (res.affectedRows === 0) throw new HttpError(404, 'not_found', NOT_FOUND);
}

/**
 * A plan turned into plantings, in one transaction: per reference crop key the household's crop
 * (found or added) and one planting without a bed, marked fromPlan, its harvest window from the
 * reference row and the frost dates. Any unknown key refuses the whole plan (400 naming the row).
 */
export async function plantingsFromPlan(h: H, input: FromPlanInput): Promise<PlantingJson[]> {
  const rows = input.crops.map((c, i) => referenceRow(c.cropKey, `crops.${i}.cropKey`));
  const frost = seasonFrostDates(h, h.timezone);
  return getDb().transaction(async (tx) => {
    const ids: number[] = [];
    for (const [i, row] of rows.entries()) {
      const cropId = await ensureReferenceCrop(tx, h.id, row);
      const w = harvestWindow(row, input.year, frost);
      const [res] = await tx.insert(plantings).values({
        householdId: h.id,
        cropId,
        bedId: null,
        areaM2: input.crops[i]!.areaM2,
        seasonYear: input.year,
        slot: 'main',
        harvestFrom: w.from,
        harvestTo: w.to,
        fromPlan: true,
      });
      ids.push(res.insertId);
    }
    const out: PlantingJson[] = [];
    for (const id of ids) out.push(await getPlanting(h, id, tx));
    return out;
  });
}

/**
 * 422 unless the planting is the household's and grows the harvest's crop: a harvest names only a
 * planting of its own crop. Example: `await requirePlantingOfCrop(tx, 7, 12, 3)`
 */
export async function requirePlantingOfCrop(ex: Executor, householdId: number, plantingId: number, cropId: number | null): Promise<void> {
  const [p] = await ex.select({ cropId: plantings.cropId }).from(plantings).where(and(eq(plantings.householdId, householdId), eq(plantings.id, plantingId))).limit(1);
  if (!p) throw new HttpError(422, 'invalid_planting', 'plantingId: There is no such planting in this household.', { plantingId: 'There is no such planting in this household.' });
  if (cropId === null || p.cropId !== cropId) {
    const message = 'This planting grows another crop: name a planting of the harvest’s own crop, or none.';
    throw new HttpError(422, 'invalid_planting', `plantingId: ${message}`, { plantingId: message });
  }
}
