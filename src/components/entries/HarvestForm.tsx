/**
 * The harvest entry form (island, client:load), built for one thumb in the garden: recent and
 * in-season crops first, a big weight field, a unit toggle remembered per household, use chips,
 * today's date in the household's zone, a split mode for one weighing shared between uses.
 * Every submission carries an Idempotency-Key and goes through the outbox, so a failed request
 * is kept, shown as waiting and sent again later without ever being stored twice. What was just
 * saved is shown with an Undo.
 */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useEffect, useMemo, useRef, useState, type FormEvent } from 'react';
import { defaultSpreadMonths, defaultUse } from '../../lib/crop-categories';
import { cropUseError, harvestInput, harvestSplitInput, isEatenUse, isSpreadUse, USES, zodErrorBody, type Use } from '../../lib/entry-schemas';
import type { WeightUnit } from '../../lib/units';
import { ApiError, canWrite, get, keys, newIdempotencyKey, request, urls, type Crop, type Harvest, type HarvestPage, type HouseholdInfo } from './api';
import { daysBetween, formatDay, monthRange, shiftYear, todayIn } from './local-date';
import { useOutbox, type OutboxItem } from './outbox';
import { QueryProvider } from './QueryProvider';
import { formatInUnit, formatQuantity, parseDecimal, trimNumber } from './quantity-text';
import { Alert, ErrorText, invalidProps, UnitToggle, UseChips, useRememberedUnit, type Errors } from './ui';

interface Props {
  household: HouseholdInfo;
  /** Today in the household's zone, as the server saw it (the form re-reads it in the browser). */
  today: string;
}

export default function HarvestForm(props: Props) {
  return (
    <QueryProvider>
      <HarvestFormInner {...props} />
    </QueryProvider>
  );
}

/** How many crops get a big button of their own; the rest are in a list below them. */
const CHIP_COUNT = 8;
/** A crop harvested within this many days counts as recent. */
const RECENT_DAYS = 28;

interface SavedEntry {
  key: string;
  label: string;
  edible: string;
  harvests: Harvest[];
  later?: boolean;
}

interface Part {
  id: number;
  quantity: string;
  use: Use;
}

type CreateAnswer = { harvest: Harvest } | { harvests: Harvest[] };
const answerHarvests = (a: CreateAnswer): Harvest[] => ('harvests' in a ? a.harvests : [a.harvest]);

function cropDefaultUse(c: Crop | undefined): Use {
  return c ? defaultUse({ category: c.category, cropDefault: c.defaultUse, notFood: c.notFood }) : 'fresh';
}

/** Crops in the order a grower reaches for them: recently harvested, then in season a year ago, then the rest. */
export function orderCrops(crops: Crop[], today: string, inSeasonIds: ReadonlySet<number>): { crop: Crop; recent: boolean; inSeason: boolean }[] {
  const rows = crops
    .filter((c) => !c.archived)
    .map((crop, i) => {
      const recent = crop.lastHarvestDate != null && daysBetween(crop.lastHarvestDate, today) <= RECENT_DAYS;
      return { crop, recent, inSeason: inSeasonIds.has(crop.id), i };
    });
  const rank = (r: (typeof rows)[number]) => (r.recent ? 0 : r.inSeason ? 1 : 2);
  rows.sort((a, b) => rank(a) - rank(b) || (a.recent && b.recent ? (b.crop.lastHarvestDate ?? '').localeCompare(a.crop.lastHarvestDate ?? '') : 0) || a.i - b.i);
  return rows.map(({ crop, recent, inSeason }) => ({ crop, recent, inSeason }));
}

/** "harvested today", "harvested yesterday" or "last Wed, 2 Dec" for the crop buttons. */
function lastHarvestText(date: string, today: string): string {
  const days = daysBetween(date, today);
  if (days === 0) return 'harvested today';
  if (days === 1) return 'harvested yesterday';
  return `last ${formatDay(date).replace(/ \d{4}$/, '')}`;
}

