/**
 * How a day or a month is written for people, everywhere in the app: "2 Dec 2026", with the
 * weekday where it helps find an entry ("Wed 2 Dec 2026"), "Dec 2026" for a month. Worked out from
 * the 'YYYY-MM-DD' string itself (src/lib/months.ts), never through the machine's locale, so the
 * server's HTML, the browser's islands and the e-mails write the same text.
 */
import { daysBetween, monthName, parseDate, parseMonth, todayIn } from './months';

const WEEKDAYS = ['Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat', 'Sun'] as const;

/** Short weekday of a date, e.g. weekdayOf('2026-12-02') → 'Wed'. */
export function weekdayOf(date: string): string {
  // 2024-01-01 was a Monday (ISO 8601 calendar).
  const offset = daysBetween('2024-01-01', date);
  return WEEKDAYS[((offset % 7) + 7) % 7]!;
}

export interface DateTextOptions {
  /** Put the short weekday first: 'Wed 2 Dec 2026'. */
  weekday?: boolean;
  /** Leave the year off (for dates in the last months): '2 Dec'. */
  year?: boolean;
}

/**
 * A date for people, e.g. formatDate('2026-12-02') → '2 Dec 2026',
 * formatDate('2026-12-02', { weekday: true }) → 'Wed 2 Dec 2026', formatDate('2026-12-02', { year: false }) → '2 Dec'.
 * Throws RangeError for a string that is not a real date.
 */
export function formatDate(date: string, { weekday = false, year = true }: DateTextOptions = {}): string {
  const d = parseDate(date);
  const text = `${d.day} ${monthName(d.month, 'short')}${year ? ` ${d.year}` : ''}`;
  return weekday ? `${weekdayOf(date)} ${text}` : text;
}

/** A month for people, short or long, e.g. formatMonthText('2027-03') → 'Mar 2027', formatMonthText('2027-03', 'long') → 'March 2027'. */
export function formatMonthText(month: string, length: 'short' | 'long' = 'short'): string {
  const { year, month: m } = parseMonth(month);
  return `${monthName(m, length)} ${year}`;
}

/**
 * The day of an instant (an ISO timestamp or a Date) in a time zone, written as formatDate writes
 * days, e.g. formatInstantDate('2026-12-09T23:30:00Z', 'Pacific/Auckland') → '10 Dec 2026'.
 */
export function formatInstantDate(instant: string | Date, timeZone = 'UTC'): string {
  const when = typeof instant === 'string' ? new Date(instant) : instant;
  if (Number.isNaN(when.getTime())) throw new RangeError(`"${String(instant)}" is not a point in time`);
  return formatDate(todayIn(timeZone, when));
}
