import { describe, expect, it } from 'vitest';
import { edibleFactor, edibleGrams } from '@/lib/edible';

describe('edible portion', () => {
  it('takes the refuse off potatoes', () => {
    // USDA SR28, NDB 11352 "Potatoes, flesh and skin, raw": 25 % refuse
    expect(edibleGrams(2000, { refusePercent: 25 })).toBe(1500);
  });
  it('takes the refuse off butternut squash', () => {
    // USDA SR28, NDB 11485 "Squash, winter, butternut, raw": 16 % refuse
    expect(edibleGrams(1000, { refusePercent: 16 })).toBeCloseTo(840, 10);
  });
  it('takes nothing off an entry weighed trimmed', () => {
    // USDA SR28, NDB 11485 "Squash, winter, butternut, raw": 16 % refuse, ignored when trimmed
    expect(edibleGrams(1000, { refusePercent: 16, trimmed: true })).toBe(1000);
  });
  it("lets the crop's edible fraction override the food's refuse", () => {
    // USDA SR28, NDB 11352 "Potatoes, flesh and skin, raw": 25 % refuse, overridden by the crop's 0.9
    expect(edibleGrams(1000, { refusePercent: 25, edibleFraction: 0.9 })).toBe(900);
  });
  it('counts no refuse when the food table gives none', () => {
    expect(edibleGrams(500, { refusePercent: null })).toBe(500);
    expect(edibleGrams(500, {})).toBe(500);
  });
  it('gives the eaten fraction on its own', () => {
    expect(edibleFactor({ refusePercent: 25 })).toBe(0.75); // USDA SR28, NDB 11352 potatoes: 25 % refuse
    expect(edibleFactor({ refusePercent: 25, trimmed: true })).toBe(1);
  });
  it('refuses refuse outside 0–100 %', () => {
    expect(() => edibleGrams(100, { refusePercent: -1 })).toThrow(/Refuse must be a percentage from 0 to 100/);
    expect(() => edibleGrams(100, { refusePercent: 101 })).toThrow(/Refuse must be a percentage/);
    expect(() => edibleGrams(100, { refusePercent: Number.NaN })).toThrow(/Refuse must be a percentage/);
  });
  it('refuses an edible fraction outside 0–1, even when trimmed', () => {
    expect(() => edibleGrams(100, { edibleFraction: 1.5 })).toThrow(/edible fraction must be between 0 and 1/);
    expect(() => edibleGrams(100, { edibleFraction: -0.1, trimmed: true })).toThrow(/edible fraction/);
  });
  it('refuses a negative weight', () => {
    expect(() => edibleGrams(-5, { refusePercent: 10 })).toThrow(/zero or more grams/);
  });
});