function HarvestFormInner({ household, today: serverToday }: Props) {
  const hid = household.id;
  const api = urls(hid);
  const qc = useQueryClient();
  const formRef = useRef<HTMLFormElement>(null);
  const [today] = useState(() => (typeof window === 'undefined' ? serverToday : todayIn(household.timezone)));

  const crops = useQuery({ queryKey: keys.crops(hid), queryFn: () => get<{ crops: Crop[] }>(api.crops()).then((r) => r.crops) });
  // In season: harvested in this calendar month a year ago.
  const lastYear = monthRange(shiftYear(today, -1));
  const season = useQuery({
    queryKey: [...keys.harvests(hid), 'season', lastYear?.from],
    queryFn: () => get<HarvestPage>(api.harvests({ from: lastYear!.from, to: lastYear!.to, pageSize: 200 })),
    enabled: lastYear !== null,
    staleTime: 60 * 60_000,
  });
  const inSeasonIds = useMemo(() => new Set((season.data?.harvests ?? []).map((h) => h.cropId).filter((id): id is number => id != null)), [season.data]);
  const ordered = useMemo(() => orderCrops(crops.data ?? [], today, inSeasonIds), [crops.data, today, inSeasonIds]);

  const [cropId, setCropId] = useState<number | null>(null);
  const crop = ordered.find((o) => o.crop.id === cropId)?.crop;
  const [quantity, setQuantity] = useState('');
  const [unit, setUnit] = useRememberedUnit(hid, household.units);
  const [use, setUse] = useState<Use>('fresh');
  const [spread, setSpread] = useState('');
  const [date, setDate] = useState(today);
  const [trimmed, setTrimmed] = useState(false);
  const [note, setNote] = useState('');
  const [splitting, setSplitting] = useState(false);
  const [parts, setParts] = useState<Part[]>([]);
  const [errors, setErrors] = useState<Errors>({});
  const [alert, setAlert] = useState<string | null>(null);
  const [saved, setSaved] = useState<SavedEntry[]>([]);
  const [busy, setBusy] = useState(false);
  const nextPartId = useRef(1);

  const onSent = (item: OutboxItem, data: CreateAnswer) => {
    const hs = answerHarvests(data);
    setSaved((s) => [{ key: item.key, label: item.label, edible: edibleText(hs), harvests: hs, later: true }, ...s].slice(0, 5));
    void qc.invalidateQueries({ queryKey: keys.harvests(hid) });
    void qc.invalidateQueries({ queryKey: keys.allCrops(hid) });
  };
  const outbox = useOutbox<CreateAnswer>('harvests', hid, onSent);

  const undo = useMutation({
    mutationFn: async (entry: SavedEntry) => {
      for (const h of entry.harvests) {
        try {
          await request<null>('DELETE', api.harvest(h.id));
        } catch (e) {
          // Already gone (undone in another tab): that is what Undo wanted.
          if (!(e instanceof ApiError && e.status === 404)) throw e;
        }
      }
      return entry;
    },
    onSuccess: (entry) => {
      setSaved((s) => s.filter((x) => x.key !== entry.key));
      setAlert(null);
      void qc.invalidateQueries({ queryKey: keys.harvests(hid) });
      void qc.invalidateQueries({ queryKey: keys.allCrops(hid) });
    },
    onError: (e) => setAlert(`Could not undo: ${(e as Error).message}`),
  });

  if (!canWrite(household.role)) {
    return <p className="card">Your role in this household is viewer: you can read the harvest log but not add to it.</p>;
  }

  function pickCrop(id: number) {
    setCropId(id);
    const c = ordered.find((o) => o.crop.id === id)?.crop;
    setUse(cropDefaultUse(c));
    setSpread('');
    setErrors((e) => ({ ...e, cropId: '' }));
  }

  const notFoodUses: readonly Use[] = crop?.notFood ? USES.filter((u) => isEatenUse(u)) : [];
  const defaultSpreadFor = (u: Use) => (crop ? defaultSpreadMonths({ use: u, category: crop.category, cropDefault: crop.defaultSpreadMonths }) : 1);
  const total = parseDecimal(quantity);
  const othersSum = parts.slice(0, -1).reduce((a, p) => a + (parseDecimal(p.quantity) ?? 0), 0);
  const rest = total !== undefined && Number.isFinite(total) ? Math.round((total - othersSum) * 1e6) / 1e6 : undefined;
  const spreadUses = splitting ? parts.map((p) => p.use).filter(isSpreadUse) : isSpreadUse(use) ? [use] : [];
  const spreadValue = spread.trim() === '' ? undefined : Number(spread);

  function startSplit() {
    const second: Use = use === 'fresh' ? 'stored' : 'fresh';
    setParts([
      { id: nextPartId.current++, quantity: '', use },
      { id: nextPartId.current++, quantity: '', use: crop?.notFood ? 'given' : second },
    ]);
    setSplitting(true);
  }

  function label(): string {
    const name = crop?.displayName ?? 'harvest';
    if (!splitting) return `${formatQuantity(total ?? 0, unit)} ${name} — ${use}`;
    const bits = parts.map((p, i) => `${trimNumber(i === parts.length - 1 ? rest ?? 0 : parseDecimal(p.quantity) ?? 0)} ${unit} ${p.use}`);
    return `${formatQuantity(total ?? 0, unit)} ${name} — ${bits.join(', ')}`;
  }

  function edibleText(hs: Harvest[]): string {
    const u = hs[0]?.unit ?? unit;
    return formatInUnit(
      hs.reduce((a, h) => a + h.edibleGrams, 0),
      u as WeightUnit,
    );
  }

  function validate(): { body: unknown; errors: Errors } {
    const errs: Errors = {};
    if (cropId === null) errs.cropId = 'Choose the crop you harvested.';
    const noteOrUndef = note.trim() === '' ? undefined : note;
    if (!splitting) {
      const raw = { date, cropId: cropId ?? undefined, quantity: total, unit, use, spreadMonths: isSpreadUse(use) ? spreadValue : undefined, trimmed, note: noteOrUndef };
      const r = harvestInput.safeParse(raw);
      if (!r.success) Object.assign(errs, zodErrorBody(r.error).fields, errs);
      const useErr = crop ? cropUseError(use, { name: crop.displayName, notFood: crop.notFood }) : undefined;
      if (useErr) errs.use = useErr;
      return { body: r.success ? r.data : raw, errors: errs };
    }
    if (total === undefined) errs.quantity = 'Enter the weight of the whole weighing.';
    else if (!(total > 0)) errs.quantity = 'The weight must be a number more than 0.';
    const partsRaw = parts.map((p, i) => ({
      quantity: i === parts.length - 1 ? rest : parseDecimal(p.quantity),
      use: p.use,
      spreadMonths: isSpreadUse(p.use) ? spreadValue : undefined,
    }));
    if (!errs.quantity && rest !== undefined && !(rest > 0)) {
      errs[`parts.${parts.length - 1}.quantity`] = `The other parts add up to ${trimNumber(othersSum)} ${unit}, which leaves nothing for the last part. Check the weights.`;
    }
    const raw = { date, cropId: cropId ?? undefined, unit, trimmed, note: noteOrUndef, parts: partsRaw };
    const r = harvestSplitInput.safeParse(raw);
    if (!r.success) {
      for (const [k, v] of Object.entries(zodErrorBody(r.error).fields)) errs[k] ??= v;
    }
    parts.forEach((p, i) => {
      const useErr = crop ? cropUseError(p.use, { name: crop.displayName, notFood: crop.notFood }) : undefined;
      if (useErr) errs[`parts.${i}.use`] = useErr;
    });
    return { body: r.success ? r.data : raw, errors: errs };
  }

  function focusFirst(errs: Errors) {
    const first = Object.keys(errs).find((k) => errs[k]);
    if (!first || !formRef.current) return;
    const el = formRef.current.querySelector<HTMLElement>(`[data-field="${CSS.escape(first)}"]`) ?? formRef.current.querySelector<HTMLElement>(`[name="${CSS.escape(first)}"]`);
    el?.focus();
  }

  function resetAfterSave() {
    setQuantity('');
    setNote('');
    setSplitting(false);
    setParts([]);
    setSpread('');
    setUse(cropDefaultUse(crop));
  }

  async function submit(e: FormEvent) {
    e.preventDefault();
    setAlert(null);
    const v = validate();
    const errs = Object.fromEntries(Object.entries(v.errors).filter(([, m]) => m));
    setErrors(errs);
    if (Object.keys(errs).length > 0) {
      focusFirst(errs);
      return;
    }
    const key = newIdempotencyKey();
    const text = label();
    setBusy(true);
    try {
      const r = await outbox.submit(api.harvests(), v.body, text, key);
      if (r.status === 'saved') {
        const hs = answerHarvests(r.data);
        setSaved((s) => [{ key, label: text, edible: edibleText(hs), harvests: hs }, ...s].slice(0, 5));
        void qc.invalidateQueries({ queryKey: keys.harvests(hid) });
        void qc.invalidateQueries({ queryKey: keys.allCrops(hid) });
      }
      resetAfterSave();
    } catch (err) {
      if (err instanceof ApiError) {
        setErrors(err.fields);
        focusFirst(err.fields);
        setAlert(err.message);
      } else setAlert(String(err));
    } finally {
      setBusy(false);
    }
  }

  if (crops.isPending) return <p className="card text-lg">Loading your crops…</p>;
  if (crops.isError) return <Alert message={`Could not load your crops: ${(crops.error as Error).message}`} />;
  if (ordered.length === 0) {
    return (
      <div className="card text-lg">
        <p>This household has no crops yet. Add what you grow first — then logging a harvest is two taps and a number.</p>
        <a href={`/households/${hid}/crops`} className="btn-primary mt-4">
          Add your crops
        </a>
      </div>
    );
  }

  const chips = ordered.slice(0, CHIP_COUNT);
  const chosenOutside = crop && !chips.some((c) => c.crop.id === crop.id) ? ordered.find((o) => o.crop.id === crop.id) : undefined;
  const shown = chosenOutside ? [...chips, chosenOutside] : chips;
  const more = ordered.slice(CHIP_COUNT);
  const qtyErr = errors.quantity;
  const restErr = splitting ? errors[`parts.${parts.length - 1}.quantity`] : undefined;

  return (
    <div>
      <form ref={formRef} onSubmit={submit} noValidate className="card" aria-label="Log a harvest">
        <fieldset aria-describedby={errors.cropId ? 'cropId-error' : undefined}>
          <legend className="text-lg font-bold">What did you harvest?</legend>
          <div className="mt-2 grid grid-cols-2 gap-2 sm:grid-cols-4" data-field="cropId" tabIndex={-1}>
            {shown.map(({ crop: c, recent, inSeason }) => {
              const on = c.id === cropId;
              return (
                <label
                  key={c.id}
                  className={`flex min-h-16 cursor-pointer flex-col justify-center rounded-xl border px-3 py-2 leading-tight has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-rind-500 ${
                    on ? 'border-sprout-700 bg-sprout-100 ring-2 ring-sprout-700' : 'border-loam-200 bg-white hover:bg-loam-100'
                  }`}
                >
                  <input type="radio" className="sr-only" name="cropId" value={c.id} checked={on} onChange={() => pickCrop(c.id)} />
                  <span className="font-bold">{c.name}</span>
                  {c.variety ? <span className="text-sm">{c.variety}</span> : null}
                  <span className="text-xs text-loam-700">
                    {recent && c.lastHarvestDate ? lastHarvestText(c.lastHarvestDate, today) : inSeason ? 'in season' : c.notFood ? 'not food' : '\u00a0'}
                  </span>
                </label>
              );
            })}
          </div>
          {more.length > 0 ? (
            <div className="mt-3">
              <label htmlFor="crop-more" className="text-sm font-semibold text-loam-700">
                Another crop
              </label>
              <select id="crop-more" className="field mt-1" value={chosenOutside ? String(cropId) : ''} onChange={(e) => e.target.value && pickCrop(Number(e.target.value))}>
                <option value="">Choose from all {ordered.length} crops…</option>
                {ordered.map(({ crop: c }) => (
                  <option key={c.id} value={c.id}>
                    {c.displayName}
                  </option>
                ))}
              </select>
            </div>
          ) : null}
          <ErrorText id="cropId" error={errors.cropId} />
        </fieldset>

        <div className="mt-5">
          <label htmlFor="quantity" className="block text-lg font-bold">
            {splitting ? 'Whole weighing' : 'Weight'}
          </label>
          <div className="mt-1 flex flex-wrap items-stretch gap-2">
            <input
              {...invalidProps('quantity', qtyErr)}
              name="quantity"
              type="text"
              inputMode="decimal"
              autoComplete="off"
              enterKeyHint="done"
              placeholder="0"
              className={`field min-h-16 w-40 flex-1 text-right text-4xl font-extrabold tabular-nums placeholder:font-normal placeholder:text-loam-200 ${qtyErr ? 'border-berry-700 ring-1 ring-berry-700' : ''}`}
              value={quantity}
              onChange={(e) => setQuantity(e.target.value)}
            />
            <div className="w-full sm:w-64">
              <UnitToggle name="unit" value={unit} onChange={setUnit} label="Weight unit" />
            </div>
          </div>
          <ErrorText id="quantity" error={qtyErr} />
        </div>

        {!splitting ? (
          <UseChips name="use" value={use} onChange={setUse} disabled={notFoodUses} error={errors.use} />
        ) : (
          <SplitParts
            parts={parts}
            unit={unit}
            rest={rest}
            restError={restErr}
            errors={errors}
            disabledUses={notFoodUses}
            onChange={setParts}
            onAdd={() => {
              const last = parts[parts.length - 1];
              const fresh: Part = { id: nextPartId.current++, quantity: '', use: crop?.notFood ? 'given' : 'preserved' };
              // A new part goes before the last one, which always takes the rest.
              setParts(last ? [...parts.slice(0, -1), fresh, last] : [fresh]);
            }}
          />
        )}

        {spreadUses.length > 0 ? (
          <div className="mt-4">
            <label htmlFor="spreadMonths" className="block font-semibold">
              Eaten over how many months?
            </label>
            <p id="spreadMonths-hint" className="text-sm text-loam-700">
              {crop
                ? `Leave empty for this crop's usual: ${[...new Set(spreadUses)].map((u) => `${defaultSpreadFor(u)} months ${u}`).join(', ')}.`
                : 'Stored and preserved food is counted in the months it is eaten.'}
            </p>
            <input
              {...invalidProps('spreadMonths', errors.spreadMonths, true)}
              name="spreadMonths"
              type="text"
              inputMode="numeric"
              className="field mt-1 w-32 text-xl"
              placeholder={crop ? String(defaultSpreadFor(spreadUses[0]!)) : ''}
              value={spread}
              onChange={(e) => setSpread(e.target.value.replace(/[^\d]/g, ''))}
            />
            <ErrorText id="spreadMonths" error={errors.spreadMonths} />
          </div>
        ) : null}

        <UseCautions uses={splitting ? parts.map((p) => p.use) : [use]} />

        <div className="mt-4">
          {!splitting ? (
            <button type="button" className="btn-quiet w-full sm:w-auto" onClick={startSplit}>
              Split this weighing between uses
            </button>
          ) : (
            <button type="button" className="btn-quiet w-full sm:w-auto" onClick={() => setSplitting(false)}>
              One use for the whole weighing
            </button>
          )}
        </div>

        <div className="mt-5 grid gap-4 sm:grid-cols-2">
          <div>
            <label htmlFor="date" className="block font-semibold">
              Date {date === today ? <span className="font-normal text-loam-700">(today)</span> : null}
            </label>
            <input {...invalidProps('date', errors.date)} name="date" type="date" className="field mt-1" value={date} max="2199-12-31" onChange={(e) => setDate(e.target.value)} />
            <ErrorText id="date" error={errors.date} />
          </div>
          <label className="flex min-h-12 cursor-pointer items-center gap-3 self-end rounded-xl border border-loam-200 bg-loam-50 px-4 py-2">
            <input type="checkbox" name="trimmed" className="size-6 accent-sprout-700" checked={trimmed} onChange={(e) => setTrimmed(e.target.checked)} />
            <span>
              <span className="font-semibold">Weighed already trimmed</span>
              <span className="block text-sm text-loam-700">peeled, topped or shelled: nothing more is taken off</span>
            </span>
          </label>
        </div>

        <div className="mt-4">
          <label htmlFor="note" className="block font-semibold">
            Note <span className="font-normal text-loam-700">(optional)</span>
          </label>
          <input {...invalidProps('note', errors.note)} name="note" type="text" className="field mt-1" maxLength={500} value={note} onChange={(e) => setNote(e.target.value)} placeholder="e.g. bed 3, first picking" />
          <ErrorText id="note" error={errors.note} />
        </div>

        <button type="submit" className="btn-primary mt-6 min-h-16 w-full text-xl" disabled={busy}>
          {busy ? 'Saving…' : 'Save harvest'}
        </button>
        <Alert message={alert} />
      </form>

      <SavedList saved={saved} onUndo={(s) => undo.mutate(s)} undoing={undo.isPending ? undo.variables?.key : undefined} />
      <WaitingList items={outbox.items} onRetry={() => void outbox.flush()} onDiscard={outbox.discard} />
    </div>
  );
}

