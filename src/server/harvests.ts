/**
 * The harvest log in the database. Every function takes the household id and touches only that
 * household's rows. Grams and edible grams are worked out here, at write time, from the entry's
 * unit and its crop (or reference food), and again on every change.
 */
import { randomUUID } from 'node:crypto';
import { and, asc, desc, eq, inArray, ne, sql } from 'drizzle-orm';
import { getDb } from '@/db/client';
import { crops, foods, harvests, households, type Crop, type Harvest } from '@/db/schema';
import { defaultSpreadMonths, type CropCategory } from '@/lib/crop-categories';
import { cropUseError, mergeHarvestPatch, splitToHarvests, type HarvestInput, type HarvestPatch, type HarvestSplitInput } from '@/lib/entry-schemas';
import { type HarvestQuery } from '@/lib/list-query-schemas';
import type { HarvestJson, HarvestList } from '@/lib/entry-types';
import { isCountOrVolume } from '@/lib/entry-units';
import type { CountVolumeBasis, MeasuredFood } from '@/lib/count-volume';
import { cropDisplayName } from '@/lib/crop-name';
import { cropRow, harvestEdibleGrams, requireFood } from './crops';
import { HttpError } from './http';
import { todayIn } from '@/lib/months';
import { fieldError, invalidInput, type Executor, type Tx } from './entry-input';
import { listEntries, type EntryListSpec } from './entry-list';
import { requirePlantingOfCrop } from './plantings';
import { updateEntry, type EntryUpdateSpec } from './entry-update';
import { groupAfterDelete, sharedSplitPatch } from '@/lib/split-weighing';
import { reconcileOutcomes } from './larder-outcomes';
import { measuredFood, weighEntry } from './unit-weights';

export type { HarvestJson, HarvestList } from '@/lib/entry-types';

const NOT_FOUND = 'No such harvest in this household.';

/** What a harvest's numbers rest on: its crop (if any) and reference food. */
export interface HarvestBasis {
  cropId: number | null;
  cropName?: string;
  foodId: number | null;
  refusePct: number | null;
  edibleFraction: number | null;
  notFood: boolean;
  category: CropCategory;
  cropDefaultSpread: number | null;
  /** The crop's weight of one piece, bunch or head (g); null = none set. */
  countGrams: number | null;
  /** The food's household measures: loaded only for an entry in a count or volume unit. */
  measured: MeasuredFood | null;
}

/** What a count or volume of this harvest is weighed from: the crop's weight of one, the food's measures. */
export function countVolumeBasis(basis: HarvestBasis): CountVolumeBasis {
  return { crop: basis.cropId === null ? null : { name: basis.cropName ?? 'this crop', countGrams: basis.countGrams }, food: basis.measured };
}

/** The basis of a harvest of one of the household's crops; `food` is the crop's reference food, if it has one. */
export function cropBasis(
  crop: Pick<Crop, 'id' | 'name' | 'variety' | 'foodId' | 'edibleFraction' | 'notFood' | 'category' | 'defaultSpreadMonths'> & { countGrams?: number | null },
  food: { refusePct: number | null } | null | undefined,
  measured: MeasuredFood | null = null,
): HarvestBasis {
  return {
    cropId: crop.id,
    cropName: cropDisplayName(crop.name, crop.variety),
    foodId: crop.foodId,
    refusePct: food?.refusePct ?? null,
    edibleFraction: crop.edibleFraction,
    notFood: crop.notFood,
    category: crop.category,
    cropDefaultSpread: crop.defaultSpreadMonths,
    countGrams: crop.countGrams ?? null,
    measured,
  };
}

/** The basis of a harvest logged straight against a reference food (no crop of the household). */
export function foodBasis(food: { id: number; refusePct: number | null }, measured: MeasuredFood | null = null): HarvestBasis {
  return { cropId: null, foodId: food.id, refusePct: food.refusePct, edibleFraction: null, notFood: false, category: 'other', cropDefaultSpread: null, countGrams: null, measured };
}

/**
 * The basis of an entry naming a crop (of this household) or a reference food; 400 when neither
 * exists. The food's household measures are read only for an entry in a count or volume unit.
 */
