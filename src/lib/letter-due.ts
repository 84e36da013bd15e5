/**
 * When a household's monthly letter is due: in the first days of a month in the household's own
 * time zone, about the month before. The window is a week wide, so a server that was down on the
 * 1st still sends on its next hourly run (claiming keeps it to one letter); after the 7th a missed
 * letter is left unsent rather than arriving late in the month.
 */
import { addMonths, monthOf, parseDate, todayIn } from './months';

/** The last local day of the month on which last month's letter may still go out. */
export const LETTER_DUE_LAST_DAY = 7;

/**
 * The month whose letter is due on a local date, or null outside the window,
 * e.g. dueLetterMonth('2027-01-01') → '2026-12'; dueLetterMonth('2027-01-08') → null.
 */
export function dueLetterMonth(localDate: string): string | null {
  const { day } = parseDate(localDate);
  return day <= LETTER_DUE_LAST_DAY ? addMonths(monthOf(localDate), -1) : null;
}

/**
 * The month whose letter is due for a household in `timeZone` at the instant `now`, or null,
 * e.g. dueLetterMonthIn('Pacific/Auckland', new Date('2027-01-01T02:00:00Z')) → '2026-12' while
 * dueLetterMonthIn('America/Los_Angeles', same instant) → null (still 31 December there).
 */
export function dueLetterMonthIn(timeZone: string, now: Date): string | null {
  return dueLetterMonth(todayIn(timeZone, now));
}
