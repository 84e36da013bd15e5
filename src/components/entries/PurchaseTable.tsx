/**
 * Bought food as a table: sortable, filtered by month and food, paginated, totals in the
 * household's units, inline edit and delete with confirmation, each offering Undo in the page's
 * toast (the island wraps it in UndoProvider). The table itself is EntriesTable; this file brings
 * the bought-food columns, filters, edit row and words.
 */
import { useState, type ReactNode } from 'react';
import { purchasePatch } from '@/lib/entry-schemas';
import type { UnitSystem } from '@/lib/units';
import type { EntryUnit } from '@/lib/entry-units';
import { useQuery } from '@tanstack/react-query';
import { foodDetail, get, keys, request, urls, type HouseholdInfo, type Purchase, type PurchasePage } from './api';
import { useEntryUndo } from './use-entry-undo';
import { EditRowShell, useEntryPatch } from './EditEntryRow';
import { EntriesTable, entryColumns, type EntryColumn } from './EntriesTable';
import { dateColumn, edibleColumn, weightColumn } from './entry-columns';
import { FoodPicker, type FoodChoice } from './FoodPicker';
import { formatDay, monthRange } from './local-date';
import { formatQuantity, parseDecimal, trimNumber } from './quantity-text';
import { MonthFilter, stack } from './table-bits';
import { ErrorText, invalidProps, UnitSelect } from './ui';
import { foodWeighBasis } from './unit-basis';
import { UnitWeightNote } from './WeightField';
import { countText } from '@/lib/plural';

/** "3.49 EUR", or empty. */
export function formatPrice(price: Purchase['price'], currency: string | null): string {
  if (price === null) return '';
  const n = Number(price);
  return Number.isFinite(n) ? `${n.toFixed(2)}${currency ? ` ${currency}` : ''}` : '';
}

const col = entryColumns<Purchase>();

/** The bought-food columns; weights in the household's units. */
function purchaseColumns(units: UnitSystem): EntryColumn<Purchase>[] {
  return [
    dateColumn<Purchase>(),
    col.accessor('foodName', {
      id: 'food',
      header: 'Food',
      meta: { sort: { asc: 'food', desc: 'food' }, cellClass: `px-3 py-2 ${stack.name}` },
      cell: ({ row: { original: p } }) => (
        <>
          <span className="font-semibold">{p.foodName}</span>
          {p.note ? <span className="block text-sm text-loam-700">{p.note}</span> : null}
        </>
      ),
    }),
    weightColumn<Purchase>('weight', 'Weight', units),
    edibleColumn<Purchase>(units),
    col.accessor('price', {
      id: 'price',
      header: 'Price',
      meta: { right: true, cellClass: 'whitespace-nowrap px-3 py-2 text-right tabular-nums max-sm:order-5 max-sm:p-0 max-sm:text-left max-sm:text-sm' },
      cell: ({ row: { original: p } }) => formatPrice(p.price, p.currency),
    }),
    col.accessor('spreadMonths', {
      id: 'spread',
      header: 'Eaten over',
      meta: { cellClass: 'whitespace-nowrap px-3 py-2 max-sm:order-5 max-sm:p-0 max-sm:text-right max-sm:text-sm' },
      cell: ({ getValue }) =>
        getValue() === 1 ? (
          'this month'
        ) : (
          <>
            <span className="sm:hidden">eaten over </span>
            {countText(getValue(), 'month')}
          </>
        ),
    }),
  ];
}

export function PurchaseTable({ household, writer }: { household: HouseholdInfo; writer: boolean }) {
  const hid = household.id;
  const api = urls(hid);
  const [month, setMonth] = useState('');
  const [food, setFood] = useState<FoodChoice | null>(null);
  const [columns] = useState(() => purchaseColumns(household.units));
  const range = month ? monthRange(month) : null;
  const offerUndo = useEntryUndo(hid, [keys.purchases(hid)]);
  const entryText = (p: Purchase) => `${formatQuantity(p.quantity, p.unit)} ${p.foodName} of ${formatDay(p.date)}`;
  async function deletePurchase(p: Purchase) {
    await request<null>('DELETE', api.purchase(p.id));
    offerUndo(`Deleted ${entryText(p)}`, { kind: 'purchase-deleted', purchase: p });
  }

  return (
    <section aria-labelledby="bought-table-title">
      <h2 id="bought-table-title" className="mb-3 text-2xl font-extrabold">
        Bought food log
      </h2>
      <EntriesTable
        household={household}
        writer={writer}
        columns={columns}
        listKey={keys.purchases(hid)}
        fetchPage={(params) => get<PurchasePage>(api.purchases(params)).then((p) => ({ rows: p.purchases, total: p.total, totals: p.totals }))}
        filters={{ from: range?.from, to: range?.to, foodId: food?.id }}
        filterFields={
          <>
            <MonthFilter id="pf-month" value={month} onChange={setMonth} />
            <div className="col-span-2">
              <FoodPicker id="pf-food" label="Food" value={food} onChange={setFood} facts={false} compact />
            </div>
          </>
        }
        onClearFilters={() => (setMonth(''), setFood(null))}
        sortSelect={{ id: 'pf-sort', options: [['-date', 'Newest first'], ['date', 'Oldest first'], ['-grams', 'Heaviest first'], ['grams', 'Lightest first'], ['food', 'By food']] }}
        deleteUrl={api.purchase}
        deleteEntry={deletePurchase}
        invalidate={[keys.purchases(hid)]}
        EditRow={PurchaseEditRow}
        editLabel={(p) => `Edit ${p.foodName} of ${p.date}`}
        deleteWhat={entryText}
        testIds={{ table: 'purchase-table', row: 'purchase-row' }}
        words={{ caption: () => 'Bought food', loadError: 'Could not load the bought food', empty: 'No bought food entered yet.', emptyFiltered: 'No bought food matches these filters.' }}
      />
    </section>
  );
}

