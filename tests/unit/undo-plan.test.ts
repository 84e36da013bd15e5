import { describe, expect, it } from 'vitest';
import { harvestInput, harvestPatch, mergeHarvestPatch, mergePurchasePatch, purchaseInput, purchasePatch } from '@/lib/entry-schemas';
import type { HarvestJson, PurchaseJson } from '@/lib/entry-types';
import { larderOutcomeInput } from '@/lib/larder-schemas';
import type { LarderOutcomeJson } from '@/lib/larder-types';
import { CREATED, harvestRestorePatch, purchaseRestorePatch, undoneText, undoSteps } from '@/lib/undo-plan';

const potato: HarvestJson = {
  id: 41,
  date: '2026-09-20',
  cropId: 3,
  cropName: 'Potato (Charlotte)',
  foodId: 12,
  foodName: 'Potatoes, flesh and skin, raw',
  foodCode: '11352',
  quantity: 20,
  unit: 'kg',
  grams: 20_000,
  edibleGrams: 15_000,
  weightSource: null,
  use: 'stored',
  spreadMonths: 6,
  preserveMethod: null,
  plantingId: 8,
  trimmed: false,
  note: 'bed 3',
  splitGroup: null,
  createdAt: '2026-09-20T10:00:00.000Z',
};

const flour: PurchaseJson = {
  id: 70,
  date: '2026-03-02',
  foodId: 5,
  foodName: 'Wheat flour, whole-grain',
  foodCode: '20080',
  quantity: 25,
  unit: 'kg',
  grams: 25_000,
  edibleGrams: 25_000,
  weightSource: null,
  price: 31.5,
  currency: 'EUR',
  spreadMonths: 6,
  trimmed: false,
  note: null,
  createdAt: '2026-03-02T10:00:00.000Z',
};

const spoiled: LarderOutcomeJson = { id: 5, kind: 'spoiled', date: '2026-12-01', lostFraction: 0.25, until: null, note: 'mice' };
const longer: LarderOutcomeJson = { id: 6, kind: 'lasted_longer', date: '2027-02-01', lostFraction: null, until: '2027-05-01', note: null };

/** The stored fields of a harvest as mergeHarvestPatch reads them (as the server's reviseHarvest builds them). */
const storedHarvest = (h: HarvestJson) => ({
  date: h.date,
  ...(h.cropId !== null ? { cropId: h.cropId } : { foodId: h.foodId! }),
  quantity: h.quantity,
  unit: h.unit,
  use: h.use,
  spreadMonths: h.spreadMonths,
  preserveMethod: h.preserveMethod,
  trimmed: h.trimmed,
  note: h.note,
  plantingId: h.plantingId,
});
const storedPurchase = (p: PurchaseJson) => ({ date: p.date, foodId: p.foodId, quantity: p.quantity, unit: p.unit, price: p.price, currency: p.currency, spreadMonths: p.spreadMonths, trimmed: p.trimmed, note: p.note });

describe('undoing a save', () => {
  it('deletes the harvest saved, or every part of a split weighing', () => {
    expect(undoSteps({ kind: 'harvests-saved', harvests: [potato] })).toEqual([{ method: 'DELETE', path: 'harvests/41' }]);
    const parts = [potato, { ...potato, id: 42, use: 'fresh' as const, spreadMonths: 1 }];
    expect(undoSteps({ kind: 'harvests-saved', harvests: parts }).map((s) => `${s.method} ${s.path}`)).toEqual(['DELETE harvests/41', 'DELETE harvests/42']);
    expect(undoneText({ kind: 'harvests-saved', harvests: parts })).toBe('Undone: the weighing and its parts are removed.');
  });

  it('deletes bought food saved from the form or a staple’s one tap', () => {
    expect(undoSteps({ kind: 'purchase-saved', purchase: flour })).toEqual([{ method: 'DELETE', path: 'purchases/70' }]);
  });
});

describe('undoing a delete', () => {
  it('logs the harvest again with every value it had, which the API’s own schema accepts', () => {
    const [step] = undoSteps({ kind: 'harvest-deleted', harvest: potato, splitWith: null, outcomes: [] });
    expect(step).toMatchObject({ method: 'POST', path: 'harvests' });
    const body = (step as { body: Record<string, unknown> }).body;
    expect(body).toEqual({ date: '2026-09-20', cropId: 3, quantity: 20, unit: 'kg', use: 'stored', spreadMonths: 6, trimmed: false, note: 'bed 3', plantingId: 8 });
    expect(harvestInput.parse(body)).toMatchObject({ cropId: 3, quantity: 20, spreadMonths: 6, plantingId: 8 });
  });

  it('logs a harvest of a reference food against that food, and a split part back into its weighing', () => {
    const eggs: HarvestJson = { ...potato, cropId: null, cropName: null, foodId: 99, use: 'fresh', spreadMonths: 1, plantingId: null, note: null, splitGroup: 'g1' };
    const [step] = undoSteps({ kind: 'harvest-deleted', harvest: eggs, splitWith: 43, outcomes: [] });
    const body = (step as { body: Record<string, unknown> }).body;
    expect(body).toEqual({ date: '2026-09-20', foodId: 99, quantity: 20, unit: 'kg', use: 'fresh', spreadMonths: 1, trimmed: false, splitWith: 43 });
    expect(harvestInput.parse(body)).toMatchObject({ foodId: 99, splitWith: 43 });
  });

  it('records the lot’s larder outcomes again, in their order, on the harvest logged again', () => {
    const steps = undoSteps({ kind: 'harvest-deleted', harvest: potato, splitWith: null, outcomes: [spoiled, longer] });
    expect(steps.map((s) => `${s.method} ${s.path}`)).toEqual(['POST harvests', 'POST larder/outcomes', 'POST larder/outcomes']);
    const bodies = steps.slice(1).map((s) => (s as { body: Record<string, unknown> }).body);
    expect(bodies).toEqual([
      { harvestId: CREATED, kind: 'spoiled', date: '2026-12-01', lostFraction: 0.25, note: 'mice' },
      { harvestId: CREATED, kind: 'lasted_longer', date: '2027-02-01', until: '2027-05-01' },
    ]);
    for (const b of bodies) expect(larderOutcomeInput.safeParse({ ...b, harvestId: 77 }).success).toBe(true);
    expect(undoneText({ kind: 'harvest-deleted', harvest: potato, splitWith: null, outcomes: [spoiled] })).toBe('The harvest is back in the log, with its larder records.');
  });

  it('enters deleted bought food again with its price, currency and spread', () => {
    const [step] = undoSteps({ kind: 'purchase-deleted', purchase: flour });
    const body = (step as { body: Record<string, unknown> }).body;
    expect(body).toEqual({ date: '2026-03-02', foodId: 5, quantity: 25, unit: 'kg', price: 31.5, currency: 'EUR', spreadMonths: 6, trimmed: false });
    expect(purchaseInput.parse(body)).toMatchObject({ price: 31.5, currency: 'EUR', spreadMonths: 6 });
  });
});

