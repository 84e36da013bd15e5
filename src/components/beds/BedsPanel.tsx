/**
 * The beds page's island: the household's growing season (frost dates), its beds with their areas
 * in the household's unit, and one season's plantings grouped by bed and succession slot, each
 * with its expected harvest window; beside them, per crop, the household's own measured yield and
 * the reference table's typical yield. Owners and growers get the forms; viewers read.
 */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { AREA_UNIT_LABELS, areaUnitFor } from '@/lib/bed-schemas';
import type { BedJson, PlantingJson, PlantingListJson, ReferenceCropOption, SeasonJson } from '@/lib/bed-types';
import type { CropJson } from '@/lib/api-types';
import { formatAmount } from '@/lib/format-number';
import { PLANTING_SLOT_LABELS, PLANTING_SLOTS } from '@/lib/planting-slots';
import type { UnitSystem } from '@/lib/units';
import { Alert, ConfirmDelete } from '@/components/entries/ui';
import { FieldShell, formMessage, invalidProps, showFailure } from '@/components/forms';
import { QueryProvider } from '@/components/QueryProvider';
import { get, request } from '@/components/request';
import {
  bedFormValues,
  bedResolver,
  expectedHarvest,
  plantingFormValues,
  plantingResolver,
  seasonResolver,
  type BedFormValues,
  type PlantingFormValues,
  type SeasonFormValues,
} from './bed-form-values';

interface Props {
  household: { id: number; name: string; units: UnitSystem; timezone: string; role: 'owner' | 'grower' | 'viewer' };
  year: number;
  referenceCrops: ReferenceCropOption[];
}

export default function BedsPanel(props: Props) {
  return (
    <QueryProvider>
      <Beds {...props} />
    </QueryProvider>
  );
}

function Beds({ household, year: thisYear, referenceCrops }: Props) {
  const base = `/api/households/${household.id}`;
  const canWrite = household.role !== 'viewer';
  const unit = AREA_UNIT_LABELS[areaUnitFor(household.units)];
  const client = useQueryClient();
  const [year, setYear] = useState(thisYear);
  const [notice, setNotice] = useState<string | null>(null);
  const season = useQuery({ queryKey: ['season', household.id], queryFn: () => get<SeasonJson>(`${base}/season`) });
  const beds = useQuery({ queryKey: ['beds', household.id], queryFn: () => get<{ beds: BedJson[] }>(`${base}/beds`) });
  const plantings = useQuery({ queryKey: ['plantings', household.id, year], queryFn: () => get<PlantingListJson>(`${base}/plantings?year=${year}`) });
  const crops = useQuery({ queryKey: ['crops', household.id], queryFn: () => get<{ crops: CropJson[] }>(`${base}/crops`), enabled: canWrite });
  const refresh = async (message: string) => {
    setNotice(message);
    await client.invalidateQueries({ queryKey: ['beds', household.id] });
    await client.invalidateQueries({ queryKey: ['plantings', household.id] });
    await client.invalidateQueries({ queryKey: ['crops', household.id] });
  };
  const frost = season.data?.season;

  return (
    <div className="grid gap-8">
      <Alert message={notice} tone="ok" />
      <section aria-labelledby="season-h">
        <h2 id="season-h" className="text-2xl font-extrabold">Growing season</h2>
        {season.isError ? <Alert message={season.error.message} /> : null}
        {frost ? (
          <p className="mt-2 text-lg" data-testid="frost-dates">
            Last spring frost <strong>{frost.lastSpringFrost}</strong>
            {frost.own.lastSpringFrost ? '' : ' (default)'}, first autumn frost <strong>{frost.firstAutumnFrost}</strong>
            {frost.own.firstAutumnFrost ? '' : ' (default)'}.
          </p>
        ) : null}
        <p className="mt-1 max-w-2xl text-sm text-loam-700">
          The defaults follow the {frost?.hemisphere ?? 'time zone’s'} hemisphere (common practice, not a published date); harvest windows are counted from these dates, so set your own.
        </p>
        {canWrite && season.data ? <SeasonForm base={base} season={season.data} onSaved={async () => { await client.invalidateQueries({ queryKey: ['season', household.id] }); setNotice('Frost dates saved.'); }} /> : null}
      </section>

      <section aria-labelledby="beds-h">
        <h2 id="beds-h" className="text-2xl font-extrabold">Beds</h2>
        {beds.isError ? <Alert message={beds.error.message} /> : null}
        <BedList base={base} beds={beds.data?.beds ?? []} unit={unit} canWrite={canWrite} onChanged={refresh} />
        {canWrite ? <BedForm base={base} unit={unit} onSaved={refresh} /> : null}
      </section>

      <section aria-labelledby="plantings-h">
        <div className="flex flex-wrap items-center justify-between gap-3">
          <h2 id="plantings-h" className="text-2xl font-extrabold">Plantings in {year}</h2>
          <div className="flex gap-2">
            <button type="button" className="btn-quiet min-h-12 px-3" onClick={() => setYear(year - 1)} aria-label="Previous season">‹ {year - 1}</button>
            <button type="button" className="btn-quiet min-h-12 px-3" onClick={() => setYear(year + 1)} aria-label="Next season">{year + 1} ›</button>
          </div>
        </div>
        {plantings.isError ? <Alert message={plantings.error.message} /> : null}
        {plantings.data ? (
          <PlantingGroups base={base} list={plantings.data} beds={beds.data?.beds ?? []} unit={unit} canWrite={canWrite} crops={crops.data?.crops ?? []} referenceCrops={referenceCrops} frost={frost} onChanged={refresh} />
        ) : null}
        {canWrite && frost ? (
          <AddPlanting base={base} year={year} beds={beds.data?.beds ?? []} unit={unit} crops={crops.data?.crops ?? []} referenceCrops={referenceCrops} frost={frost} onSaved={refresh} />
        ) : null}
      </section>

      {plantings.data && plantings.data.yields.length > 0 ? <Yields list={plantings.data} /> : null}
    </div>
  );
}

