/**
 * The harvest log as a table (island): sortable, filtered by month, crop and use, paginated, with
 * totals in the household's units; inline edit and delete with confirmation. Everything goes
 * through TanStack Query, and a change invalidates the list so it updates without a reload.
 */
import { keepPreviousData, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useState, type FormEvent } from 'react';
import { harvestPatch, USE_LABELS, USES, zodErrorBody, type Use } from '../../lib/entry-schemas';
import { formatWeight, WEIGHT_UNITS, type WeightUnit } from '../../lib/units';
import { canWrite, get, keys, request, urls, ApiError, type Crop, type Harvest, type HarvestPage, type HouseholdInfo } from './api';
import { formatDay, monthRange } from './local-date';
import { QueryProvider } from './QueryProvider';
import { formatQuantity, parseDecimal, trimNumber } from './quantity-text';
import { FilterBar, Pager, SortHeader, SortSelect, stack, TotalsLine, MessageRow } from './table-bits';
import { Alert, ConfirmDelete, ErrorText, invalidProps, splitUseLabel, type Errors } from './ui';

const PAGE_SIZE = 25;

export default function HarvestTable(props: { household: HouseholdInfo }) {
  return (
    <QueryProvider>
      <HarvestTableInner {...props} />
    </QueryProvider>
  );
}

