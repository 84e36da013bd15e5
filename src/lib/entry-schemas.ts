/**
 * The one set of rules for what a harvest, a purchase and a staple may look like (crops: crop-schemas.ts;
 * list queries: list-query-schemas.ts). Forms, API endpoints and the CSV importer all validate with these, so a rule is written once.
 *
 * Conventions:
 * - Quantities stay in the unit they were logged in (a weight, count or volume); grams are worked out
 *   when stored (counts and volumes through a named weight, src/lib/count-volume.ts).
 * - Text fields are trimmed; an empty note or variety counts as none.
 * - In a patch, `null` clears an optional field (note, price, currency, variety, …).
 */
import { z } from 'zod';
import { mustBeNumber, mustBeWhole, oneOf, trueOrFalse } from './zod-messages';
import { isDate } from './months';
import { formatCount } from './format-number';
import { lineText, noteText as plainNote } from './text-schemas';
import { QUANTITY_RULES, QUANTITY_TOO_SMALL, roundQuantity } from './quantity-rules';
import { CROP_CATEGORIES } from './crop-categories';
import { WEIGHT_UNITS } from './units';
import { ENTRY_UNITS } from './entry-units';
import { isEatenUse, isSpreadUse, USES, type Use } from './uses';
import { PRESERVE_METHODS } from './retention';

// ---------------------------------------------------------------------------------------------
// Uses (defined in ./uses; re-exported for the forms and routes that import them from here)

export { EATEN_USES, isEatenUse, isSpreadUse, NOT_EATEN_USES, SPREAD_USES, USE_LABELS, USES, type Use } from './uses';

// ---------------------------------------------------------------------------------------------
// Limits

/** Bounds the schemas enforce. Example: `ENTRY_LIMITS.maxSpreadMonths` → 24 */
export const ENTRY_LIMITS = {
  /** Largest quantity in one entry, in the entry's unit: 100 t in kg; catches a slipped keyboard. */
  maxQuantity: 100_000,
  maxNoteLength: 500,
  minSpreadMonths: 1,
  maxSpreadMonths: 24,
  maxSplitParts: 7,
  maxNameLength: 120,
  maxPrice: 10_000_000,
  minYear: 1900,
  maxYear: 2199,
  defaultPageSize: 50,
  maxPageSize: 200,
} as const;

const L = ENTRY_LIMITS;

// ---------------------------------------------------------------------------------------------
// Field schemas

/** True for 'YYYY-MM-DD' naming a day that exists (months.ts's isDate). Example: `isRealIsoDate('2026-02-30')` → false */
export const isRealIsoDate: (text: string) => boolean = isDate;

/** A calendar date written 'YYYY-MM-DD', between 1900 and 2199. Example: `isoDate.parse('2028-02-29')` → '2028-02-29' */
export const isoDate = z
  .string({ error: 'Enter a date as YYYY-MM-DD.' })
  .trim()
  .regex(/^\d{4}-\d{2}-\d{2}$/, { error: 'Write the date as YYYY-MM-DD, for example 2026-07-14.' })
  .refine(isRealIsoDate, { error: 'That day does not exist in the calendar; check the month and day.', abort: true })
  .refine((d) => Number(d.slice(0, 4)) >= L.minYear && Number(d.slice(0, 4)) <= L.maxYear, {
    error: `The year must be between ${L.minYear} and ${L.maxYear}; check for a typing slip.`,
  });

/** A database id: a positive whole number. Example: `recordId.parse(7)` → 7 */
export const recordId = z
  .number({ error: 'Choose one from the list.' })
  .int({ error: 'An id is a whole number.' })
  .positive({ error: 'An id is a positive whole number.' });

/** An amount in the entry's unit, at least 0.001, kept to 6 decimals (quantity-rules.ts). Example: `quantity.parse(1.5)` → 1.5 */
export const quantity = z
  .number({ error: (iss) => (iss.input === undefined ? 'Enter the weight.' : mustBeNumber('The weight')) })
  .positive({ error: 'The weight must be more than 0.', abort: true })
  .min(QUANTITY_RULES.min, { error: QUANTITY_TOO_SMALL })
  .max(L.maxQuantity, { error: `The weight is too large (at most ${formatCount(L.maxQuantity)} in its unit); check the unit.` })
  .overwrite(roundQuantity);

