/**
 * The security headers on the three kinds of answer — a page, an API answer, a static file — and
 * Secure cookies when the public origin is https (a second server started on another port with an
 * https PUBLIC_ORIGIN, as behind a TLS proxy).
 */
import { createHash } from 'node:crypto';
import { resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { outDir } from '@/server/config';
import { startService, stopService, waitForHttp } from '@/cli/processes';
import { api, BASE_URL } from '../support/env';
import { createHousehold, newVerifiedUser, type TestUser } from '../support/users';

let owner: TestUser;
let hid: number;
beforeAll(async () => {
  owner = await newVerifiedUser({ name: 'Header reader' });
  hid = (await createHousehold(owner.cookie, { name: 'Headed plot' })).id;
});

function expectBaseHeaders(h: Headers) {
  expect(h.get('x-content-type-options')).toBe('nosniff');
  expect(h.get('x-frame-options')).toBe('SAMEORIGIN');
  expect(h.get('referrer-policy')).toBe('strict-origin-when-cross-origin');
  expect(h.get('cross-origin-opener-policy')).toBe('same-origin');
  expect(h.get('permissions-policy')).toMatch(/camera=\(\).*geolocation=\(\).*microphone=\(\)/);
}

const directive = (policy: string, name: string) => policy.split(';').map((d) => d.trim()).find((d) => d.split(' ')[0] === name);

describe('security headers', () => {
  it('gives a signed-in page the full policy, allowing exactly its inline scripts, and no-store', async () => {
    const r = await api(`/households/${hid}`, { headers: { cookie: owner.cookie } });
    expect(r.status).toBe(200);
    expectBaseHeaders(r.headers);
    expect(r.headers.get('cache-control')).toBe('no-store');
    const csp = r.headers.get('content-security-policy')!;
    expect(directive(csp, 'default-src')).toBe("default-src 'self'");
    expect(directive(csp, 'object-src')).toBe("object-src 'none'");
    expect(directive(csp, 'frame-ancestors')).toBe("frame-ancestors 'self'");
    expect(directive(csp, 'worker-src')).toBe("worker-src 'self'");
    expect(directive(csp, 'manifest-src')).toBe("manifest-src 'self'");
    expect(directive(csp, 'connect-src')).toBe("connect-src 'self'");
    const scriptSrc = directive(csp, 'script-src')!;
    expect(scriptSrc).not.toContain('unsafe-inline');
    expect(scriptSrc).not.toMatch(/https?:/);
    // Every inline script of the page is allowed by its SHA-256, so islands hydrate.
    const inline = [...(r.body as string).matchAll(/<script(?![^>]*\bsrc=)[^>]*>([\s\S]*?)<\/script>/g)].map((m) => m[1]!);
    expect(inline.length).toBeGreaterThan(0);
    for (const body of inline) expect(scriptSrc).toContain(`'sha256-${createHash('sha256').update(body).digest('base64')}'`);
  });

  it('sends no-store only to signed-in pages', async () => {
    const r = await api('/sign-in');
    expect(r.status).toBe(200);
    expectBaseHeaders(r.headers);
    expect(r.headers.get('cache-control')).toBeNull();
    expect(r.headers.get('content-security-policy')).toContain("script-src 'self' 'sha256-");
  });

  it('gives every API answer no-store and a policy that lets nothing run', async () => {
    for (const [path, cookie] of [[`/api/households/${hid}`, owner.cookie], ['/api/households', ''], [`/api/households/${hid}/exports/harvests.csv`, owner.cookie]] as const) {
      const r = await api(path, { headers: cookie ? { cookie } : {} });
      expect([200, 401]).toContain(r.status);
      expectBaseHeaders(r.headers);
      expect(r.headers.get('cache-control'), path).toBe('no-store');
      expect(r.headers.get('content-security-policy')).toMatch(/^default-src 'none'/);
    }
  });

  it('puts nosniff and the other base headers on static files too', async () => {
    const page = await api('/sign-in');
    const css = /href="(\/_astro\/[^"]+\.css)"/.exec(page.body)?.[1];
    expect(css).toBeDefined();
    for (const path of ['/favicon.svg', css!]) {
      const r = await api(path);
      expect(r.status, path).toBe(200);
      expectBaseHeaders(r.headers);
    }
  });
});

describe('cookies behind an https public origin', () => {
  const port = Number(new URL(BASE_URL).port) + 7;
  const origin = 'https://selfsown.example';
  let server: ReturnType<typeof startService> | undefined;
  beforeAll(async () => {
    server = startService('node', [resolve(outDir(), 'server/entry.mjs')], { ...process.env, PORT: String(port), HOST: '127.0.0.1', PUBLIC_ORIGIN: origin, LETTERS_SCHEDULER: 'off' }, true);
    await waitForHttp(`http://127.0.0.1:${port}/`, 30_000, server);
  });
  afterAll(async () => {
    if (server) await stopService(server);
  });

  it('marks the session and household cookies Secure (the session one __Secure- prefixed)', async () => {
    const signIn = await fetch(`http://127.0.0.1:${port}/api/auth/sign-in/email`, {
      method: 'POST',
      headers: { origin, 'content-type': 'application/json' },
      body: JSON.stringify({ email: owner.email, password: owner.password }),
    });
    expect(signIn.status).toBe(200);
    const session = signIn.headers.getSetCookie().find((c) => c.includes('session_token='))!;
    expect(session).toMatch(/^__Secure-selfsown\.session_token=/);
    expect(session).toMatch(/; Secure/i);
    const cookie = session.split(';')[0]!;
    const page = await fetch(`http://127.0.0.1:${port}/households/${hid}`, { headers: { cookie }, redirect: 'manual' });
    expect(page.status).toBe(200);
    const household = page.headers.getSetCookie().find((c) => c.startsWith('household='));
    expect(household).toMatch(/; Secure/i);
  });
});
