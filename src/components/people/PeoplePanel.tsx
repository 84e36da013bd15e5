/**
 * People who eat in the household: list, add, edit and remove (owners and growers), each with
 * their daily energy need and what it rests on. The form is react-hook-form, checked with the shared
 * zod schema of src/lib/people-schemas.ts before sending and again by the API.
 */
import { zodResolver } from '@hookform/resolvers/zod';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useId, useState } from 'react';
import { useForm, useWatch, type FieldErrors as FieldErrorsOf, type Resolver, type ResolverResult } from 'react-hook-form';
import type { PersonJson } from '@/lib/api-types';
import { formatAmount } from '@/lib/format-number';
import { ACTIVITY_LABELS, ACTIVITY_LEVELS, personInput, type PersonFields, type PersonInput } from '@/lib/people-schemas';
import { parseDecimal } from '@/components/entries/quantity-text';
import { Alert, ConfirmDelete } from '@/components/entries/ui';
import { FieldShell, formMessage, invalidProps, showFailure } from '@/components/forms';
import { QueryProvider } from '@/components/QueryProvider';
import { get, request } from '@/components/request';

interface Props {
  householdId: number;
  canWrite: boolean;
}

export default function PeoplePanel(props: Props) {
  return (
    <QueryProvider>
      <People {...props} />
    </QueryProvider>
  );
}

type PeopleList = { month: string; people: PersonJson[] };

function People({ householdId, canWrite }: Props) {
  const base = `/api/households/${householdId}/people`;
  const key = ['people', householdId];
  const client = useQueryClient();
  const list = useQuery({ queryKey: key, queryFn: () => get<PeopleList>(base) });
  const [editing, setEditing] = useState<number | 'new' | null>(null);
  const [notice, setNotice] = useState<string | null>(null);
  const remove = useMutation({
    mutationFn: (id: number) => request<null>('DELETE', `${base}/${id}`),
    onSuccess: async () => {
      setNotice('Removed.');
      await client.invalidateQueries({ queryKey: key });
    },
  });

  const people = list.data?.people ?? [];
  return (
    <div>
      {list.isPending ? <p>Loading…</p> : null}
      {list.isError ? <Alert message={list.error.message} /> : null}
      {remove.isError ? <Alert message={remove.error.message} /> : null}
      <Alert message={notice} tone="ok" />
      {list.data && people.length === 0 ? (
        <p className="card mt-4 text-lg">Nobody is listed yet. Add everyone who eats from the household’s food, guests who stay for weeks included.</p>
      ) : null}
      <ul className="mt-4 grid gap-4" data-testid="people-list">
        {people.map((p) =>
          editing === p.id ? (
            <li key={p.id} className="card">
              <PersonForm
                title={`Change ${p.name}`}
                initial={p}
                onCancel={() => setEditing(null)}
                onSave={async (body) => {
                  await request('PATCH', `${base}/${p.id}`, body);
                  await client.invalidateQueries({ queryKey: key });
                  setEditing(null);
                  setNotice(`Saved ${body.name}.`);
                }}
              />
            </li>
          ) : (
            <li key={p.id} className="card" data-testid="person">
              <PersonCard person={p} />
              {canWrite ? (
                <div className="mt-4 flex flex-wrap gap-2">
                  <button type="button" className="btn-quiet" onClick={() => (setNotice(null), setEditing(p.id))}>
                    Change
                  </button>
                  <ConfirmDelete what={p.name} label="Remove" busy={remove.isPending} onConfirm={() => remove.mutate(p.id)} />
                </div>
              ) : null}
            </li>
          ),
        )}
      </ul>
      {canWrite ? (
        editing === 'new' ? (
          <div className="card mt-4">
            <PersonForm
              title="Add a person"
              onCancel={() => setEditing(null)}
              onSave={async (body) => {
                await request('POST', base, body);
                await client.invalidateQueries({ queryKey: key });
                setEditing(null);
                setNotice(`Added ${body.name}.`);
              }}
            />
          </div>
        ) : (
          <button type="button" className="btn-primary mt-4" onClick={() => (setNotice(null), setEditing('new'))}>
            Add a person
          </button>
        )
      ) : (
        <p className="mt-4 text-loam-700">Your role can read the people of this household but not change them.</p>
      )}
    </div>
  );
}

function ageText(p: PersonJson): string {
  if (p.birthYear != null) return `born ${p.birthYear}${p.energy ? ` (${p.energy.ageYears} this year)` : ''}`;
  if (p.ageYears == null) return '';
  return p.ageYears < 1 ? `${Math.round(p.ageYears * 12)} months old` : `${formatAmount(p.ageYears)} years`;
}

