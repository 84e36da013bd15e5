/**
 * What the people form holds and how it becomes the API's body. The form keeps what was typed,
 * in the household's units (feet, inches and pounds in a US-units household); the API stays
 * metric, so the body converts with the exact factors of src/lib/body-units.ts. The body is
 * checked with `personInput`, the schema the people API parses with, plus the two things only
 * the form asks for: a due month once "pregnant" is ticked, a start once "breastfeeding" is.
 */
import { zodResolver } from '@hookform/resolvers/zod';
import type { FieldErrors as FieldErrorsOf, Resolver, ResolverResult } from 'react-hook-form';
import { feetInchesToCm, cmToFeetInches, kgToPounds, poundsToKg } from '@/lib/body-units';
import { heightText, weightText } from '@/lib/body-plausibility';
import { ageYearsIn } from '@/lib/life-stage';
import { isMonth } from '@/lib/months';
import { PERSON_LIMITS, personInput, type PersonFields, type PersonInput } from '@/lib/people-schemas';
import type { UnitSystem } from '@/lib/units';
import { parseDecimal } from '@/components/entries/quantity-text';

/** How the age is given: in years, by birth year, or by birth month (counted in months). */
export type AgeKind = 'age' | 'birthYear' | 'birthMonth';

/** The form's values: typed text named as the API names the fields, the US boxes and the ticks. */
export interface PersonDraft {
  name: string;
  sex: string;
  ageKind: AgeKind;
  ageYears: string;
  birthYear: string;
  birthMonth: string;
  heightCm: string;
  weightKg: string;
  heightFt: string;
  heightIn: string;
  weightLb: string;
  activity: string;
  pregnant: boolean;
  pregnancyDueMonth: string;
  breastfeeding: boolean;
  lactationFrom: string;
  lactationTo: string;
  fedFromHousehold: boolean;
  diet: string;
  kcalPerDay: string;
  atHomePct: string;
  presentFrom: string;
  presentTo: string;
}

/** What the form knows besides what is typed: the household's units and the current month. */
export interface PersonFormContext {
  units: UnitSystem;
  month: string;
}

const text = (v: number | string | null | undefined) => (v == null ? '' : String(v));

/** The form as it opens, for a new person or a stored one, in the household's units. */
export function draftOf(p: PersonFields | undefined, units: UnitSystem): PersonDraft {
  const fi = p?.heightCm != null ? cmToFeetInches(p.heightCm) : null;
  return {
    name: p?.name ?? '',
    sex: p?.sex ?? 'female',
    ageKind: p?.birthMonth != null ? 'birthMonth' : p?.birthYear != null ? 'birthYear' : 'age',
    ageYears: text(p?.ageYears),
    birthYear: text(p?.birthYear),
    birthMonth: p?.birthMonth ?? '',
    heightCm: text(p?.heightCm),
    weightKg: text(p?.weightKg),
    heightFt: fi ? String(fi.feet) : '',
    heightIn: fi ? String(fi.inches) : '',
    weightLb: p?.weightKg != null && units === 'us' ? String(kgToPounds(p.weightKg)) : '',
    activity: p?.activity ?? 'low',
    // An undated flag stored before months could be given opens ticked, asking for its months.
    pregnant: p?.pregnancyDueMonth != null || p?.condition === 'pregnancy',
    pregnancyDueMonth: p?.pregnancyDueMonth ?? '',
    breastfeeding: p?.lactationFrom != null || p?.condition === 'lactation',
    lactationFrom: p?.lactationFrom ?? '',
    lactationTo: p?.lactationTo ?? '',
    fedFromHousehold: p?.fedFromHousehold ?? false,
    diet: p?.diet ?? 'omnivore',
    kcalPerDay: text(p?.kcalPerDay),
    atHomePct: text(p?.atHomePct ?? 100),
    presentFrom: p?.presentFrom ?? '',
    presentTo: p?.presentTo ?? '',
  };
}

// A blank box is null; a mistyped or negative one goes on as NaN or as typed, for the schema to name.
const num = (t: string) => parseDecimal(t) ?? null;
const usable = (n: number | null): n is number => n !== null && Number.isFinite(n) && n >= 0;

/** The height in cm the draft stands for, converting feet and inches in a US-units household. */
export function heightCmOf(d: PersonDraft, units: UnitSystem): number | null {
  if (units === 'metric') return num(d.heightCm);
  const ft = num(d.heightFt);
  const inch = num(d.heightIn);
  if (ft === null && inch === null) return null;
  if ((ft !== null && !usable(ft)) || (inch !== null && !usable(inch))) return Number.NaN;
  return feetInchesToCm(ft ?? 0, inch ?? 0);
}

