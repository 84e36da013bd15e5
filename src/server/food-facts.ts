/**
 * What the share report needs of a reference food: its share nutrients per 100 g and its dataset.
 * Reference foods change only when a dataset is reloaded, and every reload adds one to its
 * dataset's `revision` in the reload's own transaction (food-import.ts) — the revision the stored
 * share answers rest on too (share-cache.ts). So the facts already read are kept in this process
 * while the sum of the revisions is the one they were read at, and a report reads only the foods
 * it has not met yet. Nothing here is state another app server needs: each keeps its own copy of
 * reference data and drops it when the revision in the database moves. At most MAX_FOODS are
 * kept (a few hundred kilobytes).
 */
import { inArray, sql } from 'drizzle-orm';
import type { Pool } from 'mysql2/promise';
import { datasets, foodNutrients, foods } from '@/db/schema';
import { SHARE_NUTRIENTS, type ShareNutrientKey } from '@/lib/nutrients';
import type { DatasetRef } from '@/lib/share-types';
import { rawQuery, rawRead } from './raw-query';

export interface FoodFact {
  /** Amount per 100 g of each share nutrient the dataset gives; a missing key is unknown. */
  amounts: Partial<Record<ShareNutrientKey, number>>;
  dataset: DatasetRef;
  /** The food's name (a harvest group with no crop is named after its food). */
  name: string;
}

const MAX_FOODS = 5000;
let kept: { revision: number; facts: Map<number, FoodFact> } | null = null;

const revisionNow = rawQuery<{ revision: number | string }>(sql`SELECT COALESCE(SUM(${datasets.revision}), 0) AS revision FROM ${datasets}`);

/** The sum of the datasets' revisions: one more after any reload. */
export async function referenceRevision(pool: Pool): Promise<number> {
  const [row] = await revisionNow.run(pool);
  return Number(row!.revision);
}

/** One row per food and share nutrient (a food with none comes once, with nulls), with its dataset. */
interface FactRow {
  foodId: number;
  foodName: string;
  slug: string;
  datasetName: string;
  release: string;
  nutrientKey: ShareNutrientKey | null;
  amount: string | number | null;
}

async function readFacts(pool: Pool, ids: readonly number[]): Promise<Map<number, FoodFact>> {
  const rows = await rawRead<FactRow>(
    pool,
    sql`
    SELECT ${foods.id} AS foodId, ${foods.name} AS foodName, ${datasets.slug} AS slug, ${datasets.name} AS datasetName, ${datasets.release} AS \`release\`,
           ${foodNutrients.nutrientKey} AS nutrientKey, ${foodNutrients.amount} AS amount
      FROM ${foods}
      JOIN ${datasets} ON ${datasets.id} = ${foods.datasetId}
      LEFT JOIN ${foodNutrients} ON ${foodNutrients.foodId} = ${foods.id} AND ${inArray(foodNutrients.nutrientKey, [...SHARE_NUTRIENTS])}
     WHERE ${inArray(foods.id, [...ids])}`,
  );
  const out = new Map<number, FoodFact>();
  for (const r of rows) {
    let fact = out.get(r.foodId);
    if (!fact) out.set(r.foodId, (fact = { amounts: {}, dataset: { slug: r.slug, name: r.datasetName, release: r.release }, name: r.foodName }));
    if (r.nutrientKey !== null && r.amount !== null) fact.amounts[r.nutrientKey] = Number(r.amount);
  }
  return out;
}

/**
 * The facts of some foods at `revision` (referenceRevision, read no later than the report's
 * groups): from those kept when the revision is the same, the rest read in one query and kept.
 * A food id with no food is left out.
 */
export async function foodFacts(pool: Pool, ids: readonly number[], revision: number): Promise<Map<number, FoodFact>> {
  if (!kept || kept.revision !== revision) kept = { revision, facts: new Map() };
  const here = kept;
  const missing = ids.filter((id) => !here.facts.has(id));
  if (missing.length > 0) {
    const read = await readFacts(pool, missing);
    if (here.facts.size + read.size > MAX_FOODS) here.facts.clear();
    for (const [id, fact] of read) here.facts.set(id, fact);
    const out = new Map<number, FoodFact>();
    for (const id of ids) {
      const fact = here.facts.get(id) ?? read.get(id);
      if (fact) out.set(id, fact);
    }
    return out;
  }
  return new Map(ids.map((id) => [id, here.facts.get(id)!]));
}