function SplitParts({
  parts,
  unit,
  rest,
  restError,
  errors,
  disabledUses,
  onChange,
  onAdd,
}: {
  parts: Part[];
  unit: WeightUnit;
  rest: number | undefined;
  restError: string | undefined;
  errors: Errors;
  disabledUses: readonly Use[];
  onChange: (p: Part[]) => void;
  onAdd: () => void;
}) {
  const set = (i: number, patch: Partial<Part>) => onChange(parts.map((p, j) => (j === i ? { ...p, ...patch } : p)));
  return (
    <fieldset className="mt-5 rounded-2xl border border-loam-200 bg-loam-50 p-3">
      <legend className="px-1 text-lg font-bold">Split between uses</legend>
      <p className="text-sm text-loam-700">Enter the parts; the last part takes the rest of the weighing. They are saved together.</p>
      <ol className="mt-2 space-y-3">
        {parts.map((p, i) => {
          const last = i === parts.length - 1;
          const qid = `parts.${i}.quantity`;
          const qErr = last ? restError : errors[qid];
          return (
            <li key={p.id} className="rounded-xl border border-loam-200 bg-white p-3">
              <div className="flex flex-wrap items-end gap-2">
                <div className="w-36">
                  <label htmlFor={`part-${p.id}-qty`} className="block text-sm font-semibold">
                    Part {i + 1}
                    {last ? ' (the rest)' : ''}
                  </label>
                  {last ? (
                    <output id={`part-${p.id}-qty`} data-field={qid} tabIndex={-1} aria-describedby={qErr ? `part-${p.id}-qty-error` : undefined} className="field mt-1 flex items-center justify-end bg-loam-100 text-2xl font-extrabold tabular-nums">
                      {rest === undefined ? '—' : trimNumber(rest, 3)}
                    </output>
                  ) : (
                    <input
                      {...invalidProps(`part-${p.id}-qty`, qErr)}
                      data-field={qid}
                      type="text"
                      inputMode="decimal"
                      autoComplete="off"
                      className="field mt-1 text-right text-2xl font-extrabold tabular-nums"
                      value={p.quantity}
                      onChange={(e) => set(i, { quantity: e.target.value })}
                    />
                  )}
                </div>
                <span className="pb-3 text-lg font-bold">{unit}</span>
                {parts.length > 2 && !last ? (
                  <button type="button" className="btn-quiet ml-auto min-h-12 px-3" onClick={() => onChange(parts.filter((_, j) => j !== i))} aria-label={`Remove part ${i + 1}`}>
                    Remove
                  </button>
                ) : null}
              </div>
              <ErrorText id={`part-${p.id}-qty`} error={qErr} />
              <UseChips name={`parts.${i}.use`} legend={`Part ${i + 1} is`} value={p.use} onChange={(u) => set(i, { use: u })} disabled={disabledUses} error={errors[`parts.${i}.use`]} />
            </li>
          );
        })}
      </ol>
      {parts.length < 7 ? (
        <button type="button" className="btn-quiet mt-3" onClick={onAdd}>
          Add a part
        </button>
      ) : null}
      <ErrorText id="parts" error={errors.parts} />
    </fieldset>
  );
}