function HarvestTableInner({ household }: { household: HouseholdInfo }) {
  const hid = household.id;
  const api = urls(hid);
  const qc = useQueryClient();
  const writer = canWrite(household.role);
  const [month, setMonth] = useState('');
  const [cropId, setCropId] = useState('');
  const [use, setUse] = useState('');
  const [sort, setSort] = useState('-date');
  const [page, setPage] = useState(1);
  const [editing, setEditing] = useState<number | null>(null);
  const [alert, setAlert] = useState<string | null>(null);

  const range = month ? monthRange(month) : null;
  const params = { from: range?.from, to: range?.to, cropId: cropId || undefined, use: use || undefined, sort, page, pageSize: PAGE_SIZE };
  const list = useQuery({
    queryKey: [...keys.harvests(hid), 'table', params],
    queryFn: () => get<HarvestPage>(api.harvests(params)),
    placeholderData: keepPreviousData,
  });
  const crops = useQuery({ queryKey: keys.crops(hid, true), queryFn: () => get<{ crops: Crop[] }>(api.crops(true)).then((r) => r.crops) });

  const remove = useMutation({
    mutationFn: (id: number) => request<null>('DELETE', api.harvest(id)),
    onSuccess: () => {
      setAlert(null);
      void qc.invalidateQueries({ queryKey: keys.harvests(hid) });
      void qc.invalidateQueries({ queryKey: keys.allCrops(hid) });
    },
    onError: (e) => setAlert(`Could not delete: ${(e as Error).message}`),
  });

  const filter = (f: () => void) => {
    f();
    setPage(1);
  };
  const rows = list.data?.harvests ?? [];
  const colCount = writer ? 7 : 6;

  return (
    <div>
      <FilterBar>
        <div>
          <label htmlFor="f-month" className="block text-sm font-semibold">
            Month
          </label>
          <input id="f-month" type="month" className="field mt-1" value={month} onChange={(e) => filter(() => setMonth(e.target.value))} />
        </div>
        <div>
          <label htmlFor="f-crop" className="block text-sm font-semibold">
            Crop
          </label>
          <select id="f-crop" className="field mt-1" value={cropId} onChange={(e) => filter(() => setCropId(e.target.value))}>
            <option value="">All crops</option>
            {(crops.data ?? []).map((c) => (
              <option key={c.id} value={c.id}>
                {c.displayName}
                {c.archived ? ' (archived)' : ''}
              </option>
            ))}
          </select>
        </div>
        <div>
          <label htmlFor="f-use" className="block text-sm font-semibold">
            Use
          </label>
          <select id="f-use" className="field mt-1" value={use} onChange={(e) => filter(() => setUse(e.target.value))}>
            <option value="">All uses</option>
            {USES.map((u) => (
              <option key={u} value={u}>
                {USE_LABELS[u]}
              </option>
            ))}
          </select>
        </div>
        <SortSelect id="f-sort" sort={sort} onSort={setSort} options={[['-date', 'Newest first'], ['date', 'Oldest first'], ['-grams', 'Heaviest first'], ['grams', 'Lightest first'], ['crop', 'By crop']]} />
        <div className="max-sm:col-span-2">
          {month || cropId || use ? (
            <button type="button" className="btn-quiet w-full" onClick={() => filter(() => (setMonth(''), setCropId(''), setUse('')))}>
              Clear filters
            </button>
          ) : null}
        </div>
      </FilterBar>

      <div className="mt-4">
        <TotalsLine total={list.data?.total ?? 0} totals={list.data?.totals} units={household.units}>
          {list.isFetching ? <span className="text-sm">updating…</span> : null}
        </TotalsLine>
      </div>
      <Alert message={alert} />
      {list.isError ? <Alert message={`Could not load the harvest log: ${(list.error as Error).message}`} /> : null}

      <div className="mt-4 overflow-x-auto rounded-2xl border border-loam-200 bg-white">
        <table className={stack.table} data-testid="harvest-table">
          <caption className="sr-only">Harvest log, {sortCaption(sort)}</caption>
          <thead className={stack.thead}>
            <tr>
              <SortHeader label="Date" sort={sort} asc="date" desc="-date" onSort={setSort} />
              <SortHeader label="Crop" sort={sort} asc="crop" desc="crop" onSort={setSort} />
              <SortHeader label="Weighed" sort={sort} asc="grams" desc="-grams" onSort={setSort} className="text-right" />
              <th scope="col" className="px-3 py-1 text-right font-bold">
                Edible
              </th>
              <th scope="col" className="px-3 py-1 font-bold">
                Use
              </th>
              <th scope="col" className="px-3 py-1 font-bold">
                Note
              </th>
              {writer ? (
                <th scope="col" className="px-3 py-1">
                  <span className="sr-only">Actions</span>
                </th>
              ) : null}
            </tr>
          </thead>
          <tbody className={stack.tbody}>
            {list.isPending ? (
              <MessageRow colSpan={colCount}>Loading…</MessageRow>
            ) : rows.length === 0 ? (
              <MessageRow colSpan={colCount}>{month || cropId || use ? 'No harvests match these filters.' : 'No harvests logged yet.'}</MessageRow>
            ) : (
              rows.map((h) =>
                editing === h.id ? (
                  <EditRow key={h.id} harvest={h} colSpan={colCount} household={household} onDone={() => setEditing(null)} />
                ) : (
                  <tr key={h.id} className={stack.row} data-testid="harvest-row" data-id={h.id}>
                    <td className={`whitespace-nowrap px-3 py-2 ${stack.date}`}>{formatDay(h.date)}</td>
                    <td className={`px-3 py-2 font-semibold ${stack.name}`}>{h.cropName ?? h.foodName ?? '—'}</td>
                    <td className={`whitespace-nowrap px-3 py-2 text-right font-bold tabular-nums ${stack.weight}`}>{formatQuantity(h.quantity, h.unit)}</td>
                    <td className={`whitespace-nowrap px-3 py-2 text-right tabular-nums ${stack.edible}`}>
                      <span className="sm:hidden">edible </span>
                      {formatWeight(h.edibleGrams, household.units)}
                    </td>
                    <td className={`px-3 py-2 ${stack.line}`}>
                      {splitUseLabel(h.use)[0]}
                      {h.spreadMonths > 1 ? <span className="block text-xs text-loam-700 max-sm:inline max-sm:text-sm"><span className="sm:hidden"> · </span>over {h.spreadMonths} months</span> : null}
                      {h.splitGroup ? <span className="block text-xs text-loam-700 max-sm:inline max-sm:text-sm"><span className="sm:hidden"> · </span>part of a split</span> : null}
                    </td>
                    <td className={`max-w-48 px-3 py-2 text-sm text-loam-700 max-sm:max-w-none ${stack.line}`}>
                      {h.trimmed ? <span className="block">weighed trimmed</span> : null}
                      {h.note}
                    </td>
                    {writer ? (
                      <td className={`whitespace-nowrap px-3 py-2 text-right ${stack.actions}`}>
                        <span className="inline-flex flex-wrap justify-end gap-2">
                          <button type="button" className="btn-quiet min-h-12 px-3" onClick={() => setEditing(h.id)} aria-label={`Edit ${h.cropName ?? 'entry'} of ${h.date}`}>
                            Edit
                          </button>
                          <ConfirmDelete what={`${formatQuantity(h.quantity, h.unit)} ${h.cropName ?? h.foodName ?? ''} of ${formatDay(h.date)}`} busy={remove.isPending} onConfirm={() => remove.mutate(h.id)} />
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
    </div>
  );
}

function sortCaption(sort: string): string {
  return { date: 'oldest first', '-date': 'newest first', grams: 'lightest first', '-grams': 'heaviest first', crop: 'by crop' }[sort] ?? '';
}

function EditRow({ harvest, colSpan, household, onDone }: { harvest: Harvest; colSpan: number; household: HouseholdInfo; onDone: () => void }) {
  const qc = useQueryClient();
  const api = urls(household.id);
  const [quantity, setQuantity] = useState(trimNumber(harvest.quantity, 3));
  const [unit, setUnit] = useState<WeightUnit>(harvest.unit);
  const [use, setUse] = useState<Use>(harvest.use);
  const [date, setDate] = useState(harvest.date);
  const [note, setNote] = useState(harvest.note ?? '');
  const [errors, setErrors] = useState<Errors>({});
  const p = `edit-${harvest.id}`;

  const save = useMutation({
    mutationFn: (body: unknown) => request<{ harvest: Harvest }>('PATCH', api.harvest(harvest.id), body),
    onSuccess: () => {
      void qc.invalidateQueries({ queryKey: keys.harvests(household.id) });
      void qc.invalidateQueries({ queryKey: keys.allCrops(household.id) });
      onDone();
    },
    onError: (e) => setErrors(e instanceof ApiError && Object.keys(e.fields).length ? e.fields : { _form: (e as Error).message }),
  });

  function submit(e: FormEvent) {
    e.preventDefault();
    const r = harvestPatch.safeParse({ quantity: parseDecimal(quantity), unit, use, date, note });
    if (!r.success) {
      setErrors(zodErrorBody(r.error).fields);
      return;
    }
    setErrors({});
    save.mutate(r.data);
  }

  return (
    <tr className="border-b border-loam-200 bg-rind-100/50 max-sm:block">
      <td colSpan={colSpan} className="px-3 py-3 max-sm:block">
        <form onSubmit={submit} noValidate aria-label={`Edit ${harvest.cropName ?? 'harvest'} of ${harvest.date}`} className="grid gap-3 sm:grid-cols-5 sm:items-start">
          <p className="font-bold sm:col-span-5">Editing {harvest.cropName ?? harvest.foodName}</p>
          <div>
            <label htmlFor={`${p}-quantity`} className="block text-sm font-semibold">
              Quantity
            </label>
            <input {...invalidProps(`${p}-quantity`, errors.quantity)} type="text" inputMode="decimal" className="field mt-1 text-right tabular-nums" value={quantity} onChange={(e) => setQuantity(e.target.value)} />
            <ErrorText id={`${p}-quantity`} error={errors.quantity} />
          </div>
          <div>
            <label htmlFor={`${p}-unit`} className="block text-sm font-semibold">
              Unit
            </label>
            <select id={`${p}-unit`} className="field mt-1" value={unit} onChange={(e) => setUnit(e.target.value as WeightUnit)}>
              {WEIGHT_UNITS.map((u) => (
                <option key={u} value={u}>
                  {u}
                </option>
              ))}
            </select>
          </div>
          <div>
            <label htmlFor={`${p}-use`} className="block text-sm font-semibold">
              Use
            </label>
            <select {...invalidProps(`${p}-use`, errors.use)} className="field mt-1" value={use} onChange={(e) => setUse(e.target.value as Use)}>
              {USES.map((u) => (
                <option key={u} value={u}>
                  {USE_LABELS[u]}
                </option>
              ))}
            </select>
            <ErrorText id={`${p}-use`} error={errors.use} />
          </div>
          <div>
            <label htmlFor={`${p}-date`} className="block text-sm font-semibold">
              Date
            </label>
            <input {...invalidProps(`${p}-date`, errors.date)} type="date" className="field mt-1" value={date} onChange={(e) => setDate(e.target.value)} />
            <ErrorText id={`${p}-date`} error={errors.date} />
          </div>
          <div>
            <label htmlFor={`${p}-note`} className="block text-sm font-semibold">
              Note
            </label>
            <input {...invalidProps(`${p}-note`, errors.note)} type="text" className="field mt-1" maxLength={500} value={note} onChange={(e) => setNote(e.target.value)} />
            <ErrorText id={`${p}-note`} error={errors.note} />
          </div>
          <div className="flex flex-wrap gap-2 sm:col-span-5">
            <button type="submit" className="btn-primary" disabled={save.isPending}>
              {save.isPending ? 'Saving…' : 'Save changes'}
            </button>
            <button type="button" className="btn-quiet" onClick={onDone}>
              Cancel
            </button>
          </div>
          {errors._form || errors.spreadMonths || errors.cropId ? (
            <p role="alert" className="font-semibold text-berry-700 sm:col-span-5">
              {errors._form ?? errors.spreadMonths ?? errors.cropId}
            </p>
          ) : null}
        </form>
      </td>
    </tr>
  );
}
