/**
 * The household's staples list (foods it buys again and again), so that logging another sack of
 * flour is one tap. Every function takes the household id and touches only that household's rows.
 */
import { and, asc, eq } from 'drizzle-orm';
import { getDb } from '@/db/client';
import { foods, staples, type Household } from '@/db/schema';
import type { StapleJson } from '@/lib/api-types';
import type { StapleInput } from '@/lib/entry-schemas';
import { isDuplicateKey } from './db-errors';
import { requireFood } from './crops';
import { HttpError } from './http';
import { todayIn } from '@/lib/months';
import type { Executor, Tx } from './entry-input';
import type { PurchaseJson } from '@/lib/entry-types';
import { createPurchase } from './purchases';
import { isCountOrVolume } from '@/lib/entry-units';
import { measuredFood, weighEntry } from './unit-weights';


function joined(ex: Executor) {
  return ex
    .select({
      id: staples.id,
      foodId: staples.foodId,
      foodName: foods.name,
      foodCode: foods.code,
      label: staples.label,
      quantity: staples.quantity,
      unit: staples.unit,
      spreadMonths: staples.spreadMonths,
    })
    .from(staples)
    .innerJoin(foods, eq(foods.id, staples.foodId));
}

/** The household's staples, by label. */
export async function listStaples(householdId: number, ex: Executor = getDb()): Promise<StapleJson[]> {
  return joined(ex).where(eq(staples.householdId, householdId)).orderBy(asc(staples.label), asc(staples.id));
}

/** One staple of the household, or 404. */
export async function getStaple(householdId: number, stapleId: number, ex: Executor = getDb()): Promise<StapleJson> {
  const [row] = await joined(ex).where(and(eq(staples.householdId, householdId), eq(staples.id, stapleId))).limit(1);
  if (!row) throw new HttpError(404, 'not_found', 'No such staple in this household.');
  return row;
}

/** Adds a staple; its label defaults to the food's name. 409 when the same food and amount is already one. */
export async function createStaple(householdId: number, input: StapleInput): Promise<StapleJson> {
  return getDb().transaction(async (tx) => {
    const food = await requireFood(tx, input.foodId);
    // A staple by the piece or the litre must be one its food can weigh (422 otherwise), as its purchases will be.
    if (isCountOrVolume(input.unit)) weighEntry(input.quantity, input.unit, { food: await measuredFood(tx, input.foodId) });
    try {
      const [res] = await tx.insert(staples).values({
        householdId,
        foodId: input.foodId,
        label: input.label ?? food.name.slice(0, 120),
        quantity: input.quantity,
        unit: input.unit,
        spreadMonths: input.spreadMonths,
      });
      return getStaple(householdId, res.insertId, tx);
    } catch (e) {
      if (isDuplicateKey(e)) throw new HttpError(409, 'duplicate', 'This food in this amount is already on the staples list.');
      throw e;
    }
  });
}

/** Removes a staple (purchases logged from it stay). */
export async function deleteStaple(householdId: number, stapleId: number): Promise<void> {
  const [res] = await getDb()
    .delete(staples)
    .where(and(eq(staples.householdId, householdId), eq(staples.id, stapleId)));
  if (res.affectedRows === 0) throw new HttpError(404, 'not_found', 'No such staple in this household.');
}

/** Logs a staple as bought (on the date given, else today in the household's time zone), in the caller's transaction. */
export async function logStaple(tx: Tx, household: Household, userId: string | null, stapleId: number, date?: string): Promise<PurchaseJson> {
  const staple = await getStaple(household.id, stapleId, tx);
  return createPurchase(tx, household.id, userId, {
    date: date ?? todayIn(household.timezone),
    foodId: staple.foodId,
    quantity: staple.quantity,
    unit: staple.unit,
    spreadMonths: staple.spreadMonths,
    trimmed: false,
    // The label says which pack it was ("25 kg sack"); the food's own name adds nothing.
    ...(staple.label !== staple.foodName ? { note: staple.label } : {}),
  });
}
