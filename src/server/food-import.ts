/**
 * Loads a food composition dataset into MariaDB in one transaction. Re-running it updates foods in
 * place (their ids stay, so crops and entries that point at them keep working) and replaces their
 * nutrient amounts and household weights: never duplicates. Statements go through Drizzle's builder
 * except the joined deletes (marked where they stay raw); the nutrient amounts go in with one bulk load.
 */
import { eq, inArray, sql } from 'drizzle-orm';
import { drizzle } from 'drizzle-orm/mysql2';
import type { Pool } from 'mysql2/promise';
import { withWriteRetry } from './write-retry';
import type { Db } from '@/db/client';
import * as schema from '@/db/schema';
import { datasetReleases, datasets, foodNutrients, foodWeights, foods as foodsTable, nutrients } from '@/db/schema';
import { NUTRIENTS } from '@/lib/nutrients';
import { loadRows } from './bulk-load';
import { dbOn } from './db-on';
import { forgetKeptSearches } from './food-search-cache';

export interface DatasetInfo {
  slug: string;
  name: string;
  release: string;
  publisher: string;
  licence: string;
  sourceNote: string;
}

export interface FoodRecord {
  code: string;
  name: string;
  originalName: string;
  group: string;
  refusePct: number | null;
  rawness: number;
  weights: { description: string; grams: number }[];
}

export interface AmountRecord {
  code: string;
  key: string;
  amount: number;
}

export interface ImportResult {
  datasetId: number;
  foods: number;
  amounts: number;
  skipped: boolean;
}

const CHUNK = 1000;

/** Writes the nutrient definitions from src/lib/nutrients.ts (idempotent). */
export async function syncNutrients(db: Db): Promise<void> {
  await db
    .insert(nutrients)
    .values(NUTRIENTS.map((n, i) => ({ key: n.key, name: n.name, unit: n.unit, nutrientGroup: n.group, sortOrder: i })))
    .onDuplicateKeyUpdate({
      set: {
        name: sql`VALUES(${nutrients.name})`,
        unit: sql`VALUES(${nutrients.unit})`,
        nutrientGroup: sql`VALUES(${nutrients.nutrientGroup})`,
        sortOrder: sql`VALUES(${nutrients.sortOrder})`,
      },
    });
}

/**
 * True when this dataset release is already loaded with these foods and their search ranks as the
 * code works them out now: ranks are set at load time, so a release loaded under older rules
 * (rawnessRank) is loaded again, once, by the next `db:import-foods` or `npm start`.
 */
export async function isImported(pool: Pool, info: DatasetInfo, records: readonly FoodRecord[]): Promise<boolean> {
  const db = dbOn(pool);
  const [r] = await db.select({ id: datasets.id, release: datasets.release, foodCount: datasets.foodCount }).from(datasets).where(eq(datasets.slug, info.slug));
  if (!r || r.release !== info.release || r.foodCount !== records.length) return false;
  const stored = await db.select({ code: foodsTable.code, rawness: foodsTable.rawness }).from(foodsTable).where(eq(foodsTable.datasetId, r.id));
  const rank = new Map(stored.map((f) => [f.code, f.rawness]));
  return records.every((f) => rank.get(f.code) === f.rawness);
}

async function datasetId(db: Db, slug: string): Promise<number> {
  const [r] = await db.select({ id: datasets.id }).from(datasets).where(eq(datasets.slug, slug));
  return r!.id;
}

export async function importDataset(
  pool: Pool,
  info: DatasetInfo,
  foods: FoodRecord[],
  amounts: AmountRecord[],
  opts: { force?: boolean; log?: (line: string) => void; progress?: (rowsWritten: number) => void; importedBy?: string } = {},
): Promise<ImportResult> {
  const log = opts.log ?? (() => {});
  const codes = new Set<string>();
  for (const f of foods) {
    if (codes.has(f.code)) throw new Error(`dataset ${info.slug} has food code ${f.code} twice`);
    codes.add(f.code);
  }
  for (const a of amounts) {
    if (!codes.has(a.code)) throw new Error(`nutrient amount for unknown food code ${a.code}`);
    if (!Number.isFinite(a.amount) || a.amount < 0) throw new Error(`food ${a.code}: ${a.key} amount ${a.amount} is not a non-negative number`);
  }
  if (!opts.force && (await isImported(pool, info, foods))) {
    return { datasetId: await datasetId(dbOn(pool), info.slug), foods: foods.length, amounts: 0, skipped: true };
  }

  // One transaction on one connection, run whole again after a deadlock (write-retry.ts). This
  // process's kept search answers go once it ends: none of them is served from before the load.
  return withWriteRetry(() => loadInOneTransaction(pool, info, foods, amounts, opts, log)).finally(forgetKeptSearches);
}

