/**
 * The bridge between react-hook-form's errors and the flat "field path → sentence" records the
 * entry forms show (the same shape as the API's `fields`, e.g. `{ 'parts.1.use': '…' }`).
 * react-hook-form nests errors by path; the forms read them flat, so one error line, one
 * aria-describedby and one focus rule serve both the browser's check and the server's answer.
 */
import { toNestErrors } from '@hookform/resolvers';
import type { FieldError, FieldErrors, FieldValues, ResolverOptions } from 'react-hook-form';
import { FORM_FIELD } from '@/lib/error-body';

/** Field path → first message, in the order the problems were found. */
export type FlatErrors = Record<string, string>;

function isLeaf(node: unknown): node is FieldError {
  return typeof node === 'object' && node !== null && typeof (node as { type?: unknown }).type === 'string';
}

/**
 * react-hook-form's nested errors as a flat record; a field array's own error (`parts.root`) is
 * listed under the array's name, one about the whole input under `_form`. Example: `flatErrors({ parts: [{ use: { type: 'x', message: 'M' } }] })`
 *   → { 'parts.0.use': 'M' }
 */
export function flatErrors(errors: FieldErrors | undefined): FlatErrors {
  const out: FlatErrors = {};
  const walk = (node: unknown, path: string[]) => {
    if (isLeaf(node)) {
      // A problem with the whole input (a schema's root path, '') is listed as the API lists it.
      const key = (path[path.length - 1] === 'root' ? path.slice(0, -1) : path).join('.') || FORM_FIELD;
      if (node.message && !(key in out)) out[key] = String(node.message);
    }
    if (typeof node !== 'object' || node === null) return;
    for (const [k, v] of Object.entries(node)) {
      if (k === 'ref' || k === 'types' || k === 'message' || k === 'type') continue;
      walk(v, [...path, k]);
    }
  };
  walk(errors, []);
  return out;
}

/** A flat record as react-hook-form's nested errors, for a resolver to return. */
export function nestErrors<T extends FieldValues>(flat: FlatErrors, options: ResolverOptions<T>): FieldErrors<T> {
  const leaves = Object.fromEntries(Object.entries(flat).map(([k, message]) => [k, { type: 'invalid', message }]));
  return toNestErrors<T>(leaves, options);
}

/** Merges records, the earlier one winning for a field both name. Example: `firstWins({ a: '1' }, { a: '2', b: '3' })` → { a: '1', b: '3' } */
export function firstWins(...records: FlatErrors[]): FlatErrors {
  const out: FlatErrors = {};
  for (const r of records) for (const [k, v] of Object.entries(r)) if (v && !(k in out)) out[k] = v;
  return out;
}
