/**
 * The household's crop catalogue (island): list, add, edit, archive and delete crops. Adding a crop
 * suggests reference foods (raw, whole forms first) and shows the chosen food's refuse and energy
 * and protein per 100 g, so the grower can judge the match. A crop marked not food (ornamental or
 * toxic parts) is never matched to a food and never counted as food.
 */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useRef, useState, type FormEvent } from 'react';
import { CROP_CATEGORIES, CROP_CATEGORY_LABELS, defaultSpreadMonths, defaultUse, type CropCategory } from '../../lib/crop-categories';
import { cropInput, cropPatch, isEatenUse, USE_LABELS, USES, zodErrorBody, type Use } from '../../lib/entry-schemas';
import { ApiError, canWrite, get, keys, request, urls, type Crop, type HouseholdInfo } from './api';
import { FactsGrid, FoodPicker, type FoodChoice } from './FoodPicker';
import { formatDay } from './local-date';
import { QueryProvider } from './QueryProvider';
import { parseDecimal } from './quantity-text';
import { Alert, ConfirmDelete, ErrorText, FieldShell, invalidProps, pct, type Errors } from './ui';

export default function CropManager(props: { household: HouseholdInfo }) {
  return (
    <QueryProvider>
      <CropManagerInner {...props} />
    </QueryProvider>
  );
}

