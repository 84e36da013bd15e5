/**
 * What the harvest form holds and how it becomes a request. The form keeps what was typed (text,
 * so "1,2" and a half-typed number survive); the resolver turns it into the body the endpoint
 * takes and checks it with the endpoint's own schemas (`harvestInput`, `harvestSplitInput`) through
 * react-hook-form's zod resolver, adding only what the schemas cannot know in the garden: which
 * crop was tapped, whether it is food, and what is left for the last part of a split.
 */
import { zodResolver } from '@hookform/resolvers/zod';
import type { Resolver } from 'react-hook-form';
import { cropUseError, harvestInput, harvestSplitInput, isSpreadUse, type HarvestInput, type HarvestSplitInput, type Use } from '@/lib/entry-schemas';
import type { PreserveMethod } from '@/lib/retention';
import type { EntryUnit } from '@/lib/entry-units';
import { firstWins, flatErrors, nestErrors, type FlatErrors } from './form-errors';
import { formatQuantity, parseDecimal } from './quantity-text';

/** One part of a split weighing; `pid` names its inputs (`part-{pid}-qty`). */
export interface PartValues {
  pid: number;
  quantity: string;
  use: Use;
}

export interface HarvestFormValues {
  cropId: number | null;
  quantity: string;
  use: Use;
  /** Months a stored or preserved harvest is eaten over; blank takes the crop's usual. */
  spreadMonths: string;
  /** How the preserved food (or each preserved part) was kept; blank = not said. */
  preserveMethod: PreserveMethod | '';
  /** The planting the weighing came from (an id as text), '' = not said; counts toward the own yield per m². */
  plantingId: string;
  date: string;
  trimmed: boolean;
  note: string;
  /** One weighing shared between uses: `parts` holds them, the last takes the rest. */
  splitting: boolean;
  parts: PartValues[];
}

/** What the form knows besides what is typed into it: the remembered unit and the household's crops. */
export interface HarvestFormContext {
  unit: EntryUnit;
  crops: readonly { id: number; displayName: string; notFood: boolean }[];
  /** Today in the household's zone: a later date is refused, as the server refuses it. */
  today?: string;
}

/** The body sent to POST …/harvests: one harvest, or one weighing split between uses. */
export type HarvestBody = HarvestInput | HarvestSplitInput;

/** The form as it opens (and as the next entry starts, keeping the crop, date and trimmed flag). */
export function emptyHarvestValues(date: string): HarvestFormValues {
  return { cropId: null, quantity: '', use: 'fresh', spreadMonths: '', preserveMethod: '', plantingId: '', date, trimmed: false, note: '', splitting: false, parts: [] };
}

/** The whole weighing in its unit, as the body says it (one quantity, or the parts' sum). Example: { parts: [{ quantity: 3 }, { quantity: 7 }] } → 10 */
export function weighingQuantity(body: HarvestBody): number {
  return 'parts' in body ? body.parts.reduce((sum, p) => sum + p.quantity, 0) : body.quantity;
}

/** The weight left for the last part of a split (undefined until the whole weighing is a number). Example: quantity '10', parts ['3', …] → 7 */
export function restOf(values: Pick<HarvestFormValues, 'quantity' | 'parts'>): number | undefined {
  const total = parseDecimal(values.quantity);
  if (total === undefined || !Number.isFinite(total)) return undefined;
  return Math.round((total - othersSum(values.parts)) * 1e6) / 1e6;
}

function othersSum(parts: readonly PartValues[]): number {
  return parts.slice(0, -1).reduce((a, p) => a + (parseDecimal(p.quantity) ?? 0), 0);
}

/** The uses whose food is spread over months in what the form now says. */
export function spreadUsesOf(values: Pick<HarvestFormValues, 'splitting' | 'parts' | 'use'>): Use[] {
  return values.splitting ? values.parts.map((p) => p.use).filter(isSpreadUse) : isSpreadUse(values.use) ? [values.use] : [];
}

/** What the person sees for an entry: "1.2 kg Potato (Charlotte) — fresh" or "12 kg Potato — 3 kg fresh, 9 kg stored". */
export function harvestLabel(values: HarvestFormValues, unit: EntryUnit, cropName: string | undefined): string {
  const name = cropName ?? 'harvest';
  const total = parseDecimal(values.quantity) ?? 0;
  if (!values.splitting) return `${formatQuantity(total, unit)} ${name} — ${values.use}`;
  const rest = restOf(values);
  const bits = values.parts.map((p, i) => `${formatQuantity(i === values.parts.length - 1 ? rest ?? 0 : parseDecimal(p.quantity) ?? 0, unit)} ${p.use}`);
  return `${formatQuantity(total, unit)} ${name} — ${bits.join(', ')}`;
}

