/**
 * The household's growing season: its last spring frost and first autumn frost, as 'MM-DD', and
 * what follows from them — the dates and months a reference crop is harvested in a given season.
 * The crop table counts harvest weeks from the frost dates (reference-data/crops.csv), so the same
 * row gives June garlic in Kent and December garlic in Canterbury (New Zealand); only the frost
 * dates differ. A household that has not set its own gets a default from its time zone's
 * hemisphere. Pure code: no clock, no database.
 */
import type { HarvestWeek } from './crop-table';
import { daysBetween, isDate, listMonths, monthOf } from './months';

export type Hemisphere = 'northern' | 'southern';

/** A season's two frost dates, each 'MM-DD'. */
export interface FrostDates {
  lastSpringFrost: string;
  firstAutumnFrost: string;
}

/**
 * Default frost dates by hemisphere. Example: `DEFAULT_FROST_DATES.southern.lastSpringFrost` → '11-01'
 * common practice (no published source): a temperate garden's last spring frost falls around the
 * start of May and its first autumn frost around the start of October in the north; the south is
 * the same season shifted by six months. Local dates differ by weeks: the household sets its own.
 */
export const DEFAULT_FROST_DATES: Readonly<Record<Hemisphere, FrostDates>> = {
  northern: { lastSpringFrost: '05-01', firstAutumnFrost: '10-01' },
  southern: { lastSpringFrost: '11-01', firstAutumnFrost: '04-01' },
};

// IANA zones south of the equator, by prefix ('Australia/') or whole name. Tropical zones south of
// the equator are included: their "season" is wet/dry, but the six-month shift is still the better guess.
const SOUTHERN_PREFIXES = ['Australia/', 'Antarctica/', 'America/Argentina/'];
const SOUTHERN_ZONES = new Set([
  'Pacific/Auckland', 'Pacific/Chatham', 'NZ', 'NZ-CHAT', 'Pacific/Norfolk', 'Pacific/Fiji', 'Pacific/Tongatapu', 'Pacific/Noumea',
  'Pacific/Efate', 'Pacific/Apia', 'Pacific/Rarotonga', 'Pacific/Tahiti', 'Pacific/Easter', 'Pacific/Port_Moresby',
  'America/Buenos_Aires', 'America/Cordoba', 'America/Mendoza', 'America/Sao_Paulo', 'America/Santiago', 'America/Punta_Arenas',
  'America/Montevideo', 'America/Asuncion', 'America/La_Paz', 'America/Lima', 'America/Campo_Grande', 'America/Cuiaba',
  'America/Porto_Velho', 'America/Rio_Branco', 'America/Bahia', 'America/Recife', 'America/Maceio', 'America/Araguaina',
  'America/Fortaleza', 'America/Belem', 'America/Noronha', 'America/Guayaquil', 'Atlantic/Stanley', 'Atlantic/South_Georgia',
  'Atlantic/St_Helena', 'Brazil/East', 'Chile/Continental', 'Chile/EasterIsland',
  'Africa/Johannesburg', 'Africa/Maputo', 'Africa/Harare', 'Africa/Lusaka', 'Africa/Gaborone', 'Africa/Windhoek', 'Africa/Maseru',
  'Africa/Mbabane', 'Africa/Blantyre', 'Africa/Lubumbashi', 'Africa/Luanda', 'Africa/Dar_es_Salaam', 'Africa/Kinshasa',
  'Africa/Brazzaville', 'Africa/Bujumbura', 'Africa/Kigali',
  'Indian/Antananarivo', 'Indian/Mauritius', 'Indian/Reunion', 'Indian/Comoro', 'Indian/Mayotte', 'Indian/Kerguelen',
  'Indian/Cocos', 'Indian/Christmas', 'Indian/Chagos', 'Asia/Jakarta', 'Asia/Makassar', 'Asia/Jayapura', 'Asia/Dili',
]);

/**
 * The hemisphere of an IANA time zone, northern unless the zone is known to lie south of the equator.
 * Example: `hemisphereOf('Australia/Hobart')` → 'southern'; `hemisphereOf('Europe/Oslo')` → 'northern'
 */
export function hemisphereOf(timeZone: string): Hemisphere {
  if (SOUTHERN_ZONES.has(timeZone) || SOUTHERN_PREFIXES.some((p) => timeZone.startsWith(p))) return 'southern';
  return 'northern';
}

/** The default frost dates for a time zone. Example: `defaultFrostDates('Pacific/Auckland').firstAutumnFrost` → '04-01' */
export function defaultFrostDates(timeZone: string): FrostDates {
  return DEFAULT_FROST_DATES[hemisphereOf(timeZone)];
}

const MONTH_DAY = /^(\d{2})-(\d{2})$/;
// Days per month in a common year: a frost date must exist every year, so 29 February is refused.
const DAYS = [31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31];

