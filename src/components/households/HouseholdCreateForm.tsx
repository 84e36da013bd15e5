/** The "start a household" form (React island): name, time zone (the browser's by default), units, year start. */
import { useEffect, useRef, useState, type FormEvent } from 'react';
import { fieldErrors } from '../../lib/account-schemas';
import { householdInput, isTimeZone, MONTH_NAMES } from '../../lib/household-schemas';
import { answerMessage, Field, FieldError, FormAlert, focusFirstError, sendJson, type FieldErrors } from '../forms';

export function HouseholdCreateForm({ zones }: { zones: string[] }) {
  const formRef = useRef<HTMLFormElement>(null);
  const [timezone, setTimezone] = useState('UTC');
  const [options, setOptions] = useState(zones);
  const [errors, setErrors] = useState<FieldErrors>({});
  const [alert, setAlert] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  // The browser knows where it is: preselect its zone (adding it when the list spells it differently).
  useEffect(() => {
    const tz = Intl.DateTimeFormat().resolvedOptions().timeZone;
    if (!tz || !isTimeZone(tz)) return;
    if (!zones.includes(tz)) setOptions([...zones, tz].sort());
    setTimezone(tz);
  }, [zones]);

  async function submit(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    setAlert(null);
    const f = new FormData(e.currentTarget);
    const parsed = householdInput.safeParse({
      name: String(f.get('name') ?? ''),
      timezone: String(f.get('timezone') ?? ''),
      units: String(f.get('units') ?? 'metric'),
      yearStartMonth: Number(f.get('yearStartMonth') ?? 1),
    });
    const errs = fieldErrors(parsed);
    setErrors(errs);
    if (!parsed.success) return focusFirstError(formRef.current, errs);
    setBusy(true);
    const a = await sendJson('POST', '/api/households', parsed.data);
    if (a.status === 201) {
      window.location.assign(`/households/${a.body.household.id}`);
      return;
    }
    setBusy(false);
    if (a.body?.error?.fields) {
      setErrors(a.body.error.fields);
      focusFirstError(formRef.current, a.body.error.fields);
    }
    setAlert(answerMessage(a));
  }

  return (
    <form ref={formRef} onSubmit={submit} noValidate className="card mt-4 max-w-xl" aria-labelledby="new-household">
      <h2 id="new-household" className="text-xl font-bold">Start a household</h2>
      <Field id="name" label="Name" autoComplete="off" error={errors.name} hint="What the people in it call it, e.g. “Hillside plot” or “The Okafor house”." />
      <div className="mt-4">
        <label htmlFor="timezone" className="block font-semibold">Time zone</label>
        <p id="timezone-hint" className="text-sm text-loam-700">Harvest and shopping dates are days in this zone.</p>
        <select
          id="timezone"
          name="timezone"
          className="field mt-1"
          value={timezone}
          onChange={(e) => setTimezone(e.target.value)}
          aria-invalid={errors.timezone ? true : undefined}
          aria-describedby={`timezone-hint${errors.timezone ? ' timezone-error' : ''}`}
        >
          {options.map((z) => (
            <option key={z} value={z}>{z.replaceAll('_', ' ')}</option>
          ))}
        </select>
        <FieldError id="timezone" error={errors.timezone} />
      </div>
      <fieldset className="mt-4" aria-describedby={errors.units ? 'units-error' : undefined}>
        <legend className="font-semibold">Units</legend>
        <div className="mt-1 flex flex-wrap gap-3">
          <label className="btn-quiet cursor-pointer">
            <input type="radio" name="units" value="metric" defaultChecked /> Metric (g, kg)
          </label>
          <label className="btn-quiet cursor-pointer">
            <input type="radio" name="units" value="us" /> US (oz, lb)
          </label>
        </div>
        <FieldError id="units" error={errors.units} />
      </fieldset>
      <div className="mt-4">
        <label htmlFor="yearStartMonth" className="block font-semibold">The growing year starts in</label>
        <p id="yearStartMonth-hint" className="text-sm text-loam-700">Yearly totals run from this month; pick the month your season turns.</p>
        <select id="yearStartMonth" name="yearStartMonth" className="field mt-1" defaultValue="1" aria-describedby={`yearStartMonth-hint${errors.yearStartMonth ? ' yearStartMonth-error' : ''}`} aria-invalid={errors.yearStartMonth ? true : undefined}>
          {MONTH_NAMES.map((m, i) => (
            <option key={m} value={i + 1}>{m}</option>
          ))}
        </select>
        <FieldError id="yearStartMonth" error={errors.yearStartMonth} />
      </div>
      <FormAlert message={alert} />
      <button className="btn-primary mt-6" type="submit" disabled={busy}>
        {busy ? 'Creating…' : 'Create the household'}
      </button>
    </form>
  );
}
