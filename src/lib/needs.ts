/**
 * A household's need per month: each person's daily need × the days they are present in the month
 * × the share of their meals eaten at home, summed over people.
 *
 * People may be dated (life-stage.ts): no need before birth, the DRI group changing in the month
 * of the birthday, pregnancy and lactation only in their own months. A baby under 6 months adds
 * nothing unless marked `fedFromHousehold` (breast milk is not household food, and the mother's
 * lactation increment is already counted). A person with no published value for a nutrient (an
 * infant's fibre is "not determined") adds nothing for it rather than making the household's need
 * unknown; the need is unknown only when nobody at home that month has a value.
 */
import { ageYearsIn, lifeStageIn, type DatedPerson, type LifeStage } from './life-stage';
import { daysInMonth, overlapDays } from './months';
import type { NutrientKey } from './nutrients';
import { dailyNeed, type DailyNeed, type RequirementPerson } from './requirements';

/** A person who eats in the household. */
export interface Person extends Omit<RequirementPerson, 'ageYears'>, DatedPerson {
  /** Share of meals eaten at home, 0–100; default 100. */
  atHomePct?: number | null;
  /** 'YYYY-MM-DD', both included; a missing end is open. */
  presentFrom?: string | null;
  presentTo?: string | null;
  /** A baby under 6 months counts only when fed from the household's food (formula, solids); default false. */
  fedFromHousehold?: boolean | null;
}

/** Below this age (years) a baby is taken to live on breast milk unless fedFromHousehold. */
export const EXCLUSIVE_MILK_AGE_YEARS = 0.5;

/** A household's need in a month for one nutrient. */
export interface MonthNeed {
  /** The recommended intake summed over people (for carbohydrate and fat the low end of the AMDR); null when nobody at home has a value. */
  need: number | null;
  /** AMDR range in grams summed over people; null unless someone at home has a range (others add their value to both ends). */
  needLow: number | null;
  needHigh: number | null;
  /** People at home that month without a published value for this nutrient (they add nothing). */
  peopleWithoutValue: number;
}

/**
 * The age used for a person in a month, in years: from birthMonth in whole months, else the
 * month's year − birthYear, else ageYears as given (negative before birth),
 * e.g. ageInMonth({ sex: 'female', birthYear: 1990 }, '2026-03') → 36.
 */
export function ageInMonth(person: Pick<Person, 'ageYears' | 'birthYear' | 'birthMonth'>, month: string): number {
  return ageYearsIn(person, month);
}

/**
 * Days of a month a person counts as eating at home: days present × atHomePct / 100 (0 before
 * birth), e.g. homeDays({ sex: 'male', ageYears: 40, atHomePct: 50, presentFrom: '2026-03-17' }, '2026-03') → 7.5.
 */
export function homeDays(person: Person, month: string): number {
  const pct = person.atHomePct ?? 100;
  if (!Number.isFinite(pct) || pct < 0 || pct > 100) throw new RangeError(`atHomePct must be from 0 to 100, got ${pct}`);
  if (lifeStageIn(person, month) === null) return 0; // not yet born: not yet eating
  return (overlapDays(month, person.presentFrom, person.presentTo) * pct) / 100;
}

/**
 * Whether a person eats from the household's food in a month at all: present, born, and not a
 * baby under 6 months on breast milk, e.g. eatsHouseholdFood({ sex: 'male', birthMonth: '2026-09' }, '2026-11') → false.
 */
export function eatsHouseholdFood(person: Person, month: string): boolean {
  const stage = lifeStageIn(person, month);
  if (!stage || homeDays(person, month) === 0) return false;
  return stage.ageYears >= EXCLUSIVE_MILK_AGE_YEARS || person.fedFromHousehold === true;
}

type PersonMonthNeed = { need: number; low: number; high: number | null } | null;

/**
 * Daily needs already worked out, by person and life stage: a report asks for the same person at
 * the same stage month after month, so monthlyNeedDetails can take one memo for all its months.
 */
export type NeedMemo = WeakMap<Person, Map<string, Map<NutrientKey, DailyNeed | null>>>;

/** A fresh memo for one run of months, e.g. monthlyNeedDetails(people, month, keys, memo) for each month of a report. */
export function needMemo(): NeedMemo {
  return new WeakMap();
}

function stageNeeds(memo: NeedMemo | undefined, person: Person, stage: LifeStage): Map<NutrientKey, DailyNeed | null> {
  if (!memo) return new Map();
  let byStage = memo.get(person);
  if (!byStage) memo.set(person, (byStage = new Map()));
  const key = `${stage.ageYears}|${stage.condition}|${stage.trimester}|${stage.lactationPeriod}`;
  let needs = byStage.get(key);
  if (!needs) byStage.set(key, (needs = new Map()));
  return needs;
}

