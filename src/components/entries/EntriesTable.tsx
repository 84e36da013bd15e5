/**
 * The one table both entry lists are drawn with (the harvest log and bought food): filters, a
 * totals line, sortable headers, pages, inline edit and delete with confirmation. Each list brings
 * its columns (TanStack Table column definitions), its filter fields, its edit row and its words;
 * this component does the rest. Sorting and paging happen on the server: the table's sorting and
 * page become the list endpoint's `sort` and `page` parameters, fetched with TanStack Query, and a
 * change or delete invalidates the list so it updates without a reload.
 */
import { keepPreviousData, useMutation, useQuery, useQueryClient, type QueryKey } from '@tanstack/react-query';
import {
  createColumnHelper,
  FlexRender,
  functionalUpdate,
  rowPaginationFeature,
  rowSortingFeature,
  tableFeatures,
  useTable,
  type ColumnDef,
  type PaginationState,
  type RowData,
} from '@tanstack/react-table';
import { Fragment, useMemo, useState, type ComponentType, type ReactNode } from 'react';
import type { EntryTotals } from '@/lib/entry-types';
import { request, type HouseholdInfo } from './api';
import { FilterBar, MessageRow, Pager, SortHeader, SortSelect, stack, stickyFirst, TotalsLine } from './table-bits';
import { paramFromSorting, sortingFromParam, type ColumnSortKeys, type Sorting } from './table-sort';
import { Alert, ConfirmDelete } from './ui';

/** What a column says about itself beyond its header and cell. */
export interface EntryColumnMeta {
  /** The API's sort keys when the column sorts, e.g. `{ asc: 'date', desc: '-date' }`. */
  sort?: ColumnSortKeys;
  /** Numbers: the header aligned right (the cell says so in `cellClass`). */
  right?: boolean;
  /** Classes of the body cell, including its place in the phone card (`stack`). */
  cellClass: string;
}

/**
 * What the row actions need from the table at render time. Method syntax on purpose: each list
 * passes functions of its own entry type.
 */
interface EntryTableMeta {
  edit(id: number): void;
  remove(id: number): void;
  removing: boolean;
  editLabel(entry: { id: number }): string;
  deleteWhat(entry: { id: number }): string;
}

const features = tableFeatures({ rowSortingFeature, rowPaginationFeature, columnMeta: {} as EntryColumnMeta, tableMeta: {} as EntryTableMeta });
type EntryFeatures = typeof features;

/** A column of an entries table. */
// `any`: each column has its own value type (a date string, a number…).
export type EntryColumn<T extends RowData> = ColumnDef<EntryFeatures, T, any>;

/** The column helper for an entries table of `T`. Example: `entryColumns<Harvest>().accessor('date', { … })` */
export const entryColumns = <T extends RowData>() => createColumnHelper<EntryFeatures, T>();

/** One page of a list as the table needs it. */
export interface EntryRows<T> {
  rows: T[];
  total: number;
  totals: EntryTotals;
}

/** Query parameters of the list endpoint (filters, then sort and page). */
export type ListParams = Record<string, string | number | undefined>;

export interface EntriesTableProps<T extends { id: number } & RowData> {
  household: HouseholdInfo;
  writer: boolean;
  columns: EntryColumn<T>[];
  /** The list's query key (`keys.harvests(hid)`); the table's own queries sit below it. */
  listKey: QueryKey;
  fetchPage: (params: ListParams) => Promise<EntryRows<T>>;
  /** The filter parameters; a change goes back to the first page. */
  filters: ListParams;
  /** The filter fields, shown before the phone's order picker and "Clear filters". */
  filterFields: ReactNode;
  onClearFilters: () => void;
  /** The phone's order picker: its id and [sort key, label] choices. */
  sortSelect: { id: string; options: [string, string][] };
  deleteUrl: (id: number) => string;
  /** Deletes an entry instead of a plain DELETE of deleteUrl (a list that offers Undo brings its own). */
  deleteEntry?: (entry: T, page: readonly T[]) => Promise<unknown>;
  /** Query keys to refresh after a delete (the list's, and whatever else it changes). */
  invalidate: QueryKey[];
  EditRow: ComponentType<{ entry: T; colSpan: number; household: HouseholdInfo; onDone: () => void }>;
  /** The aria-label of a row's Edit button and the words of its delete confirmation. */
  editLabel: (entry: T) => string;
  deleteWhat: (entry: T) => string;
  testIds: { table: string; row: string };
  words: { caption: (sort: string) => string; loadError: string; empty: string; emptyFiltered: string };
  /** Show "updating…" in the totals line while a page loads. */
  showFetching?: boolean;
  /** A line shown above a row (the harvest log's split weighing above its first part), or null. */
  rowLead?: (entry: T, previous: T | undefined, page: T[]) => ReactNode | null;
}

