/**
 * The big amount field with its unit toggle (g / kg / oz / lb, and counts and volumes beside), sized
 * for a thumb in the garden (typed as text, so a decimal comma works). For a count or volume it says,
 * before saving, what the amount weighs and where that weight comes from — or that there is none
 * and what to do. Used by the harvest and bought-food forms.
 */
import type { UseFormRegisterReturn } from 'react-hook-form';
import { noWeightMessage, unitWeight, type CountVolumeBasis } from '@/lib/count-volume';
import { entryQuantityText, isCountUnit, type EntryUnit } from '@/lib/entry-units';
import { formatWeight, isWeightUnit, type UnitSystem } from '@/lib/units';
import { ErrorText, invalidProps, UnitToggle } from './ui';

interface WeightFieldProps {
  id: string;
  /** The label for a weight ("Weight", "Whole weighing"); a count reads "How many", a volume "Volume". */
  label: string;
  /** The input's react-hook-form registration (name, ref, change and blur). */
  input: UseFormRegisterReturn;
  error: string | undefined;
  unitName: string;
  unit: EntryUnit;
  onUnit: (u: EntryUnit) => void;
  enterKeyHint?: 'done';
  /** What a count or volume is weighed from (null until the crop or food is chosen), the amount typed and the household's units. */
  weigh?: { basis: CountVolumeBasis | null; quantity: number | undefined; units: UnitSystem };
}

export function WeightField({ id, label, input, error, unitName, unit, onUnit, enterKeyHint, weigh }: WeightFieldProps) {
  const shown = isWeightUnit(unit) ? label : isCountUnit(unit) ? 'How many' : 'Volume';
  return (
    <div className="mt-5">
      <label htmlFor={id} className="block text-lg font-bold">
        {shown}
      </label>
      <div className="mt-1 flex flex-wrap items-stretch gap-2">
        <input
          {...invalidProps(id, error)}
          {...input}
          type="text"
          inputMode="decimal"
          autoComplete="off"
          enterKeyHint={enterKeyHint}
          placeholder="0"
          className={`field min-h-16 w-40 flex-1 text-right text-4xl font-extrabold tabular-nums placeholder:font-normal placeholder:text-loam-200 ${error ? 'border-berry-700 ring-1 ring-berry-700' : ''}`}
        />
        <div className="w-full sm:w-auto sm:min-w-80">
          <UnitToggle name={unitName} value={unit} onChange={onUnit} label="Weight unit" />
        </div>
      </div>
      {weigh ? <UnitWeightNote unit={unit} {...weigh} /> : null}
      <ErrorText id={id} error={error} />
    </div>
  );
}

/**
 * Beside a count or volume: "12 pieces ≈ 600 g · USDA SR28 01123, 1 large = 50 g", or, when
 * nothing gives a weight, what to do before saving. Nothing for a weight or before the crop or food is chosen.
 */
export function UnitWeightNote({ unit, basis, quantity, units }: { unit: EntryUnit; basis: CountVolumeBasis | null; quantity: number | undefined; units: UnitSystem }) {
  if (isWeightUnit(unit) || !basis) return null;
  const w = unitWeight(unit, basis);
  if (!w) {
    return (
      <p className="mt-2 rounded-xl bg-berry-700/10 p-2 text-sm font-semibold text-berry-700" data-testid="unit-note" aria-live="polite">
        {noWeightMessage(unit, basis)}
      </p>
    );
  }
  const amount = quantity !== undefined && Number.isFinite(quantity) && quantity > 0 ? `${entryQuantityText(quantity, unit)} ≈ ${formatWeight(quantity * w.gramsPerUnit, units)} · ` : '';
  return (
    <p className="mt-2 text-sm text-loam-700" data-testid="unit-note">
      {amount}
      {w.source}
      {w.from === 'food' ? ' (edible portion)' : ''}
    </p>
  );
}
