/**
 * Importing old logs from CSV (island): choose the file and what it holds, preview it (the rows as
 * they would be stored, each problem with its row number), create the crops the household does not
 * have yet (kind + reference food for each), then commit — all rows or none. Export links for
 * re-importable CSV and a whole-household JSON backup sit beside it on the page.
 */
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useRef, useState, type FormEvent } from 'react';
import { CROP_CATEGORIES, CROP_CATEGORY_LABELS, type CropCategory } from '@/lib/crop-categories';
import { CSV_LIMITS, HARVEST_CSV_COLUMNS, PURCHASE_CSV_COLUMNS } from '@/lib/csv-import';
import { formatWeightPair } from '@/lib/units';
import { countedAmountText, isCountOrVolume } from '@/lib/entry-units';
import { ApiError, canWrite, keys, request, urls, type CsvError, type HouseholdInfo } from './api';
import { FoodPicker, type FoodChoice } from './FoodPicker';
import { formatDay } from './local-date';
import { QueryProvider } from '@/components/QueryProvider';
import { formatQuantity } from './quantity-text';
import { Alert } from './ui';
import type { ImportAnswer as ImportAnswerOf } from '@/lib/api-types';
import { countText } from '@/lib/plural';

type Kind = 'harvests' | 'purchases';

// The answer's shape is the server's own (type-only import: no server code reaches the browser).
type ImportAnswer = ImportAnswerOf['body'];

interface NewCrop {
  name: string;
  variety?: string;
  category: CropCategory;
  food: FoodChoice | null;
  create: boolean;
}

const cropKey = (c: { name: string; variety?: string | undefined }) => `${c.name.toLowerCase()}\u0000${(c.variety ?? '').toLowerCase()}`;

export default function CsvImport(props: { household: HouseholdInfo }) {
  return (
    <QueryProvider>
      <CsvImportInner {...props} />
    </QueryProvider>
  );
}

