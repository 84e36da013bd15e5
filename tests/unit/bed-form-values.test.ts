import { describe, expect, it } from 'vitest';
import { bedBody, expectedHarvest, plantingBody, plantingFormValues, seasonBody } from '@/components/beds/bed-form-values';
import { bedInput, plantingInput, plantingPatch } from '@/lib/bed-schemas';
import { DEFAULT_FROST_DATES } from '@/lib/growing-season';

describe('the beds page forms', () => {
  it('turns the bed form into the endpoint’s body', () => {
    const body = bedBody({ name: 'North', area: '12,5', notes: '' }, false);
    expect(body).toEqual({ name: 'North', area: 12.5, notes: undefined });
    expect(bedInput.parse(body)).toEqual({ name: 'North', area: 12.5 });
    expect(bedBody({ name: 'North', area: '3', notes: ' ' }, true).notes).toBeNull();
  });

  it('sends a reference crop as referenceKey and a household crop as cropId', () => {
    const values = { ...plantingFormValues(2027), crop: 'ref:garlic', area: '3' };
    expect(plantingInput.parse(plantingBody(values, false))).toEqual({ referenceKey: 'garlic', bedId: null, area: 3, seasonYear: 2027, slot: 'main' });
    const mine = plantingBody({ ...values, crop: 'crop:12', bedId: '4' }, false);
    expect(mine).toMatchObject({ cropId: 12, bedId: 4 });
  });

  it('clears a blank date when a planting is changed', () => {
    const values = { ...plantingFormValues(2027), crop: 'crop:12', area: '3', harvestFrom: '' };
    expect(plantingPatch.parse(plantingBody(values, true)).harvestFrom).toBeNull();
  });

  it('prefills the harvest window from the reference row and the frost dates', () => {
    const garlic = { key: 'garlic', name: 'Garlic', category: 'other' as const, typicalKgPerM2: 1.2, harvestFrom: { frost: 'spring' as const, weeks: 10 }, harvestTo: { frost: 'spring' as const, weeks: 14 } };
    // reference-data/crops.csv, garlic: 10 to 14 weeks after the last spring frost; 1 May + 70 and + 98 days
    expect(expectedHarvest(garlic, 2027, DEFAULT_FROST_DATES.northern)).toEqual({ from: '2027-07-10', to: '2027-08-07' });
    expect(expectedHarvest(undefined, 2027, DEFAULT_FROST_DATES.northern)).toBeNull();
    expect(expectedHarvest(garlic, Number('twenty'), DEFAULT_FROST_DATES.northern)).toBeNull();
  });

  it('sends a blank frost date as null, the default', () => {
    expect(seasonBody({ lastSpringFrost: ' ', firstAutumnFrost: '10-10' })).toEqual({ lastSpringFrost: null, firstAutumnFrost: '10-10' });
  });
});
