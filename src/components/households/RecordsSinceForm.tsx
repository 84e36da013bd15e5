/**
 * The month a household's records start (owner only, React island): months before it carry no
 * need and stay out of every total and headline. Empty means the default rule — the earlier of the
 * month the household was made and its first entry's month. Checked with the same `recordsSince`
 * rule PATCH /api/households/{id} parses with.
 */
import { useState } from 'react';
import { z } from 'zod';
import { Field, FormAlert, formMessage, showFailure, useSchemaForm } from '@/components/forms';
import { request } from '@/components/request';
import { recordsSince } from '@/lib/household-schemas';

const form = z.object({ recordsSince: z.preprocess((v) => (v === '' ? null : v), recordsSince) });

export function RecordsSinceForm({ householdId, current, effective }: { householdId: number; current: string | null; effective: string }) {
  const f = useSchemaForm(form, { recordsSince: current ?? '' });
  const [saved, setSaved] = useState<string | null>(null);
  const { errors, isSubmitting } = f.formState;

  const submit = f.handleSubmit(async (data) => {
    setSaved(null);
    try {
      const a = await request<{ household: { recordsSince: string | null } }>('PATCH', `/api/households/${householdId}`, { recordsSince: data.recordsSince });
      setSaved(a.household.recordsSince ? `Records now start in ${a.household.recordsSince}.` : 'Records start by the default rule again.');
    } catch (err) {
      showFailure(f, err);
    }
  });

  return (
    <form onSubmit={submit} noValidate className="card mt-6 max-w-xl" aria-labelledby="records-since-h" data-testid="records-since-form">
      <h2 id="records-since-h" className="text-xl font-bold">When the records start</h2>
      <p className="mt-1 text-sm text-loam-700">
        Now counted from <span className="font-semibold">{effective}</span>. Months before it are not charged any need and stay out
        of the totals. Leave the month empty for the default: the month the household was made or its first entry, whichever is
        earlier.
      </p>
      <Field
        id="recordsSince"
        label="Records start (month)"
        type="month"
        required={false}
        error={errors.recordsSince?.message}
        registration={f.register('recordsSince')}
      />
      <FormAlert message={formMessage(f)} />
      <FormAlert message={saved} tone="ok" />
      <button type="submit" className="btn-primary mt-4" disabled={isSubmitting}>
        {isSubmitting ? 'Saving…' : 'Save'}
      </button>
    </form>
  );
}
