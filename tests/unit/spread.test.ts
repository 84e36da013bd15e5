import { describe, expect, it } from 'vitest';
import { fractionEatenIn } from '@/lib/allocate';
import { spreadByDay } from '@/lib/spread';

const days = (date: string, n: number, total: number) => spreadByDay(date, n).map((p) => Math.round(p.fraction * total * 1e9) / 1e9);

describe('spreading a lot by day', () => {
  it('puts one day of a squash lot stored on 30 November into November, not a quarter', () => {
    // 30 Nov 2026 + 3 months = 28 Feb 2027 (date-fns addMonths: the last day of a shorter month); 1 + 31 + 31 + 27 = 90 days (Gregorian calendar)
    const parts = spreadByDay('2026-11-30', 3);
    expect(parts.map((p) => p.offset)).toEqual([0, 1, 2, 3]);
    expect(parts[0]!.fraction).toBeCloseTo(1 / 90, 12);
    expect(days('2026-11-30', 3, 90)).toEqual([1, 31, 31, 27]);
  });

  it('ends a lot of 31 December over two months on the last day of February, in a leap year too', () => {
    // 31 Dec 2026 + 2 months = 28 Feb 2027 (date-fns addMonths): 1 + 31 + 27 = 59 days
    expect(days('2026-12-31', 2, 59)).toEqual([1, 31, 27]);
    // 31 Dec 2027 + 2 months = 29 Feb 2028 (2028 is a Gregorian leap year): 1 + 31 + 28 = 60 days
    expect(days('2027-12-31', 2, 60)).toEqual([1, 31, 28]);
  });

  it('gives whole calendar months in proportion to their days when a lot starts on the 1st', () => {
    // 1 Jan – 31 Mar 2026: 31 + 28 + 31 = 90 days (Gregorian calendar)
    expect(days('2026-01-01', 3, 90)).toEqual([31, 28, 31]);
  });

  it('adds up to the whole lot', () => {
    for (const [date, n] of [['2026-11-30', 3], ['2025-10-10', 6], ['2026-02-28', 12]] as const) {
      expect(spreadByDay(date, n).reduce((sum, p) => sum + p.fraction, 0)).toBeCloseTo(1, 12);
    }
  });

  it('counts a spread of one month wholly in the entry\u2019s month', () => {
    expect(spreadByDay('2026-05-31', 1)).toEqual([{ offset: 0, fraction: 1 }]);
  });

  it('refuses a spread that is not a whole number of months and an impossible date', () => {
    expect(() => spreadByDay('2026-05-31', 0)).toThrow(/whole number of months/);
    expect(() => spreadByDay('2026-05-31', 2.5)).toThrow(RangeError);
    expect(() => spreadByDay('2026-02-30', 2)).toThrow(RangeError);
  });

  it('tells how much of a lot is eaten within a range, by day', () => {
    const lot = { date: '2026-11-30', use: 'stored', source: 'home', spreadMonths: 3 } as const;
    // 1 Dec 2026 – 27 Feb 2027: 31 + 31 + 27 = 89 of the lot's 90 days (Gregorian calendar)
    expect(fractionEatenIn(lot, { from: '2026-12', to: '2027-12' })).toBeCloseTo(89 / 90, 12);
    expect(fractionEatenIn({ ...lot, use: 'sold' }, { from: '2026-01', to: '2027-12' })).toBe(0);
  });
});
