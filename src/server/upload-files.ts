/**
 * The folders an administrator's upload is written to on this host (UPLOAD_DIR): `incoming-<uuid>`
 * while the request streams in, then `job-<id>` once the job row exists, removed when the job has
 * read it, failed or was refused. Leftovers of a process that died are removed when a server starts.
 */
import { randomUUID } from 'node:crypto';
import { mkdir, readdir, rename, rm, stat } from 'node:fs/promises';
import { join } from 'node:path';
import { uploadDir } from './config';

/** An incoming folder older than this belongs to no request still streaming. */
const INCOMING_MAX_AGE_MS = 6 * 60 * 60_000;

export function jobFolder(id: number): string {
  return join(uploadDir(), `job-${id}`);
}

/** A new, empty folder for an upload that is arriving. */
export async function newIncomingFolder(): Promise<string> {
  const dir = join(uploadDir(), `incoming-${randomUUID()}`);
  await mkdir(dir, { recursive: true });
  return dir;
}

/** Moves an arrived upload into its job's folder. */
export async function adoptFolder(incoming: string, id: number): Promise<string> {
  const dir = jobFolder(id);
  await rename(incoming, dir);
  return dir;
}

export async function removeFolder(dir: string): Promise<void> {
  await rm(dir, { recursive: true, force: true });
}

export async function removeJobFolder(id: number): Promise<void> {
  await removeFolder(jobFolder(id));
}

/**
 * Removes the job folders of jobs that are not running here any more and incoming folders no request
 * can still be writing (older than INCOMING_MAX_AGE_MS); answers how many went.
 */
export async function sweepUploadFolders(runningIds: ReadonlySet<number>, now = Date.now()): Promise<number> {
  let names: string[];
  try {
    names = await readdir(uploadDir());
  } catch (e) {
    if ((e as NodeJS.ErrnoException).code === 'ENOENT') return 0;
    throw e;
  }
  let removed = 0;
  for (const name of names) {
    const job = /^job-(\d+)$/.exec(name);
    const path = join(uploadDir(), name);
    const stale = job ? !runningIds.has(Number(job[1])) : name.startsWith('incoming-') && now - (await stat(path)).mtimeMs > INCOMING_MAX_AGE_MS;
    if (stale) {
      await removeFolder(path);
      removed++;
    }
  }
  return removed;
}
