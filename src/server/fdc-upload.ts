/**
 * An administrator's FoodData Central CSV upload, as a job in dataset_jobs: the files are streamed
 * through papaparse into FdcReader (src/lib/fdc-csv.ts) while the job row shows progress; a clean
 * read is kept gzipped in the row with what a new release would change per household; applying it
 * loads it through the one importer (src/server/food-import.ts) in one transaction. The row, not
 * process memory, carries the job, so any app server can answer the page's polling.
 */
import { Readable } from 'node:stream';
import { gunzipSync, gzipSync } from 'node:zlib';
import { and, eq, inArray, sql } from 'drizzle-orm';
import Papa from 'papaparse';
import { getDb, getPool } from '@/db/client';
import { datasetJobs, datasets, foodNutrients, foods, type DatasetJob } from '@/db/schema';
import { FDC_FILE_ORDER, FDC_REQUIRED_FILES, FdcReader, type FdcFile, type FdcResult } from '@/lib/fdc-csv';
import type { UploadJobJson, UploadMeta } from '@/lib/dataset-upload';
import { countText } from '@/lib/plural';
import { releaseChanges, type EnergyProtein, type HouseholdFoodGrams } from '@/lib/release-changes';
import { recordAction, type Admin } from './admin';
import { importDataset } from './food-import';
import { HttpError } from './http';

/** A job still "reading" after this long was left by a server that stopped. */
const STALE_MS = 10 * 60_000;
const PROGRESS_EVERY_ROWS = 20_000;

type Payload = Pick<FdcResult, 'foods' | 'amounts'>;

async function update(id: number, set: Partial<typeof datasetJobs.$inferInsert>): Promise<void> {
  await getDb().update(datasetJobs).set(set).where(eq(datasetJobs.id, id));
}

