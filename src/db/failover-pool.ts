/**
 * A mysql2 pool over one or more database hosts (DATABASE_URL `mysql://u:p@h1:3306,h2:3306/db`): all
 * connections go to one host, the current one, until it fails; then to the next in the list. On a
 * Galera cluster every node takes writes, so an app server names its nearest node first and the
 * others after it. Away from the first host, a probe in the background (at most every 5 s) asks it
 * `SELECT 1` — which a Galera node refuses until it has caught up — and moves back once it answers.
 *
 * Failing over is safe where nothing was done: a refused connection, or a node that answers "not
 * ready" (WSREP, 1047) before running the statement — those statements are sent to the next host at
 * once. A connection lost mid-statement moves the pool on too, but the error reaches the caller: the
 * statement may have run, and only the client's retry with its Idempotency-Key is safe then.
 *
 * Autocommit statements (`query`, `execute`) are retried after a deadlock by `withWriteRetry`;
 * transactions take a connection with `getConnection()` and are retried whole by the Drizzle client
 * (src/db/client.ts). Implements the part of mysql2's Pool that Drizzle and this code base use.
 */
import mysql from 'mysql2/promise';
import { withWriteRetry } from '@/server/write-retry';

export interface DbHost {
  host: string;
  port: number;
}

/** Errors that say the host, not the statement, is the trouble. */
const HOST_DOWN = new Set(['ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'EHOSTUNREACH', 'EPIPE', 'PROTOCOL_CONNECTION_LOST', 'ER_SERVER_SHUTDOWN']);
/** Refused before anything ran: a node that is not (yet) part of the cluster's primary component. */
const NOT_READY = new Set(['ER_UNKNOWN_COM_ERROR']);

function codeOf(e: unknown): string | undefined {
  for (let cur: unknown = e, i = 0; cur && i < 4; cur = (cur as { cause?: unknown }).cause, i++) {
    const code = (cur as { code?: unknown }).code;
    if (typeof code === 'string') return code;
  }
  return undefined;
}

/** True when `e` says a host is down or not ready. */
export function isHostFailure(e: unknown): boolean {
  const code = codeOf(e);
  return code !== undefined && (HOST_DOWN.has(code) || NOT_READY.has(code));
}

type QueryArgs = Parameters<mysql.Pool['query']>;

export class FailoverPool {
  private readonly pools: mysql.Pool[];
  private current = 0;
  private nextHomeProbe = 0;

  constructor(
    readonly hosts: DbHost[],
    options: mysql.PoolOptions,
  ) {
    if (hosts.length === 0) throw new Error('FailoverPool needs at least one host');
    this.pools = hosts.map((h) => mysql.createPool({ ...options, host: h.host, port: h.port }));
  }

  /** The host connections go to now, e.g. "127.0.0.1:4611". */
  currentHost(): string {
    const h = this.hosts[this.current]!;
    return `${h.host}:${h.port}`;
  }

  /** Moves on from host `index` (when it is still the current one) and says so once. */
  private failed(index: number, e: unknown): void {
    if (this.pools.length === 1 || this.current !== index) return;
    this.current = (index + 1) % this.pools.length;
    console.warn(`selfsown: database host ${this.hostName(index)} failed (${codeOf(e)}); now using ${this.currentHost()}`);
  }

  private hostName(i: number): string {
    return `${this.hosts[i]!.host}:${this.hosts[i]!.port}`;
  }

  /** A connection to the first host, from the current one on, that takes it. */
  async getConnection(): Promise<mysql.PoolConnection> {
    return (await this.connect()).conn;
  }

  /** Back to the first host once it answers again (not awaited: no request waits for the probe). */
  private probeHome(): void {
    if (this.current === 0 || Date.now() < this.nextHomeProbe) return;
    this.nextHomeProbe = Date.now() + 5000;
    void (async () => {
      const conn = await this.pools[0]!.getConnection();
      try {
        await conn.query('SELECT 1');
      } finally {
        conn.release();
      }
      const left = this.currentHost();
      this.current = 0;
      console.warn(`selfsown: database host ${this.currentHost()} answers again; back from ${left}`);
    })().catch(() => undefined);
  }

  private async connect(): Promise<{ conn: mysql.PoolConnection; index: number }> {
    this.probeHome();
    let lastError: unknown;
    for (let tried = 0; tried < this.pools.length; tried++) {
      const index = this.current;
      try {
        return { conn: await this.pools[index]!.getConnection(), index };
      } catch (e) {
        if (!isHostFailure(e)) throw e;
        lastError = e;
        this.failed(index, e);
      }
    }
    throw lastError;
  }

  /** One statement on a pooled connection: a host refusing it is skipped, a deadlock retried. */
  private async onConnection<T>(run: (c: mysql.PoolConnection) => Promise<T>): Promise<T> {
    return withWriteRetry(async () => {
      for (let tried = 0; ; tried++) {
        const { conn, index } = await this.connect();
        try {
          return await run(conn);
        } catch (e) {
          if (!isHostFailure(e)) throw e;
          this.failed(index, e);
          // A node that refused before running anything: the next host may run it.
          if (!NOT_READY.has(codeOf(e)!) || tried + 1 >= this.pools.length) throw e;
        } finally {
          conn.release();
        }
      }
    });
  }

  query(...args: QueryArgs): ReturnType<mysql.Pool['query']> {
    return this.onConnection((c) => (c.query as (...a: QueryArgs) => ReturnType<mysql.Pool['query']>)(...args)) as ReturnType<mysql.Pool['query']>;
  }

  execute(...args: Parameters<mysql.Pool['execute']>): ReturnType<mysql.Pool['execute']> {
    return this.onConnection((c) => (c.execute as (...a: Parameters<mysql.Pool['execute']>) => ReturnType<mysql.Pool['execute']>)(...args)) as ReturnType<mysql.Pool['execute']>;
  }

  async end(): Promise<void> {
    await Promise.all(this.pools.map((p) => p.end()));
  }
}