function CsvImportInner({ household }: { household: HouseholdInfo }) {
  const hid = household.id;
  const api = urls(hid);
  const qc = useQueryClient();
  const fileRef = useRef<HTMLInputElement>(null);
  const [kind, setKind] = useState<Kind>('harvests');
  const [file, setFile] = useState<File | null>(null);
  const [fileError, setFileError] = useState<string | undefined>();
  const [preview, setPreview] = useState<ImportAnswer | null>(null);
  const [newCrops, setNewCrops] = useState<Record<string, NewCrop>>({});
  const [done, setDone] = useState<string | null>(null);

  const createCrops = () =>
    Object.values(newCrops)
      .filter((c) => c.create)
      .map((c) => ({ name: c.name, ...(c.variety ? { variety: c.variety } : {}), category: c.category, foodId: c.food?.id ?? null }));

  const send = useMutation({
    mutationFn: async (mode: 'preview' | 'commit') => {
      const form = new FormData();
      form.set('file', file!);
      form.set('kind', kind);
      form.set('mode', mode);
      if (kind === 'harvests') form.set('createCrops', JSON.stringify(createCrops()));
      try {
        return await request<ImportAnswer>('POST', api.imports(), form);
      } catch (e) {
        // A refused commit (422) still carries the rows and errors to show.
        if (e instanceof ApiError && e.status === 422 && (e.body as ImportAnswer | null)?.errors) return e.body as ImportAnswer;
        throw e;
      }
    },
    onSuccess: (a, mode) => {
      if (mode === 'commit' && a.ok) {
        setDone(`Imported ${kind === 'harvests' ? countText(a.created ?? a.rowCount, 'harvest') : countText(a.created ?? a.rowCount, 'bought-food entry', 'bought-food entries')}.`);
        setPreview(null);
        setNewCrops({});
        setFile(null);
        if (fileRef.current) fileRef.current.value = '';
        void qc.invalidateQueries();
        void qc.invalidateQueries({ queryKey: keys.allCrops(hid) });
        return;
      }
      setPreview(a);
      setNewCrops((prev) => {
        const next: Record<string, NewCrop> = {};
        for (const c of a.unknownCrops ?? []) next[cropKey(c)] = prev[cropKey(c)] ?? { name: c.name, ...(c.variety ? { variety: c.variety } : {}), category: c.category ?? 'other', food: null, create: true };
        // Keep the crops chosen earlier: once created virtually they are no longer "unknown".
        for (const [k, v] of Object.entries(prev)) if (!(k in next) && v.create) next[k] = v;
        return next;
      });
    },
  });

  function onPreview(e: FormEvent) {
    e.preventDefault();
    setDone(null);
    if (!file) return setFileError('Choose a CSV file first.');
    if (file.size > CSV_LIMITS.maxBytes) return setFileError(`The file is ${(file.size / 1024 / 1024).toFixed(1)} MB; the limit is ${CSV_LIMITS.maxBytes / 1024 / 1024} MB. Split it into smaller files.`);
    setFileError(undefined);
    send.mutate('preview');
  }

  if (!canWrite(household.role)) {
    return <p className="card">Your role in this household is viewer: you can export its records (below) but not import.</p>;
  }

  const columns = kind === 'harvests' ? HARVEST_CSV_COLUMNS : PURCHASE_CSV_COLUMNS;
  const errorsByRow = new Map<number, CsvError[]>();
  for (const err of preview?.errors ?? []) errorsByRow.set(err.row, [...(errorsByRow.get(err.row) ?? []), err]);
  const pendingCrops = Object.entries(newCrops);
  const creating = kind === 'harvests' ? pendingCrops.filter(([, c]) => c.create).length : 0;
  // With new crops chosen, the commit itself is the check: it creates them and writes every row in
  // one transaction, or answers 422 with the rows to fix and writes nothing.
  const canCommit = preview !== null && (preview.ok || creating > 0);
  const stale = preview !== null && preview.kind === 'harvests' && pendingCrops.some(([k, c]) => c.create && (preview.unknownCrops ?? []).some((u) => cropKey(u) === k));

  return (
    <div>
      <form onSubmit={onPreview} noValidate className="card" aria-labelledby="import-title">
        <h2 id="import-title" className="text-xl font-bold">
          Import old logs
        </h2>
        <fieldset className="mt-4">
          <legend className="font-semibold">The file holds</legend>
          <div className="mt-2 flex flex-wrap gap-2">
            {(['harvests', 'purchases'] as const).map((k) => (
              <label key={k} className="chip">
                <input type="radio" name="kind" value={k} className="chip-dot" checked={kind === k} onChange={() => (setKind(k), setPreview(null))} />
                {k === 'harvests' ? 'Harvests' : 'Bought food'}
              </label>
            ))}
          </div>
        </fieldset>
        <p className="mt-3 text-sm text-loam-700">
          A header row, columns in any order: <code className="rounded bg-loam-100 px-1">{columns.join(', ')}</code>.{' '}
          {kind === 'harvests' ? 'Give crop (matched to your crops by name) or food_code. ' : ''}
          Comma or semicolon separated, UTF-8; at most {CSV_LIMITS.maxBytes / 1024 / 1024} MB and {CSV_LIMITS.maxRows.toLocaleString('en')} rows. An exported file imports as it is.
        </p>
        <div className="mt-4">
          <label htmlFor="import-file" className="block font-semibold">
            CSV file
          </label>
          <input
            ref={fileRef}
            id="import-file"
            type="file"
            accept=".csv,text/csv,text/plain"
            className="mt-1 block w-full rounded-xl border border-loam-200 bg-white p-2 text-base file:mr-3 file:min-h-12 file:rounded-lg file:border-0 file:bg-loam-100 file:px-4 file:font-semibold"
            aria-invalid={fileError ? true : undefined}
            aria-describedby={fileError ? 'import-file-error' : undefined}
            onChange={(e) => (setFile(e.target.files?.[0] ?? null), setPreview(null), setNewCrops({}), setFileError(undefined))}
          />
          {fileError ? (
            <p id="import-file-error" className="mt-1 text-sm font-semibold text-berry-700">
              {fileError}
            </p>
          ) : null}
        </div>
        <button type="submit" className="btn-primary mt-5" disabled={send.isPending}>
          {send.isPending && send.variables === 'preview' ? 'Reading…' : preview ? 'Check again' : 'Preview'}
        </button>
        {send.isError ? <Alert message={(send.error as Error).message} /> : null}
        {done ? <Alert tone="ok" message={done} /> : null}
      </form>

      {preview ? (
        <section className="mt-6" aria-labelledby="preview-title" data-testid="import-preview">
          <h2 id="preview-title" className="text-xl font-bold">
            Preview
          </h2>
          <div className={`mt-2 rounded-2xl px-4 py-3 ${preview.ok ? 'bg-sprout-100 text-sprout-900' : 'bg-berry-700/10 text-berry-700'}`} role="status">
            <p className="font-bold">
              {preview.ok
                ? `${countText(preview.rowCount, 'row')} ${preview.rowCount === 1 ? 'is' : 'are'} ready to import: ${formatWeightPair(preview.totals.grams, preview.totals.edibleGrams, household.units).weight} weighed, ${formatWeightPair(preview.totals.grams, preview.totals.edibleGrams, household.units).edible} edible portion.`
                : `${countText(preview.errors.length, 'problem')} to fix first — nothing is imported until every row is right.`}
            </p>
            {preview.ignoredColumns?.length ? <p className="text-sm">Columns ignored: {preview.ignoredColumns.join(', ')}.</p> : null}
          </div>

          {preview.errors.length > 0 ? (
            <ul className="mt-3 space-y-1" aria-label="Problems by row" data-testid="import-errors">
              {preview.errors.slice(0, 200).map((err, i) => (
                <li key={i} className="rounded-lg bg-white px-3 py-2 text-sm">
                  <span className="font-bold">{err.row === 0 ? 'File' : `Row ${err.row}`}</span>
                  {err.column ? <span className="text-loam-700"> · {err.column}</span> : null}: {err.message}
                </li>
              ))}
              {preview.errors.length > 200 ? <li className="text-sm text-loam-700">…and {preview.errors.length - 200} more.</li> : null}
            </ul>
          ) : null}

          {pendingCrops.length > 0 ? (
            <div className="card mt-4" data-testid="unknown-crops">
              <h3 className="text-lg font-bold">Crops you do not have yet</h3>
              <p className="text-sm text-loam-700">Create them with the import: choose the kind and the reference food of each, then check again.</p>
              <ul className="mt-3 space-y-4">
                {pendingCrops.map(([k, c], ci) => (
                  <li key={k} className="rounded-xl border border-loam-200 p-3">
                    <label className="flex min-h-12 cursor-pointer items-center gap-3">
                      <input type="checkbox" className="size-6 accent-sprout-700" checked={c.create} onChange={(e) => setNewCrops({ ...newCrops, [k]: { ...c, create: e.target.checked } })} />
                      <span className="font-bold">
                        Create “{c.name}
                        {c.variety ? ` (${c.variety})` : ''}”
                      </span>
                    </label>
                    {c.create ? (
                      <div className="grid gap-3 sm:grid-cols-2">
                        <div className="mt-4">
                          <label htmlFor={`nc-${ci}-cat`} className="block font-semibold">
                            Kind of crop
                          </label>
                          <select id={`nc-${ci}-cat`} className="field mt-1" value={c.category} onChange={(e) => setNewCrops({ ...newCrops, [k]: { ...c, category: e.target.value as CropCategory } })}>
                            {CROP_CATEGORIES.map((cat) => (
                              <option key={cat} value={cat}>
                                {CROP_CATEGORY_LABELS[cat]}
                              </option>
                            ))}
                          </select>
                        </div>
                        <FoodPicker id={`nc-${ci}-food`} label="Reference food" value={c.food} suggestFor={c.name} onChange={(f) => setNewCrops({ ...newCrops, [k]: { ...c, food: f } })} />
                      </div>
                    ) : null}
                  </li>
                ))}
              </ul>
            </div>
          ) : null}

          {preview.rows.length > 0 ? (
            <div role="region" aria-label="Rows of the file" tabIndex={0} className="mt-4 overflow-x-auto focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-focus rounded-2xl border border-loam-200 bg-white">
              <table className="w-full min-w-[36rem] border-collapse text-left text-sm">
                <caption className="sr-only">Rows as they would be stored</caption>
                <thead className="border-b border-loam-200 bg-loam-50">
                  <tr>
                    <th scope="col" className="px-3 py-2">Row</th>
                    <th scope="col" className="px-3 py-2">Date</th>
                    <th scope="col" className="px-3 py-2">{kind === 'harvests' ? 'Crop / food' : 'Food'}</th>
                    <th scope="col" className="px-3 py-2 text-right">Weight</th>
                    <th scope="col" className="px-3 py-2 text-right">Edible</th>
                    <th scope="col" className="px-3 py-2">{kind === 'harvests' ? 'Use' : 'Price'}</th>
                  </tr>
                </thead>
                <tbody>
                  {preview.rows.map((r) => (
                    <tr key={r.row} className={`border-b border-loam-100 ${errorsByRow.has(r.row) ? 'bg-berry-700/10' : ''}`}>
                      <td className="px-3 py-2 tabular-nums">{r.row}</td>
                      <td className="whitespace-nowrap px-3 py-2">{formatDay(r.date)}</td>
                      <td className="px-3 py-2">{r.crop ?? r.foodName ?? r.foodCode}</td>
                      <td className="px-3 py-2 text-right tabular-nums">
                        <span className="whitespace-nowrap">{isCountOrVolume(r.unit) ? countedAmountText({ quantity: r.quantity, unit: r.unit, grams: r.grams }, household.units) : formatQuantity(r.quantity, r.unit)}</span>
                        {r.weightSource ? (
                          <span className="block text-xs text-loam-700" data-testid="preview-weight-source">
                            {r.weightSource}
                          </span>
                        ) : null}
                      </td>
                      <td className="whitespace-nowrap px-3 py-2 text-right tabular-nums">{formatWeightPair(r.grams, r.edibleGrams, household.units, r.unit).edible}</td>
                      <td className="px-3 py-2">{kind === 'harvests' ? r.use : r.price != null ? `${r.price} ${r.currency ?? ''}` : ''}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
              {preview.rowCount > preview.rows.length ? <p className="px-3 py-2 text-sm text-loam-700">Showing the first {preview.rows.length} of {preview.rowCount} rows.</p> : null}
            </div>
          ) : null}

          <div className="mt-5 flex flex-wrap items-center gap-3">
            <button type="button" className="btn-primary min-h-14 text-lg" disabled={!canCommit || send.isPending} onClick={() => send.mutate('commit')}>
              {send.isPending && send.variables === 'commit'
                ? 'Importing…'
                : creating > 0
                  ? `Create ${countText(creating, 'crop')} and import`
                  : preview.ok
                    ? `Import ${countText(preview.rowCount, 'row')}`
                    : 'Import (fix the problems first)'}
            </button>
            {stale ? <span className="text-sm text-loam-700">The import checks every row again; if anything is still wrong, nothing is written.</span> : null}
          </div>
        </section>
      ) : null}
    </div>
  );
}
