/**
 * Records what happened to one lot: used up early, lasting longer (with the new end) or spoiled
 * (with the share lost). Checked by the endpoint's own schema before it is sent; the server's
 * answer (e.g. "nothing was left on that day") shows beside the field it is about.
 */
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { FieldError, FormAlert, formMessage, invalidProps, showFailure, useSchemaForm } from '@/components/forms';
import { LARDER_OUTCOME_LABELS, LARDER_OUTCOMES } from '@/lib/larder-outcomes';
import type { LarderOutcomeInput } from '@/lib/larder-schemas';
import { larderKey, recordOutcome } from './larder-api';
import { emptyOutcome, LOST_SHARES, outcomeFormSchema, type OutcomeFormValues } from './outcome-form-values';

interface Props {
  householdId: number;
  harvestId: number;
  today: string;
  onDone: () => void;
}

export function OutcomeForm({ householdId, harvestId, today, onDone }: Props) {
  const client = useQueryClient();
  const form = useSchemaForm<OutcomeFormValues, LarderOutcomeInput>(outcomeFormSchema(harvestId), emptyOutcome(today));
  const { register, handleSubmit, watch, formState } = form;
  const errors = formState.errors;
  const kind = watch('kind');
  const id = (name: string) => `lot-${harvestId}-${name}`;
  const save = useMutation({
    mutationFn: (body: LarderOutcomeInput) => recordOutcome(householdId, body),
    onSuccess: async () => {
      await client.invalidateQueries({ queryKey: larderKey(householdId) });
      onDone();
    },
    onError: (e) => showFailure(form, e),
  });
  return (
    <form className="mt-4 space-y-4 rounded-xl bg-loam-50 p-4" onSubmit={handleSubmit((body) => save.mutate(body))} noValidate data-testid="outcome-form">
      <fieldset>
        <legend className="font-semibold">What happened?</legend>
        <div className="mt-2 grid gap-2 sm:grid-cols-3">
          {LARDER_OUTCOMES.map((k) => (
            <label key={k} className="chip">
              <input type="radio" value={k} {...register('kind')} className="chip-dot" />
              {LARDER_OUTCOME_LABELS[k]}
            </label>
          ))}
        </div>
      </fieldset>
      <div>
        <label htmlFor={id('date')} className="block font-semibold">
          On which day
        </label>
        <input type="date" max={today} className="field mt-1" {...invalidProps(id('date'), errors.date?.message)} {...register('date')} />
        <FieldError id={id('date')} error={errors.date?.message} />
      </div>
      {kind === 'spoiled' ? (
        <div>
          <label htmlFor={id('lost')} className="block font-semibold">
            How much was lost
          </label>
          <select className="field mt-1" {...invalidProps(id('lost'), errors.lostFraction?.message)} {...register('lostFraction')}>
            {LOST_SHARES.map((s) => (
              <option key={s.value} value={s.value}>
                {s.label}
              </option>
            ))}
          </select>
          <FieldError id={id('lost')} error={errors.lostFraction?.message} />
        </div>
      ) : null}
      {kind === 'lasted_longer' ? (
        <div>
          <label htmlFor={id('until')} className="block font-semibold">
            The rest should now last until
          </label>
          <input type="date" className="field mt-1" {...invalidProps(id('until'), errors.until?.message)} {...register('until')} />
          <FieldError id={id('until')} error={errors.until?.message} />
        </div>
      ) : null}
      <div>
        <label htmlFor={id('note')} className="block font-semibold">
          Note <span className="font-normal text-loam-700">(optional)</span>
        </label>
        <input type="text" className="field mt-1" {...invalidProps(id('note'), errors.note?.message)} {...register('note')} />
        <FieldError id={id('note')} error={errors.note?.message} />
      </div>
      <FormAlert message={formMessage(form)} />
      <div className="flex flex-wrap gap-3">
        <button type="submit" className="btn-primary" disabled={save.isPending}>
          {save.isPending ? 'Saving…' : 'Save what happened'}
        </button>
        <button type="button" className="btn-quiet" onClick={onDone}>
          Cancel
        </button>
      </div>
    </form>
  );
}