function SeasonForm({ base, season, onSaved }: { base: string; season: SeasonJson; onSaved: () => Promise<void> }) {
  const form = useForm<SeasonFormValues, unknown, Record<string, unknown>>({
    resolver: seasonResolver,
    reValidateMode: 'onSubmit',
    defaultValues: { lastSpringFrost: season.stored.lastSpringFrost ?? '', firstAutumnFrost: season.stored.firstAutumnFrost ?? '' },
  });
  const e = form.formState.errors;
  const submit = form.handleSubmit(async (body) => {
    try {
      await request('PUT', `${base}/season`, body);
      await onSaved();
    } catch (err) {
      showFailure(form, err);
    }
  });
  return (
    <form onSubmit={submit} noValidate className="card mt-3 grid gap-x-4 sm:grid-cols-3 sm:items-end">
      <FieldShell id="lastSpringFrost" label="Last spring frost (MM-DD)" error={e.lastSpringFrost?.message} hint={`Blank: ${season.season.defaults.lastSpringFrost}`}>
        <input className="field" inputMode="numeric" placeholder={season.season.defaults.lastSpringFrost} {...form.register('lastSpringFrost')} {...invalidProps('lastSpringFrost', e.lastSpringFrost?.message, true)} />
      </FieldShell>
      <FieldShell id="firstAutumnFrost" label="First autumn frost (MM-DD)" error={e.firstAutumnFrost?.message} hint={`Blank: ${season.season.defaults.firstAutumnFrost}`}>
        <input className="field" inputMode="numeric" placeholder={season.season.defaults.firstAutumnFrost} {...form.register('firstAutumnFrost')} {...invalidProps('firstAutumnFrost', e.firstAutumnFrost?.message, true)} />
      </FieldShell>
      <button type="submit" className="btn-primary mt-4" disabled={form.formState.isSubmitting}>Save frost dates</button>
      <Alert message={formMessage(form)} />
    </form>
  );
}

