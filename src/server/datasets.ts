/**
 * The food composition datasets as the app lists them (GET /api/datasets, the admin pages), which
 * households use which, and each household's search order of datasets (households.dataset_order).
 */
import { asc, count, eq, sql } from 'drizzle-orm';
import type { Pool } from 'mysql2/promise';
import { datasetReleases, datasets, households, type Household } from '@/db/schema';
import { parseDatasetOrder, type DatasetSummary } from '@/lib/dataset-order';
import { dbOn } from './db-on';

/** Every dataset, in the order it was first loaded. */
export async function listDatasets(pool: Pool): Promise<DatasetSummary[]> {
  return dbOn(pool)
    .select({ slug: datasets.slug, name: datasets.name, release: datasets.release, publisher: datasets.publisher, licence: datasets.licence, foodCount: datasets.foodCount })
    .from(datasets)
    .orderBy(asc(datasets.id));
}

/** True when a dataset with this slug is loaded. */
export async function datasetExists(pool: Pool, slug: string): Promise<boolean> {
  const [r] = await dbOn(pool).select({ n: count() }).from(datasets).where(eq(datasets.slug, slug));
  return (r?.n ?? 0) > 0;
}

/** The slugs a household searches, first first: its stored order (known slugs only), then the rest as loaded. */
export async function householdDatasetOrder(pool: Pool, household: Pick<Household, 'datasetOrder'>): Promise<string[]> {
  const all = (await listDatasets(pool)).map((d) => d.slug);
  const chosen = parseDatasetOrder(household.datasetOrder).filter((s) => all.includes(s));
  return [...chosen, ...all.filter((s) => !chosen.includes(s))];
}

/** Stores a household's order (slugs checked against the loaded datasets by the caller). */
export async function setHouseholdDatasetOrder(pool: Pool, householdId: number, order: readonly string[]): Promise<void> {
  await dbOn(pool).update(households).set({ datasetOrder: order.join(',') }).where(eq(households.id, householdId));
}

/** Each dataset's load history, newest first. */
export async function listReleases(pool: Pool) {
  return dbOn(pool)
    .select({ slug: datasets.slug, release: datasetReleases.release, foodCount: datasetReleases.foodCount, amountCount: datasetReleases.amountCount, importedBy: datasetReleases.importedBy, importedAt: datasetReleases.importedAt })
    .from(datasetReleases)
    .innerJoin(datasets, eq(datasets.id, datasetReleases.datasetId))
    .orderBy(sql`${datasetReleases.id} DESC`)
    .limit(200);
}

export interface DatasetUse {
  slug: string;
  householdId: number;
  householdName: string;
  crops: number;
  harvests: number;
  purchases: number;
}

/** Which households use which dataset: crops, harvests and bought food matched to its foods. */
export async function datasetUsage(pool: Pool): Promise<DatasetUse[]> {
  // Three counts per (dataset, household) over UNION ALL: the builder has no UNION of grouped joins.
  const [rows] = await pool.query(
    `SELECT d.slug, h.id AS householdId, h.name AS householdName,
            SUM(u.kind = 'crop') AS crops, SUM(u.kind = 'harvest') AS harvests, SUM(u.kind = 'purchase') AS purchases
       FROM (SELECT household_id, food_id, 'crop' AS kind FROM crops WHERE food_id IS NOT NULL
             UNION ALL SELECT household_id, food_id, 'harvest' FROM harvests WHERE food_id IS NOT NULL
             UNION ALL SELECT household_id, food_id, 'purchase' FROM purchases) u
       JOIN foods f ON f.id = u.food_id
       JOIN datasets d ON d.id = f.dataset_id
       JOIN households h ON h.id = u.household_id
      GROUP BY d.slug, h.id, h.name
      ORDER BY d.slug, h.name`,
  );
  return (rows as Record<string, unknown>[]).map((r) => ({
    slug: String(r.slug),
    householdId: Number(r.householdId),
    householdName: String(r.householdName),
    crops: Number(r.crops),
    harvests: Number(r.harvests),
    purchases: Number(r.purchases),
  }));
}


/** True when the dataset's latest release came from an administrator's upload (not the built-in package). */
export async function latestReleaseUploaded(pool: Pool, slug: string): Promise<boolean> {
  const [r] = await dbOn(pool)
    .select({ importedBy: datasetReleases.importedBy })
    .from(datasetReleases)
    .innerJoin(datasets, eq(datasets.id, datasetReleases.datasetId))
    .where(eq(datasets.slug, slug))
    .orderBy(sql`${datasetReleases.id} DESC`)
    .limit(1);
  return !!r?.importedBy;
}
