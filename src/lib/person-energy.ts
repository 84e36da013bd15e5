/**
 * A person's daily energy need as the people page shows it: the value, whether it is stated by the
 * household or estimated by the IOM 2005 EER equations, and what the estimate assumed.
 */
import { ageInMonth, type Person } from './needs';
import { dailyNeed } from './requirements';

export interface PersonEnergy {
  /** kcal per day (before the share of meals at home). */
  kcalPerDay: number;
  basis: 'EER' | 'stated';
  source: string;
  /** Age used, in years (from the birth year in the month's year, or as given). */
  ageYears: number;
  /** kcal per day eaten from the household's food: kcalPerDay × atHomePct / 100. */
  atHomeKcalPerDay: number;
  /** Assumptions behind an estimate (reference height or weight, default activity…). */
  notes: string[];
}

/**
 * Daily energy need of a person in a month, or null when they are not yet born then,
 * e.g. personEnergy({ sex: 'female', ageYears: 30, kcalPerDay: 2100, atHomePct: 50 }, '2026-05') →
 * { kcalPerDay: 2100, basis: 'stated', atHomeKcalPerDay: 1050, … }.
 */
export function personEnergy(person: Person, month: string): PersonEnergy | null {
  const age = ageInMonth(person, month);
  if (age < 0) return null;
  const need = dailyNeed({ ...person, ageYears: age }, 'energy_kcal');
  if (!need) return null;
  const pct = person.atHomePct ?? 100;
  return {
    kcalPerDay: need.value,
    basis: need.basis === 'stated' ? 'stated' : 'EER',
    source: need.source,
    ageYears: age,
    atHomeKcalPerDay: (need.value * pct) / 100,
    notes: need.notes,
  };
}
