/**
 * The columns the harvest log and the bought-food table share: the date, the weight as entered and
 * the edible portion, both in one unit of the household's system (formatWeightPair: the entry's own
 * unit when it is of that system), so a pair never reads "0.45 kg · edible 396 g". Both tables show them the same way (same sort keys,
 * same phone card positions), so they are written once here and each table adds its own columns.
 */
import { formatWeightPair, type UnitSystem } from '@/lib/units';
import { countedAmountText, isCountOrVolume, type EntryUnit } from '@/lib/entry-units';
import { entryColumns, type EntryColumn } from './EntriesTable';
import { formatDay } from './local-date';
import { stack } from './table-bits';

/** What a row needs for the shared columns: both a harvest and a purchase have these fields. */
export interface WeighedEntry {
  date: string;
  grams: number;
  edibleGrams: number;
  quantity: number;
  unit: EntryUnit;
  /** Where a count or volume got its grams. */
  weightSource?: string | null;
}

/** The amount as logged: a weight in one unit with its edible pair, a count or volume with its grams ("12 pieces (600 g)"). */
export function amountText(e: WeighedEntry, units: UnitSystem): string {
  return isCountOrVolume(e.unit) ? countedAmountText({ quantity: e.quantity, unit: e.unit, grams: e.grams }, units) : formatWeightPair(e.grams, e.edibleGrams, units, e.unit).weight;
}

/** The entry's day, sortable newest or oldest first. */
export function dateColumn<T extends WeighedEntry>(): EntryColumn<T> {
  return entryColumns<T>().accessor((e) => e.date, {
    id: 'date',
    header: 'Date',
    meta: { sort: { asc: 'date', desc: '-date' }, cellClass: `whitespace-nowrap px-3 py-2 ${stack.date}` },
    cell: ({ row }) => formatDay(row.original.date),
  });
}

/** The weight ("2.5 lb", as entered when its unit is of the household's system; "12 pieces (600 g)" for a count), sortable by grams; `id` and `header` name it for the table. */
export function weightColumn<T extends WeighedEntry>(id: string, header: string, units: UnitSystem): EntryColumn<T> {
  return entryColumns<T>().accessor((e) => e.grams, {
    id,
    header,
    meta: { sort: { asc: 'grams', desc: '-grams' }, right: true, cellClass: `whitespace-nowrap px-3 py-2 text-right font-bold tabular-nums ${stack.weight}` },
    cell: ({ row: { original: e } }) => (
      <>
        {amountText(e, units)}
        {e.weightSource ? (
          <span className="block max-w-56 whitespace-normal text-xs font-normal text-loam-700 max-sm:max-w-none" data-testid="weight-source">
            {e.weightSource}
          </span>
        ) : null}
      </>
    ),
  });
}

/** The edible portion, in the same unit as the weight beside it. */
export function edibleColumn<T extends WeighedEntry>(units: UnitSystem): EntryColumn<T> {
  return entryColumns<T>().accessor((e) => e.edibleGrams, {
    id: 'edible',
    header: 'Edible',
    meta: { right: true, cellClass: `whitespace-nowrap px-3 py-2 text-right tabular-nums ${stack.edible}` },
    cell: ({ row: { original: e } }) => (
      <>
        <span className="sm:hidden">edible </span>
        {formatWeightPair(e.grams, e.edibleGrams, units, e.unit).edible}
      </>
    ),
  });
}
