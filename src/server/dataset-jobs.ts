/**
 * The dataset jobs the admin pages follow (an FDC upload, a reload of a built-in dataset) as rows of
 * dataset_jobs: this process's runner id, the heartbeat a running job keeps, the one-load-per-dataset
 * claim, the sweep that fails the jobs of a server that stopped (src/lib/job-runner.ts says when),
 * and the rows as the page reads them. Nothing here lives only in memory: any app server can answer.
 */
import { randomUUID } from 'node:crypto';
import { hostname } from 'node:os';
import { and, eq, inArray, sql } from 'drizzle-orm';
import { getDb } from '@/db/client';
import { datasetJobs, type DatasetJob } from '@/db/schema';
import { RUNNING_JOB_STATUSES } from '@/lib/dataset-jobs';
import type { UploadJobJson } from '@/lib/dataset-upload';
import { JOB_HEARTBEAT_MS, runnerText, stuckReason, type JobRunner } from '@/lib/job-runner';
import { isDuplicateKey } from './db-errors';
import { HttpError } from './http';
import { removeJobFolder, sweepUploadFolders } from './upload-files';

/** This server process, as job rows name it. */
export const SELF: JobRunner = { host: hostname(), pid: process.pid, boot: randomUUID().slice(0, 8) };
export const SELF_TEXT = runnerText(SELF);

export async function updateJob(id: number, set: Partial<typeof datasetJobs.$inferInsert>): Promise<void> {
  await getDb().update(datasetJobs).set(set).where(eq(datasetJobs.id, id));
}

/** Marks the job as ours and touches its heartbeat until the returned stop() (the timer never keeps the process alive). */
export function keepAlive(id: number): () => void {
  const beat = () => getDb().update(datasetJobs).set({ heartbeatAt: sql`CURRENT_TIMESTAMP` }).where(and(eq(datasetJobs.id, id), eq(datasetJobs.runner, SELF_TEXT)));
  const timer = setInterval(() => void beat().catch((e: unknown) => console.error(`dataset job ${id}: heartbeat failed`, e)), JOB_HEARTBEAT_MS);
  timer.unref();
  return () => clearInterval(timer);
}

/** Whether a process of this host is alive (signal 0 checks without sending anything). */
function alive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (e) {
    return (e as NodeJS.ErrnoException).code === 'EPERM';
  }
}

/**
 * Fails every running job whose server process stopped, with the reason as its phase, and frees its
 * dataset claim and temporary files. Run when the server starts and whenever jobs are read. Each
 * update names the runner and heartbeat it saw, so a job that moved on meanwhile is left alone.
 */
export async function sweepStuckJobs(now: Date = new Date()): Promise<number> {
  const running = await getDb()
    .select({ id: datasetJobs.id, status: datasetJobs.status, runner: datasetJobs.runner, heartbeatAt: datasetJobs.heartbeatAt, updatedAt: datasetJobs.updatedAt })
    .from(datasetJobs)
    .where(inArray(datasetJobs.status, [...RUNNING_JOB_STATUSES]));
  let failed = 0;
  for (const job of running) {
    const why = stuckReason(job, now, SELF, alive);
    if (!why) continue;
    const [r] = await getDb()
      .update(datasetJobs)
      .set({ status: 'failed', phase: why.slice(0, 200), payload: null, activeSlug: null })
      .where(and(eq(datasetJobs.id, job.id), eq(datasetJobs.status, job.status), sql`${datasetJobs.runner} <=> ${job.runner}`, sql`${datasetJobs.heartbeatAt} <=> ${job.heartbeatAt}`));
    if (r.affectedRows === 1) {
      failed++;
      console.warn(`dataset job ${job.id}: ${why}`);
      await removeJobFolder(job.id);
    }
  }
  return failed;
}

/**
 * When a server starts: fails the jobs a stopped process left running (on this host at once, see
 * src/lib/job-runner.ts) and removes upload folders no running job needs. Logs one line.
 */
export async function sweepAtStart(): Promise<void> {
  const failed = await sweepStuckJobs();
  const running = await getDb().select({ id: datasetJobs.id }).from(datasetJobs).where(inArray(datasetJobs.status, [...RUNNING_JOB_STATUSES]));
  const removed = await sweepUploadFolders(new Set(running.map((r) => r.id)));
  console.log(`dataset jobs: ${failed} stuck job${failed === 1 ? '' : 's'} marked failed, ${removed} upload folder${removed === 1 ? '' : 's'} removed`);
}

/**
 * Claims the dataset for one load (the unique key of active_slug) and marks the job ours: 409 when
 * another job is loading it. `from` is the status the job must have (ready for an upload).
 */
export async function claimLoad(id: number, slug: string, from: DatasetJob['status'], phase: string): Promise<boolean> {
  try {
    const [r] = await getDb()
      .update(datasetJobs)
      .set({ status: 'applying', phase, activeSlug: slug, runner: SELF_TEXT, heartbeatAt: sql`CURRENT_TIMESTAMP` })
      .where(and(eq(datasetJobs.id, id), eq(datasetJobs.status, from)));
    return r.affectedRows === 1;
  } catch (e) {
    if (isDuplicateKey(e)) throw new HttpError(409, 'dataset_busy', `Another job is loading ${slug} now; wait for it to finish.`);
    throw e;
  }
}

const jobColumns = {
  id: datasetJobs.id, kind: datasetJobs.kind, slug: datasetJobs.slug, name: datasetJobs.name, release: datasetJobs.release, publisher: datasetJobs.publisher,
  licence: datasetJobs.licence, format: datasetJobs.format, status: datasetJobs.status, phase: datasetJobs.phase, rowsRead: datasetJobs.rowsRead,
  bytesRead: datasetJobs.bytesRead, bytesTotal: datasetJobs.bytesTotal, foodCount: datasetJobs.foodCount, amountCount: datasetJobs.amountCount,
  errors: datasetJobs.errors, preview: datasetJobs.preview, createdAt: datasetJobs.createdAt,
};
type JobRow = { [K in keyof typeof jobColumns]: DatasetJob[K] };

function jobJson(j: JobRow): UploadJobJson {
  return {
    id: j.id,
    kind: j.kind,
    slug: j.slug,
    name: j.name,
    release: j.release,
    publisher: j.publisher,
    licence: j.licence,
    status: j.status,
    format: j.format,
    phase: j.phase,
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

/** One job as the page polls it (stuck jobs failed first); 404 for an unknown id. */
export async function datasetJob(id: number): Promise<UploadJobJson> {
  await sweepStuckJobs();
  const [j] = await getDb().select(jobColumns).from(datasetJobs).where(eq(datasetJobs.id, id));
  if (!j) throw new HttpError(404, 'not_found', 'No dataset job has that id.');
  return jobJson(j);
}

/** The latest jobs of a kind, newest first (stuck jobs failed first). */
export async function listDatasetJobs(kind: DatasetJob['kind'], limit = 20): Promise<UploadJobJson[]> {
  await sweepStuckJobs();
  const rows = await getDb().select(jobColumns).from(datasetJobs).where(eq(datasetJobs.kind, kind)).orderBy(sql`${datasetJobs.id} DESC`).limit(limit);
  return rows.map(jobJson);
}