/** True for 'MM-DD' naming a day every year has. Example: `isMonthDay('02-29')` → false */
export function isMonthDay(value: unknown): value is string {
  if (typeof value !== 'string') return false;
  const m = MONTH_DAY.exec(value);
  if (!m) return false;
  const month = Number(m[1]);
  const day = Number(m[2]);
  return month >= 1 && month <= 12 && day >= 1 && day <= DAYS[month - 1]!;
}

/** The household's own frost dates where set, else the default of its time zone's hemisphere, saying which is which. */
export interface SeasonFrostDates extends FrostDates {
  hemisphere: Hemisphere;
  defaults: FrostDates;
  /** True for each date the household set itself. */
  own: { lastSpringFrost: boolean; firstAutumnFrost: boolean };
}

/**
 * Frost dates to use: each stored date, or the hemisphere's default where it is null.
 * Example: `seasonFrostDates({ lastSpringFrost: '04-20', firstAutumnFrost: null }, 'Europe/Paris').firstAutumnFrost` → '10-01'
 */
export function seasonFrostDates(stored: { lastSpringFrost: string | null; firstAutumnFrost: string | null }, timeZone: string): SeasonFrostDates {
  const hemisphere = hemisphereOf(timeZone);
  const defaults = DEFAULT_FROST_DATES[hemisphere];
  return {
    lastSpringFrost: stored.lastSpringFrost ?? defaults.lastSpringFrost,
    firstAutumnFrost: stored.firstAutumnFrost ?? defaults.firstAutumnFrost,
    hemisphere,
    defaults,
    own: { lastSpringFrost: stored.lastSpringFrost !== null, firstAutumnFrost: stored.firstAutumnFrost !== null },
  };
}

/**
 * The two frost dates of season `year` as full dates: the last spring frost in `year`, and the
 * first autumn frost after it — in `year + 1` when its 'MM-DD' comes earlier in the calendar (the
 * southern season runs from November into April).
 * Example: `frostDatesOfSeason(2027, DEFAULT_FROST_DATES.southern)` → { spring: '2027-11-01', autumn: '2028-04-01' }
 */
export function frostDatesOfSeason(year: number, frost: FrostDates): { spring: string; autumn: string } {
  if (!isMonthDay(frost.lastSpringFrost) || !isMonthDay(frost.firstAutumnFrost)) {
    throw new Error(`Frost dates must be written MM-DD, got ${frost.lastSpringFrost} and ${frost.firstAutumnFrost}.`);
  }
  if (!Number.isInteger(year) || year < 1900 || year > 2199) throw new Error(`The season year must be a whole year from 1900 to 2199, got ${year}.`);
  const spring = `${year}-${frost.lastSpringFrost}`;
  const autumnYear = frost.firstAutumnFrost > frost.lastSpringFrost ? year : year + 1;
  return { spring, autumn: `${autumnYear}-${frost.firstAutumnFrost}` };
}

/** A date `days` after (or before, when negative) a 'YYYY-MM-DD' date. Example: `addDays('2026-12-30', 3)` → '2027-01-02' */
export function addDays(date: string, days: number): string {
  if (!isDate(date)) throw new Error(`"${date}" is not a date: write it as YYYY-MM-DD.`);
  const t = Date.UTC(Number(date.slice(0, 4)), Number(date.slice(5, 7)) - 1, Number(date.slice(8, 10))) + days * 86_400_000;
  return new Date(t).toISOString().slice(0, 10);
}

/** A harvest window: first and last day, and every month it touches ('YYYY-MM', in order). */
export interface HarvestWindow {
  from: string;
  to: string;
  months: string[];
}

/**
 * When a reference crop row is harvested in season `year`: each end is its frost date plus the
 * row's weeks (negative weeks fall before the frost).
 * Example: potatoes (spring +8 to autumn +0 weeks), 2026, northern defaults →
 *   { from: '2026-06-26', to: '2026-10-01', months: ['2026-06', '2026-07', '2026-08', '2026-09', '2026-10'] }
 */
export function harvestWindow(row: { harvestFrom: HarvestWeek; harvestTo: HarvestWeek }, year: number, frost: FrostDates): HarvestWindow {
  const dates = frostDatesOfSeason(year, frost);
  const at = (w: HarvestWeek) => addDays(w.frost === 'spring' ? dates.spring : dates.autumn, w.weeks * 7);
  const from = at(row.harvestFrom);
  let to = at(row.harvestTo);
  // A window counted from both frosts can come out reversed when the season is very short; keep it one day long then.
  if (daysBetween(from, to) < 0) to = from;
  return { from, to, months: listMonths(monthOf(from), monthOf(to)) };
}
