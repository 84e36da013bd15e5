/**
 * Energy need: the Estimated Energy Requirement (EER) equations of the Institute of Medicine,
 * Dietary Reference Intakes for Energy, Carbohydrate, Fiber, Fat, Fatty Acids, Cholesterol,
 * Protein, and Amino Acids (2002/2005), chapter 5, or a kcal/day the household states.
 * (NASEM published new energy equations in 2023; Selfsown uses the 2005 ones, which the DRI
 * summary tables still print.)
 */

export type Sex = 'female' | 'male';
export type Condition = 'pregnancy' | 'lactation';

/** Physical activity level categories of the IOM equations (PAL 1.0–1.39, 1.4–1.59, 1.6–1.89, 1.9–2.5). */
export const ACTIVITIES = ['sedentary', 'low', 'active', 'very_active'] as const;
export type Activity = (typeof ACTIVITIES)[number];

export interface EnergyPerson {
  sex: Sex;
  ageYears: number;
  heightCm?: number | null;
  weightKg?: number | null;
  /** Default 'low' (low active). */
  activity?: Activity | null;
  /** A stated need wins over the equations. */
  kcalPerDay?: number | null;
  condition?: Condition | null;
  /** Pregnancy trimester; without it the mean of the three increments is used (see PREGNANCY_KCAL). */
  trimester?: 1 | 2 | 3 | null;
  /** Lactation period: months 0–6 or 7–12 after birth; default 'first6'. */
  lactationPeriod?: 'first6' | 'second6' | null;
}

export interface EnergyNeed {
  /** kcal per day */
  value: number;
  basis: 'EER' | 'stated';
  source: string;
  /** What the estimate assumed, in words (reference height or weight used, default activity, …). */
  assumptions: string[];
}

export const EER_SOURCE =
  'IOM 2005, Dietary Reference Intakes for Energy, Carbohydrate, Fiber, Fat, Fatty Acids, Cholesterol, Protein, and Amino Acids, EER equations (ch. 5)';

const REFERENCE_SOURCE =
  'IOM 2005 DRI for Energy and Macronutrients, Table 1-1 reference heights and weights (CDC/NCHS growth charts 2000)';

/**
 * Pregnancy energy deposition added to the non-pregnant EER, kcal/day, by trimester (IOM 2005;
 * as printed in IOM 2009 "Weight Gain During Pregnancy", Table B-1A). Without a trimester
 * Selfsown adds the mean of the three, (0 + 340 + 452) / 3 = 264 kcal: a pregnancy spends about
 * a third of its months in each, so over the months a person is pregnant the sum comes out right.
 */
export const PREGNANCY_KCAL = { 1: 0, 2: 340, 3: 452, unknown: 264 } as const;

/**
 * Lactation: EER + milk energy − energy from weight loss (IOM 2005): months 0–6 +500 − 170 = +330,
 * months 7–12 +400 − 0 = +400. Without a period Selfsown uses +330 (the first six months, when
 * most milk is made).
 */
export const LACTATION_KCAL = { first6: 330, second6: 400 } as const;

/** Physical activity coefficients (PA) of the IOM 2005 EER equations, by sex and age group. */
export const PA_COEFFICIENTS = {
  boys3to18: { sedentary: 1.0, low: 1.13, active: 1.26, very_active: 1.42 },
  girls3to18: { sedentary: 1.0, low: 1.16, active: 1.31, very_active: 1.56 },
  men: { sedentary: 1.0, low: 1.11, active: 1.25, very_active: 1.48 },
  women: { sedentary: 1.0, low: 1.12, active: 1.27, very_active: 1.45 },
} as const;

export interface ReferenceBody {
  heightCm: number;
  weightKg: number;
  /** The DRI group the reference belongs to. */
  group: string;
}

/**
 * The reference height and weight the DRI reports use for a life-stage group (IOM 2005,
 * Table 1-1; adults of every age get the 19–30 y values, as the DRI reports do),
 * e.g. referenceBody('male', 30) → { heightCm: 177, weightKg: 70, group: 'males 19+ y' }.
 */
export function referenceBody(sex: Sex, ageYears: number): ReferenceBody {
  checkAge(ageYears);
  if (ageYears < 0.5) return { heightCm: 62, weightKg: 6, group: 'infants 0–6 mo' };
  if (ageYears < 1) return { heightCm: 71, weightKg: 9, group: 'infants 7–12 mo' };
  if (ageYears < 4) return { heightCm: 86, weightKg: 12, group: 'children 1–3 y' };
  if (ageYears < 9) return { heightCm: 115, weightKg: 20, group: 'children 4–8 y' };
  if (sex === 'male') {
    if (ageYears < 14) return { heightCm: 144, weightKg: 36, group: 'males 9–13 y' };
    if (ageYears < 19) return { heightCm: 174, weightKg: 61, group: 'males 14–18 y' };
    return { heightCm: 177, weightKg: 70, group: 'males 19+ y' };
  }
  if (ageYears < 14) return { heightCm: 144, weightKg: 37, group: 'females 9–13 y' };
  if (ageYears < 19) return { heightCm: 163, weightKg: 54, group: 'females 14–18 y' };
  return { heightCm: 163, weightKg: 57, group: 'females 19+ y' };
}

