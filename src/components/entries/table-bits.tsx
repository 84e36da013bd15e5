/** Pieces of the entries table (EntriesTable.tsx): sortable headers, the pager, the totals line, the phone's card classes. */
import type { ReactNode } from 'react';
import { formatWeightPair, type UnitSystem } from '@/lib/units';
import type { EntryTotals as Totals } from '@/lib/entry-types';
import { formatCount } from '@/lib/format-number';
import { nounFor } from '@/lib/plural';

/**
 * A column header that sorts: `state` is how the table sorts by this column now, `onToggle` asks for
 * the next order (the table decides which: newest or heaviest first, then the other way).
 */
export function SortHeader({ label, state, onToggle, className = '' }: { label: string; state: false | 'asc' | 'desc'; onToggle: (() => void) | ((e: unknown) => void) | undefined; className?: string }) {
  const aria = state === 'asc' ? 'ascending' : state === 'desc' ? 'descending' : 'none';
  const arrow = aria === 'ascending' ? '▲' : aria === 'descending' ? '▼' : '↕';
  return (
    <th scope="col" aria-sort={aria} className={`px-2 py-1 ${className}`}>
      <button type="button" className="inline-flex min-h-12 items-center gap-1 rounded-lg px-1 font-bold hover:bg-loam-100" onClick={onToggle}>
        {label}
        <span aria-hidden="true" className={`text-xs ${aria === 'none' ? 'text-loam-500' : 'text-sprout-700'}`}>
          {arrow}
        </span>
        <span className="sr-only">{aria === 'none' ? ', not sorted' : `, sorted ${aria}`}</span>
      </button>
    </th>
  );
}

/** Previous / next with "page 2 of 5"; nothing when everything fits on one page. */
export function Pager({ page, pages, canPrevious, canNext, onPrevious, onNext }: { page: number; pages: number; canPrevious: boolean; canNext: boolean; onPrevious: () => void; onNext: () => void }) {
  if (pages <= 1) return null;
  return (
    <nav aria-label="Pages" className="mt-3 flex items-center justify-between gap-2">
      <button type="button" className="btn-quiet" disabled={!canPrevious} onClick={onPrevious}>
        ← Newer
      </button>
      <span className="text-sm text-loam-700">
        Page {page} of {pages}
      </span>
      <button type="button" className="btn-quiet" disabled={!canNext} onClick={onNext}>
        Older →
      </button>
    </nav>
  );
}

/** "14 entries · 12.3 kg weighed · 9.8 kg edible portion", in the household's units. */
export function TotalsLine({ total, totals, units, children }: { total: number; totals: Totals | undefined; units: UnitSystem; children?: ReactNode }) {
  return (
    <div className="flex flex-wrap items-baseline gap-x-6 gap-y-1 rounded-2xl bg-sprout-100 px-4 py-3 text-sprout-900" data-testid="totals" role="status">
      <span>
        <span className="text-2xl font-extrabold tabular-nums">{formatCount(total)}</span> {nounFor(total, 'entry')}
      </span>
      {totals ? (
        <>
          <span>
            <span className="text-2xl font-extrabold tabular-nums">{formatWeightPair(totals.grams, totals.edibleGrams, units).weight}</span> weighed
          </span>
          <span>
            <span className="text-2xl font-extrabold tabular-nums">{formatWeightPair(totals.grams, totals.edibleGrams, units).edible}</span> edible portion
          </span>
        </>
      ) : null}
      {children}
    </div>
  );
}

/** The month filter of an entries table: a month picker, empty for every month. */
export function MonthFilter({ id, value, onChange }: { id: string; value: string; onChange: (month: string) => void }) {
  return (
    <div>
      <label htmlFor={id} className="block text-sm font-semibold">
        Month
      </label>
      <input id={id} type="month" className="field mt-1" value={value} onChange={(e) => onChange(e.target.value)} />
    </div>
  );
}

/** Filter row container: wraps on a phone, one line on a wide screen. */
export function FilterBar({ children }: { children: ReactNode }) {
  return (
    <div role="group" aria-label="Filters" className="grid grid-flow-row-dense grid-cols-2 items-end gap-3 sm:grid-cols-4">
      {children}
    </div>
  );
}

/**
 * Class names that turn a table into stacked cards on a phone (below the sm breakpoint) and leave
 * it a plain table on wider screens: the table stays one table for assistive technology, while a
 * 390 px screen never scrolls sideways.
 */
export const stack = {
  table: 'w-full border-collapse text-left max-sm:block sm:min-w-[40rem]',
  thead: 'border-b border-loam-200 bg-loam-50 text-sm max-sm:hidden',
  tbody: 'max-sm:block',
  row: 'border-b border-loam-100 last:border-b-0 max-sm:grid max-sm:grid-cols-[1fr_auto] max-sm:gap-x-3 max-sm:gap-y-1 max-sm:px-4 max-sm:py-3',
  wide: 'max-sm:block',
  /** Cell positions on a phone: 1 name | 2 weight, 3 date | 4 edible, then full-width lines. */
  name: 'max-sm:order-1 max-sm:p-0 max-sm:text-lg',
  weight: 'max-sm:order-2 max-sm:p-0 max-sm:text-lg',
  date: 'max-sm:order-3 max-sm:p-0 max-sm:text-sm max-sm:text-loam-700',
  edible: 'max-sm:order-4 max-sm:p-0 max-sm:text-sm',
  line: 'max-sm:order-5 max-sm:col-span-2 max-sm:p-0 max-sm:text-sm',
  actions: 'max-sm:order-6 max-sm:col-span-2 max-sm:p-0 max-sm:pt-2 max-sm:text-left',
} as const;

/**
 * The first column (what the row is) stays in view while a wide table scrolls sideways on a
 * tablet-sized screen; on a phone the table is cards already (`stack`) and nothing sticks.
 */
export const stickyFirst = {
  head: 'sm:sticky sm:left-0 sm:z-10 sm:bg-loam-50',
  cell: 'sm:sticky sm:left-0 sm:z-10 sm:bg-white',
} as const;

/** A sort picker for phones, where the column headers are hidden. */
export function SortSelect({ id, sort, onSort, options }: { id: string; sort: string; onSort: (s: string) => void; options: [string, string][] }) {
  return (
    <div className="sm:hidden">
      <label htmlFor={id} className="block text-sm font-semibold">
        Order
      </label>
      <select id={id} className="field mt-1" value={sort} onChange={(e) => onSort(e.target.value)}>
        {options.map(([v, l]) => (
          <option key={v} value={v}>
            {l}
          </option>
        ))}
      </select>
    </div>
  );
}

/** One full-width row for "Loading…" or "nothing here" in an entries table. */
export function MessageRow({ colSpan, children }: { colSpan: number; children: ReactNode }) {
  return (
    <tr className="max-sm:block">
      <td colSpan={colSpan} className="px-3 py-6 text-center text-loam-700 max-sm:block">
        {children}
      </td>
    </tr>
  );
}
