/**
 * The crop chips' order on the harvest form (rules in src/lib/crop-chip-order.ts: pinned
 * favourites, then most used in the last year, then by name), held steady for the session by
 * `useChipOrder`, and the small line under each crop button.
 */
import { useState } from 'react';
import { defaultUse } from '@/lib/crop-categories';
import { chipOrder, keepOrder } from '@/lib/crop-chip-order';
import type { Use } from '@/lib/entry-schemas';
import type { Crop } from './api';
import { daysBetween } from '@/lib/months';
import { formatDate } from '@/lib/format-date';

/** A crop harvested within this many days counts as recent. */
const RECENT_DAYS = 28;

export interface OrderedCrop {
  crop: Crop;
  recent: boolean;
  inSeason: boolean;
  pinned: boolean;
}

/** The crops as chips, in `order` (crop ids), with what the line under each says. */
function describe(order: readonly Crop[], today: string, inSeasonIds: ReadonlySet<number>): OrderedCrop[] {
  return order.map((crop) => ({
    crop,
    recent: crop.lastHarvestDate != null && daysBetween(crop.lastHarvestDate, today) <= RECENT_DAYS,
    inSeason: inSeasonIds.has(crop.id),
    pinned: crop.pinRank !== null,
  }));
}

/**
 * The chips in the order they had when the crops first loaded: a save raises a crop's count but
 * moves no chip. `rearrange(crops)` takes a new order at once (after the grower pins or reorders).
 */
export function useChipOrder(crops: Crop[] | undefined, today: string, inSeasonIds: ReadonlySet<number>): { ordered: OrderedCrop[]; rearrange: (crops: Crop[]) => void } {
  const [frozen, setFrozen] = useState<number[] | null>(null);
  // Fixed once, on the first list (setting state while rendering is React's way to derive it once).
  if (crops && frozen === null) setFrozen(chipOrder(crops).map((c) => c.id));
  const order = crops ? (frozen ? keepOrder(frozen, crops) : chipOrder(crops)) : [];
  return { ordered: describe(order, today, inSeasonIds), rearrange: (next) => setFrozen(chipOrder(next).map((c) => c.id)) };
}

/** "harvested today", "harvested yesterday" or "last 2 Dec" for the crop buttons. */
export function lastHarvestText(date: string, today: string): string {
  const days = daysBetween(date, today);
  if (days === 0) return 'harvested today';
  if (days === 1) return 'harvested yesterday';
  return `last ${formatDate(date, { year: false })}`;
}

/** The use a crop's harvest starts on: its own default, else its kind's (fresh with no crop). */
export function cropDefaultUse(c: Crop | undefined): Use {
  return c ? defaultUse({ category: c.category, cropDefault: c.defaultUse, notFood: c.notFood }) : 'fresh';
}
