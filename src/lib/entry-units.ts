/**
 * Every unit an entry can be logged in: the four weights of units.ts, counts (eggs by the piece,
 * radishes by the bunch, lettuces by the head) and volumes (milk, oil, honey). Counts and volumes
 * become grams only through a named household weight (src/lib/count-volume.ts); the exact volume
 * definitions live here.
 */
import { WEIGHT_UNITS } from './units';

/** Things counted one by one. Example: `COUNT_UNITS.includes('head')` → true */
export const COUNT_UNITS = ['piece', 'bunch', 'head'] as const;
export type CountUnit = (typeof COUNT_UNITS)[number];

/** Volumes, US customary unless named imperial. Example: `VOLUME_UNITS[0]` → 'ml' */
export const VOLUME_UNITS = ['ml', 'l', 'cup', 'fl_oz', 'pint_us', 'pint_imp'] as const;
export type VolumeUnit = (typeof VOLUME_UNITS)[number];

/** Every unit an entry (harvest, purchase, staple) can carry; the API codes. */
export const ENTRY_UNITS = [...WEIGHT_UNITS, ...COUNT_UNITS, ...VOLUME_UNITS] as const;
export type EntryUnit = (typeof ENTRY_UNITS)[number];

/**
 * Millilitres in one of each volume unit, exact by definition.
 * US units: 1 US gallon = 231 in³ and 1 in = 2.54 cm (NIST Handbook 44, Appendix C), so
 * 1 fl oz = 1/128 gal = 29.5735295625 ml, 1 cup = 8 fl oz, 1 pint = 16 fl oz.
 * Imperial pint: 1 gallon = 4.54609 l (UK Weights and Measures Act 1985), 1 pint = 1/8 gallon.
 */
export const ML_PER_UNIT: Readonly<Record<VolumeUnit, number>> = {
  ml: 1,
  l: 1000,
  cup: 236.5882365,
  fl_oz: 29.5735295625,
  pint_us: 473.176473,
  pint_imp: 568.26125,
};

/** True for a count unit. Example: `isCountUnit('bunch')` → true */
export function isCountUnit(value: unknown): value is CountUnit {
  return typeof value === 'string' && (COUNT_UNITS as readonly string[]).includes(value);
}

/** True for a volume unit. Example: `isVolumeUnit('pint_imp')` → true */
export function isVolumeUnit(value: unknown): value is VolumeUnit {
  return typeof value === 'string' && (VOLUME_UNITS as readonly string[]).includes(value);
}

/** True for any entry unit. Example: `isEntryUnit('cup')` → true */
export function isEntryUnit(value: unknown): value is EntryUnit {
  return typeof value === 'string' && (ENTRY_UNITS as readonly string[]).includes(value);
}
