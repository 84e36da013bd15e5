/**
 * Which months a crop's food can be eaten in, so the planner can fill February and not only the
 * year's total. A crop of the reference table is picked between two weeks counted from the
 * household's frost dates (its harvest window); food that keeps is then eaten on for as many whole
 * months as it keeps (its storage life). The planner spreads a crop's harvest evenly over those
 * months. Months are calendar months (1 = January), so the same crop fits any growing year: the
 * plan is for a year in steady state, where food carried past the year's end stands for the same
 * crop grown the season before. Pure: dates are counted on a fixed non-leap calendar.
 */
import type { FrostDates } from './growing-season';
import type { CropTableRow, HarvestWeek } from './crop-table';

const MM_DD = /^(\d{2})-(\d{2})$/;
// A non-leap year: 29 February is read as 28 February (a day does not move a frost date).
const DAYS_BEFORE_MONTH = [0, 31, 59, 90, 120, 151, 181, 212, 243, 273, 304, 334, 365];

/**
 * Day of a non-leap year (0 = 1 January) of an 'MM-DD' date; throws a sentence for a bad one.
 * Example: `dayOfYear('03-01')` → 59
 */
export function dayOfYear(mmdd: string): number {
  const m = MM_DD.exec(mmdd);
  const month = m ? Number(m[1]) : NaN;
  const day = m ? Number(m[2]) : NaN;
  const length = month >= 1 && month <= 12 ? DAYS_BEFORE_MONTH[month]! - DAYS_BEFORE_MONTH[month - 1]! + (month === 2 ? 1 : 0) : 0;
  if (!m || day < 1 || day > length) {
    throw new RangeError(`"${mmdd}" is not a day of the year: write the frost date as MM-DD, e.g. 04-20.`);
  }
  return DAYS_BEFORE_MONTH[month - 1]! + Math.min(day, month === 2 ? 28 : day) - 1;
}

/** Calendar month (1–12) of a day counted from 1 January, wrapping over year ends. Example: `monthOfDay(370)` → 1 */
export function monthOfDay(day: number): number {
  const d = ((Math.floor(day) % 365) + 365) % 365;
  let month = 1;
  while (d >= DAYS_BEFORE_MONTH[month]!) month++;
  return month;
}

/**
 * The days (counted from 1 January of the spring frost's year) of the two frost dates; the autumn
 * frost always comes after the spring one, in the next calendar year in the southern hemisphere.
 * Example: `frostDays({ lastSpringFrost: '10-01', firstAutumnFrost: '04-15' })` → { spring: 273, autumn: 469 }
 */

export function frostDays(frost: FrostDates): { spring: number; autumn: number } {
  const spring = dayOfYear(frost.lastSpringFrost);
  let autumn = dayOfYear(frost.firstAutumnFrost);
  if (autumn <= spring) autumn += 365;
  return { spring, autumn };
}

function weekDay(week: HarvestWeek, days: { spring: number; autumn: number }): number {
  return (week.frost === 'spring' ? days.spring : days.autumn) + week.weeks * 7;
}

/**
 * Calendar months (1–12, in order from the first) the harvest window of a row falls in.
 * Example: kale (spring +8 to autumn +20 weeks) with frosts '04-15' and '10-15' → [6, 7, …, 12, 1, 2]
 */
export function harvestMonths(row: Pick<CropTableRow, 'harvestFrom' | 'harvestTo'>, frost: FrostDates): number[] {
  const days = frostDays(frost);
  const start = weekDay(row.harvestFrom, days);
  const end = Math.max(start, weekDay(row.harvestTo, days));
  return monthsBetween(start, end);
}

/** Months since January of year 0 of a day counted from 1 January (days may run past a year). */
function absoluteMonth(day: number): number {
  const d = Math.floor(day);
  const year = Math.floor(d / 365);
  return year * 12 + monthOfDay(d) - 1;
}

function monthsBetween(start: number, end: number): number[] {
  const first = absoluteMonth(start);
  const count = Math.min(12, absoluteMonth(end) - first + 1);
  return Array.from({ length: count }, (_, i) => ((first + i) % 12) + 1);
}

/**
 * Calendar months (1–12) a row's food can be eaten in: its harvest window, then as many whole
 * months as it keeps (storage_months rounded down), at most twelve in all.
 * Example: potatoes picked in August–October that keep 6 months → [8, 9, 10, 11, 12, 1, 2, 3, 4]
 */
export function eatingMonths(row: Pick<CropTableRow, 'harvestFrom' | 'harvestTo' | 'storageMonths'>, frost: FrostDates): number[] {
  const out = harvestMonths(row, frost);
  let m = out[out.length - 1]!;
  for (let i = 0; i < Math.floor(row.storageMonths) && out.length < 12; i++) {
    m = (m % 12) + 1;
    out.push(m);
  }
  return out;
}

/**
 * The share of a crop's food eaten in each calendar month (index 0 = January), spread evenly over
 * its eating months; the twelve shares add up to 1. Example: food eaten in [11, 12, 1, 2] → 0.25 in
 * January, February, November and December, 0 elsewhere.
 */
export function monthShares(row: Pick<CropTableRow, 'harvestFrom' | 'harvestTo' | 'storageMonths'>, frost: FrostDates): number[] {
  const months = eatingMonths(row, frost);
  const shares = new Array<number>(12).fill(0);
  for (const m of months) shares[m - 1] = 1 / months.length;
  return shares;
}