/** One of g, kg, oz, lb. Example: `weightUnit.parse('lb')` → 'lb' */
export const weightUnit = z.enum(WEIGHT_UNITS, { error: oneOf('The unit', WEIGHT_UNITS) });

/**
 * Any unit an entry can be logged in: a weight, a count (piece, bunch, head) or a volume (ml, l,
 * cup, fl_oz, pint_us, pint_imp); counts and volumes are weighed through src/lib/count-volume.ts.
 * Example: `entryUnit.parse('piece')` → 'piece'
 */
export const entryUnit = z.enum(ENTRY_UNITS, { error: oneOf('The unit', ENTRY_UNITS) });

/** One of the uses. Example: `use.parse('seed')` → 'seed' */
export const use = z.enum(USES, { error: oneOf('The use', USES) });

/** How preserved food was kept (its vitamins are reduced by the retention factors). Example: `preserveMethod.parse('frozen')` → 'frozen' */
export const preserveMethod = z.enum(PRESERVE_METHODS, { error: oneOf('The preserving method', PRESERVE_METHODS) });

/** Whole months from 1 to 24. Example: `spreadMonths.parse(6)` → 6 */
export const spreadMonths = z
  .number({ error: 'The spread must be a number of months.' })
  .int({ error: 'The spread must be a whole number of months.' })
  .min(L.minSpreadMonths, { error: `The spread must be at least ${L.minSpreadMonths} month.` })
  .max(L.maxSpreadMonths, { error: `The spread can be at most ${L.maxSpreadMonths} months.` });

const noteText = plainNote('The note', L.maxNoteLength);

/** A free-text note up to 500 characters; blank becomes no note. Example: `note.parse('  ')` → undefined */
export const note = noteText.transform((s) => (s === '' ? undefined : s));

// In a patch: null or blank clears the note.
const noteOrClear = z.union([noteText.transform((s) => (s === '' ? null : s)), z.null()]);

const trimmedFlag = z.boolean({ error: trueOrFalse('Trimmed') });

/** Price paid, 0 or more. Example: `price.parse(3.49)` → 3.49 */
export const price = z
  .number({ error: mustBeNumber('The price') })
  .min(0, { error: 'The price cannot be negative.' })
  .max(L.maxPrice, { error: 'The price is too large; check it.' });

/** ISO 4217 currency code, upper-cased. Example: `currency.parse('eur')` → 'EUR' */
export const currency = z
  .string({ error: 'The currency must be a code like EUR or USD.' })
  .trim()
  .toUpperCase()
  .regex(/^[A-Z]{3}$/, { error: 'The currency must be a three-letter ISO 4217 code, like EUR or USD.' });

/** A one-line name of up to ENTRY_LIMITS.maxNameLength characters (crops, staples). */
export const nameText = (what: string) => lineText(`The ${what}`, L.maxNameLength);

// ---------------------------------------------------------------------------------------------
// Shared rules

type Ctx = z.RefinementCtx;

// Fresh food is counted in its own month and food that is not eaten is not counted at all, so a
// spread only means something for stored and preserved food.
function checkSpreadForUse(value: { use?: Use | undefined; spreadMonths?: number | undefined }, ctx: Ctx): void {
  if (value.use === undefined || value.spreadMonths === undefined) return;
  if (!isSpreadUse(value.use) && value.spreadMonths !== 1) {
    ctx.addIssue({
      code: 'custom',
      path: ['spreadMonths'],
      message: 'Only stored or preserved food is spread over months; leave the spread empty (or 1) for this use.',
    });
  }
}

// Only preserved food is frozen, canned, dried or fermented; the method reduces its vitamins.
function checkPreserveForUse(value: { use?: Use | undefined; preserveMethod?: string | null | undefined }, ctx: Ctx): void {
  if (value.preserveMethod == null || value.use === undefined) return;
  if (value.use !== 'preserved') {
    ctx.addIssue({
      code: 'custom',
      path: ['preserveMethod'],
      message: 'Only preserved food has a preserving method; leave the method empty, or set the use to preserved.',
    });
  }
}

