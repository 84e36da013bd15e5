/**
 * The "start a household" form (React island): name, time zone (the browser's by default), units,
 * year start and currency (guessed from the time zone until the person types one). A react-hook-form form checked with `householdInput`, the schema POST /api/households
 * parses with; the server's own field errors show beside the fields.
 */
import { useEffect, useState } from 'react';
import { useController, useWatch } from 'react-hook-form';
import { currencyForZone } from '@/lib/currency';
import { currentZoneName, householdInput, isTimeZone, MONTH_NAMES } from '@/lib/household-schemas';
import { Field, FieldError, FormAlert, formMessage, showFailure, useSchemaForm } from '@/components/forms';
import { request } from '@/components/request';
import { CurrencyField } from './CurrencyField';

export function HouseholdCreateForm({ zones }: { zones: string[] }) {
  const [options, setOptions] = useState(zones);
  const form = useSchemaForm(householdInput, { name: '', timezone: 'UTC', units: 'metric', yearStartMonth: 1, currency: '' });
  const { errors, isSubmitting, isSubmitSuccessful } = form.formState;
  const timezone = useController({ control: form.control, name: 'timezone' });
  const { setValue, getFieldState } = form;
  const zoneNow = useWatch({ control: form.control, name: 'timezone' });

  // The currency follows the zone (from memory: src/lib/currency.ts) until the person types one.
  useEffect(() => {
    if (!getFieldState('currency').isDirty) setValue('currency', currencyForZone(zoneNow ?? '') ?? '');
  }, [zoneNow, setValue, getFieldState]);

  // The browser knows where it is: preselect its zone (adding it when the list spells it differently).
  useEffect(() => {
    // Browsers may answer an old spelling (Asia/Calcutta); the list and the household use the current one.
    const found = Intl.DateTimeFormat().resolvedOptions().timeZone;
    if (!found || !isTimeZone(found)) return;
    const tz = currentZoneName(found);
    if (!zones.includes(tz)) setOptions([...zones, tz].sort());
    setValue('timezone', tz);
  }, [zones, setValue]);

  const submit = form.handleSubmit(async (data) => {
    try {
      const a = await request<{ household: { id: number } }>('POST', '/api/households', data);
      window.location.assign(`/households/${a.household.id}`);
    } catch (err) {
      showFailure(form, err);
    }
  });
  // A created household keeps the button busy while its page loads.
  const busy = isSubmitting || isSubmitSuccessful;

  return (
    <form onSubmit={submit} noValidate className="card mt-4 max-w-xl" aria-labelledby="new-household">
      <h2 id="new-household" className="text-xl font-bold">Start a household</h2>
      <Field id="name" label="Name" autoComplete="off" registration={form.register('name')} error={errors.name?.message} hint="What the people in it call it, e.g. “Hillside plot” or “The Okafor house”." />
      <div className="mt-4">
        <label htmlFor="timezone" className="block font-semibold">Time zone</label>
        <p id="timezone-hint" className="text-sm text-loam-700">Harvest and shopping dates are days in this zone.</p>
        <select
          id="timezone"
          name={timezone.field.name}
          ref={timezone.field.ref}
          className="field mt-1"
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
        <div className="mt-2 flex flex-wrap gap-2">
          <label className="chip">
            <input type="radio" {...form.register('units')} value="metric" className="chip-dot" defaultChecked /> Metric (g, kg)
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
          defaultValue="1"
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
        hint="Guessed from the time zone; change it to the currency you shop in, or leave it blank."
      />
      <FormAlert message={formMessage(form)} />
      <button className="btn-primary mt-6" type="submit" disabled={busy}>
        {busy ? 'Creating…' : 'Create the household'}
      </button>
    </form>
  );
}
