/**
 * Entering bought food: a reference food (with its refuse and energy/protein per 100 g), quantity
 * and unit, price and currency, the months a bulk buy lasts (a 25 kg sack of flour over six), and
 * "save as staple" for one-tap repeats. The form is react-hook-form, checked by the endpoint's
 * own zod schema (purchase-form-values.ts). Sent through the outbox with an Idempotency-Key, like the
 * harvest form, so a dropped connection keeps the entry and never stores it twice.
 */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useRef, useState, type FormEvent } from 'react';
import { Controller, useForm } from 'react-hook-form';
import { stapleInput, type PurchaseInput } from '@/lib/entry-schemas';
import { ApiError, foodDetail, keys, newIdempotencyKey, request, urls, type HouseholdInfo, type Staple } from './api';
import { FoodPicker } from './FoodPicker';
import { flatErrors } from './form-errors';
import { purchaseLabel, savedPurchase, type PurchaseOutbox, type SavedPurchase } from './PurchaseSaved';
import { emptyPurchaseValues, purchaseResolver, type PurchaseFormContext, type PurchaseFormValues } from './purchase-form-values';
import { Alert, ErrorText, invalidProps, useRememberedCurrency, useRememberedUnit, type Errors } from './ui';
import { CheckCard, NoteField } from './entry-form-fields';
import { WeightField } from './WeightField';
import { foodWeighBasis } from './unit-basis';
import { currencyChoices, currencyForZone } from '@/lib/currency';
import { parseDecimal } from './quantity-text';

