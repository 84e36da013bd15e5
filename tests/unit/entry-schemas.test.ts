import { describe, expect, it } from 'vitest';
import { cropUseError, EATEN_USES, FORM_FIELD, harvestInput, harvestPatch, harvestSplitInput, isoDate, mergeHarvestPatch, mergePurchasePatch, purchaseInput, purchasePatch, splitToHarvests, stapleInput, stapleLogInput, USE_LABELS, USES, zodErrorBody } from '@/lib/entry-schemas';
import { cropInput, cropPatch, mergeCropPatch } from '@/lib/crop-schemas';
import { harvestQuery, purchaseQuery } from '@/lib/list-query-schemas';
import { CROP_CATEGORIES, CROP_CATEGORY_LABELS, defaultSpreadMonths, defaultUse } from '@/lib/crop-categories';

const harvest = { date: '2026-07-14', cropId: 3, quantity: 2.5, unit: 'kg' as const };

function fieldsOf(result: { success: boolean; error?: unknown }): Record<string, string> {
  if (result.success) throw new Error('expected the input to be refused');
  return zodErrorBody(result.error as never).fields;
}

describe('dates', () => {
  it('accepts a real calendar date', () => {
    expect(isoDate.parse('2026-07-14')).toBe('2026-07-14');
  });
  it('accepts 29 February in a leap year', () => {
    expect(isoDate.safeParse('2028-02-29').success).toBe(true); // 2028 is divisible by 4 and not by 100 (Gregorian calendar)
    expect(isoDate.safeParse('2000-02-29').success).toBe(true); // 2000 is divisible by 400 (Gregorian calendar)
  });
  it('refuses days that do not exist', () => {
    expect(isoDate.safeParse('2026-02-30').success).toBe(false);
    expect(isoDate.safeParse('2026-02-29').success).toBe(false); // 2026 is not a leap year
    expect(isoDate.safeParse('1900-02-29').success).toBe(false); // 1900 is divisible by 100, not 400 (Gregorian calendar)
    expect(isoDate.safeParse('2026-04-31').success).toBe(false);
    expect(isoDate.safeParse('2026-13-01').success).toBe(false);
    expect(isoDate.safeParse('2026-00-10').success).toBe(false);
  });
  it('refuses other date layouts', () => {
    for (const d of ['14/07/2026', '2026-7-14', '20260714', '2026-07-14T00:00']) expect(isoDate.safeParse(d).success).toBe(false);
  });
  it('refuses a year that is surely a typing slip', () => {
    expect(isoDate.safeParse('0226-07-14').success).toBe(false);
  });
  it('says why an impossible date was refused', () => {
    expect(fieldsOf(harvestInput.safeParse({ ...harvest, date: '2026-02-30' })).date).toMatch(/does not exist/);
  });
});

