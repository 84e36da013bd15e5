/**
 * The one set of rules for a person who eats in the household (not a member who signs in). The
 * people form and the people API validate with these schemas, so a rule is written once.
 *
 * Conventions: an optional field left out, null or (from a form) blank means "not given"; in a
 * patch, null clears a field. A patch is merged onto the stored person and the result is checked
 * with `personInput` again, so rules across fields (age or birth year, from ≤ to) always hold.
 *
 * Dated people (issue 9): exactly one of `ageYears`, `birthYear` and `birthMonth` is given — two
 * could disagree, and needs.ts would silently follow one (the birth month), so two are refused.
 * `pregnancyDueMonth` and `lactationFrom`/`lactationTo` ('YYYY-MM') are for a female person only,
 * with the lactation start no later than its end and an end only after a start; a dated pregnancy
 * or lactation replaces the undated `condition` flag, so the two together are refused too.
 * `fedFromHousehold` is accepted for anyone and stored as given, but counts only while the person
 * is under 6 months (needs.ts): a baby grows out of it, and refusing it then would make an old
 * record fail every later change.
 */
import { z } from 'zod';
import { mustBeNumber, mustBeWhole, oneOf } from './zod-messages';
import { formatCount } from './format-number';
import { lineText } from './text-schemas';
import { isDate, isMonth } from './months';
import { DIETS, type Diet } from './diet';
import type { Person } from './needs';

export { DIETS, type Diet } from './diet';

/** Display names for the diets. Example: `DIET_LABELS.vegetarian` → 'Vegetarian (no meat or fish)' */
export const DIET_LABELS: Readonly<Record<Diet, string>> = {
  omnivore: 'Eats meat or fish',
  vegetarian: 'Vegetarian (no meat or fish)',
};

/** Sexes the DRI tables are split by. Example: `SEXES[0]` → 'female' */
export const SEXES = ['female', 'male'] as const;
export type PersonSex = (typeof SEXES)[number];

/** Activity levels as the API and database name them ('very' = the IOM "very active" category). */
export const ACTIVITY_LEVELS = ['sedentary', 'low', 'active', 'very'] as const;
export type ActivityLevel = (typeof ACTIVITY_LEVELS)[number];

/** Display names for the activity levels. Example: `ACTIVITY_LABELS.low` → 'Low active (a daily walk, garden work)' */
export const ACTIVITY_LABELS: Readonly<Record<ActivityLevel, string>> = {
  sedentary: 'Sedentary (desk and household tasks only)',
  low: 'Low active (a daily walk, garden work)',
  active: 'Active (about an hour of brisk work a day)',
  very: 'Very active (hard physical work most of the day)',
};

/** Pregnancy or lactation change the needs. Example: `CONDITIONS[1]` → 'pregnancy' */
export const CONDITIONS = ['none', 'pregnancy', 'lactation'] as const;
export type PersonCondition = (typeof CONDITIONS)[number];

/** Bounds the schemas enforce. Example: `PERSON_LIMITS.maxAgeYears` → 120 */
export const PERSON_LIMITS = {
  maxNameLength: 120,
  // The DRI tables run to ">70 y"; a typed age beyond a long life is a slip.
  maxAgeYears: 120,
  minBirthYear: 1900,
  maxBirthYear: 2199,
  minHeightCm: 30,
  maxHeightCm: 250,
  minWeightKg: 1,
  maxWeightKg: 350,
  // A stated need below 300 or above 10,000 kcal a day is far outside any published EER.
  minKcalPerDay: 300,
  maxKcalPerDay: 10_000,
  minYear: 1900,
  maxYear: 2199,
} as const;

const L = PERSON_LIMITS;

// Forms send '' for an empty box; the API may send null. Both mean "not given".
const blankToNull = (v: unknown) => (v === '' ? null : v);

function optionalNumber(what: string, min: number, max: number, unit: string, int = false) {
  let n = z.number({ error: mustBeNumber(what) });
  if (int) n = n.int({ error: mustBeWhole(what) });
  n = n
    .min(min, { error: `${what} must be at least ${min}${unit}.` })
    .max(max, { error: `${what} can be at most ${formatCount(max)}${unit}.` });
  return z.preprocess(blankToNull, n.nullable().optional());
}

