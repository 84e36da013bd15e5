/**
 * The order of the middleware steps (src/middleware.ts), seen from outside: the security headers
 * wrap every answer, the steps' own included, and the origin check answers before the signed-out
 * redirect or anything that writes.
 */
import { describe, expect, it } from 'vitest';
import { api, BASE_URL } from '../support/env';
import { apiAs, newVerifiedUser } from '../support/users';

function expectSecurityHeaders(headers: Headers) {
  expect(headers.get('x-content-type-options')).toBe('nosniff');
  expect(headers.get('x-frame-options')).toBe('SAMEORIGIN');
  expect(headers.get('content-security-policy')).toContain("frame-ancestors 'self'");
  expect(headers.get('referrer-policy')).toBe('strict-origin-when-cross-origin');
}

describe('the middleware steps', () => {
  it('puts the security headers on the redirect to sign-in', async () => {
    const r = await api('/households');
    expect(r.status).toBe(303);
    expect(r.headers.get('location')).toBe('/sign-in?next=%2Fhouseholds');
    expectSecurityHeaders(r.headers);
  });

  it('puts the security headers on a refused cross-site request', async () => {
    const r = await api('/api/households', {
      method: 'POST',
      headers: { origin: 'https://elsewhere.example', 'content-type': 'application/json' },
      body: JSON.stringify({ name: 'Planted by a stranger', timezone: 'UTC' }),
    });
    expect(r.status).toBe(403);
    expect(r.body.error.code).toBe('bad_origin');
    expectSecurityHeaders(r.headers);
  });

  it('refuses a cross-site form post to a private page before sending the visitor to sign in', async () => {
    const r = await api('/households', { method: 'POST', headers: { origin: 'https://elsewhere.example' }, body: 'x=1' });
    expect(r.status).toBe(403);
    expect(r.headers.get('content-type')).toContain('text/plain');
    expect(r.body).toBe('Cross-site form submissions are refused.');
  });

  it('lets a same-origin signed-out post to a private page through the origin check to the sign-in redirect', async () => {
    const r = await api('/households', { method: 'POST', headers: { origin: BASE_URL }, body: 'x=1' });
    expect(r.status).toBe(303);
    expect(r.headers.get('location')).toBe('/sign-in?next=%2Fhouseholds');
  });
});

describe('state changes that carry a session cookie but no Origin', () => {
  it('refuses them, even with a foreign or our own Referer; Sec-Fetch-Site: same-origin lets them through', async () => {
    const u = await newVerifiedUser({ name: 'No-origin owner' });
    const body = JSON.stringify({ name: 'Planted without an origin', timezone: 'UTC' });
    const send = (headers: Record<string, string>) =>
      api('/api/households', { method: 'POST', headers: { cookie: u.cookie, 'content-type': 'application/json', ...headers }, body });

    const bare = await send({});
    expect(bare.status).toBe(403);
    expect(bare.body.error.code).toBe('bad_origin');
    expect((await send({ referer: 'https://elsewhere.example/page' })).status).toBe(403);
    expect((await send({ referer: `${BASE_URL}/households` })).status).toBe(403);
    expect((await send({ origin: 'null' })).status).toBe(403);
    expect((await send({ 'sec-fetch-site': 'cross-site' })).status).toBe(403);
    expect((await apiAs(u.cookie, 'GET', '/api/households')).body.households).toEqual([]);

    const sameOrigin = await send({ 'sec-fetch-site': 'same-origin' });
    expect(sameOrigin.status).toBe(201);
    // A page form post without Origin is refused the same way (plain text, not JSON).
    const form = await api('/households', { method: 'POST', headers: { cookie: u.cookie }, body: 'x=1' });
    expect(form.status).toBe(403);
    expect(form.body).toBe('Cross-site form submissions are refused.');
  });

  it('keeps the token-only unsubscribe open to mail programs without Origin', async () => {
    const r = await api('/api/letters/unsubscribe?t=not-a-token', { method: 'POST', headers: { cookie: 'selfsown.session_token=x' } });
    expect(r.status).toBe(400);
    expect(r.body.error.code).toBe('invalid_token');
  });
});
