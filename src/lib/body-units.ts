/**
 * Height and weight in the household's units. The people API stores a person's body in metric
 * (centimetres and kilograms, what the IOM 2005 energy equations take); a US-units household
 * types feet + inches and pounds. The factors are the exact ones of the International Yard and
 * Pound Agreement (1959): 1 in = 2.54 cm, 1 lb = 0.45359237 kg. Stored values are rounded to a
 * millimetre and ten grams, far below what a tape or a bathroom scale can tell apart, so a value
 * typed in one system reads back the same after a round trip.
 */

// 1 in = 2.54 cm exactly (International Yard and Pound Agreement, 1959)
export const CM_PER_INCH = 2.54;
export const INCHES_PER_FOOT = 12;
// 1 lb = 0.45359237 kg exactly (International Yard and Pound Agreement, 1959)
export const KG_PER_POUND = 0.45359237;

function finite(value: number, what: string): void {
  if (typeof value !== 'number' || !Number.isFinite(value)) throw new RangeError(`The ${what} must be a finite number, got ${String(value)}.`);
  if (value < 0) throw new RangeError(`The ${what} cannot be negative, got ${value}.`);
}

const round = (value: number, decimals: number) => Math.round(value * 10 ** decimals) / 10 ** decimals;

/** Feet and inches to centimetres, rounded to the millimetre. Example: `feetInchesToCm(5, 10)` → 177.8 */
export function feetInchesToCm(feet: number, inches: number): number {
  finite(feet, 'number of feet');
  finite(inches, 'number of inches');
  return round((feet * INCHES_PER_FOOT + inches) * CM_PER_INCH, 1);
}

/**
 * Centimetres to whole feet and inches to a tenth (12 inches roll over into a foot),
 * e.g. cmToFeetInches(177.8) → { feet: 5, inches: 10 }.
 */
export function cmToFeetInches(cm: number): { feet: number; inches: number } {
  finite(cm, 'height');
  const totalInches = round(cm / CM_PER_INCH, 1);
  const feet = Math.floor(totalInches / INCHES_PER_FOOT);
  return { feet, inches: round(totalInches - feet * INCHES_PER_FOOT, 1) };
}

/** Pounds to kilograms, rounded to ten grams. Example: `poundsToKg(180)` → 81.65 */
export function poundsToKg(pounds: number): number {
  finite(pounds, 'weight');
  return round(pounds * KG_PER_POUND, 2);
}

/** Kilograms to pounds, to a tenth. Example: `kgToPounds(81.65)` → 180 */
export function kgToPounds(kg: number): number {
  finite(kg, 'weight');
  return round(kg / KG_PER_POUND, 1);
}
