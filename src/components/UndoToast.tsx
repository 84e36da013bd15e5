/**
 * Undo, where the thumb is: after a save, a delete or an edit, a toast says what happened and
 * offers Undo for a few seconds — on a phone just above the bottom bar, on wider screens at the
 * bottom of the window. Its words are in a live region (screen readers hear them); the Undo
 * button is in the tab order right where the island puts the toast, and takes the focus when the
 * change removed the focused element (a deleted row). The countdown pauses while the pointer or
 * the focus is on the toast (WCAG 2.2.1: time to act), Escape closes it.
 * An island wraps its content in <UndoProvider> and calls `useUndo()(offer)`.
 */
import { createContext, useCallback, useContext, useEffect, useRef, useState, type ReactNode } from 'react';
import { THUMB_ZONE } from './thumb-float';

/** How long the toast offers Undo. */
export const UNDO_MS = 8000;
/** How long "Undone" stays. */
const DONE_MS = 4000;

export interface UndoOffer {
  /** What just happened: "Saved 2 kg Potato". */
  message: string;
  /** Undoes it and answers what the toast says then; throws to say it could not. Absent: nothing to undo. */
  undo?: () => Promise<string>;
}

type Shown = UndoOffer & { serial: number; state: 'offered' | 'undoing' | 'done' | 'failed' };

const OfferContext = createContext<(offer: UndoOffer) => void>(() => undefined);

/** Offers Undo for what just happened (replacing an earlier offer). */
export function useUndo(): (offer: UndoOffer) => void {
  return useContext(OfferContext);
}

export function UndoProvider({ children }: { children: ReactNode }) {
  const [shown, setShown] = useState<Shown | null>(null);
  const serial = useRef(0);
  const offer = useCallback((o: UndoOffer) => {
    serial.current += 1;
    setShown({ ...o, serial: serial.current, state: 'offered' });
  }, []);
  return (
    <OfferContext.Provider value={offer}>
      {children}
      <UndoToast shown={shown} setShown={setShown} />
    </OfferContext.Provider>
  );
}

function UndoToast({ shown, setShown }: { shown: Shown | null; setShown: (s: Shown | null | ((s: Shown | null) => Shown | null)) => void }) {
  const box = useRef<HTMLDivElement>(null);
  const undoButton = useRef<HTMLButtonElement>(null);
  const closeButton = useRef<HTMLButtonElement>(null);
  // A keyboard user who undid keeps the focus in the toast (on Close) when Undo goes away.
  const keepFocus = useRef(false);
  const [held, setHeld] = useState({ pointer: false, focus: false });
  const paused = held.pointer || held.focus;

  useEffect(() => {
    if (keepFocus.current && shown && shown.state !== 'undoing') {
      keepFocus.current = false;
      closeButton.current?.focus();
    }
  }, [shown]);

  // A delete takes the focused button with its row: give the focus to Undo rather than the page.
  useEffect(() => {
    if (shown?.state !== 'offered' || !shown.undo) return;
    const active = document.activeElement;
    if (!active || active === document.body || !active.isConnected) undoButton.current?.focus();
  }, [shown?.serial, shown?.state, shown?.undo]);

  // The countdown: an offer for UNDO_MS, "Undone" for DONE_MS; a failure stays until closed.
  useEffect(() => {
    if (!shown || paused || shown.state === 'undoing' || shown.state === 'failed') return;
    const serial = shown.serial;
    const t = setTimeout(() => setShown((s) => (s?.serial === serial ? null : s)), shown.state === 'done' ? DONE_MS : UNDO_MS);
    return () => clearTimeout(t);
  }, [shown, paused, setShown]);

  async function undo() {
    if (!shown?.undo) return;
    const serial = shown.serial;
    keepFocus.current = box.current?.contains(document.activeElement) ?? false;
    setShown({ ...shown, state: 'undoing' });
    try {
      const message = await shown.undo();
      setShown((s) => (s?.serial === serial ? { ...s, message, state: 'done', undo: undefined } : s));
    } catch (e) {
      setShown((s) => (s?.serial === serial ? { ...s, message: `Could not undo: ${(e as Error).message}`, state: 'failed', undo: undefined } : s));
    }
  }

  const close = () => {
    const inside = box.current?.contains(document.activeElement);
    setShown(null);
    setHeld({ pointer: false, focus: false });
    // The toast's buttons go: the focus goes to the start of the page's content, not to nowhere.
    const main = document.getElementById('main');
    if (inside && main) {
      main.tabIndex = -1;
      main.focus({ preventScroll: true });
    }
  };

  const visible = shown !== null;
  return (
    <div
      ref={box}
      data-testid="undo-toast"
      className={
        visible
          ? `${THUMB_ZONE} z-50 mt-4 flex flex-wrap items-center gap-3 rounded-2xl border p-3 shadow-lg sm:fixed sm:bottom-6 sm:left-1/2 sm:w-[min(36rem,calc(100%-2rem))] sm:-translate-x-1/2 ${
              shown.state === 'failed' ? 'border-berry-700 bg-berry-100 text-berry-700' : 'border-sprout-300 bg-sprout-100 text-sprout-900'
            }`
          : 'sr-only'
      }
      onPointerEnter={() => setHeld((h) => ({ ...h, pointer: true }))}
      onPointerLeave={() => setHeld((h) => ({ ...h, pointer: false }))}
      // Only a keyboard's focus holds the countdown (a tap on a button focuses it too).
      onFocus={(e) => e.target.matches(':focus-visible') && setHeld((h) => ({ ...h, focus: true }))}
      onBlur={(e) => {
        if (!e.currentTarget.contains(e.relatedTarget as Node | null)) setHeld((h) => ({ ...h, focus: false }));
      }}
      onKeyDown={(e) => {
        if (e.key === 'Escape' && visible) close();
      }}
    >
      {/* Always in the page, so that a new message is announced. */}
      <p role="status" aria-live="polite" aria-atomic="true" className="min-w-0 flex-1 font-semibold" data-testid="undo-message">
        {shown?.message ?? ''}
      </p>
      {shown?.undo || shown?.state === 'undoing' ? (
        <button ref={undoButton} type="button" className="btn-quiet min-h-12 px-5" disabled={shown.state === 'undoing'} onClick={() => void undo()}>
          {shown.state === 'undoing' ? 'Undoing…' : 'Undo'}
        </button>
      ) : null}
      {visible ? (
        <button ref={closeButton} type="button" className="btn-quiet min-h-12 min-w-12 px-3" aria-label="Close this message" onClick={close}>
          <span aria-hidden="true">×</span>
        </button>
      ) : null}
    </div>
  );
}