describe('harvest input', () => {
  it('fills in fresh use, one month and untrimmed', () => {
    expect(harvestInput.parse(harvest)).toEqual({ ...harvest, use: 'fresh', spreadMonths: 1, trimmed: false });
  });
  it('leaves the spread of stored food for the server to fill', () => {
    const parsed = harvestInput.parse({ ...harvest, use: 'stored' });
    expect(parsed.spreadMonths).toBeUndefined();
  });
  it('keeps the spread given for preserved food', () => {
    expect(harvestInput.parse({ ...harvest, use: 'preserved', spreadMonths: 9 }).spreadMonths).toBe(9);
  });
  it('refuses zero and negative weights', () => {
    expect(fieldsOf(harvestInput.safeParse({ ...harvest, quantity: 0 })).quantity).toMatch(/more than 0/);
    expect(fieldsOf(harvestInput.safeParse({ ...harvest, quantity: -2 })).quantity).toMatch(/more than 0/);
  });
  it('refuses weights that are not finite or absurdly large', () => {
    expect(harvestInput.safeParse({ ...harvest, quantity: Number.POSITIVE_INFINITY }).success).toBe(false);
    expect(harvestInput.safeParse({ ...harvest, quantity: Number.NaN }).success).toBe(false);
    expect(fieldsOf(harvestInput.safeParse({ ...harvest, quantity: 100_001 })).quantity).toMatch(/too large/);
    expect(harvestInput.safeParse({ ...harvest, quantity: '2.5' }).success).toBe(false);
  });
  it('refuses unknown units', () => {
    expect(fieldsOf(harvestInput.safeParse({ ...harvest, unit: 'stone' })).unit).toMatch(/g, kg, oz, lb/);
    expect(harvestInput.safeParse({ ...harvest, unit: 'KG' }).success).toBe(false);
  });
  it('refuses spreads of 0, 25 and 1.5 months', () => {
    for (const spreadMonths of [0, 25, 1.5]) {
      expect(fieldsOf(harvestInput.safeParse({ ...harvest, use: 'stored', spreadMonths })).spreadMonths).toBeDefined();
    }
  });
  it('accepts spreads of 1 and 24 months', () => {
    for (const spreadMonths of [1, 24]) expect(harvestInput.safeParse({ ...harvest, use: 'stored', spreadMonths }).success).toBe(true);
  });
  it('refuses a spread on fresh food or food that is not eaten', () => {
    expect(fieldsOf(harvestInput.safeParse({ ...harvest, use: 'fresh', spreadMonths: 3 })).spreadMonths).toMatch(/Only stored or preserved/);
    expect(harvestInput.safeParse({ ...harvest, use: 'sold', spreadMonths: 2 }).success).toBe(false);
    expect(harvestInput.safeParse({ ...harvest, use: 'fresh', spreadMonths: 1 }).success).toBe(true);
  });
  it('needs exactly one of crop and food', () => {
    const { cropId: _, ...noRef } = harvest;
    expect(fieldsOf(harvestInput.safeParse(noRef)).cropId).toMatch(/Choose the crop/);
    expect(fieldsOf(harvestInput.safeParse({ ...harvest, foodId: 9 })).foodId).toMatch(/not both/);
    expect(harvestInput.safeParse({ ...noRef, foodId: 9 }).success).toBe(true);
  });
  it('refuses ids that are not positive whole numbers', () => {
    for (const cropId of [0, -1, 2.5, '3']) expect(harvestInput.safeParse({ ...harvest, cropId }).success).toBe(false);
  });
  it('trims notes, drops blank ones and refuses long ones', () => {
    expect(harvestInput.parse({ ...harvest, note: '  first picking ' }).note).toBe('first picking');
    expect(harvestInput.parse({ ...harvest, note: '   ' }).note).toBeUndefined();
    expect(harvestInput.safeParse({ ...harvest, note: 'x'.repeat(500) }).success).toBe(true);
    expect(fieldsOf(harvestInput.safeParse({ ...harvest, note: 'x'.repeat(501) })).note).toMatch(/500/);
  });
  it('refuses an unknown use', () => {
    expect(fieldsOf(harvestInput.safeParse({ ...harvest, use: 'eaten' })).use).toMatch(/fresh, stored/);
  });
});

describe('uses', () => {
  it('labels every use', () => {
    for (const use of USES) expect(USE_LABELS[use].length).toBeGreaterThan(0);
  });
  it('counts fresh, stored and preserved as eaten', () => {
    expect([...EATEN_USES]).toEqual(['fresh', 'stored', 'preserved']);
  });
});

describe('splitting one weighing between uses', () => {
  const split = {
    date: '2026-09-20',
    cropId: 4,
    unit: 'kg',
    note: 'main crop',
    parts: [
      { quantity: 20, use: 'stored' },
      { quantity: 2, use: 'fresh' },
      { quantity: 0.5, use: 'seed' },
    ],
  };
  it('turns each part into a harvest with the shared fields', () => {
    const harvests = splitToHarvests(harvestSplitInput.parse(split));
    expect(harvests).toEqual([
      { date: '2026-09-20', cropId: 4, unit: 'kg', note: 'main crop', trimmed: false, quantity: 20, use: 'stored' },
      { date: '2026-09-20', cropId: 4, unit: 'kg', note: 'main crop', trimmed: false, quantity: 2, use: 'fresh', spreadMonths: 1 },
      { date: '2026-09-20', cropId: 4, unit: 'kg', note: 'main crop', trimmed: false, quantity: 0.5, use: 'seed', spreadMonths: 1 },
    ]);
  });
  it('needs one to seven parts', () => {
    expect(harvestSplitInput.safeParse({ ...split, parts: [] }).success).toBe(false);
    const eight = Array.from({ length: 8 }, () => ({ quantity: 1, use: 'fresh' }));
    expect(fieldsOf(harvestSplitInput.safeParse({ ...split, parts: eight })).parts).toMatch(/at most 7/);
  });
  it('names the part that is wrong', () => {
    const bad = { ...split, parts: [{ quantity: 1, use: 'fresh' }, { quantity: -1, use: 'stored' }] };
    expect(fieldsOf(harvestSplitInput.safeParse(bad))['parts.1.quantity']).toMatch(/more than 0/);
  });
});

