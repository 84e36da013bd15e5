import { describe, expect, it } from 'vitest';
import { harvestWarnings, HEAVY_WEIGHING_GRAMS, isStorageCrop, LIGHT_STORAGE_GRAMS } from '@/lib/harvest-warnings';

describe('weights worth a second look', () => {
  it('has the thresholds of the issue', () => {
    expect(HEAVY_WEIGHING_GRAMS).toBe(100_000); // common practice (no published source)
    expect(LIGHT_STORAGE_GRAMS).toBe(20); // common practice (no published source)
  });

  it('asks about a weighing over 100 kg, saying it back in its unit', () => {
    const [w] = harvestWarnings({ grams: 150_000, unit: 'kg', category: 'leafy_green' });
    expect(w!.code).toBe('heavy_weighing');
    expect(w!.message).toBe('150 kg is over 100 kg for one weighing. Check the weight and the unit, or save it if it is right.');
    // 250 lb = 113.4 kg (International Yard and Pound Agreement, 1959: 1 lb = 453.59237 g)
    expect(harvestWarnings({ grams: 250 * 453.59237, unit: 'lb' })[0]!.message).toMatch(/^250 lb is over 100 kg/);
  });

  it('takes exactly 100 kg without a word', () => {
    expect(harvestWarnings({ grams: 100_000, unit: 'kg', category: 'grain' })).toEqual([]);
  });

  it('asks about under 20 g of a storage crop, but not of herbs or greens', () => {
    const [w] = harvestWarnings({ grams: 12, unit: 'g', category: 'root_tuber', cropName: 'Potato' });
    expect(w!.code).toBe('light_storage_crop');
    expect(w!.message).toContain('12 g of Potato is less than 20 g');
    expect(harvestWarnings({ grams: 20, unit: 'g', category: 'squash' })).toEqual([]);
    expect(harvestWarnings({ grams: 5, unit: 'g', category: 'herb' })).toEqual([]);
    expect(harvestWarnings({ grams: 15, unit: 'g', category: 'leafy_green' })).toEqual([]);
    expect(harvestWarnings({ grams: 15, unit: 'g', category: null })).toEqual([]);
  });

  it('leaves a weight that is not a positive number to the schema', () => {
    expect(harvestWarnings({ grams: Number.NaN, unit: 'kg' })).toEqual([]);
    expect(harvestWarnings({ grams: 0, unit: 'kg', category: 'grain' })).toEqual([]);
  });

  it('counts grain, pulses, roots and squash as storage crops', () => {
    expect(['grain', 'legume', 'root_tuber', 'squash'].every((c) => isStorageCrop(c as never))).toBe(true);
    expect(isStorageCrop('fruit')).toBe(false);
  });
});
