import { describe, expect, it } from 'vitest';
import { fieldErrors } from '@/lib/error-body';
import { planRequest } from '@/lib/plan-schemas';

describe('planRequest', () => {
  it('fills the defaults: the year basis and 30 % of energy per crop', () => {
    expect(planRequest.parse({ year: 2027, targets: { energy_kcal: 0.5 } })).toEqual({ year: 2027, targets: { energy_kcal: 0.5 }, basis: 'year', maxShareOfEnergyPerCrop: 0.3 });
  });

  it('takes every field of the issue', () => {
    const body = { year: 2027, targets: { vitamin_c_mg: 1, energy_kcal: 0.25 }, basis: 'month', maxAreaM2: 40, crops: ['potatoes', 'kale'], maxShareOfEnergyPerCrop: 0.5 };
    expect(planRequest.parse(body)).toEqual(body);
  });

  it('names each bad field with a sentence saying how to fix it', () => {
    const errors = fieldErrors(planRequest.safeParse({ year: 2027.5, targets: { energy_kcal: -1, zinc: 1 }, basis: 'week', maxAreaM2: 0, crops: ['Potatoes'], maxShareOfEnergyPerCrop: 2, extra: 1 }));
    expect(errors).toEqual({
      year: 'Give the growing year as a whole number, e.g. 2027.',
      'targets.energy_kcal': 'A target is a share of need from 0 to 3 (1 = all of it).',
      'targets.zinc': expect.stringMatching(/^The nutrient must be one of energy_kcal, protein_g/),
      basis: 'The basis must be one of year, month.',
      maxAreaM2: 'The area limit must be more than 0 m².',
      'crops.0': 'A crop is its key in the reference table, e.g. "potatoes".',
      maxShareOfEnergyPerCrop: 'The largest share of energy per crop must be more than 0 and at most 1.',
      extra: 'Unknown field: check its spelling.',
    });
  });

  it('wants at least one target', () => {
    expect(fieldErrors(planRequest.safeParse({ year: 2027, targets: {} }))).toEqual({ targets: 'Give at least one target, e.g. { "energy_kcal": 0.5 }.' });
    expect(fieldErrors(planRequest.safeParse({ year: 2027 })).targets).toMatch(/Give targets as an object/);
  });
});
