/**
 * Bought food as a table: sortable, filtered by month and food, paginated, totals in the
 * household's units, inline edit and delete with confirmation (TanStack Query; a change
 * invalidates the list so it updates without a reload).
 */
import { keepPreviousData, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useState, type FormEvent, type ReactNode } from 'react';
import { purchasePatch, zodErrorBody } from '../../lib/entry-schemas';
import { formatWeight, WEIGHT_UNITS, type WeightUnit } from '../../lib/units';
import { ApiError, get, keys, request, urls, type HouseholdInfo, type Purchase, type PurchasePage } from './api';
import { FoodPicker, type FoodChoice } from './FoodPicker';
import { formatDay, monthRange } from './local-date';
import { formatQuantity, parseDecimal, trimNumber } from './quantity-text';
import { FilterBar, Pager, SortHeader, SortSelect, stack, TotalsLine, MessageRow } from './table-bits';
import { Alert, ConfirmDelete, ErrorText, invalidProps, type Errors } from './ui';

const PAGE_SIZE = 25;

/** "3.49 EUR", or empty. */
export function formatPrice(price: Purchase['price'], currency: string | null): string {
  if (price === null) return '';
  const n = Number(price);
  return Number.isFinite(n) ? `${n.toFixed(2)}${currency ? ` ${currency}` : ''}` : '';
}