describe('changing a harvest', () => {
  const stored = { ...harvest, use: 'stored' as const, spreadMonths: 6, trimmed: false, note: 'cellar' };
  it('needs at least one field', () => {
    expect(fieldsOf(harvestPatch.safeParse({}))[FORM_FIELD]).toMatch(/Nothing to change/);
  });
  it('applies no defaults of its own', () => {
    expect(harvestPatch.parse({ quantity: 3 })).toEqual({ quantity: 3 });
  });
  it('validates the fields it has', () => {
    expect(harvestPatch.safeParse({ quantity: 0 }).success).toBe(false);
    expect(harvestPatch.safeParse({ date: '2026-02-30' }).success).toBe(false);
    expect(harvestPatch.safeParse({ cropId: 1, foodId: 2 }).success).toBe(false);
  });
  it('drops the old spread when the use changes', () => {
    expect(mergeHarvestPatch(stored, { use: 'fresh' }).data?.spreadMonths).toBe(1);
  });
  it('keeps the spread when only the weight changes', () => {
    const merged = mergeHarvestPatch(stored, { quantity: 4 });
    expect(merged.data).toEqual({ ...stored, quantity: 4 });
  });
  it('replaces the crop by a food', () => {
    const merged = mergeHarvestPatch(stored, { foodId: 8 });
    expect(merged.data?.foodId).toBe(8);
    expect(merged.data?.cropId).toBeUndefined();
  });
  it('clears the note with null and ignores nulls from the database', () => {
    expect(mergeHarvestPatch({ ...stored, note: null }, { quantity: 1 }).success).toBe(true);
    expect(mergeHarvestPatch(stored, { note: null }).data?.note).toBeUndefined();
    expect(harvestPatch.parse({ note: '  ' })).toEqual({ note: null });
  });
  it('refuses a patch that leaves the harvest inconsistent', () => {
    const fresh = harvestInput.parse(harvest);
    expect(mergeHarvestPatch(fresh, { spreadMonths: 4 }).success).toBe(false);
  });
});

describe('bought food', () => {
  const purchase = { date: '2026-03-02', foodId: 5, quantity: 25, unit: 'kg' };
  it('fills in one month and untrimmed', () => {
    expect(purchaseInput.parse(purchase)).toEqual({ ...purchase, spreadMonths: 1, trimmed: false });
  });
  it('takes a price and an ISO 4217 currency', () => {
    const parsed = purchaseInput.parse({ ...purchase, price: 31.5, currency: 'eur', spreadMonths: 6 });
    expect(parsed.currency).toBe('EUR');
    expect(parsed.price).toBe(31.5);
  });
  it('refuses bad prices and currencies', () => {
    expect(fieldsOf(purchaseInput.safeParse({ ...purchase, price: -1 })).price).toMatch(/negative/);
    for (const currency of ['EURO', '€', 'E1R', '']) expect(purchaseInput.safeParse({ ...purchase, currency }).success).toBe(false);
  });
  it('needs a food', () => {
    const { foodId: _, ...noFood } = purchase;
    expect(fieldsOf(purchaseInput.safeParse(noFood)).foodId).toBeDefined();
  });
  it('refuses zero weights and bad spreads', () => {
    expect(purchaseInput.safeParse({ ...purchase, quantity: 0 }).success).toBe(false);
    for (const spreadMonths of [0, 25, 1.5]) expect(purchaseInput.safeParse({ ...purchase, spreadMonths }).success).toBe(false);
  });
  it('clears the price with a patch of null', () => {
    const current = purchaseInput.parse({ ...purchase, price: 3, currency: 'USD' });
    expect(purchasePatch.parse({ price: null })).toEqual({ price: null });
    expect(mergePurchasePatch(current, { price: null }).data?.price).toBeUndefined();
    expect(purchasePatch.safeParse({}).success).toBe(false);
  });
});