function CropManagerInner({ household }: { household: HouseholdInfo }) {
  const hid = household.id;
  const api = urls(hid);
  const qc = useQueryClient();
  const writer = canWrite(household.role);
  const [showArchived, setShowArchived] = useState(false);
  const [editing, setEditing] = useState<number | 'new' | null>(null);
  const [alert, setAlert] = useState<{ tone: 'error' | 'ok'; text: string; archiveId?: number } | null>(null);
  const list = useQuery({ queryKey: keys.crops(hid, true), queryFn: () => get<{ crops: Crop[] }>(api.crops(true)).then((r) => r.crops) });
  const crops = (list.data ?? []).filter((c) => showArchived || !c.archived);
  const archivedCount = (list.data ?? []).filter((c) => c.archived).length;

  const invalidate = () => {
    void qc.invalidateQueries({ queryKey: keys.allCrops(hid) });
    void qc.invalidateQueries({ queryKey: keys.harvests(hid) });
  };
  const archive = useMutation({
    mutationFn: ({ id, archived }: { id: number; archived: boolean }) => request<{ crop: Crop }>('PATCH', api.crop(id), { archived }),
    onSuccess: (r) => {
      setAlert({ tone: 'ok', text: r.crop.archived ? `${r.crop.displayName} is archived: it stays in the log but leaves the harvest form.` : `${r.crop.displayName} is back in the harvest form.` });
      invalidate();
    },
    onError: (e) => setAlert({ tone: 'error', text: (e as Error).message }),
  });
  const remove = useMutation({
    mutationFn: (crop: Crop) => request<null>('DELETE', api.crop(crop.id)).then(() => crop),
    onSuccess: (crop) => {
      setAlert({ tone: 'ok', text: `${crop.displayName} is deleted.` });
      invalidate();
    },
    onError: (e, crop) => {
      if (e instanceof ApiError && e.status === 409) {
        setAlert({ tone: 'error', text: `${crop.displayName} has harvests logged, so it cannot be deleted. Archive it instead: its harvests stay counted, and it leaves the harvest form.`, archiveId: crop.id });
      } else setAlert({ tone: 'error', text: (e as Error).message });
    },
  });

  return (
    <div>
      <p className="caution max-w-2xl">
        Some garden plants and plant parts are toxic — for example rhubarb leaves, potato and tomato foliage and green potato skin, foxglove, and many ornamental bulbs. Mark such plants as
        <strong> not food</strong>: Selfsown never counts them as food and never suggests them for eating.
      </p>

      {writer ? (
        editing === 'new' ? (
          <CropForm household={household} onDone={(msg) => (setEditing(null), msg && setAlert({ tone: 'ok', text: msg }))} />
        ) : (
          <button type="button" className="btn-primary mt-5" onClick={() => (setEditing('new'), setAlert(null))}>
            Add a crop
          </button>
        )
      ) : null}

      {alert ? (
        <Alert
          tone={alert.tone}
          message={
            <span>
              {alert.text}
              {alert.archiveId ? (
                <button type="button" className="btn-quiet ml-3 mt-2" onClick={() => archive.mutate({ id: alert.archiveId!, archived: true })}>
                  Archive it
                </button>
              ) : null}
            </span>
          }
        />
      ) : null}

      <div className="mt-6 flex flex-wrap items-center justify-between gap-3">
        <h2 className="text-xl font-bold">
          {crops.length} {crops.length === 1 ? 'crop' : 'crops'}
        </h2>
        {archivedCount > 0 ? (
          <label className="flex min-h-12 cursor-pointer items-center gap-2">
            <input type="checkbox" className="size-5 accent-sprout-700" checked={showArchived} onChange={(e) => setShowArchived(e.target.checked)} />
            Show {archivedCount} archived
          </label>
        ) : null}
      </div>
      {list.isPending ? <p className="mt-3 text-loam-700">Loading…</p> : null}
      {list.isError ? <Alert message={`Could not load the crops: ${(list.error as Error).message}`} /> : null}
      {list.isSuccess && crops.length === 0 ? <p className="card mt-3">No crops yet. {writer ? 'Add the first one: what you grow or keep, matched to a reference food.' : ''}</p> : null}
      <ul className="mt-3 grid gap-3 md:grid-cols-2" data-testid="crop-list">
        {crops.map((c) =>
          editing === c.id ? (
            <li key={c.id} className="md:col-span-2">
              <CropForm household={household} crop={c} onDone={(msg) => (setEditing(null), msg && setAlert({ tone: 'ok', text: msg }))} />
            </li>
          ) : (
            <li key={c.id} className={`card ${c.archived ? 'opacity-70' : ''}`} data-testid="crop-card">
              <div className="flex flex-wrap items-baseline justify-between gap-2">
                <h3 className="text-lg font-extrabold">
                  {c.name}
                  {c.variety ? <span className="font-semibold text-loam-700"> · {c.variety}</span> : null}
                </h3>
                <span className="text-sm text-loam-700">{CROP_CATEGORY_LABELS[c.category]}</span>
              </div>
              {c.archived ? <p className="text-sm font-semibold text-rind-700">Archived</p> : null}
              {c.notFood ? (
                <p className="mt-2 rounded-lg bg-berry-700/10 px-3 py-2 text-sm font-semibold text-berry-700">Not food — never counted as food (seed, given, sold or lost only)</p>
              ) : c.food ? (
                <div className="mt-2">
                  <p className="text-sm">
                    Matched to <a className="font-semibold underline" href={`/foods/${c.food.id}`}>{c.food.name}</a>{' '}
                    <span className="text-loam-700">({c.food.dataset.toUpperCase()} {c.food.code})</span>
                  </p>
                  <FactsGrid refusePct={c.food.refusePct} kcal={c.food.kcalPer100g} protein={c.food.proteinPer100g} />
                </div>
              ) : (
                <p className="mt-2 text-sm font-semibold text-rind-700">Not matched to a reference food yet: its harvests count by weight but add no nutrients.</p>
              )}
              <dl className="mt-3 grid grid-cols-2 gap-x-4 gap-y-1 text-sm">
                {c.edibleFraction != null ? (
                  <>
                    <dt className="text-loam-700">Eaten share (own)</dt>
                    <dd className="font-semibold">{pct(c.edibleFraction * 100)}</dd>
                  </>
                ) : null}
                <dt className="text-loam-700">Usual use</dt>
                <dd className="font-semibold">{USE_LABELS[defaultUse({ category: c.category, cropDefault: c.defaultUse, notFood: c.notFood })]}</dd>
                {!c.notFood ? (
                  <>
                    <dt className="text-loam-700">If stored, eaten over</dt>
                    <dd className="font-semibold">{defaultSpreadMonths({ use: 'stored', category: c.category, cropDefault: c.defaultSpreadMonths })} months</dd>
                  </>
                ) : null}
                <dt className="text-loam-700">Harvests</dt>
                <dd className="font-semibold">
                  {c.harvestCount}
                  {c.lastHarvestDate ? `, last ${formatDay(c.lastHarvestDate)}` : ''}
                </dd>
              </dl>
              {writer ? (
                <div className="mt-4 flex flex-wrap gap-2">
                  <button type="button" className="btn-quiet" onClick={() => (setEditing(c.id), setAlert(null))} aria-label={`Edit ${c.displayName}`}>
                    Edit
                  </button>
                  <button type="button" className="btn-quiet" disabled={archive.isPending} onClick={() => archive.mutate({ id: c.id, archived: !c.archived })} aria-label={`${c.archived ? 'Unarchive' : 'Archive'} ${c.displayName}`}>
                    {c.archived ? 'Unarchive' : 'Archive'}
                  </button>
                  {c.harvestCount === 0 ? <ConfirmDelete what={c.displayName} busy={remove.isPending} onConfirm={() => remove.mutate(c)} /> : null}
                </div>
              ) : null}
            </li>
          ),
        )}
      </ul>
    </div>
  );
}

