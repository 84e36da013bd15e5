import { describe, expect, it } from 'vitest';
import { shareQuery } from '@/lib/share-query';

describe('shareQuery', () => {
  it('passes a range of whole months through', () => {
    expect(shareQuery.parse({ from: '2026-01', to: '2026-12' })).toEqual({ from: '2026-01', to: '2026-12' });
  });

  it('leaves an empty query for the caller to default', () => {
    expect(shareQuery.parse({})).toEqual({});
  });

  it('reads one end alone as 12 months from or to it', () => {
    expect(shareQuery.parse({ from: '2026-10' })).toEqual({ from: '2026-10', to: '2027-09' });
    expect(shareQuery.parse({ to: '2026-03' })).toEqual({ from: '2025-04', to: '2026-03' });
  });

  it('refuses months that do not exist or are not written YYYY-MM', () => {
    expect(shareQuery.safeParse({ from: '2026-13', to: '2026-12' }).success).toBe(false);
    expect(shareQuery.safeParse({ from: '2026-1', to: '2026-12' }).success).toBe(false);
    expect(shareQuery.safeParse({ from: 'spring', to: '2026-12' }).success).toBe(false);
  });

  it('refuses a range that ends before it starts', () => {
    const r = shareQuery.safeParse({ from: '2026-05', to: '2026-04' });
    expect(r.success).toBe(false);
    expect(r.error?.issues[0]?.path).toEqual(['to']);
  });

  it('allows 10 years (120 months) and refuses one month more', () => {
    expect(shareQuery.safeParse({ from: '2020-01', to: '2029-12' }).success).toBe(true);
    expect(shareQuery.safeParse({ from: '2020-01', to: '2030-01' }).success).toBe(false);
  });
});