function BedList({ base, beds, unit, canWrite, onChanged }: { base: string; beds: BedJson[]; unit: string; canWrite: boolean; onChanged: (m: string) => Promise<void> }) {
  const [editing, setEditing] = useState<number | null>(null);
  const remove = useMutation({ mutationFn: (b: BedJson) => request<null>('DELETE', `${base}/beds/${b.id}`), onSuccess: (_r, b) => onChanged(`Deleted ${b.name}; its plantings stay, without a bed.`) });
  if (beds.length === 0) return <p className="card mt-3">No beds yet. Add each bed, row or orchard strip with its area.</p>;
  return (
    <ul className="mt-3 grid gap-3" data-testid="bed-list">
      {remove.isError ? <Alert message={remove.error.message} /> : null}
      {beds.map((b) =>
        editing === b.id ? (
          <li key={b.id}>
            <BedForm base={base} unit={unit} bed={b} onCancel={() => setEditing(null)} onSaved={async (m) => { setEditing(null); await onChanged(m); }} />
          </li>
        ) : (
          <li key={b.id} className="card flex flex-wrap items-center justify-between gap-3" data-testid="bed">
            <div>
              <p className="text-xl font-extrabold">{b.name}</p>
              <p className="text-lg"><span className="font-bold">{formatAmount(b.area)} {unit}</span>{b.notes ? <span className="text-loam-700"> · {b.notes}</span> : null}</p>
            </div>
            {canWrite ? (
              <div className="flex flex-wrap gap-2">
                <button type="button" className="btn-quiet min-h-12 px-3" onClick={() => setEditing(b.id)} aria-label={`Change ${b.name}`}>Change</button>
                <ConfirmDelete what={b.name} busy={remove.isPending} onConfirm={() => remove.mutate(b)} />
              </div>
            ) : null}
          </li>
        ),
      )}
    </ul>
  );
}

function BedForm({ base, unit, bed, onSaved, onCancel }: { base: string; unit: string; bed?: BedJson; onSaved: (m: string) => Promise<void>; onCancel?: () => void }) {
  const editing = bed !== undefined;
  const form = useForm<BedFormValues, unknown, Record<string, unknown>>({ resolver: bedResolver, context: { editing }, reValidateMode: 'onSubmit', defaultValues: bedFormValues(bed) });
  const e = form.formState.errors;
  const id = (f: string) => `bed-${bed?.id ?? 'new'}-${f}`;
  const submit = form.handleSubmit(async (body) => {
    try {
      await request(editing ? 'PATCH' : 'POST', editing ? `${base}/beds/${bed.id}` : `${base}/beds`, body);
      if (!editing) form.reset(bedFormValues());
      await onSaved(`${editing ? 'Saved' : 'Added'} ${String(body.name ?? bed?.name)}.`);
    } catch (err) {
      showFailure(form, err);
    }
  });
  return (
    <form onSubmit={submit} noValidate className="card mt-3" aria-label={editing ? `Change ${bed.name}` : 'Add a bed'}>
      <h3 className="text-lg font-bold">{editing ? `Change ${bed.name}` : 'Add a bed'}</h3>
      <div className="grid gap-x-4 sm:grid-cols-3">
        <FieldShell id={id('name')} label="Bed name" error={e.name?.message}>
          <input className="field" {...form.register('name')} {...invalidProps(id('name'), e.name?.message)} />
        </FieldShell>
        <FieldShell id={id('area')} label={`Area, ${unit}`} error={e.area?.message}>
          <input className="field" inputMode="decimal" {...form.register('area')} {...invalidProps(id('area'), e.area?.message)} />
        </FieldShell>
        <FieldShell id={id('notes')} label="Notes (optional)" error={e.notes?.message}>
          <input className="field" {...form.register('notes')} {...invalidProps(id('notes'), e.notes?.message)} />
        </FieldShell>
      </div>
      <div className="mt-4 flex flex-wrap gap-2">
        <button type="submit" className="btn-primary" disabled={form.formState.isSubmitting}>{editing ? 'Save bed' : 'Add bed'}</button>
        {onCancel ? <button type="button" className="btn-quiet" onClick={onCancel}>Cancel</button> : null}
      </div>
      <Alert message={formMessage(form)} />
    </form>
  );
}

