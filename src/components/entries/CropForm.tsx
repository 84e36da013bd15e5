/**
 * Adding or changing one crop: its name and variety, its kind, the reference food it is matched to
 * (with that food's refuse and figures, so the match can be judged), the share eaten, its usual use
 * and how long stored food lasts, the weight of one piece, bunch or head (for counts), or "not
 * food". The form is react-hook-form, checked by the
 * endpoint's own zod schemas (crop-form-values.ts).
 */
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useRef, useState, type FormEvent } from 'react';
import { Controller, useForm } from 'react-hook-form';
import { CROP_CATEGORIES, CROP_CATEGORY_LABELS, defaultSpreadMonths, defaultUse } from '@/lib/crop-categories';
import { isEatenUse, USE_LABELS, USES } from '@/lib/entry-schemas';
import { type CropInput, type CropPatch } from '@/lib/crop-schemas';
import { ApiError, keys, request, urls, type Crop, type HouseholdInfo } from './api';
import { countWeightUnit, cropFormValues, cropResolver, type CropFormContext, type CropFormValues } from './crop-form-values';
import { FoodPicker } from './FoodPicker';
import { flatErrors } from './form-errors';
import { Alert, ErrorText, FieldShell, invalidProps, pct, type Errors } from './ui';

/** Add (no `crop`) or edit one crop. `onDone(message)` closes the form. */
export function CropForm({ household, crop, onDone }: { household: HouseholdInfo; crop?: Crop; onDone: (message?: string) => void }) {
  const qc = useQueryClient();
  const api = urls(household.id);
  const formRef = useRef<HTMLFormElement>(null);
  const [alert, setAlert] = useState<string | null>(null);
  const { control, register, watch, setError, handleSubmit, formState } = useForm<CropFormValues, CropFormContext, CropInput | CropPatch>({
    defaultValues: cropFormValues(crop, household.units),
    resolver: cropResolver,
    // Errors show after Save and stay until the next Save.
    mode: 'onSubmit',
    reValidateMode: 'onSubmit',
    shouldFocusError: false,
    context: { editing: crop !== undefined, units: household.units },
  });
  const errors: Errors = flatErrors(formState.errors);
  const [name, category, food, notFood] = watch(['name', 'category', 'food', 'notFood']);
  const p = crop ? `crop-${crop.id}` : 'crop-new';

  const save = useMutation({
    mutationFn: (body: CropInput | CropPatch) => (crop ? request<{ crop: Crop }>('PATCH', api.crop(crop.id), body) : request<{ crop: Crop }>('POST', api.crops(), body)),
    onSuccess: (r) => {
      void qc.invalidateQueries({ queryKey: keys.allCrops(household.id) });
      void qc.invalidateQueries({ queryKey: keys.harvests(household.id) });
      onDone(crop ? `${r.crop.displayName} is saved.` : `${r.crop.displayName} is added. Log its first harvest from “Log harvest”.`);
    },
    onError: (e) => {
      const fields = e instanceof ApiError ? e.fields : {};
      for (const [field, message] of Object.entries(fields)) setError(field as keyof CropFormValues, { type: 'server', message });
      setAlert((e as Error).message);
    },
  });

  function focusFirst(errs: Errors) {
    const first = Object.keys(errs)[0];
    const map: Record<string, string> = { countGrams: `${p}-count`, edibleFraction: `${p}-eaten`, defaultSpreadMonths: `${p}-spread`, defaultUse: `${p}-use`, foodId: `${p}-food`, name: `${p}-name`, variety: `${p}-variety` };
    if (first) formRef.current?.querySelector<HTMLElement>(`#${CSS.escape(map[first] ?? first)}`)?.focus();
  }

  function submit(e: FormEvent) {
    setAlert(null);
    void handleSubmit(
      (body) => save.mutate(body),
      (errs) => focusFirst(flatErrors(errs)),
    )(e);
  }

  const refuse = food?.refusePct ?? null;
  // Before the server picks a kind from the name, the hints speak for Other.
  const kind = category === '' ? 'other' : category;
  const catUse = defaultUse({ category: kind, notFood });

  return (
    <form ref={formRef} onSubmit={submit} noValidate className="card mt-5 max-w-2xl" aria-labelledby={`${p}-title`}>
      <h2 id={`${p}-title`} className="text-xl font-bold">
        {crop ? `Edit ${crop.displayName}` : 'Add a crop'}
      </h2>
      <div className="grid gap-x-4 sm:grid-cols-2">
        <FieldShell id={`${p}-name`} label="Name" error={errors.name} hint="What you call it, e.g. “Flint corn for meal”.">
          <input {...invalidProps(`${p}-name`, errors.name, true)} {...register('name')} type="text" className="field" maxLength={120} autoComplete="off" />
        </FieldShell>
        <FieldShell id={`${p}-variety`} label={<>Variety <span className="font-normal text-loam-700">(optional)</span></>} error={errors.variety} hint="e.g. “Charlotte”, “Waltham”.">
          <input {...invalidProps(`${p}-variety`, errors.variety, true)} {...register('variety')} type="text" className="field" maxLength={120} autoComplete="off" />
        </FieldShell>
      </div>
      <FieldShell id={`${p}-category`} label="Kind of crop" error={errors.category} hint="Sets the usual use and how long stored food lasts, unless you say otherwise below.">
        <select {...invalidProps(`${p}-category`, errors.category, true)} {...register('category')} className="field">
          {crop ? null : <option value="">From the name (a known crop’s kind, else Other)</option>}
          {CROP_CATEGORIES.map((c) => (
            <option key={c} value={c}>
              {CROP_CATEGORY_LABELS[c]}
            </option>
          ))}
        </select>
      </FieldShell>

      <label className="mt-5 flex min-h-12 cursor-pointer items-start gap-3 rounded-xl border border-loam-200 bg-loam-50 p-3">
        <input type="checkbox" {...register('notFood')} className="mt-1 size-6 accent-berry-700" />
        <span>
          <span className="font-semibold">Not food (ornamental / toxic part)</span>
          <span className="block text-sm text-loam-700">Flowers for cutting, seed-only plants, or plants whose harvested part is toxic. Never matched to a food and never counted as eaten: log it as seed, given, sold or lost.</span>
        </span>
      </label>
      {notFood ? (
        <p className="caution mt-3">Some garden plants and plant parts are toxic. Selfsown never counts a not-food crop as food, whatever its weight.</p>
      ) : (
        <>
          <Controller
            control={control}
            name="food"
            render={({ field }) => (
              <FoodPicker
                id={`${p}-food`}
                label="Reference food"
                value={field.value}
                onChange={field.onChange}
                suggestFor={name}
                error={errors.foodId}
                hint="The food as you harvest it — raw and whole forms come first. Check the refuse and figures fit."
              />
            )}
          />
          <FieldShell
            id={`${p}-eaten`}
            label={<>Share you eat, in % <span className="font-normal text-loam-700">(optional)</span></>}
            error={errors.edibleFraction}
            hint={refuse != null ? `Leave empty to use the food’s ${pct(refuse)} refuse (${pct(100 - refuse)} eaten). Set it when you trim differently.` : 'Leave empty to use the food’s refuse.'}
          >
            <input {...invalidProps(`${p}-eaten`, errors.edibleFraction, true)} {...register('eatenPct')} type="text" inputMode="decimal" className="field w-32" placeholder={refuse != null ? String(100 - refuse) : ''} />
          </FieldShell>
        </>
      )}

      <div className="grid gap-x-4 sm:grid-cols-2">
        <FieldShell id={`${p}-use`} label="Usual use" error={errors.defaultUse} hint={`Leave as is for the kind’s usual: ${USE_LABELS[catUse].toLowerCase()}.`}>
          <select {...invalidProps(`${p}-use`, errors.defaultUse, true)} {...register('use')} className="field">
            <option value="">Usual for the kind</option>
            {USES.filter((u) => !notFood || !isEatenUse(u)).map((u) => (
              <option key={u} value={u}>
                {USE_LABELS[u]}
              </option>
            ))}
          </select>
        </FieldShell>
        {!notFood ? (
          <FieldShell id={`${p}-spread`} label="Stored food lasts (months)" error={errors.defaultSpreadMonths} hint={`Empty: ${defaultSpreadMonths({ use: 'stored', category: kind })} stored, ${defaultSpreadMonths({ use: 'preserved', category: kind })} preserved.`}>
            <Controller
              control={control}
              name="spread"
              render={({ field }) => (
                <input {...invalidProps(`${p}-spread`, errors.defaultSpreadMonths, true)} type="text" inputMode="numeric" className="field w-32" value={field.value} onChange={(e) => field.onChange(e.target.value.replace(/[^\d]/g, ''))} />
              )}
            />
          </FieldShell>
        ) : null}
      </div>
      <FieldShell
        id={`${p}-count`}
        label={<>Weight of one (piece, bunch or head), in {countWeightUnit(household.units)} <span className="font-normal text-loam-700">(optional)</span></>}
        error={errors.countGrams}
        hint="Weigh one whole, as you harvest it, to log this crop by count (“3 bunches”); its refuse still comes off. Empty: the reference food’s household measures, when it has one."
      >
        <input {...invalidProps(`${p}-count`, errors.countGrams, true)} {...register('countWeight')} type="text" inputMode="decimal" className="field w-32" autoComplete="off" />
      </FieldShell>
      <ErrorText id={`${p}-form`} error={errors._form} />
      <div className="mt-6 flex flex-wrap gap-2">
        <button type="submit" className="btn-primary" disabled={save.isPending}>
          {save.isPending ? 'Saving…' : crop ? 'Save crop' : 'Add crop'}
        </button>
        <button type="button" className="btn-quiet" onClick={() => onDone()}>
          Cancel
        </button>
      </div>
      <Alert message={alert} />
    </form>
  );
}
