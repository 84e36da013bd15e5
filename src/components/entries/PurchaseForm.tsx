/**
 * Entering bought food: a reference food (with its refuse and energy/protein per 100 g), quantity
 * and unit, price and currency, the months a bulk buy lasts (a 25 kg sack of flour over six), and
 * "save as staple" for one-tap repeats. Sent through the outbox with an Idempotency-Key, like the
 * harvest form, so a dropped connection keeps the entry and never stores it twice.
 */
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useEffect, useRef, useState, type FormEvent } from 'react';
import { purchaseInput, stapleInput, zodErrorBody } from '../../lib/entry-schemas';
import { ApiError, keys, newIdempotencyKey, request, urls, type HouseholdInfo, type Purchase, type Staple } from './api';
import { FoodPicker, type FoodChoice } from './FoodPicker';
import type { Outbox } from './outbox';
import { formatInUnit, formatQuantity, parseDecimal } from './quantity-text';
import { Alert, ErrorText, invalidProps, UnitToggle, useRememberedUnit, type Errors } from './ui';

export interface SavedPurchase {
  key: string;
  label: string;
  edible: string;
  purchase: Purchase;
  later?: boolean;
}

/** "25 kg Wheat flour — over 6 months". */
export function purchaseLabel(quantity: number, unit: Purchase['unit'], name: string, spread: number): string {
  return `${formatQuantity(quantity, unit)} ${name}${spread > 1 ? ` — over ${spread} months` : ''}`;
}

export function savedPurchase(key: string, label: string, p: Purchase, later = false): SavedPurchase {
  return { key, label, edible: formatInUnit(p.edibleGrams, p.unit), purchase: p, later };
}

function useRememberedCurrency(householdId: number, fallback: string): [string, (c: string) => void] {
  const key = `selfsown:currency:${householdId}`;
  const [c, setC] = useState(fallback);
  useEffect(() => {
    try {
      const saved = localStorage.getItem(key);
      if (saved && /^[A-Z]{3}$/.test(saved)) setC(saved);
    } catch {
      /* storage unavailable */
    }
  }, [key]);
  const remember = (v: string) => {
    try {
      if (/^[A-Z]{3}$/.test(v)) localStorage.setItem(key, v);
    } catch {
      /* storage unavailable */
    }
  };
  return [c, (v) => (setC(v), remember(v.toUpperCase()))];
}

export type PurchaseOutbox = Outbox<{ purchase: Purchase }>;