function SavedList({ saved, onUndo, undoing }: { saved: SavedEntry[]; onUndo: (s: SavedEntry) => void; undoing: string | undefined }) {
  const ref = useRef<HTMLElement>(null);
  const newest = saved[0]?.key;
  // On a phone the confirmation lands below the fold: bring it up so the thumb sees it (and Undo).
  useEffect(() => {
    if (newest) ref.current?.scrollIntoView({ block: 'nearest', behavior: 'smooth' });
  }, [newest]);
  return (
    <section ref={ref} aria-label="Just saved" aria-live="polite" className="mt-4 scroll-mb-4" data-testid="just-saved">
      {saved.map((s, i) => (
        <div key={s.key} className={`flex flex-wrap items-center gap-3 rounded-2xl border p-4 ${i === 0 ? 'border-sprout-300 bg-sprout-100' : 'mt-2 border-loam-200 bg-white'}`}>
          <div className="min-w-0 flex-1">
            <p className="text-sm font-semibold text-sprout-900">{s.later ? 'Sent and saved' : 'Saved'}</p>
            <p className="text-lg font-bold" data-testid="saved-label">
              {s.label}
            </p>
            <p className="text-sm text-loam-700">edible portion {s.edible}</p>
          </div>
          <button type="button" className="btn-quiet min-h-12" onClick={() => onUndo(s)} disabled={undoing === s.key}>
            {undoing === s.key ? 'Undoing…' : 'Undo'}
          </button>
        </div>
      ))}
    </section>
  );
}

