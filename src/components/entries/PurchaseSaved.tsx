/**
 * Bought food once it is sent: the label people see for an entry ("25 kg Wheat flour — over 6
 * months"), the saved entry with its edible portion (for Undo), and the entries waiting on this
 * device. Shared by the entry form and the one-tap staples.
 */
import type { Purchase } from './api';
import type { Outbox } from './outbox';
import { SignInToSend } from './HarvestSaved';
import { formatInUnit, formatQuantity } from './quantity-text';

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

export type PurchaseOutbox = Outbox<{ purchase: Purchase }>;

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
      <SignInToSend items={outbox.items} />
      <button type="button" className="btn-quiet mt-3" onClick={() => void outbox.flush()}>
        Send now
      </button>
    </section>
  );
}
