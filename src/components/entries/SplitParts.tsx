/**
 * The split editor: one weighing shared between uses ("20 kg stored, 2 kg fresh"). Each part has
 * its weight and use; the last part takes the rest of the weighing, so the parts always add up.
 * The parts are a react-hook-form field array of the harvest form.
 */
import { Controller, useFieldArray, type Control } from 'react-hook-form';
import type { Use } from '@/lib/entry-schemas';
import { ENTRY_UNIT_NAMES, type EntryUnit } from '@/lib/entry-units';
import type { HarvestBody, HarvestFormContext, HarvestFormValues, PartValues } from './harvest-form-values';
import { trimNumber } from './quantity-text';
import { ErrorText, invalidProps, UseChips, type Errors } from './ui';

/** A split has at most this many parts (the schema's limit). */
const MAX_PARTS = 7;

interface SplitPartsProps {
  control: Control<HarvestFormValues, HarvestFormContext, HarvestBody>;
  unit: EntryUnit;
  /** The weight left for the last part, undefined until the whole weighing is a number. */
  rest: number | undefined;
  errors: Errors;
  disabledUses: readonly Use[];
  /** A new part, with a fresh id, for "Add a part". */
  newPart: () => PartValues;
}

export function SplitParts({ control, unit, rest, errors, disabledUses, newPart }: SplitPartsProps) {
  const { fields, insert, remove } = useFieldArray({ control, name: 'parts' });
  return (
    <fieldset className="mt-5 rounded-2xl border border-loam-200 bg-loam-50 p-3">
      <legend className="px-1 text-lg font-bold">Split between uses</legend>
      <p className="text-sm text-loam-700">Enter the parts; the last part takes the rest of the weighing. They are saved together.</p>
      <ol className="mt-2 space-y-3">
        {fields.map((p, i) => {
          const last = i === fields.length - 1;
          const qid = `parts.${i}.quantity`;
          const qErr = errors[qid];
          const inputId = `part-${p.pid}-qty`;
          return (
            <li key={p.id} className="rounded-xl border border-loam-200 bg-white p-3">
              <div className="flex flex-wrap items-end gap-2">
                <div className="w-36">
                  <label htmlFor={inputId} className="block text-sm font-semibold">
                    Part {i + 1}
                    {last ? ' (the rest)' : ''}
                  </label>
                  {last ? (
                    <output id={inputId} data-field={qid} tabIndex={-1} aria-describedby={qErr ? `${inputId}-error` : undefined} className="field mt-1 flex items-center justify-end bg-loam-100 text-2xl font-extrabold tabular-nums">
                      {rest === undefined ? '—' : trimNumber(rest, 3)}
                    </output>
                  ) : (
                    <Controller
                      control={control}
                      name={`parts.${i}.quantity`}
                      render={({ field }) => (
                        <input
                          {...invalidProps(inputId, qErr)}
                          data-field={qid}
                          type="text"
                          inputMode="decimal"
                          autoComplete="off"
                          className="field mt-1 text-right text-2xl font-extrabold tabular-nums"
                          value={field.value}
                          onChange={(e) => field.onChange(e.target.value)}
                        />
                      )}
                    />
                  )}
                </div>
                <span className="pb-3 text-lg font-bold">{ENTRY_UNIT_NAMES[unit]}</span>
                {fields.length > 2 && !last ? (
                  <button type="button" className="btn-quiet ml-auto min-h-12 px-3" onClick={() => remove(i)} aria-label={`Remove part ${i + 1}`}>
                    Remove
                  </button>
                ) : null}
              </div>
              <ErrorText id={inputId} error={qErr} />
              <Controller
                control={control}
                name={`parts.${i}.use`}
                render={({ field }) => <UseChips name={`parts.${i}.use`} legend={`Part ${i + 1} is`} value={field.value} onChange={field.onChange} disabled={disabledUses} error={errors[`parts.${i}.use`]} />}
              />
            </li>
          );
        })}
      </ol>
      {fields.length < MAX_PARTS ? (
        // A new part goes before the last one, which always takes the rest.
        <button type="button" className="btn-quiet mt-3" onClick={() => insert(Math.max(fields.length - 1, 0), newPart())}>
          Add a part
        </button>
      ) : null}
      <ErrorText id="parts" error={errors.parts} />
    </fieldset>
  );
}
