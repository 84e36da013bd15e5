import { describe, expect, it } from 'vitest';
import { growingYear, growingYearLabel, lastTwelveMonths } from '@/lib/growing-year';
import { todayIn } from '@/lib/months';

describe('growing year', () => {
  it('is the calendar year when it starts in January', () => {
    expect(growingYear('2026-07', 1)).toEqual({ from: '2026-01', to: '2026-12' });
  });

  it('runs across a year end when it starts later, and a month before the start belongs to the year before', () => {
    expect(growingYear('2026-11', 10)).toEqual({ from: '2026-10', to: '2027-09' });
    expect(growingYear('2026-02', 10)).toEqual({ from: '2025-10', to: '2026-09' });
    expect(growingYear('2026-10', 10).from).toBe('2026-10');
  });

  it('refuses a start month outside 1–12', () => {
    expect(() => growingYear('2026-01', 13)).toThrow(RangeError);
  });

  it('is labelled with both years when it crosses a year end', () => {
    expect(growingYearLabel({ from: '2025-10', to: '2026-09' })).toBe('2025/26');
    expect(growingYearLabel({ from: '2026-01', to: '2026-12' })).toBe('2026');
  });

  it('gives the last 12 months ending with a month', () => {
    expect(lastTwelveMonths('2026-03')).toEqual({ from: '2025-04', to: '2026-03' });
  });

  it('reads today in the household time zone, not in UTC', () => {
    // Pacific/Auckland is UTC+13 in (southern) summer (IANA tz database: NZDT)
    expect(todayIn('Pacific/Auckland', new Date('2026-12-31T12:00:00Z'))).toBe('2027-01-01');
    // America/Los_Angeles is UTC−8 in winter (IANA tz database: PST)
    expect(todayIn('America/Los_Angeles', new Date('2027-01-01T05:00:00Z'))).toBe('2026-12-31');
  });
});
