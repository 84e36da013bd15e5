/**
 * What a person's diet changes in their need. Iron from a vegetarian diet is absorbed less well
 * (non-haem iron, more phytate), so the IOM sets the iron requirement of vegetarians at 1.8 times
 * that of people who eat meat (IOM 2001, Dietary Reference Intakes for Vitamin A, Vitamin K,
 * Arsenic, Boron, Chromium, Copper, Iodine, Iron, …, Zinc, ch. 9: bioavailability of iron from
 * vegetarian diets). Zinc needs may be up to 50 % higher too (same report, ch. 12), which the IOM
 * did not turn into a factor: Selfsown says so as a caution and leaves the number alone.
 */
import type { NutrientKey } from './nutrients';

export const DIETS = ['omnivore', 'vegetarian'] as const;
export type Diet = (typeof DIETS)[number];

export const VEGETARIAN_IRON_FACTOR = 1.8;

export const DIET_SOURCE =
  'IOM 2001, Dietary Reference Intakes for Vitamin A, Vitamin K, Arsenic, Boron, Chromium, Copper, Iodine, Iron, Manganese, Molybdenum, Nickel, Silicon, Vanadium, and Zinc, iron chapter (vegetarians: 1.8 × the iron requirement)';

/** Cautions the share report shows beside a vegetarian household member's figures. */
export const VEGETARIAN_CAUTIONS = [
  'Zinc needs of vegetarians may be up to 50 % higher than the figure shown (IOM 2001, zinc chapter).',
] as const;

/**
 * The factor a diet puts on a recommended intake: 1.8 for a vegetarian's iron RDA (an AI, the
 * 0–6 month infant value resting on breast milk, is left alone); 1 otherwise,
 * e.g. dietFactor('iron_mg', 'vegetarian', 'RDA') → 1.8.
 */
export function dietFactor(key: NutrientKey, diet: Diet | null | undefined, basis: string): number {
  if (diet != null && !(DIETS as readonly string[]).includes(diet)) {
    throw new RangeError(`diet must be one of ${DIETS.join(', ')}, got "${String(diet)}"`);
  }
  return diet === 'vegetarian' && key === 'iron_mg' && basis === 'RDA' ? VEGETARIAN_IRON_FACTOR : 1;
}
