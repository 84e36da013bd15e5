/**
 * The order of food composition datasets this household's food search follows (owner only, React
 * island): the first dataset's foods come first in every search; the others follow in their turn.
 * Saved with PUT /api/households/{id}/datasets, checked by the same zod schema.
 */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useEffect, useState } from 'react';
import { FormAlert } from '@/components/forms';
import { get, request } from '@/components/request';
import type { DatasetSummary } from '@/lib/dataset-order';
import { countText } from '@/lib/plural';

export function DatasetOrderForm({ householdId }: { householdId: number }) {
  const url = `/api/households/${householdId}/datasets`;
  const client = useQueryClient();
  const q = useQuery({ queryKey: ['datasets', householdId], queryFn: () => get<{ datasets: DatasetSummary[] }>(url) });
  const [order, setOrder] = useState<DatasetSummary[]>([]);
  useEffect(() => {
    if (q.data) setOrder(q.data.datasets);
  }, [q.data]);
  const save = useMutation({
    mutationFn: () => request<{ order: string[] }>('PUT', url, { order: order.map((d) => d.slug) }),
    onSuccess: () => client.invalidateQueries({ queryKey: ['foods'] }),
  });

  function move(i: number, by: -1 | 1) {
    const next = order.slice();
    const [d] = next.splice(i, 1);
    next.splice(i + by, 0, d!);
    setOrder(next);
    save.reset();
  }

  return (
    <section className="card mt-6 max-w-xl" aria-labelledby="datasets-h" data-testid="dataset-order">
      <h2 id="datasets-h" className="text-xl font-bold">Reference food datasets</h2>
      <p className="mt-1 text-sm text-loam-700">
        Food search looks in every dataset; the first one’s foods come first. Crops and entries keep the food they were matched
        to, whatever the order.
      </p>
      {q.isError ? <FormAlert message={`Could not load the datasets: ${(q.error as Error).message}`} /> : null}
      <ol className="mt-3 grid gap-2">
        {order.map((d, i) => (
          <li key={d.slug} className="flex items-center justify-between gap-3 rounded-xl border border-loam-200 bg-white px-3 py-2" data-testid={`dataset-${d.slug}`}>
            <span>
              <span className="font-semibold">{i + 1}. {d.name}</span>
              <span className="block text-sm text-loam-700">
                {d.release} · {countText(d.foodCount, 'food')}
              </span>
            </span>
            <span className="flex gap-1">
              <button type="button" className="btn-quiet min-h-target px-3" disabled={i === 0} onClick={() => move(i, -1)} aria-label={`Move ${d.name} up`}>
                ↑
              </button>
              <button type="button" className="btn-quiet min-h-target px-3" disabled={i === order.length - 1} onClick={() => move(i, 1)} aria-label={`Move ${d.name} down`}>
                ↓
              </button>
            </span>
          </li>
        ))}
      </ol>
      <FormAlert message={save.isError ? (save.error as Error).message : null} />
      <FormAlert message={save.isSuccess ? 'Saved: food search follows this order.' : null} tone="ok" />
      <button type="button" className="btn-primary mt-4" disabled={save.isPending || order.length === 0} onClick={() => save.mutate()}>
        {save.isPending ? 'Saving…' : 'Save order'}
      </button>
    </section>
  );
}