/** Add (no `crop`) or edit one crop. `onDone(message)` closes the form. */
function CropForm({ household, crop, onDone }: { household: HouseholdInfo; crop?: Crop; onDone: (message?: string) => void }) {
  const qc = useQueryClient();
  const api = urls(household.id);
  const formRef = useRef<HTMLFormElement>(null);
  const [name, setName] = useState(crop?.name ?? '');
  const [variety, setVariety] = useState(crop?.variety ?? '');
  const [category, setCategory] = useState<CropCategory>(crop?.category ?? 'other');
  const [food, setFood] = useState<FoodChoice | null>(crop?.food ? { id: crop.food.id, name: crop.food.name, code: crop.food.code, dataset: crop.food.dataset, refusePct: crop.food.refusePct } : null);
  const [eatenPct, setEatenPct] = useState(crop?.edibleFraction != null ? String(Math.round(crop.edibleFraction * 1000) / 10) : '');
  const [use, setUse] = useState<Use | ''>(crop?.defaultUse ?? '');
  const [spread, setSpread] = useState(crop?.defaultSpreadMonths != null ? String(crop.defaultSpreadMonths) : '');
  const [notFood, setNotFood] = useState(crop?.notFood ?? false);
  const [errors, setErrors] = useState<Errors>({});
  const [alert, setAlert] = useState<string | null>(null);
  const p = crop ? `crop-${crop.id}` : 'crop-new';

  const save = useMutation({
    mutationFn: (body: unknown) => (crop ? request<{ crop: Crop }>('PATCH', api.crop(crop.id), body) : request<{ crop: Crop }>('POST', api.crops(), body)),
    onSuccess: (r) => {
      void qc.invalidateQueries({ queryKey: keys.allCrops(household.id) });
      void qc.invalidateQueries({ queryKey: keys.harvests(household.id) });
      onDone(crop ? `${r.crop.displayName} is saved.` : `${r.crop.displayName} is added. Log its first harvest from “Log harvest”.`);
    },
    onError: (e) => {
      const fields = e instanceof ApiError ? e.fields : {};
      setErrors(fields);
      setAlert((e as Error).message);
    },
  });

  function submit(e: FormEvent) {
    e.preventDefault();
    setAlert(null);
    const fraction = parseDecimal(eatenPct);
    const spreadN = parseDecimal(spread);
    const body = {
      name,
      variety: crop ? (variety.trim() === '' ? null : variety) : variety,
      category,
      foodId: notFood ? null : (food?.id ?? null),
      edibleFraction: notFood || fraction === undefined ? (crop ? null : undefined) : fraction / 100,
      defaultUse: use === '' ? (crop ? null : undefined) : use,
      defaultSpreadMonths: spreadN === undefined ? (crop ? null : undefined) : spreadN,
      notFood,
    };
    const r = crop ? cropPatch.safeParse(body) : cropInput.safeParse(body);
    if (!r.success) {
      const f = zodErrorBody(r.error).fields;
      setErrors(f);
      const first = Object.keys(f)[0];
      const map: Record<string, string> = { edibleFraction: `${p}-eaten`, defaultSpreadMonths: `${p}-spread`, defaultUse: `${p}-use`, foodId: `${p}-food`, name: `${p}-name`, variety: `${p}-variety` };
      if (first) formRef.current?.querySelector<HTMLElement>(`#${CSS.escape(map[first] ?? first)}`)?.focus();
      return;
    }
    setErrors({});
    save.mutate(r.data);
  }

  const refuse = food?.refusePct ?? null;
  const catUse = defaultUse({ category, notFood });

  return (
    <form ref={formRef} onSubmit={submit} noValidate className="card mt-5 max-w-2xl" aria-labelledby={`${p}-title`}>
      <h2 id={`${p}-title`} className="text-xl font-bold">
        {crop ? `Edit ${crop.displayName}` : 'Add a crop'}
      </h2>
      <div className="grid gap-x-4 sm:grid-cols-2">
        <FieldShell id={`${p}-name`} label="Name" error={errors.name} hint="What you call it, e.g. “Flint corn for meal”.">
          <input {...invalidProps(`${p}-name`, errors.name, true)} type="text" className="field" value={name} maxLength={120} onChange={(e) => setName(e.target.value)} autoComplete="off" />
        </FieldShell>
        <FieldShell id={`${p}-variety`} label={<>Variety <span className="font-normal text-loam-700">(optional)</span></>} error={errors.variety} hint="e.g. “Charlotte”, “Waltham”.">
          <input {...invalidProps(`${p}-variety`, errors.variety, true)} type="text" className="field" value={variety} maxLength={120} onChange={(e) => setVariety(e.target.value)} autoComplete="off" />
        </FieldShell>
      </div>
      <FieldShell id={`${p}-category`} label="Kind of crop" error={errors.category} hint="Sets the usual use and how long stored food lasts, unless you say otherwise below.">
        <select {...invalidProps(`${p}-category`, errors.category, true)} className="field" value={category} onChange={(e) => setCategory(e.target.value as CropCategory)}>
          {CROP_CATEGORIES.map((c) => (
            <option key={c} value={c}>
              {CROP_CATEGORY_LABELS[c]}
            </option>
          ))}
        </select>
      </FieldShell>

      <label className="mt-5 flex min-h-12 cursor-pointer items-start gap-3 rounded-xl border border-loam-200 bg-loam-50 p-3">
        <input type="checkbox" className="mt-1 size-6 accent-berry-700" checked={notFood} onChange={(e) => setNotFood(e.target.checked)} />
        <span>
          <span className="font-semibold">Not food (ornamental / toxic part)</span>
          <span className="block text-sm text-loam-700">Flowers for cutting, seed-only plants, or plants whose harvested part is toxic. Never matched to a food and never counted as eaten: log it as seed, given, sold or lost.</span>
        </span>
      </label>
      {notFood ? (
        <p className="caution mt-3">Some garden plants and plant parts are toxic. Selfsown never counts a not-food crop as food, whatever its weight.</p>
      ) : (
        <>
          <FoodPicker
            id={`${p}-food`}
            label="Reference food"
            value={food}
            onChange={setFood}
            suggestFor={name}
            error={errors.foodId}
            hint="The food as you harvest it — raw and whole forms come first. Check the refuse and figures fit."
          />
          <FieldShell
            id={`${p}-eaten`}
            label={<>Share you eat, in % <span className="font-normal text-loam-700">(optional)</span></>}
            error={errors.edibleFraction}
            hint={refuse != null ? `Leave empty to use the food’s ${pct(refuse)} refuse (${pct(100 - refuse)} eaten). Set it when you trim differently.` : 'Leave empty to use the food’s refuse.'}
          >
            <input {...invalidProps(`${p}-eaten`, errors.edibleFraction, true)} type="text" inputMode="decimal" className="field w-32" value={eatenPct} onChange={(e) => setEatenPct(e.target.value)} placeholder={refuse != null ? String(100 - refuse) : ''} />
          </FieldShell>
        </>
      )}

      <div className="grid gap-x-4 sm:grid-cols-2">
        <FieldShell id={`${p}-use`} label="Usual use" error={errors.defaultUse} hint={`Leave as is for the kind’s usual: ${USE_LABELS[catUse].toLowerCase()}.`}>
          <select {...invalidProps(`${p}-use`, errors.defaultUse, true)} className="field" value={use} onChange={(e) => setUse(e.target.value as Use | '')}>
            <option value="">Usual for the kind</option>
            {USES.filter((u) => !notFood || !isEatenUse(u)).map((u) => (
              <option key={u} value={u}>
                {USE_LABELS[u]}
              </option>
            ))}
          </select>
        </FieldShell>
        {!notFood ? (
          <FieldShell id={`${p}-spread`} label="Stored food lasts (months)" error={errors.defaultSpreadMonths} hint={`Empty: ${defaultSpreadMonths({ use: 'stored', category })} stored, ${defaultSpreadMonths({ use: 'preserved', category })} preserved.`}>
            <input {...invalidProps(`${p}-spread`, errors.defaultSpreadMonths, true)} type="text" inputMode="numeric" className="field w-32" value={spread} onChange={(e) => setSpread(e.target.value.replace(/[^\d]/g, ''))} />
          </FieldShell>
        ) : null}
      </div>
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
