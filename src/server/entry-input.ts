/**
 * Small shared pieces of the entry routes and data layer (crops, harvests, bought food, staples,
 * imports): one way to turn a zod failure into a 400, the transaction type, database error tests
 * and the household's local date.
 */
import { sql } from 'drizzle-orm';
import type { z } from 'zod';
import type { Db } from '@/db/client';
import { zodErrorBody } from '@/lib/error-body';
import { parseRouteId } from '@/lib/route-id';
import { HttpError } from './http';

/** A Drizzle transaction (what `db.transaction(fn)` hands to fn). */
export type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];

/** The shared client or a transaction: data-layer functions accept either. */
export type Executor = Db | Tx;

/**
 * Validates input with a schema of entry-schemas.ts; a failure is a 400 `invalid_input` answer with
 * one message per field (zodErrorBody). Example: `parseInput(harvestInput, body)` → HarvestInput
 */
export function parseInput<S extends z.ZodType>(schema: S, value: unknown): z.output<S> {
  const r = schema.safeParse(value);
  if (r.success) return r.data;
  throw invalidInput(r.error);
}

/** The 400 for a zod error, in the API's error shape. */
export function invalidInput(err: z.ZodError): HttpError {
  const body = zodErrorBody(err);
  return new HttpError(400, body.code, body.message, body.fields);
}

/** A 400 naming one field. Example: `fieldError('cropId', 'No such crop in this household.')` */
export function fieldError(field: string, message: string, code = 'invalid_input'): HttpError {
  return new HttpError(400, code, `${field}: ${message}`, { [field]: message });
}

// readOptionalJson lives with the other body readers in ./http.

/**
 * Takes a shared lock on the household's row at the start of a write transaction, or answers 404
 * when it is gone: a concurrent deletion (which locks the row first, for update) then waits for
 * this write to end, or this write waits for the deletion and finds nothing — never half of each.
 */
export async function lockHousehold(tx: Tx, householdId: number): Promise<void> {
  const [rows] = (await tx.execute(sql`SELECT id FROM households WHERE id = ${householdId} LOCK IN SHARE MODE`)) as unknown as [unknown[]];
  if (rows.length === 0) throw new HttpError(404, 'not_found', 'No such household.');
}

/** A route parameter holding a record id, or a 404 when it is not one. */
export function idParam(value: string | undefined, what: string): number {
  const id = parseRouteId(value);
  if (id === null) throw new HttpError(404, 'not_found', `No such ${what}.`);
  return id;
}