function PersonCard({ person: p }: { person: PersonJson }) {
  const e = p.energy;
  return (
    <div>
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 className="text-xl font-extrabold">{p.name}</h2>
        <p className="text-loam-700">
          {p.sex}, {ageText(p)}
          {p.condition !== 'none' ? ` · ${p.condition}` : ''}
        </p>
      </div>
      {e ? (
        <p className="mt-2">
          <span className="text-3xl font-extrabold text-sprout-900" data-testid="person-kcal">
            {formatAmount(e.kcalPerDay)} kcal
          </span>{' '}
          <span className="text-loam-700">a day</span>{' '}
          <span className="inline-block rounded-full bg-loam-100 px-3 py-1 text-sm font-semibold whitespace-nowrap" data-testid="person-basis">
            {e.basis === 'stated' ? 'as you stated' : 'estimated (EER)'}
          </span>
        </p>
      ) : (
        <p className="mt-2 text-loam-700">Not yet born this month: no need counted.</p>
      )}
      <dl className="mt-3 grid gap-x-6 gap-y-1 text-sm sm:grid-cols-2">
        <div>
          <dt className="inline text-loam-700">Meals from the household: </dt>
          <dd className="inline font-semibold">
            {formatAmount(p.atHomePct)} %{e && p.atHomePct !== 100 ? ` (${formatAmount(e.atHomeKcalPerDay)} kcal a day counted)` : ''}
          </dd>
        </div>
        <div>
          <dt className="inline text-loam-700">Activity: </dt>
          <dd className="inline font-semibold">{ACTIVITY_LABELS[p.activity]}</dd>
        </div>
        {p.heightCm != null || p.weightKg != null ? (
          <div>
            <dt className="inline text-loam-700">Height, weight: </dt>
            <dd className="inline font-semibold">
              {p.heightCm != null ? `${formatAmount(p.heightCm)} cm` : 'height not given'}, {p.weightKg != null ? `${formatAmount(p.weightKg)} kg` : 'weight not given'}
            </dd>
          </div>
        ) : null}
        {p.presentFrom || p.presentTo ? (
          <div>
            <dt className="inline text-loam-700">Eats here: </dt>
            <dd className="inline font-semibold">
              {p.presentFrom ? `from ${p.presentFrom}` : ''} {p.presentTo ? `to ${p.presentTo}` : ''}
            </dd>
          </div>
        ) : null}
      </dl>
      {e ? (
        <details className="mt-2 text-sm">
          <summary className="cursor-pointer text-sprout-700">What the energy need rests on</summary>
          <p className="mt-1">{e.basis === 'stated' ? 'The kcal a day stated for this person.' : e.source}</p>
          {e.notes.length ? (
            <ul className="mt-1 list-disc pl-5">
              {e.notes.map((n) => (
                <li key={n}>{n}</li>
              ))}
            </ul>
          ) : null}
        </details>
      ) : null}
    </div>
  );
}

// The form's values are the typed text, named as the API names the fields; `ageKind` says which of
// age and birth year is being given.
type Draft = Record<'name' | 'sex' | 'ageKind' | 'ageYears' | 'birthYear' | 'heightCm' | 'weightKg' | 'activity' | 'condition' | 'kcalPerDay' | 'atHomePct' | 'presentFrom' | 'presentTo', string>;

function draftOf(p?: PersonFields): Draft {
  const s = (v: number | string | null | undefined) => (v == null ? '' : String(v));
  return {
    name: p?.name ?? '',
    sex: p?.sex ?? 'female',
    ageKind: p?.birthYear != null ? 'birthYear' : 'age',
    ageYears: s(p?.ageYears),
    birthYear: s(p?.birthYear),
    heightCm: s(p?.heightCm),
    weightKg: s(p?.weightKg),
    activity: p?.activity ?? 'low',
    condition: p?.condition ?? 'none',
    kcalPerDay: s(p?.kcalPerDay),
    atHomePct: s(p?.atHomePct ?? 100),
    presentFrom: p?.presentFrom ?? '',
    presentTo: p?.presentTo ?? '',
  };
}

// Typed text → the API's body; a blank number is null, a mistyped one NaN (the schema says so).
function bodyOf(d: Draft): Record<string, unknown> {
  const num = (t: string) => parseDecimal(t) ?? null;
  return {
    name: d.name,
    sex: d.sex,
    ageYears: d.ageKind === 'age' ? num(d.ageYears) : null,
    birthYear: d.ageKind === 'birthYear' ? num(d.birthYear) : null,
    heightCm: num(d.heightCm),
    weightKg: num(d.weightKg),
    activity: d.activity,
    condition: d.condition,
    kcalPerDay: num(d.kcalPerDay),
    atHomePct: num(d.atHomePct) ?? 100,
    presentFrom: d.presentFrom || null,
    presentTo: d.presentTo || null,
  };
}

