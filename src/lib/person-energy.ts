/**
 * A person's daily energy need as the people page shows it: the value, whether it is stated by the
 * household or estimated by the IOM 2005 EER equations, and what the estimate assumed.
 */
import { lifeStageIn } from './life-stage';
import { EXCLUSIVE_MILK_AGE_YEARS, type Person } from './needs';
import { dailyNeed } from './requirements';

export interface PersonEnergy {
  /** kcal per day (before the share of meals at home). */
  kcalPerDay: number;
  basis: 'EER' | 'stated';
  source: string;
  /** Age used, in years (from the birth month in months, the birth year in the month's year, or as given). */
  ageYears: number;
  /** kcal per day eaten from the household's food: kcalPerDay × atHomePct / 100; 0 for a baby under 6 months not fed from it. */
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
  const stage = lifeStageIn(person, month); // dated pregnancy and lactation set their increment for the month
  if (!stage) return null;
  const need = dailyNeed({ ...person, ...stage }, 'energy_kcal');
  if (!need) return null;
  const pct = person.atHomePct ?? 100;
  const onMilk = stage.ageYears < EXCLUSIVE_MILK_AGE_YEARS && person.fedFromHousehold !== true;
  return {
    kcalPerDay: need.value,
    basis: need.basis === 'stated' ? 'stated' : 'EER',
    source: need.source,
    ageYears: stage.ageYears,
    atHomeKcalPerDay: onMilk ? 0 : (need.value * pct) / 100,
    notes: onMilk ? [...need.notes, 'under 6 months and not fed from the household: breast milk is not household food'] : need.notes,
  };
}
