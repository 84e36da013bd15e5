import { describe, expect, it } from 'vitest';
import {
  MAX_RANGE_MONTHS,
  addMonths,
  compareMonths,
  daysBetween,
  daysInMonth,
  isDate,
  isLeapYear,
  isMonth,
  listMonths,
  monthName,
  MONTH_NAMES,
  monthOf,
  overlapDays,
  parseMonth,
  todayIn,
} from '@/lib/months';

describe('months', () => {
  it('accepts YYYY-MM with a month from 01 to 12 only', () => {
    expect(parseMonth('2026-11')).toEqual({ year: 2026, month: 11 });
    expect(isMonth('2026-01')).toBe(true);
    for (const bad of ['2026-13', '2026-00', '2026-1', '26-01', '2026-01-01', '2026/01', '', 'x']) {
      expect(isMonth(bad)).toBe(false);
      expect(() => parseMonth(bad)).toThrow(RangeError);
    }
  });

  it('counts February by the Gregorian leap-year rule', () => {
    // Gregorian calendar: leap years are divisible by 4, except centuries not divisible by 400 (papal bull Inter gravissimas, 1582)
    expect(daysInMonth('2026-02')).toBe(28);
    expect(daysInMonth('2028-02')).toBe(29);
    expect(daysInMonth('1900-02')).toBe(28);
    expect(daysInMonth('2000-02')).toBe(29);
    expect(isLeapYear(2100)).toBe(false);
  });

  it('gives 30 days to April, June, September and November and 31 to the rest', () => {
    // Gregorian calendar month lengths
    expect(['2026-04', '2026-06', '2026-09', '2026-11'].map(daysInMonth)).toEqual([30, 30, 30, 30]);
    expect(['2026-01', '2026-03', '2026-05', '2026-07', '2026-08', '2026-10', '2026-12'].map(daysInMonth)).toEqual([
      31, 31, 31, 31, 31, 31, 31,
    ]);
  });

  it('adds months across year ends, forwards and back', () => {
    expect(addMonths('2026-11', 3)).toBe('2027-02');
    expect(addMonths('2026-01', -1)).toBe('2025-12');
    expect(addMonths('2026-05', 0)).toBe('2026-05');
    expect(addMonths('2026-05', 24)).toBe('2028-05');
    expect(() => addMonths('2026-05', 1.5)).toThrow(RangeError);
  });

  it('orders months', () => {
    expect(compareMonths('2026-12', '2027-01')).toBe(-1);
    expect(compareMonths('2027-01', '2026-12')).toBe(1);
    expect(compareMonths('2027-01', '2027-01')).toBe(0);
  });

  it('lists every month from one to another, both included', () => {
    expect(listMonths('2026-11', '2027-02')).toEqual(['2026-11', '2026-12', '2027-01', '2027-02']);
    expect(listMonths('2026-06', '2026-06')).toEqual(['2026-06']);
  });

  it('refuses a range that ends before it starts', () => {
    expect(() => listMonths('2026-06', '2026-05')).toThrow(/before it starts/);
  });

  it('allows at most ten years (120 months) in a range', () => {
    expect(MAX_RANGE_MONTHS).toBe(120);
    expect(listMonths('2020-01', '2029-12')).toHaveLength(120);
    expect(() => listMonths('2020-01', '2030-01')).toThrow(/at most 120/);
  });

  it('knows real dates from impossible ones', () => {
    expect(isDate('2028-02-29')).toBe(true);
    expect(isDate('2026-02-29')).toBe(false);
    expect(isDate('2026-04-31')).toBe(false);
    expect(isDate('2026-4-01')).toBe(false);
    // Exactly four digits, hyphen, two digits, hyphen, two digits: nothing around, no signs or spaces.
    for (const bad of ['2026-04-1', '2026-04-011', ' 2026-04-01', '2026-04-01\n', '2026-04+01', '+026-04-01', '2026-0a-01', '2026--4-01', '0000-01-01', '2026_04_01']) {
      expect(isDate(bad), bad).toBe(false);
    }
    for (const bad of ['2026-+1', '2026-1 ', ' 026-01', '0000-01', '2026-011']) expect(isMonth(bad), bad).toBe(false);
    expect(isDate('0001-01-01')).toBe(true);
    expect(isDate('9999-12-31')).toBe(true);
    expect(monthOf('2026-11-05')).toBe('2026-11');
    expect(() => monthOf('2026-11-31')).toThrow(RangeError);
  });

  it('counts days between dates across a leap day', () => {
    expect(daysBetween('2028-02-28', '2028-03-01')).toBe(2);
    expect(daysBetween('2026-02-28', '2026-03-01')).toBe(1);
    expect(daysBetween('2026-01-01', '2027-01-01')).toBe(365);
    expect(daysBetween('2028-01-01', '2029-01-01')).toBe(366);
  });

  it('counts the days of a month inside a date interval, ends included', () => {
    expect(overlapDays('2026-02')).toBe(28);
    expect(overlapDays('2028-02')).toBe(29);
    expect(overlapDays('2026-03', '2026-03-20')).toBe(12);
    expect(overlapDays('2026-03', null, '2026-03-10')).toBe(10);
    expect(overlapDays('2026-03', '2026-03-10', '2026-03-10')).toBe(1);
    expect(overlapDays('2026-03', '2026-01-15', '2026-05-01')).toBe(31);
    expect(overlapDays('2026-03', '2026-04-01')).toBe(0);
    expect(overlapDays('2026-03', undefined, '2026-02-28')).toBe(0);
  });

  it('refuses an interval whose start is after its end', () => {
    expect(() => overlapDays('2026-03', '2026-03-20', '2026-03-10')).toThrow(RangeError);
  });

  it('names months long and short from one list', () => {
    expect(MONTH_NAMES).toHaveLength(12);
    expect(monthName(1)).toBe('January');
    expect(monthName(9, 'short')).toBe('Sep');
    expect(MONTH_NAMES.map((_, i) => monthName(i + 1, 'short'))).toEqual(['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec']);
    expect(() => monthName(13)).toThrow(RangeError);
  });

  it('reads today in a time zone, and falls back to the UTC date for a zone the runtime does not know', () => {
    // Pacific/Auckland is UTC+13 in (southern) summer (IANA tz database: NZDT)
    expect(todayIn('Pacific/Auckland', new Date('2026-12-31T12:00:00Z'))).toBe('2027-01-01');
    expect(todayIn('Mars/Olympus', new Date('2026-12-31T23:00:00Z'))).toBe('2026-12-31');
  });
});
