/**
 * The rules for a household's crop (name, variety, reference food, category, edible share, usual
 * use and spread, not-food flag, the weight of one piece, bunch or head) — the crop form, the crops
 * API and the CSV importer's new crops all check with these.
 */
import { z } from 'zod';
import { isEatenUse, type Use } from './uses';
import { mustBeNumber, oneOf, trueOrFalse } from './zod-messages';
import { checkNotEmpty, cropUseError, ENTRY_LIMITS, mergeFields, nameText, recordId, spreadMonths, use, type Stored } from './entry-schemas';
import { formatCount } from './format-number';
import { CROP_CATEGORIES } from './crop-categories';

const cropFields = {
  name: nameText('crop name').min(1, { error: 'Give the crop a name.' }),
  variety: nameText('variety')
    .transform((s) => (s === '' ? undefined : s))
    .optional(),
  foodId: recordId.nullable(),
  category: z.enum(CROP_CATEGORIES, { error: oneOf('The category', CROP_CATEGORIES) }),
  edibleFraction: z
    .number({ error: mustBeNumber('The edible fraction') })
    .gt(0, { error: 'The edible fraction must be more than 0.' })
    .max(1, { error: 'The edible fraction can be at most 1 (all of it eaten).' }),
  defaultUse: use,
  defaultSpreadMonths: spreadMonths,
  notFood: z.boolean({ error: trueOrFalse('Not food') }),
  // Grams of one piece, bunch or head as the grower counts this crop, weighed whole as harvested.
  countGrams: z
    .number({ error: mustBeNumber('The weight of one') })
    .gt(0, { error: 'The weight of one must be more than 0 g.' })
    .max(ENTRY_LIMITS.maxQuantity, { error: `The weight of one can be at most ${formatCount(ENTRY_LIMITS.maxQuantity)} g; check the unit.` }),
};

// A crop marked not food (ornamental, or toxic parts) is never counted as food: it links to no
// reference food, has no edible fraction and no eaten default use. Its harvests are checked with
// cropUseError, so they can only be seed, given, sold or lost.
function checkNotFood(
  value: { notFood?: boolean | undefined; foodId?: number | null | undefined; edibleFraction?: number | undefined; defaultUse?: Use | undefined },
  ctx: z.RefinementCtx,
): void {
  if (!value.notFood) return;
  if (value.foodId != null) {
    ctx.addIssue({ code: 'custom', path: ['foodId'], message: 'A crop marked as not food cannot be matched to a reference food.' });
  }
  if (value.edibleFraction !== undefined) {
    ctx.addIssue({ code: 'custom', path: ['edibleFraction'], message: 'A crop marked as not food has no edible fraction.' });
  }
  if (value.defaultUse !== undefined && isEatenUse(value.defaultUse)) {
    ctx.addIssue({ code: 'custom', path: ['defaultUse'], message: 'A crop marked as not food can only default to seed, given, sold or lost.' });
  }
}

/**
 * A crop the household grows: name, variety, matched reference food (or null), category, optional
 * edible fraction override, default use and spread, whether it is not food, and the grams of one
 * piece, bunch or head (countGrams, null = the food's household measures). The category may be
 * left out when the name says it (see insertCrop in src/server/crops.ts).
 * Example: `cropInput.parse({ name: 'Potato', variety: 'Charlotte', foodId: 12, category: 'root_tuber' })`
 *   → { name: 'Potato', variety: 'Charlotte', foodId: 12, category: 'root_tuber', notFood: false }
 */
export const cropInput = z
  .strictObject({
    ...cropFields,
    // Left out, the server takes the matching reference crop's category, else 'other' (src/lib/crop-name-match.ts).
    category: cropFields.category.optional(),
    foodId: cropFields.foodId.default(null),
    edibleFraction: cropFields.edibleFraction.optional(),
    defaultUse: cropFields.defaultUse.optional(),
    defaultSpreadMonths: cropFields.defaultSpreadMonths.optional(),
    notFood: cropFields.notFood.default(false),
    countGrams: cropFields.countGrams.nullable().optional(),
  })
  .superRefine(checkNotFood);

export type CropInput = z.output<typeof cropInput>;
export type CropInputRaw = z.input<typeof cropInput>;

/** A change to a crop: any field (and `archived`), at least one; null clears variety, edible fraction, default use, spread or weight of one. Example: `cropPatch.parse({ countGrams: 120 })` */
export const cropPatch = z
  .strictObject({
    ...cropFields,
    variety: z.union([nameText('variety').transform((s) => (s === '' ? null : s)), z.null()]),
    edibleFraction: cropFields.edibleFraction.nullable(),
    defaultUse: cropFields.defaultUse.nullable(),
    defaultSpreadMonths: cropFields.defaultSpreadMonths.nullable(),
    countGrams: cropFields.countGrams.nullable(),
    // Archived crops are hidden from the entry form but keep their harvests.
    archived: z.boolean({ error: trueOrFalse('Archived') }),
  })
  .partial()
  .superRefine(checkNotEmpty)
  .superRefine((v, ctx) => checkNotFood({ ...v, edibleFraction: v.edibleFraction ?? undefined, defaultUse: v.defaultUse ?? undefined }, ctx));

export type CropPatch = z.output<typeof cropPatch>;

/** The crop after a patch, validated as a whole (the not-food rule included). Example: `mergeCropPatch(crop, { notFood: true }).success` */
export function mergeCropPatch(current: Stored<CropInput>, patch: CropPatch): z.ZodSafeParseResult<CropInput> {
  // `archived` is a flag on the stored crop, not part of what a crop is: it is checked by cropPatch.
  const { archived: _archived, ...fields } = patch;
  const merged = mergeFields({ ...current }, fields);
  // foodId is nullable on a crop: keep an explicit null rather than dropping the key.
  if (!('foodId' in merged)) merged.foodId = null;
  return cropInput.safeParse(merged);
}