/** Streams one file's rows into the reader, counting bytes and rows for the job's progress. */
async function readFile(reader: FdcReader, file: FdcFile, blob: Blob, progress: { bytes: number; rows: number; tick: () => Promise<void> }): Promise<void> {
  const headers: string[] = [];
  const parser = Papa.parse(Papa.NODE_STREAM_INPUT, { header: true, skipEmptyLines: true, transformHeader: (h: string) => (headers.push(h.trim()), h.trim()) });
  // Count bytes before decoding; TextDecoderStream drops a UTF-8 byte-order mark.
  const counted = blob.stream().pipeThrough(new TransformStream<Uint8Array, Uint8Array>({ transform(c, ctl) { progress.bytes += c.byteLength; ctl.enqueue(c); } }));
  Readable.fromWeb(counted.pipeThrough(new TextDecoderStream() as unknown as TransformStream<Uint8Array, string>) as never).pipe(parser);
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

/** Reads the uploaded files into the job (called without waiting: the page polls the row). */
export async function readUpload(jobId: number, files: ReadonlyMap<FdcFile, Blob>): Promise<void> {
  const reader = new FdcReader();
  const progress = { bytes: 0, rows: 0, tick: async () => update(jobId, { rowsRead: progress.rows, bytesRead: progress.bytes }) };
  try {
    for (const file of FDC_FILE_ORDER) {
      const blob = files.get(file);
      if (!blob) {
        if ((FDC_REQUIRED_FILES as readonly string[]).includes(file)) reader.start(file, []);
        continue;
      }
      await update(jobId, { phase: `reading ${file}`, rowsRead: progress.rows, bytesRead: progress.bytes });
      await readFile(reader, file, blob, progress);
    }
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
  }
}

/** Creates the job row for an upload and starts reading it; answers the job's id at once. */
export async function startUpload(admin: Admin, meta: UploadMeta, files: ReadonlyMap<FdcFile, Blob>): Promise<number> {
  const bytesTotal = [...files.values()].reduce((s, b) => s + b.size, 0);
  const [r] = await getDb().insert(datasetJobs).values({ ...meta, status: 'reading', phase: 'starting', bytesTotal, createdBy: admin.id }).$returningId();
  await recordAction(admin, 'dataset.upload', meta.slug, `${meta.release}: ${[...files.keys()].join(', ')} (${bytesTotal} bytes)`);
  void readUpload(r!.id, files);
  return r!.id;
}

function jobJson(j: DatasetJob, now = Date.now()): UploadJobJson {
  const stale = j.status === 'reading' && now - j.updatedAt.getTime() > STALE_MS;
  return {
    id: j.id,
    slug: j.slug,
    name: j.name,
    release: j.release,
    publisher: j.publisher,
    licence: j.licence,
    status: stale ? 'failed' : j.status,
    format: j.format,
    phase: stale ? 'stopped: the server reading it went away; upload again' : j.phase,
    rowsRead: j.rowsRead,
    bytesRead: j.bytesRead,
    bytesTotal: j.bytesTotal,
    foodCount: j.foodCount,
    amountCount: j.amountCount,
    errors: j.errors ? (JSON.parse(j.errors) as UploadJobJson['errors']) : [],
    changes: j.preview ? (JSON.parse(j.preview) as UploadJobJson['changes']) : null,
    createdAt: j.createdAt.toISOString(),
  };
}

const jobColumns = {
  id: datasetJobs.id, slug: datasetJobs.slug, name: datasetJobs.name, release: datasetJobs.release, publisher: datasetJobs.publisher,
  licence: datasetJobs.licence, format: datasetJobs.format, status: datasetJobs.status, phase: datasetJobs.phase, rowsRead: datasetJobs.rowsRead,
  bytesRead: datasetJobs.bytesRead, bytesTotal: datasetJobs.bytesTotal, foodCount: datasetJobs.foodCount, amountCount: datasetJobs.amountCount,
  errors: datasetJobs.errors, preview: datasetJobs.preview, createdBy: datasetJobs.createdBy, createdAt: datasetJobs.createdAt, updatedAt: datasetJobs.updatedAt,
};

export async function uploadJob(id: number): Promise<UploadJobJson> {
  const [j] = await getDb().select(jobColumns).from(datasetJobs).where(eq(datasetJobs.id, id));
  if (!j) throw new HttpError(404, 'not_found', 'No upload has that id.');
  return jobJson({ ...j, payload: null });
}

/** The latest uploads, newest first. */
export async function listUploads(limit = 20): Promise<UploadJobJson[]> {
  const rows = await getDb().select(jobColumns).from(datasetJobs).orderBy(sql`${datasetJobs.id} DESC`).limit(limit);
  return rows.map((j) => jobJson({ ...j, payload: null }));
}

/**
 * Applies a read and checked upload: claims it (ready → applying, once), loads it in one transaction
 * and records the action. Anything but a ready job is 409.
 */
export async function applyUpload(admin: Admin, id: number): Promise<UploadJobJson> {
  const db = getDb();
  const [claim] = await db.update(datasetJobs).set({ status: 'applying', phase: 'loading into the database' }).where(and(eq(datasetJobs.id, id), eq(datasetJobs.status, 'ready')));
  if (claim.affectedRows !== 1) {
    const job = await uploadJob(id);
    throw new HttpError(409, 'not_ready', `This upload is ${job.status}, not ready to apply.`);
  }
  const [j] = await db.select().from(datasetJobs).where(eq(datasetJobs.id, id));
  const payload = JSON.parse(gunzipSync(j!.payload!).toString('utf8')) as Payload;
  const info = { slug: j!.slug, name: j!.name, release: j!.release, publisher: j!.publisher, licence: j!.licence, sourceNote: `Uploaded by ${admin.email}: FoodData Central ${j!.format === 'foundation' ? 'Foundation Foods' : 'SR Legacy'} CSV.` };
  const foodsIn = payload.foods.map((f) => ({ code: f.code, name: f.name, originalName: f.name, group: f.group, refusePct: null, rawness: f.rawness, weights: f.weights }));
  let last = 0;
  const log = (line: string) => {
    if (Date.now() - last < 1000) return;
    last = Date.now();
    void update(id, { phase: `loading:${line}`.slice(0, 200) });
  };
  try {
    await importDataset(getPool(), info, foodsIn, payload.amounts, { force: true, importedBy: admin.id, log });
  } catch (e) {
    await update(id, { status: 'failed', phase: `not applied, nothing changed: ${e instanceof Error ? e.message : String(e)}`.slice(0, 200), payload: null });
    throw new HttpError(422, 'apply_failed', `The upload could not be loaded; nothing changed. ${e instanceof Error ? e.message : ''}`);
  }
  await update(id, { status: 'applied', phase: `loaded ${countText(payload.foods.length, 'food')}`, payload: null });
  await recordAction(admin, 'dataset.apply', j!.slug, `${j!.release}: ${payload.foods.length} foods, ${payload.amounts.length} amounts`);
  return uploadJob(id);
}

/** Cancels an upload that is not applied (its payload is dropped). */
export async function cancelUpload(admin: Admin, id: number): Promise<void> {
  await uploadJob(id); // 404 for an unknown id
  const [r] = await getDb().update(datasetJobs).set({ status: 'cancelled', phase: 'cancelled', payload: null }).where(and(eq(datasetJobs.id, id), inArray(datasetJobs.status, ['ready', 'failed'])));
  if (r.affectedRows !== 1) throw new HttpError(409, 'not_cancellable', 'Only an upload that is ready or failed can be cancelled.');
  await recordAction(admin, 'dataset.upload_cancel', String(id));
}

