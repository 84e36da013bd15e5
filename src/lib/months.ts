/**
 * Calendar months as 'YYYY-MM' strings and dates as 'YYYY-MM-DD' strings (proleptic Gregorian
 * calendar, no time zones: a harvest belongs to the day it was written down for). This is the one
 * home of date arithmetic and month names, for the server, the reports and the forms alike; only
 * `todayIn` looks at a clock, and then only at the one it is handed.
 */

/** The longest range a share report covers: 10 years. */
export const MAX_RANGE_MONTHS = 120;

export interface YearMonth {
  year: number;
  /** 1–12 */
  month: number;
}

export interface YearMonthDay extends YearMonth {
  /** 1–31 */
  day: number;
}

/**
 * The number written by `length` ASCII digits of `value` from `at`, or -1 when one is not a digit.
 * The report reads thousands of dates: reading the characters beats a regular expression's
 * match arrays and substrings.
 */
function digitsAt(value: string, at: number, length: number): number {
  let n = 0;
  for (let i = at; i < at + length; i++) {
    const c = value.charCodeAt(i) - 48;
    if (c < 0 || c > 9) return -1;
    n = n * 10 + c;
  }
  return n;
}

/** 'YYYY-MM' (exactly: four digits, a hyphen, two digits) as numbers, unchecked beyond that; null otherwise. */
function monthDigits(value: string, length: number): YearMonth | null {
  if (value.length !== length || value.charCodeAt(4) !== 45) return null;
  const year = digitsAt(value, 0, 4);
  const month = digitsAt(value, 5, 2);
  return year < 0 || month < 0 ? null : { year, month };
}