/** The PA coefficient for a person, e.g. paCoefficient('male', 30, 'active') → 1.25; 1 under 3 years (no PA term). */
export function paCoefficient(sex: Sex, ageYears: number, activity: Activity): number {
  checkAge(ageYears);
  if (!(ACTIVITIES as readonly string[]).includes(activity)) {
    throw new RangeError(`activity must be one of ${ACTIVITIES.join(', ')}, got "${String(activity)}"`);
  }
  if (ageYears < 3) return 1;
  if (ageYears < 19) return (sex === 'male' ? PA_COEFFICIENTS.boys3to18 : PA_COEFFICIENTS.girls3to18)[activity];
  return (sex === 'male' ? PA_COEFFICIENTS.men : PA_COEFFICIENTS.women)[activity];
}

/**
 * Energy need in kcal/day: the stated kcalPerDay if given, else the IOM 2005 EER with the
 * reference height and weight for any measure not given, plus pregnancy or lactation energy,
 * e.g. estimatedEnergyRequirement({ sex: 'male', ageYears: 30, heightCm: 177, weightKg: 70, activity: 'active' }).value ≈ 2962.1.
 */
export function estimatedEnergyRequirement(person: EnergyPerson): EnergyNeed {
  const { sex, ageYears } = person;
  checkAge(ageYears);
  if (person.kcalPerDay != null) {
    if (!Number.isFinite(person.kcalPerDay) || person.kcalPerDay <= 0) {
      throw new RangeError(`a stated energy need must be a number above 0 kcal/day, got ${person.kcalPerDay}`);
    }
    return { value: person.kcalPerDay, basis: 'stated', source: 'stated by the household', assumptions: [] };
  }
  const assumptions: string[] = [];
  const ref = referenceBody(sex, ageYears);
  const heightCm = measure(person.heightCm, 'heightCm', ref.heightCm, `reference height ${ref.heightCm} cm (${ref.group})`, assumptions);
  const weightKg = measure(person.weightKg, 'weightKg', ref.weightKg, `reference weight ${ref.weightKg} kg (${ref.group})`, assumptions);
  if (person.heightCm == null || person.weightKg == null) assumptions.push(REFERENCE_SOURCE);
  const activity = person.activity ?? 'low';
  if (person.activity == null && ageYears >= 3) assumptions.push('activity: low active (default)');
  const pa = paCoefficient(sex, ageYears, activity);
  const ht = heightCm / 100;
  const wt = weightKg;

  let value: number;
  if (ageYears < 3) {
    // 0–35 months: EER = TEE + energy deposition, TEE = 89 × weight − 100 (no PA term)
    const months = Math.floor(ageYears * 12 + 1e-9); // completed months; epsilon for 7/12 × 12 = 6.999…
    const deposition = months <= 3 ? 175 : months <= 6 ? 56 : months <= 12 ? 22 : 20;
    value = 89 * wt - 100 + deposition;
  } else if (ageYears < 19) {
    const growth = ageYears < 9 ? 20 : 25; // energy deposition, kcal/day
    value =
      sex === 'male'
        ? 88.5 - 61.9 * ageYears + pa * (26.7 * wt + 903 * ht) + growth
        : 135.3 - 30.8 * ageYears + pa * (10.0 * wt + 934 * ht) + growth;
  } else {
    value =
      sex === 'male'
        ? 662 - 9.53 * ageYears + pa * (15.91 * wt + 539.6 * ht)
        : 354 - 6.91 * ageYears + pa * (9.36 * wt + 726 * ht);
  }

  if (person.condition === 'pregnancy') {
    const t = person.trimester;
    value += t == null ? PREGNANCY_KCAL.unknown : PREGNANCY_KCAL[t];
    if (t == null) assumptions.push('pregnancy without trimester: mean of the trimester increments, +264 kcal');
  } else if (person.condition === 'lactation') {
    value += LACTATION_KCAL[person.lactationPeriod ?? 'first6'];
    if (person.lactationPeriod == null) assumptions.push('lactation period not given: months 0–6, +330 kcal');
  }
  return { value, basis: 'EER', source: EER_SOURCE, assumptions };
}

function measure(given: number | null | undefined, name: string, fallback: number, note: string, notes: string[]): number {
  if (given == null) {
    notes.push(note);
    return fallback;
  }
  if (!Number.isFinite(given) || given <= 0) throw new RangeError(`${name} must be a number above 0, got ${given}`);
  return given;
}

function checkAge(ageYears: number): void {
  if (!Number.isFinite(ageYears) || ageYears < 0 || ageYears > 130) {
    throw new RangeError(`age must be a number of years from 0 to 130, got ${ageYears}`);
  }
}
