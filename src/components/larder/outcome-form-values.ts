/**
 * The "what happened to this lot" form: its values (strings, as the inputs hold them), the request
 * body they become, and a resolver that checks that body with the endpoint's own schema
 * (larderOutcomeInput), so the form and the API refuse the same things with the same words.
 */
import { z } from 'zod';
import type { LarderOutcomeKind } from '@/lib/larder-outcomes';
import { larderOutcomeInput, type LarderOutcomeInput } from '@/lib/larder-schemas';

export interface OutcomeFormValues {
  kind: LarderOutcomeKind;
  date: string;
  /** Share lost as offered in the list: '1', '0.5', … (spoiled only). */
  lostFraction: string;
  /** New end 'YYYY-MM-DD' (lasting longer only). */
  until: string;
  note: string;
}

/** The shares of a lot a grower can say were lost, most common first. */
export const LOST_SHARES = [
  { value: '1', label: 'All of what was left' },
  { value: '0.5', label: 'About half' },
  { value: '0.25', label: 'About a quarter' },
  { value: '0.1', label: 'About a tenth' },
] as const;

export function emptyOutcome(today: string): OutcomeFormValues {
  return { kind: 'used_up', date: today, lostFraction: '1', until: '', note: '' };
}

/**
 * The request body for a lot, keeping only the fields the kind uses,
 * e.g. outcomeBody(7, { kind: 'spoiled', date: '2027-01-10', lostFraction: '0.25', until: '', note: '' }) → { harvestId: 7, kind: 'spoiled', date: '2027-01-10', lostFraction: 0.25 }.
 */
export function outcomeBody(harvestId: number, v: OutcomeFormValues) {
  return {
    harvestId,
    kind: v.kind,
    date: v.date,
    ...(v.kind === 'spoiled' ? { lostFraction: Number(v.lostFraction) } : {}),
    ...(v.kind === 'lasted_longer' ? { until: v.until } : {}),
    ...(v.note.trim() ? { note: v.note } : {}),
  };
}

/** The form's schema: its values → the body, checked by the endpoint's schema. */
export function outcomeFormSchema(harvestId: number): z.ZodType<LarderOutcomeInput, OutcomeFormValues> {
  const values = z.object({ kind: z.string(), date: z.string(), lostFraction: z.string(), until: z.string(), note: z.string() });
  // The values' kind is a plain string to zod; the form only ever offers the outcome kinds.
  return values.transform((v) => outcomeBody(harvestId, v as OutcomeFormValues)).pipe(larderOutcomeInput) as unknown as z.ZodType<LarderOutcomeInput, OutcomeFormValues>;
}