async function loadInOneTransaction(
  pool: Pool,
  info: DatasetInfo,
  foods: FoodRecord[],
  amounts: AmountRecord[],
  opts: { importedBy?: string; progress?: (rowsWritten: number) => void },
  log: (line: string) => void,
): Promise<ImportResult> {
  const conn = await pool.getConnection();
  // Drizzle on the transaction's own connection; the bulk statements below use `conn` directly.
  const db = drizzle(conn, { schema, mode: 'default' });
  try {
    await conn.beginTransaction();
    await syncNutrients(db);
    const dataset = {
      slug: info.slug,
      name: info.name,
      release: info.release,
      publisher: info.publisher,
      licence: info.licence,
      sourceNote: info.sourceNote,
      foodCount: foods.length,
    };
    const { slug: _slug, ...changed } = dataset;
    await db
      .insert(datasets)
      .values(dataset)
      // A new revision voids the stored share answers resting on the old amounts (share-cache.ts).
      .onDuplicateKeyUpdate({ set: { ...changed, revision: sql`${datasets.revision} + 1`, importedAt: sql`CURRENT_TIMESTAMP` } });
    const id = await datasetId(db, info.slug);

    log(`  foods 0/${foods.length}`);
    for (let i = 0; i < foods.length; i += CHUNK) {
      const rows = foods.slice(i, i + CHUNK).map((f) => ({
        datasetId: id,
        code: f.code,
        name: f.name,
        originalName: f.originalName,
        foodGroup: f.group,
        refusePct: f.refusePct,
        rawness: f.rawness,
        searchText: `${f.name} ${f.originalName} ${f.group} ${f.code}`,
      }));
      await db
        .insert(foodsTable)
        .values(rows)
        .onDuplicateKeyUpdate({
          set: {
            name: sql`VALUES(${foodsTable.name})`,
            originalName: sql`VALUES(${foodsTable.originalName})`,
            foodGroup: sql`VALUES(${foodsTable.foodGroup})`,
            refusePct: sql`VALUES(${foodsTable.refusePct})`,
            rawness: sql`VALUES(${foodsTable.rawness})`,
            searchText: sql`VALUES(${foodsTable.searchText})`,
          },
        });
      log(`  foods ${Math.min(i + CHUNK, foods.length)}/${foods.length}`);
      opts.progress?.(Math.min(i + CHUNK, foods.length));
    }
    const idRows = await db.select({ id: foodsTable.id, code: foodsTable.code }).from(foodsTable).where(eq(foodsTable.datasetId, id));
    const idByCode = new Map(idRows.map((r) => [r.code, r.id]));
    // A food this release no longer has keeps its row (entries name it; its figures become unknown),
    // but search stops offering it: nobody should pick a food with no figures. Back in a later
    // release, the upsert above gives it its search words again.
    const inRelease = new Set(foods.map((f) => f.code));
    const dropped = idRows.filter((r) => !inRelease.has(r.code)).map((r) => r.id);
    for (let i = 0; i < dropped.length; i += CHUNK) {
      await db.update(foodsTable).set({ searchText: '' }).where(inArray(foodsTable.id, dropped.slice(i, i + CHUNK)));
    }

    // Multi-table DELETE with a join: Drizzle's delete() has no join.
    await conn.query('DELETE fn FROM food_nutrients fn JOIN foods f ON f.id = fn.food_id WHERE f.dataset_id = ?', [id]);
    await conn.query('DELETE w FROM food_weights w JOIN foods f ON f.id = w.food_id WHERE f.dataset_id = ?', [id]);
    log(`  nutrient amounts 0/${amounts.length}`);
    // About 260,000 rows: one LOAD DATA LOCAL INFILE from memory, the database's own bulk path (bulk-load.ts).
    await loadRows(db, foodNutrients, amounts.map((a) => ({ foodId: idByCode.get(a.code)!, nutrientKey: a.key, amount: a.amount })));
    log(`  nutrient amounts ${amounts.length}`);
    opts.progress?.(foods.length + amounts.length);
    const weightRows = foods.flatMap((f) => f.weights.map((w, i) => ({ foodId: idByCode.get(f.code)!, seq: i + 1, description: w.description.slice(0, 200), grams: w.grams })));
    for (let i = 0; i < weightRows.length; i += CHUNK) await db.insert(foodWeights).values(weightRows.slice(i, i + CHUNK));
    log(`  household weights ${weightRows.length}`);
    await db.insert(datasetReleases).values({ datasetId: id, release: info.release, foodCount: foods.length, amountCount: amounts.length, importedBy: opts.importedBy ?? null });
    await conn.commit();
    return { datasetId: id, foods: foods.length, amounts: amounts.length, skipped: false };
  } catch (e) {
    await conn.rollback();
    throw e;
  } finally {
    conn.release();
  }
}
