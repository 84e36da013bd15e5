/**
 * A household's need per month: each person's daily need × the days they are present in the month
 * × the share of their meals eaten at home, summed over people.
 */
import { daysInMonth, overlapDays, parseMonth } from './months';
import type { NutrientKey } from './nutrients';
import { dailyNeed, type RequirementPerson } from './requirements';

/** A person who eats in the household. */
export interface Person extends Omit<RequirementPerson, 'ageYears'> {
  /** Age as given; used when birthYear is absent. */
  ageYears?: number | null;
  /** When given, the age in a month is the month's year − birthYear. */
  birthYear?: number | null;
  /** Share of meals eaten at home, 0–100; default 100. */
  atHomePct?: number | null;
  /** 'YYYY-MM-DD', both included; a missing end is open. */
  presentFrom?: string | null;
  presentTo?: string | null;
}

/**
 * The age used for a person in a month: year of the month − birthYear if a birth year is given
 * (so a whole calendar year shares one age), else ageYears as given,
 * e.g. ageInMonth({ sex: 'female', birthYear: 1990 }, '2026-03') → 36.
 */
export function ageInMonth(person: Pick<Person, 'ageYears' | 'birthYear'>, month: string): number {
  if (person.birthYear != null) {
    if (!Number.isInteger(person.birthYear)) throw new RangeError(`birthYear must be a whole year, got ${person.birthYear}`);
    return parseMonth(month).year - person.birthYear;
  }
  if (person.ageYears != null) return person.ageYears;
  throw new RangeError('a person needs ageYears or birthYear');
}

/**
 * Days of a month a person counts as eating at home: days present × atHomePct / 100 (0 before
 * birth), e.g. homeDays({ sex: 'male', ageYears: 40, atHomePct: 50, presentFrom: '2026-03-17' }, '2026-03') → 7.5.
 */
export function homeDays(person: Person, month: string): number {
  const pct = person.atHomePct ?? 100;
  if (!Number.isFinite(pct) || pct < 0 || pct > 100) throw new RangeError(`atHomePct must be from 0 to 100, got ${pct}`);
  if (ageInMonth(person, month) < 0) return 0; // born after this month's year began: not yet eating
  return (overlapDays(month, person.presentFrom, person.presentTo) * pct) / 100;
}

/**
 * One person's need in a month per nutrient: daily need × homeDays; null when the DRI set no
 * need for them; 0 when they are not at home that month,
 * e.g. personMonthNeeds({ sex: 'female', ageYears: 25 }, '2026-02', ['protein_g']) → { protein_g: 1288 } (46 g × 28 days).
 */
export function personMonthNeeds<K extends NutrientKey>(person: Person, month: string, keys: readonly K[]): Record<K, number | null> {
  const days = homeDays(person, month);
  const out = {} as Record<K, number | null>;
  if (days === 0) {
    for (const key of keys) out[key] = 0;
    return out;
  }
  const who: RequirementPerson = { ...person, ageYears: ageInMonth(person, month) };
  for (const key of keys) {
    const need = dailyNeed(who, key);
    out[key] = need === null ? null : need.value * days;
  }
  return out;
}

/**
 * The household's need in a month per nutrient, summed over people. If anyone at home that
 * month has no published need for a nutrient, the household's need is unknown (null) rather
 * than a partial sum; with nobody at home it is 0,
 * e.g. monthlyNeeds([{ sex: 'female', ageYears: 25 }, { sex: 'male', ageYears: 25 }], '2026-01', ['protein_g']) → { protein_g: 3162 }.
 */
export function monthlyNeeds<K extends NutrientKey>(people: readonly Person[], month: string, keys: readonly K[]): Record<K, number | null> {
  daysInMonth(month); // validates the month even for an empty household
  const out = {} as Record<K, number | null>;
  for (const key of keys) out[key] = 0;
  for (const person of people) {
    const needs = personMonthNeeds(person, month, keys);
    for (const key of keys) {
      const sum = out[key];
      const add = needs[key];
      out[key] = sum === null || add === null ? null : sum + add;
    }
  }
  return out;
}
