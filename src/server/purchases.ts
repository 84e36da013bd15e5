/**
 * Bought food in the database. Every function takes the household id and touches only that
 * household's rows. Grams and edible grams (the food's refuse taken off unless weighed trimmed) are
 * worked out at write time and again on every change.
 */
import { and, asc, desc, eq, gte, lte, type SQL } from 'drizzle-orm';
import { getDb } from '../db/client';
import { foods, purchases, type Purchase } from '../db/schema';
import { edibleGrams } from '../lib/edible';
import { mergePurchasePatch, type PurchaseInput, type PurchasePatch, type PurchaseQuery } from '../lib/entry-schemas';
import { toGrams, type WeightUnit } from '../lib/units';
import { requireFood } from './crops';
import { HttpError } from './http';
import { invalidInput, type Executor, type Tx } from './entry-input';
import { countAndTotals, entryOrdering, pageOffset, type EntryPage } from './entry-list';

export interface PurchaseJson {
  id: number;
  date: string;
  foodId: number;
  foodName: string;
  foodCode: string;
  quantity: number;
  unit: WeightUnit;
  grams: number;
  edibleGrams: number;
  price: number | null;
  currency: string | null;
  spreadMonths: number;
  trimmed: boolean;
  note: string | null;
  createdAt: string;
}

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
  if (!row) throw new HttpError(404, 'not_found', 'No such bought food in this household.');
  return toJson(row);
}

/** Stores bought food in a transaction. Example: `await createPurchase(tx, 7, userId, purchaseInput.parse(body))` → PurchaseJson */
export async function createPurchase(tx: Tx, householdId: number, userId: string | null, input: PurchaseInput): Promise<PurchaseJson> {
  const food = await requireFood(tx, input.foodId);
  const [res] = await tx.insert(purchases).values({ ...purchaseValues(input, food.refusePct), householdId, createdBy: userId });
  return getPurchase(householdId, res.insertId, tx);
}

function filters(householdId: number, q: Omit<PurchaseQuery, 'page' | 'pageSize'>): SQL {
  const where: SQL[] = [eq(purchases.householdId, householdId)];
  if (q.from !== undefined) where.push(gte(purchases.date, q.from));
  if (q.to !== undefined) where.push(lte(purchases.date, q.to));
  if (q.foodId !== undefined) where.push(eq(purchases.foodId, q.foodId));
  return and(...where)!;
}

function ordering(sort: PurchaseQuery['sort']): SQL[] {
  if (sort === 'food') return [asc(foods.name), desc(purchases.date), desc(purchases.id)];
  return entryOrdering(purchases, sort);
}

export interface PurchaseList extends EntryPage {
  purchases: PurchaseJson[];
}

/** One page of the household's bought food, with count and weight totals of the whole filter. */
export async function listPurchases(householdId: number, q: PurchaseQuery): Promise<PurchaseList> {
  const db = getDb();
  const where = filters(householdId, q);
  const rows = await joined(db)
    .where(where)
    .orderBy(...ordering(q.sort))
    .limit(q.pageSize)
    .offset(pageOffset(q));
  return { purchases: rows.map(toJson), page: q.page, pageSize: q.pageSize, ...(await countAndTotals(db, purchases, where)) };
}

/** Changes bought food; grams and edible grams are worked out again. */
export async function updatePurchase(householdId: number, purchaseId: number, patch: PurchasePatch): Promise<PurchaseJson> {
  return getDb().transaction(async (tx) => {
    const [row] = await tx
      .select()
      .from(purchases)
      .where(and(eq(purchases.householdId, householdId), eq(purchases.id, purchaseId)))
      .limit(1)
      .for('update');
    if (!row) throw new HttpError(404, 'not_found', 'No such bought food in this household.');
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
    await tx
      .update(purchases)
      .set(purchaseValues(merged.data, food.refusePct))
      .where(and(eq(purchases.householdId, householdId), eq(purchases.id, purchaseId)));
    return getPurchase(householdId, purchaseId, tx);
  });
}

/** Deletes bought food of the household; 404 when it has none with this id. */
export async function deletePurchase(householdId: number, purchaseId: number): Promise<void> {
  const [res] = await getDb()
    .delete(purchases)
    .where(and(eq(purchases.householdId, householdId), eq(purchases.id, purchaseId)));
  if (res.affectedRows === 0) throw new HttpError(404, 'not_found', 'No such bought food in this household.');
}

/** Every purchase of the household, oldest first (for the backup). */
export async function everyPurchase(householdId: number, ex: Executor = getDb()): Promise<PurchaseJson[]> {
  const rows = await joined(ex).where(eq(purchases.householdId, householdId)).orderBy(asc(purchases.date), asc(purchases.id));
  return rows.map(toJson);
}
