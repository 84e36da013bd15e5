/**
 * Small pieces the entry islands share: a labelled field shell with its error, the unit toggle and
 * the unit select (weights, then counts, then volumes), the use chips, a two-step delete button and the hooks that remember a unit and a currency per
 * household.
 * Touch targets are at least 48 px (min-h-12) so they work with one thumb outdoors.
 */
import { useEffect, useState, type ReactNode } from 'react';
import { USE_LABELS, USES, type Use } from '@/lib/entry-schemas';
import { FieldError as ErrorText, invalidProps } from '@/components/forms';
import { useThumbFloat } from '@/components/thumb-float';
import { DEFAULT_ENTRY_UNIT, WEIGHT_UNITS, isWeightUnit, type UnitSystem, type WeightUnit } from '@/lib/units';
import { ENTRY_UNIT_NAMES, UNIT_GROUPS, isEntryUnit, type EntryUnit } from '@/lib/entry-units';

// The field pieces live in ../forms (shared with the account and household forms); re-exported
// here so the entry islands keep one import.
export { describedBy, invalidProps, FieldShell, FieldError as ErrorText, type FieldErrors as Errors } from '@/components/forms';

/**
 * A message for the whole form: role=alert for errors, role=status for good news. On a phone,
 * good news ("Saved", "Added Rosa") first shows just above the bottom bar, where the thumb is,
 * then settles in its place in the page.
 */
export function Alert({ message, tone = 'error' }: { message: ReactNode | null; tone?: 'error' | 'ok' | 'wait' }) {
  const style = tone === 'error' ? 'bg-berry-700/10 text-berry-700' : tone === 'ok' ? 'bg-sprout-100 text-sprout-900' : 'bg-rind-100 text-loam-900';
  const float = useThumbFloat(message, tone === 'ok');
  return (
    <div role={tone === 'error' ? 'alert' : 'status'}>
      {message ? <div className={`mt-4 rounded-xl p-3 font-semibold ${style} ${float}`} data-testid={tone === 'ok' ? 'confirmation' : undefined}>{message}</div> : null}
    </div>
  );
}

const segment = 'min-h-12 min-w-12 flex-1 px-3 text-lg font-bold transition-colors first:rounded-l-xl last:rounded-r-xl border border-loam-200 -ml-px first:ml-0';

/**
 * The unit of the big amount field: the g / kg / oz / lb toggle (a radio group, so arrow keys move
 * between units, one tap in the garden) and beside it a select of counts and volumes, grouped. A
 * count or volume chosen leaves no weight checked.
 */
export function UnitToggle({ name, value, onChange, label = 'Unit' }: { name: string; value: EntryUnit; onChange: (u: EntryUnit) => void; label?: string }) {
  const others = UNIT_GROUPS.filter((g) => g.label !== 'Weight');
  return (
    <div className="flex flex-wrap gap-2">
      <fieldset className="min-w-48 flex-[4_1_12rem]">
        <legend className="sr-only">{label}</legend>
        <div className="flex">
          {WEIGHT_UNITS.map((u) => (
            <label key={u} className={`${segment} flex cursor-pointer items-center justify-center ${value === u ? 'border-sprout-700 bg-sprout-700 text-white' : 'bg-white text-loam-900 hover:bg-loam-100'}`}>
              <input type="radio" className="sr-only" name={name} value={u} checked={value === u} onChange={() => onChange(u)} />
              {u}
            </label>
          ))}
        </div>
      </fieldset>
      <div className="min-w-0 flex-[1_1_7rem]">
        <select
          aria-label="Count or volume"
          data-testid={`${name}-other`}
          className={`field px-2 text-base font-bold ${isWeightUnit(value) ? '' : 'border-sprout-700 bg-sprout-100 text-sprout-900 ring-2 ring-sprout-700'}`}
          value={isWeightUnit(value) ? '' : value}
          onChange={(e) => isEntryUnit(e.target.value) && onChange(e.target.value)}
        >
          <option value="">more units</option>
          <UnitOptions groups={others} />
        </select>
      </div>
    </div>
  );
}

/** One labelled option group per kind of unit (weights, counts, volumes). */
function UnitOptions({ groups }: { groups: typeof UNIT_GROUPS }) {
  return groups.map((g) => (
    <optgroup key={g.label} label={g.label}>
      {g.units.map((u) => (
        <option key={u} value={u}>
          {ENTRY_UNIT_NAMES[u]}
        </option>
      ))}
    </optgroup>
  ));
}

/** A compact unit select for edit rows and lists: weights, then counts, then volumes, each group labelled. */
export function UnitSelect({ id, value, onChange, error }: { id: string; value: EntryUnit; onChange: (u: EntryUnit) => void; error?: string | undefined }) {
  return (
    <select {...invalidProps(id, error)} className="field mt-1" value={value} onChange={(e) => isEntryUnit(e.target.value) && onChange(e.target.value)}>
      <UnitOptions groups={UNIT_GROUPS} />
    </select>
  );
}

/** "Stored (cellar, clamp, shelf)" → ["Stored", "cellar, clamp, shelf"]. */
export function splitUseLabel(use: Use): [string, string | null] {
  const m = /^(.*?)\s*\((.*)\)$/.exec(USE_LABELS[use]);
  return m ? [m[1]!, m[2]!] : [USE_LABELS[use], null];
}

