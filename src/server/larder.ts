/**
 * TEMP larder stub: an empty larder until householdLarder() arrives from branch wt-larder.
 * Replaced by the real module when that branch is merged.
 */
import type { Household } from '@/db/schema';
import type { LarderResponse } from '@/lib/larder-types';
import { todayIn } from '@/lib/months';

export async function householdLarder(household: Household, now: Date = new Date()): Promise<LarderResponse> {
  return {
    today: todayIn(household.timezone, now),
    lots: [],
    byCrop: [],
    byCategory: [],
    totals: { remainingGrams: 0, energyKcal: null, proteinG: null },
    emptyMonths: [],
    units: household.units,
  };
}
