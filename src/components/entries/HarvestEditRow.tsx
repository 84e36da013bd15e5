/**
 * The harvest log's inline edit: crop (or, for a harvest logged against a reference food, that
 * food, with a food picker beside the crop select), amount and unit, use, date, months in store
 * (stored and preserved), preserving method (preserved), trimmed and note. A part of a split
 * weighing says that a new crop or date moves the whole weighing (src/lib/split-weighing.ts).
 * A saved change is offered for Undo; a lot's larder records are read first, since taking it out
 * of store removes them.
 */
import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { harvestPatch, isSpreadUse, USE_LABELS, USES, type Use } from '@/lib/entry-schemas';
import { PRESERVE_METHODS, type PreserveMethod } from '@/lib/retention';
import type { EntryUnit } from '@/lib/entry-units';
import { foodDetail, get, keys, urls, type Crop, type Harvest, type HouseholdInfo } from './api';
import { EditRowShell, useEntryPatch } from './EditEntryRow';
import { FoodPicker, type FoodChoice } from './FoodPicker';
import { formatDay } from './local-date';
import { PRESERVE_METHOD_LABELS } from './PreserveField';
import { parseDecimal, trimNumber } from './quantity-text';
import { ErrorText, invalidProps, UnitSelect } from './ui';
import { outcomesOf, useEntryUndo } from './use-entry-undo';
import { cropWeighBasis, foodWeighBasis } from './unit-basis';
import { UnitWeightNote } from './WeightField';