/** The use chips: one tap picks what happens to the food. Uses in `disabled` cannot be picked. */
export function UseChips({ name, value, onChange, disabled = [], legend = 'What happens to it', error }: { name: string; value: Use; onChange: (u: Use) => void; disabled?: readonly Use[]; legend?: string; error?: string | undefined }) {
  const errId = `${name}-error`;
  return (
    <fieldset className="mt-5" aria-describedby={error ? errId : undefined}>
      <legend className="font-semibold">{legend}</legend>
      <div className="mt-2 grid grid-cols-2 gap-2 sm:grid-cols-4">
        {USES.map((u) => {
          const [main, sub] = splitUseLabel(u);
          const off = disabled.includes(u);
          const on = value === u;
          return (
            <label
              key={u}
              className={`flex min-h-14 cursor-pointer flex-col justify-center rounded-xl border px-3 py-2 leading-tight transition-colors has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-focus ${
                on ? 'border-sprout-700 bg-sprout-100 text-sprout-900 ring-2 ring-sprout-700' : 'border-loam-200 bg-white hover:bg-loam-100'
              } ${off ? 'cursor-not-allowed opacity-40' : ''}`}
            >
              <input type="radio" className="sr-only" name={name} value={u} checked={on} disabled={off} onChange={() => onChange(u)} />
              <span className="font-bold">{main}</span>
              {sub ? <span className="text-xs text-loam-700">{sub}</span> : null}
            </label>
          );
        })}
      </div>
      <ErrorText id={name} error={error} />
    </fieldset>
  );
}

/** A delete button that asks once more before it acts. */
export function ConfirmDelete({ onConfirm, label = 'Delete', what, busy = false }: { onConfirm: () => void; label?: string; what: string; busy?: boolean }) {
  const [asking, setAsking] = useState(false);
  if (!asking) {
    return (
      <button type="button" className="btn-quiet min-h-12 px-3 text-berry-700" onClick={() => setAsking(true)} aria-label={`${label} ${what}`}>
        {label}
      </button>
    );
  }
  return (
    <span className="inline-flex flex-wrap items-center gap-2" role="group" aria-label={`Confirm: ${label.toLowerCase()} ${what}`}>
      <span className="text-sm font-semibold">{label} {what}?</span>
      <button type="button" className="btn-danger min-h-12 px-3" disabled={busy} onClick={onConfirm}>
        Yes, {label.toLowerCase()}
      </button>
      <button type="button" className="btn-quiet min-h-12 px-3" onClick={() => setAsking(false)}>
        Keep
      </button>
    </span>
  );
}

/**
 * The unit of the form and the weight unit last used in this household on this device
 * (localStorage), else the unit-system default (metric → kg, us → lb). Only weights are remembered:
 * a count or volume fits one food, not the next. Reading storage waits for hydration, so the server
 * HTML matches.
 */
export function useRememberedUnit(householdId: number, system: UnitSystem, what = 'unit'): [EntryUnit, (u: EntryUnit) => void, WeightUnit] {
  const key = `selfsown:${what}:${householdId}`;
  const [weight, setWeight] = useState<WeightUnit>(DEFAULT_ENTRY_UNIT[system]);
  const [unit, setUnit] = useState<EntryUnit>(DEFAULT_ENTRY_UNIT[system]);
  useEffect(() => {
    try {
      const saved = localStorage.getItem(key);
      if (isWeightUnit(saved)) {
        setWeight(saved);
        setUnit(saved);
      }
    } catch {
      /* storage unavailable */
    }
  }, [key]);
  const choose = (u: EntryUnit) => {
    setUnit(u);
    if (!isWeightUnit(u)) return;
    setWeight(u);
    try {
      localStorage.setItem(key, u);
    } catch {
      /* storage unavailable */
    }
  };
  return [unit, choose, weight];
}

/**
 * The currency a new purchase starts with: the household's own when it has one (so a currency it
 * never used is not offered ahead of it), else the one last used on this device (localStorage),
 * else none. Kept only when it is a three-letter code.
 */
export function useRememberedCurrency(householdId: number, householdCurrency: string | null | undefined): [string, (c: string) => void] {
  const key = `selfsown:currency:${householdId}`;
  const [c, setC] = useState(householdCurrency ?? '');
  useEffect(() => {
    if (householdCurrency) return;
    try {
      const saved = localStorage.getItem(key);
      if (saved && /^[A-Z]{3}$/.test(saved)) setC(saved);
    } catch {
      /* storage unavailable */
    }
  }, [key, householdCurrency]);
  const remember = (v: string) => {
    try {
      if (/^[A-Z]{3}$/.test(v)) localStorage.setItem(key, v);
    } catch {
      /* storage unavailable */
    }
  };
  return [c, (v) => (setC(v), remember(v.toUpperCase()))];
}

/** A value that follows `value` after it has stopped changing for `ms`. */
export function useDebounced<T>(value: T, ms = 250): T {
  const [v, setV] = useState(value);
  useEffect(() => {
    const t = window.setTimeout(() => setV(value), ms);
    return () => window.clearTimeout(t);
  }, [value, ms]);
  return v;
}

/** Percent for people. Example: `pct(25)` → '25 %' */
export function pct(n: number | null | undefined): string {
  return n == null ? 'not given' : `${Math.round(n * 10) / 10} %`;
}
