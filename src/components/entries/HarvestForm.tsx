/**
 * The harvest entry form (island, client:load), built for one thumb in the garden: pinned and
 * most used crops first, in an order that holds still, a big weight field, a unit toggle remembered per household, use chips,
 * today's date in the household's zone, a split mode for one weighing shared between uses, the
 * preserving method of preserved food. The form is react-hook-form, checked by the endpoint's own
 * zod schemas (harvest-form-values.ts); a date after today is refused, and a weight that looks like
 * a slip of the unit (src/lib/harvest-warnings.ts) is questioned before it is saved.
 * Every submission carries an Idempotency-Key and goes through the entry queue (outbox.ts): offline
 * or failed, it is kept on the device, shown as waiting and sent later, never stored twice. What was just
 * saved is shown with an Undo.
 */
import { useQuery } from '@tanstack/react-query';
import { useMemo, useRef, useState, type FormEvent } from 'react';
import { Controller, useForm } from 'react-hook-form';
import { defaultSpreadMonths } from '@/lib/crop-categories';
import { isEatenUse, USES, type Use } from '@/lib/entry-schemas';
import type { PlantingJson } from '@/lib/bed-types';
import { formatAmount } from '@/lib/format-number';
import { harvestWarnings } from '@/lib/harvest-warnings';
import { isWeightUnit, toGrams } from '@/lib/units';
import { ApiError, canWrite, get, keys, newIdempotencyKey, urls, type Crop, type HarvestPage, type HouseholdInfo } from './api';
import { cropDefaultUse, useChipOrder } from './crop-order';
import { ConfirmWarning } from './ConfirmWarning';
import { CropChips } from './CropChips';
import { flatErrors } from './form-errors';
import { emptyHarvestValues, harvestLabel, harvestResolver, restOf, spreadUsesOf, weighingQuantity, type HarvestBody, type HarvestFormContext, type HarvestFormValues, type PartValues } from './harvest-form-values';
import { SavedList, WaitingList } from './HarvestSaved';
import { todayIn } from '@/lib/months';
import { monthRange, shiftYear } from './local-date';
import { useOutbox } from './outbox';
import { queueScopeOf } from './entry-queue';
import { PreserveField } from './PreserveField';
import { QueryProvider } from '@/components/QueryProvider';
import { SplitParts } from './SplitParts';
import { SpreadField } from './SpreadField';
import { Alert, ErrorText, invalidProps, UseChips, useRememberedUnit, type Errors } from './ui';
import { CheckCard, NoteField } from './entry-form-fields';
import { UseCautions } from './UseCautions';
import { useSavedHarvests, type CreateAnswer } from './use-saved-harvests';
import { WeightField } from './WeightField';
import { cropWeighBasis } from './unit-basis';
import { parseDecimal } from './quantity-text';

interface Props {
  household: HouseholdInfo;
  /** Today in the household's zone, as the server saw it (the form re-reads it in the browser). */
  today: string;
}

export default function HarvestForm(props: Props) {
  return (
    <QueryProvider queue={queueScopeOf(props.household)}>
      <HarvestFormInner {...props} />
    </QueryProvider>
  );
}

