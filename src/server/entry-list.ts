/**
 * What the harvest log and the bought-food list share when they answer one page: the sorts by
 * date and weight, the page offset, and the count and weight totals of the whole filter.
 */
import { asc, count, desc, sum, type AnyColumn, type SQL } from 'drizzle-orm';
import type { harvests, purchases } from '../db/schema';
import type { Executor } from './entry-input';

/** Grams and edible grams summed over every entry of a filter. */
export interface EntryTotals {
  grams: number;
  edibleGrams: number;
}

/** Where a page stands in the whole filtered list. */
export interface EntryPage {
  page: number;
  pageSize: number;
  total: number;
  totals: EntryTotals;
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

/** The count and weight totals of the entries matching `where`. Example: `await countAndTotals(db, harvests, where)` → { total, totals } */
export async function countAndTotals(ex: Executor, table: typeof harvests | typeof purchases, where: SQL): Promise<Pick<EntryPage, 'total' | 'totals'>> {
  const [agg] = await ex
    .select({ n: count(), grams: sum(table.grams), edibleGrams: sum(table.edibleGrams) })
    .from(table)
    .where(where);
  return {
    total: Number(agg?.n ?? 0),
    totals: { grams: Number(agg?.grams ?? 0), edibleGrams: Number(agg?.edibleGrams ?? 0) },
  };
}
