/**
 * An administrator's FoodData Central CSV upload, as a job in dataset_jobs. fdc-upload-form.ts
 * streams the request's files into the job's folder on disk; from there each is streamed through
 * papaparse into FdcReader (src/lib/fdc-csv.ts) while the job row shows progress, then the folder
 * is removed. A clean read is kept gzipped in the row with what a new release would change per
 * household; applying it loads it through the one importer (src/server/food-import.ts) in one
 * transaction. The row, not process memory, carries the job, so any app server can answer the
 * page's polling (dataset-jobs.ts).
 */
import { createReadStream } from 'node:fs';
import { Transform } from 'node:stream';
import { StringDecoder } from 'node:string_decoder';
import { gunzipSync, gzipSync } from 'node:zlib';
import { and, eq, inArray } from 'drizzle-orm';
import Papa from 'papaparse';
import { getDb, getPool } from '@/db/client';
import { datasetJobs, datasets, foodNutrients, foods } from '@/db/schema';
import { FDC_FILE_ORDER, FDC_REQUIRED_FILES, FdcReader, type FdcFile, type FdcResult } from '@/lib/fdc-csv';
import type { UploadJobJson, UploadMeta } from '@/lib/dataset-upload';
import { countText } from '@/lib/plural';
import { releaseChanges, type EnergyProtein, type HouseholdFoodGrams } from '@/lib/release-changes';
import { recordAction, type Admin } from './admin';
import { claimLoad, datasetJob, keepAlive, SELF_TEXT, updateJob as update } from './dataset-jobs';
import { importDataset } from './food-import';
import { HttpError } from './http';
import { removeJobFolder } from './upload-files';

const PROGRESS_EVERY_ROWS = 20_000;

type Payload = Pick<FdcResult, 'foods' | 'amounts'>;

/** One uploaded file as it lies in the job's folder. */
export interface UploadedFile {
  path: string;
  bytes: number;
}

/** Counts the bytes going by and decodes them as UTF-8, dropping a byte-order mark papaparse would keep in the first header. */
function countedText(progress: { bytes: number }): Transform {
  const decoder = new StringDecoder('utf8');
  let first = true;
  return new Transform({
    readableObjectMode: true,
    transform(chunk: Buffer, _enc, done) {
      progress.bytes += chunk.length;
      let text = decoder.write(chunk);
      if (first && text.length > 0) {
        first = false;
        text = text.replace(/^\uFEFF/, '');
      }
      done(null, text || undefined);
    },
    flush(done) {
      done(null, decoder.end() || undefined);
    },
  });
}

/** Streams one file's rows from disk into the reader, counting bytes and rows for the job's progress. */
async function readFile(reader: FdcReader, file: FdcFile, upload: UploadedFile, progress: { bytes: number; rows: number; tick: () => Promise<void> }): Promise<void> {
  const headers: string[] = [];
  const parser = Papa.parse(Papa.NODE_STREAM_INPUT, { header: true, skipEmptyLines: true, transformHeader: (h: string) => (headers.push(h.trim()), h.trim()) });
  const source = createReadStream(upload.path);
  source.pipe(countedText(progress)).pipe(parser);
  let started: boolean | null = null;
  let line = 1;
  for await (const row of parser as AsyncIterable<Record<string, string>>) {
    line++;
    started ??= reader.start(file, headers);
    if (!started) break;
    reader.row(file, line, row);
    if (++progress.rows % PROGRESS_EVERY_ROWS === 0) await progress.tick();
  }
  if (started === null) reader.start(file, headers);
  source.destroy();
  parser.destroy();
}

/** Edible grams per household and food code of a dataset (harvests and bought food). */
async function gramsOn(slug: string): Promise<HouseholdFoodGrams[]> {
  // UNION ALL of both entry tables, grouped: raw SQL, the builder has no grouped union.
  const [rows] = await getPool().query(
    `SELECT h.id AS householdId, h.name AS householdName, f.code, SUM(e.edible_grams) AS grams, COUNT(*) AS entries
       FROM (SELECT household_id, food_id, edible_grams FROM harvests WHERE food_id IS NOT NULL
             UNION ALL SELECT household_id, food_id, edible_grams FROM purchases) e
       JOIN foods f ON f.id = e.food_id JOIN datasets d ON d.id = f.dataset_id JOIN households h ON h.id = e.household_id
      WHERE d.slug = ? GROUP BY h.id, h.name, f.code`,
    [slug],
  );
  return (rows as Record<string, unknown>[]).map((r) => ({ householdId: Number(r.householdId), householdName: String(r.householdName), code: String(r.code), edibleGrams: Number(r.grams), entries: Number(r.entries) }));
}

