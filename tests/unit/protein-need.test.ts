import { describe, expect, it } from 'vitest';
import { proteinByWeight, proteinPerKg } from '@/lib/protein-need';
import { dailyNeed } from '@/lib/requirements';

describe('protein from the person\u2019s weight', () => {
  it('uses the RDA per kilogram of each age group', () => {
    expect(proteinPerKg(30, null)).toBe(0.8); // RDA protein ≥19 y: 0.80 g/kg/day (IOM 2005 DRI for macronutrients)
    expect(proteinPerKg(16, null)).toBe(0.85); // 14–18 y: 0.85 g/kg/day (IOM 2005)
    expect(proteinPerKg(10, null)).toBe(0.95); // 9–13 y: 0.95 g/kg/day (IOM 2005)
    expect(proteinPerKg(5, null)).toBe(0.95); // 4–8 y: 0.95 g/kg/day (IOM 2005)
    expect(proteinPerKg(2, null)).toBe(1.05); // 1–3 y: 1.05 g/kg/day (IOM 2005)
    expect(proteinPerKg(25, 'pregnancy')).toBe(1.1); // pregnancy: 1.1 g/kg/day (IOM 2005)
    expect(proteinPerKg(25, 'lactation')).toBe(1.3); // from memory: IOM 2005 ch. 10, lactation RDA 1.3 g/kg/day (EAR 1.05, IOM 2006 WIC Food Packages Table F-3)
    expect(proteinPerKg(0.7, null)).toBeNull();
  });

  it('replaces the table value when a weight is given', () => {
    expect(dailyNeed({ sex: 'male', ageYears: 30, weightKg: 80 }, 'protein_g')?.value).toBeCloseTo(64, 9); // 0.80 g/kg × 80 kg (IOM 2005)
    expect(dailyNeed({ sex: 'female', ageYears: 16, weightKg: 60 }, 'protein_g')?.value).toBeCloseTo(51, 9); // 0.85 g/kg × 60 kg (IOM 2005)
    expect(dailyNeed({ sex: 'male', ageYears: 2, weightKg: 12 }, 'protein_g')?.value).toBeCloseTo(12.6, 9); // 1.05 g/kg × 12 kg (IOM 2005)
    expect(dailyNeed({ sex: 'female', ageYears: 25, weightKg: 60, condition: 'pregnancy' }, 'protein_g')?.value).toBeCloseTo(66, 9); // 1.1 g/kg × 60 kg (IOM 2005)
  });

  it('keeps the table value without a weight and under 1 year', () => {
    expect(dailyNeed({ sex: 'female', ageYears: 25 }, 'protein_g')?.value).toBe(46); // RDA protein, women 19–30 y: 46 g/day (DRI Macronutrients table)
    expect(dailyNeed({ sex: 'male', ageYears: 0.3, weightKg: 6 }, 'protein_g')?.value).toBe(9.1); // AI protein, infants 0–6 mo: 9.1 g/day (DRI Macronutrients table)
    expect(proteinByWeight({ ageYears: 30 })).toBeNull();
  });

  it('refuses a weight that is not a positive number', () => {
    expect(() => proteinByWeight({ ageYears: 30, weightKg: 0 })).toThrow(/kilograms above 0/);
    expect(() => proteinByWeight({ ageYears: 30, weightKg: Number.NaN })).toThrow(RangeError);
  });
});