export async function harvestBasis(ex: Executor, householdId: number, ref: { cropId?: number | undefined; foodId?: number | undefined; unit?: string }): Promise<HarvestBasis> {
  const measured = (foodId: number | null) => (isCountOrVolume(ref.unit) ? measuredFood(ex, foodId) : Promise.resolve(null));
  if (ref.cropId !== undefined) {
    const crop = await cropRow(ex, householdId, ref.cropId).catch((e: unknown) => {
      if (e instanceof HttpError && e.status === 404) throw fieldError('cropId', 'There is no such crop in this household.');
      throw e;
    });
    const food = crop.foodId === null ? null : await requireFood(ex, crop.foodId);
    return cropBasis(crop, food, await measured(crop.foodId));
  }
  if (ref.foodId !== undefined) {
    return foodBasis(await requireFood(ex, ref.foodId), await measured(ref.foodId));
  }
  throw fieldError('cropId', 'Choose the crop (or a reference food) this harvest is of.');
}

/** The stored columns of a harvest: the fields the API answers with (HarvestJson) that come from the input, and its planting. */
export type HarvestValues = Pick<HarvestJson, 'cropId' | 'foodId' | 'date' | 'quantity' | 'unit' | 'grams' | 'edibleGrams' | 'weightSource' | 'use' | 'spreadMonths' | 'preserveMethod' | 'trimmed' | 'note'> & {
  plantingId: number | null;
};

/**
 * The stored columns of a harvest from its input and basis (grams, edible grams, spread filled in).
 * A count or volume is weighed through its named weight (422 when there is none); one weighed by a
 * reference food's household measure is edible as logged (SR28 gives those weights edible).
 */
export function harvestValues(input: HarvestInput, basis: HarvestBasis): HarvestValues {
  const { grams, weightSource, edibleAsLogged } = weighEntry(input.quantity, input.unit, countVolumeBasis(basis));
  return {
    cropId: basis.cropId,
    foodId: basis.foodId,
    date: input.date,
    quantity: input.quantity,
    unit: input.unit,
    grams,
    edibleGrams: harvestEdibleGrams(grams, input.trimmed || edibleAsLogged, basis),
    weightSource,
    use: input.use,
    // Stored or preserved without a spread: the crop's own default, else its category's.
    spreadMonths: input.spreadMonths ?? defaultSpreadMonths({ use: input.use, category: basis.category, cropDefault: basis.cropDefaultSpread }),
    preserveMethod: input.use === 'preserved' ? (input.preserveMethod ?? null) : null,
    trimmed: input.trimmed,
    note: input.note ?? null,
    plantingId: input.plantingId ?? null,
  };
}

/**
 * Refuses a harvest dated after today in the household's time zone: a harvest is weighed, so it
 * cannot lie ahead (a slipped year would also put food into months not yet lived).
 */
async function checkNotFuture(ex: Executor, householdId: number, date: string): Promise<void> {
  const [h] = await ex.select({ timezone: households.timezone }).from(households).where(eq(households.id, householdId));
  const today = todayIn(h?.timezone ?? 'UTC');
  if (date > today) throw fieldError('date', `The harvest date ${date} is after today (${today} in the household's time zone); enter the day it was picked.`);
}

/** 422 unless a named planting is the household's and grows the harvest's crop. */
async function checkPlanting(ex: Executor, householdId: number, input: HarvestInput, basis: HarvestBasis): Promise<void> {
  if (input.plantingId !== undefined) await requirePlantingOfCrop(ex, householdId, input.plantingId, basis.cropId);
}

function checkUse(input: HarvestInput, basis: HarvestBasis, field = 'use'): void {
  const problem = cropUseError(input.use, { name: basis.cropName, notFood: basis.notFood });
  if (problem) throw fieldError(field, problem);
}

const selectJson = {
  h: harvests,
  cropName: crops.name,
  cropVariety: crops.variety,
  foodName: foods.name,
  foodCode: foods.code,
};

type JoinedRow = { h: Harvest; cropName: string | null; cropVariety: string | null; foodName: string | null; foodCode: string | null };

function toJson(r: JoinedRow): HarvestJson {
  const h = r.h;
  return {
    id: h.id,
    date: h.date,
    cropId: h.cropId,
    cropName: r.cropName === null ? null : cropDisplayName(r.cropName, r.cropVariety),
    foodId: h.foodId,
    foodName: r.foodName,
    foodCode: r.foodCode,
    quantity: h.quantity,
    unit: h.unit,
    grams: h.grams,
    edibleGrams: h.edibleGrams,
    weightSource: h.weightSource,
    use: h.use,
    spreadMonths: h.spreadMonths,
    preserveMethod: h.preserveMethod,
    plantingId: h.plantingId,
    trimmed: h.trimmed,
    note: h.note,
    splitGroup: h.splitGroup,
    createdAt: h.createdAt.toISOString(),
  };
}

