/**
 * What the cluster tests share: the two app servers (CLUSTER_APP_URLS) behind one public origin
 * (PUBLIC_ORIGIN, server A's address standing in for the proxy's), their logs, and the Galera
 * nodes (CLUSTER_LAYOUT), all set by src/cli/test-cluster.ts.
 */
import { readFileSync } from 'node:fs';
import mysql from 'mysql2/promise';
import type { GaleraCluster, GaleraNode } from '@/cli/galera';
import { parseDatabaseUrl } from '@/server/config';
import { requestAt, type LoopbackAnswer } from '../support/loopback';

function required(name: string): string {
  const v = process.env[name];
  if (!v) throw new Error(`${name} is not set: run these tests with npm run test:cluster`);
  return v;
}

export const SERVERS = required('CLUSTER_APP_URLS').split(',');
export const LOGS = required('CLUSTER_APP_LOGS').split(',');
export const CLUSTER = JSON.parse(required('CLUSTER_LAYOUT')) as GaleraCluster;
export const ORIGIN = required('PUBLIC_ORIGIN');

export type Answer = LoopbackAnswer;

/**
 * One JSON request to app server `server` (0 = A, 1 = B), from `localAddress` when given (the
 * sign-in limiter counts per address). A state change names the public origin, as a browser does.
 * A network failure rejects, like fetch.
 */
export function call(server: number, cookie: string, method: string, path: string, body?: unknown, headers: Record<string, string> = {}, localAddress?: string): Promise<Answer> {
  return requestAt(SERVERS[server]!, ORIGIN, localAddress, method, path, body, { ...(cookie ? { cookie } : {}), ...headers });
}

/** Lines of server `server`'s log matching `pattern`. */
export function logLines(server: number, pattern: RegExp): string[] {
  return readFileSync(LOGS[server]!, 'utf8')
    .split('\n')
    .filter((l) => pattern.test(l));
}

/** Write retries (deadlock or certification conflict) both servers have logged so far. */
export function retriesLogged(): number {
  return logLines(0, /write retried/).length + logLines(1, /write retried/).length;
}

/** A connection as the app's user to one node only (no failover): for reading what that node holds. */
export function nodeConnection(node: GaleraNode): Promise<mysql.Connection> {
  const db = parseDatabaseUrl(required('TEST_DATABASE_URL'));
  return mysql.createConnection({ host: '127.0.0.1', port: node.port, user: db.user, password: db.password, database: db.database });
}

/** Rows of one query on one node. */
export async function onNode<T>(node: GaleraNode, sql: string, values: unknown[] = []): Promise<T[]> {
  const c = await nodeConnection(node);
  try {
    const [rows] = await c.query(sql, values);
    return rows as T[];
  } finally {
    await c.end();
  }
}

/** Yesterday (UTC) as YYYY-MM-DD: a date every zone has reached, so no entry is "in the future". */
export function yesterday(): string {
  return new Date(Date.now() - 86_400_000).toISOString().slice(0, 10);
}

/** The 10th of last month (UTC) as YYYY-MM-DD, and that month as 'YYYY-MM'. */
export function lastMonth(): { day: string; month: string } {
  const d = new Date();
  const first = new Date(Date.UTC(d.getUTCFullYear(), d.getUTCMonth() - 1, 10));
  const day = first.toISOString().slice(0, 10);
  return { day, month: day.slice(0, 7) };
}

export const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));
