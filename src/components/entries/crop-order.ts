/**
 * The order a grower reaches for crops on the harvest form — recently harvested first, then what
 * was in season a year ago, then the rest — and the small line under each crop button.
 */
import { defaultUse } from '@/lib/crop-categories';
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
}

/** Crops in the order a grower reaches for them: recently harvested, then in season a year ago, then the rest. */
export function orderCrops(crops: Crop[], today: string, inSeasonIds: ReadonlySet<number>): OrderedCrop[] {
  const rows = crops
    .filter((c) => !c.archived)
    .map((crop, i) => {
      const recent = crop.lastHarvestDate != null && daysBetween(crop.lastHarvestDate, today) <= RECENT_DAYS;
      return { crop, recent, inSeason: inSeasonIds.has(crop.id), i };
    });
  const rank = (r: (typeof rows)[number]) => (r.recent ? 0 : r.inSeason ? 1 : 2);
  rows.sort((a, b) => rank(a) - rank(b) || (a.recent && b.recent ? (b.crop.lastHarvestDate ?? '').localeCompare(a.crop.lastHarvestDate ?? '') : 0) || a.i - b.i);
  return rows.map(({ crop, recent, inSeason }) => ({ crop, recent, inSeason }));
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