/** The request body the form's values stand for, before the schema checks it. */
export function harvestBody(values: HarvestFormValues, unit: EntryUnit): Record<string, unknown> {
  const spread = values.spreadMonths.trim() === '' ? undefined : Number(values.spreadMonths);
  const shared = { date: values.date, cropId: values.cropId ?? undefined, unit, trimmed: values.trimmed, note: values.note.trim() === '' ? undefined : values.note };
  // The method goes with preserved food only (the schema refuses it on any other use).
  const method = (use: Use) => (use === 'preserved' && values.preserveMethod !== '' ? { preserveMethod: values.preserveMethod } : {});
  // A single weighing may name its planting (a split weighing does not).
  const planting = values.plantingId === '' ? {} : { plantingId: Number(values.plantingId) };
  if (!values.splitting) return { ...shared, quantity: parseDecimal(values.quantity), use: values.use, spreadMonths: isSpreadUse(values.use) ? spread : undefined, ...method(values.use), ...planting };
  const rest = restOf(values);
  return {
    ...shared,
    parts: values.parts.map((p, i) => ({
      quantity: i === values.parts.length - 1 ? rest : parseDecimal(p.quantity),
      use: p.use,
      spreadMonths: isSpreadUse(p.use) ? spread : undefined,
      ...method(p.use),
    })),
  };
}

const singleResolver = zodResolver(harvestInput);
const splitResolver = zodResolver(harvestSplitInput);

/** The problems the schemas cannot see: no crop tapped, a date after today, the whole weighing and the rest of a split. */
function formChecks(values: HarvestFormValues, unit: EntryUnit, today: string | undefined): FlatErrors {
  const errs: FlatErrors = {};
  if (values.cropId === null) errs.cropId = 'Choose the crop you harvested.';
  // The same sentence as the server's (src/server/harvests.ts), which refuses it too.
  if (today && /^\d{4}-\d{2}-\d{2}$/.test(values.date) && values.date > today) {
    errs.date = `The harvest date ${values.date} is after today (${today} in the household's time zone); enter the day it was picked.`;
  }
  if (!values.splitting) return errs;
  const total = parseDecimal(values.quantity);
  if (total === undefined) errs.quantity = 'Enter the weight of the whole weighing.';
  else if (!(total > 0)) errs.quantity = 'The weight must be a number more than 0.';
  const rest = restOf(values);
  if (!errs.quantity && rest !== undefined && !(rest > 0)) {
    errs[`parts.${values.parts.length - 1}.quantity`] = `The other parts add up to ${formatQuantity(othersSum(values.parts), unit)}, which leaves nothing for the last part. Check the weights.`;
  }
  return errs;
}

/** A crop marked not food can only be seed, given, sold or lost: the use (or each part's) says so. */
function useChecks(values: HarvestFormValues, context: HarvestFormContext): FlatErrors {
  const crop = context.crops.find((c) => c.id === values.cropId);
  if (!crop) return {};
  const info = { name: crop.displayName, notFood: crop.notFood };
  const errs: FlatErrors = {};
  if (!values.splitting) {
    const e = cropUseError(values.use, info);
    if (e) errs.use = e;
  } else {
    values.parts.forEach((p, i) => {
      const e = cropUseError(p.use, info);
      if (e) errs[`parts.${i}.use`] = e;
    });
  }
  return errs;
}

/**
 * The harvest form's resolver: the form's own checks first, then the endpoint schema's messages
 * for the fields they leave alone, then the not-food rule over the use. On success the parsed
 * body (defaults applied) is what the submit handler receives.
 */
export const harvestResolver: Resolver<HarvestFormValues, HarvestFormContext, HarvestBody> = async (values, context, options) => {
  const ctx: HarvestFormContext = context ?? { unit: 'kg', crops: [] };
  const body = harvestBody(values, ctx.unit);
  // The body's paths are the form's paths, so the schema's errors land on the form's fields.
  // (The casts: the schema is typed by the body it reads, the options by the form they serve.)
  const r = values.splitting ? await splitResolver(body as never, undefined, options as never) : await singleResolver(body as never, undefined, options as never);
  const errs = firstWins(formChecks(values, ctx.unit, ctx.today), flatErrors(r.errors));
  Object.assign(errs, useChecks(values, ctx));
  if (Object.keys(errs).length === 0) return { values: r.values as HarvestBody, errors: {} };
  return { values: {}, errors: nestErrors(errs, options) };
};