function HarvestFormInner({ household, today: serverToday }: Props) {
  const hid = household.id;
  const api = urls(hid);
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
  // Plantings of this season and the last (a winter harvest comes from last year's planting).
  const year = Number(today.slice(0, 4));
  const plantings = useQuery({
    queryKey: [...keys.harvests(hid), 'plantings', year],
    queryFn: () =>
      Promise.all([year, year - 1].map((y) => get<{ plantings: PlantingJson[] }>(`/api/households/${hid}/plantings?year=${y}`).then((r) => r.plantings))).then((a) => a.flat()),
    staleTime: 5 * 60_000,
  });
  const inSeasonIds = useMemo(() => new Set((season.data?.harvests ?? []).map((h) => h.cropId).filter((id): id is number => id != null)), [season.data]);
  // Pinned, then most used; fixed when the crops first load, so no chip moves after a save.
  const { ordered, rearrange } = useChipOrder(crops.data, today, inSeasonIds);

  const [unit, setUnit, weightUnit] = useRememberedUnit(hid, household.units);
  const [alert, setAlert] = useState<string | null>(null);
  // A weight questioned (over 100 kg, a few grams of a storage crop) waits here until confirmed.
  const [question, setQuestion] = useState<{ messages: string[] } | null>(null);
  const nextPartId = useRef(1);

  const form = useForm<HarvestFormValues, HarvestFormContext, HarvestBody>({
    defaultValues: emptyHarvestValues(today),
    resolver: harvestResolver,
    // Errors show after Save and stay until the next Save, as the person fixes them.
    mode: 'onSubmit',
    reValidateMode: 'onSubmit',
    shouldFocusError: false,
    // What the resolver needs besides the typed values: the remembered unit and the crops.
    context: { unit, crops: crops.data ?? [], today },
  });
  const { control, register, watch, setValue, getValues, reset, setError, clearErrors, handleSubmit } = form;
  const values = watch();
  const crop = ordered.find((o) => o.crop.id === values.cropId)?.crop;
  const cropPlantings = (plantings.data ?? []).filter((p) => p.cropId === values.cropId);
  const errors: Errors = flatErrors(form.formState.errors);
  const busy = form.formState.isSubmitting;

  const { saved, add, undo, undoing } = useSavedHarvests(hid, weightUnit, setAlert);
  const outbox = useOutbox<CreateAnswer>('harvests', hid, (item, data) => add(item.key, item.label, data, true));

  if (!canWrite(household.role)) {
    return <p className="card">Your role in this household is viewer: you can read the harvest log but not add to it.</p>;
  }

  function pickCrop(id: number) {
    setValue('cropId', id);
    setValue('use', cropDefaultUse(ordered.find((o) => o.crop.id === id)?.crop));
    setValue('spreadMonths', '');
    setValue('plantingId', '');
    clearErrors('cropId');
  }

  const notFoodUses: readonly Use[] = crop?.notFood ? USES.filter((u) => isEatenUse(u)) : [];
  const defaultSpreadFor = (u: Use) => (crop ? defaultSpreadMonths({ use: u, category: crop.category, cropDefault: crop.defaultSpreadMonths }) : 1);
  const spreadUses = spreadUsesOf(values);
  const newPart = (use: Use): PartValues => ({ pid: nextPartId.current++, quantity: '', use });

  function startSplit() {
    const use = getValues('use');
    const second: Use = use === 'fresh' ? 'stored' : 'fresh';
    setValue('parts', [newPart(use), newPart(crop?.notFood ? 'given' : second)]);
    setValue('splitting', true);
  }

  function focusFirst(errs: Errors) {
    const first = Object.keys(errs).find((k) => errs[k]);
    if (!first || !formRef.current) return;
    const el = formRef.current.querySelector<HTMLElement>(`[data-field="${CSS.escape(first)}"]`) ?? formRef.current.querySelector<HTMLElement>(`[name="${CSS.escape(first)}"]`);
    el?.focus();
  }

  // Questions an odd weight first; the warning's button saves what the form then holds, unquestioned.
  async function check(body: HarvestBody) {
    // The unit-slip questions are about weights; a count or volume is weighed by its named weight.
    const messages = isWeightUnit(unit) ? harvestWarnings({ grams: toGrams(weighingQuantity(body), unit), unit, category: crop?.category, cropName: crop?.displayName }).map((w) => w.message) : [];
    if (messages.length > 0) {
      setQuestion({ messages });
      return;
    }
    await save(body);
  }

  async function save(body: HarvestBody) {
    setQuestion(null);
    const key = newIdempotencyKey();
    const text = harvestLabel(getValues(), unit, crop?.displayName);
    try {
      const r = await outbox.submit(api.harvests(), body, text, key);
      if (r.status === 'saved') add(key, text, r.data);
      // The next weighing keeps the crop, the date and the trimmed flag.
      reset({ ...getValues(), quantity: '', note: '', splitting: false, parts: [], spreadMonths: '', preserveMethod: '', use: cropDefaultUse(crop) });
    } catch (err) {
      if (err instanceof ApiError) {
        for (const [field, message] of Object.entries(err.fields)) setError(field as keyof HarvestFormValues, { type: 'server', message });
        focusFirst(err.fields);
        setAlert(err.message);
      } else setAlert(String(err));
    }
  }

  function submit(e: FormEvent) {
    setAlert(null);
    setQuestion(null);
    void handleSubmit(check, (errs) => focusFirst(flatErrors(errs)))(e);
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

  const splitting = values.splitting;

  return (
    <div>
      <form ref={formRef} onSubmit={submit} noValidate className="card" aria-label="Log a harvest">
        <CropChips ordered={ordered} value={values.cropId} today={today} error={errors.cropId} onPick={pickCrop} householdId={hid} onArranged={rearrange} />

        <WeightField
          id="quantity"
          label={splitting ? 'Whole weighing' : 'Weight'}
          input={register('quantity')}
          error={errors.quantity}
          unitName="unit"
          unit={unit}
          onUnit={setUnit}
          enterKeyHint="done"
          weigh={{ basis: cropWeighBasis(crop), quantity: parseDecimal(values.quantity), units: household.units }}
        />

        {!splitting ? (
          <Controller control={control} name="use" render={({ field }) => <UseChips name="use" value={field.value} onChange={field.onChange} disabled={notFoodUses} error={errors.use} />} />
        ) : (
          <SplitParts control={control} unit={unit} rest={restOf(values)} errors={errors} disabledUses={notFoodUses} newPart={() => newPart(crop?.notFood ? 'given' : 'preserved')} />
        )}

        {spreadUses.length > 0 ? (
          <Controller
            control={control}
            name="spreadMonths"
            render={({ field }) => <SpreadField value={field.value} onChange={field.onChange} uses={spreadUses} usual={crop ? defaultSpreadFor : undefined} error={errors.spreadMonths} />}
          />
        ) : null}

        {!splitting && cropPlantings.length > 0 ? (
          <div className="mt-4">
            <label htmlFor="harvest-planting" className="block font-semibold">
              From planting <span className="font-normal text-loam-700">(optional: counts toward your own yield per m²)</span>
            </label>
            <select id="harvest-planting" className="field mt-1" {...register('plantingId')}>
              <option value="">Not said</option>
              {cropPlantings.map((p) => (
                <option key={p.id} value={String(p.id)}>
                  {p.seasonYear} · {p.bedName ?? 'no bed yet'} · {p.slot} · {formatAmount(p.area)} {p.areaUnit === 'ft2' ? 'ft²' : 'm²'}
                </option>
              ))}
            </select>
          </div>
        ) : null}

        {spreadUses.includes('preserved') ? (
          <Controller control={control} name="preserveMethod" render={({ field }) => <PreserveField value={field.value} onChange={field.onChange} error={errors.preserveMethod} />} />
        ) : null}

        <UseCautions uses={splitting ? values.parts.map((p) => p.use) : [values.use]} />

        <div className="mt-4">
          {!splitting ? (
            <button type="button" className="btn-quiet w-full sm:w-auto" onClick={startSplit}>
              Split this weighing between uses
            </button>
          ) : (
            <button type="button" className="btn-quiet w-full sm:w-auto" onClick={() => setValue('splitting', false)}>
              One use for the whole weighing
            </button>
          )}
        </div>

        <div className="mt-5 grid gap-4 sm:grid-cols-2">
          <div>
            <label htmlFor="date" className="block font-semibold">
              Date {values.date === today ? <span className="font-normal text-loam-700">(today)</span> : null}
            </label>
            <input {...invalidProps('date', errors.date)} {...register('date')} type="date" className="field mt-1" max={today} />
            <ErrorText id="date" error={errors.date} />
          </div>
          <CheckCard registration={register('trimmed')} title="Weighed already trimmed" hint="peeled, topped or shelled: nothing more is taken off" />
        </div>

        <NoteField id="note" registration={register('note')} error={errors.note} placeholder="e.g. bed 3, first picking" />

        {question ? (
          <ConfirmWarning testId="weight-warning" messages={question.messages} confirmLabel="The weight is right: save it" busy={busy} onConfirm={() => void handleSubmit(save, (errs) => focusFirst(flatErrors(errs)))()} />
        ) : null}

        <button type="submit" className="btn-primary mt-6 min-h-16 w-full text-xl" disabled={busy}>
          {busy ? 'Saving…' : 'Save harvest'}
        </button>
        <Alert message={alert} />
      </form>

      <SavedList saved={saved} onUndo={undo} undoing={undoing} />
      <WaitingList items={outbox.items} onRetry={() => void outbox.flush()} onDiscard={outbox.discard} />
    </div>
  );
}
