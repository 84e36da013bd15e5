/**
 * Arranging the crop buttons: pin the crops a grower reaches for first, put them in order, unpin
 * them. Every step is a plain button (keyboard and screen readers work as they do everywhere,
 * 48 px targets); the focus follows the crop that moved, and a status line says where it went.
 * Nothing is sent until "Save order": then the whole list goes in one PUT …/crops/pins.
 */
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useEffect, useRef, useState } from 'react';
import { movePin, pinnedIds, togglePin } from '@/lib/crop-pins';
import { keys, request, type Crop } from './api';
import { Alert } from './ui';

const byName = new Intl.Collator('en', { sensitivity: 'base', numeric: true });

export function ChipArrange({ crops, householdId, onSaved, onClose }: { crops: Crop[]; householdId: number; onSaved: (crops: Crop[]) => void; onClose: () => void }) {
  const qc = useQueryClient();
  const [pins, setPins] = useState(() => pinnedIds(crops));
  const [said, setSaid] = useState('');
  const focusNext = useRef<string | null>(null);
  const panel = useRef<HTMLDivElement>(null);
  const byId = new Map(crops.map((c) => [c.id, c]));
  const pinned = pins.flatMap((id) => byId.get(id) ?? []);
  const others = crops.filter((c) => !pins.includes(c.id)).sort((a, b) => byName.compare(a.displayName, b.displayName));

  // A moved crop keeps the focus, wherever its button went.
  useEffect(() => {
    if (!focusNext.current) return;
    panel.current?.querySelector<HTMLElement>(`[data-arrange="${focusNext.current}"]:not(:disabled)`)?.focus();
    focusNext.current = null;
  });

  const save = useMutation({
    mutationFn: () => request<{ crops: Crop[] }>('PUT', `/api/households/${householdId}/crops/pins`, { cropIds: pins }),
    onSuccess: (r) => {
      qc.setQueryData(keys.crops(householdId), r.crops);
      onSaved(r.crops);
    },
  });

  function change(next: number[], focus: string, message: string) {
    setPins(next);
    focusNext.current = focus;
    setSaid(message);
  }
  const move = (c: Crop, step: -1 | 1) => {
    const next = movePin(pins, c.id, step);
    const place = next.indexOf(c.id) + 1;
    // At the top or bottom the button goes dim: the focus goes to the other direction.
    const stuck = place === 1 ? 'down' : place === next.length ? 'up' : step < 0 ? 'up' : 'down';
    change(next, `${stuck}-${c.id}`, `${c.displayName} is now pinned ${place} of ${next.length}.`);
  };

  return (
    <div ref={panel} className="mt-4 rounded-2xl border border-loam-200 bg-loam-50 p-4" data-testid="chip-arrange">
      <h3 className="font-bold">Arrange your crop buttons</h3>
      <p className="text-sm text-loam-700">Pinned crops come first, in this order. The rest follow by how often you harvested them in the last year.</p>
      <p role="status" className="sr-only">
        {said}
      </p>

      <h4 className="mt-3 font-semibold">Pinned</h4>
      {pinned.length === 0 ? <p className="text-sm text-loam-700">None yet: pin the crops you reach for most.</p> : null}
      <ol className="mt-1 space-y-2">
        {pinned.map((c, i) => (
          <li key={c.id} className="flex flex-wrap items-center gap-2 rounded-xl border border-loam-200 bg-white p-2">
            <span className="min-w-0 flex-1 font-semibold">
              {i + 1}. {c.displayName}
            </span>
            <button type="button" data-arrange={`up-${c.id}`} className="btn-quiet min-h-12 min-w-12 px-3 disabled:opacity-40" disabled={i === 0} aria-label={`Move ${c.displayName} up`} onClick={() => move(c, -1)}>
              Up
            </button>
            <button type="button" data-arrange={`down-${c.id}`} className="btn-quiet min-h-12 min-w-12 px-3 disabled:opacity-40" disabled={i === pinned.length - 1} aria-label={`Move ${c.displayName} down`} onClick={() => move(c, 1)}>
              Down
            </button>
            <button type="button" data-arrange={`unpin-${c.id}`} className="btn-quiet min-h-12 px-3" aria-label={`Unpin ${c.displayName}`} onClick={() => change(togglePin(pins, c.id), `pin-${c.id}`, `${c.displayName} is no longer pinned.`)}>
              Unpin
            </button>
          </li>
        ))}
      </ol>

      {others.length > 0 ? (
        <>
          <h4 className="mt-4 font-semibold">Not pinned</h4>
          <ul className="mt-1 flex flex-wrap gap-2">
            {others.map((c) => (
              <li key={c.id}>
                <button
                  type="button"
                  data-arrange={`pin-${c.id}`}
                  className="btn-quiet min-h-12 px-3"
                  aria-label={`Pin ${c.displayName}`}
                  onClick={() => change(togglePin(pins, c.id), `unpin-${c.id}`, `${c.displayName} is pinned ${pins.length + 1} of ${pins.length + 1}.`)}
                >
                  + {c.displayName}
                </button>
              </li>
            ))}
          </ul>
        </>
      ) : null}

      <div className="mt-4 flex flex-wrap gap-2">
        <button type="button" className="btn-primary" disabled={save.isPending} onClick={() => save.mutate()}>
          {save.isPending ? 'Saving…' : 'Save order'}
        </button>
        <button type="button" className="btn-quiet" onClick={onClose}>
          Cancel
        </button>
      </div>
      {save.isError ? <Alert message={`Could not save the order: ${(save.error as Error).message}`} /> : null}
    </div>
  );
}
