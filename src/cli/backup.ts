/**
 * npm run backup [-- --dir DIR]
 *
 * Writes the whole app database (DATABASE_URL: every table, the reference foods and the migration
 * record included) with mariadb-dump to `.data/backups/selfsown-<YYYYMMDD-HHMMSS>.sql` (or DIR),
 * as one consistent snapshot (--single-transaction: the app may keep running). Prints the file's
 * path; `npm run restore <file>` loads it back. The file holds people's accounts and households'
 * records: keep it as private as the database.
 */
import { spawn } from 'node:child_process';
import { createWriteStream, mkdirSync, rmSync, statSync } from 'node:fs';
import { resolve } from 'node:path';
import { parseArgs } from 'node:util';
import { databaseUrl, loadDotEnv, parseDatabaseUrl } from '@/server/config';
import { clientCall } from './mariadb-client';
import { isMain } from './is-main';
import { ensureProgram } from './system';

/** The file name for a backup taken at `when` (UTC). Example: `backupFileName(new Date('2026-12-03T07:15:09Z'))` → 'selfsown-20261203-071509.sql' */
export function backupFileName(when: Date): string {
  const s = when.toISOString().replace(/[-:]/g, '').replace('T', '-').slice(0, 15);
  return `selfsown-${s}.sql`;
}

/** Dumps the database at `url` into `dir`; resolves with the file's path. */
export async function backup(url: string, dir: string, when = new Date()): Promise<string> {
  const db = parseDatabaseUrl(url);
  const call = await clientCall(url, db);
  const dump = ensureProgram('mariadb-dump', 'mariadb-client');
  mkdirSync(dir, { recursive: true });
  const file = resolve(dir, backupFileName(when));
  const args = [...call.args, '--single-transaction', '--quick', '--routines', '--triggers', '--hex-blob', '--add-drop-table', db.database];
  const out = createWriteStream(file, { mode: 0o600 });
  const child = spawn(dump, args, { env: call.env, stdio: ['ignore', 'pipe', 'pipe'] });
  let stderr = '';
  child.stderr.on('data', (c: Buffer) => (stderr += c.toString()));
  child.stdout.pipe(out);
  const code = await new Promise<number>((done) => child.on('close', (c) => done(c ?? 1)));
  await new Promise<void>((done) => out.end(done));
  if (code !== 0) {
    rmSync(file, { force: true });
    throw new Error(`mariadb-dump failed (exit ${code}): ${stderr.trim()}`);
  }
  return file;
}

async function main(): Promise<void> {
  loadDotEnv();
  const { values } = parseArgs({ options: { dir: { type: 'string' } } });
  const dir = resolve(values.dir ?? '.data/backups');
  const file = await backup(databaseUrl(), dir);
  console.log(`• backup of ${parseDatabaseUrl(databaseUrl()).database} written to ${file} (${(statSync(file).size / 1e6).toFixed(1)} MB)`);
}

if (isMain(import.meta.url)) {
  main().catch((e: unknown) => {
    console.error(`backup: ${e instanceof Error ? e.message : String(e)}`);
    process.exit(1);
  });
}
