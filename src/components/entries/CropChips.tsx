/**
 * "What did you harvest?": big buttons for the crops a grower reaches for first — pinned ones
 * (marked with a plant label), then the most used — and a list of all the others below them. The
 * chosen crop keeps a button even when it came from the list. "Arrange" opens the panel that pins
 * and orders them (ChipArrange).
 */
import { useRef, useState } from 'react';
import type { Crop } from './api';
import { ChipArrange } from './ChipArrange';
import { lastHarvestText, type OrderedCrop } from './crop-order';
import { Icon } from '@/components/icons/Icon';
import { ErrorText } from './ui';
import { countText } from '@/lib/plural';

/** How many crops get a big button of their own; the rest are in a list below them. */
const CHIP_COUNT = 8;

interface Props {
  ordered: OrderedCrop[];
  value: number | null;
  today: string;
  error: string | undefined;
  onPick: (id: number) => void;
  householdId: number;
  /** The crops after the grower saved a new arrangement (the chips take its order at once). */
  onArranged: (crops: Crop[]) => void;
}

export function CropChips({ ordered, value, today, error, onPick, householdId, onArranged }: Props) {
  const [arranging, setArranging] = useState(false);
  const arrangeButton = useRef<HTMLButtonElement>(null);
  // Closing the panel takes its buttons away: the focus goes back to the button that opened it.
  const closeArranging = () => {
    setArranging(false);
    arrangeButton.current?.focus();
  };
  const chips = ordered.slice(0, CHIP_COUNT);
  const chosenOutside = value !== null && !chips.some((c) => c.crop.id === value) ? ordered.find((o) => o.crop.id === value) : undefined;
  const shown = chosenOutside ? [...chips, chosenOutside] : chips;
  const more = ordered.slice(CHIP_COUNT);
  return (
    <div>
      <fieldset aria-describedby={error ? 'cropId-error' : undefined}>
        <legend className="text-lg font-bold">What did you harvest?</legend>
        <div className="mt-2 grid grid-cols-2 gap-2 sm:grid-cols-4" data-field="cropId" data-testid="crop-chips" tabIndex={-1}>
          {shown.map(({ crop: c, recent, inSeason, pinned }) => {
            const on = c.id === value;
            return (
              <label
                key={c.id}
                data-testid="crop-chip"
                className={`relative flex min-h-16 cursor-pointer flex-col justify-center rounded-xl border px-3 py-2 leading-tight has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-focus ${
                  on ? 'border-sprout-700 bg-sprout-100 ring-2 ring-sprout-700' : 'border-loam-200 bg-white hover:bg-loam-100'
                }`}
              >
                <input type="radio" className="sr-only" name="cropId" value={c.id} checked={on} onChange={() => onPick(c.id)} />
                <span className="pr-5 font-bold">{c.name}</span>
                {c.variety ? <span className="text-sm">{c.variety}</span> : null}
                <span className="text-xs text-loam-700">
                  {recent && c.lastHarvestDate ? lastHarvestText(c.lastHarvestDate, today) : inSeason ? 'in season' : c.notFood ? 'not food' : '\u00a0'}
                </span>
                {pinned ? (
                  <span className="absolute right-2 top-2 text-sprout-700">
                    <Icon name="stake" size={16} />
                    <span className="sr-only">, pinned</span>
                  </span>
                ) : null}
              </label>
            );
          })}
        </div>
        {more.length > 0 ? (
          <div className="mt-3">
            <label htmlFor="crop-more" className="text-sm font-semibold text-loam-700">
              Another crop
            </label>
            <select id="crop-more" className="field mt-1" value={chosenOutside ? String(value) : ''} onChange={(e) => e.target.value && onPick(Number(e.target.value))}>
              <option value="">{ordered.length === 1 ? 'Choose the crop…' : `Choose from all ${countText(ordered.length, 'crop')}…`}</option>
              {ordered.map(({ crop: c }) => (
                <option key={c.id} value={c.id}>
                  {c.displayName}
                </option>
              ))}
            </select>
          </div>
        ) : null}
        <ErrorText id="cropId" error={error} />
      </fieldset>
      {ordered.length > 1 ? (
        <button ref={arrangeButton} type="button" className="link mt-1 gap-2" aria-expanded={arranging} onClick={() => setArranging((a) => !a)}>
          <Icon name="stake" size={20} />
          {arranging ? 'Close arranging' : 'Arrange: pin and order crops'}
        </button>
      ) : null}
      {arranging ? (
        <ChipArrange
          crops={ordered.map((o) => o.crop)}
          householdId={householdId}
          onClose={closeArranging}
          onSaved={(crops) => {
            onArranged(crops);
            closeArranging();
          }}
        />
      ) : null}
    </div>
  );
}
