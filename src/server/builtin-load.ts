/**
 * A site administrator's reload of a built-in dataset (USDA SR28, IFCT 2017) from the /admin page:
 * a dataset_jobs row of kind builtin_load, run in this process through the same importer as
 * `npm run db:import-foods -- --force` (importDataset, one transaction), with progress in the row
 * the page polls. The row claims the dataset (active_slug) so one load of it runs at a time on any
 * server; the importer raises the dataset's revision, which voids every stored share answer
 * (share-cache.ts compares the sum of revisions).
 */
import { sql } from 'drizzle-orm';
import { getDb, getPool } from '@/db/client';
import { datasetJobs } from '@/db/schema';
import { formatAmount } from '@/lib/format-number';
import { countText } from '@/lib/plural';
import { isDuplicateKey } from './db-errors';
import { recordAction, type Admin } from './admin';
import { BUILTIN_DATASETS, builtinDataset, type BuiltinDataset } from './builtin-datasets';
import { keepAlive, SELF_TEXT, updateJob } from './dataset-jobs';
import { importDataset } from './food-import';
import { HttpError } from './http';

/** Rows written between two progress updates of the job row, at most one a second. */
const PROGRESS_EVERY_MS = 1000;

async function runLoad(id: number, builtin: BuiltinDataset): Promise<void> {
  const stop = keepAlive(id);
  const started = Date.now();
  try {
    // Reading and converting the package holds the event loop for a few seconds (SR28): let the 202 leave first.
    await new Promise((r) => setImmediate(r));
    const { foods, amounts } = builtin.load();
    const total = foods.length + amounts.length;
    await updateJob(id, { phase: 'loading into the database', foodCount: foods.length, amountCount: amounts.length, bytesTotal: total });
    let last = 0;
    // Progress writes go one after another and all land before the last word, never after it.
    let written: Promise<unknown> = Promise.resolve();
    const progress = (rows: number) => {
      if (Date.now() - last < PROGRESS_EVERY_MS && rows < total) return;
      last = Date.now();
      const phase = `loading: ${formatAmount(rows)} of ${formatAmount(total)} rows written`;
      written = written.then(() => updateJob(id, { rowsRead: rows, bytesRead: rows, phase })).catch(() => {});
    };
    try {
      await importDataset(getPool(), builtin.info, foods, amounts, { force: true, progress });
    } finally {
      await written;
    }
    const secs = ((Date.now() - started) / 1000).toFixed(1);
    await updateJob(id, { status: 'applied', activeSlug: null, rowsRead: total, bytesRead: total, phase: `loaded ${countText(foods.length, 'food')} and ${countText(amounts.length, 'nutrient amount')} in ${secs} s` });
  } catch (e) {
    console.error(`dataset job ${id}: reloading ${builtin.info.slug} failed`, e);
    const why = e instanceof Error ? e.message : String(e);
    await updateJob(id, { status: 'failed', activeSlug: null, phase: `not loaded, nothing changed: ${why}`.slice(0, 200) }).catch(() => {});
  } finally {
    stop();
  }
}

/**
 * Starts reloading a built-in dataset and records the action; answers the job's id at once.
 * 404 for a slug that is not built in, 409 while another job loads the same dataset.
 */
export async function startBuiltinLoad(admin: Admin, slug: string): Promise<number> {
  const builtin = builtinDataset(slug);
  if (!builtin) {
    throw new HttpError(404, 'not_found', `No built-in dataset is called "${slug}"; the built-in ones are ${BUILTIN_DATASETS.map((d) => d.info.slug).join(' and ')}.`);
  }
  const { info } = builtin;
  let id: number;
  try {
    const [r] = await getDb()
      .insert(datasetJobs)
      .values({
        kind: 'builtin_load',
        slug: info.slug,
        name: info.name,
        release: info.release,
        publisher: info.publisher,
        licence: info.licence,
        status: 'applying',
        phase: 'reading the package',
        createdBy: admin.id,
        runner: SELF_TEXT,
        heartbeatAt: sql`CURRENT_TIMESTAMP`,
        activeSlug: info.slug,
      })
      .$returningId();
    id = r!.id;
  } catch (e) {
    if (isDuplicateKey(e)) throw new HttpError(409, 'dataset_busy', `Another job is loading ${info.slug} now; wait for it to finish.`);
    throw e;
  }
  await recordAction(admin, 'dataset.reload', info.slug, `${info.release}, from the package (job ${id})`);
  void runLoad(id, builtin);
  return id;
}