export function PurchaseForm({ household, today, outbox, onSaved }: { household: HouseholdInfo; today: string; outbox: PurchaseOutbox; onSaved: (s: SavedPurchase) => void }) {
  const hid = household.id;
  const api = urls(hid);
  const qc = useQueryClient();
  const formRef = useRef<HTMLFormElement>(null);
  const [food, setFood] = useState<FoodChoice | null>(null);
  const [quantity, setQuantity] = useState('');
  const [unit, setUnit] = useRememberedUnit(hid, household.units, 'purchase-unit');
  const [price, setPrice] = useState('');
  const [currency, setCurrency] = useRememberedCurrency(hid, household.units === 'us' ? 'USD' : '');
  const [spread, setSpread] = useState('1');
  const [date, setDate] = useState(today);
  const [trimmed, setTrimmed] = useState(false);
  const [note, setNote] = useState('');
  const [asStaple, setAsStaple] = useState(false);
  const [stapleLabel, setStapleLabel] = useState('');
  const [errors, setErrors] = useState<Errors>({});
  const [alert, setAlert] = useState<{ tone: 'error' | 'ok'; text: string } | null>(null);
  const [busy, setBusy] = useState(false);

  const addStaple = useMutation({
    mutationFn: (body: unknown) => request<{ staple: Staple }>('POST', api.staples(), body),
    onSuccess: (r) => {
      void qc.invalidateQueries({ queryKey: keys.staples(hid) });
      setAlert({ tone: 'ok', text: `“${r.staple.label}” is on your staples list: one tap logs it again.` });
    },
    onError: (e) => setAlert({ tone: 'error', text: `Saved the purchase, but not as a staple: ${(e as Error).message}` }),
  });

  async function submit(e: FormEvent) {
    e.preventDefault();
    setAlert(null);
    const spreadN = parseDecimal(spread);
    const priceN = parseDecimal(price);
    const raw = {
      date,
      foodId: food?.id,
      quantity: parseDecimal(quantity),
      unit,
      price: priceN,
      currency: priceN === undefined || currency.trim() === '' ? undefined : currency,
      spreadMonths: spreadN ?? 1,
      trimmed,
      note: note.trim() === '' ? undefined : note,
    };
    const r = purchaseInput.safeParse(raw);
    const errs: Errors = r.success ? {} : zodErrorBody(r.error).fields;
    if (!food) errs.foodId = 'Choose the food you bought from the reference foods.';
    if (priceN !== undefined && currency.trim() === '') errs.currency = 'Give the currency of the price, e.g. EUR or USD.';
    setErrors(errs);
    if (!r.success || Object.keys(errs).length > 0) {
      const first = Object.keys(errs)[0];
      const id = first === 'foodId' ? 'p-food' : `p-${first}`;
      formRef.current?.querySelector<HTMLElement>(`#${CSS.escape(id)}`)?.focus();
      return;
    }
    const key = newIdempotencyKey();
    const label = purchaseLabel(r.data.quantity, r.data.unit, food!.name, r.data.spreadMonths);
    setBusy(true);
    try {
      const res = await outbox.submit(api.purchases(), r.data, label, key);
      if (res.status === 'saved') {
        onSaved(savedPurchase(key, label, res.data.purchase));
        void qc.invalidateQueries({ queryKey: keys.purchases(hid) });
      }
      if (asStaple) {
        const s = stapleInput.safeParse({ foodId: r.data.foodId, label: stapleLabel, quantity: r.data.quantity, unit: r.data.unit, spreadMonths: r.data.spreadMonths });
        if (s.success) addStaple.mutate(s.data);
      }
      setQuantity('');
      setPrice('');
      setNote('');
      setSpread('1');
      setAsStaple(false);
      setStapleLabel('');
      setFood(null);
    } catch (err) {
      if (err instanceof ApiError) setErrors(err.fields);
      setAlert({ tone: 'error', text: (err as Error).message });
    } finally {
      setBusy(false);
    }
  }

  return (
    <form ref={formRef} onSubmit={submit} noValidate className="card" aria-labelledby="purchase-title">
      <h2 id="purchase-title" className="text-xl font-bold">
        Enter bought food
      </h2>
      <FoodPicker id="p-food" label="Food bought" value={food} onChange={setFood} error={errors.foodId} hint="Search the reference foods, e.g. “wheat flour whole”, “rice brown”, “milk”." />

      <div className="mt-5">
        <label htmlFor="p-quantity" className="block text-lg font-bold">
          Weight
        </label>
        <div className="mt-1 flex flex-wrap items-stretch gap-2">
          <input
            {...invalidProps('p-quantity', errors.quantity)}
            type="text"
            inputMode="decimal"
            autoComplete="off"
            placeholder="0"
            className={`field min-h-16 w-40 flex-1 text-right text-4xl font-extrabold tabular-nums placeholder:font-normal placeholder:text-loam-200 ${errors.quantity ? 'border-berry-700 ring-1 ring-berry-700' : ''}`}
            value={quantity}
            onChange={(e) => setQuantity(e.target.value)}
          />
          <div className="w-full sm:w-64">
            <UnitToggle name="p-unit" value={unit} onChange={setUnit} label="Weight unit" />
          </div>
        </div>
        <ErrorText id="p-quantity" error={errors.quantity} />
      </div>

      <div className="mt-4 grid grid-cols-2 gap-3">
        <div>
          <label htmlFor="p-price" className="block font-semibold">
            Price <span className="font-normal text-loam-700">(optional)</span>
          </label>
          <input {...invalidProps('p-price', errors.price)} type="text" inputMode="decimal" className="field mt-1 text-right tabular-nums" value={price} onChange={(e) => setPrice(e.target.value)} />
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
            placeholder="EUR"
            autoCapitalize="characters"
            value={currency}
            onChange={(e) => setCurrency(e.target.value.toUpperCase())}
          />
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
        <input
          {...invalidProps('p-spreadMonths', errors.spreadMonths, true)}
          type="text"
          inputMode="numeric"
          className="field mt-1 w-32 text-xl"
          value={spread}
          onChange={(e) => setSpread(e.target.value.replace(/[^\d]/g, ''))}
        />
        <ErrorText id="p-spreadMonths" error={errors.spreadMonths} />
      </div>

      <div className="mt-4 grid gap-4 sm:grid-cols-2">
        <div>
          <label htmlFor="p-date" className="block font-semibold">
            Date {date === today ? <span className="font-normal text-loam-700">(today)</span> : null}
          </label>
          <input {...invalidProps('p-date', errors.date)} type="date" className="field mt-1" value={date} onChange={(e) => setDate(e.target.value)} />
          <ErrorText id="p-date" error={errors.date} />
        </div>
        <label className="flex min-h-12 cursor-pointer items-center gap-3 self-end rounded-xl border border-loam-200 bg-loam-50 px-4 py-2">
          <input type="checkbox" className="size-6 accent-sprout-700" checked={trimmed} onChange={(e) => setTrimmed(e.target.checked)} />
          <span>
            <span className="font-semibold">Bought ready to eat</span>
            <span className="block text-sm text-loam-700">no peel, stones or bones to take off</span>
          </span>
        </label>
      </div>

      <div className="mt-4">
        <label htmlFor="p-note" className="block font-semibold">
          Note <span className="font-normal text-loam-700">(optional)</span>
        </label>
        <input {...invalidProps('p-note', errors.note)} type="text" className="field mt-1" maxLength={500} value={note} onChange={(e) => setNote(e.target.value)} />
        <ErrorText id="p-note" error={errors.note} />
      </div>

      <label className="mt-4 flex min-h-12 cursor-pointer items-center gap-3">
        <input type="checkbox" className="size-6 accent-sprout-700" checked={asStaple} onChange={(e) => setAsStaple(e.target.checked)} />
        <span className="font-semibold">Also save as a staple (one tap next time)</span>
      </label>
      {asStaple ? (
        <div className="mt-2">
          <label htmlFor="p-staple-label" className="block text-sm font-semibold">
            Staple name <span className="font-normal text-loam-700">(optional; the food’s name otherwise)</span>
          </label>
          <input id="p-staple-label" type="text" className="field mt-1" maxLength={120} value={stapleLabel} onChange={(e) => setStapleLabel(e.target.value)} placeholder="e.g. Flour sack" />
        </div>
      ) : null}

      <button type="submit" className="btn-primary mt-6 min-h-16 w-full text-xl" disabled={busy}>
        {busy ? 'Saving…' : 'Save bought food'}
      </button>
      {alert ? <Alert tone={alert.tone} message={alert.text} /> : null}
    </form>
  );
}

/** Bought food kept on this device until Selfsown can be reached (or refused, to discard). */
export function PurchaseWaiting({ outbox }: { outbox: PurchaseOutbox }) {
  if (outbox.items.length === 0) return null;
  return (
    <section aria-label="Waiting to send" className="mt-4 rounded-2xl border-l-4 border-rind-500 bg-rind-100 p-4" data-testid="purchase-waiting">
      <ul className="space-y-2">
        {outbox.items.map((i) => (
          <li key={i.key}>
            <span className="font-semibold">{i.label}</span>{' '}
            {i.refused ? (
              <>
                <span className="text-berry-700">— not saved: {i.lastError}</span>{' '}
                <button type="button" className="btn-quiet ml-2" onClick={() => outbox.discard(i.key)}>
                  Discard
                </button>
              </>
            ) : (
              <span className="text-sm text-loam-700">· waiting to send</span>
            )}
          </li>
        ))}
      </ul>
      <button type="button" className="btn-quiet mt-3" onClick={() => void outbox.flush()}>
        Send now
      </button>
    </section>
  );
}