describe('list queries', () => {
  const fromUrl = (q: string) => Object.fromEntries(new URLSearchParams(q));
  it('reads numbers and dates from search parameters with defaults', () => {
    expect(harvestQuery.parse(fromUrl('from=2026-01-01&to=2026-12-31&cropId=3&use=stored'))).toEqual({
      from: '2026-01-01',
      to: '2026-12-31',
      cropId: 3,
      use: 'stored',
      page: 1,
      pageSize: 50,
    });
  });
  it('treats blank parameters as absent', () => {
    expect(harvestQuery.parse(fromUrl('from=&cropId=&page=&use='))).toEqual({ page: 1, pageSize: 50 });
  });
  it('refuses page sizes over 200 and pages below 1', () => {
    expect(harvestQuery.parse(fromUrl('pageSize=200')).pageSize).toBe(200);
    expect(fieldsOf(harvestQuery.safeParse(fromUrl('pageSize=201'))).pageSize).toMatch(/200/);
    expect(harvestQuery.safeParse(fromUrl('page=0')).success).toBe(false);
    expect(harvestQuery.safeParse(fromUrl('page=two')).success).toBe(false);
  });
  it('reads a sort order and refuses an unknown one', () => {
    expect(harvestQuery.parse(fromUrl('sort=-grams')).sort).toBe('-grams');
    expect(harvestQuery.parse(fromUrl('sort=')).sort).toBeUndefined();
    expect(fieldsOf(harvestQuery.safeParse(fromUrl('sort=weight'))).sort).toMatch(/-date/);
    expect(purchaseQuery.parse(fromUrl('sort=food')).sort).toBe('food');
    expect(purchaseQuery.safeParse(fromUrl('sort=crop')).success).toBe(false);
  });
  it('refuses impossible dates, bad ids and an end before the start', () => {
    expect(harvestQuery.safeParse(fromUrl('from=2026-02-30')).success).toBe(false);
    expect(harvestQuery.safeParse(fromUrl('cropId=abc')).success).toBe(false);
    expect(fieldsOf(purchaseQuery.safeParse(fromUrl('from=2026-05-01&to=2026-04-01'))).to).toMatch(/before/);
  });
});

describe('crops', () => {
  const crop = { name: ' Potato ', variety: 'Charlotte', foodId: 12, category: 'root_tuber' };
  it('trims the name and fills in defaults', () => {
    expect(cropInput.parse(crop)).toEqual({ ...crop, name: 'Potato', notFood: false });
    expect(cropInput.parse({ name: 'Oca', category: 'root_tuber' }).foodId).toBeNull();
  });
  it('refuses a blank or too long name', () => {
    expect(cropInput.safeParse({ ...crop, name: '   ' }).success).toBe(false);
    expect(cropInput.safeParse({ ...crop, name: 'x'.repeat(121) }).success).toBe(false);
    expect(cropInput.safeParse({ ...crop, name: 'x'.repeat(120) }).success).toBe(true);
  });
  it('takes an edible fraction above 0 up to 1', () => {
    expect(cropInput.safeParse({ ...crop, edibleFraction: 1 }).success).toBe(true);
    expect(cropInput.safeParse({ ...crop, edibleFraction: 0 }).success).toBe(false);
    expect(cropInput.safeParse({ ...crop, edibleFraction: 1.2 }).success).toBe(false);
  });
  it('refuses an unknown category', () => {
    expect(fieldsOf(cropInput.safeParse({ ...crop, category: 'tuber' })).category).toMatch(/root_tuber/);
  });
  it('keeps a crop marked not food away from food', () => {
    const flower = { name: 'Foxglove', foodId: null, category: 'other', notFood: true };
    expect(cropInput.safeParse({ ...flower, defaultUse: 'seed' }).success).toBe(true);
    expect(fieldsOf(cropInput.safeParse({ ...flower, defaultUse: 'fresh' })).defaultUse).toMatch(/not food/);
    expect(fieldsOf(cropInput.safeParse({ ...flower, foodId: 3 })).foodId).toMatch(/not food/);
    expect(fieldsOf(cropInput.safeParse({ ...flower, edibleFraction: 0.5 })).edibleFraction).toMatch(/not food/);
  });
  it('lets a crop marked not food be logged only as seed, given, sold or lost', () => {
    const flower = { name: 'Foxglove', notFood: true };
    for (const use of ['fresh', 'stored', 'preserved'] as const) expect(cropUseError(use, flower)).toMatch(/Foxglove is marked as not food/);
    for (const use of ['seed', 'given', 'sold', 'lost'] as const) expect(cropUseError(use, flower)).toBeUndefined();
    expect(cropUseError('fresh', { name: 'Potato', notFood: false })).toBeUndefined();
  });
  it('checks the not-food rule on the crop after a patch', () => {
    const current = cropInput.parse(crop);
    expect(mergeCropPatch(current, { notFood: true }).success).toBe(false); // still matched to a food
    expect(mergeCropPatch(current, { notFood: true, foodId: null }).success).toBe(true);
    expect(cropPatch.safeParse({}).success).toBe(false);
  });
});

