/**
 * npm run restore <file>
 *
 * Loads a backup written by `npm run backup` into the configured database (DATABASE_URL; on the
 * private server it is created when missing). Each table of the backup is dropped and written
 * again, so stop the app first. Refuses (exit 2) without a file or for a file that does not exist,
 * and (exit 1, changing nothing) when the database holds tables the backup does not — a database
 * from a newer version: restore into an empty database instead (set DATABASE_URL to a new name).
 */
import { spawn } from 'node:child_process';
import { createReadStream, existsSync, statSync } from 'node:fs';
import { createInterface } from 'node:readline';
import { resolve } from 'node:path';
import mysql from 'mysql2/promise';
import { databaseUrl, loadDotEnv, parseDatabaseUrl } from '@/server/config';
import { clientCall } from './mariadb-client';
import { isMain } from './is-main';
import { ensureProgram } from './system';

const USAGE = 'usage: npm run restore <file>   (a .sql file written by npm run backup)';

/** The tables a dump creates, read from its `CREATE TABLE` lines. */
export async function tablesInDump(file: string): Promise<Set<string>> {
  const tables = new Set<string>();
  const lines = createInterface({ input: createReadStream(file, 'utf8'), crlfDelay: Infinity });
  for await (const line of lines) {
    const m = /^CREATE TABLE `([^`]+)`/.exec(line);
    if (m) tables.add(m[1]!);
  }
  return tables;
}

async function tablesInDatabase(url: string): Promise<string[]> {
  const c = await mysql.createConnection(url);
  try {
    const [rows] = await c.query('SHOW TABLES');
    return (rows as Record<string, string>[]).map((r) => Object.values(r)[0]!);
  } finally {
    await c.end();
  }
}

/** Loads `file` into the database at `url`. */
export async function restore(url: string, file: string): Promise<{ tables: number }> {
  const db = parseDatabaseUrl(url);
  const call = await clientCall(url, db);
  const inDump = await tablesInDump(file);
  if (inDump.size === 0) throw new Error(`${file} holds no tables: is it a backup written by npm run backup?`);
  const extra = (await tablesInDatabase(url)).filter((t) => !inDump.has(t));
  if (extra.length > 0) {
    throw new Error(`database ${db.database} holds tables the backup does not (${extra.join(', ')}); nothing was changed. Restore into an empty database instead.`);
  }
  const child = spawn(ensureProgram('mariadb', 'mariadb-client'), [...call.args, db.database], { env: call.env, stdio: ['pipe', 'inherit', 'pipe'] });
  let stderr = '';
  child.stderr.on('data', (c: Buffer) => (stderr += c.toString()));
  createReadStream(file).pipe(child.stdin);
  const code = await new Promise<number>((done) => child.on('close', (c) => done(c ?? 1)));
  if (code !== 0) throw new Error(`mariadb failed (exit ${code}) while loading ${file}: ${stderr.trim()}`);
  return { tables: inDump.size };
}

async function main(): Promise<number> {
  loadDotEnv();
  const arg = process.argv[2];
  if (!arg || arg.startsWith('-')) {
    console.error(`restore: which backup? ${USAGE}`);
    return 2;
  }
  const file = resolve(arg);
  if (!existsSync(file) || !statSync(file).isFile()) {
    console.error(`restore: there is no file ${file}. ${USAGE}`);
    return 2;
  }
  const url = databaseUrl();
  const { tables } = await restore(url, file);
  console.log(`• restored ${tables} tables from ${file} into ${parseDatabaseUrl(url).database}`);
  return 0;
}

if (isMain(import.meta.url)) {
  main().then(
    (code) => process.exit(code),
    (e: unknown) => {
      console.error(`restore: ${e instanceof Error ? e.message : String(e)}`);
      process.exit(1);
    },
  );
}
