/**
 * The "Household" section of the settings page (owner only): name, time zone (a list of the
 * runtime's IANA names with a search box above it, since there are some four hundred), units, the
 * month the growing year starts and the currency bought food starts with. Checked with `householdInput`, whose fields are the ones
 * PATCH /api/households/{id} parses; the server's own field errors land beside the fields.
 */
import { useMemo, useState } from 'react';
import { useController, useWatch } from 'react-hook-form';
import { householdInput, MONTH_NAMES } from '@/lib/household-schemas';
import { settingsChangeNotes } from '@/lib/household-settings';
import { Field, FieldError, FormAlert, formMessage, showFailure, useSchemaForm } from '@/components/forms';
import { request } from '@/components/request';
import { CurrencyField } from './CurrencyField';

export interface HouseholdSettingsJson {
  id: number;
  name: string;
  timezone: string;
  units: 'metric' | 'us';
  yearStartMonth: number;
  recordsSince: string | null;
  currency: string | null;
}

/** The zones to offer: those matching the search (spaces or underscores alike), always with the chosen one. */
function zoneOptions(zones: string[], search: string, chosen: string): string[] {
  const words = search.toLowerCase().replaceAll('_', ' ').split(/\s+/).filter(Boolean);
  const found = zones.filter((z) => {
    const readable = z.toLowerCase().replaceAll('_', ' ');
    return words.every((w) => readable.includes(w));
  });
  return found.includes(chosen) ? found : [chosen, ...found];
}

export function HouseholdDetailsForm({ household, zones, onSaved }: { household: HouseholdSettingsJson; zones: string[]; onSaved: (h: HouseholdSettingsJson) => void }) {
  const [saved, setSaved] = useState<HouseholdSettingsJson>(household);
  const [savedNote, setSavedNote] = useState<string | null>(null);
  const [search, setSearch] = useState('');
  const form = useSchemaForm(householdInput, { name: household.name, timezone: household.timezone, units: household.units, yearStartMonth: household.yearStartMonth, currency: household.currency ?? '' });
  const { errors, isSubmitting } = form.formState;
  const timezone = useController({ control: form.control, name: 'timezone' });
  const [zoneNow, yearNow] = useWatch({ control: form.control, name: ['timezone', 'yearStartMonth'] });
  const allZones = useMemo(() => (zones.includes(household.timezone) ? zones : [...zones, household.timezone].sort()), [zones, household.timezone]);
  const options = zoneOptions(allZones, search, timezone.field.value ?? saved.timezone);
  const notes = settingsChangeNotes(saved, { timezone: zoneNow ?? saved.timezone, yearStartMonth: Number(yearNow) });

  const submit = form.handleSubmit(async (data) => {
    setSavedNote(null);
    try {
      const a = await request<{ household: HouseholdSettingsJson }>('PATCH', `/api/households/${household.id}`, data);
      setSaved(a.household);
      onSaved(a.household);
      form.reset({ name: a.household.name, timezone: a.household.timezone, units: a.household.units, yearStartMonth: a.household.yearStartMonth, currency: a.household.currency ?? '' });
      setSavedNote('Saved.');
    } catch (err) {
      showFailure(form, err);
    }
  });

  return (
    <form onSubmit={submit} noValidate className="card" aria-labelledby="household-settings-h" data-testid="household-settings-form">
      <h2 id="household-settings-h" className="text-xl font-bold">Household</h2>
      <Field id="name" label="Name" autoComplete="off" registration={form.register('name')} error={errors.name?.message} />
      <div className="mt-4">
        <label htmlFor="timezone" className="block font-semibold">Time zone</label>
        <p id="timezone-hint" className="text-sm text-loam-700">Harvest and shopping dates are days in this zone. Type a city or region to shorten the list.</p>
        <input
          type="search"
          className="field mt-1"
          placeholder="Search zones, e.g. Berlin"
          aria-label="Search time zones"
          value={search}
          onChange={(e) => setSearch(e.target.value)}
        />
        <select
          id="timezone"
          name={timezone.field.name}
          ref={timezone.field.ref}
          className="field mt-2"
          value={timezone.field.value}
          onChange={timezone.field.onChange}
          onBlur={timezone.field.onBlur}
          aria-invalid={errors.timezone ? true : undefined}
          aria-describedby={`timezone-hint${errors.timezone ? ' timezone-error' : ''}`}
        >
          {options.map((z) => (
            <option key={z} value={z}>{z.replaceAll('_', ' ')}</option>
          ))}
        </select>
        <FieldError id="timezone" error={errors.timezone?.message} />
      </div>
      <fieldset className="mt-4" aria-describedby={errors.units ? 'units-error' : undefined}>
        <legend className="font-semibold">Units</legend>
        <p className="text-sm text-loam-700">How weights are shown and entered. Stored weights do not change.</p>
        <div className="mt-2 flex flex-wrap gap-2">
          <label className="chip">
            <input type="radio" {...form.register('units')} value="metric" className="chip-dot" /> Metric (g, kg)
          </label>
          <label className="chip">
            <input type="radio" {...form.register('units')} value="us" className="chip-dot" /> US (oz, lb)
          </label>
        </div>
        <FieldError id="units" error={errors.units?.message} />
      </fieldset>
      <div className="mt-4">
        <label htmlFor="yearStartMonth" className="block font-semibold">The growing year starts in</label>
        <p id="yearStartMonth-hint" className="text-sm text-loam-700">Yearly totals run from this month; pick the month your season turns.</p>
        <select
          id="yearStartMonth"
          {...form.register('yearStartMonth', { valueAsNumber: true })}
          className="field mt-1"
          aria-describedby={`yearStartMonth-hint${errors.yearStartMonth ? ' yearStartMonth-error' : ''}`}
          aria-invalid={errors.yearStartMonth ? true : undefined}
        >
          {MONTH_NAMES.map((m, i) => (
            <option key={m} value={i + 1}>{m}</option>
          ))}
        </select>
        <FieldError id="yearStartMonth" error={errors.yearStartMonth?.message} />
      </div>
      <CurrencyField
        registration={form.register('currency')}
        error={errors.currency?.message}
        hint="New bought food starts in this currency. Leave it blank and the first purchase with a price sets it."
      />
      {notes.length > 0 && (
        <ul className="mt-4 space-y-1 rounded-xl bg-loam-100 p-3 text-sm" data-testid="settings-change-notes">
          {notes.map((n) => <li key={n}>{n}</li>)}
        </ul>
      )}
      <FormAlert message={formMessage(form)} />
      {/* The confirmation sits right above the button, so on a phone it shows where the thumb is. */}
      <FormAlert message={savedNote} tone="ok" />
      <button className="btn-primary mt-4" type="submit" disabled={isSubmitting}>
        {isSubmitting ? 'Saving…' : 'Save household'}
      </button>
    </form>
  );
}
