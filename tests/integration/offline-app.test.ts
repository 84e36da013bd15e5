/**
 * The installable app as the built server serves it: the web app manifest and its icons, the
 * service worker and the offline page; and the caching rule of household data — `no-store` for every
 * HTTP cache, with the signed-in offline pages and the API lists they read marked X-Selfsown-Offline:
 * keep, the only answers the service worker keeps.
 */
import { describe, expect, it } from 'vitest';
import { OFFLINE_FALLBACK, OFFLINE_KEEP_HEADER, OFFLINE_LISTS, RUNTIME_CACHES } from '@/lib/app-cache';
import { PALETTE } from '@/lib/palette';
import { api } from '../support/env';
import { apiAs, createHousehold, newVerifiedUser } from '../support/users';

describe('the installable app', () => {
  it('serves a manifest with our name, colours and icons, and every icon it names', async () => {
    const r = await api('/manifest.webmanifest');
    expect(r.status).toBe(200);
    const m = typeof r.body === 'string' ? JSON.parse(r.body) : r.body;
    expect(m).toMatchObject({ name: 'Selfsown', start_url: '/', display: 'standalone', background_color: PALETTE['loam-50'], theme_color: PALETTE['sprout-700'] });
    // Installable in Chromium: a 192 px and a 512 px icon (web.dev "What does it take to be installable?"), and one maskable.
    const sizes = m.icons.map((i: { sizes: string }) => i.sizes);
    expect(sizes).toEqual(expect.arrayContaining(['192x192', '512x512']));
    expect(m.icons.some((i: { purpose: string }) => i.purpose === 'maskable')).toBe(true);
    for (const icon of m.icons) {
      const res = await fetch(new URL(icon.src, process.env.TEST_BASE_URL ?? `http://127.0.0.1:${process.env.TEST_PORT ?? '4399'}`));
      expect(res.status, icon.src).toBe(200);
      expect(res.headers.get('content-type'), icon.src).toContain(icon.type);
    }
  });

  it('serves a Workbox service worker that keeps the offline lists and pages and falls back to the offline page', async () => {
    const sw = await api('/sw.js');
    expect(sw.status).toBe(200);
    const text = String(sw.body);
    expect(text).toContain('precacheAndRoute');
    expect(text).toContain(`"${OFFLINE_FALLBACK}"`);
    expect(text).toContain('offline.html');
    for (const name of Object.values(RUNTIME_CACHES)) expect(text).toContain(`cacheName:"${name}"`);
    for (const list of OFFLINE_LISTS) expect(text).toContain(list);
    // The worker keeps only what the server marked (its plugin is written in as text).
    expect(text).toContain(`"${OFFLINE_KEEP_HEADER.toLowerCase()}"`);
    const offline = await api(OFFLINE_FALLBACK);
    expect(offline.status).toBe(200);
    expect(String(offline.body)).toContain('No connection');
  });

  it('links the manifest from every page', async () => {
    const r = await api('/sign-in');
    expect(String(r.body)).toMatch(/<link rel="manifest" href="\/manifest\.webmanifest"\s*\/?>/);
  });
});

describe('caching of household data', () => {
  it('keeps household data out of every HTTP cache and marks only the offline lists and pages for the worker', async () => {
    const owner = await newVerifiedUser();
    const h = await createHousehold(owner.cookie, { name: 'Cache plot' });
    for (const list of OFFLINE_LISTS) {
      const r = await apiAs(owner.cookie, 'GET', `/api/households/${h.id}/${list}${list === 'plantings' ? '?year=2026' : ''}`);
      expect(r.status, list).toBe(200);
      expect(r.headers.get('cache-control'), list).toBe('no-store');
      expect(r.headers.get(OFFLINE_KEEP_HEADER), list).toBe('keep');
    }
    const log = await apiAs(owner.cookie, 'GET', `/households/${h.id}/log`);
    expect(log.status).toBe(200);
    expect(log.headers.get('cache-control')).toBe('no-store');
    expect(log.headers.get(OFFLINE_KEEP_HEADER)).toBe('keep');
    // Everything else is never kept, by the worker either.
    for (const path of [`/api/households/${h.id}/members`, `/api/households/${h.id}/people`, `/api/households/${h.id}`, `/households/${h.id}/share`]) {
      const r = await apiAs(owner.cookie, 'GET', path);
      expect(r.status, path).toBe(200);
      expect(r.headers.get('cache-control'), path).toBe('no-store');
      expect(r.headers.get(OFFLINE_KEEP_HEADER), path).toBeNull();
    }
    // A refusal of a list is not marked for keeping.
    const outsider = await newVerifiedUser();
    const refused = await apiAs(outsider.cookie, 'GET', `/api/households/${h.id}/crops`);
    expect(refused.status).toBe(404);
    expect(refused.headers.get('cache-control')).toBe('no-store');
    expect(refused.headers.get(OFFLINE_KEEP_HEADER)).toBeNull();
  });

  it('sets no caching rule on pages for a signed-out visitor', async () => {
    const r = await api('/sign-in');
    expect(r.status).toBe(200);
    expect(r.headers.get('cache-control')).toBeNull();
  });
});
