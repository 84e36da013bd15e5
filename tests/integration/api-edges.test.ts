import { beforeAll, describe, expect, it } from 'vitest';
import { api, BASE_URL } from '../support/env';
import { apiAs, createHousehold, newVerifiedUser, type TestUser } from '../support/users';

let owner: TestUser;
let householdId: number;
beforeAll(async () => {
  owner = await newVerifiedUser({ name: 'Edge owner' });
  householdId = (await createHousehold(owner.cookie, { name: 'Edge plot' })).id;
});

function post(path: string, body: string, type: string, extra: Record<string, string> = {}) {
  return fetch(`${BASE_URL}${path}`, { method: 'POST', headers: { cookie: owner.cookie, origin: BASE_URL, 'content-type': type, ...extra }, body });
}

describe('the edges of the API', () => {
  it('sends the security headers on pages and API answers alike', async () => {
    for (const path of ['/foods', '/api/foods?code=11352']) {
      const r = await api(path);
      expect(r.headers.get('x-content-type-options')).toBe('nosniff');
      expect(r.headers.get('content-security-policy')).toContain("frame-ancestors 'self'");
    }
  });

  it('answers an unknown API path with the JSON error shape', async () => {
    const r = await api('/api/no-such-thing');
    expect(r.status).toBe(404);
    expect(r.body.error.code).toBe('not_found');
  });

  it('takes only application/json as JSON, not a type that merely mentions it', async () => {
    const body = JSON.stringify({ name: 'Sly', timezone: 'UTC', units: 'metric' });
    expect((await post('/api/households', body, 'text/plain; x=application/json')).status).toBe(415);
    expect((await post('/api/households', body, 'application/json; charset=utf-8')).status).toBe(201);
  });

  it('refuses a body over the limit with 413', async () => {
    const big = JSON.stringify({ name: 'x'.repeat(1_100_000), timezone: 'UTC' });
    const r = await post('/api/households', big, 'application/json');
    expect(r.status).toBe(413);
  });

  it('names a misspelt field instead of storing the entry without it', async () => {
    const r = await apiAs(owner.cookie, 'POST', `/api/households/${householdId}/harvests`, {
      date: '2026-09-01', foodId: 1, quantity: 1, unit: 'kg', use: 'stored', spreadmonths: 6,
    });
    expect(r.status).toBe(400);
    expect(r.body.error.fields.spreadmonths).toMatch(/Unknown field/);
  });
});