function checkOneOfCropFood(value: { cropId?: number | undefined; foodId?: number | undefined }, ctx: Ctx, required: boolean): void {
  const hasCrop = value.cropId !== undefined;
  const hasFood = value.foodId !== undefined;
  if (hasCrop && hasFood) {
    ctx.addIssue({ code: 'custom', path: ['foodId'], message: 'Give either a crop or a reference food, not both.' });
  } else if (required && !hasCrop && !hasFood) {
    ctx.addIssue({ code: 'custom', path: ['cropId'], message: 'Choose the crop (or a reference food) this harvest is of.' });
  }
}

/** A patch must change something. */
export function checkNotEmpty(value: object, ctx: z.RefinementCtx): void {
  if (Object.values(value).every((v) => v === undefined)) {
    ctx.addIssue({ code: 'custom', path: [], message: 'Nothing to change: give at least one field.' });
  }
}

// Fresh food and food that is not eaten fall in the entry's month: spread 1. Stored and preserved
// food without a spread is left without one, for the server to fill from the crop or its category.
function withSpreadDefault<T extends { use: Use; spreadMonths?: number | undefined }>(value: T): T {
  if (value.spreadMonths !== undefined || isSpreadUse(value.use)) return value;
  return { ...value, spreadMonths: 1 };
}

// ---------------------------------------------------------------------------------------------
// Harvests

const harvestFields = {
  date: isoDate,
  quantity,
  unit: entryUnit,
  use: use.default('fresh'),
  spreadMonths: spreadMonths.optional(),
  preserveMethod: preserveMethod.nullable().optional(),
  trimmed: trimmedFlag.default(false),
  note: note.optional(),
};

const cropOrFood = { cropId: recordId.optional(), foodId: recordId.optional() };

/**
 * A harvest: date, exactly one of cropId / foodId, quantity in its unit, use (default fresh),
 * spread (1 for every use but stored/preserved, where an absent spread is left for the server to
 * fill from the crop or its category), preserving method (only for use preserved), trimmed
 * (default false), note.
 * Example: `harvestInput.parse({ date: '2026-07-14', cropId: 3, quantity: 2.5, unit: 'kg' })`
 *   → { date: '2026-07-14', cropId: 3, quantity: 2.5, unit: 'kg', use: 'fresh', spreadMonths: 1, trimmed: false }
 */
export const harvestInput = z
  // plantingId: the planting it came from (its own crop's), for the household's own yield per m².
  // splitWith: a harvest whose weighing this one joins as a part (undoing the delete of a part).
  .strictObject({ ...cropOrFood, ...harvestFields, plantingId: recordId.optional(), splitWith: recordId.optional() })
  .superRefine((v, ctx) => checkOneOfCropFood(v, ctx, true))
  .superRefine(checkSpreadForUse)
  .superRefine(checkPreserveForUse)
  .transform(withSpreadDefault);

export type HarvestInput = z.output<typeof harvestInput>;
/** What a form or a client sends before defaults are applied. */
export type HarvestInputRaw = z.input<typeof harvestInput>;

/**
 * A harvest before its crop or food is known — a CSV row, resolved later by name or code.
 * Example: `harvestDetailsInput.parse({ date: '2026-07-14', quantity: 1, unit: 'lb', use: 'stored' })`
 */
export const harvestDetailsInput = z
  .object(harvestFields)
  .superRefine(checkSpreadForUse)
  .superRefine(checkPreserveForUse)
  .transform(withSpreadDefault);

export type HarvestDetails = z.output<typeof harvestDetailsInput>;

const splitPart = z
  .strictObject({ quantity, use, spreadMonths: spreadMonths.optional(), preserveMethod: preserveMethod.nullable().optional() })
  .superRefine(checkSpreadForUse)
  .superRefine(checkPreserveForUse)
  .transform(withSpreadDefault);

