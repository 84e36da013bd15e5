/**
 * The stored share answers (src/server/share-cache.ts), looked up in the household gate's own
 * query by a key of the request as asked: what is stored is what is sent; an answer is kept per
 * range asked; the default range follows the household's year start; a client that takes gzip gets
 * the stored copy compressed; and nobody but a member gets one. (Every write that changes an answer is in share-rollup.test.ts.)
 */
import { request, type IncomingHttpHeaders } from 'node:http';
import { gunzipSync } from 'node:zlib';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Pool } from 'mysql2/promise';
import { BASE_URL, testPool } from '../support/env';
import { foodId, logHarvest, makeCrop } from '../support/entries';
import { apiAs, householdWithRoles, type RoleFixture } from '../support/users';

let pool: Pool;
let t: RoleFixture;
let hid: number;

const share = async (query = '', cookie = t.owner.cookie) => apiAs(cookie, 'GET', `/api/households/${hid}/share${query}`);
const stored = async () => {
  const [rows] = await pool.query('SELECT answer_key, context FROM share_cache WHERE household_id = ? ORDER BY answer_key', [hid]);
  return rows as { answer_key: string; context: string }[];
};

beforeAll(async () => {
  pool = testPool();
  t = await householdWithRoles({ name: 'Stored answers', timezone: 'Europe/London' });
  hid = t.household.id;
  const potato = await makeCrop(t.owner.cookie, hid, { name: 'Potato', foodId: await foodId('11352'), category: 'root_tuber' });
  await logHarvest(t.owner.cookie, hid, { cropId: potato.id, date: '2025-07-02', quantity: 3, unit: 'kg', use: 'fresh' });
});

afterAll(async () => {
  await pool.end();
});

/** Waits until the household has `n` stored answers (they are stored just after the answer is sent). */
async function storedCount(n: number): Promise<void> {
  for (let i = 0; i < 50 && (await stored()).length < n; i++) await new Promise((r) => setTimeout(r, 20));
  expect(await stored()).toHaveLength(n);
}

describe('stored share answers', () => {
  it('sends the stored text as it is while nothing it rests on changed', async () => {
    const first = await share('?from=2025-01&to=2025-12');
    expect(first.status).toBe(200);
    await storedCount(1);
    // A marker only the stored row holds: were the answer worked out again, it would not be there.
    // (Its gzip copy dropped, so the marked text is what goes out.)
    await pool.query(`UPDATE share_cache SET body = JSON_SET(body, '$.from', 'stored'), body_gzip = NULL WHERE household_id = ?`, [hid]);
    expect((await share('?from=2025-01&to=2025-12')).body.from).toBe('stored');
    // Another range is another answer; the first stays as stored.
    expect((await share('?from=2025-06&to=2026-05')).body.from).toBe('2025-06');
    await storedCount(2);
    expect((await share('?from=2025-01&to=2025-12')).body.from).toBe('stored');
  });

  it('works the default range out again when the year start moves it', async () => {
    const before = await share();
    expect(before.status).toBe(200);
    ok(await apiAs(t.owner.cookie, 'PATCH', `/api/households/${hid}`, { yearStartMonth: before.body.from.endsWith('-03') ? 9 : 3 }));
    const after = await share();
    expect(after.body.from).not.toBe(before.body.from);
    expect(after.body.from.slice(5)).toBe(before.body.from.endsWith('-03') ? '09' : '03');
  });

  it('answers a non-member 404 and a viewer the stored answer', async () => {
    await share('?from=2025-01&to=2025-12');
    expect((await share('?from=2025-01&to=2025-12', t.outsider.cookie)).status).toBe(404);
    const viewer = await share('?from=2025-01&to=2025-12', t.viewer.cookie);
    expect(viewer.status).toBe(200);
    expect(viewer.body.from).toBe('stored');
  });

  it('sends a stored answer gzip-compressed to a client that accepts gzip, and plain to others', async () => {
    const path = `/api/households/${hid}/share?from=2024-01&to=2024-12`;
    const cold = await rawGet(path, { 'accept-encoding': 'gzip, deflate, br, zstd' });
    // Worked out now: sent plain (compressing would keep the client waiting), then stored both ways.
    expect(cold.status).toBe(200);
    expect(cold.headers['content-encoding']).toBeUndefined();
    expect(cold.headers.vary).toBe('Accept-Encoding');
    const report = JSON.parse(cold.bytes.toString('utf8'));
    for (let i = 0; i < 50; i++) {
      const [rows] = await pool.query('SELECT body_gzip IS NOT NULL AS z FROM share_cache WHERE household_id = ? AND answer_key LIKE ?', [hid, '2024-01|2024-12|%']);
      if ((rows as { z: number }[])[0]?.z === 1) break;
      await new Promise((r) => setTimeout(r, 20));
    }
    const warm = await rawGet(path, { 'accept-encoding': 'gzip, deflate, br, zstd' });
    expect(warm.headers['content-encoding']).toBe('gzip');
    expect(warm.headers.vary).toBe('Accept-Encoding');
    expect(warm.bytes.length).toBeLessThan(cold.bytes.length / 3);
    expect(JSON.parse(gunzipSync(warm.bytes).toString('utf8'))).toEqual(report);
    for (const asked of [undefined, 'identity', 'br, deflate', 'gzip;q=0, *']) {
      const plain = await rawGet(path, asked === undefined ? {} : { 'accept-encoding': asked });
      expect(plain.headers['content-encoding'], String(asked)).toBeUndefined();
      expect(JSON.parse(plain.bytes.toString('utf8'))).toEqual(report);
    }
  });

  it('refuses a bad range with 400 whether or not an answer is stored', async () => {
    expect((await share('?from=2025-13&to=2025-12')).status).toBe(400);
    expect((await share('?from=2025-13&to=2025-12')).status).toBe(400);
  });
});

/** One GET as the owner with exactly these headers, its body as the bytes sent (nothing decoded). */
function rawGet(path: string, headers: Record<string, string>): Promise<{ status: number; headers: IncomingHttpHeaders; bytes: Buffer }> {
  const url = new URL(path, BASE_URL);
  return new Promise((resolve, reject) => {
    const req = request({ host: url.hostname, port: url.port, path: url.pathname + url.search, headers: { cookie: t.owner.cookie, ...headers } }, (res) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => resolve({ status: res.statusCode ?? 0, headers: res.headers, bytes: Buffer.concat(chunks) }));
    });
    req.on('error', reject);
    req.end();
  });
}

function ok(r: { status: number; body: unknown }) {
  expect(r.status, JSON.stringify(r.body)).toBe(200);
}
