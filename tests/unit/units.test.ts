import { describe, expect, it } from 'vitest';
import { formatWeight, formatWeightIn, formatWeightPair, fromGrams, GRAMS_PER_UNIT, parseWeightUnit, toGrams, weightPairText, WEIGHT_UNITS } from '@/lib/units';

describe('converting weights to grams', () => {
  it('uses the exact international pound', () => {
    expect(toGrams(1, 'lb')).toBe(453.59237); // 1 lb = 453.59237 g exactly (International Yard and Pound Agreement, 1959)
  });
  it('uses the exact international ounce', () => {
    expect(toGrams(1, 'oz')).toBe(28.349523125); // 1 oz = 1/16 lb = 28.349523125 g exactly (International Yard and Pound Agreement, 1959)
  });
  it('makes sixteen ounces one pound', () => {
    expect(toGrams(16, 'oz')).toBe(toGrams(1, 'lb')); // 1 lb = 16 oz (International Yard and Pound Agreement, 1959)
  });
  it('makes a kilogram a thousand grams', () => {
    expect(toGrams(2.5, 'kg')).toBe(2500); // 1 kg = 1000 g (SI)
    expect(toGrams(250, 'g')).toBe(250);
  });
  it('converts back from grams to the same quantity', () => {
    for (const unit of WEIGHT_UNITS) expect(fromGrams(toGrams(3.7, unit), unit)).toBeCloseTo(3.7, 12);
  });
  it('gives about 2.2046 lb per kilogram', () => {
    expect(fromGrams(1000, 'lb')).toBeCloseTo(1000 / 453.59237, 12); // 1 lb = 453.59237 g exactly (International Yard and Pound Agreement, 1959)
    expect(fromGrams(1000, 'lb')).toBeCloseTo(2.20462, 5);
  });
  it('refuses an unknown unit with a sentence', () => {
    expect(() => toGrams(1, 'stone')).toThrow(/Unknown weight unit "stone": use one of g, kg, oz, lb\./);
    expect(() => fromGrams(1, 'KG')).toThrow(/Unknown weight unit/);
  });
  it('refuses a quantity that is not a finite number', () => {
    expect(() => toGrams(Number.NaN, 'kg')).toThrow(/finite number/);
    expect(() => toGrams(Number.POSITIVE_INFINITY, 'g')).toThrow(/finite number/);
  });
  it('has a factor for every unit', () => {
    for (const unit of WEIGHT_UNITS) expect(GRAMS_PER_UNIT[unit]).toBeGreaterThan(0);
  });
});

describe('reading units as people write them', () => {
  it('accepts case, spaces and plurals', () => {
    expect(parseWeightUnit(' KG ')).toBe('kg');
    expect(parseWeightUnit('lbs')).toBe('lb');
    expect(parseWeightUnit('Pounds')).toBe('lb');
    expect(parseWeightUnit('ounces')).toBe('oz');
    expect(parseWeightUnit('grams')).toBe('g');
  });
  it('does not guess at units it does not know', () => {
    expect(parseWeightUnit('gr')).toBeUndefined(); // could be the grain
    expect(parseWeightUnit('stone')).toBeUndefined();
    expect(parseWeightUnit('')).toBeUndefined();
    expect(parseWeightUnit('constructor')).toBeUndefined();
  });
});

describe('writing weights for the household', () => {
  it('writes grams below a kilogram and kilograms above', () => {
    expect(formatWeight(350, 'metric')).toBe('350 g');
    expect(formatWeight(1250, 'metric')).toBe('1.25 kg');
    expect(formatWeight(2000, 'metric')).toBe('2 kg');
    expect(formatWeight(2.45, 'metric')).toBe('2.5 g');
  });
  it('switches to kilograms when the grams would round to 1000', () => {
    expect(formatWeight(999.7, 'metric')).toBe('1 kg');
  });
  it('writes ounces below a pound and decimal pounds above', () => {
    expect(formatWeight(100, 'us')).toBe('3.5 oz'); // 100 / 28.349523125 = 3.527 oz
    expect(formatWeight(1250, 'us')).toBe('2.76 lb'); // 1250 / 453.59237 = 2.7558 lb
    expect(formatWeight(453.59237, 'us')).toBe('1 lb'); // 1 lb = 453.59237 g exactly (International Yard and Pound Agreement, 1959)
  });
  it('switches to pounds when the ounces would round to 16', () => {
    expect(formatWeight(453.5, 'us')).toBe('1 lb');
  });
  it('always shows a unit', () => {
    for (const g of [0, 0.4, 7, 999, 1000, 123456]) {
      expect(formatWeight(g, 'metric')).toMatch(/ (g|kg)$/);
      expect(formatWeight(g, 'us')).toMatch(/ (oz|lb)$/);
    }
  });
  it('refuses an unknown unit system', () => {
    expect(() => formatWeight(1, 'imperial' as never)).toThrow(/Unknown unit system "imperial"/);
  });
});

describe('weight pairs in one unit', () => {
  it('writes a weighing and its edible portion in the entry’s unit when it is of the household’s system', () => {
    expect(weightPairText(450, 396, 'metric', 'kg')).toBe('0.45 kg · edible 0.4 kg');
    expect(formatWeightPair(450, 396, 'metric', 'g')).toEqual({ weight: '450 g', edible: '396 g', unit: 'g' });
  });

  it('picks the system’s unit for the larger figure when the entry’s unit is of the other system', () => {
    // 1 lb = 453.59237 g exactly (International Yard and Pound Agreement, 1959): 2 lb = 907.18 g
    expect(formatWeightPair(907.18474, 800, 'metric', 'lb')).toEqual({ weight: '907 g', edible: '800 g', unit: 'g' });
    // 2500 g = 5.51 lb; 2000 g = 4.41 lb
    expect(formatWeightPair(2500, 2000, 'us', 'kg')).toEqual({ weight: '5.51 lb', edible: '4.41 lb', unit: 'lb' });
  });

  it('never mixes units across the pair even where one figure alone would switch', () => {
    // formatWeight alone writes 1.2 kg and 900 g; the pair keeps kg for both
    const p = formatWeightPair(1200, 900, 'metric');
    expect(p.weight).toBe('1.2 kg');
    expect(p.edible).toBe('0.9 kg');
  });

  it('writes grams in a chosen unit with that unit’s decimals', () => {
    // 1 oz = 28.349523125 g exactly: 100 g = 3.53 oz → one decimal
    expect(formatWeightIn(100, 'oz')).toBe('3.5 oz');
    expect(formatWeightIn(396.4, 'g')).toBe('396 g');
  });
});