function PurchaseEditRow({ entry: purchase, colSpan, household, onDone }: { entry: Purchase; colSpan: number; household: HouseholdInfo; onDone: () => void }) {
  const [quantity, setQuantity] = useState(trimNumber(purchase.quantity, 3));
  const [unit, setUnit] = useState<EntryUnit>(purchase.unit);
  const [price, setPrice] = useState(purchase.price == null ? '' : String(Number(purchase.price)));
  const [currency, setCurrency] = useState(purchase.currency ?? '');
  const [date, setDate] = useState(purchase.date);
  const [spread, setSpread] = useState(String(purchase.spreadMonths));
  const [note, setNote] = useState(purchase.note ?? '');
  const [food, setFood] = useState<FoodChoice | null>({ id: purchase.foodId, name: purchase.foodName, code: purchase.foodCode });
  const [trimmed, setTrimmed] = useState(purchase.trimmed);
  const invalidate = [keys.purchases(household.id)];
  const offerUndo = useEntryUndo(household.id, invalidate);
  const { errors, send, saving } = useEntryPatch<{ purchase: Purchase }>(purchasePatch, urls(household.id).purchase(purchase.id), invalidate, onDone, (r) =>
    offerUndo(`Changes saved to ${r.purchase.foodName} of ${formatDay(r.purchase.date)}`, { kind: 'purchase-edited', before: purchase, after: r.purchase }),
  );
  const p = `pedit-${purchase.id}`;
  const chosenFood = food?.id ?? purchase.foodId;
  const detail = useQuery({ queryKey: keys.food(chosenFood), queryFn: () => foodDetail(chosenFood), staleTime: 10 * 60_000 });

  const field = (key: string, label: string, input: ReactNode) => (
    <div>
      <label htmlFor={`${p}-${key}`} className="block text-sm font-semibold">
        {label}
      </label>
      {input}
      <ErrorText id={`${p}-${key}`} error={errors[key]} />
    </div>
  );

  return (
    <EditRowShell
      colSpan={colSpan}
      label={`Edit ${purchase.foodName} of ${purchase.date}`}
      title={`Editing ${purchase.foodName}`}
      layout={{ grid: 'sm:grid-cols-4', span: 'sm:col-span-4' }}
      saving={saving}
      formError={errors._form}
      // A cleared picker never quietly keeps the old food: choose another, or Cancel keeps it.
      blocked={food ? undefined : `Choose the food bought to save, or Cancel to keep ${purchase.foodName}.`}
      onSubmit={() =>
        send({
          quantity: parseDecimal(quantity),
          unit,
          price: parseDecimal(price) ?? null,
          currency: currency.trim() === '' ? null : currency,
          date,
          spreadMonths: parseDecimal(spread),
          trimmed,
          note,
          // A new food replaces the old one (its refuse with it); Save is blocked while none is chosen.
          ...(food && food.id !== purchase.foodId ? { foodId: food.id } : {}),
        })
      }
      onCancel={onDone}
    >
      <div className="sm:col-span-4">
        <FoodPicker id={`${p}-food`} label="Food" value={food} onChange={setFood} error={errors.foodId} facts={false} compact />
      </div>
      {field('quantity', 'Quantity', <input {...invalidProps(`${p}-quantity`, errors.quantity)} type="text" inputMode="decimal" className="field mt-1 text-right" value={quantity} onChange={(e) => setQuantity(e.target.value)} />)}
      {field(
        'unit',
        'Unit',
        <UnitSelect id={`${p}-unit`} value={unit} onChange={setUnit} error={errors.unit} />,
      )}
      <div className="sm:col-span-4 empty:hidden">
        <UnitWeightNote unit={unit} basis={foodWeighBasis(detail.data)} quantity={parseDecimal(quantity)} units={household.units} />
      </div>
      {field('price', 'Price', <input {...invalidProps(`${p}-price`, errors.price)} type="text" inputMode="decimal" className="field mt-1 text-right" value={price} onChange={(e) => setPrice(e.target.value)} />)}
      {field('currency', 'Currency', <input {...invalidProps(`${p}-currency`, errors.currency)} type="text" maxLength={3} className="field mt-1 uppercase" value={currency} onChange={(e) => setCurrency(e.target.value.toUpperCase())} />)}
      {field('date', 'Date', <input {...invalidProps(`${p}-date`, errors.date)} type="date" className="field mt-1" value={date} onChange={(e) => setDate(e.target.value)} />)}
      <div className="flex items-end">
        <label className="flex min-h-11 items-center gap-2 font-semibold">
          <input type="checkbox" className="size-5" checked={trimmed} onChange={(e) => setTrimmed(e.target.checked)} />
          Weighed trimmed
        </label>
      </div>
      {field('spreadMonths', 'Eaten over (months)', <input {...invalidProps(`${p}-spreadMonths`, errors.spreadMonths)} type="text" inputMode="numeric" className="field mt-1" value={spread} onChange={(e) => setSpread(e.target.value)} />)}
      <div className="sm:col-span-3">
        {field('note', 'Note', <input {...invalidProps(`${p}-note`, errors.note)} type="text" maxLength={500} className="field mt-1" value={note} onChange={(e) => setNote(e.target.value)} />)}
      </div>
    </EditRowShell>
  );
}
