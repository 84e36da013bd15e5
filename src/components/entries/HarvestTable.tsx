/**
 * The harvest log as a table (island): sortable, filtered by month, crop and use, paginated, with
 * totals in the household's units; inline edit and delete with confirmation. The table itself is
 * EntriesTable; this file brings the harvest log's columns, filters, edit row and words.
 */
import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { harvestPatch, USE_LABELS, USES, type Use } from '@/lib/entry-schemas';
import { WEIGHT_UNITS, type UnitSystem, type WeightUnit } from '@/lib/units';
import { canWrite, get, keys, urls, type Crop, type Harvest, type HarvestPage, type HouseholdInfo } from './api';
import { EditRowShell, useEntryPatch } from './EditEntryRow';
import { PRESERVE_METHOD_LABELS } from './PreserveField';
import { EntriesTable, entryColumns, type EntryColumn } from './EntriesTable';
import { dateColumn, edibleColumn, weightColumn } from './entry-columns';
import { formatDay, monthRange } from './local-date';
import { QueryProvider } from '@/components/QueryProvider';
import { formatQuantity, parseDecimal, trimNumber } from './quantity-text';
import { MonthFilter, stack } from './table-bits';
import { ErrorText, invalidProps, splitUseLabel } from './ui';

export default function HarvestTable(props: { household: HouseholdInfo }) {
  return (
    <QueryProvider>
      <HarvestTableInner {...props} />
    </QueryProvider>
  );
}

const col = entryColumns<Harvest>();

/** The harvest log's columns; weights in the household's units. */
function harvestColumns(units: UnitSystem): EntryColumn<Harvest>[] {
  return [
    dateColumn<Harvest>(),
    col.accessor((h) => h.cropName ?? h.foodName ?? '—', {
      id: 'crop',
      header: 'Crop',
      meta: { sort: { asc: 'crop', desc: 'crop' }, cellClass: `px-3 py-2 font-semibold ${stack.name}` },
    }),
    weightColumn<Harvest>('weighed', 'Weighed', units),
    edibleColumn<Harvest>(units),
    col.accessor('use', {
      id: 'use',
      header: 'Use',
      meta: { cellClass: `px-3 py-2 ${stack.line}` },
      cell: ({ row: { original: h } }) => (
        <>
          {splitUseLabel(h.use)[0]}
          {h.preserveMethod ? <span data-testid="preserve-method"> ({PRESERVE_METHOD_LABELS[h.preserveMethod].toLowerCase()})</span> : null}
          {h.spreadMonths > 1 ? <span className="block text-xs text-loam-700 max-sm:inline max-sm:text-sm"><span className="sm:hidden"> · </span>over {h.spreadMonths} months</span> : null}
          {h.splitGroup ? <span className="block text-xs text-loam-700 max-sm:inline max-sm:text-sm"><span className="sm:hidden"> · </span>part of a split</span> : null}
        </>
      ),
    }),
    col.accessor('note', {
      id: 'note',
      header: 'Note',
      meta: { cellClass: `max-w-48 px-3 py-2 text-sm text-loam-700 max-sm:max-w-none ${stack.line}` },
      cell: ({ row: { original: h } }) => (
        <>
          {h.trimmed ? <span className="block">weighed trimmed</span> : null}
          {h.note}
        </>
      ),
    }),
  ];
}

function sortCaption(sort: string): string {
  return { date: 'oldest first', '-date': 'newest first', grams: 'lightest first', '-grams': 'heaviest first', crop: 'by crop' }[sort] ?? '';
}

function HarvestTableInner({ household }: { household: HouseholdInfo }) {
  const hid = household.id;
  const api = urls(hid);
  const [month, setMonth] = useState('');
  const [cropId, setCropId] = useState('');
  const [use, setUse] = useState('');
  const crops = useQuery({ queryKey: keys.crops(hid, true), queryFn: () => get<{ crops: Crop[] }>(api.crops(true)).then((r) => r.crops) });
  const [columns] = useState(() => harvestColumns(household.units));
  const range = month ? monthRange(month) : null;

  return (
    <EntriesTable
      household={household}
      writer={canWrite(household.role)}
      columns={columns}
      listKey={keys.harvests(hid)}
      fetchPage={(params) => get<HarvestPage>(api.harvests(params)).then((p) => ({ rows: p.harvests, total: p.total, totals: p.totals }))}
      filters={{ from: range?.from, to: range?.to, cropId: cropId || undefined, use: use || undefined }}
      filterFields={
        <>
          <MonthFilter id="f-month" value={month} onChange={setMonth} />
          <div>
            <label htmlFor="f-crop" className="block text-sm font-semibold">
              Crop
            </label>
            <select id="f-crop" className="field mt-1" value={cropId} onChange={(e) => setCropId(e.target.value)}>
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
            <select id="f-use" className="field mt-1" value={use} onChange={(e) => setUse(e.target.value)}>
              <option value="">All uses</option>
              {USES.map((u) => (
                <option key={u} value={u}>
                  {USE_LABELS[u]}
                </option>
              ))}
            </select>
          </div>
        </>
      }
      onClearFilters={() => (setMonth(''), setCropId(''), setUse(''))}
      sortSelect={{ id: 'f-sort', options: [['-date', 'Newest first'], ['date', 'Oldest first'], ['-grams', 'Heaviest first'], ['grams', 'Lightest first'], ['crop', 'By crop']] }}
      deleteUrl={api.harvest}
      invalidate={[keys.harvests(hid), keys.allCrops(hid)]}
      EditRow={HarvestEditRow}
      editLabel={(h) => `Edit ${h.cropName ?? 'entry'} of ${h.date}`}
      deleteWhat={(h) => `${formatQuantity(h.quantity, h.unit)} ${h.cropName ?? h.foodName ?? ''} of ${formatDay(h.date)}`}
      testIds={{ table: 'harvest-table', row: 'harvest-row' }}
      words={{ caption: (sort) => `Harvest log, ${sortCaption(sort)}`, loadError: 'Could not load the harvest log', empty: 'No harvests logged yet.', emptyFiltered: 'No harvests match these filters.' }}
      showFetching
    />
  );
}

function HarvestEditRow({ entry: harvest, colSpan, household, onDone }: { entry: Harvest; colSpan: number; household: HouseholdInfo; onDone: () => void }) {
  const [quantity, setQuantity] = useState(trimNumber(harvest.quantity, 3));
  const [unit, setUnit] = useState<WeightUnit>(harvest.unit);
  const [use, setUse] = useState<Use>(harvest.use);
  const [date, setDate] = useState(harvest.date);
  const [note, setNote] = useState(harvest.note ?? '');
  const { errors, send, saving } = useEntryPatch(harvestPatch, urls(household.id).harvest(harvest.id), [keys.harvests(household.id), keys.allCrops(household.id)], onDone);
  const p = `edit-${harvest.id}`;

  return (
    <EditRowShell
      colSpan={colSpan}
      label={`Edit ${harvest.cropName ?? 'harvest'} of ${harvest.date}`}
      title={`Editing ${harvest.cropName ?? harvest.foodName}`}
      layout={{ grid: 'sm:grid-cols-5', span: 'sm:col-span-5' }}
      saving={saving}
      formError={errors._form ?? errors.spreadMonths ?? errors.cropId}
      onSubmit={() => send({ quantity: parseDecimal(quantity), unit, use, date, note })}
      onCancel={onDone}
    >
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
    </EditRowShell>
  );
}