interface PlantingContext {
  base: string;
  beds: BedJson[];
  unit: string;
  crops: CropJson[];
  referenceCrops: ReferenceCropOption[];
}

function PlantingGroups({ list, canWrite, frost, onChanged, ...ctx }: PlantingContext & { list: PlantingListJson; canWrite: boolean; frost: SeasonJson['season'] | undefined; onChanged: (m: string) => Promise<void> }) {
  const [editing, setEditing] = useState<number | null>(null);
  const remove = useMutation({ mutationFn: (p: PlantingJson) => request<null>('DELETE', `${ctx.base}/plantings/${p.id}`), onSuccess: (_r, p) => onChanged(`Deleted the planting of ${p.cropName}.`) });
  if (list.plantings.length === 0) return <p className="card mt-3">No plantings in {list.year} yet.</p>;
  const groups = new Map<string, PlantingJson[]>();
  for (const p of list.plantings) {
    const key = p.bedName ?? 'No bed yet';
    groups.set(key, [...(groups.get(key) ?? []), p]);
  }
  const slotOrder = (p: PlantingJson) => PLANTING_SLOTS.indexOf(p.slot);
  return (
    <div className="mt-3 grid gap-4" data-testid="planting-groups">
      {remove.isError ? <Alert message={remove.error.message} /> : null}
      {[...groups].map(([bedName, items]) => (
        <section key={bedName} className="card" aria-label={bedName} data-testid="planting-group">
          <h3 className="text-xl font-extrabold">{bedName}</h3>
          <ul className="mt-2 grid gap-3">
            {[...items].sort((a, b) => slotOrder(a) - slotOrder(b)).map((p) =>
              editing === p.id && frost ? (
                <li key={p.id}>
                  <PlantingForm {...ctx} year={list.year} frost={frost} planting={p} onCancel={() => setEditing(null)} onSaved={async (m) => { setEditing(null); await onChanged(m); }} />
                </li>
              ) : (
                <li key={p.id} className="border-t border-loam-200 pt-2 first:border-0 first:pt-0" data-testid="planting">
                  <p className="text-lg">
                    <span className="font-bold">{p.cropName}</span> · {formatAmount(p.area)} {ctx.unit} · {PLANTING_SLOT_LABELS[p.slot]}
                    {p.fromPlan ? <span className="ml-2 rounded-full bg-rind-100 px-2 py-0.5 text-sm font-semibold">from the plan</span> : null}
                  </p>
                  <p className="text-sm text-loam-700">
                    {p.sowDate ? `Sown ${p.sowDate}. ` : ''}
                    {p.harvestFrom || p.harvestTo ? `Harvest expected ${p.harvestFrom ?? '?'} to ${p.harvestTo ?? '?'}. ` : 'No harvest window. '}
                    {p.harvestedKg > 0 ? `${formatAmount(p.harvestedKg)} kg harvested so far.` : ''}
                    {p.notes ? ` ${p.notes}` : ''}
                  </p>
                  {canWrite ? (
                    <div className="mt-1 flex flex-wrap gap-2">
                      <button type="button" className="btn-quiet min-h-12 px-3" onClick={() => setEditing(p.id)} aria-label={`Change the planting of ${p.cropName}`}>Change</button>
                      <ConfirmDelete what={`the planting of ${p.cropName}`} busy={remove.isPending} onConfirm={() => remove.mutate(p)} />
                    </div>
                  ) : null}
                </li>
              ),
            )}
          </ul>
        </section>
      ))}
    </div>
  );
}