export function HarvestEditRow({ entry: harvest, colSpan, household, onDone }: { entry: Harvest; colSpan: number; household: HouseholdInfo; onDone: () => void }) {
  const hid = household.id;
  const crops = useQuery({ queryKey: keys.crops(hid, true), queryFn: () => get<{ crops: Crop[] }>(urls(hid).crops(true)).then((r) => r.crops) });
  const [cropId, setCropId] = useState(harvest.cropId === null ? '' : String(harvest.cropId));
  const [quantity, setQuantity] = useState(trimNumber(harvest.quantity, 3));
  const [unit, setUnit] = useState<EntryUnit>(harvest.unit);
  const [use, setUse] = useState<Use>(harvest.use);
  const [date, setDate] = useState(harvest.date);
  const [spread, setSpread] = useState(isSpreadUse(harvest.use) ? String(harvest.spreadMonths) : '');
  const [method, setMethod] = useState<PreserveMethod | ''>(harvest.preserveMethod ?? '');
  const [trimmed, setTrimmed] = useState(harvest.trimmed);
  const [note, setNote] = useState(harvest.note ?? '');
  // Only a harvest logged against a reference food has one to change (a crop's food follows the crop).
  const [food, setFood] = useState<FoodChoice | null>(harvest.cropId === null && harvest.foodId !== null ? { id: harvest.foodId, name: harvest.foodName ?? '', code: harvest.foodCode ?? '' } : null);
  const onFood = harvest.cropId === null && cropId === '';
  const outcomes = useQuery({ queryKey: ['larder-outcomes', hid, harvest.id], queryFn: () => outcomesOf(hid, harvest), enabled: isSpreadUse(harvest.use) });
  const invalidate = [keys.harvests(hid), keys.allCrops(hid)];
  const offerUndo = useEntryUndo(hid, invalidate);
  const { errors, send, saving } = useEntryPatch<{ harvest: Harvest }>(harvestPatch, urls(hid).harvest(harvest.id), invalidate, onDone, (r) =>
    offerUndo(`Changes saved to ${r.harvest.cropName ?? r.harvest.foodName} of ${formatDay(r.harvest.date)}`, {
      kind: 'harvest-edited',
      before: harvest,
      after: r.harvest,
      outcomes: outcomes.data ?? [],
    }),
  );
  const p = `edit-${harvest.id}`;
  // What a count or volume would be weighed from: the chosen crop, or the entry's own food.
  const basisFoodId = food?.id ?? harvest.foodId;
  const foodInfo = useQuery({ queryKey: keys.food(basisFoodId ?? 0), queryFn: () => foodDetail(basisFoodId!), enabled: cropId === '' && basisFoodId !== null, staleTime: 10 * 60_000 });
  const basis = cropId !== '' ? cropWeighBasis(crops.data?.find((c) => c.id === Number(cropId))) : foodWeighBasis(foodInfo.data);

  function submit() {
    send({
      quantity: parseDecimal(quantity),
      unit,
      use,
      note,
      trimmed,
      // Crop and date only when changed: on a split part they move every part of the weighing.
      // A new crop leaves the old crop's planting behind (the API refuses a planting of another crop).
      ...(cropId !== '' && Number(cropId) !== harvest.cropId ? { cropId: Number(cropId), plantingId: null } : {}),
      ...(onFood && food && food.id !== harvest.foodId ? { foodId: food.id } : {}),
      ...(date !== harvest.date ? { date } : {}),
      // Blank months: kept as stored, or after a change of use the new use's default (the crop's usual).
      ...(isSpreadUse(use) && spread !== '' ? { spreadMonths: parseDecimal(spread) } : {}),
      ...(use === 'preserved' ? { preserveMethod: method === '' ? null : method } : {}),
    });
  }

  return (
    <EditRowShell
      colSpan={colSpan}
      label={`Edit ${harvest.cropName ?? 'harvest'} of ${harvest.date}`}
      title={`Editing ${harvest.cropName ?? harvest.foodName}`}
      layout={{ grid: 'sm:grid-cols-4', span: 'sm:col-span-4' }}
      saving={saving}
      formError={errors._form}
      // A cleared food picker never quietly keeps the old food: choose one, or Cancel keeps it.
      blocked={onFood && !food ? `Choose the reference food (or a crop) to save, or Cancel to keep ${harvest.foodName ?? 'the food'}.` : undefined}
      onSubmit={submit}
      onCancel={onDone}
    >
      {harvest.splitGroup ? (
        <p className="text-sm text-loam-700 sm:col-span-4" data-testid="split-edit-hint">
          Part of a split weighing: a new crop or date changes every part; amount, use and the rest change this part only.
        </p>
      ) : null}
      <div className="sm:col-span-2">
        <label htmlFor={`${p}-crop`} className="block text-sm font-semibold">
          Crop
        </label>
        <select {...invalidProps(`${p}-crop`, errors.cropId)} className="field mt-1" value={cropId} onChange={(e) => setCropId(e.target.value)}>
          {harvest.cropId === null ? <option value="">A reference food, not a crop</option> : null}
          {(crops.data ?? []).filter((c) => !c.archived || c.id === harvest.cropId).map((c) => (
            <option key={c.id} value={c.id}>
              {c.displayName}
            </option>
          ))}
        </select>
        <ErrorText id={`${p}-crop`} error={errors.cropId} />
      </div>
      {onFood ? (
        <div className="sm:col-span-2">
          <FoodPicker id={`${p}-food`} label="Reference food" value={food} onChange={setFood} error={errors.foodId} facts={false} compact />
        </div>
      ) : null}
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
        <UnitSelect id={`${p}-unit`} value={unit} onChange={setUnit} error={errors.unit} />
        <ErrorText id={`${p}-unit`} error={errors.unit} />
      </div>
      <div className="sm:col-span-4 empty:hidden">
        <UnitWeightNote unit={unit} basis={basis} quantity={parseDecimal(quantity)} units={household.units} />
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
      {isSpreadUse(use) ? (
        <div>
          <label htmlFor={`${p}-spreadMonths`} className="block text-sm font-semibold">
            Months in store
          </label>
          <input
            {...invalidProps(`${p}-spreadMonths`, errors.spreadMonths)}
            type="text"
            inputMode="numeric"
            placeholder="crop's usual"
            className="field mt-1"
            value={spread}
            onChange={(e) => setSpread(e.target.value.replace(/[^\d]/g, ''))}
          />
          <ErrorText id={`${p}-spreadMonths`} error={errors.spreadMonths} />
        </div>
      ) : null}
      {use === 'preserved' ? (
        <div>
          <label htmlFor={`${p}-preserveMethod`} className="block text-sm font-semibold">
            Preserved by
          </label>
          <select {...invalidProps(`${p}-preserveMethod`, errors.preserveMethod)} className="field mt-1" value={method} onChange={(e) => setMethod(e.target.value as PreserveMethod | '')}>
            <option value="">Not said</option>
            {PRESERVE_METHODS.map((m) => (
              <option key={m} value={m}>
                {PRESERVE_METHOD_LABELS[m]}
              </option>
            ))}
          </select>
          <ErrorText id={`${p}-preserveMethod`} error={errors.preserveMethod} />
        </div>
      ) : null}
      <div className="flex items-end">
        <label className="flex min-h-11 items-center gap-2 font-semibold">
          <input type="checkbox" className="size-5" checked={trimmed} onChange={(e) => setTrimmed(e.target.checked)} />
          Weighed trimmed
        </label>
      </div>
      <div className="sm:col-span-2">
        <label htmlFor={`${p}-note`} className="block text-sm font-semibold">
          Note
        </label>
        <input {...invalidProps(`${p}-note`, errors.note)} type="text" className="field mt-1" maxLength={500} value={note} onChange={(e) => setNote(e.target.value)} />
        <ErrorText id={`${p}-note`} error={errors.note} />
      </div>
    </EditRowShell>
  );
}
