/**
 * Calendar dates for the forms and filters: the household's "today", month ranges and how a day is
 * written for people, as 'YYYY-MM-DD'. The arithmetic itself lives in src/lib/months.ts; this file
 * only adds what the entry islands need on top of it.
 */
import { daysInMonth, isMonth } from '@/lib/months';

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

/** A date for people: 'Tue 14 Jul 2026'. Example: `formatDay('2026-07-14')` → 'Tue 14 Jul 2026' */
export function formatDay(date: string): string {
  const d = new Date(`${date}T12:00:00Z`);
  if (Number.isNaN(d.getTime())) return date;
  return new Intl.DateTimeFormat('en-GB', { weekday: 'short', day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' }).format(d);
}