function AddPlanting(props: PlantingContext & { year: number; frost: SeasonJson['season']; onSaved: (m: string) => Promise<void> }) {
  const [open, setOpen] = useState(false);
  if (!open) return <button type="button" className="btn-primary mt-4" onClick={() => setOpen(true)}>Add a planting</button>;
  return <PlantingForm {...props} onCancel={() => setOpen(false)} onSaved={async (m) => { setOpen(false); await props.onSaved(m); }} />;
}

function PlantingForm({ base, beds, unit, crops, referenceCrops, year, frost, planting, onSaved, onCancel }: PlantingContext & { year: number; frost: SeasonJson['season']; planting?: PlantingJson; onSaved: (m: string) => Promise<void>; onCancel: () => void }) {
  const editing = planting !== undefined;
  const form = useForm<PlantingFormValues, unknown, Record<string, unknown>>({ resolver: plantingResolver, context: { editing }, reValidateMode: 'onSubmit', defaultValues: plantingFormValues(year, planting) });
  const e = form.formState.errors;
  const id = (f: string) => `planting-${planting?.id ?? 'new'}-${f}`;
  const linked = new Set(crops.map((c) => c.name));
  const refOf = (choice: string, seasonYear: string) => {
    const key = choice.startsWith('ref:') ? choice.slice(4) : undefined;
    const ref = referenceCrops.find((r) => r.key === key) ?? referenceCrops.find((r) => r.key === planting?.referenceKey && choice === `crop:${planting.cropId}`);
    return expectedHarvest(ref, Number(seasonYear), frost);
  };
  // Choosing a crop or a season fills the expected harvest window from the reference row and the frost dates.
  const prefill = (choice: string, seasonYear: string) => {
    const w = refOf(choice, seasonYear);
    if (w) {
      form.setValue('harvestFrom', w.from);
      form.setValue('harvestTo', w.to);
    }
  };
  const submit = form.handleSubmit(async (body) => {
    try {
      await request(editing ? 'PATCH' : 'POST', editing ? `${base}/plantings/${planting.id}` : `${base}/plantings`, body);
      await onSaved(editing ? 'Planting saved.' : 'Planting added.');
    } catch (err) {
      showFailure(form, err);
    }
  });
  const cropReg = form.register('crop', { onChange: (ev: { target: { value: string } }) => prefill(ev.target.value, form.getValues('seasonYear')) });
  const yearReg = form.register('seasonYear', { onChange: (ev: { target: { value: string } }) => prefill(form.getValues('crop'), ev.target.value) });
  return (
    <form onSubmit={submit} noValidate className="card mt-3" aria-label={editing ? 'Change the planting' : 'Add a planting'}>
      <h3 className="text-lg font-bold">{editing ? `Change the planting of ${planting.cropName}` : 'Add a planting'}</h3>
      <div className="grid gap-x-4 sm:grid-cols-2">
        <FieldShell id={id('crop')} label="Crop" error={e.crop?.message} hint={editing ? undefined : 'A reference crop adds it to the household’s crops, linked to its yields and harvest weeks.'}>
          <select className="field" {...cropReg} {...invalidProps(id('crop'), e.crop?.message, !editing)}>
            <option value="">Choose a crop</option>
            <optgroup label="The household’s crops">
              {crops.map((c) => <option key={c.id} value={`crop:${c.id}`}>{c.displayName}</option>)}
              {planting && !crops.some((c) => c.id === planting.cropId) ? <option value={`crop:${planting.cropId}`}>{planting.cropName}</option> : null}
            </optgroup>
            {editing ? null : (
              <optgroup label="Reference crops">
                {referenceCrops.filter((r) => !linked.has(r.name)).map((r) => <option key={r.key} value={`ref:${r.key}`}>{r.name}</option>)}
              </optgroup>
            )}
          </select>
        </FieldShell>
        <FieldShell id={id('bedId')} label="Bed" error={e.bedId?.message}>
          <select className="field" {...form.register('bedId')} {...invalidProps(id('bedId'), e.bedId?.message)}>
            <option value="">No bed yet</option>
            {beds.map((b) => <option key={b.id} value={String(b.id)}>{b.name}</option>)}
          </select>
        </FieldShell>
        <FieldShell id={id('area')} label={`Area, ${unit}`} error={e.area?.message}>
          <input className="field" inputMode="decimal" {...form.register('area')} {...invalidProps(id('area'), e.area?.message)} />
        </FieldShell>
        <FieldShell id={id('seasonYear')} label="Season year" error={e.seasonYear?.message}>
          <input className="field" inputMode="numeric" {...yearReg} {...invalidProps(id('seasonYear'), e.seasonYear?.message)} />
        </FieldShell>
        <FieldShell id={id('slot')} label="Slot" error={e.slot?.message}>
          <select className="field" {...form.register('slot')} {...invalidProps(id('slot'), e.slot?.message)}>
            {PLANTING_SLOTS.map((s) => <option key={s} value={s}>{PLANTING_SLOT_LABELS[s]}</option>)}
          </select>
        </FieldShell>
        <FieldShell id={id('sowDate')} label="Sowing date (optional)" error={e.sowDate?.message}>
          <input type="date" className="field" {...form.register('sowDate')} {...invalidProps(id('sowDate'), e.sowDate?.message)} />
        </FieldShell>
        <FieldShell id={id('harvestFrom')} label="Harvest expected from" error={e.harvestFrom?.message}>
          <input type="date" className="field" {...form.register('harvestFrom')} {...invalidProps(id('harvestFrom'), e.harvestFrom?.message)} />
        </FieldShell>
        <FieldShell id={id('harvestTo')} label="Harvest expected until" error={e.harvestTo?.message}>
          <input type="date" className="field" {...form.register('harvestTo')} {...invalidProps(id('harvestTo'), e.harvestTo?.message)} />
        </FieldShell>
      </div>
      <FieldShell id={id('notes')} label="Notes (optional)" error={e.notes?.message}>
        <input className="field" {...form.register('notes')} {...invalidProps(id('notes'), e.notes?.message)} />
      </FieldShell>
      <div className="mt-4 flex flex-wrap gap-2">
        <button type="submit" className="btn-primary" disabled={form.formState.isSubmitting}>{editing ? 'Save planting' : 'Add planting'}</button>
        <button type="button" className="btn-quiet" onClick={onCancel}>Cancel</button>
      </div>
      <Alert message={formMessage(form)} />
    </form>
  );
}

