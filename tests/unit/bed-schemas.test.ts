import { describe, expect, it } from 'vitest';
import { areaUnitFor, bedInput, bedPatch, fromM2, fromPlanInput, M2_PER_FT2, plantingInput, plantingPatch, seasonInput, toM2 } from '@/lib/bed-schemas';

describe('areas in m² or ft²', () => {
  it('converts square feet by the international foot', () => {
    // 1 ft = 0.3048 m exactly (International Yard and Pound Agreement, 1959), so 1 ft² = 0.09290304 m²
    expect(M2_PER_FT2).toBe(0.3048 * 0.3048);
    expect(M2_PER_FT2).toBe(0.09290304);
    expect(toM2(100, 'ft2')).toBeCloseTo(9.290304, 12);
    expect(fromM2(toM2(250, 'ft2'), 'ft2')).toBeCloseTo(250, 10);
    expect(toM2(12, 'm2')).toBe(12);
  });

  it('takes the household’s unit system', () => {
    expect(areaUnitFor('us')).toBe('ft2');
    expect(areaUnitFor('metric')).toBe('m2');
  });

  it('refuses a negative area with a sentence', () => {
    expect(() => toM2(-1, 'm2')).toThrow('An area must be zero or more, got -1.');
  });
});

describe('beds', () => {
  it('takes a name and an area, trimming the name and dropping blank notes', () => {
    expect(bedInput.parse({ name: '  North bed ', area: 12, notes: ' ' })).toEqual({ name: 'North bed', area: 12 });
  });

  it('says what is wrong with a bed without area or with a negative one', () => {
    const missing = bedInput.safeParse({ name: 'A' });
    expect(missing.success).toBe(false);
    expect(missing.error?.issues[0]?.message).toBe('Enter the area.');
    expect(bedInput.safeParse({ name: 'A', area: -2 }).error?.issues[0]?.message).toBe('The area must be more than 0.');
    expect(bedInput.safeParse({ name: '', area: 2 }).error?.issues[0]?.message).toBe('Give the bed a name.');
    expect(bedInput.safeParse({ name: 'A', area: 2, areaUnit: 'acre' }).success).toBe(false);
  });

  it('refuses an empty patch and a unit without its area', () => {
    expect(bedPatch.safeParse({}).success).toBe(false);
    expect(bedPatch.safeParse({ areaUnit: 'ft2' }).error?.issues[0]?.message).toBe('Give the area together with its unit.');
    expect(bedPatch.parse({ notes: null })).toEqual({ notes: null });
  });
});

describe('plantings', () => {
  it('defaults the slot to main and the bed to none', () => {
    expect(plantingInput.parse({ cropId: 3, area: 4, seasonYear: 2027 })).toEqual({ cropId: 3, bedId: null, area: 4, seasonYear: 2027, slot: 'main' });
  });

  it('takes either a household crop or a reference crop, not both or neither', () => {
    expect(plantingInput.safeParse({ area: 4, seasonYear: 2027 }).error?.issues[0]?.message).toBe('Choose the crop this planting grows.');
    expect(plantingInput.safeParse({ cropId: 1, referenceKey: 'garlic', area: 4, seasonYear: 2027 }).success).toBe(false);
    expect(plantingInput.parse({ referenceKey: 'winter-squash', area: 4, seasonYear: 2027 }).referenceKey).toBe('winter-squash');
    expect(plantingInput.safeParse({ referenceKey: 'Winter Squash', area: 4, seasonYear: 2027 }).success).toBe(false);
  });

  it('names a missing crop even when the area is missing too', () => {
    const r = plantingInput.safeParse({ seasonYear: 2027 });
    expect(r.error?.issues.map((i) => [i.path.join('.'), i.message])).toEqual([
      ['area', 'Enter the area.'],
      ['cropId', 'Choose the crop this planting grows.'],
    ]);
  });

  it('refuses a harvest that ends before it starts, or a sowing years away from its season', () => {
    const back = plantingInput.safeParse({ cropId: 1, area: 1, seasonYear: 2027, harvestFrom: '2027-08-01', harvestTo: '2027-07-01' });
    expect(back.error?.issues[0]).toMatchObject({ path: ['harvestTo'], message: 'The harvest ends before it starts: check both dates.' });
    const far = plantingInput.safeParse({ cropId: 1, area: 1, seasonYear: 2027, sowDate: '2024-04-01' });
    expect(far.error?.issues[0]?.path).toEqual(['sowDate']);
    // Autumn-sown grain for the 2027 season is sown in 2026.
    expect(plantingInput.safeParse({ cropId: 1, area: 1, seasonYear: 2027, sowDate: '2026-10-10' }).success).toBe(true);
    expect(plantingInput.safeParse({ cropId: 1, area: 1, seasonYear: 2027, slot: 'second' }).success).toBe(false);
  });

  it('lets a patch clear the bed and refuses an empty one', () => {
    expect(plantingPatch.parse({ bedId: null })).toEqual({ bedId: null });
    expect(plantingPatch.safeParse({}).success).toBe(false);
  });
});

describe('season and plans', () => {
  it('needs both frost dates, each MM-DD or null', () => {
    expect(seasonInput.parse({ lastSpringFrost: '04-20', firstAutumnFrost: null })).toEqual({ lastSpringFrost: '04-20', firstAutumnFrost: null });
    expect(seasonInput.safeParse({}).success).toBe(false);
    expect(seasonInput.safeParse({ lastSpringFrost: '02-29', firstAutumnFrost: null }).success).toBe(false);
    expect(seasonInput.safeParse({ lastSpringFrost: '05-01', firstAutumnFrost: '05-01' }).success).toBe(false);
  });

  it('takes a plan’s crops once each', () => {
    expect(fromPlanInput.parse({ year: 2027, crops: [{ cropKey: 'potatoes', areaM2: 12 }] }).crops).toHaveLength(1);
    const twice = fromPlanInput.safeParse({ year: 2027, crops: [{ cropKey: 'kale', areaM2: 1 }, { cropKey: 'kale', areaM2: 2 }] });
    expect(twice.error?.issues[0]?.path).toEqual(['crops', 1, 'cropKey']);
    expect(fromPlanInput.safeParse({ year: 2027, crops: [] }).success).toBe(false);
  });
});