/** What applying `payload` as a new release of `slug` would change; null when no such dataset exists. */
async function previewChanges(slug: string, payload: Payload) {
  const [existing] = await getDb().select({ id: datasets.id }).from(datasets).where(eq(datasets.slug, slug));
  if (!existing) return null;
  const grams = await gramsOn(slug);
  const codes = [...new Set(grams.map((g) => g.code))];
  const before = new Map<string, EnergyProtein>();
  if (codes.length) {
    const rows = await getDb()
      .select({ code: foods.code, key: foodNutrients.nutrientKey, amount: foodNutrients.amount })
      .from(foods)
      .innerJoin(foodNutrients, eq(foodNutrients.foodId, foods.id))
      .where(and(eq(foods.datasetId, existing.id), inArray(foods.code, codes), inArray(foodNutrients.nutrientKey, ['energy_kcal', 'protein_g'])));
    for (const r of rows) before.set(r.code, { ...before.get(r.code), [r.key]: r.amount });
  }
  const after = new Map<string, EnergyProtein>(payload.foods.map((f) => [f.code, {}]));
  for (const a of payload.amounts) if (a.key === 'energy_kcal' || a.key === 'protein_g') after.set(a.code, { ...after.get(a.code), [a.key]: a.amount });
  return releaseChanges(grams, before, after);
}

/** Reads the uploaded files into the job, then removes them (called without waiting: the page polls the row). */
export async function readUpload(jobId: number, files: ReadonlyMap<FdcFile, UploadedFile>): Promise<void> {
  const reader = new FdcReader();
  const progress = { bytes: 0, rows: 0, tick: async () => update(jobId, { rowsRead: progress.rows, bytesRead: progress.bytes }) };
  const stop = keepAlive(jobId);
  try {
    for (const file of FDC_FILE_ORDER) {
      const upload = files.get(file);
      if (!upload) {
        if ((FDC_REQUIRED_FILES as readonly string[]).includes(file)) reader.start(file, []);
        continue;
      }
      await update(jobId, { phase: `reading ${file}`, rowsRead: progress.rows, bytesRead: progress.bytes });
      await readFile(reader, file, upload, progress);
    }
    // Every byte is read: the files go now, before the job says what became of them.
    await removeJobFolder(jobId);
    const result = reader.finish();
    const done = { rowsRead: progress.rows, bytesRead: progress.bytes, format: result.format, foodCount: result.foods.length, amountCount: result.amounts.length };
    if (result.errors.length) {
      const more = result.moreErrors ? `, and ${result.moreErrors} more rows` : '';
      await update(jobId, { ...done, status: 'failed', phase: `refused: ${countText(result.errors.length, 'bad row')}${more}; nothing was loaded`, errors: JSON.stringify(result.errors) });
      return;
    }
    const payload: Payload = { foods: result.foods, amounts: result.amounts };
    await update(jobId, { ...done, phase: 'working out what a new release would change' });
    const [job] = await getDb().select({ slug: datasetJobs.slug }).from(datasetJobs).where(eq(datasetJobs.id, jobId));
    const changes = await previewChanges(job!.slug, payload);
    await update(jobId, { status: 'ready', phase: 'read and checked: waiting for confirmation', preview: JSON.stringify(changes), payload: gzipSync(JSON.stringify(payload)) });
  } catch (e) {
    console.error('dataset upload failed while reading', e);
    await update(jobId, { status: 'failed', phase: `stopped: ${e instanceof Error ? e.message : String(e)}`.slice(0, 200) }).catch(() => {});
  } finally {
    stop();
    await removeJobFolder(jobId).catch((e: unknown) => console.error(`dataset job ${jobId}: could not remove its upload folder`, e));
  }
}

/**
 * Creates the job row for an upload that has arrived, moves its files into the job's own folder
 * (`adopt`) and starts reading them; answers the job's id at once.
 */
