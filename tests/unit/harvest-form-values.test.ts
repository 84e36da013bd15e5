/**
 * The harvest form's resolver: what is typed becomes the endpoint's body, checked by the endpoint's
 * own schemas, with the form's own sentences for what only the form can see.
 */
import { describe, expect, it } from 'vitest';
import { emptyHarvestValues, harvestLabel, harvestResolver, restOf, type HarvestFormContext, type HarvestFormValues } from '@/components/entries/harvest-form-values';
import { firstWins, flatErrors } from '@/components/entries/form-errors';

const options = { fields: {}, shouldUseNativeValidation: false };
const context: HarvestFormContext = {
  unit: 'kg',
  crops: [
    { id: 3, displayName: 'Potato (Charlotte)', notFood: false },
    { id: 9, displayName: 'Foxglove', notFood: true },
  ],
};
const form = (patch: Partial<HarvestFormValues>): HarvestFormValues => ({ ...emptyHarvestValues('2026-07-14'), ...patch });

async function resolve(values: HarvestFormValues) {
  const r = await harvestResolver(values, context, options);
  return { values: r.values, errors: flatErrors(r.errors) };
}

describe('harvestResolver', () => {
  it('reads a decimal comma and sends the parsed body with the remembered unit', async () => {
    const r = await resolve(form({ cropId: 3, quantity: '1,2' }));
    expect(r.errors).toEqual({});
    expect(r.values).toEqual({ date: '2026-07-14', cropId: 3, quantity: 1.2, unit: 'kg', use: 'fresh', spreadMonths: 1, trimmed: false });
  });

  it('asks for the crop first, then gives the schema’s sentence for the weight', async () => {
    const r = await resolve(form({ quantity: '' }));
    expect(Object.keys(r.errors)[0]).toBe('cropId');
    expect(r.errors.cropId).toBe('Choose the crop you harvested.');
    expect(r.errors.quantity).toBe('Enter the weight.');
  });

  it('refuses an eaten use for a crop marked not food', async () => {
    const r = await resolve(form({ cropId: 9, quantity: '2', use: 'fresh' }));
    expect(r.errors.use).toBe('Foxglove is marked as not food, so it can only be logged as seed, given, sold or lost.');
  });

  it('sends a split with the rest of the weighing as its last part', async () => {
    const values = form({ cropId: 3, quantity: '12', splitting: true, spreadMonths: '5', parts: [{ pid: 1, quantity: '3', use: 'fresh' }, { pid: 2, quantity: '', use: 'stored' }] });
    expect(restOf(values)).toBe(9);
    const r = await resolve(values);
    expect(r.errors).toEqual({});
    expect(r.values).toMatchObject({ cropId: 3, unit: 'kg', parts: [{ quantity: 3, use: 'fresh', spreadMonths: 1 }, { quantity: 9, use: 'stored', spreadMonths: 5 }] });
    expect(harvestLabel(values, 'kg', 'Potato')).toBe('12 kg Potato — 3 kg fresh, 9 kg stored');
    expect(harvestLabel(values, 'piece', 'Eggs')).toBe('12 pieces Eggs — 3 pieces fresh, 9 pieces stored');
  });

  it('sends the preserving method with preserved food only, in one weighing or in each preserved part', async () => {
    const one = await resolve(form({ cropId: 3, quantity: '4', use: 'preserved', preserveMethod: 'frozen' }));
    expect(one.errors).toEqual({});
    expect(one.values).toMatchObject({ use: 'preserved', preserveMethod: 'frozen' });
    const fresh = await resolve(form({ cropId: 3, quantity: '4', use: 'fresh', preserveMethod: 'frozen' }));
    expect(fresh.values).not.toHaveProperty('preserveMethod');
    const split = await resolve(form({ cropId: 3, quantity: '10', splitting: true, preserveMethod: 'canned', parts: [{ pid: 1, quantity: '3', use: 'fresh' }, { pid: 2, quantity: '', use: 'preserved' }] }));
    expect(split.values).toMatchObject({ parts: [{ use: 'fresh' }, { use: 'preserved', preserveMethod: 'canned' }] });
    expect((split.values as { parts: object[] }).parts[0]).not.toHaveProperty('preserveMethod');
  });

  it('refuses a date after today in the household’s zone, as the server does', async () => {
    const r = await harvestResolver(form({ cropId: 3, quantity: '1', date: '2026-07-15' }), { ...context, today: '2026-07-14' }, options);
    expect(flatErrors(r.errors).date).toBe("The harvest date 2026-07-15 is after today (2026-07-14 in the household's time zone); enter the day it was picked.");
    const ok = await harvestResolver(form({ cropId: 3, quantity: '1', date: '2026-07-14' }), { ...context, today: '2026-07-14' }, options);
    expect(flatErrors(ok.errors)).toEqual({});
  });

  it('says when the other parts leave nothing for the last one', async () => {
    const r = await resolve(form({ cropId: 3, quantity: '2', splitting: true, parts: [{ pid: 1, quantity: '2', use: 'fresh' }, { pid: 2, quantity: '', use: 'stored' }] }));
    expect(r.errors['parts.1.quantity']).toBe('The other parts add up to 2 kg, which leaves nothing for the last part. Check the weights.');
  });
});

describe('flatErrors', () => {
  it('flattens nested errors to paths and lists a field array’s own error under its name', () => {
    const nested = { quantity: { type: 'x', message: 'Q' }, parts: Object.assign([{ use: { type: 'x', message: 'U' } }], { root: { type: 'x', message: 'P' } }) };
    expect(flatErrors(nested as never)).toEqual({ quantity: 'Q', 'parts.0.use': 'U', parts: 'P' });
  });

  it('keeps the first message for a field named twice', () => {
    expect(firstWins({ a: '1' }, { a: '2', b: '3' })).toEqual({ a: '1', b: '3' });
  });
});

describe('a weighing that names its planting', () => {
  it('sends the planting with a single weighing, and never with a split one', async () => {
    const { harvestBody } = await import('@/components/entries/harvest-form-values');
    const one = harvestBody(form({ cropId: 3, quantity: '2', plantingId: '17' }), 'kg');
    expect(one).toMatchObject({ cropId: 3, quantity: 2, plantingId: 17 });
    const none = harvestBody(form({ cropId: 3, quantity: '2' }), 'kg');
    expect(none).not.toHaveProperty('plantingId');
    const split = harvestBody(form({ cropId: 3, quantity: '10', plantingId: '17', splitting: true, parts: [{ pid: 1, quantity: '4', use: 'fresh' }, { pid: 2, quantity: '', use: 'stored' }] }), 'kg');
    expect(split).not.toHaveProperty('plantingId');
  });
});
