/**
 * What the bought-food form holds and how it becomes a request: the typed text is read into the
 * body of POST …/purchases and checked by the endpoint's own schema (`purchaseInput`) through
 * react-hook-form's zod resolver, with the form's own sentences for a food not yet chosen and a
 * price without its currency.
 */
import { zodResolver } from '@hookform/resolvers/zod';
import type { Resolver } from 'react-hook-form';
import { purchaseInput, type PurchaseInput } from '@/lib/entry-schemas';
import type { EntryUnit } from '@/lib/entry-units';
import type { FoodChoice } from './FoodPicker';
import { flatErrors, nestErrors } from './form-errors';
import { parseDecimal } from './quantity-text';

export interface PurchaseFormValues {
  food: FoodChoice | null;
  quantity: string;
  price: string;
  /** Months the food is eaten over: 1 for the week's shopping, more for a bulk buy. */
  spreadMonths: string;
  date: string;
  trimmed: boolean;
  note: string;
  /** Also save the entry as a staple, under `stapleLabel` (blank: the food's name). */
  asStaple: boolean;
  stapleLabel: string;
}

/** What the form knows besides what is typed into it: the remembered unit and currency. */
export interface PurchaseFormContext {
  unit: EntryUnit;
  currency: string;
}

/** The form as it opens. */
export function emptyPurchaseValues(date: string): PurchaseFormValues {
  return { food: null, quantity: '', price: '', spreadMonths: '1', date, trimmed: false, note: '', asStaple: false, stapleLabel: '' };
}

/** The request body the form's values stand for, before the schema checks it. */
export function purchaseBody(values: PurchaseFormValues, context: PurchaseFormContext): Record<string, unknown> {
  const price = parseDecimal(values.price);
  return {
    date: values.date,
    foodId: values.food?.id,
    quantity: parseDecimal(values.quantity),
    unit: context.unit,
    price,
    currency: price === undefined || context.currency.trim() === '' ? undefined : context.currency,
    spreadMonths: parseDecimal(values.spreadMonths) ?? 1,
    trimmed: values.trimmed,
    note: values.note.trim() === '' ? undefined : values.note,
  };
}

const schemaResolver = zodResolver(purchaseInput);

/** The bought-food form's resolver: the endpoint schema's messages, then the form's own for the food and currency. */
export const purchaseResolver: Resolver<PurchaseFormValues, PurchaseFormContext, PurchaseInput> = async (values, context, options) => {
  const ctx: PurchaseFormContext = context ?? { unit: 'kg', currency: '' };
  // The casts: the schema is typed by the body it reads, the options by the form they serve.
  const r = await schemaResolver(purchaseBody(values, ctx) as never, undefined, options as never);
  const errs = flatErrors(r.errors);
  if (!values.food) errs.foodId = 'Choose the food you bought from the reference foods.';
  if (parseDecimal(values.price) !== undefined && ctx.currency.trim() === '') errs.currency = 'Give the currency of the price, e.g. EUR or USD.';
  if (Object.keys(errs).length === 0) return { values: r.values as PurchaseInput, errors: {} };
  return { values: {}, errors: nestErrors(errs, options) };
};