export function PurchaseForm({ household, today, outbox, onSaved }: { household: HouseholdInfo; today: string; outbox: PurchaseOutbox; onSaved: (s: SavedPurchase) => void }) {
  const hid = household.id;
  const api = urls(hid);
  const qc = useQueryClient();
  const formRef = useRef<HTMLFormElement>(null);
  const [unit, setUnit] = useRememberedUnit(hid, household.units, 'purchase-unit');
  const [currency, setCurrency] = useRememberedCurrency(hid, household.currency);
  const [alert, setAlert] = useState<{ tone: 'error' | 'ok'; text: string } | null>(null);
  const { control, register, watch, getValues, reset, setError, handleSubmit, formState } = useForm<PurchaseFormValues, PurchaseFormContext, PurchaseInput>({
    defaultValues: emptyPurchaseValues(today),
    resolver: purchaseResolver,
    // Errors show after Save and stay until the next Save.
    mode: 'onSubmit',
    reValidateMode: 'onSubmit',
    shouldFocusError: false,
    context: { unit, currency },
  });
  const errors: Errors = flatErrors(formState.errors);
  const [date, asStaple, chosenFood, typed] = watch(['date', 'asStaple', 'food', 'quantity']);
  // The chosen food's household measures (the picker reads the same query), for a count or volume.
  const detail = useQuery({ queryKey: keys.food(chosenFood?.id ?? 0), queryFn: () => foodDetail(chosenFood!.id), enabled: chosenFood != null, staleTime: 10 * 60_000 });

  const addStaple = useMutation({
    mutationFn: (body: unknown) => request<{ staple: Staple }>('POST', api.staples(), body),
    onSuccess: (r) => {
      void qc.invalidateQueries({ queryKey: keys.staples(hid) });
      setAlert({ tone: 'ok', text: `“${r.staple.label}” is on your staples list: one tap logs it again.` });
    },
    onError: (e) => setAlert({ tone: 'error', text: `Saved the purchase, but not as a staple: ${(e as Error).message}` }),
  });

  function focusFirst(errs: Errors) {
    const first = Object.keys(errs)[0];
    if (!first) return;
    const id = first === 'foodId' ? 'p-food' : `p-${first}`;
    formRef.current?.querySelector<HTMLElement>(`#${CSS.escape(id)}`)?.focus();
  }

  async function save(body: PurchaseInput) {
    const { food, asStaple: staple, stapleLabel } = getValues();
    const key = newIdempotencyKey();
    const label = purchaseLabel(body.quantity, body.unit, food!.name, body.spreadMonths);
    try {
      const res = await outbox.submit(api.purchases(), body, label, key);
      if (res.status === 'saved') {
        onSaved(savedPurchase(key, label, res.data.purchase));
        void qc.invalidateQueries({ queryKey: keys.purchases(hid) });
      }
      if (staple) {
        const s = stapleInput.safeParse({ foodId: body.foodId, label: stapleLabel, quantity: body.quantity, unit: body.unit, spreadMonths: body.spreadMonths });
        if (s.success) addStaple.mutate(s.data);
      }
      // The next entry keeps the date and the ready-to-eat flag.
      reset({ ...emptyPurchaseValues(today), date: getValues('date'), trimmed: getValues('trimmed') });
    } catch (err) {
      if (err instanceof ApiError) for (const [field, message] of Object.entries(err.fields)) setError(field as keyof PurchaseFormValues, { type: 'server', message });
      setAlert({ tone: 'error', text: (err as Error).message });
    }
  }

  function submit(e: FormEvent) {
    setAlert(null);
    void handleSubmit(save, (errs) => focusFirst(flatErrors(errs)))(e);
  }

  const busy = formState.isSubmitting;

  return (
    <form ref={formRef} onSubmit={submit} noValidate className="card" aria-labelledby="purchase-title">
      <h2 id="purchase-title" className="text-xl font-bold">
        Enter bought food
      </h2>
      <Controller
        control={control}
        name="food"
        render={({ field }) => <FoodPicker id="p-food" label="Food bought" value={field.value} onChange={field.onChange} error={errors.foodId} hint="Search the reference foods, e.g. “wheat flour whole”, “rice brown”, “milk”." />}
      />

      <WeightField
        id="p-quantity"
        label="Weight"
        input={register('quantity')}
        error={errors.quantity}
        unitName="p-unit"
        unit={unit}
        onUnit={setUnit}
        weigh={{ basis: chosenFood ? foodWeighBasis(detail.data) : null, quantity: parseDecimal(typed), units: household.units }}
      />

      <div className="mt-4 grid grid-cols-2 gap-3">
        <div>
          <label htmlFor="p-price" className="block font-semibold">
            Price <span className="font-normal text-loam-700">(optional)</span>
          </label>
          <input {...invalidProps('p-price', errors.price)} {...register('price')} type="text" inputMode="decimal" className="field mt-1 text-right tabular-nums" />
          <ErrorText id="p-price" error={errors.price} />
        </div>
        <div>
          <label htmlFor="p-currency" className="block font-semibold">
            Currency
          </label>
          <input
            {...invalidProps('p-currency', errors.currency)}
            type="text"
            className="field mt-1 uppercase"
            maxLength={3}
            // Never a currency the household does not use: its own, or the guess from its time zone.
            placeholder={household.currency ?? currencyForZone(household.timezone) ?? undefined}
            autoCapitalize="characters"
            list="p-currency-codes"
            value={currency}
            onChange={(e) => setCurrency(e.target.value.toUpperCase())}
          />
          {/* The household's own currency is offered first, never one it does not use ahead of it. */}
          <datalist id="p-currency-codes">
            {currencyChoices(household.currency).map((c) => (
              <option key={c} value={c} />
            ))}
          </datalist>
          <ErrorText id="p-currency" error={errors.currency} />
        </div>
      </div>

      <div className="mt-4">
        <label htmlFor="p-spreadMonths" className="block font-semibold">
          Eaten over how many months?
        </label>
        <p id="p-spreadMonths-hint" className="text-sm text-loam-700">
          1 for the week’s shopping; more for a bulk buy — a 25 kg sack of flour might last 6.
        </p>
        <Controller
          control={control}
          name="spreadMonths"
          render={({ field }) => (
            <input
              {...invalidProps('p-spreadMonths', errors.spreadMonths, true)}
              type="text"
              inputMode="numeric"
              className="field mt-1 w-32 text-xl"
              value={field.value}
              onChange={(e) => field.onChange(e.target.value.replace(/[^\d]/g, ''))}
            />
          )}
        />
        <ErrorText id="p-spreadMonths" error={errors.spreadMonths} />
      </div>

      <div className="mt-4 grid gap-4 sm:grid-cols-2">
        <div>
          <label htmlFor="p-date" className="block font-semibold">
            Date {date === today ? <span className="font-normal text-loam-700">(today)</span> : null}
          </label>
          <input {...invalidProps('p-date', errors.date)} {...register('date')} type="date" className="field mt-1" />
          <ErrorText id="p-date" error={errors.date} />
        </div>
        <CheckCard registration={register('trimmed')} title="Bought ready to eat" hint="no peel, stones or bones to take off" />
      </div>

      <NoteField id="p-note" registration={register('note')} error={errors.note} />

      <label className="mt-4 flex min-h-12 cursor-pointer items-center gap-3">
        <input type="checkbox" {...register('asStaple')} className="size-6 accent-sprout-700" />
        <span className="font-semibold">Also save as a staple (one tap next time)</span>
      </label>
      {asStaple ? (
        <div className="mt-2">
          <label htmlFor="p-staple-label" className="block text-sm font-semibold">
            Staple name <span className="font-normal text-loam-700">(optional; the food’s name otherwise)</span>
          </label>
          <input id="p-staple-label" {...register('stapleLabel')} type="text" className="field mt-1" maxLength={120} placeholder="e.g. Flour sack" />
        </div>
      ) : null}

      <button type="submit" className="btn-primary mt-6 min-h-16 w-full text-xl" disabled={busy}>
        {busy ? 'Saving…' : 'Save bought food'}
      </button>
      {alert ? <Alert tone={alert.tone} message={alert.text} /> : null}
    </form>
  );
}
