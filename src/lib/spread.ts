/**
 * How a lot of food is spread over the months it is eaten in. Food kept for two months or more is
 * eaten evenly per day, from the day it was stored or bought (included) to the same day `n`
 * months later (excluded), with date-fns `addMonths` semantics (31 January + 1 month = the last
 * day of February). So a squash lot stored on 30 November puts one day's share into November, not
 * a whole quarter. Food with a spread of one month or none counts wholly in its own month.
 */
import { addMonths, differenceInCalendarDays } from 'date-fns';
import { parseDate } from './months';

export interface SpreadPart {
  /** Months after the entry's month (0 = the entry's own month). */
  offset: number;
  /** Share of the lot eaten in that month; the parts of a lot add up to 1. */
  fraction: number;
}

/** Local-time midnight of a checked 'YYYY-MM-DD' date (date-fns works on Date objects). */
function dayOf(date: string): Date {
  const { year, month, day } = parseDate(date);
  const d = new Date(2000, month - 1, day);
  d.setFullYear(year); // years before 100 would otherwise be read as 19xx
  return d;
}

/**
 * The months a lot is eaten in and the share of it in each, e.g.
 * spreadByDay('2026-11-30', 3) → Nov 1/90, Dec 31/90, Jan 31/90, Feb 27/90 (30 Nov to 28 Feb, 90 days);
 * spreadByDay('2026-07-14', 1) → [{ offset: 0, fraction: 1 }].
 */
export function spreadByDay(date: string, spreadMonths: number): SpreadPart[] {
  if (!Number.isInteger(spreadMonths) || spreadMonths < 1) {
    throw new RangeError(`spreadMonths must be a whole number of months from 1, got ${spreadMonths}`);
  }
  const start = dayOf(date);
  if (spreadMonths === 1) return [{ offset: 0, fraction: 1 }];
  return spreadDays(start, addMonths(start, spreadMonths));
}

/**
 * The same evenly by day over [from, until) given by its end (excluded), as the larder re-spreads
 * a lot from the day of a recorded outcome, e.g. spreadBetween('2026-11-30', '2026-12-02') →
 * Nov 1/2, Dec 1/2. Throws RangeError when `until` is not after `from`.
 */
export function spreadBetween(from: string, until: string): SpreadPart[] {
  const start = dayOf(from);
  const end = dayOf(until);
  if (!(end > start)) throw new RangeError(`a spread must end after it starts: ${until} is not after ${from}`);
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
  const end = addMonths(dayOf(date), spreadMonths);
  const pad = (n: number, w: number) => String(n).padStart(w, '0');
  return `${pad(end.getFullYear(), 4)}-${pad(end.getMonth() + 1, 2)}-${pad(end.getDate(), 2)}`;
}

function spreadDays(start: Date, end: Date): SpreadPart[] {
  const total = differenceInCalendarDays(end, start);
  const parts: SpreadPart[] = [];
  let cursor = start;
  for (let offset = 0; cursor < end; offset++) {
    const nextMonth = new Date(cursor.getFullYear(), cursor.getMonth() + 1, 1);
    const stop = nextMonth < end ? nextMonth : end;
    const days = differenceInCalendarDays(stop, cursor);
    if (days > 0) parts.push({ offset, fraction: days / total });
    cursor = stop;
  }
  return parts;
}