/** Leap year in the Gregorian calendar, e.g. isLeapYear(2028) → true, isLeapYear(2100) → false. */
export function isLeapYear(year: number): boolean {
  return (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0;
}

/** Month names in English, January first; short names are their first three letters. Example: `MONTH_NAMES[8]` → 'September' */
export const MONTH_NAMES = ['January', 'February', 'March', 'April', 'May', 'June', 'July', 'August', 'September', 'October', 'November', 'December'] as const;

/** The name of a month number 1–12, long or short. Example: `monthName(9, 'short')` → 'Sep' */
export function monthName(month: number, length: 'long' | 'short' = 'long'): string {
  const name = MONTH_NAMES[month - 1];
  if (!Number.isInteger(month) || name === undefined) throw new RangeError(`${month} is not a month number: use 1 to 12`);
  return length === 'short' ? name.slice(0, 3) : name;
}

function daysIn(year: number, month: number): number {
  if (month === 2) return isLeapYear(year) ? 29 : 28;
  return month === 4 || month === 6 || month === 9 || month === 11 ? 30 : 31;
}

function splitMonth(value: string): YearMonth | null {
  const ym = monthDigits(value, 7);
  if (!ym || ym.year < 1 || ym.month < 1 || ym.month > 12) return null;
  return ym;
}

function splitDate(value: string): YearMonthDay | null {
  const ym = monthDigits(value, 10);
  if (!ym || value.charCodeAt(7) !== 45) return null;
  const { year, month } = ym;
  const day = digitsAt(value, 8, 2);
  if (year < 1 || month < 1 || month > 12 || day < 1 || day > daysIn(year, month)) return null;
  return { year, month, day };
}

/** Whether a value is a real month, e.g. isMonth('2026-02') → true, isMonth('2026-13') → false. */
export function isMonth(value: unknown): value is string {
  return typeof value === 'string' && splitMonth(value) !== null;
}

/** Year and month of a 'YYYY-MM' string, e.g. parseMonth('2026-11') → { year: 2026, month: 11 }. Throws RangeError otherwise. */
export function parseMonth(value: string): YearMonth {
  const ym = typeof value === 'string' ? splitMonth(value) : null;
  if (!ym) throw new RangeError(`"${String(value)}" is not a month: expected YYYY-MM with a month from 01 to 12`);
  return ym;
}

/** The 'YYYY-MM' string of a year and month, e.g. formatMonth({ year: 2027, month: 1 }) → '2027-01'. */
export function formatMonth({ year, month }: YearMonth): string {
  return `${String(year).padStart(4, '0')}-${String(month).padStart(2, '0')}`;
}

/** Whether a value is a real date, e.g. isDate('2028-02-29') → true, isDate('2026-02-29') → false. */
export function isDate(value: unknown): value is string {
  return typeof value === 'string' && splitDate(value) !== null;
}

/**
 * Today's date 'YYYY-MM-DD' in an IANA time zone, e.g. todayIn('Pacific/Auckland',
 * new Date('2026-12-31T12:00:00Z')) → '2027-01-01'. A zone the runtime does not know (an older
 * browser) falls back to the UTC date rather than failing.
 */
export function todayIn(timeZone: string, now: Date = new Date()): string {
  try {
    return dayFormat(timeZone).format(now);
  } catch {
    return now.toISOString().slice(0, 10);
  }
}

/**
 * One formatter per zone, kept: making an Intl.DateTimeFormat costs far more than formatting with
 * it, and a share request asks for "today" several times. Only zones the runtime knows get in
 * (an unknown one throws before it is kept), so the map holds at most the runtime's zone list.
 */
const dayFormats = new Map<string, Intl.DateTimeFormat>();

function dayFormat(timeZone: string): Intl.DateTimeFormat {
  let f = dayFormats.get(timeZone);
  if (!f) {
    // en-CA writes dates as YYYY-MM-DD.
    f = new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' });
    dayFormats.set(timeZone, f);
  }
  return f;
}

/**
 * The month index (year × 12 + month − 1, as monthIndex) of a 'YYYY-MM-DD' date, checked as
 * parseDate checks it but without making an object: the share report asks for every entry,
 * e.g. dateMonthIndex('2026-11-30') → 24322. Throws RangeError for an impossible date.
 */
export function dateMonthIndex(value: string): number {
  if (typeof value === 'string' && value.length === 10 && value.charCodeAt(4) === 45 && value.charCodeAt(7) === 45) {
    const year = digitsAt(value, 0, 4);
    const month = digitsAt(value, 5, 2);
    const day = digitsAt(value, 8, 2);
    if (year >= 1 && month >= 1 && month <= 12 && day >= 1 && day <= daysIn(year, month)) return year * 12 + (month - 1);
  }
  parseDate(value); // throws its sentence
  return NaN;
}

/** Year, month and day of a 'YYYY-MM-DD' string, e.g. parseDate('2026-04-30'). Throws RangeError for an impossible date. */
export function parseDate(value: string): YearMonthDay {
  const d = typeof value === 'string' ? splitDate(value) : null;
  if (!d) throw new RangeError(`"${String(value)}" is not a date: expected YYYY-MM-DD that exists in the calendar`);
  return d;
}

/** The month a date falls in, e.g. monthOf('2026-11-05') → '2026-11'. */
export function monthOf(date: string): string {
  return formatMonth(parseDate(date));
}

/** Number of days in a month, e.g. daysInMonth('2026-02') → 28, daysInMonth('2028-02') → 29. */
export function daysInMonth(month: string): number {
  const { year, month: m } = parseMonth(month);
  return daysIn(year, m);
}

/** Months since the start of year 0: consecutive months differ by 1, e.g. monthIndex('0001-01') → 12. */
export function monthIndex(month: string): number {
  const { year, month: m } = parseMonth(month);
  return year * 12 + (m - 1);
}

function fromIndex(index: number): string {
  const year = Math.floor(index / 12);
  if (year < 1 || year > 9999) throw new RangeError('month out of range: years run from 0001 to 9999');
  return formatMonth({ year, month: index - year * 12 + 1 });
}

/** A month n months later (n may be negative), across year ends, e.g. addMonths('2026-11', 3) → '2027-02'. */
export function addMonths(month: string, n: number): string {
  if (!Number.isInteger(n)) throw new RangeError(`cannot add ${n} months: the count must be a whole number`);
  return fromIndex(monthIndex(month) + n);
}

/** Negative, zero or positive as month a is before, equal to or after b, e.g. compareMonths('2026-12', '2027-01') → -1. */
export function compareMonths(a: string, b: string): number {
  return Math.sign(monthIndex(a) - monthIndex(b));
}

/**
 * Every month from `from` to `to`, both included, e.g. listMonths('2026-11', '2027-02') →
 * ['2026-11', '2026-12', '2027-01', '2027-02']. Throws RangeError when `to` is before `from`
 * or the range is longer than MAX_RANGE_MONTHS.
 */
export function listMonths(from: string, to: string): string[] {
  const a = monthIndex(from);
  const b = monthIndex(to);
  if (b < a) throw new RangeError(`the range ends (${to}) before it starts (${from})`);
  const count = b - a + 1;
  if (count > MAX_RANGE_MONTHS) {
    throw new RangeError(`the range ${from}..${to} has ${count} months; at most ${MAX_RANGE_MONTHS} (10 years) are allowed`);
  }
  const out: string[] = [];
  for (let i = a; i <= b; i++) out.push(fromIndex(i));
  return out;
}

/** Days since 1970-01-01 (H. Hinnant's days_from_civil; no Date object, so years 1–99 stay themselves). */
function dayNumber({ year, month, day }: YearMonthDay): number {
  const y = month <= 2 ? year - 1 : year;
  const era = Math.floor(y / 400);
  const yoe = y - era * 400;
  const mp = (month + 9) % 12;
  const doy = Math.floor((153 * mp + 2) / 5) + day - 1;
  const doe = yoe * 365 + Math.floor(yoe / 4) - Math.floor(yoe / 100) + doy;
  return era * 146097 + doe - 719468;
}

/** Days from date a to date b (b − a), e.g. daysBetween('2026-02-27', '2026-03-01') → 2. */
export function daysBetween(a: string, b: string): number {
  return dayNumber(parseDate(b)) - dayNumber(parseDate(a));
}

/** Inverse of dayNumber (H. Hinnant's civil_from_days). */
function fromDayNumber(z: number): string {
  const zz = z + 719468;
  const era = Math.floor(zz / 146097);
  const doe = zz - era * 146097;
  const yoe = Math.floor((doe - Math.floor(doe / 1460) + Math.floor(doe / 36524) - Math.floor(doe / 146096)) / 365);
  const doy = doe - (365 * yoe + Math.floor(yoe / 4) - Math.floor(yoe / 100));
  const mp = Math.floor((5 * doy + 2) / 153);
  const day = doy - Math.floor((153 * mp + 2) / 5) + 1;
  const month = mp < 10 ? mp + 3 : mp - 9;
  const year = yoe + era * 400 + (month <= 2 ? 1 : 0);
  if (year < 1 || year > 9999) throw new RangeError('date out of range: years run from 0001 to 9999');
  return `${String(year).padStart(4, '0')}-${String(month).padStart(2, '0')}-${String(day).padStart(2, '0')}`;
}

/** The date n days after a date (n may be negative), e.g. addDays('2026-02-28', 1) → '2026-03-01'. */
export function addDays(date: string, n: number): string {
  if (!Number.isInteger(n)) throw new RangeError(`cannot add ${n} days: the count must be a whole number`);
  return fromDayNumber(dayNumber(parseDate(date)) + n);
}

/**
 * Days of `month` inside the date interval [from, to] (both included; a missing end is open),
 * e.g. overlapDays('2026-03', '2026-03-20') → 12, overlapDays('2026-02') → 28.
 * Throws RangeError when `from` is after `to`.
 */
export function overlapDays(month: string, from?: string | null, to?: string | null): number {
  const { year, month: m } = parseMonth(month);
  const first = dayNumber({ year, month: m, day: 1 });
  const last = dayNumber({ year, month: m, day: daysIn(year, m) });
  const start = from != null ? dayNumber(parseDate(from)) : -Infinity;
  const end = to != null ? dayNumber(parseDate(to)) : Infinity;
  if (start > end) throw new RangeError(`the interval starts (${String(from)}) after it ends (${String(to)})`);
  const lo = Math.max(first, start);
  const hi = Math.min(last, end);
  return hi < lo ? 0 : hi - lo + 1;
}
