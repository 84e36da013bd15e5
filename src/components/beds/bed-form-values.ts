/**
 * What the beds page's forms hold and how each becomes a request: a bed (`bedInput`/`bedPatch`), a
 * planting (`plantingInput`/`plantingPatch`) and the frost dates (`seasonInput`), each checked in
 * the browser by the endpoint's own schema through react-hook-form's zod resolver. Text boxes hold
 * strings; a blank one is left out of a new record and clears the field of a changed one.
 */
import { zodResolver } from '@hookform/resolvers/zod';
import type { Resolver } from 'react-hook-form';
import { bedInput, bedPatch, plantingInput, plantingPatch, seasonInput } from '@/lib/bed-schemas';
import type { BedJson, PlantingJson, ReferenceCropOption } from '@/lib/bed-types';
import { harvestWindow, type FrostDates } from '@/lib/growing-season';
import type { PlantingSlot } from '@/lib/planting-slots';
import { flatErrors, nestErrors } from '@/components/entries/form-errors';
import { parseDecimal } from '@/components/entries/quantity-text';

/** Whether a form adds a record (POST) or changes one (PATCH). */
export interface FormContext {
  editing: boolean;
}

type Body = Record<string, unknown>;

/** A resolver that turns the form's values into the request body and checks it with the endpoint's schema (or patch schema). */
function bodyResolver<V extends Record<string, unknown>>(toBody: (v: V, editing: boolean) => Body, input: Parameters<typeof zodResolver>[0], patch: Parameters<typeof zodResolver>[0], rename: Record<string, string> = {}): Resolver<V, unknown, Body> {
  const inputResolver = zodResolver(input);
  const patchResolver = zodResolver(patch);
  return async (values, context, options) => {
    const editing = (context as FormContext | undefined)?.editing ?? false;
    const body = toBody(values, editing);
    const r = editing ? await patchResolver(body as never, undefined, options as never) : await inputResolver(body as never, undefined, options as never);
    const errs = flatErrors(r.errors);
    if (Object.keys(errs).length === 0) return { values: body, errors: {} };
    const named = Object.fromEntries(Object.entries(errs).map(([k, m]) => [rename[k] ?? k, m]));
    return { values: {}, errors: nestErrors(named, options) };
  };
}

const num = (text: string): number | undefined => parseDecimal(text);
const blankOr = (text: string, editing: boolean): string | null | undefined => (text.trim() === '' ? (editing ? null : undefined) : text);

// ── beds ──────────────────────────────────────────────────────────────────────────────────────

export interface BedFormValues extends Record<string, unknown> {
  name: string;
  area: string;
  notes: string;
}

export function bedFormValues(bed?: BedJson): BedFormValues {
  return { name: bed?.name ?? '', area: bed ? String(Math.round(bed.area * 100) / 100) : '', notes: bed?.notes ?? '' };
}

/** The request body of the bed form. Example: `bedBody({ name: 'North', area: '12', notes: '' }, false)` → { name: 'North', area: 12 } */
export function bedBody(v: BedFormValues, editing: boolean): Body {
  return { name: v.name, area: num(v.area), notes: blankOr(v.notes, editing) };
}

export const bedResolver = bodyResolver<BedFormValues>(bedBody, bedInput, bedPatch);

// ── plantings ─────────────────────────────────────────────────────────────────────────────────

export interface PlantingFormValues extends Record<string, unknown> {
  /** 'crop:ID' for a household crop, 'ref:KEY' for a reference crop. */
  crop: string;
  /** A bed id, or '' for none yet. */
  bedId: string;
  area: string;
  seasonYear: string;
  slot: PlantingSlot;
  sowDate: string;
  harvestFrom: string;
  harvestTo: string;
  notes: string;
}

export function plantingFormValues(year: number, p?: PlantingJson): PlantingFormValues {
  return {
    crop: p ? `crop:${p.cropId}` : '',
    bedId: p?.bedId != null ? String(p.bedId) : '',
    area: p ? String(Math.round(p.area * 100) / 100) : '',
    seasonYear: String(p?.seasonYear ?? year),
    slot: p?.slot ?? 'main',
    sowDate: p?.sowDate ?? '',
    harvestFrom: p?.harvestFrom ?? '',
    harvestTo: p?.harvestTo ?? '',
    notes: p?.notes ?? '',
  };
}

/**
 * The request body of the planting form. Example: `plantingBody({ crop: 'ref:garlic', bedId: '', area: '3', seasonYear: '2027', … }, false)`
 *   → { referenceKey: 'garlic', bedId: null, area: 3, seasonYear: 2027, slot: 'main' }
 */
export function plantingBody(v: PlantingFormValues, editing: boolean): Body {
  const [kind, id] = v.crop.split(':');
  const crop = kind === 'ref' ? { referenceKey: id } : kind === 'crop' ? { cropId: Number(id) } : {};
  if (editing && kind === 'ref') throw new Error('A planting being changed names a household crop.');
  return {
    ...crop,
    bedId: v.bedId === '' ? null : Number(v.bedId),
    area: num(v.area),
    seasonYear: num(v.seasonYear),
    slot: v.slot,
    sowDate: blankOr(v.sowDate, editing),
    harvestFrom: blankOr(v.harvestFrom, editing),
    harvestTo: blankOr(v.harvestTo, editing),
    notes: blankOr(v.notes, editing),
  };
}

export const plantingResolver = bodyResolver<PlantingFormValues>(plantingBody, plantingInput, plantingPatch, { cropId: 'crop', referenceKey: 'crop' });

/**
 * The expected harvest window of a reference crop in a season, for the form to prefill, or null.
 * Example: `expectedHarvest(garlicOption, 2027, { lastSpringFrost: '05-01', firstAutumnFrost: '10-01' })` → { from: '2027-07-10', to: '2027-08-07' }
 */
export function expectedHarvest(ref: ReferenceCropOption | undefined, year: number, frost: FrostDates): { from: string; to: string } | null {
  if (!ref || !Number.isInteger(year) || year < 1900 || year > 2199) return null;
  const w = harvestWindow(ref, year, frost);
  return { from: w.from, to: w.to };
}

// ── growing season ────────────────────────────────────────────────────────────────────────────

export interface SeasonFormValues extends Record<string, unknown> {
  lastSpringFrost: string;
  firstAutumnFrost: string;
}

/** The request body of the frost dates form: a blank date is null (the default). */
export function seasonBody(v: SeasonFormValues): Body {
  return { lastSpringFrost: v.lastSpringFrost.trim() || null, firstAutumnFrost: v.firstAutumnFrost.trim() || null };
}

export const seasonResolver = bodyResolver<SeasonFormValues>((v) => seasonBody(v), seasonInput, seasonInput);
