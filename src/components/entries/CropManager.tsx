/**
 * The household's crop catalogue (island): list, add, edit, archive and delete crops. Adding a crop
 * suggests reference foods (raw, whole forms first) and shows the chosen food's refuse and energy
 * and protein per 100 g, so the grower can judge the match. A crop marked not food (ornamental or
 * toxic parts) is never matched to a food and never counted as food.
 */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { CROP_CATEGORY_LABELS, defaultSpreadMonths, defaultUse } from '@/lib/crop-categories';
import { USE_LABELS } from '@/lib/entry-schemas';
import { ApiError, canWrite, get, keys, request, urls, type Crop, type HouseholdInfo } from './api';
import { CropForm } from './CropForm';
import { FactsGrid } from './FoodPicker';
import { formatDate } from '@/lib/format-date';
import { countText } from '@/lib/plural';
import { formatWeight } from '@/lib/units';
import { QueryProvider } from '@/components/QueryProvider';
import { Alert, ConfirmDelete, pct } from './ui';

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
          {countText(crops.length, 'crop')}
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
                    <dd className="font-semibold">{countText(defaultSpreadMonths({ use: 'stored', category: c.category, cropDefault: c.defaultSpreadMonths }), 'month')}</dd>
                  </>
                ) : null}
                {c.countGrams != null ? (
                  <>
                    <dt className="text-loam-700">Weight of one</dt>
                    <dd className="font-semibold">{formatWeight(c.countGrams, household.units)}</dd>
                  </>
                ) : null}
                <dt className="text-loam-700">Harvests</dt>
                <dd className="font-semibold">
                  {c.harvestCount}
                  {c.lastHarvestDate ? `, last ${formatDate(c.lastHarvestDate)}` : ''}
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