/**
 * A person's daily needs at a life stage (dailyNeed per key), from the memo when it has them,
 * e.g. stageDailyNeeds(person, lifeStageIn(person, '2026-03')!, ['protein_g'], memo).get('protein_g')?.value.
 */
export function stageDailyNeeds(person: Person, stage: LifeStage, keys: readonly NutrientKey[], memo?: NeedMemo): Map<NutrientKey, DailyNeed | null> {
  const known = stageNeeds(memo, person, stage);
  let who: RequirementPerson | null = null;
  for (const key of keys) {
    if (!known.has(key)) known.set(key, dailyNeed((who ??= { ...person, ...stage } as RequirementPerson), key));
  }
  return known;
}

function personMonthDetails<K extends NutrientKey>(person: Person, month: string, keys: readonly K[], memo?: NeedMemo): Record<K, PersonMonthNeed> | 'absent' {
  if (!eatsHouseholdFood(person, month)) return 'absent';
  const stage = lifeStageIn(person, month)!;
  const days = homeDays(person, month);
  const known = stageDailyNeeds(person, stage, keys, memo);
  const out = {} as Record<K, PersonMonthNeed>;
  for (const key of keys) {
    const need = known.get(key)!;
    out[key] = need === null ? null : { need: need.value * days, low: (need.range?.low ?? need.value) * days, high: need.range ? need.range.high * days : null };
  }
  return out;
}

/**
 * One person's need in a month per nutrient: daily need × homeDays; null when the DRI set no
 * value for them; 0 when they are not at home that month, not yet born, or a baby under 6 months
 * not fed from the household,
 * e.g. personMonthNeeds({ sex: 'female', ageYears: 25 }, '2026-02', ['protein_g']) → { protein_g: 1288 } (46 g × 28 days).
 */
export function personMonthNeeds<K extends NutrientKey>(person: Person, month: string, keys: readonly K[]): Record<K, number | null> {
  const details = personMonthDetails(person, month, keys);
  const out = {} as Record<K, number | null>;
  for (const key of keys) out[key] = details === 'absent' ? 0 : (details[key]?.need ?? null);
  return out;
}

/**
 * The household's need in a month per nutrient with its AMDR range, summed over the people who
 * eat from its food that month. Someone without a published value adds nothing (and is counted
 * in peopleWithoutValue); the need is null only when nobody at home has a value; with nobody at
 * home it is 0,
 * e.g. monthlyNeedDetails([{ sex: 'male', ageYears: 30, kcalPerDay: 2000 }], '2026-04', ['fat_g']).fat_g
 * → { need: 1333.3, needLow: 1333.3, needHigh: 2333.3, peopleWithoutValue: 0 } (20–35 % of 2000 kcal at 9 kcal/g × 30 days).
 */
export function monthlyNeedDetails<K extends NutrientKey>(people: readonly Person[], month: string, keys: readonly K[], memo?: NeedMemo): Record<K, MonthNeed> {
  daysInMonth(month); // validates the month even for an empty household
  const perPerson: Record<K, PersonMonthNeed>[] = [];
  for (const person of people) {
    const d = personMonthDetails(person, month, keys, memo);
    if (d !== 'absent') perPerson.push(d);
  }
  const out = {} as Record<K, MonthNeed>;
  // Plain loops, people in order (the same sums as adding their needs one by one): a report asks for every month.
  for (const key of keys) {
    let known = 0;
    let ranged = false;
    let need = 0;
    let low = 0;
    let high = 0;
    for (const d of perPerson) {
      const n = d[key];
      if (n === null) continue;
      known += 1;
      if (n.high !== null) ranged = true;
      need += n.need;
      low += n.low;
      high += n.high ?? n.need;
    }
    const withoutValue = perPerson.length - known;
    if (perPerson.length > 0 && known === 0) {
      out[key] = { need: null, needLow: null, needHigh: null, peopleWithoutValue: withoutValue };
      continue;
    }
    out[key] = { need, needLow: ranged ? low : null, needHigh: ranged ? high : null, peopleWithoutValue: withoutValue };
  }
  return out;
}

/**
 * The household's need in a month per nutrient (the `need` of monthlyNeedDetails),
 * e.g. monthlyNeeds([{ sex: 'female', ageYears: 25 }, { sex: 'male', ageYears: 25 }], '2026-01', ['protein_g']) → { protein_g: 3162 }.
 */
export function monthlyNeeds<K extends NutrientKey>(people: readonly Person[], month: string, keys: readonly K[]): Record<K, number | null> {
  const details = monthlyNeedDetails(people, month, keys);
  const out = {} as Record<K, number | null>;
  for (const key of keys) out[key] = details[key].need;
  return out;
}
