/**
 * What the crop form holds and how it becomes a request: a new crop is checked by the endpoint's
 * `cropInput`, a change by its `cropPatch` (where a blank field clears the crop's own value), both
 * through react-hook-form's zod resolver.
 */
import { zodResolver } from '@hookform/resolvers/zod';
import type { Resolver } from 'react-hook-form';
import type { CropCategory } from '@/lib/crop-categories';
import { type Use } from '@/lib/entry-schemas';
import { cropInput, cropPatch, type CropInput, type CropPatch } from '@/lib/crop-schemas';
import { fromGrams, toGrams, type UnitSystem } from '@/lib/units';
import type { Crop } from './api';
import type { FoodChoice } from './FoodPicker';
import { flatErrors, nestErrors } from './form-errors';
import { parseDecimal } from './quantity-text';

export interface CropFormValues {
  name: string;
  variety: string;
  /** '' (new crops only): the server takes the matching reference crop's category, else Other. */
  category: CropCategory | '';
  food: FoodChoice | null;
  /** The share eaten, in %, blank for the food's refuse. */
  eatenPct: string;
  /** The usual use, blank for the kind's usual. */
  use: Use | '';
  /** Months stored food lasts, blank for the kind's usual. */
  spread: string;
  notFood: boolean;
  /** The weight of one piece, bunch or head, in g (metric) or oz (US); blank = the food's household measures. */
  countWeight: string;
}

/** Whether the form adds a crop (POST, cropInput) or changes one (PATCH, cropPatch), and the household's units. */
export interface CropFormContext {
  editing: boolean;
  units?: UnitSystem;
}

/** The unit the weight of one is typed in: grams, or ounces in a US household. Example: `countWeightUnit('us')` → 'oz' */
export function countWeightUnit(units: UnitSystem = 'metric'): 'g' | 'oz' {
  return units === 'us' ? 'oz' : 'g';
}

/** The form's values for a new crop, or for changing `crop`. */
export function cropFormValues(crop?: Crop, units: UnitSystem = 'metric'): CropFormValues {
  const unit = countWeightUnit(units);
  return {
    name: crop?.name ?? '',
    variety: crop?.variety ?? '',
    category: crop?.category ?? '',
    food: crop?.food ? { id: crop.food.id, name: crop.food.name, code: crop.food.code, dataset: crop.food.dataset, refusePct: crop.food.refusePct } : null,
    eatenPct: crop?.edibleFraction != null ? String(Math.round(crop.edibleFraction * 1000) / 10) : '',
    use: crop?.defaultUse ?? '',
    spread: crop?.defaultSpreadMonths != null ? String(crop.defaultSpreadMonths) : '',
    notFood: crop?.notFood ?? false,
    countWeight: crop?.countGrams != null ? String(Math.round(fromGrams(crop.countGrams, unit) * 100) / 100) : '',
  };
}

/** The request body the form's values stand for: in a change, a blank field is null (cleared); in a new crop it is left out. */
export function cropBody(values: CropFormValues, editing: boolean, units: UnitSystem = 'metric'): Record<string, unknown> {
  const fraction = parseDecimal(values.eatenPct);
  const spread = parseDecimal(values.spread);
  const one = parseDecimal(values.countWeight);
  const blank = editing ? null : undefined;
  return {
    name: values.name,
    variety: editing ? (values.variety.trim() === '' ? null : values.variety) : values.variety,
    category: values.category === '' ? undefined : values.category,
    foodId: values.notFood ? null : (values.food?.id ?? null),
    edibleFraction: values.notFood || fraction === undefined ? blank : fraction / 100,
    defaultUse: values.use === '' ? blank : values.use,
    defaultSpreadMonths: spread === undefined ? blank : spread,
    notFood: values.notFood,
    // Stored in grams; an ounce is 28.349523125 g exactly (International Yard and Pound Agreement, 1959).
    countGrams: one === undefined ? blank : Number.isFinite(one) ? toGrams(one, countWeightUnit(units)) : one,
  };
}

const inputResolver = zodResolver(cropInput);
const patchResolver = zodResolver(cropPatch);

/** The crop form's resolver: the endpoint's own schema, its messages as they are. */
export const cropResolver: Resolver<CropFormValues, CropFormContext, CropInput | CropPatch> = async (values, context, options) => {
  const editing = context?.editing ?? false;
  const body = cropBody(values, editing, context?.units);
  // The casts: the schema is typed by the body it reads, the options by the form they serve.
  const r = editing ? await patchResolver(body as never, undefined, options as never) : await inputResolver(body as never, undefined, options as never);
  const errs = flatErrors(r.errors);
  if (Object.keys(errs).length === 0) return { values: r.values as CropInput | CropPatch, errors: {} };
  return { values: {}, errors: nestErrors(errs, options) };
};