/** The weight in kg the draft stands for, converting pounds in a US-units household. */
export function weightKgOf(d: PersonDraft, units: UnitSystem): number | null {
  if (units === 'metric') return num(d.weightKg);
  const lb = num(d.weightLb);
  if (lb === null) return null;
  return usable(lb) ? poundsToKg(lb) : Number.NaN;
}

/** The API's body the draft stands for (metric), before the schema checks it. */
export function personBody(d: PersonDraft, units: UnitSystem): Record<string, unknown> {
  const female = d.sex === 'female';
  return {
    name: d.name,
    sex: d.sex,
    ageYears: d.ageKind === 'age' ? num(d.ageYears) : null,
    birthYear: d.ageKind === 'birthYear' ? num(d.birthYear) : null,
    birthMonth: d.ageKind === 'birthMonth' ? d.birthMonth || null : null,
    heightCm: heightCmOf(d, units),
    weightKg: weightKgOf(d, units),
    activity: d.activity,
    // The months say when; the undated flag is not sent from this form.
    condition: 'none',
    pregnancyDueMonth: female && d.pregnant ? d.pregnancyDueMonth || null : null,
    lactationFrom: female && d.breastfeeding ? d.lactationFrom || null : null,
    lactationTo: female && d.breastfeeding ? d.lactationTo || null : null,
    fedFromHousehold: d.fedFromHousehold,
    diet: d.diet,
    kcalPerDay: num(d.kcalPerDay),
    atHomePct: num(d.atHomePct) ?? 100,
    presentFrom: d.presentFrom || null,
    presentTo: d.presentTo || null,
  };
}

/**
 * The person's age in years this month as the draft gives it, or null when it cannot be told yet,
 * e.g. draftAgeYears({ ageKind: 'birthMonth', birthMonth: '2026-09', … }, '2026-12') → 0.25.
 */
export function draftAgeYears(d: PersonDraft, month: string): number | null {
  const body = personBody(d, 'metric');
  const person = { ageYears: body.ageYears as number | null, birthYear: body.birthYear as number | null, birthMonth: body.birthMonth as string | null };
  if (person.birthMonth != null && !isMonth(person.birthMonth)) return null;
  if (person.ageYears == null && person.birthYear == null && person.birthMonth == null) return null;
  if (!isMonth(month)) return null;
  try {
    const age = ageYearsIn(person, month);
    return Number.isFinite(age) ? age : null;
  } catch {
    return null; // a half-typed birth year: the schema says what is wrong on submit
  }
}

const checkPerson = zodResolver(personInput);

type DraftErrors = FieldErrorsOf<PersonDraft>;

function move(errors: DraftErrors, from: keyof PersonDraft, to: keyof PersonDraft, message?: string) {
  const e = errors[from];
  if (!e) return;
  delete errors[from];
  errors[to] ??= { ...e, ...(message ? { message } : {}) } as never;
}

/**
 * Checks the typed draft with `personInput` after turning it into the API's body, and puts each
 * message beside the box on show: the age rule beside the birth year or month when that is what
 * is being given, height and weight beside the feet and pounds boxes in feet and pounds.
 */
export const personResolver: Resolver<PersonDraft, unknown, PersonInput> = async (draft, context, options) => {
  // The context is the form's PersonFormContext (react-hook-form types it loosely for shared helpers).
  const units = (context as PersonFormContext | undefined)?.units ?? 'metric';
  // The zod resolver is typed for the API body; it is handed exactly that, built from the draft.
  const result = await checkPerson(personBody(draft, units) as never, undefined, options as never);
  const errors = { ...(result.errors as DraftErrors) };
  if (draft.ageKind !== 'age') move(errors, 'ageYears', draft.ageKind);
  if (units === 'us') {
    const L = PERSON_LIMITS;
    move(errors, 'heightCm', 'heightFt', `Enter the height in feet and inches, between ${heightText(L.minHeightCm, 'us')} and ${heightText(L.maxHeightCm, 'us')}.`);
    move(errors, 'weightKg', 'weightLb', `Enter the weight in pounds, between ${weightText(L.minWeightKg, 'us')} and ${weightText(L.maxWeightKg, 'us')}.`);
  }
  if (draft.sex === 'female' && draft.pregnant && !draft.pregnancyDueMonth) {
    errors.pregnancyDueMonth ??= { type: 'required', message: 'Give the month the baby is due: the trimester of each month follows from it.' };
  }
  if (draft.sex === 'female' && draft.breastfeeding && !draft.lactationFrom) {
    errors.lactationFrom ??= { type: 'required', message: 'Give the month breastfeeding began (the baby’s birth month, usually).' };
  }
  if (Object.keys(errors).length === 0) return result as ResolverResult<PersonDraft, PersonInput>;
  return { values: {}, errors } as ResolverResult<PersonDraft, PersonInput>;
};