function joined(ex: Executor) {
  return ex.select(selectJson).from(harvests).leftJoin(crops, eq(crops.id, harvests.cropId)).leftJoin(foods, eq(foods.id, harvests.foodId));
}

/** Harvests of the household by id, in the order of the ids given. */
export async function harvestsByIds(ex: Executor, householdId: number, ids: readonly number[]): Promise<HarvestJson[]> {
  if (ids.length === 0) return [];
  const rows = await joined(ex).where(and(eq(harvests.householdId, householdId), inArray(harvests.id, [...ids])));
  const byId = new Map(rows.map((r) => [r.h.id, toJson(r)]));
  return ids.flatMap((id) => byId.get(id) ?? []);
}

/** Every harvest of the household, oldest first (for the backup). */
export async function everyHarvest(householdId: number, ex: Executor = getDb()): Promise<HarvestJson[]> {
  const rows = await joined(ex).where(eq(harvests.householdId, householdId)).orderBy(asc(harvests.date), asc(harvests.id));
  return rows.map(toJson);
}

/** One harvest of the household as JSON, or 404. */
export async function getHarvest(householdId: number, harvestId: number, ex: Executor = getDb()): Promise<HarvestJson> {
  const [h] = await harvestsByIds(ex, householdId, [harvestId]);
  if (!h) throw new HttpError(404, 'not_found', NOT_FOUND);
  return h;
}

/**
 * Stores one harvest in a transaction. With `splitWith` it joins that harvest's weighing as one
 * more part (undoing the delete of a part). Example: `await createHarvest(tx, 7, userId, harvestInput.parse(body))` → HarvestJson
 */
export async function createHarvest(tx: Tx, householdId: number, userId: string | null, input: HarvestInput): Promise<HarvestJson> {
  await checkNotFuture(tx, householdId, input.date);
  const basis = await harvestBasis(tx, householdId, input);
  checkUse(input, basis);
  await checkPlanting(tx, householdId, input, basis);
  const values = harvestValues(input, basis);
  const splitGroup = input.splitWith === undefined ? null : await weighingToJoin(tx, householdId, input.splitWith, values);
  const [res] = await tx.insert(harvests).values({ ...values, householdId, createdBy: userId, splitGroup });
  return getHarvest(householdId, res.insertId, tx);
}

/**
 * The split group a new part joins: that of harvest `partId`, which must share the new part's crop
 * (or food), planting and date (split-weighing.ts); a harvest left alone by a delete gets a new
 * group with it. 400 naming `splitWith` otherwise.
 */
async function weighingToJoin(tx: Tx, householdId: number, partId: number, values: HarvestValues): Promise<string> {
  const [part] = await tx.select().from(harvests).where(and(eq(harvests.householdId, householdId), eq(harvests.id, partId))).for('update');
  if (!part) throw fieldError('splitWith', `There is no harvest #${partId} in this household to join.`);
  const same = part.cropId === values.cropId && (values.cropId !== null || part.foodId === values.foodId) && part.plantingId === values.plantingId && part.date === values.date;
  if (!same) throw fieldError('splitWith', `Harvest #${partId} is of another crop, food, planting or day; the parts of one weighing share them.`);
  if (part.splitGroup !== null) return part.splitGroup;
  const group = randomUUID();
  await tx.update(harvests).set({ splitGroup: group }).where(eq(harvests.id, part.id));
  return group;
}

/**
 * Stores one weighing split between uses: one entry per part, sharing a split_group id, in the
 * caller's transaction; if any part is refused the caller's transaction rolls back and nothing is kept.
 */
export async function createSplitHarvest(tx: Tx, householdId: number, userId: string | null, split: HarvestSplitInput): Promise<HarvestJson[]> {
  await checkNotFuture(tx, householdId, split.date);
  const parts = splitToHarvests(split);
  const basis = await harvestBasis(tx, householdId, split);
  parts.forEach((part, i) => checkUse(part, basis, `parts.${i}.use`));
  const splitGroup = randomUUID();
  const ids: number[] = [];
  // One insert per part: each insertId is exact (multi-row insert ids need not be consecutive under Galera).
  for (const part of parts) {
    const [res] = await tx.insert(harvests).values({ ...harvestValues(part, basis), householdId, createdBy: userId, splitGroup });
    ids.push(res.insertId);
  }
  return harvestsByIds(tx, householdId, ids);
}

