/**
 * Loads a food composition dataset into MariaDB in one transaction. Re-running it updates foods in
 * place (their ids stay, so crops and entries that point at them keep working) and replaces their
 * nutrient amounts and household weights: never duplicates.
 */
import type { Pool, PoolConnection } from 'mysql2/promise';
import { NUTRIENTS } from '../lib/nutrients';

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

async function insertChunks(
  conn: PoolConnection,
  sql: string,
  rows: unknown[][],
  progress?: (done: number) => void,
): Promise<void> {
  for (let i = 0; i < rows.length; i += CHUNK) {
    await conn.query(sql, [rows.slice(i, i + CHUNK)]);
    progress?.(Math.min(i + CHUNK, rows.length));
  }
}

/** Writes the nutrient definitions from src/lib/nutrients.ts (idempotent). */
export async function syncNutrients(conn: PoolConnection | Pool): Promise<void> {
  const rows = NUTRIENTS.map((n, i) => [n.key, n.name, n.unit, n.group, i]);
  await conn.query(
    'INSERT INTO nutrients (`key`, name, unit, nutrient_group, sort_order) VALUES ? ' +
      'ON DUPLICATE KEY UPDATE name = VALUES(name), unit = VALUES(unit), nutrient_group = VALUES(nutrient_group), sort_order = VALUES(sort_order)',
    [rows],
  );
}

/** True when this dataset release is already loaded with this many foods. */
export async function isImported(pool: Pool, info: DatasetInfo, foodCount: number): Promise<boolean> {
  const [rows] = await pool.query('SELECT `release`, food_count FROM datasets WHERE slug = ?', [info.slug]);
  const r = (rows as { release: string; food_count: number }[])[0];
  return !!r && r.release === info.release && r.food_count === foodCount;
}

export async function importDataset(
  pool: Pool,
  info: DatasetInfo,
  foods: FoodRecord[],
  amounts: AmountRecord[],
  opts: { force?: boolean; log?: (line: string) => void } = {},
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
  if (!opts.force && (await isImported(pool, info, foods.length))) {
    const [rows] = await pool.query('SELECT id FROM datasets WHERE slug = ?', [info.slug]);
    return { datasetId: (rows as { id: number }[])[0]!.id, foods: foods.length, amounts: 0, skipped: true };
  }

  const conn = await pool.getConnection();
  try {
    await conn.beginTransaction();
    await syncNutrients(conn);
    await conn.query(
      'INSERT INTO datasets (slug, name, `release`, publisher, licence, source_note, food_count) VALUES (?, ?, ?, ?, ?, ?, ?) ' +
        'ON DUPLICATE KEY UPDATE name = VALUES(name), `release` = VALUES(`release`), publisher = VALUES(publisher), ' +
        'licence = VALUES(licence), source_note = VALUES(source_note), food_count = VALUES(food_count), imported_at = CURRENT_TIMESTAMP',
      [info.slug, info.name, info.release, info.publisher, info.licence, info.sourceNote, foods.length],
    );
    const [ds] = await conn.query('SELECT id FROM datasets WHERE slug = ?', [info.slug]);
    const datasetId = (ds as { id: number }[])[0]!.id;

    log(`  foods 0/${foods.length}`);
    await insertChunks(
      conn,
      'INSERT INTO foods (dataset_id, code, name, original_name, food_group, refuse_pct, rawness, search_text) VALUES ? ' +
        'ON DUPLICATE KEY UPDATE name = VALUES(name), original_name = VALUES(original_name), food_group = VALUES(food_group), ' +
        'refuse_pct = VALUES(refuse_pct), rawness = VALUES(rawness), search_text = VALUES(search_text)',
      foods.map((f) => [datasetId, f.code, f.name, f.originalName, f.group, f.refusePct, f.rawness, `${f.name} ${f.originalName} ${f.group} ${f.code}`]),
      (n) => log(`  foods ${n}/${foods.length}`),
    );
    const [idRows] = await conn.query('SELECT id, code FROM foods WHERE dataset_id = ?', [datasetId]);
    const idByCode = new Map((idRows as { id: number; code: string }[]).map((r) => [r.code, r.id]));

    await conn.query('DELETE fn FROM food_nutrients fn JOIN foods f ON f.id = fn.food_id WHERE f.dataset_id = ?', [datasetId]);
    await conn.query('DELETE w FROM food_weights w JOIN foods f ON f.id = w.food_id WHERE f.dataset_id = ?', [datasetId]);
    log(`  nutrient amounts 0/${amounts.length}`);
    await insertChunks(
      conn,
      'INSERT INTO food_nutrients (food_id, nutrient_key, amount) VALUES ?',
      amounts.map((a) => [idByCode.get(a.code), a.key, a.amount]),
      (n) => {
        if (n % 50_000 < CHUNK || n === amounts.length) log(`  nutrient amounts ${n}/${amounts.length}`);
      },
    );
    const weightRows = foods.flatMap((f) => f.weights.map((w, i) => [idByCode.get(f.code), i + 1, w.description.slice(0, 200), w.grams]));
    await insertChunks(conn, 'INSERT INTO food_weights (food_id, seq, description, grams) VALUES ?', weightRows);
    log(`  household weights ${weightRows.length}`);
    await conn.commit();
    return { datasetId, foods: foods.length, amounts: amounts.length, skipped: false };
  } catch (e) {
    await conn.rollback();
    throw e;
  } finally {
    conn.release();
  }
}