/**
 * One weighing split between uses: shared date, crop or food, unit, trimmed and note, and 1–7 parts
 * each with its own quantity (in the shared unit), use and spread. The weighed total is the sum of
 * the parts. Example: `harvestSplitInput.parse({ date: '2026-09-20', cropId: 4, unit: 'kg',
 *   parts: [{ quantity: 20, use: 'stored' }, { quantity: 2, use: 'fresh' }] })`
 */
export const harvestSplitInput = z
  .strictObject({
    ...cropOrFood,
    date: isoDate,
    unit: entryUnit,
    trimmed: trimmedFlag.default(false),
    note: note.optional(),
    parts: z
      .array(splitPart, { error: 'List the parts of the split.' })
      .min(1, { error: 'A split needs at least one part.' })
      .max(L.maxSplitParts, { error: `A split can have at most ${L.maxSplitParts} parts.` }),
  })
  .superRefine((v, ctx) => checkOneOfCropFood(v, ctx, true));

export type HarvestSplitInput = z.output<typeof harvestSplitInput>;

/** Turns a split into one harvest per part. Example: `splitToHarvests(split).length` → split.parts.length */
export function splitToHarvests(split: HarvestSplitInput): HarvestInput[] {
  const { parts, ...shared } = split;
  return parts.map((part) => harvestInput.parse({ ...shared, ...part }));
}

/**
 * A change to a harvest: any of its fields, at least one. Setting cropId replaces the foodId and the
 * other way round; a null note clears it. Defaults are not applied: use mergeHarvestPatch.
 * Example: `harvestPatch.parse({ quantity: 3 })` → { quantity: 3 }
 */
export const harvestPatch = z
  .strictObject({
    date: isoDate,
    cropId: recordId,
    foodId: recordId,
    quantity,
    unit: entryUnit,
    use,
    spreadMonths,
    preserveMethod: preserveMethod.nullable(),
    trimmed: trimmedFlag,
    note: noteOrClear,
    plantingId: recordId.nullable(),
  })
  .partial()
  .superRefine(checkNotEmpty)
  .superRefine((v, ctx) => checkOneOfCropFood(v, ctx, false))
  .superRefine(checkSpreadForUse)
  .superRefine(checkPreserveForUse);

export type HarvestPatch = z.output<typeof harvestPatch>;

export type Stored<T> = { [K in keyof T]?: T[K] | null };

/** Applies a patch to a stored row: nulls mean "none", a patch's null clears the field. */
export function mergeFields(current: Record<string, unknown>, patch: Record<string, unknown>): Record<string, unknown> {
  const merged: Record<string, unknown> = {};
  for (const [key, value] of Object.entries(current)) if (value !== null && value !== undefined) merged[key] = value;
  for (const [key, value] of Object.entries(patch)) {
    if (value === undefined) continue;
    if (value === null) delete merged[key];
    else merged[key] = value;
  }
  return merged;
}

/**
 * The harvest after a patch, validated as a whole. A patch that sets cropId drops the foodId (and
 * the other way round); a patch that changes the use without a spread drops the old spread, so the
 * new use's default applies, and one that changes it away from preserved drops the preserving method.
 * Example: `mergeHarvestPatch(entry, { use: 'fresh' }).data?.spreadMonths` → 1
 */
export function mergeHarvestPatch(
  current: Stored<HarvestInput>,
  patch: HarvestPatch,
): z.ZodSafeParseResult<HarvestInput> {
  const base: Record<string, unknown> = { ...current };
  if (patch.cropId !== undefined) delete base.foodId;
  if (patch.foodId !== undefined) delete base.cropId;
  if (patch.use !== undefined && patch.use !== current.use && patch.spreadMonths === undefined) delete base.spreadMonths;
  // Leaving 'preserved' drops the method (it would be refused); a patch naming one keeps it.
  if (patch.use !== undefined && patch.use !== 'preserved' && patch.preserveMethod === undefined) delete base.preserveMethod;
  return harvestInput.safeParse(mergeFields(base, patch));
}

/** A crop as far as the use rule needs it. */
export interface CropUseInfo {
  name?: string;
  notFood?: boolean | null;
}

