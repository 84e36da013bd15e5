/**
 * The harvest log as a table (island): sortable, filtered by month, crop and use, paginated, with
 * totals in the household's units; inline edit and delete with confirmation, each offering Undo in
 * the page's toast. A split weighing shows whole: the parts of a page's weighings that fall on
 * another page are fetched with it. The table itself is EntriesTable; this file brings the harvest
 * log's columns, filters, edit row and words.
 */
import { useQuery } from '@tanstack/react-query';
import { useState, type ReactNode } from 'react';
import { USE_LABELS, USES } from '@/lib/entry-schemas';
import { groupWeighings, splitGroupsOf, withMissingParts } from '@/lib/split-weighing';
import { type UnitSystem } from '@/lib/units';
import { UndoProvider } from '@/components/UndoToast';
import { canWrite, get, keys, request, urls, type Crop, type Harvest, type HarvestPage, type HouseholdInfo } from './api';
import { HarvestEditRow } from './HarvestEditRow';
import { PRESERVE_METHOD_LABELS } from './PreserveField';
import { EntriesTable, entryColumns, type EntryColumn } from './EntriesTable';
import { dateColumn, edibleColumn, weightColumn } from './entry-columns';
import { formatDay, monthRange } from './local-date';
import { QueryProvider } from '@/components/QueryProvider';
import { formatInUnit, formatQuantity } from './quantity-text';
import { MonthFilter, stack } from './table-bits';
import { splitUseLabel } from './ui';
import { outcomesOf, useEntryUndo } from './use-entry-undo';

export default function HarvestTable(props: { household: HouseholdInfo }) {
  return (
    <QueryProvider>
      <UndoProvider>
        <HarvestTableInner {...props} />
      </UndoProvider>
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

/** The page's rows with the parts of each split weighing together, where its first part stands. */
function weighingOrder(rows: Harvest[]): Harvest[] {
  // Within a weighing the parts keep the order they were entered in, whatever the list's sort.
  return groupWeighings(rows).flatMap((line) => (line.kind === 'split' ? [...line.parts].sort((a, b) => a.id - b.id) : [line.entry]));
}

/** Above the first part of a split weighing on the page: the weighing, its total and its parts. */
function splitLead(h: Harvest, previous: Harvest | undefined, page: Harvest[]): ReactNode {
  if (h.splitGroup === null || previous?.splitGroup === h.splitGroup) return null;
  const parts = page.filter((p) => p.splitGroup === h.splitGroup);
  const grams = parts.reduce((sum, p) => sum + p.grams, 0);
  return (
    <p data-testid="split-weighing" className="text-sm">
      <span className="font-bold">
        One weighing of {h.cropName ?? h.foodName}, {formatDay(h.date)}: {formatInUnit(grams, h.unit)}
      </span>
      <span className="text-loam-700">
        {' '}
        in {parts.length} parts — {parts.map((p) => `${formatQuantity(p.quantity, p.unit)} ${splitUseLabel(p.use)[0].toLowerCase()}`).join(', ')}
      </span>
    </p>
  );
}

/**
 * A page of the log with every part of its split weighings: the parts that fell on another page
 * come in one more request under the same filters (so a weighing straddling two pages shows
 * whole on both).
 */
async function pageWithWholeWeighings(hid: number, params: Record<string, string | number | undefined>): Promise<{ rows: Harvest[]; total: number; totals: HarvestPage['totals'] }> {
  const api = urls(hid);
  const p = await get<HarvestPage>(api.harvests(params));
  const groups = splitGroupsOf(p.harvests);
  let rows = p.harvests;
  if (groups.length > 0) {
    const { sort: _sort, page: _page, pageSize: _size, ...filters } = params;
    const parts = await get<HarvestPage>(api.harvests({ ...filters, splitGroup: groups.join(','), pageSize: 200 }));
    rows = withMissingParts(p.harvests, parts.harvests);
  }
  return { rows: weighingOrder(rows), total: p.total, totals: p.totals };
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
  const offerUndo = useEntryUndo(hid, [keys.harvests(hid), keys.allCrops(hid)]);
  const entryText = (h: Harvest) => `${formatQuantity(h.quantity, h.unit)} ${h.cropName ?? h.foodName ?? ''} of ${formatDay(h.date)}`;

  // Undo logs the harvest again: its larder records are read first, and a part rejoins its weighing.
  async function deleteHarvest(h: Harvest, page: readonly Harvest[]) {
    const outcomes = await outcomesOf(hid, h);
    await request<null>('DELETE', api.harvest(h.id));
    const sibling = h.splitGroup === null ? undefined : page.find((p) => p.splitGroup === h.splitGroup && p.id !== h.id);
    offerUndo(`Deleted ${entryText(h)}`, { kind: 'harvest-deleted', harvest: h, splitWith: sibling?.id ?? null, outcomes });
  }

  return (
    <EntriesTable
      household={household}
      writer={canWrite(household.role)}
      columns={columns}
      listKey={keys.harvests(hid)}
      fetchPage={(params) => pageWithWholeWeighings(hid, params)}
      rowLead={splitLead}
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
      deleteEntry={deleteHarvest}
      invalidate={[keys.harvests(hid), keys.allCrops(hid)]}
      EditRow={HarvestEditRow}
      editLabel={(h) => `Edit ${h.cropName ?? 'entry'} of ${h.date}`}
      deleteWhat={entryText}
      testIds={{ table: 'harvest-table', row: 'harvest-row' }}
      words={{ caption: (sort) => `Harvest log, ${sortCaption(sort)}`, loadError: 'Could not load the harvest log', empty: 'No harvests logged yet.', emptyFiltered: 'No harvests match these filters.' }}
      showFetching
    />
  );
}
