/**
 * What the harvest form shows after a save: the entries just saved, each with an Undo (and the
 * edible portion worked out by the server), and the entries waiting on this device to be sent.
 */
import { useEffect, useRef } from 'react';
import type { Harvest } from './api';
import type { OutboxItem } from './outbox';

/** One saved weighing (a split is several harvests under one Undo). */
export interface SavedEntry {
  key: string;
  label: string;
  edible: string;
  harvests: Harvest[];
  later?: boolean;
}

export function SavedList({ saved, onUndo, undoing }: { saved: SavedEntry[]; onUndo: (s: SavedEntry) => void; undoing: string | undefined }) {
  const ref = useRef<HTMLElement>(null);
  const newest = saved[0]?.key;
  // On a phone the confirmation lands below the fold: bring it up so the thumb sees it (and Undo),
  // clear of the bottom bar (scroll-mb-24).
  useEffect(() => {
    if (newest) ref.current?.scrollIntoView({ block: 'nearest', behavior: 'smooth' });
  }, [newest]);
  return (
    <section ref={ref} aria-label="Just saved" aria-live="polite" className="mt-4 scroll-mb-24 sm:scroll-mb-4" data-testid="just-saved">
      {saved.map((s, i) => (
        <div key={s.key} className={`flex flex-wrap items-center gap-3 rounded-2xl border p-4 ${i === 0 ? 'border-sprout-300 bg-sprout-100' : 'mt-2 border-loam-200 bg-white'}`}>
          <div className="min-w-0 flex-1">
            <p className="text-sm font-semibold text-sprout-900">{s.later ? 'Sent and saved' : 'Saved'}</p>
            <p className="text-lg font-bold" data-testid="saved-label">
              {s.label}
            </p>
            <p className="text-sm text-loam-700">edible portion {s.edible}</p>
          </div>
          <button type="button" className="btn-quiet min-h-12" onClick={() => onUndo(s)} disabled={undoing === s.key}>
            {undoing === s.key ? 'Undoing…' : 'Undo'}
          </button>
        </div>
      ))}
    </section>
  );
}

/** The queue waits for a new sign-in (the session ended): where to sign in, and back to this page. */
export function SignInToSend({ items }: { items: OutboxItem[] }) {
  if (!items.some((i) => i.signIn)) return null;
  const next = typeof window === 'undefined' ? '/' : window.location.pathname + window.location.search;
  return (
    <div className="mt-2 rounded-xl border border-rind-500 bg-white p-3" data-testid="queue-sign-in">
      <p className="font-semibold">You are signed out, so these cannot be sent yet.</p>
      <p className="text-sm">They stay on this device. Sign in again and they are sent, each once.</p>
      <a className="btn-primary mt-2" href={`/sign-in?next=${encodeURIComponent(next)}`}>
        Sign in to send them
      </a>
    </div>
  );
}

export function WaitingList({ items, onRetry, onDiscard }: { items: OutboxItem[]; onRetry: () => void; onDiscard: (key: string) => void }) {
  if (items.length === 0) return null;
  const waiting = items.filter((i) => !i.refused);
  const refused = items.filter((i) => i.refused);
  return (
    <section aria-label="Waiting to send" className="mt-4 rounded-2xl border-l-4 border-rind-500 bg-rind-100 p-4" data-testid="waiting">
      {waiting.length > 0 ? (
        <>
          <h2 className="font-bold" role="status">
            {waiting.length === 1 ? '1 entry is waiting to send' : `${waiting.length} entries are waiting to send`}
          </h2>
          <p className="text-sm">Kept on this device; it is sent as soon as Selfsown can be reached, and never counted twice.</p>
          <ul className="mt-2 space-y-1">
            {waiting.map((i) => (
              <li key={i.key} className="font-semibold">
                {i.label} <span className="text-sm font-normal text-loam-700">· waiting to send</span>
              </li>
            ))}
          </ul>
          <SignInToSend items={waiting} />
          <button type="button" className="btn-quiet mt-3" onClick={onRetry}>
            Send now
          </button>
        </>
      ) : null}
      {refused.map((i) => (
        <div key={i.key} className="mt-3" role="alert">
          <p className="font-semibold text-berry-700">
            Not saved: {i.label} — {i.lastError}
          </p>
          <button type="button" className="btn-quiet mt-2" onClick={() => onDiscard(i.key)}>
            Discard it
          </button>
        </div>
      ))}
    </section>
  );
}