export function PurchaseTable({ household, writer }: { household: HouseholdInfo; writer: boolean }) {
  const hid = household.id;
  const api = urls(hid);
  const qc = useQueryClient();
  const [month, setMonth] = useState('');
  const [food, setFood] = useState<FoodChoice | null>(null);
  const [sort, setSort] = useState('-date');
  const [page, setPage] = useState(1);
  const [editing, setEditing] = useState<number | null>(null);
  const [alert, setAlert] = useState<string | null>(null);
  const range = month ? monthRange(month) : null;
  const params = { from: range?.from, to: range?.to, foodId: food?.id, sort, page, pageSize: PAGE_SIZE };
  const list = useQuery({ queryKey: [...keys.purchases(hid), 'table', params], queryFn: () => get<PurchasePage>(api.purchases(params)), placeholderData: keepPreviousData });
  const remove = useMutation({
    mutationFn: (id: number) => request<null>('DELETE', api.purchase(id)),
    onSuccess: () => void qc.invalidateQueries({ queryKey: keys.purchases(hid) }),
    onError: (e) => setAlert(`Could not delete: ${(e as Error).message}`),
  });
  const rows = list.data?.purchases ?? [];
  const cols = writer ? 7 : 6;

  return (
    <section aria-labelledby="bought-table-title">
      <h2 id="bought-table-title" className="mb-3 text-2xl font-extrabold">
        Bought food log
      </h2>
      <FilterBar>
        <div>
          <label htmlFor="pf-month" className="block text-sm font-semibold">
            Month
          </label>
          <input id="pf-month" type="month" className="field mt-1" value={month} onChange={(e) => (setMonth(e.target.value), setPage(1))} />
        </div>
        <div className="col-span-2">
          <FoodPicker id="pf-food" label="Food" value={food} onChange={(f) => (setFood(f), setPage(1))} facts={false} compact />
        </div>
        <SortSelect id="pf-sort" sort={sort} onSort={setSort} options={[['-date', 'Newest first'], ['date', 'Oldest first'], ['-grams', 'Heaviest first'], ['grams', 'Lightest first'], ['food', 'By food']]} />
        <div className="max-sm:col-span-2">
          {month || food ? (
            <button type="button" className="btn-quiet w-full" onClick={() => (setMonth(''), setFood(null), setPage(1))}>
              Clear filters
            </button>
          ) : null}
        </div>
      </FilterBar>
      <div className="mt-4">
        <TotalsLine total={list.data?.total ?? 0} totals={list.data?.totals} units={household.units} />
      </div>
      <Alert message={alert} />
      {list.isError ? <Alert message={`Could not load the bought food: ${(list.error as Error).message}`} /> : null}
      <div className="mt-4 overflow-x-auto rounded-2xl border border-loam-200 bg-white">
        <table className={stack.table} data-testid="purchase-table">
          <caption className="sr-only">Bought food</caption>
          <thead className={stack.thead}>
            <tr>
              <SortHeader label="Date" sort={sort} asc="date" desc="-date" onSort={setSort} />
              <SortHeader label="Food" sort={sort} asc="food" desc="food" onSort={setSort} />
              <SortHeader label="Weight" sort={sort} asc="grams" desc="-grams" onSort={setSort} className="text-right" />
              <th scope="col" className="px-3 py-1 text-right font-bold">
                Edible
              </th>
              <th scope="col" className="px-3 py-1 text-right font-bold">
                Price
              </th>
              <th scope="col" className="px-3 py-1 font-bold">
                Eaten over
              </th>
              {writer ? (
                <th scope="col">
                  <span className="sr-only">Actions</span>
                </th>
              ) : null}
            </tr>
          </thead>
          <tbody className={stack.tbody}>
            {list.isPending ? (
              <MessageRow colSpan={cols}>Loading…</MessageRow>
            ) : rows.length === 0 ? (
              <MessageRow colSpan={cols}>{month || food ? 'No bought food matches these filters.' : 'No bought food entered yet.'}</MessageRow>
            ) : (
              rows.map((p) =>
                editing === p.id ? (
                  <EditPurchaseRow key={p.id} purchase={p} colSpan={cols} household={household} onDone={() => setEditing(null)} />
                ) : (
                  <tr key={p.id} className={stack.row} data-testid="purchase-row">
                    <td className={`whitespace-nowrap px-3 py-2 ${stack.date}`}>{formatDay(p.date)}</td>
                    <td className={`px-3 py-2 ${stack.name}`}>
                      <span className="font-semibold">{p.foodName}</span>
                      {p.note ? <span className="block text-sm text-loam-700">{p.note}</span> : null}
                    </td>
                    <td className={`whitespace-nowrap px-3 py-2 text-right font-bold tabular-nums ${stack.weight}`}>{formatQuantity(p.quantity, p.unit)}</td>
                    <td className={`whitespace-nowrap px-3 py-2 text-right tabular-nums ${stack.edible}`}>
                      <span className="sm:hidden">edible </span>
                      {formatWeight(p.edibleGrams, household.units)}
                    </td>
                    <td className="whitespace-nowrap px-3 py-2 text-right tabular-nums max-sm:order-5 max-sm:p-0 max-sm:text-left max-sm:text-sm">{formatPrice(p.price, p.currency)}</td>
                    <td className="whitespace-nowrap px-3 py-2 max-sm:order-5 max-sm:p-0 max-sm:text-right max-sm:text-sm">{p.spreadMonths === 1 ? 'this month' : <><span className="sm:hidden">eaten over </span>{p.spreadMonths} months</>}</td>
                    {writer ? (
                      <td className={`whitespace-nowrap px-3 py-2 text-right ${stack.actions}`}>
                        <span className="inline-flex flex-wrap justify-end gap-2">
                          <button type="button" className="btn-quiet min-h-12 px-3" onClick={() => setEditing(p.id)} aria-label={`Edit ${p.foodName} of ${p.date}`}>
                            Edit
                          </button>
                          <ConfirmDelete what={`${formatQuantity(p.quantity, p.unit)} ${p.foodName} of ${formatDay(p.date)}`} busy={remove.isPending} onConfirm={() => remove.mutate(p.id)} />
                        </span>
                      </td>
                    ) : null}
                  </tr>
                ),
              )
            )}
          </tbody>
        </table>
      </div>
      <Pager page={page} pageSize={PAGE_SIZE} total={list.data?.total ?? 0} onPage={setPage} />
    </section>
  );
}

