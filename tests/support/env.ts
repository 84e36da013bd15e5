/** Where the integration tests find the built server and the test database (set by `npm test`). */
import { createPool } from '@/db/client';
import { loadDotEnv, testDatabaseUrl } from '@/server/config';

loadDotEnv();

// Not BASE_URL: Vite (and so Vitest) sets that one to '/'.
export const BASE_URL = process.env.TEST_BASE_URL ?? `http://127.0.0.1:${process.env.TEST_PORT ?? '4399'}`;
export const TEST_DB_URL = testDatabaseUrl();

if (!/_test(_[a-z0-9]+)?$/.test(TEST_DB_URL.split('/').pop() ?? '')) {
  // Integration tests write and delete rows: never point them at the demo database.
  throw new Error(`TEST_DATABASE_URL must name a test database (selfsown_test or selfsown_test_<name>) (got ${TEST_DB_URL})`);
}

export function testPool() {
  return createPool(TEST_DB_URL);
}

/**
 * A kept-alive socket the server closes for idleness just as the client reuses it fails the request
 * before it was sent (undici: UND_ERR_SOCKET, "other side closed"); a read is sent again once. Writes
 * are never sent twice here: a test must see what its one request did.
 */
async function fetchOnce(url: string, init: RequestInit): Promise<Response> {
  try {
    return await fetch(url, init);
  } catch (e) {
    const code = (e as { cause?: { code?: string } }).cause?.code;
    if ((init.method ?? 'GET').toUpperCase() !== 'GET' || code !== 'UND_ERR_SOCKET') throw e;
    return fetch(url, init);
  }
}

export async function api(path: string, init: RequestInit = {}): Promise<{ status: number; body: any; headers: Headers }> {
  const res = await fetchOnce(`${BASE_URL}${path}`, { redirect: 'manual', ...init });
  const text = await res.text();
  let body: unknown = text;
  try {
    body = JSON.parse(text);
  } catch {
    /* not JSON */
  }
  return { status: res.status, body, headers: res.headers };
}
