/**
 * Carbohydrate and fat have no meaningful "need" in grams from an RDA: the 130 g carbohydrate
 * RDA is only the brain's glucose floor, and fat has none over 1 year. What a professional reads
 * is the Acceptable Macronutrient Distribution Range (AMDR), a share of the energy need (IOM 2005,
 * Dietary Reference Intakes for Energy, Carbohydrate, Fiber, Fat, Fatty Acids, Cholesterol,
 * Protein, and Amino Acids, AMDR table). Here the range becomes grams from a person's energy need;
 * the share report reads its low end as "the least recommended". Under 1 year there is no AMDR
 * and the DRI table's AI applies.
 */
import type { NutrientKey } from './nutrients';

export const AMDR_SOURCE =
  'IOM 2005, Dietary Reference Intakes for Energy, Carbohydrate, Fiber, Fat, Fatty Acids, Cholesterol, Protein, and Amino Acids, Acceptable Macronutrient Distribution Ranges';

export type AmdrKey = 'carbohydrate_g' | 'fat_g';

interface AmdrBand {
  ageMin: number;
  /** Ages below; null = no upper limit. */
  ageMax: number | null;
  lowPct: number;
  highPct: number;
}

/** Energy per gram used to turn a share of energy into grams (Atwater general factors). */
export const KCAL_PER_G: Record<AmdrKey, number> = { carbohydrate_g: 4, fat_g: 9 };

/** AMDR in percent of energy by age (IOM 2005): carbohydrate 45–65 % from 1 y; fat 30–40 % at 1–3 y, 25–35 % at 4–18 y, 20–35 % from 19 y. */
export const AMDR_BANDS: Record<AmdrKey, readonly AmdrBand[]> = {
  carbohydrate_g: [{ ageMin: 1, ageMax: null, lowPct: 45, highPct: 65 }],
  fat_g: [
    { ageMin: 1, ageMax: 4, lowPct: 30, highPct: 40 },
    { ageMin: 4, ageMax: 19, lowPct: 25, highPct: 35 },
    { ageMin: 19, ageMax: null, lowPct: 20, highPct: 35 },
  ],
};

export function isAmdrKey(key: NutrientKey): key is AmdrKey {
  return key === 'carbohydrate_g' || key === 'fat_g';
}

/**
 * The AMDR in percent of energy for an age, or null under 1 year or for another nutrient,
 * e.g. amdrPercent('fat_g', 10) → { lowPct: 25, highPct: 35 }.
 */
export function amdrPercent(key: NutrientKey, ageYears: number): { lowPct: number; highPct: number } | null {
  if (!Number.isFinite(ageYears) || ageYears < 0) throw new RangeError(`age must be a number of years from 0, got ${ageYears}`);
  if (!isAmdrKey(key)) return null;
  const band = AMDR_BANDS[key].find((b) => b.ageMin <= ageYears && (b.ageMax === null || ageYears < b.ageMax));
  return band ? { lowPct: band.lowPct, highPct: band.highPct } : null;
}

/**
 * The AMDR in grams a day from an energy need in kcal a day, or null where there is none,
 * e.g. amdrGrams('carbohydrate_g', 30, 2000) → { low: 225, high: 325 } (45–65 % of 2000 kcal at 4 kcal/g).
 */
export function amdrGrams(key: NutrientKey, ageYears: number, energyKcal: number): { low: number; high: number } | null {
  if (!Number.isFinite(energyKcal) || energyKcal < 0) throw new RangeError(`The energy need must be a number of kcal from 0, got ${energyKcal}.`);
  const pct = amdrPercent(key, ageYears);
  if (!pct || !isAmdrKey(key)) return null;
  const perG = KCAL_PER_G[key];
  return { low: (energyKcal * pct.lowPct) / 100 / perG, high: (energyKcal * pct.highPct) / 100 / perG };
}