describe('crop categories', () => {
  it('labels every category', () => {
    for (const c of CROP_CATEGORIES) expect(CROP_CATEGORY_LABELS[c].length).toBeGreaterThan(0);
  });
  it('spreads fresh food and food not eaten over one month', () => {
    expect(defaultSpreadMonths({ use: 'fresh', category: 'grain' })).toBe(1);
    expect(defaultSpreadMonths({ use: 'sold', category: 'grain' })).toBe(1);
  });
  it("prefers the crop's own spread over the category's", () => {
    expect(defaultSpreadMonths({ use: 'stored', category: 'root_tuber', cropDefault: 8 })).toBe(8);
    expect(defaultSpreadMonths({ use: 'stored', category: 'root_tuber' })).toBe(6); // common practice (no published source)
  });
  it('keeps every default spread within the allowed 1–24 months', () => {
    for (const category of CROP_CATEGORIES) {
      for (const use of ['stored', 'preserved'] as const) {
        const months = defaultSpreadMonths({ use, category });
        expect(Number.isInteger(months) && months >= 1 && months <= 24).toBe(true);
      }
    }
  });
  it('never starts a crop marked not food on an eaten use', () => {
    for (const category of CROP_CATEGORIES) expect(EATEN_USES as readonly string[]).not.toContain(defaultUse({ category, notFood: true }));
  });
});

describe('error answers', () => {
  it('lists one message per field and summarises', () => {
    const body = zodErrorBody(harvestInput.safeParse({ ...harvest, quantity: 0, unit: 'stone' }).error!);
    expect(body.code).toBe('invalid_input');
    expect(Object.keys(body.fields).sort()).toEqual(['quantity', 'unit']);
    expect(body.message).toMatch(/^quantity: The weight must be more than 0\. \(and 1 more problem\)$/);
  });
});

describe('crop archiving and staples', () => {
  it('takes archived alone as a crop change', () => {
    expect(cropPatch.parse({ archived: true })).toEqual({ archived: true });
    expect(cropPatch.safeParse({ archived: 'yes' }).success).toBe(false);
  });
  it('reads a staple with a spread of 1 month unless told, and a blank label as none', () => {
    expect(stapleInput.parse({ foodId: 5, label: '  ', quantity: 25, unit: 'kg' })).toEqual({ foodId: 5, quantity: 25, unit: 'kg', spreadMonths: 1 });
    expect(fieldsOf(stapleInput.safeParse({ foodId: 5, quantity: 0, unit: 'kg' })).quantity).toBeDefined();
    expect(fieldsOf(stapleInput.safeParse({ foodId: 5, quantity: 1, unit: 'sack' })).unit).toBeDefined();
    expect(fieldsOf(stapleInput.safeParse({ foodId: 5, quantity: 1, unit: 'kg', spreadMonths: 25 })).spreadMonths).toBeDefined();
  });
  it('logs a staple on an optional real date', () => {
    expect(stapleLogInput.parse({})).toEqual({});
    expect(stapleLogInput.safeParse({ date: '2026-02-30' }).success).toBe(false);
  });
});