export async function startUpload(
  admin: Admin,
  meta: UploadMeta,
  files: ReadonlyMap<FdcFile, UploadedFile>,
  adopt: (id: number) => Promise<ReadonlyMap<FdcFile, UploadedFile>>,
): Promise<number> {
  const bytesTotal = [...files.values()].reduce((s, f) => s + f.bytes, 0);
  const [r] = await getDb()
    .insert(datasetJobs)
    .values({ ...meta, kind: 'fdc_upload', status: 'reading', phase: 'starting', bytesTotal, createdBy: admin.id, runner: SELF_TEXT })
    .$returningId();
  const id = r!.id;
  let moved: ReadonlyMap<FdcFile, UploadedFile>;
  try {
    moved = await adopt(id);
  } catch (e) {
    await update(id, { status: 'failed', phase: 'stopped: the uploaded files could not be kept for reading' }).catch(() => {});
    throw e;
  }
  await recordAction(admin, 'dataset.upload', meta.slug, `${meta.release}: ${[...files.keys()].join(', ')} (${bytesTotal} bytes)`);
  void readUpload(id, moved);
  return id;
}

/**
 * Applies a read and checked upload: claims it (ready → applying, once, and one load per dataset),
 * loads it in one transaction and records the action. Anything but a ready job is 409.
 */
export async function applyUpload(admin: Admin, id: number): Promise<UploadJobJson> {
  const db = getDb();
  const [ready] = await db.select({ slug: datasetJobs.slug }).from(datasetJobs).where(eq(datasetJobs.id, id));
  if (!ready || !(await claimLoad(id, ready.slug, 'ready', 'loading into the database'))) {
    const job = await datasetJob(id);
    throw new HttpError(409, 'not_ready', `This upload is ${job.status}, not ready to apply.`);
  }
  const stop = keepAlive(id);
  const [j] = await db.select().from(datasetJobs).where(eq(datasetJobs.id, id));
  const payload = JSON.parse(gunzipSync(j!.payload!).toString('utf8')) as Payload;
  const info = { slug: j!.slug, name: j!.name, release: j!.release, publisher: j!.publisher, licence: j!.licence, sourceNote: `Uploaded by ${admin.email}: FoodData Central ${j!.format === 'foundation' ? 'Foundation Foods' : 'SR Legacy'} CSV.` };
  const foodsIn = payload.foods.map((f) => ({ code: f.code, name: f.name, originalName: f.name, group: f.group, refusePct: null, rawness: f.rawness, weights: f.weights }));
  let last = 0;
  // Phase writes go one after another and all land before the last word, never after it.
  let written: Promise<unknown> = Promise.resolve();
  const log = (line: string) => {
    if (Date.now() - last < 1000) return;
    last = Date.now();
    written = written.then(() => update(id, { phase: `loading:${line}`.slice(0, 200) })).catch(() => {});
  };
  try {
    await importDataset(getPool(), info, foodsIn, payload.amounts, { force: true, importedBy: admin.id, log }).finally(() => written);
  } catch (e) {
    await update(id, { status: 'failed', activeSlug: null, phase: `not applied, nothing changed: ${e instanceof Error ? e.message : String(e)}`.slice(0, 200), payload: null });
    throw new HttpError(422, 'apply_failed', `The upload could not be loaded; nothing changed. ${e instanceof Error ? e.message : ''}`);
  } finally {
    stop();
  }
  await update(id, { status: 'applied', activeSlug: null, phase: `loaded ${countText(payload.foods.length, 'food')}`, payload: null });
  await recordAction(admin, 'dataset.apply', j!.slug, `${j!.release}: ${payload.foods.length} foods, ${payload.amounts.length} amounts`);
  return datasetJob(id);
}

/** Cancels an upload that is not applied (its payload is dropped). */
export async function cancelUpload(admin: Admin, id: number): Promise<void> {
  await datasetJob(id); // 404 for an unknown id
  const [r] = await getDb().update(datasetJobs).set({ status: 'cancelled', phase: 'cancelled', payload: null }).where(and(eq(datasetJobs.id, id), eq(datasetJobs.kind, 'fdc_upload'), inArray(datasetJobs.status, ['ready', 'failed'])));
  if (r.affectedRows !== 1) throw new HttpError(409, 'not_cancellable', 'Only an upload that is ready or failed can be cancelled.');
  await recordAction(admin, 'dataset.upload_cancel', String(id));
}
