/**
 * Which calendar months a reference crop can feed the household: the months of its harvest window
 * (weeks counted from the household's frost dates), followed by the months its food keeps in
 * store. The gap finder reads these to answer "what would still be on the table in February?".
 * Pure: frost dates in, month numbers (1–12) out; no dates of a particular year are needed, so a
 * window that runs over the year end (kale picked into March) simply wraps round.
 */
import type { CropTableRow, HarvestWeek } from './crop-table';
import type { FrostDates } from './growing-season';

export interface EatingMonths {
  /** Calendar months (1–12) of the harvest window, in order from its first month. */
  harvest: number[];
  /** Calendar months after the window that stored food still covers, in order. */
  stored: number[];
}

const MM_DD = /^(\d{2})-(\d{2})$/;
// A year with no 29 February: a frost date is a day of any year, and weeks are added to it.
const BASE_YEAR = 2001;

function frostDay(value: string, which: string): number {
  const m = MM_DD.exec(value);
  const month = m ? Number(m[1]) : NaN;
  const day = m ? Number(m[2]) : NaN;
  const t = Date.UTC(BASE_YEAR, month - 1, day);
  if (!m || month < 1 || month > 12 || day < 1 || new Date(t).getUTCMonth() !== month - 1) {
    throw new RangeError(`The ${which} frost date "${value}" is not a day of the year: write it as MM-DD, e.g. 04-20.`);
  }
  return t;
}

/**
 * The calendar month (1–12) of a week counted from a frost date,
 * e.g. harvestMonth({ frost: 'autumn', weeks: 20 }, { lastSpringFrost: '04-20', firstAutumnFrost: '10-15' }) → 3 (4 March).
 */
export function harvestMonth(week: HarvestWeek, frosts: FrostDates): number {
  const base = week.frost === 'spring' ? frostDay(frosts.lastSpringFrost, 'last spring') : frostDay(frosts.firstAutumnFrost, 'first autumn');
  return new Date(base + week.weeks * 7 * 86_400_000).getUTCMonth() + 1;
}

/**
 * The months a crop can be eaten: its harvest window's months, then whole months of storage after
 * the window ends (storage_months rounded to the nearest whole month), never more than 12 in all.
 * Example: winter squash (autumn −4 to autumn 0 weeks, keeps 5 months) with frosts 04-20 / 10-15 →
 * { harvest: [9, 10], stored: [11, 12, 1, 2, 3] }
 */
export function eatingMonths(row: Pick<CropTableRow, 'harvestFrom' | 'harvestTo' | 'storageMonths'>, frosts: FrostDates): EatingMonths {
  const first = harvestMonth(row.harvestFrom, frosts);
  const last = harvestMonth(row.harvestTo, frosts);
  const windowLength = ((last - first + 12) % 12) + 1;
  const keeps = Math.max(0, Math.round(row.storageMonths));
  const monthAt = (offset: number) => ((first - 1 + offset) % 12) + 1;
  const harvest = Array.from({ length: windowLength }, (_, i) => monthAt(i));
  const stored = Array.from({ length: Math.min(keeps, 12 - windowLength) }, (_, i) => monthAt(windowLength + i));
  return { harvest, stored };
}

