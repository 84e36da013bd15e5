/**
 * One way to answer a page of the harvest log or of the bought-food list: the filters both have
 * (household, date range, reference food), the sorts by date and weight, the page offset, and the
 * count and weight totals of the whole filter. What differs between the two lists — the joined
 * columns, the extra filters, the sort by name — comes in as an `EntryListSpec`.
 */
import { and, asc, count, desc, eq, gte, lte, sum, type AnyColumn, type SQL } from 'drizzle-orm';
import { getDb } from '@/db/client';
import type { harvests, purchases } from '@/db/schema';
import type { EntryPage } from '@/lib/entry-types';
import type { Executor } from './entry-input';


/** The tables whose rows are entries: harvests and bought food. */
export type EntryTable = typeof harvests | typeof purchases;

/** The query parameters both lists take (see `harvestQuery` and `purchaseQuery`). */
export interface EntryQuery {
  from?: string | undefined;
  to?: string | undefined;
  foodId?: number | undefined;
  sort?: string | undefined;
  page: number;
  pageSize: number;
}

/** A joined select that can still be filtered, ordered and paged; resolves to the joined rows. */
interface PageableSelect<Row> {
  where(where: SQL | undefined): { orderBy(...order: SQL[]): { limit(n: number): { offset(n: number): PromiseLike<Row[]> } } };
}

/**
 * What one kind of entry brings to the shared list: its table, the select joining the names it
 * shows, how a joined row becomes JSON, its own filters and its sort by name.
 */
export interface EntryListSpec<Q extends EntryQuery, Row, Json> {
  table: EntryTable;
  select: (ex: Executor) => PageableSelect<Row>;
  toJson: (row: Row) => Json;
  /** Conditions beyond household, date range and food (e.g. crop and use for harvests). */
  extraFilters?: (q: Q) => SQL[];
  /** The sort key that orders by name ('crop', 'food') and its ORDER BY. */
  nameSort: { key: string; order: SQL[] };
}

/** The first row of a 1-based page. Example: `pageOffset({ page: 3, pageSize: 25 })` → 50 */
export function pageOffset(q: { page: number; pageSize: number }): number {
  return (q.page - 1) * q.pageSize;
}

/**
 * ORDER BY for the sorts both lists have: 'date' (oldest first), 'grams', '-grams', else newest
 * first. Ties go by id, so a page never shows an entry twice. Example: `entryOrdering(harvests, '-grams')`
 */
export function entryOrdering(table: { date: AnyColumn; grams: AnyColumn; id: AnyColumn }, sort: string | undefined): SQL[] {
  switch (sort) {
    case 'date':
      return [asc(table.date), asc(table.id)];
    case 'grams':
      return [asc(table.grams), asc(table.id)];
    case '-grams':
      return [desc(table.grams), desc(table.id)];
    default:
      return [desc(table.date), desc(table.id)];
  }
}

/** The WHERE of a list: the household always, then the date range, food and the kind's own filters. */
export function entryFilters<Q extends EntryQuery>(spec: Pick<EntryListSpec<Q, unknown, unknown>, 'table' | 'extraFilters'>, householdId: number, q: Q): SQL {
  const t = spec.table;
  const where: SQL[] = [eq(t.householdId, householdId)];
  if (q.from !== undefined) where.push(gte(t.date, q.from));
  if (q.to !== undefined) where.push(lte(t.date, q.to));
  if (q.foodId !== undefined) where.push(eq(t.foodId, q.foodId));
  where.push(...(spec.extraFilters?.(q) ?? []));
  return and(...where)!;
}

/** The count and weight totals of the entries matching `where`. Example: `await countAndTotals(db, harvests, where)` → { total, totals } */
export async function countAndTotals(ex: Executor, table: EntryTable, where: SQL): Promise<Pick<EntryPage, 'total' | 'totals'>> {
  const [agg] = await ex
    .select({ n: count(), grams: sum(table.grams), edibleGrams: sum(table.edibleGrams) })
    .from(table)
    .where(where);
  return {
    total: Number(agg?.n ?? 0),
    totals: { grams: Number(agg?.grams ?? 0), edibleGrams: Number(agg?.edibleGrams ?? 0) },
  };
}

/**
 * One page of a household's entries with the count and weight totals of the whole filter. The
 * caller names the rows (`{ harvests: rows, ...page }`), so each list keeps its own answer shape.
 * Example: `await listEntries(harvestList, 7, { sort: '-grams', page: 1, pageSize: 25 })`
 */
export async function listEntries<Q extends EntryQuery, Row, Json>(spec: EntryListSpec<Q, Row, Json>, householdId: number, q: Q): Promise<{ rows: Json[]; page: EntryPage }> {
  const db = getDb();
  const where = entryFilters(spec, householdId, q);
  const order = q.sort === spec.nameSort.key ? spec.nameSort.order : entryOrdering(spec.table, q.sort);
  const rows = await spec.select(db).where(where).orderBy(...order).limit(q.pageSize).offset(pageOffset(q));
  return { rows: rows.map(spec.toJson), page: { page: q.page, pageSize: q.pageSize, ...(await countAndTotals(db, spec.table, where)) } };
}
