/**
 * What the faults tests break and mend: the stage's private MariaDB (src/cli/test-faults.ts starts
 * it; these kill it with SIGKILL and start it again on the same data) and the built app server on
 * TEST_BASE_URL (started, stopped, or killed outright). Never the shared MariaDB on 3307.
 */
import { resolve } from 'node:path';
import type { ChildProcess } from 'node:child_process';
import mysql from 'mysql2/promise';
import { killServer, serverPaths, startServer } from '@/cli/mariadb';
import { startService, stopService, waitForHttp } from '@/cli/processes';
import { childEnv, outDir, parseDatabaseUrl } from '@/server/config';

const folder = process.env.FAULTS_DB_FOLDER;
const port = Number(process.env.FAULTS_DB_PORT);
if (!folder || !port) throw new Error('The faults tests run in npm test\'s faults stage (TEST_STAGES=faults), which starts their private MariaDB.');

const paths = serverPaths(process.cwd(), folder);
export const APP_BASE = process.env.TEST_BASE_URL!;
const databaseUrl = process.env.TEST_DATABASE_URL!;
if (parseDatabaseUrl(databaseUrl).port !== port) throw new Error(`TEST_DATABASE_URL must point at the private server on ${port}`);

/** The private MariaDB: kill it (a crash), start it again, ask it as root over its socket. */
export const privateDb = {
  kill: () => killServer(paths),
  start: () => startServer(paths, port),
  async query<T>(sql: string, values: unknown[] = []): Promise<T> {
    const c = await mysql.createConnection({ socketPath: paths.socket, user: 'root', database: parseDatabaseUrl(databaseUrl).database });
    try {
      const [rows] = await c.query(sql, values);
      return rows as T;
    } finally {
      await c.end();
    }
  },
  /** A root connection kept open (to watch a transaction while it runs). */
  connect: () => mysql.createConnection({ socketPath: paths.socket, user: 'root', database: parseDatabaseUrl(databaseUrl).database }),
};

export interface AppServer {
  child: ChildProcess;
  /** SIGTERM to its process group, waiting for it to exit. */
  stop(): Promise<void>;
  /** SIGKILL, as a crash or a pulled plug would: no answer finished, nothing cleaned up. */
  kill(): Promise<void>;
}

/** Starts the built app server on TEST_BASE_URL's port against the private database and waits until it answers. */
export async function startApp(): Promise<AppServer> {
  const url = new URL(APP_BASE);
  const env = childEnv({ DATABASE_URL: databaseUrl, HOST: '127.0.0.1', PORT: url.port, PUBLIC_ORIGIN: APP_BASE });
  const child = startService('node', [resolve(outDir(), 'server/entry.mjs')], env, true);
  const exited = new Promise<void>((r) => child.once('exit', () => r()));
  const app: AppServer = {
    child,
    stop: () => stopService(child),
    async kill() {
      if (child.exitCode !== null || child.signalCode !== null) return;
      process.kill(-child.pid!, 'SIGKILL');
      await exited;
    },
  };
  try {
    await waitForHttp(`${APP_BASE}/api/health`, 30_000, child);
  } catch (e) {
    await app.stop();
    throw e;
  }
  return app;
}

/** Milliseconds `fn` took, with its result. */
export async function timed<T>(fn: () => Promise<T>): Promise<{ ms: number; value: T }> {
  const t0 = performance.now();
  const value = await fn();
  return { ms: performance.now() - t0, value };
}
