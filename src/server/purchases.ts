/**
 * Bought food in the database. Every function takes the household id and touches only that
 * household's rows. Grams and edible grams (the food's refuse taken off unless weighed trimmed) are
 * worked out at write time and again on every change.
 */
import { and, asc, desc, eq } from 'drizzle-orm';
import { getDb } from '@/db/client';
import { foods, purchases, type Purchase } from '@/db/schema';
import { edibleGrams } from '@/lib/edible';
import { mergePurchasePatch, type PurchaseInput, type PurchasePatch } from '@/lib/entry-schemas';
import { type PurchaseQuery } from '@/lib/list-query-schemas';
import type { PurchaseJson, PurchaseList } from '@/lib/entry-types';
import { toGrams, type WeightUnit } from '@/lib/units';
import { requireFood } from './crops';
import { HttpError } from './http';
import { invalidInput, type Executor, type Tx } from './entry-input';
import { listEntries, type EntryListSpec } from './entry-list';
import { deleteEntry, updateEntry, type EntryUpdateSpec } from './entry-update';


const NOT_FOUND = 'No such bought food in this household.';

/** The stored columns of a purchase from its input and its food's refuse. */
export function purchaseValues(input: PurchaseInput, refusePct: number | null) {
  const grams = toGrams(input.quantity, input.unit);
  return {
    foodId: input.foodId,
    date: input.date,
    quantity: input.quantity,
    unit: input.unit,
    grams,
    // Bought food has refuse too (bought bananas have peels).
    edibleGrams: edibleGrams(grams, { refusePercent: refusePct, trimmed: input.trimmed }),
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
  const food = await requireFood(tx, input.foodId);
  const [res] = await tx.insert(purchases).values({ ...purchaseValues(input, food.refusePct), householdId, createdBy: userId });
  return getPurchase(householdId, res.insertId, tx);
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
    const food = await requireFood(tx, merged.data.foodId);
    return purchaseValues(merged.data, food.refusePct);
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
