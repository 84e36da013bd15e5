/**
 * "The database is down" told apart from every other error, with real driver errors: mysql2
 * connecting to a port nothing listens on, a closed pool, the same under Drizzle's wrapper — and the
 * 503 answer they become (src/server/db-errors.ts, src/server/http.ts).
 */
import mysql from 'mysql2/promise';
import { drizzle } from 'drizzle-orm/mysql2';
import { sql } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { databaseErrorAnswer, isDatabaseUnavailable } from '@/server/db-errors';
import { toResponse } from '@/server/http';
import { unavailablePageHtml } from '@/lib/unavailable-page';
import { freeLoopbackPort } from '@/cli/processes';

async function caught(fn: () => Promise<unknown>): Promise<unknown> {
  try {
    await fn();
  } catch (e) {
    return e;
  }
  throw new Error('expected a failure');
}

describe('a database that cannot be reached', () => {
  it('is recognised from a refused connect, a closed pool and under Drizzle’s wrapper', async () => {
    const port = await freeLoopbackPort();
    const refused = await caught(() => mysql.createConnection({ host: '127.0.0.1', port, user: 'x', connectTimeout: 2_000 }));
    expect((refused as { code: string }).code).toBe('ECONNREFUSED');
    expect(isDatabaseUnavailable(refused)).toBe(true);

    const pool = mysql.createPool({ host: '127.0.0.1', port, user: 'x', connectTimeout: 2_000 });
    const viaDrizzle = await caught(() => drizzle(pool).execute(sql`SELECT 1`));
    // Drizzle wraps the driver's error: the code is only on its cause.
    expect((viaDrizzle as { code?: string }).code).toBeUndefined();
    expect((viaDrizzle as { cause?: { code?: string } }).cause?.code).toBe('ECONNREFUSED');
    expect(isDatabaseUnavailable(viaDrizzle)).toBe(true);
    await pool.end();
    const closed = await caught(() => pool.query('SELECT 1'));
    expect((closed as Error).message).toMatch(/Pool is closed/);
    expect(isDatabaseUnavailable(closed)).toBe(true);
  });

  it('is not claimed for query errors, or for socket codes the driver did not mark fatal', () => {
    const dup = Object.assign(new Error('Duplicate entry'), { code: 'ER_DUP_ENTRY', errno: 1062 });
    expect(isDatabaseUnavailable(dup)).toBe(false);
    // A mail server's timeout carries the same code but is not the database's.
    expect(isDatabaseUnavailable(Object.assign(new Error('Greeting never received'), { code: 'ETIMEDOUT' }))).toBe(false);
    expect(isDatabaseUnavailable(new Error('Something else'))).toBe(false);
    expect(isDatabaseUnavailable(Object.assign(new Error('shutdown'), { code: 'ER_SERVER_SHUTDOWN', errno: 1053 }))).toBe(true);
  });

  it('answers 503 database_unavailable with Retry-After, not 500', async () => {
    const lost = Object.assign(new Error('Connection lost: The server closed the connection.'), { code: 'PROTOCOL_CONNECTION_LOST', fatal: true });
    const wrapped = Object.assign(new Error('Failed query'), { cause: lost });
    expect(databaseErrorAnswer(wrapped)?.status).toBe(503);
    const r = toResponse(wrapped);
    expect(r.status).toBe(503);
    expect(r.headers.get('retry-after')).toBe('5');
    const body = (await r.json()) as { error: { code: string; message: string } };
    expect(body.error.code).toBe('database_unavailable');
    expect(body.error.message).toMatch(/try again in a few seconds/);
  });

  it('shows browsers a plain page that runs no script and names the wait', () => {
    const html = unavailablePageHtml(5);
    expect(html).toContain('Back in a moment');
    expect(html).toContain('about 5 seconds');
    expect(html).not.toMatch(/<script/i);
  });
});
