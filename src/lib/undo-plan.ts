/**
 * What Undo does after each change to the harvest log or bought food, as a list of API requests
 * worked out from what the change answered (or what was there before it):
 *
 * - a saved harvest, split weighing, bought food or one-tap staple → delete what was saved;
 * - a deleted harvest → log it again with the same values (a part of a split weighing rejoins its
 *   weighing through `splitWith`), then record its larder outcomes again, in their order;
 * - a deleted purchase → enter it again with the same values;
 * - an edit → a PATCH of the fields that changed, back to their previous values; an edit that took
 *   a lot out of store (its larder outcomes went with it) records them again.
 *
 * The entry brought back is a new row with a new id; its values, and so every figure, are the same.
 * Paths are relative to the household's API (`/api/households/{id}/`).
 */
import type { HarvestJson, PurchaseJson } from './entry-types';
import type { LarderOutcomeJson } from './larder-types';
import { isSpreadUse } from './uses';

export type UndoAction =
  /** One harvest, or the parts of one split weighing, just saved. */
  | { kind: 'harvests-saved'; harvests: readonly HarvestJson[] }
  /** Bought food just saved, from the form or a staple's one tap. */
  | { kind: 'purchase-saved'; purchase: PurchaseJson }
  /** A harvest deleted; `splitWith` is another part of its weighing still in the log, if any. */
  | { kind: 'harvest-deleted'; harvest: HarvestJson; splitWith: number | null; outcomes: readonly LarderOutcomeJson[] }
  | { kind: 'purchase-deleted'; purchase: PurchaseJson }
  /** A harvest changed; `outcomes` are its larder records as they were before. */
  | { kind: 'harvest-edited'; before: HarvestJson; after: HarvestJson; outcomes: readonly LarderOutcomeJson[] }
  | { kind: 'purchase-edited'; before: PurchaseJson; after: PurchaseJson };

/** Stands for the id of the harvest the step before logged again. */
export const CREATED = 'created';

export type UndoStep =
  /** A 404 answer counts as done: the entry is gone already (undone in another tab). */
  | { method: 'DELETE'; path: string }
  | { method: 'POST'; path: 'harvests' | 'purchases'; body: Record<string, unknown> }
  | { method: 'PATCH'; path: string; body: Record<string, unknown> }
  | { method: 'POST'; path: 'larder/outcomes'; body: Record<string, unknown> & { harvestId: number | typeof CREATED } };

/**
 * The body that logs a harvest again with the values it had.
 * Example: `harvestBodyOf(potato, null)` → { date, cropId, quantity, unit, use, spreadMonths, trimmed }
 */
export function harvestBodyOf(h: HarvestJson, splitWith: number | null = null): Record<string, unknown> {
  return {
    date: h.date,
    ...(h.cropId !== null ? { cropId: h.cropId } : { foodId: h.foodId }),
    quantity: h.quantity,
    unit: h.unit,
    use: h.use,
    spreadMonths: h.spreadMonths,
    ...(h.preserveMethod !== null ? { preserveMethod: h.preserveMethod } : {}),
    trimmed: h.trimmed,
    ...(h.note !== null ? { note: h.note } : {}),
    ...(h.plantingId !== null ? { plantingId: h.plantingId } : {}),
    ...(splitWith !== null ? { splitWith } : {}),
  };
}

/** The body that enters bought food again with the values it had. */
export function purchaseBodyOf(p: PurchaseJson): Record<string, unknown> {
  return {
    date: p.date,
    foodId: p.foodId,
    quantity: p.quantity,
    unit: p.unit,
    ...(p.price !== null ? { price: Number(p.price) } : {}),
    ...(p.currency !== null ? { currency: p.currency } : {}),
    spreadMonths: p.spreadMonths,
    trimmed: p.trimmed,
    ...(p.note !== null ? { note: p.note } : {}),
  };
}

/** The request body that records an outcome again on `harvestId`. */
export function outcomeBodyOf(o: LarderOutcomeJson, harvestId: number | typeof CREATED): Record<string, unknown> & { harvestId: number | typeof CREATED } {
  return {
    harvestId,
    kind: o.kind,
    date: o.date,
    ...(o.kind === 'spoiled' && o.lostFraction !== null ? { lostFraction: o.lostFraction } : {}),
    ...(o.until !== null ? { until: o.until } : {}),
    ...(o.note !== null ? { note: o.note } : {}),
  };
}

