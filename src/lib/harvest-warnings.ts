/**
 * Weights worth a second look before a harvest is saved. A slip of the unit toggle turns 12 kg of
 * potatoes into 12 g, or 150 g of beans into 150 kg, and the share report believes it. These rules
 * never refuse (a grain harvest can be heavy, a first potato tiny); they say in a sentence what
 * looks odd, and the form asks to confirm before saving.
 */
import type { CropCategory } from './crop-categories';
import { trimmedDecimal } from './format-number';
import { fromGrams, type WeightUnit } from './units';

/** One weighing above this many grams is asked about. */
export const HEAVY_WEIGHING_GRAMS = 100_000; // common practice (no published source): more than one person carries at once

/** A storage crop weighed at less than this many grams is asked about. */
export const LIGHT_STORAGE_GRAMS = 20; // common practice (no published source): less than one small potato or a handful of beans

/**
 * Crops grown to be stored in bulk (a cellar, a sack, a shelf of cured squash), whose harvest is
 * rarely a few grams. Herbs, nuts and greens are left out: a handful of them is a real harvest.
 */
export const STORAGE_CROP_CATEGORIES: readonly CropCategory[] = ['grain', 'legume', 'root_tuber', 'squash']; // common practice (no published source)

export interface HarvestWarning {
  code: 'heavy_weighing' | 'light_storage_crop';
  message: string;
}

export interface WeighingToCheck {
  /** The whole weighing in grams. */
  grams: number;
  /** The unit it was typed in, to say the weight back as typed. */
  unit: WeightUnit;
  /** The crop's category and name, when a crop was chosen. */
  category?: CropCategory | null;
  cropName?: string | null;
}

/** True for a category grown to be stored in bulk. Example: `isStorageCrop('squash')` → true */
export function isStorageCrop(category: CropCategory | null | undefined): boolean {
  return category != null && STORAGE_CROP_CATEGORIES.includes(category);
}

const typed = (grams: number, unit: WeightUnit) => `${trimmedDecimal(fromGrams(grams, unit), 3)} ${unit}`;

/**
 * What looks odd about one weighing, as sentences; empty when nothing does,
 * e.g. harvestWarnings({ grams: 150_000, unit: 'kg' })[0].code → 'heavy_weighing';
 * harvestWarnings({ grams: 12, unit: 'g', category: 'root_tuber', cropName: 'Potato' })[0].code → 'light_storage_crop'.
 */
export function harvestWarnings({ grams, unit, category, cropName }: WeighingToCheck): HarvestWarning[] {
  if (!Number.isFinite(grams) || grams <= 0) return []; // the schema refuses these with its own message
  const name = cropName ?? 'this crop';
  if (grams > HEAVY_WEIGHING_GRAMS) {
    return [
      {
        code: 'heavy_weighing',
        message: `${typed(grams, unit)} is over 100 kg for one weighing. Check the weight and the unit, or save it if it is right.`,
      },
    ];
  }
  if (grams < LIGHT_STORAGE_GRAMS && isStorageCrop(category)) {
    return [
      {
        code: 'light_storage_crop',
        message: `${typed(grams, unit)} of ${name} is less than 20 g, very little for a storage crop. Check the weight and the unit, or save it if it is right.`,
      },
    ];
  }
  return [];
}