/** The harvest log's part of the shared list: crop names joined, crop and use filters, sort by crop. */
const harvestList: EntryListSpec<HarvestQuery, JoinedRow, HarvestJson> = {
  table: harvests,
  select: joined,
  toJson,
  extraFilters: (q) => [
    ...(q.cropId !== undefined ? [eq(harvests.cropId, q.cropId)] : []),
    ...(q.use !== undefined ? [eq(harvests.use, q.use)] : []),
    ...(q.splitGroup !== undefined && q.splitGroup.length > 0 ? [inArray(harvests.splitGroup, q.splitGroup)] : []),
  ],
  // Entries without a crop (a reference food chosen directly) sort by the food's name.
  nameSort: { key: 'crop', order: [asc(sql`COALESCE(${crops.name}, ${foods.name})`), asc(crops.variety), desc(harvests.date), desc(harvests.id)] },
};

/** One page of the household's harvests, with the count and weight totals of the whole filter. */
export async function listHarvests(householdId: number, q: HarvestQuery): Promise<HarvestList> {
  const { rows, page } = await listEntries(harvestList, householdId, q);
  return { harvests: rows, ...page };
}

/** The columns of a stored harvest after `patch`: merged, checked again (date, crop, use, planting), larder outcomes reconciled. */
async function reviseHarvest(tx: Tx, householdId: number, row: Harvest, patch: HarvestPatch): Promise<HarvestValues> {
  // A harvest of a crop also stores the crop's food: as input it names the crop only.
  const current = {
    date: row.date,
    ...(row.cropId !== null ? { cropId: row.cropId } : { foodId: row.foodId }),
    quantity: row.quantity,
    unit: row.unit,
    use: row.use,
    spreadMonths: row.spreadMonths,
    preserveMethod: row.preserveMethod,
    trimmed: row.trimmed,
    note: row.note,
    plantingId: row.plantingId,
  };
  // A planting of the old crop stays and is refused (422) unless the patch clears or replaces it.
  const merged = mergeHarvestPatch(current, patch);
  if (!merged.success) throw invalidInput(merged.error);
  if (patch.date !== undefined) await checkNotFuture(tx, householdId, merged.data.date);
  const basis = await harvestBasis(tx, householdId, merged.data);
  checkUse(merged.data, basis);
  await checkPlanting(tx, householdId, merged.data, basis);
  const values = harvestValues(merged.data, basis);
  await reconcileOutcomes(tx, householdId, row.id, values);
  return values;
}

/** The other parts of a harvest's split weighing, locked; none when it is not split. */
async function otherParts(tx: Tx, householdId: number, row: Harvest): Promise<Harvest[]> {
  if (row.splitGroup === null) return [];
  return tx
    .select()
    .from(harvests)
    .where(and(eq(harvests.householdId, householdId), eq(harvests.splitGroup, row.splitGroup), ne(harvests.id, row.id)))
    .orderBy(asc(harvests.id))
    .for('update');
}

/** A harvest's part of the shared update; a split part's crop, planting or date goes to the whole weighing (split-weighing.ts). */
const harvestUpdate: EntryUpdateSpec<typeof harvests, HarvestPatch, HarvestJson> = {
  table: harvests,
  notFound: NOT_FOUND,
  revise: reviseHarvest,
  alsoUpdate: async (tx, householdId, row, patch) => {
    const shared = sharedSplitPatch(patch);
    if (!shared) return;
    for (const part of await otherParts(tx, householdId, row)) {
      const values = await reviseHarvest(tx, householdId, part, shared);
      await tx.update(harvests).set(values).where(eq(harvests.id, part.id));
    }
  },
  get: getHarvest,
};

/** Changes a harvest; grams, edible grams and the spread are worked out again. */
export async function updateHarvest(householdId: number, harvestId: number, patch: HarvestPatch): Promise<HarvestJson> {
  return updateEntry(harvestUpdate, householdId, harvestId, patch);
}

/**
 * Deletes a harvest of the household (404 when it has none with this id). The other parts of its
 * split weighing stay; a single part left becomes an ordinary harvest. One transaction.
 */
export async function deleteHarvest(householdId: number, harvestId: number): Promise<void> {
  await getDb().transaction(async (tx) => {
    const [row] = await tx.select().from(harvests).where(and(eq(harvests.householdId, householdId), eq(harvests.id, harvestId))).limit(1).for('update');
    if (!row) throw new HttpError(404, 'not_found', NOT_FOUND);
    const others = await otherParts(tx, householdId, row);
    await tx.delete(harvests).where(eq(harvests.id, row.id));
    if (row.splitGroup !== null && groupAfterDelete(others.length) === 'clear') {
      await tx.update(harvests).set({ splitGroup: null }).where(inArray(harvests.id, others.map((p) => p.id)));
    }
  });
}
