/**
 * Questions to ask before a height and a weight are saved. The energy need rests on them (IOM 2005
 * EER equations), and a slip goes unnoticed: a US user's "70" and "180" typed into centimetre and
 * kilogram boxes become a 70 cm, 180 kg person needing about 3,700 kcal a day. These rules do not
 * refuse anything (people do come in every shape); they find a combination worth a second look and
 * say so in a sentence, and the form asks to confirm before it saves.
 */
import { cmToFeetInches, CM_PER_INCH, kgToPounds, KG_PER_POUND } from './body-units';
import { trimmedDecimal } from './format-number';
import type { UnitSystem } from './units';

/**
 * Body-mass indexes outside this range are rare enough in living people to ask about
 * (BMI = kg / m², the WHO definition). // common practice (no published source) for the bounds
 */
export const PLAUSIBLE_BMI = { low: 12, high: 60 } as const;

/** Below this height an adult (18 y or older) is asked whether the figure was meant in inches. */
// common practice (no published source)
export const SHORT_ADULT_CM = 120;

export interface BodyWarning {
  code: 'looks_imperial' | 'bmi_low' | 'bmi_high' | 'short_adult';
  message: string;
}

export interface BodyFigures {
  heightCm: number | null;
  weightKg: number | null;
  /** Age in years when the form knows it (an age typed or worked out from the birth year or month). */
  ageYears?: number | null;
  /** The household's units, in which the sentences name the figures. */
  units: UnitSystem;
}

/** Body-mass index, kg / m². Example: `bodyMassIndex(177.8, 81.65)` → 25.83 (to two decimals) */
export function bodyMassIndex(heightCm: number, weightKg: number): number {
  if (!(heightCm > 0) || !(weightKg > 0)) throw new RangeError(`The height and weight must be above 0, got ${heightCm} cm and ${weightKg} kg.`);
  const m = heightCm / 100;
  return weightKg / (m * m);
}

// Heights and weights to a tenth, as typed (177.8, not 178).
const one = (n: number) => trimmedDecimal(n, 1);

const plausible = (bmi: number) => bmi >= PLAUSIBLE_BMI.low && bmi <= PLAUSIBLE_BMI.high;

/** A height as the household reads it. Example: `heightText(177.8, 'us')` → '5 ft 10 in' */
export function heightText(cm: number, units: UnitSystem): string {
  if (units === 'metric') return `${one(cm)} cm`;
  const { feet, inches } = cmToFeetInches(cm);
  return `${feet} ft ${one(inches)} in`;
}

/** A weight as the household reads it. Example: `weightText(81.65, 'us')` → '180 lb' */
export function weightText(kg: number, units: UnitSystem): string {
  return units === 'metric' ? `${one(kg)} kg` : `${one(kgToPounds(kg))} lb`;
}

/**
 * What looks wrong with a height and weight, as sentences; empty when nothing does,
 * e.g. bodyWarnings({ heightCm: 70, weightKg: 180, units: 'metric' })[0].code → 'looks_imperial'.
 */
export function bodyWarnings({ heightCm, weightKg, ageYears, units }: BodyFigures): BodyWarning[] {
  const out: BodyWarning[] = [];
  if (heightCm != null && weightKg != null && heightCm > 0 && weightKg > 0) {
    const bmi = bodyMassIndex(heightCm, weightKg);
    if (!plausible(bmi)) {
      // The same two numbers read as inches and pounds make a believable person: a unit slip.
      const asImperial = units === 'metric' ? bodyMassIndex(heightCm * CM_PER_INCH, weightKg * KG_PER_POUND) : NaN;
      if (plausible(asImperial)) {
        out.push({
          code: 'looks_imperial',
          message:
            `${one(heightCm)} cm and ${one(weightKg)} kg look like inches and pounds ` +
            `(${one(heightCm)} in is ${one(heightCm * CM_PER_INCH)} cm, ${one(weightKg)} lb is ${one(weightKg * KG_PER_POUND)} kg). ` +
            'Enter the height in centimetres and the weight in kilograms, or confirm they are right as typed.',
        });
      } else {
        out.push({
          code: bmi < PLAUSIBLE_BMI.low ? 'bmi_low' : 'bmi_high',
          message:
            `A height of ${heightText(heightCm, units)} and a weight of ${weightText(weightKg, units)} give a body-mass index of ${String(Math.round(bmi))}, ` +
            `outside the ${PLAUSIBLE_BMI.low}–${PLAUSIBLE_BMI.high} seen in nearly everyone. Check both, or confirm they are right as typed.`,
        });
      }
    }
  }
  if (out.length === 0 && heightCm != null && ageYears != null && ageYears >= 18 && heightCm < SHORT_ADULT_CM) {
    out.push({
      code: 'short_adult',
      message:
        `${heightText(heightCm, units)} is short for an adult` +
        (units === 'metric' ? ` (if it is in inches, that is ${one(heightCm * CM_PER_INCH)} cm)` : '') +
        '. Check the height, or confirm it is right as typed.',
    });
  }
  return out;
}