/** A calendar date 'YYYY-MM-DD' between 1900 and 2199; null or blank = none. Example: `presenceDate.parse('2026-06-01')` → '2026-06-01' */
export const presenceDate = z
  .preprocess(
    blankToNull,
    z
      .string({ error: 'Enter the date as YYYY-MM-DD.' })
      .trim()
      .refine(isDate, { error: 'Write a date that exists, as YYYY-MM-DD (for example 2026-06-01).', abort: true })
      .refine((d) => Number(d.slice(0, 4)) >= L.minYear && Number(d.slice(0, 4)) <= L.maxYear, {
        error: `The year must be between ${L.minYear} and ${L.maxYear}.`,
      })
      .nullable()
      .optional(),
  );

/**
 * A month 'YYYY-MM' between 1900 and 2199; null or blank = none,
 * e.g. personMonth('The birth month').parse('2025-11') → '2025-11'.
 */
export function personMonth(what: string) {
  return z.preprocess(
    blankToNull,
    z
      .string({ error: `Enter ${what.toLowerCase()} as YYYY-MM.` })
      .trim()
      .refine(isMonth, { error: `Write ${what.toLowerCase()} as a real month, YYYY-MM (for example 2026-06).`, abort: true })
      .refine((m) => Number(m.slice(0, 4)) >= L.minYear && Number(m.slice(0, 4)) <= L.maxYear, {
        error: `The year of ${what.toLowerCase()} must be between ${L.minYear} and ${L.maxYear}.`,
      })
      .nullable()
      .optional(),
  );
}

const fields = {
  name: lineText('The name', L.maxNameLength, 'Give the person a name.').min(1, { error: 'Give the person a name.' }),
  sex: z.enum(SEXES, { error: 'Choose female or male (the reference intakes are given by sex).' }),
  ageYears: optionalNumber('The age', 0, L.maxAgeYears, ' years'),
  birthYear: optionalNumber('The birth year', L.minBirthYear, L.maxBirthYear, '', true),
  heightCm: optionalNumber('The height', L.minHeightCm, L.maxHeightCm, ' cm'),
  weightKg: optionalNumber('The weight', L.minWeightKg, L.maxWeightKg, ' kg'),
  activity: z.preprocess(
    (v) => (v === '' || v == null ? undefined : v),
    z.enum(ACTIVITY_LEVELS, { error: oneOf('The activity', ACTIVITY_LEVELS) }).default('low'),
  ),
  condition: z.preprocess(
    (v) => (v === '' || v == null ? undefined : v),
    z.enum(CONDITIONS, { error: oneOf('The condition', CONDITIONS) }).default('none'),
  ),
  kcalPerDay: optionalNumber('The stated energy need', L.minKcalPerDay, L.maxKcalPerDay, ' kcal a day'),
  atHomePct: z.preprocess(
    (v) => (v === '' || v == null ? undefined : v),
    z
      .number({ error: 'The share of meals at home must be a number of percent.' })
      .min(0, { error: 'The share of meals at home is at least 0 %.' })
      .max(100, { error: 'The share of meals at home is at most 100 %.' })
      .default(100),
  ),
  presentFrom: presenceDate,
  presentTo: presenceDate,
  birthMonth: personMonth('The birth month'),
  pregnancyDueMonth: personMonth('The due month'),
  lactationFrom: personMonth('The month breastfeeding began'),
  lactationTo: personMonth('The month breastfeeding ended'),
  fedFromHousehold: z.preprocess(
    (v) => (v === '' || v == null ? undefined : v),
    z.boolean({ error: 'Say true or false for whether the baby is fed from the household’s food.' }).default(false),
  ),
  diet: z.preprocess(
    (v) => (v === '' || v == null ? undefined : v),
    z.enum(DIETS, { error: oneOf('The diet', DIETS) }).default('omnivore'),
  ),
};

type Ctx = z.RefinementCtx;

interface CrossFields {
  sex: PersonSex;
  ageYears: number | null;
  birthYear: number | null;
  condition: PersonCondition;
  presentFrom: string | null;
  presentTo: string | null;
  birthMonth: string | null;
  pregnancyDueMonth: string | null;
  lactationFrom: string | null;
  lactationTo: string | null;
}

/** The youngest age with DRI pregnancy and lactation rows (National Academies DRI tables: 14–18 y and 19–50 y). */
export const PREGNANCY_MIN_AGE_YEARS = 14;

