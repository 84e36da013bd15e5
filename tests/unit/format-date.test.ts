import { describe, expect, it } from 'vitest';
import { formatDate, formatInstantDate, formatMonthText, weekdayOf } from '@/lib/format-date';

describe('formatDate', () => {
  it('writes day, short month and year, without the machine locale', () => {
    expect(formatDate('2026-12-02')).toBe('2 Dec 2026');
    expect(formatDate('2027-03-01')).toBe('1 Mar 2027');
  });

  it('puts the weekday first when asked', () => {
    // 2 December 2026 is a Wednesday (Gregorian calendar; `cal 12 2026`)
    expect(formatDate('2026-12-02', { weekday: true })).toBe('Wed 2 Dec 2026');
    // 29 February 2028 is a Tuesday (`cal 2 2028`)
    expect(formatDate('2028-02-29', { weekday: true })).toBe('Tue 29 Feb 2028');
  });

  it('leaves the year off when asked', () => {
    expect(formatDate('2026-07-14', { year: false })).toBe('14 Jul');
  });

  it('refuses a day that does not exist', () => {
    expect(() => formatDate('2026-02-29')).toThrow(RangeError);
    expect(() => formatDate('12/9/2026')).toThrow(RangeError);
  });
});

describe('weekdayOf', () => {
  it('counts weekdays before and after its anchor', () => {
    // 1 January 2024 was a Monday, 31 December 2023 a Sunday, 1 January 2000 a Saturday (`cal`)
    expect(weekdayOf('2024-01-01')).toBe('Mon');
    expect(weekdayOf('2023-12-31')).toBe('Sun');
    expect(weekdayOf('2000-01-01')).toBe('Sat');
  });
});

describe('formatMonthText', () => {
  it('writes a month short or long', () => {
    expect(formatMonthText('2027-03')).toBe('Mar 2027');
    expect(formatMonthText('2027-03', 'long')).toBe('March 2027');
  });
});

describe('formatInstantDate', () => {
  it('takes the day in the zone given, written like every other date', () => {
    expect(formatInstantDate('2026-12-09T23:30:00Z')).toBe('9 Dec 2026');
    // Auckland is UTC+13 in December (daylight time)
    expect(formatInstantDate('2026-12-09T23:30:00Z', 'Pacific/Auckland')).toBe('10 Dec 2026');
  });

  it('refuses text that is not a point in time', () => {
    expect(() => formatInstantDate('soon')).toThrow(RangeError);
  });
});
