/**
 * Adding or changing one person: age in years, by birth year or by birth month; height and weight
 * in the household's units; dated pregnancy and breastfeeding; whether a young baby is fed from
 * the household's food; diet. Checked with the people API's own schema (person-form-values.ts);
 * a height and weight that look wrong together are questioned before saving, not refused.
 */
import { useId, useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { bodyWarnings } from '@/lib/body-plausibility';
import { EXCLUSIVE_MILK_AGE_YEARS } from '@/lib/needs';
import { ACTIVITY_LABELS, ACTIVITY_LEVELS, DIET_LABELS, DIETS, type PersonFields, type PersonInput } from '@/lib/people-schemas';
import type { UnitSystem } from '@/lib/units';
import { ConfirmWarning } from '@/components/entries/ConfirmWarning';
import { Alert } from '@/components/entries/ui';
import { FieldShell, formMessage, invalidProps, showFailure } from '@/components/forms';
import { draftAgeYears, draftOf, personResolver, type PersonDraft, type PersonFormContext } from './person-form-values';

interface Props {
  title: string;
  initial?: PersonFields;
  units: UnitSystem;
  /** The current month in the household's zone (the age of a baby is counted in it). */
  month: string;
  onSave: (body: PersonInput) => Promise<void>;
  onCancel: () => void;
}

const radio = 'chip';

export function PersonForm({ title, initial, units, month, onSave, onCancel }: Props) {
  const id = useId();
  const form = useForm<PersonDraft, unknown, PersonInput>({ resolver: personResolver, context: { units, month } satisfies PersonFormContext, reValidateMode: 'onSubmit', defaultValues: draftOf(initial, units) });
  const { errors, isSubmitting } = form.formState;
  const draft = useWatch({ control: form.control }) as PersonDraft;
  const { sex, ageKind, pregnant, breastfeeding } = draft;
  // Figures questioned and then confirmed as typed: saved without asking again.
  const [question, setQuestion] = useState<{ key: string; messages: string[] } | null>(null);
  const [confirmed, setConfirmed] = useState<string | null>(null);
  const f = (name: string) => `${id}-${name}`;
  const age = draftAgeYears(draft, month);
  const babyOnMilkAge = (age !== null && age >= 0 && age < EXCLUSIVE_MILK_AGE_YEARS) || draft.fedFromHousehold;

  const save = async (body: PersonInput, allowOdd: boolean) => {
    const messages = bodyWarnings({ heightCm: body.heightCm, weightKg: body.weightKg, ageYears: age, units }).map((w) => w.message);
    const key = `${body.heightCm}|${body.weightKg}|${age}`;
    if (messages.length > 0 && !allowOdd && confirmed !== key) {
      setQuestion({ key, messages });
      return;
    }
    setQuestion(null);
    try {
      await onSave(body);
    } catch (err) {
      showFailure(form, err, 'Could not save. Please try again.');
    }
  };
  const submit = form.handleSubmit((body) => save(body, false));
  const saveAsTyped = () => {
    if (question) setConfirmed(question.key);
    void form.handleSubmit((body) => save(body, true))();
  };

  // A text box registered under its form name; `idName` keeps the element ids the form always had.
  const input = (name: keyof PersonDraft, idName: string, extra: Record<string, unknown> = {}) => (
    <input {...invalidProps(f(idName), errors[name]?.message)} {...form.register(name)} className="field" {...extra} />
  );
  const tick = (name: 'pregnant' | 'breastfeeding' | 'fedFromHousehold', label: string, hint?: string) => (
    <label className="mt-3 flex min-h-12 cursor-pointer items-center gap-3 rounded-xl border border-loam-200 bg-loam-50 px-4 py-2">
      <input type="checkbox" {...form.register(name)} className="size-6 accent-sprout-700" />
      <span>
        <span className="font-semibold">{label}</span>
        {hint ? <span className="block text-sm text-loam-700">{hint}</span> : null}
      </span>
    </label>
  );
  const weightLabel = sex === 'female' && pregnant ? 'Weight before pregnancy' : 'Weight';

  return (
    <form onSubmit={submit} noValidate aria-labelledby={`${id}-title`}>
      <h2 id={`${id}-title`} className="text-xl font-extrabold">
        {title}
      </h2>
      <FieldShell id={f('name')} label="Name" error={errors.name?.message}>
        {input('name', 'name', { autoComplete: 'off' })}
      </FieldShell>
      <fieldset className="mt-4">
        <legend className="font-semibold">Sex</legend>
        <p className="text-sm text-loam-700">The reference intakes are published by sex.</p>
        <div className="mt-1 flex gap-2">
          {(['female', 'male'] as const).map((s) => (
            <label key={s} className="chip">
              <input type="radio" {...form.register('sex')} value={s} className="chip-dot" /> {s}
            </label>
          ))}
        </div>
      </fieldset>
      <fieldset className="mt-4">
        <legend className="font-semibold">Age</legend>
        <div className="mt-2 flex flex-wrap gap-2">
          <label className={radio}>
            <input type="radio" {...form.register('ageKind')} value="age" className="chip-dot" /> Age in years
          </label>
          <label className={radio}>
            <input type="radio" {...form.register('ageKind')} value="birthYear" className="chip-dot" /> Birth year (the age then follows the calendar)
          </label>
          <label className={radio}>
            <input type="radio" {...form.register('ageKind')} value="birthMonth" className="chip-dot" /> Birth month (for a child: the age counts in months)
          </label>
        </div>
        {ageKind === 'age' ? (
          <FieldShell id={f('age')} label="Age in years" hint="For a baby, a fraction: 0.5 is six months." error={errors.ageYears?.message} className="mt-2">
            {input('ageYears', 'age', { inputMode: 'decimal' })}
          </FieldShell>
        ) : ageKind === 'birthYear' ? (
          <FieldShell id={f('birthYear')} label="Birth year" error={errors.birthYear?.message} className="mt-2">
            {input('birthYear', 'birthYear', { inputMode: 'numeric' })}
          </FieldShell>
        ) : (
          <FieldShell id={f('birthMonth')} label="Birth month" hint="Year and month, e.g. 2026-09. No need is counted before it." error={errors.birthMonth?.message} className="mt-2">
            {input('birthMonth', 'birthMonth', { type: 'month', placeholder: 'YYYY-MM' })}
          </FieldShell>
        )}
      </fieldset>
      {babyOnMilkAge ? (
        <div data-testid="baby-feeding">
          {tick('fedFromHousehold', 'Fed from the household’s food', 'Formula or solids from the household. A baby under 6 months on breast milk alone adds no need: the milk is not household food, and the mother’s extra need is counted with her.')}
        </div>
      ) : null}
      {units === 'us' ? (
        <div className="grid gap-x-4 sm:grid-cols-3">
          <FieldShell id={f('heightFt')} label="Height, feet (optional)" error={errors.heightFt?.message}>
            {input('heightFt', 'heightFt', { inputMode: 'decimal' })}
          </FieldShell>
          <FieldShell id={f('heightIn')} label="and inches" error={errors.heightIn?.message}>
            {input('heightIn', 'heightIn', { inputMode: 'decimal' })}
          </FieldShell>
          <FieldShell id={f('weightLb')} label={`${weightLabel}, lb (optional)`} error={errors.weightLb?.message}>
            {input('weightLb', 'weightLb', { inputMode: 'decimal' })}
          </FieldShell>
        </div>
      ) : (
        <div className="grid gap-x-4 sm:grid-cols-2">
          <FieldShell id={f('heightCm')} label="Height, cm (optional)" error={errors.heightCm?.message}>
            {input('heightCm', 'heightCm', { inputMode: 'decimal' })}
          </FieldShell>
          <FieldShell id={f('weightKg')} label={`${weightLabel}, kg (optional)`} error={errors.weightKg?.message}>
            {input('weightKg', 'weightKg', { inputMode: 'decimal' })}
          </FieldShell>
        </div>
      )}
      <p className="mt-1 text-sm text-loam-700">
        Without height or weight the estimate uses the reference body of the person’s age group.
        {sex === 'female' && pregnant ? ' In pregnancy, give the weight before it: protein by weight is counted from it (IOM 2005).' : ''}
      </p>
      <FieldShell id={f('activity')} label="Activity" error={errors.activity?.message}>
        <select {...invalidProps(f('activity'), errors.activity?.message)} {...form.register('activity')} className="field">
          {ACTIVITY_LEVELS.map((a) => (
            <option key={a} value={a}>
              {ACTIVITY_LABELS[a]}
            </option>
          ))}
        </select>
      </FieldShell>
      <FieldShell id={f('diet')} label="Diet" hint="A vegetarian’s iron need is 1.8 times higher (IOM 2001): iron from plants is absorbed less well." error={errors.diet?.message}>
        <select {...invalidProps(f('diet'), errors.diet?.message, true)} {...form.register('diet')} className="field">
          {DIETS.map((d) => (
            <option key={d} value={d}>
              {DIET_LABELS[d]}
            </option>
          ))}
        </select>
      </FieldShell>
      {sex === 'female' ? (
        <fieldset className="mt-4">
          <legend className="font-semibold">Pregnancy and breastfeeding</legend>
          <p className="text-sm text-loam-700">Dated by month, so the extra need counts only in its own months and follows the trimester.</p>
          {tick('pregnant', 'Pregnant')}
          {pregnant ? (
            <FieldShell id={f('pregnancyDueMonth')} label="Month the baby is due" error={errors.pregnancyDueMonth?.message} className="mt-2">
              {input('pregnancyDueMonth', 'pregnancyDueMonth', { type: 'month', placeholder: 'YYYY-MM' })}
            </FieldShell>
          ) : null}
          {tick('breastfeeding', 'Breastfeeding')}
          {breastfeeding ? (
            <div className="grid gap-x-4 sm:grid-cols-2">
              <FieldShell id={f('lactationFrom')} label="Breastfeeding from (month)" error={errors.lactationFrom?.message} className="mt-2">
                {input('lactationFrom', 'lactationFrom', { type: 'month', placeholder: 'YYYY-MM' })}
              </FieldShell>
              <FieldShell id={f('lactationTo')} label="until (month, optional)" hint="Empty: the first 12 months." error={errors.lactationTo?.message} className="mt-2">
                {input('lactationTo', 'lactationTo', { type: 'month', placeholder: 'YYYY-MM' })}
              </FieldShell>
            </div>
          ) : null}
        </fieldset>
      ) : null}
      <FieldShell
        id={f('kcalPerDay')}
        label="Energy need, kcal a day (optional)"
        hint="Leave empty to estimate it. A figure from a dietitian or physician wins over the estimate."
        error={errors.kcalPerDay?.message}
      >
        {input('kcalPerDay', 'kcalPerDay', { inputMode: 'decimal' })}
      </FieldShell>
      <FieldShell id={f('atHomePct')} label="Share of meals from the household’s food, %" hint="100 for everyday eaters; 50 for someone who eats half their meals elsewhere." error={errors.atHomePct?.message}>
        {input('atHomePct', 'atHomePct', { inputMode: 'decimal' })}
      </FieldShell>
      <div className="grid gap-x-4 sm:grid-cols-2">
        <FieldShell id={f('presentFrom')} label="Eats here from (optional)" error={errors.presentFrom?.message}>
          {input('presentFrom', 'presentFrom', { type: 'date' })}
        </FieldShell>
        <FieldShell id={f('presentTo')} label="Eats here until (optional)" error={errors.presentTo?.message}>
          {input('presentTo', 'presentTo', { type: 'date' })}
        </FieldShell>
      </div>
      {question ? <ConfirmWarning testId="body-warning" messages={question.messages} confirmLabel="They are right: save as typed" busy={isSubmitting} onConfirm={saveAsTyped} /> : null}
      <Alert message={formMessage(form)} />
      <div className="mt-5 flex flex-wrap gap-2">
        <button type="submit" className="btn-primary" disabled={isSubmitting}>
          {isSubmitting ? 'Saving…' : 'Save'}
        </button>
        <button type="button" className="btn-quiet" onClick={onCancel}>
          Cancel
        </button>
      </div>
    </form>
  );
}