/** The field to flag when pregnancy or breastfeeding is given for someone under 14 at that time, else null. */
function youngerThanPregnancyRows(p: CrossFields): 'condition' | 'pregnancyDueMonth' | 'lactationFrom' | null {
  const yearsAt = (month: string): number | null => {
    if (p.birthMonth != null) {
      const [by, bm] = p.birthMonth.split('-').map(Number) as [number, number];
      const [y, m] = month.split('-').map(Number) as [number, number];
      return (y * 12 + m - (by * 12 + bm)) / 12;
    }
    if (p.birthYear != null) return Number(month.slice(0, 4)) - p.birthYear;
    return p.ageYears;
  };
  for (const key of ['pregnancyDueMonth', 'lactationFrom'] as const) {
    const month = p[key];
    const age = month == null ? null : yearsAt(month);
    if (age !== null && age < PREGNANCY_MIN_AGE_YEARS) return key;
  }
  if (p.condition !== 'none' && p.ageYears != null && p.ageYears < PREGNANCY_MIN_AGE_YEARS) return 'condition';
  return null;
}

// The rules that look at more than one field.
function checkPerson(p: CrossFields, ctx: Ctx): void {
  if (p.ageYears == null && p.birthYear == null && p.birthMonth == null) {
    ctx.addIssue({ code: 'custom', path: ['ageYears'], message: 'Give the age in years, the birth year or the birth month.' });
  }
  if (p.ageYears != null && p.birthYear != null) {
    // Two ages could disagree; the needs would silently follow one of them.
    ctx.addIssue({ code: 'custom', path: ['birthYear'], message: 'Give the age or the birth year, not both.' });
  }
  if (p.birthMonth != null && (p.ageYears != null || p.birthYear != null)) {
    ctx.addIssue({ code: 'custom', path: ['birthMonth'], message: 'Give the birth month alone: clear the age and the birth year.' });
  }
  if (p.condition !== 'none' && p.sex !== 'female') {
    ctx.addIssue({ code: 'custom', path: ['condition'], message: 'Pregnancy and lactation apply to a female person only.' });
  }
  if (p.sex !== 'female') {
    for (const key of ['pregnancyDueMonth', 'lactationFrom', 'lactationTo'] as const) {
      if (p[key] != null) ctx.addIssue({ code: 'custom', path: [key], message: 'Pregnancy and breastfeeding apply to a female person only; clear this month.' });
    }
  }
  // The DRI tables give pregnancy and lactation rows from 14 years; younger, no published value applies.
  const young = youngerThanPregnancyRows(p);
  if (young) ctx.addIssue({ code: 'custom', path: [young], message: `The reference intakes for pregnancy and breastfeeding start at ${PREGNANCY_MIN_AGE_YEARS} years of age; for someone younger, ask a physician or registered dietitian and leave this empty.` });
  const dated = p.pregnancyDueMonth != null || p.lactationFrom != null;
  if (dated && p.condition !== 'none') {
    // The dated months replace the flag (life-stage.ts); keeping both would leave one silently unused.
    ctx.addIssue({ code: 'custom', path: ['condition'], message: 'With a due month or breastfeeding months given, set the condition to none: the months say when it applies.' });
  }
  if (p.lactationTo != null && p.lactationFrom == null) {
    ctx.addIssue({ code: 'custom', path: ['lactationFrom'], message: 'Give the month breastfeeding began as well as the month it ended.' });
  }
  if (p.lactationFrom != null && p.lactationTo != null && p.lactationFrom > p.lactationTo) {
    ctx.addIssue({ code: 'custom', path: ['lactationTo'], message: 'Breastfeeding ends before it begins; swap the two months.' });
  }
  if (p.presentFrom && p.presentTo && p.presentFrom > p.presentTo) {
    ctx.addIssue({ code: 'custom', path: ['presentTo'], message: 'The last day present comes before the first; swap them.' });
  }
}

/**
 * A whole person as created (POST) or after a patch is merged,
 * e.g. personInput.parse({ name: 'Ada', sex: 'female', ageYears: 34 }).atHomePct → 100.
 */
