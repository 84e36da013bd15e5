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

export async function api(path: string, init: RequestInit = {}): Promise<{ status: number; body: any; headers: Headers }> {
  const res = await fetch(`${BASE_URL}${path}`, { redirect: 'manual', ...init });
  const text = await res.text();
  let body: unknown = text;
  try {
    body = JSON.parse(text);
  } catch {
    /* not JSON */
  }
  return { status: res.status, body, headers: res.headers };
}
