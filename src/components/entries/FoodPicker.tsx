/**
 * Search-as-you-type for reference foods (TanStack Query, debounced; raw and whole forms come
 * first from the API), and the facts card that shows the chosen food's refuse and energy and
 * protein per 100 g, so the person can judge the match.
 */
import { keepPreviousData, useQuery } from '@tanstack/react-query';
import { useId, useState, type KeyboardEvent } from 'react';
import { formatAmount } from '@/lib/format-number';
import { foodDetail, keys, nutrientAmount, searchFoods, type FoodHit } from './api';
import { ErrorText, pct, useDebounced } from './ui';

export interface FoodChoice {
  id: number;
  name: string;
  code: string;
  dataset?: string;
  refusePct?: number | null;
}

interface FoodPickerProps {
  id: string;
  label: string;
  value: FoodChoice | null;
  onChange: (food: FoodChoice | null) => void;
  /** Words to search for until the person types their own (e.g. the crop's name). */
  suggestFor?: string;
  hint?: string;
  error?: string | undefined;
  /** Show the facts card for the chosen food. */
  facts?: boolean;
  compact?: boolean;
}

export function FoodPicker({ id, label, value, onChange, suggestFor = '', hint, error, facts = true, compact = false }: FoodPickerProps) {
  const [typed, setTyped] = useState<string | null>(null);
  const [open, setOpen] = useState(false);
  const [active, setActive] = useState(0);
  const listId = useId();
  const text = typed ?? suggestFor;
  const q = useDebounced(text.trim(), 250);
  const search = useQuery({
    queryKey: keys.foodSearch(q),
    queryFn: () => searchFoods(q),
    enabled: q.length >= 2 && !value,
    placeholderData: keepPreviousData,
    staleTime: 5 * 60_000,
  });
  const hits: FoodHit[] = q.length >= 2 ? (search.data ?? []) : [];
  const showList = !value && q.length >= 2 && (open || typed === null);

  function choose(f: FoodHit) {
    onChange({ id: f.id, name: f.name, code: f.code, dataset: f.dataset, refusePct: f.refusePct });
    setOpen(false);
    setTyped(null);
  }

  function onKey(e: KeyboardEvent<HTMLInputElement>) {
    if (e.key === 'ArrowDown') {
      e.preventDefault();
      setOpen(true);
      setActive((a) => Math.min(a + 1, Math.max(hits.length - 1, 0)));
    } else if (e.key === 'ArrowUp') {
      e.preventDefault();
      setActive((a) => Math.max(a - 1, 0));
    } else if (e.key === 'Enter' && showList && hits[active]) {
      e.preventDefault();
      choose(hits[active]);
    } else if (e.key === 'Escape') {
      setOpen(false);
    }
  }

  const hintId = hint ? `${id}-hint` : '';
  const errId = error ? `${id}-error` : '';

  if (value) {
    return (
      <div className={compact ? '' : 'mt-4'}>
        <span className="block font-semibold" id={`${id}-label`}>
          {label}
        </span>
        <div className="mt-1 rounded-xl border border-sprout-300 bg-sprout-100/50 p-3" data-testid={`${id}-chosen`}>
          <div className="flex flex-wrap items-start justify-between gap-2">
            <div>
              <div className="font-bold">{value.name}</div>
              <div className="text-sm text-loam-700">
                {value.dataset ? `${value.dataset.toUpperCase()} ` : ''}code {value.code}
              </div>
            </div>
            <button type="button" className="btn-quiet min-h-12 px-3" onClick={() => onChange(null)} aria-label={`Change ${label.toLowerCase()}`}>
              Change
            </button>
          </div>
          {facts ? <FoodFacts foodId={value.id} /> : null}
        </div>
        <ErrorText id={id} error={error} />
      </div>
    );
  }

  return (
    <div className={`relative ${compact ? '' : 'mt-4'}`}>
      <label htmlFor={id} className="block font-semibold">
        {label}
      </label>
      {hint ? (
        <p id={hintId} className="text-sm text-loam-700">
          {hint}
        </p>
      ) : null}
      <input
        id={id}
        name={id}
        type="search"
        role="combobox"
        autoComplete="off"
        className={`field mt-1 ${error ? 'border-berry-700 ring-1 ring-berry-700' : ''}`}
        placeholder="e.g. potatoes raw"
        value={text}
        aria-expanded={showList}
        aria-controls={listId}
        aria-autocomplete="list"
        aria-activedescendant={showList && hits[active] ? `${listId}-${hits[active].id}` : undefined}
        aria-invalid={error ? true : undefined}
        aria-describedby={[hintId, errId].filter(Boolean).join(' ') || undefined}
        onChange={(e) => {
          setTyped(e.target.value);
          setOpen(true);
          setActive(0);
        }}
        onFocus={() => setOpen(true)}
        onKeyDown={onKey}
      />
      <ErrorText id={id} error={error} />
      {showList ? (
        <ul id={listId} role="listbox" aria-label={`${label}: suggestions`} className="mt-1 max-h-80 overflow-auto rounded-xl border border-loam-200 bg-white shadow-md">
          {search.isFetching && hits.length === 0 ? <li className="px-4 py-3 text-loam-700">Searching…</li> : null}
          {!search.isFetching && search.isSuccess && hits.length === 0 ? <li className="px-4 py-3 text-loam-700">No reference food matches “{q}”. Try fewer or other words.</li> : null}
          {search.isError ? <li className="px-4 py-3 text-berry-700">The search did not answer: {(search.error as Error).message}</li> : null}
          {hits.map((f, i) => (
            <li
              key={f.id}
              id={`${listId}-${f.id}`}
              role="option"
              aria-selected={i === active}
              className={`flex min-h-12 cursor-pointer flex-col justify-center border-b border-loam-100 px-4 py-2 last:border-b-0 ${i === active ? 'bg-loam-100' : 'hover:bg-loam-50'}`}
              onMouseDown={(e) => e.preventDefault()}
              onClick={() => choose(f)}
            >
              <span className="font-semibold">{f.name}</span>
              <span className="text-sm text-loam-700">
                {f.dataset.toUpperCase()} · {f.group} · code {f.code}
                {f.refusePct ? ` · ${f.refusePct} % refuse` : ''}
              </span>
            </li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}

/** Refuse and energy/protein per 100 g of one reference food, with its dataset and code. */
export function FoodFacts({ foodId }: { foodId: number }) {
  const q = useQuery({ queryKey: keys.food(foodId), queryFn: () => foodDetail(foodId), staleTime: 10 * 60_000 });
  if (q.isPending) return <p className="mt-2 text-sm text-loam-700">Loading the food’s figures…</p>;
  if (q.isError) return <p className="mt-2 text-sm text-berry-700">Could not load the food’s figures: {(q.error as Error).message}</p>;
  const f = q.data;
  const kcal = nutrientAmount(f, 'energy_kcal');
  const protein = nutrientAmount(f, 'protein_g');
  return (
    <FactsGrid
      refusePct={f.refusePct}
      kcal={kcal}
      protein={protein}
      source={`${f.datasetInfo.name}, code ${f.code}`}
      href={`/foods/${f.id}`}
    />
  );
}

/** The three figures side by side, big enough to read at arm's length. */
export function FactsGrid({ refusePct, kcal, protein, source, href }: { refusePct: number | null; kcal: number | null; protein: number | null; source?: string; href?: string }) {
  return (
    <div className="mt-3" data-testid="food-facts">
      <dl className="grid grid-cols-3 gap-2 text-center">
        <div className="rounded-lg bg-white p-2">
          <dt className="text-xs text-loam-700">Refuse</dt>
          <dd className="text-lg font-extrabold" data-testid="facts-refuse">{refusePct == null ? 'none given' : pct(refusePct)}</dd>
        </div>
        <div className="rounded-lg bg-white p-2">
          <dt className="text-xs text-loam-700">Energy / 100 g</dt>
          <dd className="text-lg font-extrabold">{kcal == null ? '—' : `${formatAmount(kcal)} kcal`}</dd>
        </div>
        <div className="rounded-lg bg-white p-2">
          <dt className="text-xs text-loam-700">Protein / 100 g</dt>
          <dd className="text-lg font-extrabold">{protein == null ? '—' : `${formatAmount(protein)} g`}</dd>
        </div>
      </dl>
      {source ? (
        <p className="mt-1 text-xs text-loam-700">
          Per 100 g edible portion · {href ? <a className="underline" href={href} target="_blank" rel="noopener">{source}</a> : source}
        </p>
      ) : null}
    </div>
  );
}
