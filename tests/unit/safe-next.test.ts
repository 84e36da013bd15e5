import { describe, expect, it } from 'vitest';
import { DEFAULT_NEXT, safeNext, withNext } from '@/lib/safe-next';

describe('safeNext', () => {
  it('keeps a path on this site with its query and fragment', () => {
    expect(safeNext('/households/3/members?tab=x#top')).toBe('/households/3/members?tab=x#top');
    expect(safeNext('/invite/abc_DEF-123')).toBe('/invite/abc_DEF-123');
  });

  it('falls back for anything that could leave the site', () => {
    for (const bad of ['https://elsewhere.example/', '//elsewhere.example/x', '/\\elsewhere.example', 'javascript:alert(1)', 'households', '/ok\nLocation: x', '/a\\b']) {
      expect(safeNext(bad), bad).toBe(DEFAULT_NEXT);
    }
  });

  it('falls back when nothing is given, or the fallback chosen by the caller', () => {
    expect(safeNext(null)).toBe('/households');
    expect(safeNext('', '/')).toBe('/');
    expect(safeNext('x'.repeat(3000))).toBe(DEFAULT_NEXT);
  });

  it('normalises dot segments so the result stays a plain path', () => {
    expect(safeNext('/a/../households')).toBe('/households');
  });
});

describe('withNext', () => {
  it('adds an encoded next to a page link, or nothing when next is unusable', () => {
    expect(withNext('/sign-in', '/invite/abc')).toBe('/sign-in?next=%2Finvite%2Fabc');
    expect(withNext('/sign-in', 'https://elsewhere.example')).toBe('/sign-in');
    expect(withNext('/sign-up', null)).toBe('/sign-up');
  });
});