function EditPurchaseRow({ purchase, colSpan, household, onDone }: { purchase: Purchase; colSpan: number; household: HouseholdInfo; onDone: () => void }) {
  const qc = useQueryClient();
  const api = urls(household.id);
  const [quantity, setQuantity] = useState(trimNumber(purchase.quantity, 3));
  const [unit, setUnit] = useState<WeightUnit>(purchase.unit);
  const [price, setPrice] = useState(purchase.price == null ? '' : String(Number(purchase.price)));
  const [currency, setCurrency] = useState(purchase.currency ?? '');
  const [date, setDate] = useState(purchase.date);
  const [spread, setSpread] = useState(String(purchase.spreadMonths));
  const [note, setNote] = useState(purchase.note ?? '');
  const [errors, setErrors] = useState<Errors>({});
  const p = `pedit-${purchase.id}`;
  const save = useMutation({
    mutationFn: (body: unknown) => request<{ purchase: Purchase }>('PATCH', api.purchase(purchase.id), body),
    onSuccess: () => {
      void qc.invalidateQueries({ queryKey: keys.purchases(household.id) });
      onDone();
    },
    onError: (e) => setErrors(e instanceof ApiError && Object.keys(e.fields).length ? e.fields : { _form: (e as Error).message }),
  });

  function submit(e: FormEvent) {
    e.preventDefault();
    const priceN = parseDecimal(price);
    const r = purchasePatch.safeParse({
      quantity: parseDecimal(quantity),
      unit,
      price: priceN ?? null,
      currency: currency.trim() === '' ? null : currency,
      date,
      spreadMonths: parseDecimal(spread),
      note,
    });
    if (!r.success) return setErrors(zodErrorBody(r.error).fields);
    setErrors({});
    save.mutate(r.data);
  }

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
    <tr className="border-b border-loam-200 bg-rind-100/50 max-sm:block">
      <td colSpan={colSpan} className="px-3 py-3 max-sm:block">
        <form onSubmit={submit} noValidate aria-label={`Edit ${purchase.foodName} of ${purchase.date}`} className="grid gap-3 sm:grid-cols-4 sm:items-start">
          <p className="font-bold sm:col-span-4">Editing {purchase.foodName}</p>
          {field('quantity', 'Quantity', <input {...invalidProps(`${p}-quantity`, errors.quantity)} type="text" inputMode="decimal" className="field mt-1 text-right" value={quantity} onChange={(e) => setQuantity(e.target.value)} />)}
          {field(
            'unit',
            'Unit',
            <select id={`${p}-unit`} className="field mt-1" value={unit} onChange={(e) => setUnit(e.target.value as WeightUnit)}>
              {WEIGHT_UNITS.map((u) => (
                <option key={u}>{u}</option>
              ))}
            </select>,
          )}
          {field('price', 'Price', <input {...invalidProps(`${p}-price`, errors.price)} type="text" inputMode="decimal" className="field mt-1 text-right" value={price} onChange={(e) => setPrice(e.target.value)} />)}
          {field('currency', 'Currency', <input {...invalidProps(`${p}-currency`, errors.currency)} type="text" maxLength={3} className="field mt-1 uppercase" value={currency} onChange={(e) => setCurrency(e.target.value.toUpperCase())} />)}
          {field('date', 'Date', <input {...invalidProps(`${p}-date`, errors.date)} type="date" className="field mt-1" value={date} onChange={(e) => setDate(e.target.value)} />)}
          {field('spreadMonths', 'Eaten over (months)', <input {...invalidProps(`${p}-spreadMonths`, errors.spreadMonths)} type="text" inputMode="numeric" className="field mt-1" value={spread} onChange={(e) => setSpread(e.target.value)} />)}
          <div className="sm:col-span-2">
            {field('note', 'Note', <input {...invalidProps(`${p}-note`, errors.note)} type="text" maxLength={500} className="field mt-1" value={note} onChange={(e) => setNote(e.target.value)} />)}
          </div>
          <div className="flex flex-wrap gap-2 sm:col-span-4">
            <button type="submit" className="btn-primary" disabled={save.isPending}>
              {save.isPending ? 'Saving…' : 'Save changes'}
            </button>
            <button type="button" className="btn-quiet" onClick={onDone}>
              Cancel
            </button>
          </div>
          {errors._form ? (
            <p role="alert" className="font-semibold text-berry-700 sm:col-span-4">
              {errors._form}
            </p>
          ) : null}
        </form>
      </td>
    </tr>
  );
}
