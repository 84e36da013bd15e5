import { describe, expect, it } from 'vitest';
import { NUTRIENTS, SHARE_NUTRIENTS, isNutrientKey, nutrientDef } from '@/lib/nutrients';

describe('nutrient list', () => {
  it('has unique keys and unique SR28 fields', () => {
    expect(new Set(NUTRIENTS.map((n) => n.key)).size).toBe(NUTRIENTS.length);
    expect(new Set(NUTRIENTS.map((n) => n.sr28Field)).size).toBe(NUTRIENTS.length);
  });
  it('names every share nutrient', () => {
    for (const key of SHARE_NUTRIENTS) expect(isNutrientKey(key)).toBe(true);
  });
  it('puts the unit in the key suffix', () => {
    const suffix: Record<string, string> = { kcal: '_kcal', g: '_g', mg: '_mg', 'µg': '_ug' };
    for (const n of NUTRIENTS) expect(n.key.endsWith(suffix[n.unit]!)).toBe(true);
  });
  it('answers undefined for an unknown key', () => {
    expect(nutrientDef('unobtainium_mg')).toBeUndefined();
  });
});
