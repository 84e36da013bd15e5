/**
 * Which months a report covers by default: the household's growing year (12 months from its
 * start month) containing today, or the last 12 months — with "today" read in the household's
 * own time zone, so a report never jumps a month early or late for a grower far from UTC.
 */
import { addMonths, formatMonth, parseMonth } from './months';


export interface MonthRange {
  from: string;
  to: string;
}

/**
 * The growing year (12 months from startMonth, 1–12) that contains a month,
 * e.g. growingYear('2026-02', 10) → { from: '2025-10', to: '2026-09' }.
 */
export function growingYear(month: string, startMonth: number): MonthRange {
  if (!Number.isInteger(startMonth) || startMonth < 1 || startMonth > 12) {
    throw new RangeError(`the growing year starts in a month from 1 to 12, got ${startMonth}`);
  }
  const { year, month: m } = parseMonth(month);
  const from = formatMonth({ year: m >= startMonth ? year : year - 1, month: startMonth });
  return { from, to: addMonths(from, 11) };
}

/** The 12 months ending with a month, e.g. lastTwelveMonths('2026-03') → { from: '2025-04', to: '2026-03' }. */
export function lastTwelveMonths(month: string): MonthRange {
  return { from: addMonths(month, -11), to: month };
}

/**
 * How a growing year is called: its calendar year, or both years when it crosses a year end,
 * e.g. growingYearLabel({ from: '2025-10', to: '2026-09' }) → '2025/26'.
 */
export function growingYearLabel({ from, to }: MonthRange): string {
  const a = parseMonth(from).year;
  const b = parseMonth(to).year;
  return a === b ? String(a) : `${a}/${String(b).slice(-2)}`;
}
