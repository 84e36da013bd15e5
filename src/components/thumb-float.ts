/**
 * Where good news appears on a phone: a confirmation ("Saved", "3 plantings made") first floats just
 * above the bottom navigation bar, where the thumb is, then settles into its place in the page.
 * Wider screens show it in place at once.
 */
import { useEffect, useState } from 'react';

/** How long a confirmation floats above the bar before it settles. */
export const FLOAT_MS = 6000;

/** Where the thumb is on a phone: fixed just above the bottom navigation bar (none from `sm` up). */
export const THUMB_ZONE = 'max-sm:fixed max-sm:inset-x-3 max-sm:bottom-20 max-sm:z-40';

/** Classes that float a message above the phone's bottom bar (none from the `sm` breakpoint up). */
const FLOATING = `${THUMB_ZONE} max-sm:shadow-lg`;

/**
 * The classes for a confirmation that should float for a while after `message` changes; '' while
 * settled or when `active` is false (errors stay beside what they are about).
 */
export function useThumbFloat(message: unknown, active = true): string {
  const [floating, setFloating] = useState(false);
  useEffect(() => {
    if (!active || !message) return;
    setFloating(true);
    const t = setTimeout(() => setFloating(false), FLOAT_MS);
    return () => clearTimeout(t);
  }, [message, active]);
  return floating ? FLOATING : '';
}
