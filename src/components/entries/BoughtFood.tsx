/**
 * The bought-food page's one island: the entry form, the staples list and the table share one
 * TanStack Query client (so entering food refreshes the table), one outbox and one Undo toast:
 * on a phone the "Just saved" list sits above the form, so what was just saved is offered for
 * Undo at the thumb as well.
 */
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { canWrite, keys, type HouseholdInfo, type Purchase } from './api';
import { todayIn } from '@/lib/months';
import { undoneText, undoSteps, type UndoAction } from '@/lib/undo-plan';
import { UndoProvider, useUndo } from '@/components/UndoToast';
import { runUndoSteps } from './use-entry-undo';
import { useOutbox } from './outbox';
import { queueScopeOf } from './entry-queue';
import { PurchaseForm } from './PurchaseForm';
import { PurchaseWaiting, savedPurchase, type SavedPurchase } from './PurchaseSaved';
import { PurchaseTable } from './PurchaseTable';
import { QueryProvider } from '@/components/QueryProvider';
import { StapleList } from './StapleList';
import { Alert } from './ui';

interface Props {
  household: HouseholdInfo;
  today: string;
}

export default function BoughtFood(props: Props) {
  return (
    <QueryProvider queue={queueScopeOf(props.household)}>
      <UndoProvider>
        <BoughtFoodInner {...props} />
      </UndoProvider>
    </QueryProvider>
  );
}

function BoughtFoodInner({ household, today: serverToday }: Props) {
  const hid = household.id;
  const qc = useQueryClient();
  const writer = canWrite(household.role);
  const [today] = useState(() => (typeof window === 'undefined' ? serverToday : todayIn(household.timezone)));
  const [saved, setSaved] = useState<SavedPurchase[]>([]);
  const [alert, setAlert] = useState<string | null>(null);
  const toast = useUndo();
  const actionOf = (s: SavedPurchase): UndoAction => ({ kind: 'purchase-saved', purchase: s.purchase });
  // Deletes what was saved; already gone (undone in another tab) counts as undone.
  const undoSaved = async (s: SavedPurchase) => {
    await runUndoSteps(hid, undoSteps(actionOf(s)));
    setSaved((list) => list.filter((x) => x.key !== s.key));
    void qc.invalidateQueries({ queryKey: keys.purchases(hid) });
    return s;
  };
  const add = (s: SavedPurchase) => {
    setSaved((list) => [s, ...list.filter((x) => x.key !== s.key)].slice(0, 5));
    // Sent later by the outbox: the list says so; a toast for each would bury the current one.
    if (!s.later) toast({ message: `Saved ${s.label} · edible ${s.edible}`, undo: () => undoSaved(s).then(() => undoneText(actionOf(s))) });
  };
  const outbox = useOutbox<{ purchase: Purchase }>('purchases', hid, (item, data) => {
    add(savedPurchase(item.key, item.label, data.purchase, true));
    void qc.invalidateQueries({ queryKey: keys.purchases(hid) });
  });
  const undo = useMutation({
    mutationFn: undoSaved,
    onSuccess: (s) => toast({ message: undoneText(actionOf(s)) }),
    onError: (e) => setAlert(`Could not undo: ${(e as Error).message}`),
  });

  return (
    <div>
      {writer ? (
        <div className="grid gap-6 lg:grid-cols-[3fr_2fr]">
          <div>
            <PurchaseForm household={household} today={today} outbox={outbox} onSaved={add} />
          </div>
          {/* On a phone the staples come first: one tap is quicker than the form. */}
          <div className="max-lg:order-first">
            <StapleList household={household} today={today} outbox={outbox} onSaved={add} writer={writer} />
            <section aria-label="Just saved" aria-live="polite" className="mt-4" data-testid="purchase-saved">
              {saved.map((s, i) => (
                <div key={s.key} className={`flex flex-wrap items-center gap-3 rounded-2xl border p-4 ${i === 0 ? 'border-sprout-300 bg-sprout-100' : 'mt-2 border-loam-200 bg-white'}`}>
                  <div className="min-w-0 flex-1">
                    <p className="text-sm font-semibold text-sprout-900">{s.later ? 'Sent and saved' : 'Saved'}</p>
                    <p className="font-bold">{s.label}</p>
                    <p className="text-sm text-loam-700">edible portion {s.edible}</p>
                  </div>
                  <button type="button" className="btn-quiet" disabled={undo.isPending && undo.variables?.key === s.key} onClick={() => undo.mutate(s)}>
                    Undo
                  </button>
                </div>
              ))}
            </section>
            <PurchaseWaiting outbox={outbox} />
            <Alert message={alert} />
          </div>
        </div>
      ) : (
        <StapleList household={household} today={today} outbox={outbox} onSaved={add} writer={false} />
      )}
      <div className="mt-8">
        <PurchaseTable household={household} writer={writer} />
      </div>
    </div>
  );
}
