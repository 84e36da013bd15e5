/**
 * The order of the middleware steps (src/middleware.ts), seen from outside: the security headers
 * wrap every answer, the steps' own included, and the origin check answers before the signed-out
 * redirect or anything that writes.
 */
import { describe, expect, it } from 'vitest';
import { api, BASE_URL } from '../support/env';

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