/** `from[key]` for each key whose value differs in `to`. */
function changed<T extends object>(from: T, to: T, keys: readonly (keyof T)[]): Partial<T> {
  const out: Partial<T> = {};
  for (const key of keys) if (from[key] !== to[key]) out[key] = from[key];
  return out;
}

/**
 * The PATCH that puts an edited harvest back: the previous value of every field the edit changed
 * (null clears a note, a method or a planting). An amount goes back with its unit.
 * Example: after a change of 2 kg → 3 kg, `harvestRestorePatch(before, after)` → { quantity: 2, unit: 'kg' }
 */
export function harvestRestorePatch(before: HarvestJson, after: HarvestJson): Record<string, unknown> {
  // A harvest of a crop names the crop only (its food follows the crop); one of a food names the food.
  const source = before.cropId !== after.cropId || (before.cropId === null && before.foodId !== after.foodId);
  return {
    ...(source ? (before.cropId !== null ? { cropId: before.cropId } : { foodId: before.foodId }) : {}),
    ...(before.quantity !== after.quantity || before.unit !== after.unit ? { quantity: before.quantity, unit: before.unit } : {}),
    ...changed(before, after, ['date', 'use', 'spreadMonths', 'preserveMethod', 'trimmed', 'note', 'plantingId']),
  };
}

/** The PATCH that puts edited bought food back (null clears a price, currency or note). */
export function purchaseRestorePatch(before: PurchaseJson, after: PurchaseJson): Record<string, unknown> {
  return {
    ...(before.quantity !== after.quantity || before.unit !== after.unit ? { quantity: before.quantity, unit: before.unit } : {}),
    ...changed(before, after, ['foodId', 'date', 'price', 'currency', 'spreadMonths', 'trimmed', 'note']),
  };
}

/**
 * True when an edit took a lot out of store: its larder outcomes were dropped with the change of
 * use (src/server/larder-outcomes.ts, reconcileOutcomes) and Undo records them again.
 */
export function editDroppedOutcomes(before: Pick<HarvestJson, 'use'>, after: Pick<HarvestJson, 'use'>): boolean {
  return isSpreadUse(before.use) && !isSpreadUse(after.use);
}

/**
 * The requests that undo an action, in order; an empty list when there is nothing to undo (an
 * edit that changed nothing).
 */
export function undoSteps(action: UndoAction): UndoStep[] {
  switch (action.kind) {
    case 'harvests-saved':
      return action.harvests.map((h) => ({ method: 'DELETE', path: `harvests/${h.id}` }));
    case 'purchase-saved':
      return [{ method: 'DELETE', path: `purchases/${action.purchase.id}` }];
    case 'harvest-deleted':
      return [
        { method: 'POST', path: 'harvests', body: harvestBodyOf(action.harvest, action.splitWith) },
        ...action.outcomes.map((o): UndoStep => ({ method: 'POST', path: 'larder/outcomes', body: outcomeBodyOf(o, CREATED) })),
      ];
    case 'purchase-deleted':
      return [{ method: 'POST', path: 'purchases', body: purchaseBodyOf(action.purchase) }];
    case 'harvest-edited': {
      const patch = harvestRestorePatch(action.before, action.after);
      if (Object.keys(patch).length === 0) return [];
      const again = editDroppedOutcomes(action.before, action.after) ? action.outcomes : [];
      return [
        { method: 'PATCH', path: `harvests/${action.before.id}`, body: patch },
        ...again.map((o): UndoStep => ({ method: 'POST', path: 'larder/outcomes', body: outcomeBodyOf(o, action.before.id) })),
      ];
    }
    case 'purchase-edited': {
      const patch = purchaseRestorePatch(action.before, action.after);
      return Object.keys(patch).length === 0 ? [] : [{ method: 'PATCH', path: `purchases/${action.before.id}`, body: patch }];
    }
  }
}

/** What the toast says once an action is undone. Example: `undoneText({ kind: 'purchase-deleted', … })` → 'Bought food is back in the log.' */
export function undoneText(action: UndoAction): string {
  switch (action.kind) {
    case 'harvests-saved':
      return action.harvests.length > 1 ? 'Undone: the weighing and its parts are removed.' : 'Undone: the harvest is removed.';
    case 'purchase-saved':
      return 'Undone: the bought food is removed.';
    case 'harvest-deleted':
      return action.outcomes.length > 0 ? 'The harvest is back in the log, with its larder records.' : 'The harvest is back in the log.';
    case 'purchase-deleted':
      return 'The bought food is back in the log.';
    case 'harvest-edited':
    case 'purchase-edited':
      return 'Undone: the previous values are back.';
  }
}
