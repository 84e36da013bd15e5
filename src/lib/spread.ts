/**
 * How a lot of food is spread over the months it is eaten in. Food kept for two months or more is
 * eaten evenly per day, from the day it was stored or bought (included) to the same day `n`
 * months later (excluded), with date-fns `addMonths` semantics (31 January + 1 month = the last
 * day of February). So a squash lot stored on 30 November puts one day's share into November, not
 * a whole quarter. Food with a spread of one month or none counts wholly in its own month.
 *
 * The share report asks this for every group of entries, so the days are counted on whole day
 * numbers (no Date objects), and the parts of a (date, months) pair are kept once computed.
 */
import { parseDate, type YearMonthDay } from './months';

export interface SpreadPart {
  /** Months after the entry's month (0 = the entry's own month). */
  offset: number;
  /** Share of the lot eaten in that month; the parts of a lot add up to 1. */
  fraction: number;
}

/** Days since 1970-01-01 of a proleptic Gregorian date (H. Hinnant's days_from_civil algorithm). */
function dayNumber({ year, month, day }: YearMonthDay): number {
  const y = month <= 2 ? year - 1 : year;
  const era = Math.floor(y / 400);
  const yearOfEra = y - era * 400;
  const dayOfYear = Math.floor((153 * ((month + 9) % 12) + 2) / 5) + day - 1; // from 1 March
  return era * 146097 + yearOfEra * 365 + Math.floor(yearOfEra / 4) - Math.floor(yearOfEra / 100) + dayOfYear - 719468;
}

function daysIn(year: number, month: number): number {
  if (month === 2) return (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0 ? 29 : 28;
  return month === 4 || month === 6 || month === 9 || month === 11 ? 30 : 31;
}

/** The same day `n` months later, the month's last day when it is shorter (date-fns addMonths). */
function plusMonths(d: YearMonthDay, n: number): YearMonthDay {
  const index = d.year * 12 + (d.month - 1) + n;
  const year = Math.floor(index / 12);
  const month = index - year * 12 + 1;
  return { year, month, day: Math.min(d.day, daysIn(year, month)) };
}

/** Parts already computed, by "date|months" (the same pair always gives the same parts); callers only read them. */
const known = new Map<string, SpreadPart[]>();
const KNOWN_MAX = 20_000;

/**
 * The months a lot is eaten in and the share of it in each, e.g.
 * spreadByDay('2026-11-30', 3) → Nov 1/90, Dec 31/90, Jan 31/90, Feb 27/90 (30 Nov to 28 Feb, 90 days);
 * spreadByDay('2026-07-14', 1) → [{ offset: 0, fraction: 1 }].
 */
export function spreadByDay(date: string, spreadMonths: number): readonly SpreadPart[] {
  if (!Number.isInteger(spreadMonths) || spreadMonths < 1) {
    throw new RangeError(`spreadMonths must be a whole number of months from 1, got ${spreadMonths}`);
  }
  const key = `${date}|${spreadMonths}`;
  const seen = known.get(key);
  if (seen) return seen;
  const start = parseDate(date);
  const parts = spreadMonths === 1 ? [{ offset: 0, fraction: 1 }] : spreadDays(start, plusMonths(start, spreadMonths));
  if (known.size >= KNOWN_MAX) known.clear();
  known.set(key, parts);
  return parts;
}

/**
 * The same evenly by day over [from, until) given by its end (excluded), as the larder re-spreads
 * a lot from the day of a recorded outcome, e.g. spreadBetween('2026-11-30', '2026-12-02') →
 * Nov 1/2, Dec 1/2. Throws RangeError when `until` is not after `from`.
 */
export function spreadBetween(from: string, until: string): SpreadPart[] {
  const start = parseDate(from);
  const end = parseDate(until);
  if (!(dayNumber(end) > dayNumber(start))) throw new RangeError(`a spread must end after it starts: ${until} is not after ${from}`);
  return spreadDays(start, end);
}

/**
 * The day a lot spread over `spreadMonths` months from `date` is eaten up (excluded), with
 * date-fns addMonths semantics, e.g. spreadEnd('2027-01-31', 1) → '2027-02-28'.
 */
export function spreadEnd(date: string, spreadMonths: number): string {
  if (!Number.isInteger(spreadMonths) || spreadMonths < 1) {
    throw new RangeError(`spreadMonths must be a whole number of months from 1, got ${spreadMonths}`);
  }
  const end = plusMonths(parseDate(date), spreadMonths);
  const pad = (n: number, w: number) => String(n).padStart(w, '0');
  return `${pad(end.year, 4)}-${pad(end.month, 2)}-${pad(end.day, 2)}`;
}

/** Shares by month of the days from `start` (included) to `end` (excluded). */
function spreadDays(start: YearMonthDay, end: YearMonthDay): SpreadPart[] {
  const first = dayNumber(start);
  const last = dayNumber(end);
  const total = last - first;
  const parts: SpreadPart[] = [];
  let cursor = first;
  let year = start.year;
  let month = start.month;
  for (let offset = 0; cursor < last; offset++) {
    if (month === 12) {
      month = 1;
      year += 1;
    } else month += 1;
    const nextMonth = dayNumber({ year, month, day: 1 });
    const stop = nextMonth < last ? nextMonth : last;
    if (stop > cursor) parts.push({ offset, fraction: (stop - cursor) / total });
    cursor = stop;
  }
  return parts;
}