function Yields({ list }: { list: PlantingListJson }) {
  return (
    <section aria-labelledby="yields-h">
      <h2 id="yields-h" className="text-2xl font-extrabold">Yield in {list.year}: yours beside the reference</h2>
      <p className="mt-1 max-w-2xl text-sm text-loam-700">
        Your yield is the weight of harvests that name a planting, divided by those plantings’ area; the reference is the typical yield of the crop’s row in Selfsown’s crop table, with its source.
      </p>
      <table className="mt-3 w-full text-left" data-testid="yields">
        <thead>
          <tr className="border-b border-loam-200">
            <th className="py-2 pr-3">Crop</th>
            <th className="py-2 pr-3">Yours, kg/m²</th>
            <th className="py-2">Reference, kg/m²</th>
          </tr>
        </thead>
        <tbody>
          {list.yields.map((y) => (
            <tr key={y.cropId} className="border-b border-loam-100">
              <td className="py-2 pr-3 font-semibold">{y.cropName}</td>
              <td className="py-2 pr-3">{y.ownKgPerM2 === null ? 'not measured yet' : `${formatAmount(y.ownKgPerM2)} (${formatAmount(y.harvestedKg)} kg from ${formatAmount(y.measuredAreaM2)} m²)`}</td>
              <td className="py-2" title={y.referenceSource ?? undefined}>{y.referenceKgPerM2 === null ? 'no reference row' : formatAmount(y.referenceKgPerM2)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </section>
  );
}
