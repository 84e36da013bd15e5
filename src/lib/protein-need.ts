/**
 * Protein need from a person's own weight. The DRI table's grams a day are the RDA in g/kg/day
 * times a reference weight (46 g for a 57 kg woman); a person who gives their weight gets the
 * RDA per kilogram times that weight instead (IOM 2005, Dietary Reference Intakes for Energy,
 * Carbohydrate, Fiber, Fat, Fatty Acids, Cholesterol, Protein, and Amino Acids, ch. 10).
 *
 * Which weight in pregnancy and lactation: the IOM derives the pregnancy and lactation RDAs per
 * kilogram of the woman's pre-pregnancy weight (from memory: IOM 2005, ch. 10); Selfsown uses
 * the weight given for the person, so the person form should ask for the weight before pregnancy.
 * Under 1 year the table's value is kept (the infant AI rests on breast-milk intake, not weight).
 */
import type { Condition } from './eer';

export const PROTEIN_SOURCE =
  'IOM 2005, Dietary Reference Intakes for Energy, Carbohydrate, Fiber, Fat, Fatty Acids, Cholesterol, Protein, and Amino Acids, protein RDA in g/kg/day (ch. 10)';

/**
 * RDA protein in g per kg of body weight per day (IOM 2005): 1.05 at 1–3 y, 0.95 at 4–13 y,
 * 0.85 at 14–18 y, 0.80 from 19 y; 1.1 in pregnancy. Lactation: the IOM's EAR is 1.05 g/kg/day
 * (as printed in IOM 2006, WIC Food Packages, Table F-3 note a), and its RDA 1.3 g/kg/day
 * (EAR × 1.25 for the 12.5 % coefficient of variation the protein chapter uses; from memory:
 * IOM 2005, ch. 10). Issue 9 wrote 1.1 for lactation; Selfsown follows the published 1.3.
 */
export const PROTEIN_G_PER_KG = {
  children1to3: 1.05,
  children4to13: 0.95,
  adolescents14to18: 0.85,
  adults: 0.8,
  pregnancy: 1.1,
  lactation: 1.3,
} as const;

/**
 * The RDA in g/kg/day for an age and condition, or null under 1 year (the table value applies),
 * e.g. proteinPerKg(30, null) → 0.8; proteinPerKg(30, 'pregnancy') → 1.1; proteinPerKg(0.5, null) → null.
 */
export function proteinPerKg(ageYears: number, condition: Condition | null | undefined): number | null {
  if (!Number.isFinite(ageYears) || ageYears < 0) throw new RangeError(`age must be a number of years from 0, got ${ageYears}`);
  if (ageYears < 1) return null;
  if (condition === 'pregnancy') return PROTEIN_G_PER_KG.pregnancy;
  if (condition === 'lactation') return PROTEIN_G_PER_KG.lactation;
  if (ageYears < 4) return PROTEIN_G_PER_KG.children1to3;
  if (ageYears < 14) return PROTEIN_G_PER_KG.children4to13;
  if (ageYears < 19) return PROTEIN_G_PER_KG.adolescents14to18;
  return PROTEIN_G_PER_KG.adults;
}

/**
 * Grams of protein a day from the person's weight, or null when no weight is given or they are
 * under 1 year (the DRI table's value applies),
 * e.g. proteinByWeight({ ageYears: 30, weightKg: 80 }) → 64 (0.80 × 80).
 */
export function proteinByWeight(person: { ageYears: number; weightKg?: number | null; condition?: Condition | null }): number | null {
  if (person.weightKg == null) return null;
  if (!Number.isFinite(person.weightKg) || person.weightKg <= 0) {
    throw new RangeError(`The weight must be a number of kilograms above 0, got ${person.weightKg}.`);
  }
  const perKg = proteinPerKg(person.ageYears, person.condition);
  return perKg === null ? null : perKg * person.weightKg;
}
