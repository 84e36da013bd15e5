/**
 * The big weight field with its g / kg / oz / lb toggle, sized for a thumb in the garden (the
 * weight is typed as text, so a decimal comma works). Used by the harvest and bought-food forms.
 */
import type { UseFormRegisterReturn } from 'react-hook-form';
import type { WeightUnit } from '@/lib/units';
import { ErrorText, invalidProps, UnitToggle } from './ui';

interface WeightFieldProps {
  id: string;
  label: string;
  /** The input's react-hook-form registration (name, ref, change and blur). */
  input: UseFormRegisterReturn;
  error: string | undefined;
  unitName: string;
  unit: WeightUnit;
  onUnit: (u: WeightUnit) => void;
  enterKeyHint?: 'done';
}

export function WeightField({ id, label, input, error, unitName, unit, onUnit, enterKeyHint }: WeightFieldProps) {
  return (
    <div className="mt-5">
      <label htmlFor={id} className="block text-lg font-bold">
        {label}
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
        <div className="w-full sm:w-64">
          <UnitToggle name={unitName} value={unit} onChange={onUnit} label="Weight unit" />
        </div>
      </div>
      <ErrorText id={id} error={error} />
    </div>
  );
}
