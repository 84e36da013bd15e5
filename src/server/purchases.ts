/**
 * Bought food in the database. Every function takes the household id and touches only that
 * household's rows. Grams and edible grams (the food's refuse taken off unless weighed trimmed) are
 * worked out at write time and again on every change; a count or volume is weighed by the food's
 * household measures (src/lib/count-volume.ts). The first purchase with a currency gives a household
 * without one its currency.
 */
import { and, asc, desc, eq, isNull } from 'drizzle-orm';
import { getDb } from '@/db/client';
import { foods, households, purchases, type Purchase } from '@/db/schema';
import { edibleGrams } from '@/lib/edible';
import { mergePurchasePatch, type PurchaseInput, type PurchasePatch } from '@/lib/entry-schemas';
import { type PurchaseQuery } from '@/lib/list-query-schemas';
import type { PurchaseJson, PurchaseList } from '@/lib/entry-types';
import { isCountOrVolume } from '@/lib/entry-units';
import type { MeasuredFood } from '@/lib/count-volume';
import { requireFood } from './crops';
import { HttpError } from './http';
import { invalidInput, type Executor, type Tx } from './entry-input';
import { listEntries, type EntryListSpec } from './entry-list';
import { deleteEntry, updateEntry, type EntryUpdateSpec } from './entry-update';
import { measuredFood, weighEntry } from './unit-weights';


const NOT_FOUND = 'No such bought food in this household.';

/** What bought food's numbers rest on: its food's refuse and, for a count or volume, its household measures. */
export interface PurchaseBasis {
  refusePct: number | null;
  measured?: MeasuredFood | null;
}

/** The food of an entry with its measures read when the unit is a count or volume; 400 when there is no such food. */
export async function purchaseBasis(ex: Executor, foodId: number, unit: string): Promise<PurchaseBasis> {
  const food = await requireFood(ex, foodId);
  return { refusePct: food.refusePct, measured: isCountOrVolume(unit) ? await measuredFood(ex, foodId) : null };
}

/**
 * The stored columns of a purchase from its input and its food: a count or volume weighed by the
 * food's household measure is edible as logged (SR28 gives those weights edible); 422 without one.
 */
export function purchaseValues(input: PurchaseInput, basis: PurchaseBasis) {
  const { grams, weightSource, edibleAsLogged } = weighEntry(input.quantity, input.unit, { food: basis.measured ?? null });
  return {
    foodId: input.foodId,
    date: input.date,
    quantity: input.quantity,
    unit: input.unit,
    grams,
    // Bought food has refuse too (bought bananas have peels).
    edibleGrams: edibleGrams(grams, { refusePercent: basis.refusePct, trimmed: input.trimmed || edibleAsLogged }),
    weightSource,
    // DECIMAL(12,2): written as text so that 3.49 is stored as 3.49.
    price: input.price === undefined ? null : input.price.toFixed(2),
    currency: input.currency ?? null,
    spreadMonths: input.spreadMonths,
    trimmed: input.trimmed,
    note: input.note ?? null,
  };
}

type JoinedRow = { p: Purchase; foodName: string; foodCode: string };

function toJson(r: JoinedRow): PurchaseJson {
  const p = r.p;
  return {
    id: p.id,
    date: p.date,
    foodId: p.foodId,
    foodName: r.foodName,
    foodCode: r.foodCode,
    quantity: p.quantity,
    unit: p.unit,
    grams: p.grams,
    edibleGrams: p.edibleGrams,
    weightSource: p.weightSource,
    price: p.price === null ? null : Number(p.price),
    currency: p.currency,
    spreadMonths: p.spreadMonths,
    trimmed: p.trimmed,
    note: p.note,
    createdAt: p.createdAt.toISOString(),
  };
}

function joined(ex: Executor) {
  return ex.select({ p: purchases, foodName: foods.name, foodCode: foods.code }).from(purchases).innerJoin(foods, eq(foods.id, purchases.foodId));
}

/** One purchase of the household as JSON, or 404. */
export async function getPurchase(householdId: number, purchaseId: number, ex: Executor = getDb()): Promise<PurchaseJson> {
  const [row] = await joined(ex).where(and(eq(purchases.householdId, householdId), eq(purchases.id, purchaseId))).limit(1);
  if (!row) throw new HttpError(404, 'not_found', NOT_FOUND);
  return toJson(row);
}

/** Stores bought food in a transaction. Example: `await createPurchase(tx, 7, userId, purchaseInput.parse(body))` → PurchaseJson */
export async function createPurchase(tx: Tx, householdId: number, userId: string | null, input: PurchaseInput): Promise<PurchaseJson> {
  const basis = await purchaseBasis(tx, input.foodId, input.unit);
  const [res] = await tx.insert(purchases).values({ ...purchaseValues(input, basis), householdId, createdBy: userId });
  if (input.currency !== undefined) await adoptCurrency(tx, householdId, input.currency);
  return getPurchase(householdId, res.insertId, tx);
}

/** A household without a currency takes the one its purchase was paid in (the purchase form then starts with it). */
export async function adoptCurrency(ex: Executor, householdId: number, currency: string): Promise<void> {
  await ex.update(households).set({ currency }).where(and(eq(households.id, householdId), isNull(households.currency)));
}

/** The bought-food list's part of the shared list: food names joined, sort by food. */
const purchaseList: EntryListSpec<PurchaseQuery, JoinedRow, PurchaseJson> = {
  table: purchases,
  select: joined,
  toJson,
  nameSort: { key: 'food', order: [asc(foods.name), desc(purchases.date), desc(purchases.id)] },
};

/** One page of the household's bought food, with count and weight totals of the whole filter. */
export async function listPurchases(householdId: number, q: PurchaseQuery): Promise<PurchaseList> {
  const { rows, page } = await listEntries(purchaseList, householdId, q);
  return { purchases: rows, ...page };
}

/** Bought food's part of the shared update: the patch merged over the stored entry, the food's refuse looked up again. */
const purchaseUpdate: EntryUpdateSpec<typeof purchases, PurchasePatch, PurchaseJson> = {
  table: purchases,
  notFound: NOT_FOUND,
  revise: async (tx, _householdId, row, patch) => {
    const merged = mergePurchasePatch(
      {
        date: row.date,
        foodId: row.foodId,
        quantity: row.quantity,
        unit: row.unit,
        price: row.price === null ? null : Number(row.price),
        currency: row.currency,
        spreadMonths: row.spreadMonths,
        trimmed: row.trimmed,
        note: row.note,
      },
      patch,
    );
    if (!merged.success) throw invalidInput(merged.error);
    return purchaseValues(merged.data, await purchaseBasis(tx, merged.data.foodId, merged.data.unit));
  },
  get: getPurchase,
};

/** Changes bought food; grams and edible grams are worked out again. */
export async function updatePurchase(householdId: number, purchaseId: number, patch: PurchasePatch): Promise<PurchaseJson> {
  return updateEntry(purchaseUpdate, householdId, purchaseId, patch);
}

/** Deletes bought food of the household; 404 when it has none with this id. */
export async function deletePurchase(householdId: number, purchaseId: number): Promise<void> {
  await deleteEntry(purchases, householdId, purchaseId, NOT_FOUND);
}

/** Every purchase of the household, oldest first (for the backup). */
export async function everyPurchase(householdId: number, ex: Executor = getDb()): Promise<PurchaseJson[]> {
  const rows = await joined(ex).where(eq(purchases.householdId, householdId)).orderBy(asc(purchases.date), asc(purchases.id));
  return rows.map(toJson);
}
