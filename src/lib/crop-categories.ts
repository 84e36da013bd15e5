/**
 * Kinds of crop, and the defaults that follow from the kind: what a harvest is usually used for,
 * and over how many months stored or preserved food of that kind is eaten. A crop's own settings
 * always win over these; these only fill the gap when the grower has not said.
 */
import type { Use } from './uses';

/** Kinds of crop. Example: `CROP_CATEGORIES.includes('squash')` → true */
export const CROP_CATEGORIES = [
  'grain',
  'legume',
  'root_tuber',
  'squash',
  'leafy_green',
  'fruit',
  'nut_seed',
  'herb',
  'animal_product',
  'other',
] as const;

export type CropCategory = (typeof CROP_CATEGORIES)[number];

/** Display names in our own words. Example: `CROP_CATEGORY_LABELS.root_tuber` → 'Roots and tubers' */
export const CROP_CATEGORY_LABELS: Readonly<Record<CropCategory, string>> = {
  grain: 'Grains',
  legume: 'Beans, peas and lentils',
  root_tuber: 'Roots and tubers',
  squash: 'Squash and pumpkins',
  leafy_green: 'Leafy greens',
  fruit: 'Fruit',
  nut_seed: 'Nuts and seeds',
  herb: 'Herbs',
  animal_product: 'Eggs, honey, milk and meat',
  other: 'Other',
};

/** True for one of the crop categories. Example: `isCropCategory('grain')` → true */
export function isCropCategory(value: unknown): value is CropCategory {
  return typeof value === 'string' && (CROP_CATEGORIES as readonly string[]).includes(value);
}

/**
 * Months over which a *stored* harvest (cellar, shelf, clamp) is eaten, starting with the month it
 * was logged. Example: `STORED_SPREAD_MONTHS.squash` → 5
 */
export const STORED_SPREAD_MONTHS: Readonly<Record<CropCategory, number>> = {
  grain: 12, // common practice (no published source): dry grain is eaten until the next harvest
  legume: 12, // common practice (no published source): dry pulses likewise
  root_tuber: 6, // common practice (no published source): cellar potatoes and roots last into spring
  squash: 5, // common practice (no published source): cured winter squash keeps through winter
  leafy_green: 1, // common practice (no published source): greens keep days to weeks
  fruit: 3, // common practice (no published source): cellar apples and pears
  nut_seed: 12, // common practice (no published source): dry nuts and seeds keep a year
  herb: 6, // common practice (no published source): dried herbs
  animal_product: 2, // common practice (no published source): eggs keep weeks; set honey per crop
  other: 3, // common practice (no published source)
};

/**
 * Months over which a *preserved* harvest (dried, frozen, canned, fermented) is eaten.
 * Example: `PRESERVED_SPREAD_MONTHS.fruit` → 12
 */
export const PRESERVED_SPREAD_MONTHS: Readonly<Record<CropCategory, number>> = {
  grain: 12, // common practice (no published source)
  legume: 12, // common practice (no published source)
  root_tuber: 12, // common practice (no published source)
  squash: 12, // common practice (no published source)
  leafy_green: 9, // common practice (no published source): frozen greens are eaten before the new crop
  fruit: 12, // common practice (no published source): jams, bottled and dried fruit
  nut_seed: 12, // common practice (no published source)
  herb: 12, // common practice (no published source)
  animal_product: 6, // common practice (no published source)
  other: 12, // common practice (no published source)
};

/**
 * The use a new harvest of this kind starts with in the form. Staples that are dried and kept start
 * as stored; everything else as fresh. Example: `DEFAULT_USE_BY_CATEGORY.grain` → 'stored'
 */
export const DEFAULT_USE_BY_CATEGORY: Readonly<Record<CropCategory, Use>> = {
  grain: 'stored', // common practice (no published source)
  legume: 'stored', // common practice (no published source): dry beans; set green beans to fresh per crop
  root_tuber: 'fresh',
  squash: 'fresh',
  leafy_green: 'fresh',
  fruit: 'fresh',
  nut_seed: 'stored', // common practice (no published source)
  herb: 'fresh',
  animal_product: 'fresh',
  other: 'fresh',
};

export interface SpreadDefaultOptions {
  use: Use;
  category: CropCategory;
  /** The crop's own default for stored and preserved harvests, when the grower set one. */
  cropDefault?: number | null;
}

/**
 * Months a harvest is spread over when the entry does not say: 1 for fresh food and for food that
 * is not eaten (seed, given, sold, lost); for stored or preserved food the crop's own default, else
 * the category's. Example: `defaultSpreadMonths({ use: 'stored', category: 'root_tuber' })` → 6
 */
export function defaultSpreadMonths({ use, category, cropDefault }: SpreadDefaultOptions): number {
  if (use !== 'stored' && use !== 'preserved') return 1;
  if (cropDefault != null) return cropDefault;
  if (!isCropCategory(category)) {
    throw new Error(`Unknown crop category "${String(category)}": use one of ${CROP_CATEGORIES.join(', ')}.`);
  }
  return use === 'stored' ? STORED_SPREAD_MONTHS[category] : PRESERVED_SPREAD_MONTHS[category];
}

/** The use a new harvest starts with: the crop's own, else its category's. Example: `defaultUse({ category: 'grain' })` → 'stored' */
export function defaultUse({ category, cropDefault, notFood }: { category: CropCategory; cropDefault?: Use | null; notFood?: boolean }): Use {
  if (cropDefault != null) return cropDefault;
  // A crop that is not food is never eaten: start it on a use that is not eaten.
  if (notFood) return 'seed';
  return DEFAULT_USE_BY_CATEGORY[category];
}
