/**
 * Pinned crops: the favourites a grower keeps at the front of the harvest form's chips, in their
 * own order. The whole list is sent at once (`PUT /api/households/{id}/crops/pins`, first chip
 * first), so a reorder is one atomic change and two ranks can never collide. The list edits the
 * arrange panel makes (pin, unpin, move) are plain functions over the list of crop ids.
 */
import { z } from 'zod';
import { recordId } from './entry-schemas';
import type { ChipCrop } from './crop-chip-order';

/** Most pinned crops a household keeps (pin_rank is 1–99). */
export const MAX_PINS = 99;

/**
 * The household's pinned crops, first chip first; an empty list unpins every crop.
 * Example: `cropPinsInput.parse({ cropIds: [12, 7] })` → { cropIds: [12, 7] } (12 gets rank 1)
 */
export const cropPinsInput = z.strictObject({
  cropIds: z
    .array(recordId, { error: 'Send cropIds: the pinned crops’ ids as a list, first chip first.' })
    .max(MAX_PINS, { error: `At most ${MAX_PINS} crops can be pinned.` })
    .refine((ids) => new Set(ids).size === ids.length, { error: 'A crop can be pinned only once; the list names one twice.' }),
});

export type CropPinsInput = z.output<typeof cropPinsInput>;

/** The pinned crops' ids in rank order. Example: Kale (rank 2), Bean (rank 1), Leek (none) → [Bean, Kale] */
export function pinnedIds(crops: readonly Pick<ChipCrop, 'id' | 'pinRank' | 'archived'>[]): number[] {
  return crops
    .filter((c) => c.pinRank !== null && !c.archived)
    .sort((a, b) => a.pinRank! - b.pinRank! || a.id - b.id)
    .map((c) => c.id);
}

/** Pins a crop at the end of the list, or unpins it. Example: `togglePin([4, 9], 9)` → [4]; `togglePin([4], 9)` → [4, 9] */
export function togglePin(pins: readonly number[], id: number): number[] {
  if (pins.includes(id)) return pins.filter((p) => p !== id);
  return pins.length >= MAX_PINS ? [...pins] : [...pins, id];
}

/**
 * Moves a pinned crop one place earlier (-1) or later (+1); at either end it stays.
 * Example: `movePin([4, 9, 2], 2, -1)` → [4, 2, 9]
 */
export function movePin(pins: readonly number[], id: number, step: -1 | 1): number[] {
  const from = pins.indexOf(id);
  const to = from + step;
  if (from < 0 || to < 0 || to >= pins.length) return [...pins];
  const next = [...pins];
  [next[from], next[to]] = [next[to]!, next[from]!];
  return next;
}
