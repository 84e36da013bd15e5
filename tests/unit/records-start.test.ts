import { describe, expect, it } from 'vitest';
import { countedMonths, defaultRecordsSince, headlineMonths, isBeforeRecords, isFutureMonth, markRecordsStart } from '@/lib/records-start';

// The rule is Selfsown's own (issue 9, "Records start"): common practice (no published source).
describe('records start', () => {
  it('defaults to the earlier of the creation month and the first entry month', () => {
    expect(defaultRecordsSince('2026-12-02', '2026-08-14')).toBe('2026-08');
    expect(defaultRecordsSince('2026-12-02', '2027-01-05')).toBe('2026-12');
    expect(defaultRecordsSince('2026-12-02', null)).toBe('2026-12');
  });

  it('charges a household made on 2 December nothing for March to November', () => {
    const months = ['2026-03', '2026-11', '2026-12'].map((month) => ({ month, need: 1000 }));
    expect(markRecordsStart(months, '2026-12')).toEqual([
      { month: '2026-03', beforeRecords: true, need: null },
      { month: '2026-11', beforeRecords: true, need: null },
      { month: '2026-12', beforeRecords: false, need: 1000 },
    ]);
  });

  it('leaves months before the start out of the totals', () => {
    expect(countedMonths(['2026-10', '2026-11', '2026-12', '2027-01'], '2026-12')).toEqual(['2026-12', '2027-01']);
    expect(countedMonths(['2026-10', '2026-11'], null)).toEqual(['2026-10', '2026-11']);
  });

  it('counts the start month itself and refuses a start that is not a month', () => {
    expect(isBeforeRecords('2026-12', '2026-12')).toBe(false);
    expect(isBeforeRecords('2026-11', '2026-12')).toBe(true);
    expect(() => isBeforeRecords('2026-11', '2026-13')).toThrow(/YYYY-MM/);
    expect(() => defaultRecordsSince('2026-02-30', null)).toThrow(RangeError);
  });

  it('heads the report with the year so far and keeps future months apart', () => {
    const year = ['2026-03', '2026-11', '2026-12', '2027-01', '2027-02'];
    expect(headlineMonths(year, { recordsSince: '2026-11', currentMonth: '2026-12' })).toEqual(['2026-11', '2026-12']);
    expect(isFutureMonth('2027-01', '2026-12')).toBe(true);
    expect(isFutureMonth('2026-12', '2026-12')).toBe(false);
    expect(() => headlineMonths(year, { recordsSince: null, currentMonth: 'December' })).toThrow(/YYYY-MM/);
  });
});