describe('undoing an edit', () => {
  it('sends back only what changed; applied to the edited entry it gives the entry as it was', () => {
    const after: HarvestJson = { ...potato, quantity: 3, unit: 'lb', use: 'fresh', spreadMonths: 1, note: null, date: '2026-09-21' };
    const patch = harvestRestorePatch(potato, after);
    expect(patch).toEqual({ quantity: 20, unit: 'kg', date: '2026-09-20', use: 'stored', spreadMonths: 6, note: 'bed 3' });
    const restored = mergeHarvestPatch(storedHarvest(after), harvestPatch.parse(patch));
    expect(restored.success && restored.data).toMatchObject({ quantity: 20, unit: 'kg', date: '2026-09-20', use: 'stored', spreadMonths: 6, note: 'bed 3', cropId: 3, plantingId: 8 });
  });

  it('moves a harvest back to its crop and planting, and a food harvest back to its food', () => {
    const moved: HarvestJson = { ...potato, cropId: 4, cropName: 'Leek', foodId: 20, plantingId: null };
    expect(harvestRestorePatch(potato, moved)).toEqual({ cropId: 3, plantingId: 8 });
    const onFood: HarvestJson = { ...potato, cropId: null, cropName: null, foodId: 99, plantingId: null };
    expect(harvestRestorePatch(onFood, { ...onFood, foodId: 100 })).toEqual({ foodId: 99 });
    // A crop's food follows the crop: the same crop with a new food match is no change of this harvest.
    expect(harvestRestorePatch(potato, { ...potato, foodId: 13 })).toEqual({});
  });

  it('clears what the edit added (a note, a preserving method) with null', () => {
    const jam: HarvestJson = { ...potato, use: 'preserved', preserveMethod: null, note: null };
    const patch = harvestRestorePatch(jam, { ...jam, preserveMethod: 'frozen', note: 'freezer 2' });
    expect(patch).toEqual({ preserveMethod: null, note: null });
    expect(harvestPatch.safeParse(patch).success).toBe(true);
  });

  it('records again the larder outcomes an edit took away with the lot’s change of use', () => {
    const after: HarvestJson = { ...potato, use: 'given', spreadMonths: 1 };
    const steps = undoSteps({ kind: 'harvest-edited', before: potato, after, outcomes: [spoiled] });
    expect(steps).toEqual([
      { method: 'PATCH', path: 'harvests/41', body: { use: 'stored', spreadMonths: 6 } },
      { method: 'POST', path: 'larder/outcomes', body: { harvestId: 41, kind: 'spoiled', date: '2026-12-01', lostFraction: 0.25, note: 'mice' } },
    ]);
    // Still in store after the edit: its records stayed, nothing to record again.
    expect(undoSteps({ kind: 'harvest-edited', before: potato, after: { ...potato, note: 'x' }, outcomes: [spoiled] })).toHaveLength(1);
  });

  it('offers nothing to undo for an edit that changed nothing', () => {
    expect(undoSteps({ kind: 'harvest-edited', before: potato, after: { ...potato }, outcomes: [] })).toEqual([]);
    expect(undoSteps({ kind: 'purchase-edited', before: flour, after: { ...flour } })).toEqual([]);
  });

  it('puts bought food back, clearing a price or currency that was not there', () => {
    const bare: PurchaseJson = { ...flour, price: null, currency: null };
    const after: PurchaseJson = { ...bare, price: 12, currency: 'GBP', foodId: 6, foodName: 'Rye flour', quantity: 10 };
    const patch = purchaseRestorePatch(bare, after);
    expect(patch).toEqual({ quantity: 25, unit: 'kg', foodId: 5, price: null, currency: null });
    const restored = mergePurchasePatch(storedPurchase(after), purchasePatch.parse(patch));
    expect(restored.success && restored.data).toEqual(purchaseInput.parse({ date: '2026-03-02', foodId: 5, quantity: 25, unit: 'kg', spreadMonths: 6, trimmed: false }));
  });
});
