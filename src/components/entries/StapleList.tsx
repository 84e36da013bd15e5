/**
 * The household's staples: the foods it buys again and again, each one tap to log as bought today
 * (POST staples/{id}/log through the outbox, with an Idempotency-Key), and removable.
 */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { get, keys, newIdempotencyKey, request, urls, type HouseholdInfo, type Staple } from './api';
import { purchaseLabel, savedPurchase, type PurchaseOutbox, type SavedPurchase } from './PurchaseSaved';
import { Alert, ConfirmDelete } from './ui';
import { formatQuantity } from './quantity-text';

export function StapleList({ household, today, outbox, onSaved, writer }: { household: HouseholdInfo; today: string; outbox: PurchaseOutbox; onSaved: (s: SavedPurchase) => void; writer: boolean }) {
  const hid = household.id;
  const api = urls(hid);
  const qc = useQueryClient();
  const [alert, setAlert] = useState<string | null>(null);
  const [logging, setLogging] = useState<number | null>(null);
  const list = useQuery({ queryKey: keys.staples(hid), queryFn: () => get<{ staples: Staple[] }>(api.staples()).then((r) => r.staples) });
  const remove = useMutation({
    mutationFn: (id: number) => request<null>('DELETE', api.staple(id)),
    onSuccess: () => void qc.invalidateQueries({ queryKey: keys.staples(hid) }),
    onError: (e) => setAlert((e as Error).message),
  });

  async function log(s: Staple) {
    setAlert(null);
    setLogging(s.id);
    const key = newIdempotencyKey();
    const label = purchaseLabel(s.quantity, s.unit, s.label, s.spreadMonths);
    try {
      const r = await outbox.submit(api.stapleLog(s.id), { date: today }, label, key);
      if (r.status === 'saved') {
        onSaved(savedPurchase(key, label, r.data.purchase));
        void qc.invalidateQueries({ queryKey: keys.purchases(hid) });
      }
    } catch (e) {
      setAlert((e as Error).message);
    } finally {
      setLogging(null);
    }
  }

  const staples = list.data ?? [];
  return (
    <section aria-labelledby="staples-title" className="card">
      <h2 id="staples-title" className="text-xl font-bold">
        Staples
      </h2>
      {list.isPending ? <p className="mt-2 text-loam-700">Loading…</p> : null}
      {list.isError ? <Alert message={`Could not load the staples: ${(list.error as Error).message}`} /> : null}
      {list.isSuccess && staples.length === 0 ? (
        <p className="mt-2 text-loam-700">Nothing here yet. When you enter bought food, tick “Also save as a staple” and it shows here, one tap to log again.</p>
      ) : null}
      <ul className="mt-3 space-y-2" data-testid="staples">
        {staples.map((s) => (
          <li key={s.id} className="flex flex-wrap items-center gap-2">
            {writer ? (
              <button type="button" className="btn-quiet min-h-14 flex-1 justify-start text-left" disabled={logging === s.id} onClick={() => void log(s)}>
                <span className="text-2xl leading-none text-sprout-700" aria-hidden="true">
                  +
                </span>
                <span>
                  <span className="block font-bold">
                    {s.label} · {formatQuantity(s.quantity, s.unit)}
                  </span>
                  <span className="block text-xs font-normal text-loam-700">
                    {logging === s.id ? 'Logging…' : `Log as bought today${s.spreadMonths > 1 ? `, eaten over ${s.spreadMonths} months` : ''}`}
                  </span>
                </span>
              </button>
            ) : (
              <span className="flex-1">
                <span className="font-bold">{s.label}</span> · {formatQuantity(s.quantity, s.unit)}
              </span>
            )}
            {writer ? <ConfirmDelete label="Remove" what={s.label} busy={remove.isPending} onConfirm={() => remove.mutate(s.id)} /> : null}
          </li>
        ))}
      </ul>
      <Alert message={alert} />
    </section>
  );
}