function WaitingList({ items, onRetry, onDiscard }: { items: OutboxItem[]; onRetry: () => void; onDiscard: (key: string) => void }) {
  if (items.length === 0) return null;
  const waiting = items.filter((i) => !i.refused);
  const refused = items.filter((i) => i.refused);
  return (
    <section aria-label="Waiting to send" className="mt-4 rounded-2xl border-l-4 border-rind-500 bg-rind-100 p-4" data-testid="waiting">
      {waiting.length > 0 ? (
        <>
          <h2 className="font-bold" role="status">
            {waiting.length === 1 ? '1 entry is waiting to send' : `${waiting.length} entries are waiting to send`}
          </h2>
          <p className="text-sm">Kept on this device; it is sent as soon as Selfsown can be reached, and never counted twice.</p>
          <ul className="mt-2 space-y-1">
            {waiting.map((i) => (
              <li key={i.key} className="font-semibold">
                {i.label} <span className="text-sm font-normal text-loam-700">· waiting to send</span>
              </li>
            ))}
          </ul>
          <button type="button" className="btn-quiet mt-3" onClick={onRetry}>
            Send now
          </button>
        </>
      ) : null}
      {refused.map((i) => (
        <div key={i.key} className="mt-3" role="alert">
          <p className="font-semibold text-berry-700">
            Not saved: {i.label} — {i.lastError}
          </p>
          <button type="button" className="btn-quiet mt-2" onClick={() => onDiscard(i.key)}>
            Discard it
          </button>
        </div>
      ))}
    </section>
  );
}

/** The usual cautions for what a grower is about to do with a harvest (preserving, selling). */
function UseCautions({ uses }: { uses: readonly Use[] }) {
  const preserved = uses.includes('preserved');
  const sold = uses.includes('sold');
  if (!preserved && !sold) return null;
  return (
    <div className="caution mt-4 space-y-1" data-testid="use-caution">
      {preserved && (
        <p>
          Preserving: follow tested, published guidance for your method. Home canning of low-acid food (beans, corn,
          potatoes, squash, most vegetables, meat) needs a pressure canner; a water bath is not enough.
        </p>
      )}
      {sold && <p>Selling produce, eggs or honey may need a licence or labelling where you live: check your local rules.</p>}
    </div>
  );
}
