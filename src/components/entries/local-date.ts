/**
 * Calendar dates for the forms and filters: the household's "today", month ranges and how a day is
 * written for people, as 'YYYY-MM-DD'. The arithmetic itself lives in src/lib/months.ts; this file
 * only adds what the entry islands need on top of it.
 */
import { formatDate } from '@/lib/format-date';
import { daysInMonth, isDate, isMonth } from '@/lib/months';

// One todayIn and one daysBetween for the whole app, re-exported for the entry islands.

/** First and last day of a month written 'YYYY-MM'. Example: `monthRange('2028-02')` → { from: '2028-02-01', to: '2028-02-29' } */
export function monthRange(month: string): { from: string; to: string } | null {
  if (!isMonth(month)) return null;
  return { from: `${month}-01`, to: `${month}-${String(daysInMonth(month)).padStart(2, '0')}` };
}

/** The same month a number of years earlier, 'YYYY-MM'. Example: `shiftYear('2026-07-15', -1)` → '2025-07' */
export function shiftYear(date: string, years: number): string {
  return `${String(Number(date.slice(0, 4)) + years).padStart(4, '0')}-${date.slice(5, 7)}`;
}

/** A day in an entry list: 'Tue 14 Jul 2026' (src/lib/format-date.ts, the one date helper). */
export function formatDay(date: string): string {
  return isDate(date) ? formatDate(date, { weekday: true }) : date;
}
