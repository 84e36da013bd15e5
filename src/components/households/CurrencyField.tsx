/**
 * The household's currency: a three-letter ISO 4217 code typed or picked from a short list of
 * common ones (the browser's datalist). Bought food starts with it; blank means none yet, and then
 * the first purchase with a currency sets it.
 */
import type { UseFormRegisterReturn } from 'react-hook-form';
import { COMMON_CURRENCIES } from '@/lib/currency';
import { FieldError, invalidProps } from '@/components/forms';

export function CurrencyField({ registration, error, hint }: { registration: UseFormRegisterReturn; error?: string | undefined; hint: string }) {
  return (
    <div className="mt-4">
      <label htmlFor="currency" className="block font-semibold">
        Currency of bought food
      </label>
      <p id="currency-hint" className="text-sm text-loam-700">
        {hint}
      </p>
      <input
        {...registration}
        {...invalidProps('currency', error, true)}
        type="text"
        list="currency-codes"
        maxLength={3}
        autoCapitalize="characters"
        autoComplete="off"
        placeholder="e.g. EUR"
        className={`field mt-1 w-32 uppercase ${error ? 'border-berry-700 ring-1 ring-berry-700' : ''}`}
      />
      <datalist id="currency-codes">
        {COMMON_CURRENCIES.map((c) => (
          <option key={c} value={c} />
        ))}
      </datalist>
      <FieldError id="currency" error={error} />
    </div>
  );
}