const PAGE_SIZE = 25;
const DEFAULT_SORT = '-date';

/** Edit and delete for one row (writers only). */
function actionsColumn<T extends { id: number } & RowData>(): EntryColumn<T> {
  return entryColumns<T>().display({
    id: 'actions',
    header: () => <span className="sr-only">Actions</span>,
    meta: { cellClass: `whitespace-nowrap px-3 py-2 text-right ${stack.actions}` },
    cell: ({ row, table }) => {
      const m = table.options.meta!;
      return (
        <span className="inline-flex flex-wrap justify-end gap-2">
          <button type="button" className="btn-quiet min-h-12 px-3" onClick={() => m.edit(row.original.id)} aria-label={m.editLabel(row.original)}>
            Edit
          </button>
          <ConfirmDelete what={m.deleteWhat(row.original)} busy={m.removing} onConfirm={() => m.remove(row.original.id)} />
        </span>
      );
    },
  });
}

export function EntriesTable<T extends { id: number } & RowData>(props: EntriesTableProps<T>) {
  const { household, writer, listKey, filters, EditRow, words } = props;
  const qc = useQueryClient();
  const [sort, setSort] = useState(DEFAULT_SORT);
  // The page belongs to the filters it was chosen under: new filters start again at page 1.
  const filterKey = JSON.stringify(filters);
  const [paging, setPaging] = useState({ filterKey, pageIndex: 0 });
  if (paging.filterKey !== filterKey) setPaging({ filterKey, pageIndex: 0 });
  const pageIndex = paging.filterKey === filterKey ? paging.pageIndex : 0;
  const [editing, setEditing] = useState<number | null>(null);
  const [alert, setAlert] = useState<string | null>(null);
  const filtered = Object.values(filters).some((v) => v !== undefined && v !== '');

  const params = { ...filters, sort, page: pageIndex + 1, pageSize: PAGE_SIZE };
  const list = useQuery({ queryKey: [...listKey, 'table', params], queryFn: () => props.fetchPage(params), placeholderData: keepPreviousData });

  const remove = useMutation({
    mutationFn: (id: number) => {
      const page = list.data?.rows ?? [];
      const entry = page.find((e) => e.id === id);
      return props.deleteEntry && entry ? props.deleteEntry(entry, page) : request<null>('DELETE', props.deleteUrl(id));
    },
    onSuccess: () => {
      setAlert(null);
      for (const queryKey of props.invalidate) void qc.invalidateQueries({ queryKey });
    },
    onError: (e) => setAlert(`Could not delete: ${(e as Error).message}`),
  });

  // Built once per list: a cell renderer is a component, so a new one would remount the row's
  // buttons (and close an open delete confirmation). What changes reaches it through `meta`.
  const columns = useMemo<EntryColumn<T>[]>(() => (writer ? [...props.columns, actionsColumn<T>()] : props.columns), [props.columns, writer]);
  const meta: EntryTableMeta = {
    edit: setEditing,
    remove: (id) => remove.mutate(id),
    removing: remove.isPending,
    editLabel: props.editLabel,
    deleteWhat: props.deleteWhat,
  };

  const sortable = useMemo(() => columns.map((c) => ({ id: c.id ?? '', sort: c.meta?.sort })), [columns]);
  const sorting: Sorting = sortingFromParam(sort, sortable);
  const pagination: PaginationState = { pageIndex, pageSize: PAGE_SIZE };
  const total = list.data?.total ?? 0;

  const table = useTable({
    features,
    columns,
    data: list.data?.rows ?? [],
    getRowId: (entry) => String(entry.id),
    meta,
    state: { sorting, pagination },
    manualSorting: true,
    sortDescFirst: true,
    enableSortingRemoval: false,
    enableMultiSort: false,
    onSortingChange: (updater) => setSort(paramFromSorting(functionalUpdate(updater, sorting), sortable, sort)),
    manualPagination: true,
    autoResetPageIndex: false,
    rowCount: total,
    onPaginationChange: (updater) => setPaging({ filterKey, pageIndex: functionalUpdate(updater, pagination).pageIndex }),
  });

  const rows = table.getRowModel().rows;
  const colCount = columns.length;

  return (
    <div>
      <FilterBar>
        {props.filterFields}
        <SortSelect id={props.sortSelect.id} sort={sort} onSort={setSort} options={props.sortSelect.options} />
        <div className="max-sm:col-span-2">
          {filtered ? (
            <button type="button" className="btn-quiet w-full" onClick={props.onClearFilters}>
              Clear filters
            </button>
          ) : null}
        </div>
      </FilterBar>

      <div className="mt-4">
        <TotalsLine total={total} totals={list.data?.totals} units={household.units}>
          {props.showFetching && list.isFetching ? <span className="text-sm">updating…</span> : null}
        </TotalsLine>
      </div>
      <Alert message={alert} />
      {list.isError ? <Alert message={`${words.loadError}: ${(list.error as Error).message}`} /> : null}

      <div role="region" aria-label="Entries" tabIndex={0} className="mt-4 overflow-x-auto focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-focus rounded-2xl border border-loam-200 bg-white">
        <table className={stack.table} data-testid={props.testIds.table}>
          <caption className="sr-only">{words.caption(sort)}</caption>
          <thead className={stack.thead}>
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header, i) => {
                  const meta = header.column.columnDef.meta;
                  const right = `${meta?.right ? 'text-right' : ''} ${i === 0 ? stickyFirst.head : ''}`;
                  if (meta?.sort)
                    return (
                      <SortHeader key={header.id} label={String(header.column.columnDef.header)} state={header.column.getIsSorted()} onToggle={header.column.getToggleSortingHandler()} className={right} />
                    );
                  return (
                    <th key={header.id} scope="col" className={`px-3 py-1 font-bold ${right}`}>
                      <FlexRender header={header} />
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody className={stack.tbody}>
            {list.isPending ? (
              <MessageRow colSpan={colCount}>Loading…</MessageRow>
            ) : rows.length === 0 ? (
              <MessageRow colSpan={colCount}>{filtered ? words.emptyFiltered : words.empty}</MessageRow>
            ) : (
              rows.map((row, index) => {
                const lead = props.rowLead?.(row.original, rows[index - 1]?.original, list.data?.rows ?? []);
                return (
                  <Fragment key={row.id}>
                    {lead ? (
                      <tr className="border-b border-loam-200 bg-rind-100/40 max-sm:block">
                        <td colSpan={colCount} className="px-3 py-2 max-sm:block">
                          {lead}
                        </td>
                      </tr>
                    ) : null}
                    {editing === row.original.id ? (
                      <EditRow entry={row.original} colSpan={colCount} household={household} onDone={() => setEditing(null)} />
                    ) : (
                      <tr className={stack.row} data-testid={props.testIds.row} data-id={row.original.id}>
                        {row.getAllCells().map((cell, i) => (
                          <td key={cell.id} className={`${cell.column.columnDef.meta?.cellClass ?? ''} ${i === 0 ? stickyFirst.cell : ''}`}>
                            <FlexRender cell={cell} />
                          </td>
                        ))}
                      </tr>
                    )}
                  </Fragment>
                );
              })
            )}
          </tbody>
        </table>
      </div>
      <Pager page={pageIndex + 1} pages={table.getPageCount()} canPrevious={table.getCanPreviousPage()} canNext={table.getCanNextPage()} onPrevious={() => table.previousPage()} onNext={() => table.nextPage()} />
    </div>
  );
}
