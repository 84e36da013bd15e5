/**
 * The project's private MariaDB server: data under .data/mariadb, bound to 127.0.0.1 on its own
 * port and socket. Idempotent: `up` after `up`, or after a crash, just works.
 */
import { spawn, spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, rmSync, writeFileSync, openSync } from 'node:fs';
import { resolve } from 'node:path';
import mysql from 'mysql2/promise';
import { pidAlive, serverPid } from './server-pid';
import { ensureProgram, findProgram } from './system';
import type { DbUrlParts } from '@/server/config';

export interface ServerPaths {
  base: string;
  dataDir: string;
  socket: string;
  pidFile: string;
  logFile: string;
  marker: string;
}

/** Where a private server keeps its files: `.data` for the project's, another folder for a test's own (npm test's faults stage). */
export function serverPaths(root = process.cwd(), folder = '.data'): ServerPaths {
  const base = resolve(root, folder);
  return {
    base,
    dataDir: resolve(base, 'mariadb'),
    socket: resolve(base, 'run', 'mariadb.sock'),
    pidFile: resolve(base, 'run', 'mariadb.pid'),
    logFile: resolve(base, 'mariadb.log'),
    marker: resolve(base, 'mariadb', '.selfsown-initialised'),
  };
}

function sleep(ms: number) {
  return new Promise((r) => setTimeout(r, ms));
}

/** The running server's pid, or null when none runs from this data directory (a stale pid file included). */
export function runningPid(p: ServerPaths): number | null {
  return serverPid(p.pidFile, p.dataDir);
}

async function ping(p: ServerPaths): Promise<boolean> {
  try {
    const c = await mysql.createConnection({ socketPath: p.socket, user: 'root' });
    await c.query('SELECT 1');
    await c.end();
    return true;
  } catch {
    return false;
  }
}

/** Installs (as root, from Debian) and initialises the data directory when needed. */
export function ensureInstalled(p: ServerPaths): void {
  ensureProgram('mariadbd', 'mariadb-server');
  const installDb = findProgram('mariadb-install-db') ?? findProgram('mysql_install_db');
  if (!installDb) throw new Error('mariadb-install-db is missing; reinstall the Debian package mariadb-server');
  if (existsSync(p.marker)) return;
  // A data directory without our marker is a half-finished init (crash): start it again.
  if (existsSync(p.dataDir)) rmSync(p.dataDir, { recursive: true, force: true });
  mkdirSync(p.dataDir, { recursive: true });
  console.log(`• initialising a private MariaDB data directory in ${p.dataDir}`);
  const args = ['--no-defaults', `--datadir=${p.dataDir}`, '--auth-root-authentication-method=normal', '--skip-test-db'];
  if (process.getuid?.() === 0) args.push('--user=root');
  const r = spawnSync(installDb, args, { encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`mariadb-install-db failed:\n${r.stdout}\n${r.stderr}`);
  writeFileSync(p.marker, new Date().toISOString() + '\n');
}

/** Starts the private server on `port` unless it already answers. */
export async function startServer(p: ServerPaths, port: number): Promise<void> {
  if (await ping(p)) return;
  const old = runningPid(p);
  if (old) {
    // Starting up, or hung: give it a moment before concluding anything.
    for (let i = 0; i < 100; i++) {
      if (await ping(p)) return;
      await sleep(100);
    }
    throw new Error(`MariaDB (pid ${old}) is running but does not answer on ${p.socket}; see ${p.logFile}`);
  }
  rmSync(p.pidFile, { force: true });
  rmSync(p.socket, { force: true });
  mkdirSync(resolve(p.socket, '..'), { recursive: true });
  const mariadbd = ensureProgram('mariadbd', 'mariadb-server');
  const args = [
    '--no-defaults',
    `--datadir=${p.dataDir}`,
    `--port=${port}`,
    '--bind-address=127.0.0.1',
    `--socket=${p.socket}`,
    `--pid-file=${p.pidFile}`,
    `--log-error=${p.logFile}`,
    '--character-set-server=utf8mb4',
    '--collation-server=utf8mb4_unicode_ci',
    '--skip-name-resolve',
    // Food names have short words ("oil", "raw", "dry"): index them, and index every word.
    '--innodb-ft-min-token-size=2',
    '--innodb-ft-enable-stopword=0',
    '--innodb-buffer-pool-size=256M',
    // Bulk imports stream their rows with LOAD DATA LOCAL INFILE (src/server/bulk-load.ts).
    '--local-infile=ON',
  ];
  if (process.getuid?.() === 0) args.push('--user=root');
  const out = openSync(p.logFile, 'a');
  const child = spawn(mariadbd, args, { detached: true, stdio: ['ignore', out, out] });
  child.unref();
  for (let i = 0; i < 300; i++) {
    if (await ping(p)) return;
    if (child.exitCode !== null) break;
    await sleep(100);
  }
  throw new Error(`MariaDB did not start on port ${port}; see ${p.logFile}`);
}

/** Creates the database and its application user (for TCP logins from 127.0.0.1 and localhost). */
export async function ensureDatabase(p: ServerPaths, db: DbUrlParts): Promise<void> {
  const c = await mysql.createConnection({ socketPath: p.socket, user: 'root' });
  try {
    await c.query(`CREATE DATABASE IF NOT EXISTS \`${db.database}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
    for (const host of ['127.0.0.1', 'localhost']) {
      await c.query('CREATE USER IF NOT EXISTS ?@? IDENTIFIED BY ?', [db.user, host, db.password]);
      await c.query('ALTER USER ?@? IDENTIFIED BY ?', [db.user, host, db.password]);
      await c.query(`GRANT ALL PRIVILEGES ON \`${db.database}\`.* TO ?@?`, [db.user, host]);
    }
  } finally {
    await c.end();
  }
}

/** Drops and re-creates a database (tests only). */
export async function recreateDatabase(p: ServerPaths, db: DbUrlParts): Promise<void> {
  const c = await mysql.createConnection({ socketPath: p.socket, user: 'root' });
  try {
    await c.query(`DROP DATABASE IF EXISTS \`${db.database}\``);
  } finally {
    await c.end();
  }
  await ensureDatabase(p, db);
}

/** Stops the private server and waits for the process to exit. */
export async function stopServer(p: ServerPaths): Promise<boolean> {
  const pid = runningPid(p);
  if (!pid) {
    rmSync(p.pidFile, { force: true });
    return false;
  }
  const admin = findProgram('mariadb-admin') ?? findProgram('mysqladmin');
  if (admin) spawnSync(admin, ['--no-defaults', `--socket=${p.socket}`, '-uroot', 'shutdown'], { stdio: 'ignore' });
  else process.kill(pid, 'SIGTERM');
  for (let i = 0; i < 300 && pidAlive(pid); i++) await sleep(100);
  if (pidAlive(pid)) process.kill(pid, 'SIGKILL');
  return true;
}

/** Kills the server at once (SIGKILL: no shutdown, no flush), as a crash would; waits until it is gone. */
export async function killServer(p: ServerPaths): Promise<number> {
  const pid = runningPid(p);
  if (!pid) throw new Error(`no MariaDB is running from ${p.dataDir}`);
  process.kill(pid, 'SIGKILL');
  for (let i = 0; i < 100 && pidAlive(pid); i++) await sleep(50);
  if (pidAlive(pid)) throw new Error(`MariaDB (pid ${pid}) did not die on SIGKILL`);
  return pid;
}
