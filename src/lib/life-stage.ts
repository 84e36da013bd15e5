/**
 * Where a person stands in a given month: age, and whether they are pregnant (which trimester)
 * or breastfeeding (which half of the first year). A person may be dated — a birth month, a due
 * month, lactation from/to — so the DRI life-stage group changes in the month it should, not on
 * 1 January, and a pregnancy is counted only in its own months instead of as a flag left on all
 * year. Undated people (ageYears, birthYear, a condition flag) are read as before.
 */
import type { Condition } from './eer';
import { isMonth, monthIndex, parseMonth } from './months';

export interface DatedPerson {
  /** Age as given; used when neither birthMonth nor birthYear is given. */
  ageYears?: number | null;
  /** Age in a month is that month's year − birthYear (a whole calendar year shares one age). */
  birthYear?: number | null;
  /** 'YYYY-MM': age is counted in months; wins over birthYear and ageYears. */
  birthMonth?: string | null;
  /** Undated condition, as given; ignored when the pregnancy or lactation is dated. */
  condition?: Condition | null;
  trimester?: 1 | 2 | 3 | null;
  lactationPeriod?: 'first6' | 'second6' | null;
  /** 'YYYY-MM' the baby is due: pregnant in that month and the eight before it. */
  pregnancyDueMonth?: string | null;
  /** 'YYYY-MM', both included; without an end, lactation lasts the first year (12 months). */
  lactationFrom?: string | null;
  lactationTo?: string | null;
}

export interface LifeStage {
  /** Age in years (fractional when counted from a birth month). */
  ageYears: number;
  condition: Condition | null;
  trimester: 1 | 2 | 3 | null;
  lactationPeriod: 'first6' | 'second6' | null;
}

function checkedMonth(value: string, name: string): number {
  if (!isMonth(value)) throw new RangeError(`${name} must be a month written YYYY-MM, got "${value}".`);
  return monthIndex(value);
}

/**
 * Whole months from a birth month to a month, negative before birth,
 * e.g. ageInMonths('2026-01', '2026-07') → 6; ageInMonths('2026-01', '2025-12') → -1.
 */
export function ageInMonths(birthMonth: string, month: string): number {
  return checkedMonth(month, 'The month') - checkedMonth(birthMonth, 'The birth month');
}

/**
 * The age used for a person in a month, in years, negative before birth: from the birth month in
 * months (a baby born in January is 0.5 years in July), else the month's year − birthYear, else
 * ageYears as given, e.g. ageYearsIn({ birthMonth: '2007-06' }, '2026-06') → 19.
 */
export function ageYearsIn(person: Pick<DatedPerson, 'ageYears' | 'birthYear' | 'birthMonth'>, month: string): number {
  if (person.birthMonth != null) return ageInMonths(person.birthMonth, month) / 12;
  if (person.birthYear != null) {
    if (!Number.isInteger(person.birthYear)) throw new RangeError(`The birth year must be a whole year, got ${person.birthYear}.`);
    return parseMonth(month).year - person.birthYear;
  }
  if (person.ageYears != null) return person.ageYears;
  throw new RangeError('A person needs an age: give ageYears or birthYear, or a birthMonth.');
}

/**
 * The trimester in a month of a pregnancy due in `dueMonth`, or null outside it. Nine months
 * are counted, three to each trimester (about 13 weeks each of a 40-week pregnancy; common
 * practice, no published source for the split by calendar month),
 * e.g. trimesterIn('2027-06', '2026-10') → 1; trimesterIn('2027-06', '2027-06') → 3; trimesterIn('2027-06', '2027-07') → null.
 */
export function trimesterIn(dueMonth: string, month: string): 1 | 2 | 3 | null {
  const before = checkedMonth(dueMonth, 'The due month') - checkedMonth(month, 'The month');
  if (before < 0 || before > 8) return null;
  return before >= 6 ? 1 : before >= 3 ? 2 : 3;
}

/**
 * The lactation period in a month of breastfeeding from `from` to `to` (both included; no end =
 * the first 12 months), or null outside it: months 0–5 'first6', from month 6 'second6' (the
 * 0–6 / 7–12 month groups of the IOM 2005 energy increments; past 12 months the second is kept),
 * e.g. lactationPeriodIn('2027-06', null, '2027-12') → 'second6'.
 */
export function lactationPeriodIn(from: string, to: string | null | undefined, month: string): 'first6' | 'second6' | null {
  const start = checkedMonth(from, 'The lactation start');
  const end = to == null ? start + 11 : checkedMonth(to, 'The lactation end');
  if (end < start) throw new RangeError(`The lactation end (${to}) must not be before its start (${from}).`);
  const m = checkedMonth(month, 'The month');
  if (m < start || m > end) return null;
  return m - start < 6 ? 'first6' : 'second6';
}

/**
 * A person's age and condition in a month, or null before they are born. A dated lactation wins
 * over a pregnancy in a month both cover (the baby has come); a dated pregnancy or lactation
 * replaces the undated condition flag,
 * e.g. lifeStageIn({ ageYears: 30, pregnancyDueMonth: '2027-06' }, '2027-01') → { ageYears: 30, condition: 'pregnancy', trimester: 2, lactationPeriod: null }.
 */
export function lifeStageIn(person: DatedPerson, month: string): LifeStage | null {
  const ageYears = ageYearsIn(person, month);
  if (ageYears < 0) return null;
  const dated = person.pregnancyDueMonth != null || person.lactationFrom != null;
  if (!dated) {
    const condition = person.condition ?? null;
    return {
      ageYears,
      condition,
      trimester: condition === 'pregnancy' ? (person.trimester ?? null) : null,
      lactationPeriod: condition === 'lactation' ? (person.lactationPeriod ?? null) : null,
    };
  }
  const period = person.lactationFrom != null ? lactationPeriodIn(person.lactationFrom, person.lactationTo, month) : null;
  if (period) return { ageYears, condition: 'lactation', trimester: null, lactationPeriod: period };
  const trimester = person.pregnancyDueMonth != null ? trimesterIn(person.pregnancyDueMonth, month) : null;
  if (trimester) return { ageYears, condition: 'pregnancy', trimester, lactationPeriod: null };
  return { ageYears, condition: null, trimester: null, lactationPeriod: null };
}
