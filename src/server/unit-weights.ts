/**
 * Weighing counts and volumes on the server: the household measures of reference foods read from
 * `food_weights` (only when an entry is in a count or volume unit), and the one 422 answer for an
 * entry whose count or volume has no weight to go by. The rules are src/lib/count-volume.ts.
 */
import { asc, eq, inArray } from 'drizzle-orm';
import { datasets, foods, foodWeights } from '@/db/schema';
import { datasetShortName, entryWeight, type CountVolumeBasis, type MeasuredFood } from '@/lib/count-volume';
import type { EntryUnit } from '@/lib/entry-units';
import type { Executor } from './entry-input';
import { HttpError } from './http';

/** Reference foods by id with their dataset's short name and household measures in the dataset's order. */
export async function measuredFoods(ex: Executor, foodIds: readonly number[]): Promise<Map<number, MeasuredFood>> {
  const ids = [...new Set(foodIds)];
  const out = new Map<number, MeasuredFood & { measures: { description: string; grams: number }[] }>();
  if (ids.length === 0) return out;
  const rows = await ex
    .select({ id: foods.id, code: foods.code, name: foods.name, slug: datasets.slug })
    .from(foods)
    .innerJoin(datasets, eq(datasets.id, foods.datasetId))
    .where(inArray(foods.id, ids));
  for (const r of rows) out.set(r.id, { dataset: datasetShortName(r.slug), code: r.code, name: r.name, measures: [] });
  const weights = await ex
    .select({ foodId: foodWeights.foodId, description: foodWeights.description, grams: foodWeights.grams })
    .from(foodWeights)
    .where(inArray(foodWeights.foodId, ids))
    .orderBy(asc(foodWeights.foodId), asc(foodWeights.seq));
  for (const w of weights) out.get(w.foodId)?.measures.push({ description: w.description, grams: w.grams });
  return out;
}

/** One food's measures (see measuredFoods), or null when there is no such food. */
export async function measuredFood(ex: Executor, foodId: number | null): Promise<MeasuredFood | null> {
  if (foodId === null) return null;
  return (await measuredFoods(ex, [foodId])).get(foodId) ?? null;
}

/** The error a count or volume without a weight is answered with: 422 `no_unit_weight`, on the unit field. */
export class NoUnitWeight extends HttpError {
  constructor(message: string, field = 'unit') {
    super(422, 'no_unit_weight', message, { [field]: message });
  }
}

/**
 * An entry's grams in any unit, or a 422 naming what to do (weigh it, or give the crop a weight of one).
 * Example: `weighEntry(12, 'piece', { food: egg })` → { grams: 600, weightSource: 'USDA SR28 01123, 1 large = 50 g', edibleAsLogged: true }
 */
export function weighEntry(quantity: number, unit: EntryUnit, basis: CountVolumeBasis): { grams: number; weightSource: string | null; edibleAsLogged: boolean } {
  const w = entryWeight(quantity, unit, basis);
  if (!w.ok) throw new NoUnitWeight(w.message);
  return w;
}
