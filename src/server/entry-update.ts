/**
 * One way to change or delete a harvest or an entry of bought food: lock the household's row, let
 * the kind of entry merge the patch and work out its stored columns again (grams, edible grams,
 * spread), write them, and answer the entry as JSON — or 404 when the household has no such entry.
 * What differs between harvests and bought food comes in as an `EntryUpdateSpec`.
 */
import { and, eq, type SQL } from 'drizzle-orm';
import { getDb } from '@/db/client';
import type { Harvest, harvests, Purchase } from '@/db/schema';
import type { Executor, Tx } from './entry-input';
import type { EntryTable } from './entry-list';
import { HttpError } from './http';

/** The stored row of an entry table. */
type RowOf<T extends EntryTable> = T extends typeof harvests ? Harvest : Purchase;

/** What one kind of entry brings to the shared update: its table, its 404 sentence, how a patch becomes new columns. */
export interface EntryUpdateSpec<T extends EntryTable, Patch, Json> {
  table: T;
  /** The 404 message, e.g. "No such harvest in this household." */
  notFound: string;
  /** The columns to store after `patch`, worked out again from the merged entry; throws a 400 for a bad merge. */
  revise: (tx: Tx, householdId: number, row: RowOf<T>, patch: Patch) => Promise<Partial<T['$inferInsert']>>;
  /** Other rows that change with this one (the rest of a split weighing), in the same transaction. */
  alsoUpdate?: (tx: Tx, householdId: number, row: RowOf<T>, patch: Patch) => Promise<void>;
  /** The entry as JSON, read inside the same transaction. */
  get: (householdId: number, id: number, ex: Executor) => Promise<Json>;
}

function ofHousehold(table: EntryTable, householdId: number, id: number): SQL {
  return and(eq(table.householdId, householdId), eq(table.id, id))!;
}

/**
 * Changes one entry in a transaction, its row locked while the new columns are worked out.
 * Example: `await updateEntry(harvestUpdate, 7, 42, { quantity: 2.5 })` → HarvestJson
 */
export async function updateEntry<T extends EntryTable, Patch, Json>(spec: EntryUpdateSpec<T, Patch, Json>, householdId: number, id: number, patch: Patch): Promise<Json> {
  const table: EntryTable = spec.table;
  return getDb().transaction(async (tx) => {
    const where = ofHousehold(table, householdId, id);
    const [row] = await tx.select().from(table).where(where).limit(1).for('update');
    if (!row) throw new HttpError(404, 'not_found', spec.notFound);
    const values = await spec.revise(tx, householdId, row as RowOf<T>, patch);
    await tx.update(table).set(values).where(where);
    if (spec.alsoUpdate) await spec.alsoUpdate(tx, householdId, row as RowOf<T>, patch);
    return spec.get(householdId, id, tx);
  });
}

/** Deletes one entry of the household; 404 (with `notFound`) when it has none with this id. */
export async function deleteEntry(table: EntryTable, householdId: number, id: number, notFound: string): Promise<void> {
  const where = ofHousehold(table, householdId, id);
  const [res] = await getDb().delete(table).where(where);
  if (res.affectedRows === 0) throw new HttpError(404, 'not_found', notFound);
}