export const personInput = z
  .strictObject(fields)
  .transform((p) => ({
    ...p,
    ageYears: p.ageYears ?? null,
    birthYear: p.birthYear ?? null,
    heightCm: p.heightCm ?? null,
    weightKg: p.weightKg ?? null,
    kcalPerDay: p.kcalPerDay ?? null,
    presentFrom: p.presentFrom ?? null,
    presentTo: p.presentTo ?? null,
    birthMonth: p.birthMonth ?? null,
    pregnancyDueMonth: p.pregnancyDueMonth ?? null,
    lactationFrom: p.lactationFrom ?? null,
    lactationTo: p.lactationTo ?? null,
  }))
  .superRefine(checkPerson);

export type PersonInput = z.output<typeof personInput>;

/**
 * A change to a person: any of the fields, null clears an optional one; at least one field,
 * e.g. personPatch.parse({ atHomePct: 50 }) → { atHomePct: 50 }.
 */
export const personPatch = z
  .strictObject({
    name: fields.name.optional(),
    sex: fields.sex.optional(),
    ageYears: fields.ageYears,
    birthYear: fields.birthYear,
    heightCm: fields.heightCm,
    weightKg: fields.weightKg,
    activity: z.enum(ACTIVITY_LEVELS, { error: oneOf('The activity', ACTIVITY_LEVELS) }).optional(),
    condition: z.enum(CONDITIONS, { error: oneOf('The condition', CONDITIONS) }).optional(),
    kcalPerDay: fields.kcalPerDay,
    atHomePct: z
      .number({ error: 'The share of meals at home must be a number of percent.' })
      .min(0, { error: 'The share of meals at home is at least 0 %.' })
      .max(100, { error: 'The share of meals at home is at most 100 %.' })
      .optional(),
    presentFrom: fields.presentFrom,
    presentTo: fields.presentTo,
    birthMonth: fields.birthMonth,
    pregnancyDueMonth: fields.pregnancyDueMonth,
    lactationFrom: fields.lactationFrom,
    lactationTo: fields.lactationTo,
    fedFromHousehold: z.boolean({ error: 'Say true or false for whether the baby is fed from the household’s food.' }).optional(),
    diet: z.enum(DIETS, { error: oneOf('The diet', DIETS) }).optional(),
  })
  .refine((v) => Object.values(v).some((x) => x !== undefined), { message: 'Nothing to change: give at least one field.' });

export type PersonPatch = z.output<typeof personPatch>;

/** The stored fields of a person, as the API returns them (before derived values are added). */
export type PersonFields = PersonInput;

/**
 * A patch applied to a stored person (fields left out stay), ready to be checked with personInput,
 * e.g. mergePerson({ name: 'Ada', …, ageYears: 34 }, { ageYears: null, birthYear: 1992 }).birthYear → 1992.
 */
export function mergePerson(current: PersonFields, patch: PersonPatch): Record<string, unknown> {
  const out: Record<string, unknown> = { ...current };
  for (const [k, v] of Object.entries(patch)) if (v !== undefined) out[k] = v;
  return out;
}

// ---------------------------------------------------------------------------------------------
// To the needs model (src/lib/needs.ts), whose names follow the IOM equations

const EER_ACTIVITY = { sedentary: 'sedentary', low: 'low', active: 'active', very: 'very_active' } as const;

/**
 * A stored person as needs.ts counts them: activity 'very' is the IOM "very active" category and
 * condition 'none' is no condition; the dated fields, the feeding of a baby and the diet pass as stored,
 * e.g. needsPerson({ sex: 'male', ageYears: 40, activity: 'very', condition: 'none', … }).activity → 'very_active'.
 */
export function needsPerson(p: PersonFields): Person {
  return {
    sex: p.sex,
    ageYears: p.ageYears,
    birthYear: p.birthYear,
    heightCm: p.heightCm,
    weightKg: p.weightKg,
    activity: EER_ACTIVITY[p.activity],
    condition: p.condition === 'none' ? null : p.condition,
    kcalPerDay: p.kcalPerDay,
    atHomePct: p.atHomePct,
    presentFrom: p.presentFrom,
    presentTo: p.presentTo,
    birthMonth: p.birthMonth,
    pregnancyDueMonth: p.pregnancyDueMonth,
    lactationFrom: p.lactationFrom,
    lactationTo: p.lactationTo,
    fedFromHousehold: p.fedFromHousehold,
    diet: p.diet,
  };
}
