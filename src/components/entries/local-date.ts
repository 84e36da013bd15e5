/** Calendar dates for the forms and filters: the household's "today" and month ranges, as 'YYYY-MM-DD'. */

/** Today's date in an IANA time zone. Example: `todayIn('Pacific/Auckland')` → '2026-07-15' */
export function todayIn(timeZone: string, now: Date = new Date()): string {
  try {
    // en-CA writes dates as YYYY-MM-DD.
    return new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' }).format(now);
  } catch {
    return now.toISOString().slice(0, 10);
  }
}

/** First and last day of a month written 'YYYY-MM'. Example: `monthRange('2028-02')` → { from: '2028-02-01', to: '2028-02-29' } */
export function monthRange(month: string): { from: string; to: string } | null {
  const m = /^(\d{4})-(\d{2})$/.exec(month);
  if (!m) return null;
  const year = Number(m[1]);
  const mon = Number(m[2]);
  if (mon < 1 || mon > 12) return null;
  const last = new Date(Date.UTC(year, mon, 0)).getUTCDate();
  return { from: `${m[1]}-${m[2]}-01`, to: `${m[1]}-${m[2]}-${String(last).padStart(2, '0')}` };
}

/** The same month a number of years earlier, 'YYYY-MM'. Example: `shiftYear('2026-07-15', -1)` → '2025-07' */
export function shiftYear(date: string, years: number): string {
  return `${String(Number(date.slice(0, 4)) + years).padStart(4, '0')}-${date.slice(5, 7)}`;
}

/** Whole days from a to b (b later is positive). Example: `daysBetween('2026-07-01', '2026-07-15')` → 14 */
export function daysBetween(a: string, b: string): number {
  return Math.round((Date.parse(`${b}T00:00:00Z`) - Date.parse(`${a}T00:00:00Z`)) / 86_400_000);
}

/** A date for people: 'Tue 14 Jul 2026'. Example: `formatDay('2026-07-14')` → 'Tue 14 Jul 2026' */
export function formatDay(date: string): string {
  const d = new Date(`${date}T12:00:00Z`);
  if (Number.isNaN(d.getTime())) return date;
  return new Intl.DateTimeFormat('en-GB', { weekday: 'short', day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' }).format(d);
}
