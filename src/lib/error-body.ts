/**
 * The body of a 400 answer for input that breaks the rules, in the one shape the whole API uses:
 * { code: "invalid_input", message, fields: { "path.to.field": "first message" } }.
 */
import type { z } from 'zod';

/** The body of a 400/422 answer for bad input (wrapped as `{ error: … }` by the route). */
export interface InvalidInputBody {
  code: 'invalid_input';
  message: string;
  /** Field path ('quantity', 'parts.1.use') → first message for it; '_form' for the input as a whole. */
  fields: Record<string, string>;
}

/** Key under which problems with the whole input (not one field) are listed in `fields`. */
export const FORM_FIELD = '_form';

/**
 * The one flattener of zod errors: field path → its first message, '_form' for the input as a
 * whole, and a misspelt or unknown field named so it is not silently dropped. The API's `fields`
 * and the forms' inline errors both come from here.
 * Example: `zodFieldErrors(harvestInput.safeParse({ quantity: 0 }).error!)` → { date: …, quantity: 'The weight must be more than 0.', … }
 */
export function zodFieldErrors(err: z.ZodError): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of err.issues) {
    const at = issue.path.map(String);
    if (issue.code === 'unrecognized_keys') {
      for (const k of issue.keys) fields[[...at, k].join('.')] ??= 'Unknown field: check its spelling.';
      continue;
    }
    const key = at.length === 0 ? FORM_FIELD : at.join('.');
    fields[key] ??= issue.message;
  }
  return fields;
}

/**
 * First message per field of a parse result, for inline form errors; {} when it succeeded.
 * Example: `fieldErrors(signInInput.safeParse({ email: 'x', password: '' }))` → { email: 'Enter an e-mail…', password: 'Enter your password.' }
 */
export function fieldErrors(result: { success: boolean; error?: z.ZodError }): Record<string, string> {
  return result.success || !result.error ? {} : zodFieldErrors(result.error);
}

/**
 * Turns a zod error into the answer body the API and the forms show.
 * Example: `zodErrorBody(harvestInput.safeParse({ date: '2026-02-30', cropId: 1, quantity: 0, unit: 'kg' }).error!)`
 *   → { code: 'invalid_input', message: 'date: That day does not exist … (and 1 more problem)', fields: { date: …, quantity: … } }
 */
export function zodErrorBody(err: z.ZodError): InvalidInputBody {
  const fields = zodFieldErrors(err);
  const first = err.issues[0];
  if (!first) return { code: 'invalid_input', message: 'The input is not valid.', fields };
  const where = first.path.length === 0 ? '' : `${first.path.map(String).join('.')}: `;
  const more = err.issues.length - 1;
  const tail = more === 0 ? '' : ` (and ${more} more problem${more === 1 ? '' : 's'})`;
  return { code: 'invalid_input', message: `${where}${first.message}${tail}`, fields };
}
