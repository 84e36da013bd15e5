/**
 * The bought-food and crop forms' resolvers: typed text becomes the endpoint's body and is checked
 * by the endpoint's own schemas, with the form's own sentences where only the form can tell.
 */
import { describe, expect, it } from 'vitest';
import { cropBody, cropFormValues, cropResolver } from '@/components/entries/crop-form-values';
import { flatErrors } from '@/components/entries/form-errors';
import { emptyPurchaseValues, purchaseResolver, type PurchaseFormValues } from '@/components/entries/purchase-form-values';

const options = { fields: {}, shouldUseNativeValidation: false };
const flour = { id: 5, name: 'Wheat flour, whole-grain', code: '20080' };
const purchase = (patch: Partial<PurchaseFormValues>): PurchaseFormValues => ({ ...emptyPurchaseValues('2026-03-02'), ...patch });

describe('purchaseResolver', () => {
  it('sends a bulk buy with its months, the remembered unit and the currency of its price', async () => {
    const r = await purchaseResolver(purchase({ food: flour, quantity: '25', price: '31,5', spreadMonths: '6' }), { unit: 'kg', currency: 'EUR' }, options);
    expect(flatErrors(r.errors)).toEqual({});
    expect(r.values).toEqual({ date: '2026-03-02', foodId: 5, quantity: 25, unit: 'kg', price: 31.5, currency: 'EUR', spreadMonths: 6, trimmed: false });
  });

  it('asks for the food in the form’s words', async () => {
    const r = await purchaseResolver(purchase({ quantity: '1' }), { unit: 'kg', currency: '' }, options);
    expect(flatErrors(r.errors)).toEqual({ foodId: 'Choose the food you bought from the reference foods.' });
  });

  it('asks for the currency of a price', async () => {
    const r = await purchaseResolver(purchase({ food: flour, quantity: '1', price: '2' }), { unit: 'kg', currency: ' ' }, options);
    expect(flatErrors(r.errors).currency).toBe('Give the currency of the price, e.g. EUR or USD.');
  });
});

describe('cropResolver', () => {
  it('gives the schema’s sentence for a crop without a name', async () => {
    const r = await cropResolver(cropFormValues(), { editing: false }, options);
    expect(flatErrors(r.errors).name).toBe('Give the crop a name.');
  });

  it('reads the eaten share in % as a fraction', async () => {
    const r = await cropResolver({ ...cropFormValues(), name: 'Leek', eatenPct: '62,5' }, { editing: false }, options);
    expect(flatErrors(r.errors)).toEqual({});
    expect(r.values).toMatchObject({ name: 'Leek', edibleFraction: 0.625, foodId: null, notFood: false });
  });

  it('leaves the category out of a new crop when the form says "from the name", for the server to fill', () => {
    const values = { ...cropFormValues(), name: 'Potatoes' };
    expect(values.category).toBe('');
    expect(cropBody(values, false).category).toBeUndefined();
    expect(cropBody({ ...values, category: 'grain' }, false).category).toBe('grain');
  });

  it('clears blank fields when a crop is changed, and leaves them out when it is new', () => {
    const values = { ...cropFormValues(), name: 'Leek' };
    expect(cropBody(values, true)).toMatchObject({ variety: null, edibleFraction: null, defaultUse: null, defaultSpreadMonths: null });
    expect(cropBody(values, false)).toMatchObject({ variety: '', edibleFraction: undefined, defaultUse: undefined, defaultSpreadMonths: undefined });
  });

  it('sends the weight of one in grams, typed in ounces in a US household', () => {
    const values = { ...cropFormValues(), name: 'Radish', countWeight: '4' };
    // 1 oz = 28.349523125 g exactly (International Yard and Pound Agreement, 1959): 4 oz = 113.3980925 g
    expect(cropBody(values, false, 'us').countGrams).toBeCloseTo(113.3980925, 9);
    expect(cropBody(values, false, 'metric').countGrams).toBe(4);
    expect(cropBody({ ...values, countWeight: '' }, true).countGrams).toBeNull();
    const stored = { name: 'Radish', countGrams: 113.3980925 } as unknown as Parameters<typeof cropFormValues>[0];
    expect(cropFormValues(stored, 'us').countWeight).toBe('4');
  });

  it('refuses a weight of one of 0', async () => {
    const r = await cropResolver({ ...cropFormValues(), name: 'Radish', countWeight: '0' }, { editing: false }, options);
    expect(flatErrors(r.errors).countGrams).toBe('The weight of one must be more than 0 g.');
  });
});
