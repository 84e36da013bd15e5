/**
 * "Eaten over how many months?" for stored and preserved harvests: whole months only, blank for
 * the crop's usual (shown, per use, in the hint and as the placeholder).
 */
import type { Use } from '@/lib/entry-schemas';
import { ErrorText, invalidProps } from './ui';
import { countText } from '@/lib/plural';

interface SpreadFieldProps {
  value: string;
  onChange: (value: string) => void;
  /** The spread uses in the form (at least one), and each one's usual months for the chosen crop. */
  uses: readonly Use[];
  usual: ((use: Use) => number) | undefined;
  error: string | undefined;
}

export function SpreadField({ value, onChange, uses, usual, error }: SpreadFieldProps) {
  return (
    <div className="mt-4">
      <label htmlFor="spreadMonths" className="block font-semibold">
        Eaten over how many months?
      </label>
      <p id="spreadMonths-hint" className="text-sm text-loam-700">
        {usual
          ? `Leave empty for this crop's usual: ${[...new Set(uses)].map((u) => `${countText(usual(u), 'month')} ${u}`).join(', ')}.`
          : 'Stored and preserved food is counted in the months it is eaten.'}
      </p>
      <input
        {...invalidProps('spreadMonths', error, true)}
        name="spreadMonths"
        type="text"
        inputMode="numeric"
        className="field mt-1 w-32 text-xl"
        placeholder={usual ? String(usual(uses[0]!)) : ''}
        value={value}
        onChange={(e) => onChange(e.target.value.replace(/[^\d]/g, ''))}
      />
      <ErrorText id="spreadMonths" error={error} />
    </div>
  );
}
