/**
 * "What did you harvest?": big buttons for the crops a grower reaches for first, and a list of all
 * the others below them. The chosen crop keeps a button even when it came from the list.
 */
import { lastHarvestText, type OrderedCrop } from './crop-order';
import { ErrorText } from './ui';
import { countText } from '@/lib/plural';

/** How many crops get a big button of their own; the rest are in a list below them. */
const CHIP_COUNT = 8;

export function CropChips({ ordered, value, today, error, onPick }: { ordered: OrderedCrop[]; value: number | null; today: string; error: string | undefined; onPick: (id: number) => void }) {
  const chips = ordered.slice(0, CHIP_COUNT);
  const chosenOutside = value !== null && !chips.some((c) => c.crop.id === value) ? ordered.find((o) => o.crop.id === value) : undefined;
  const shown = chosenOutside ? [...chips, chosenOutside] : chips;
  const more = ordered.slice(CHIP_COUNT);
  return (
    <fieldset aria-describedby={error ? 'cropId-error' : undefined}>
      <legend className="text-lg font-bold">What did you harvest?</legend>
      <div className="mt-2 grid grid-cols-2 gap-2 sm:grid-cols-4" data-field="cropId" tabIndex={-1}>
        {shown.map(({ crop: c, recent, inSeason }) => {
          const on = c.id === value;
          return (
            <label
              key={c.id}
              className={`flex min-h-16 cursor-pointer flex-col justify-center rounded-xl border px-3 py-2 leading-tight has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-focus ${
                on ? 'border-sprout-700 bg-sprout-100 ring-2 ring-sprout-700' : 'border-loam-200 bg-white hover:bg-loam-100'
              }`}
            >
              <input type="radio" className="sr-only" name="cropId" value={c.id} checked={on} onChange={() => onPick(c.id)} />
              <span className="font-bold">{c.name}</span>
              {c.variety ? <span className="text-sm">{c.variety}</span> : null}
              <span className="text-xs text-loam-700">
                {recent && c.lastHarvestDate ? lastHarvestText(c.lastHarvestDate, today) : inSeason ? 'in season' : c.notFood ? 'not food' : '\u00a0'}
              </span>
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
  );
}