const checkPerson = zodResolver(personInput);

/**
 * Checks the typed draft with `personInput`, the schema the people API parses with, after turning
 * the text into the API's body. "Give the age or the birth year" stands beside the birth year when
 * that is the box on show.
 */
const personResolver: Resolver<Draft, unknown, PersonInput> = async (draft, context, options) => {
  // The zod resolver is typed for the API body; it is handed exactly that, built from the draft.
  const result = await checkPerson(bodyOf(draft) as never, context, options as never);
  const errors = result.errors as FieldErrorsOf<Draft>;
  if (draft.ageKind === 'birthYear' && errors.ageYears) {
    errors.birthYear ??= { ...errors.ageYears, ref: options.fields.birthYear?.ref };
    delete errors.ageYears;
  }
  return result as ResolverResult<Draft, PersonInput>;
};

function PersonForm({ title, initial, onSave, onCancel }: { title: string; initial?: PersonFields; onSave: (body: PersonFields) => Promise<void>; onCancel: () => void }) {
  const id = useId();
  const form = useForm<Draft, unknown, PersonInput>({ resolver: personResolver, reValidateMode: 'onSubmit', defaultValues: draftOf(initial) });
  const { errors, isSubmitting } = form.formState;
  const [sex, ageKind] = useWatch({ control: form.control, name: ['sex', 'ageKind'] });
  const f = (name: string) => `${id}-${name}`;

  const submit = form.handleSubmit(async (body) => {
    try {
      await onSave(body);
    } catch (err) {
      showFailure(form, err, 'Could not save. Please try again.');
    }
  });

  // A text box registered under its API name; `idName` keeps the element ids the form always had.
  const input = (name: keyof Draft, idName: string, extra: Record<string, unknown> = {}) => (
    <input {...invalidProps(f(idName), errors[name]?.message)} {...form.register(name)} className="field" {...extra} />
  );

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
            <label key={s} className={`btn-quiet cursor-pointer ${sex === s ? 'border-sprout-700 bg-sprout-100' : ''}`}>
              <input type="radio" {...form.register('sex')} value={s} className="h-5 w-5" /> {s}
            </label>
          ))}
        </div>
      </fieldset>
      <fieldset className="mt-4">
        <legend className="font-semibold">Age</legend>
        <div className="mt-1 flex flex-wrap gap-2">
          <label className="inline-flex min-h-12 items-center gap-2">
            <input type="radio" {...form.register('ageKind')} value="age" className="h-5 w-5" /> Age in years
          </label>
          <label className="inline-flex min-h-12 items-center gap-2">
            <input type="radio" {...form.register('ageKind')} value="birthYear" className="h-5 w-5" /> Birth year (the age then
            follows the calendar)
          </label>
        </div>
        {ageKind === 'age' ? (
          <FieldShell id={f('age')} label="Age in years" hint="For a baby, a fraction: 0.5 is six months." error={errors.ageYears?.message} className="mt-2">
            {input('ageYears', 'age', { inputMode: 'decimal' })}
          </FieldShell>
        ) : (
          <FieldShell id={f('birthYear')} label="Birth year" error={errors.birthYear?.message} className="mt-2">
            {input('birthYear', 'birthYear', { inputMode: 'numeric' })}
          </FieldShell>
        )}
      </fieldset>
      <div className="grid gap-x-4 sm:grid-cols-2">
        <FieldShell id={f('heightCm')} label="Height, cm (optional)" error={errors.heightCm?.message}>
          {input('heightCm', 'heightCm', { inputMode: 'decimal' })}
        </FieldShell>
        <FieldShell id={f('weightKg')} label="Weight, kg (optional)" error={errors.weightKg?.message}>
          {input('weightKg', 'weightKg', { inputMode: 'decimal' })}
        </FieldShell>
      </div>
      <p className="mt-1 text-sm text-loam-700">Without height or weight the estimate uses the reference body of the person’s age group.</p>
      <FieldShell id={f('activity')} label="Activity" error={errors.activity?.message}>
        <select {...invalidProps(f('activity'), errors.activity?.message)} {...form.register('activity')} className="field">
          {ACTIVITY_LEVELS.map((a) => (
            <option key={a} value={a}>
              {ACTIVITY_LABELS[a]}
            </option>
          ))}
        </select>
      </FieldShell>
      {sex === 'female' ? (
        <FieldShell id={f('condition')} label="Pregnant or breastfeeding" error={errors.condition?.message}>
          <select {...invalidProps(f('condition'), errors.condition?.message)} {...form.register('condition')} className="field">
            <option value="none">Neither</option>
            <option value="pregnancy">Pregnant</option>
            <option value="lactation">Breastfeeding</option>
          </select>
        </FieldShell>
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
