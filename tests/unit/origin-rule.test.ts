import { describe, expect, it } from 'vitest';
import { sameSiteRequest } from '@/lib/origin-rule';

const ORIGIN = 'https://plot.example';

describe('sameSiteRequest (the cross-site request forgery rule)', () => {
  it('lets a request from our own origin through', () => {
    expect(sameSiteRequest({ origin: ORIGIN, fetchSite: 'same-origin', hasCookie: true }, ORIGIN)).toBe(true);
    expect(sameSiteRequest({ origin: ORIGIN, fetchSite: null, hasCookie: true }, ORIGIN)).toBe(true);
  });

  it('refuses another origin, and fetch metadata that says cross-site or same-site', () => {
    expect(sameSiteRequest({ origin: 'https://elsewhere.example', fetchSite: null, hasCookie: true }, ORIGIN)).toBe(false);
    expect(sameSiteRequest({ origin: 'http://plot.example', fetchSite: null, hasCookie: false }, ORIGIN)).toBe(false);
    expect(sameSiteRequest({ origin: ORIGIN, fetchSite: 'cross-site', hasCookie: true }, ORIGIN)).toBe(false);
    expect(sameSiteRequest({ origin: null, fetchSite: 'same-site', hasCookie: true }, ORIGIN)).toBe(false);
  });

  it('refuses a cookie-carrying request without Origin unless Sec-Fetch-Site says same-origin', () => {
    expect(sameSiteRequest({ origin: null, fetchSite: null, hasCookie: true }, ORIGIN)).toBe(false);
    expect(sameSiteRequest({ origin: 'null', fetchSite: null, hasCookie: true }, ORIGIN)).toBe(false);
    expect(sameSiteRequest({ origin: null, fetchSite: 'none', hasCookie: true }, ORIGIN)).toBe(false);
    expect(sameSiteRequest({ origin: null, fetchSite: 'same-origin', hasCookie: true }, ORIGIN)).toBe(true);
  });

  it('lets a request without cookies or Origin through to the route (it acts for nobody)', () => {
    expect(sameSiteRequest({ origin: null, fetchSite: null, hasCookie: false }, ORIGIN)).toBe(true);
  });
});
