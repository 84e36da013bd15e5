/**
 * "How was it preserved?" for a preserved harvest: frozen, canned, dried or fermented, or not said.
 * The method sets how much of the vitamins the share report keeps (the USDA Table of Nutrient
 * Retention Factors, Release 6, in reference-data/retention.csv); not said, none are reduced.
 */
import { PRESERVE_METHODS, type PreserveMethod } from '@/lib/retention';
import { ErrorText } from './ui';

/** Our words for the methods. Example: `PRESERVE_METHOD_LABELS.dried` → 'Dried' */
export const PRESERVE_METHOD_LABELS: Readonly<Record<PreserveMethod, string>> = {
  frozen: 'Frozen',
  canned: 'Canned (bottled)',
  dried: 'Dried',
  fermented: 'Fermented',
};

const chip = 'flex min-h-12 cursor-pointer items-center justify-center rounded-xl border px-3 text-center font-semibold';

export function PreserveField({ value, onChange, error }: { value: PreserveMethod | ''; onChange: (v: PreserveMethod | '') => void; error: string | undefined }) {
  const options: (PreserveMethod | '')[] = [...PRESERVE_METHODS, ''];
  return (
    <fieldset className="mt-4" data-field="preserveMethod" aria-describedby={error ? 'preserveMethod-error' : 'preserveMethod-hint'}>
      <legend className="font-semibold">How was it preserved?</legend>
      <p id="preserveMethod-hint" className="text-sm text-loam-700">
        Preserving loses some vitamins (vitamin C and folate most); the method says how much.
      </p>
      <div className="mt-2 grid grid-cols-2 gap-2 sm:grid-cols-5">
        {options.map((m) => (
          <label key={m || 'none'} className={`${chip} ${value === m ? 'border-sprout-700 bg-sprout-700 text-white' : 'border-loam-200 bg-white text-loam-900'}`}>
            <input type="radio" className="sr-only" name="preserveMethod" value={m} checked={value === m} onChange={() => onChange(m)} />
            {m ? PRESERVE_METHOD_LABELS[m] : 'Not said'}
          </label>
        ))}
      </div>
      <ErrorText id="preserveMethod" error={error} />
    </fieldset>
  );
}