/**
 * Why a use is not allowed for a crop, or undefined when it is: a crop marked not food (ornamental
 * or toxic) can only be logged as seed, given, sold or lost. The server and the importer call this
 * once the crop is known. Example: `cropUseError('fresh', { name: 'Foxglove', notFood: true })`
 *   → 'Foxglove is marked as not food, so it can only be logged as seed, given, sold or lost.'
 */
export function cropUseError(entryUse: Use, crop: CropUseInfo): string | undefined {
  if (!crop.notFood || !isEatenUse(entryUse)) return undefined;
  const who = crop.name?.trim() || 'This crop';
  return `${who} is marked as not food, so it can only be logged as seed, given, sold or lost.`;
}

// ---------------------------------------------------------------------------------------------
// Bought food

const purchaseFields = {
  date: isoDate,
  quantity,
  unit: entryUnit,
  price: price.optional(),
  currency: currency.optional(),
  spreadMonths: spreadMonths.default(1),
  trimmed: trimmedFlag.default(false),
  note: note.optional(),
};

/**
 * Bought food: date, reference food, quantity in its unit, optional price and currency, spread
 * (default 1; a bulk buy eaten over months sets more), trimmed (default false), note.
 * Example: `purchaseInput.parse({ date: '2026-03-02', foodId: 5, quantity: 25, unit: 'kg', spreadMonths: 6 })`
 */
export const purchaseInput = z.strictObject({ foodId: recordId, ...purchaseFields });

export type PurchaseInput = z.output<typeof purchaseInput>;
export type PurchaseInputRaw = z.input<typeof purchaseInput>;

/** Bought food before its food is known — a CSV row. Example: `purchaseDetailsInput.parse({ date: '2026-03-02', quantity: 1, unit: 'kg' })` */
export const purchaseDetailsInput = z.object(purchaseFields);

export type PurchaseDetails = z.output<typeof purchaseDetailsInput>;

/**
 * A change to bought food: any field, at least one; null clears price, currency or note.
 * Example: `purchasePatch.parse({ price: null })` → { price: null }
 */
export const purchasePatch = z
  .strictObject({
    date: isoDate,
    foodId: recordId,
    quantity,
    unit: entryUnit,
    price: price.nullable(),
    currency: currency.nullable(),
    spreadMonths,
    trimmed: trimmedFlag,
    note: noteOrClear,
  })
  .partial()
  .superRefine(checkNotEmpty);

export type PurchasePatch = z.output<typeof purchasePatch>;

/** Bought food after a patch, validated as a whole. Example: `mergePurchasePatch(entry, { quantity: 2 }).success` → true */
export function mergePurchasePatch(
  current: Stored<PurchaseInput>,
  patch: PurchasePatch,
): z.ZodSafeParseResult<PurchaseInput> {
  return purchaseInput.safeParse(mergeFields({ ...current }, patch));
}

// ---------------------------------------------------------------------------------------------
// Staples (foods bought again and again)

/**
 * A staple: the reference food, a label (blank takes the food's name), the usual quantity and unit,
 * and the months one lasts (default 1). Example: `stapleInput.parse({ foodId: 5, quantity: 25, unit: 'kg', spreadMonths: 6 })`
 *   → { foodId: 5, quantity: 25, unit: 'kg', spreadMonths: 6 }
 */
export const stapleInput = z.strictObject({
  foodId: recordId,
  label: nameText('label')
    .transform((s) => (s === '' ? undefined : s))
    .optional(),
  quantity,
  unit: entryUnit,
  spreadMonths: spreadMonths.default(1),
});

export type StapleInput = z.output<typeof stapleInput>;

/** Logging a staple as bought: the date, default today in the household. Example: `stapleLogInput.parse({})` → {} */
export const stapleLogInput = z.strictObject({ date: isoDate.optional() });

// ---------------------------------------------------------------------------------------------
// Error answers

// The error body is shared by every API route and form (src/lib/error-body.ts).
export { FORM_FIELD, zodErrorBody, type InvalidInputBody } from './error-body';
