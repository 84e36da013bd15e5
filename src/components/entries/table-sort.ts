/**
 * The entry tables sort on the server: the list endpoints take one `sort` parameter ('-date',
 * 'grams', 'crop'…), while the table library keeps its sorting as `[{ id, desc }]`. These two
 * functions translate between them through each column's sort keys, so a header click and the
 * phone's order picker both end in the same query parameter. A column may sort one way only (the
 * same key for both directions, as 'crop' does): it then always reads as ascending.
 */

/** The API's sort key for each direction of one column. */
export interface ColumnSortKeys {
  asc: string;
  desc: string;
}

/** One column's id and, when it sorts, its keys. */
export interface SortableColumn {
  id: string;
  sort?: ColumnSortKeys | undefined;
}

/** The table library's sorting: at most one column here, since the API sorts by one key. */
export type Sorting = { id: string; desc: boolean }[];

/**
 * The table's sorting for an API sort key; empty when no column sorts by it.
 * Example: `sortingFromParam('-grams', [{ id: 'weight', sort: { asc: 'grams', desc: '-grams' } }])` → [{ id: 'weight', desc: true }]
 */
export function sortingFromParam(sort: string, columns: readonly SortableColumn[]): Sorting {
  for (const c of columns) {
    if (c.sort?.asc === sort) return [{ id: c.id, desc: false }];
    if (c.sort?.desc === sort) return [{ id: c.id, desc: true }];
  }
  return [];
}

/**
 * The API sort key for the table's sorting, or `fallback` when it names no sortable column.
 * Example: `paramFromSorting([{ id: 'date', desc: false }], columns, '-date')` → 'date'
 */
export function paramFromSorting(sorting: Sorting, columns: readonly SortableColumn[], fallback: string): string {
  const first = sorting[0];
  const keys = first ? columns.find((c) => c.id === first.id)?.sort : undefined;
  if (!first || !keys) return fallback;
  return first.desc ? keys.desc : keys.asc;
}
