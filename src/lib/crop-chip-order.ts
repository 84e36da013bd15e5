/**
 * The order of the crop chips on the harvest form. The grower's pinned favourites come first, in
 * the order they set (pin rank 1 first); then the crops the household harvested most often over
 * the last 365 days; ties go by name. The order is worked out once, when the page loads, and kept
 * for the session (`keepOrder`): a save raises a crop's count, but its chip must not jump from
 * under the thumb between two weighings.
 */
import { addDays } from './months';

/** How far back "most used" counts, in days (today included). */
export const MOST_USED_DAYS = 365;

/** A crop as far as the chip order needs it (CropJson has these fields). */
export interface ChipCrop {
  id: number;
  displayName: string;
  /** 1 = first pinned chip; null = not pinned. */
  pinRank: number | null;
  /** Harvests of the crop in the last MOST_USED_DAYS days. */
  harvestsLastYear: number;
  archived: boolean;
}

// Names compare as people read them: case and accents aside, "Bean 2" before "Bean 10".
const byName = new Intl.Collator('en', { sensitivity: 'base', numeric: true });

/**
 * The first day "most used" counts from: the window is MOST_USED_DAYS days ending today.
 * Example: `mostUsedSince('2026-12-31')` → '2026-01-01'
 */
export function mostUsedSince(today: string): string {
  return addDays(today, -(MOST_USED_DAYS - 1));
}

/**
 * Crops in chip order: pinned by rank, then most harvested in the last year, then by name (then
 * id, so the order is total). Archived crops are left out.
 * Example: Kale (pin 1), Bean (9 harvests), Leek (9), Onion (2) → Kale, Bean, Leek, Onion
 */
export function chipOrder<T extends ChipCrop>(crops: readonly T[]): T[] {
  return crops
    .filter((c) => !c.archived)
    .sort((a, b) => {
      if (a.pinRank !== null || b.pinRank !== null) {
        if (a.pinRank === null) return 1;
        if (b.pinRank === null) return -1;
        if (a.pinRank !== b.pinRank) return a.pinRank - b.pinRank;
      } else if (a.harvestsLastYear !== b.harvestsLastYear) {
        return b.harvestsLastYear - a.harvestsLastYear;
      }
      return byName.compare(a.displayName, b.displayName) || a.id - b.id;
    });
}

/**
 * The crops in the order fixed earlier in the session (`frozen`, crop ids), whatever their counts
 * are now: crops no longer there (archived, deleted) drop out, crops added since go at the end in
 * their own chip order. Example: `keepOrder([3, 1], crops 1, 2, 3)` → [3, 1, 2]
 */
export function keepOrder<T extends ChipCrop>(frozen: readonly number[], crops: readonly T[]): T[] {
  const ordered = chipOrder(crops);
  const place = new Map(frozen.map((id, i) => [id, i]));
  const known = ordered.filter((c) => place.has(c.id)).sort((a, b) => place.get(a.id)! - place.get(b.id)!);
  return [...known, ...ordered.filter((c) => !place.has(c.id))];
}
