import { describe, expect, it } from 'vitest';
import { amdrGrams, amdrPercent } from '@/lib/amdr';
import { monthlyNeedDetails } from '@/lib/needs';
import { dailyNeed } from '@/lib/requirements';

describe('carbohydrate and fat as ranges of the energy need', () => {
  it('gives the AMDR in percent of energy by age', () => {
    expect(amdrPercent('carbohydrate_g', 30)).toEqual({ lowPct: 45, highPct: 65 }); // carbohydrate 45–65 % (IOM 2005 AMDR)
    expect(amdrPercent('fat_g', 30)).toEqual({ lowPct: 20, highPct: 35 }); // fat ≥19 y: 20–35 % (IOM 2005 AMDR)
    expect(amdrPercent('fat_g', 10)).toEqual({ lowPct: 25, highPct: 35 }); // fat 4–18 y: 25–35 % (IOM 2005 AMDR)
    expect(amdrPercent('fat_g', 2)).toEqual({ lowPct: 30, highPct: 40 }); // fat 1–3 y: 30–40 % (IOM 2005 AMDR)
    expect(amdrPercent('fat_g', 0.7)).toBeNull();
    expect(amdrPercent('protein_g', 30)).toBeNull();
  });

  it('turns the range into grams at 4 kcal/g carbohydrate and 9 kcal/g fat', () => {
    expect(amdrGrams('carbohydrate_g', 30, 2000)).toEqual({ low: 225, high: 325 }); // 45–65 % of 2000 kcal ÷ 4 kcal/g (IOM 2005 AMDR)
    const fat = amdrGrams('fat_g', 30, 2000)!;
    expect(fat.low).toBeCloseTo(400 / 9, 9); // 20 % of 2000 kcal ÷ 9 kcal/g (IOM 2005 AMDR)
    expect(fat.high).toBeCloseTo(700 / 9, 9); // 35 % of 2000 kcal ÷ 9 kcal/g
  });

  it('makes the need the low end and keeps the range beside it', () => {
    const carb = dailyNeed({ sex: 'male', ageYears: 30, kcalPerDay: 2000 }, 'carbohydrate_g')!;
    expect(carb).toMatchObject({ value: 225, range: { low: 225, high: 325 }, basis: 'AMDR' }); // 45–65 % of 2000 kcal (IOM 2005 AMDR)
    const child = dailyNeed({ sex: 'female', ageYears: 2, kcalPerDay: 1000 }, 'fat_g')!;
    expect(child.value).toBeCloseTo(300 / 9, 9); // 30 % of 1000 kcal ÷ 9 kcal/g, 1–3 y (IOM 2005 AMDR)
    expect(child.range!.high).toBeCloseTo(400 / 9, 9); // 40 %
  });

  it('keeps the infant AI, where there is no AMDR', () => {
    expect(dailyNeed({ sex: 'male', ageYears: 0.3 }, 'carbohydrate_g')).toMatchObject({ value: 60, basis: 'AI', range: null }); // AI carbohydrate, infants 0–6 mo: 60 g/day (DRI Macronutrients table)
    expect(dailyNeed({ sex: 'male', ageYears: 0.3 }, 'fat_g')).toMatchObject({ value: 31, basis: 'AI', range: null }); // AI fat, infants 0–6 mo: 31 g/day
  });

  it('sums the household\u2019s range over the month', () => {
    const fat = monthlyNeedDetails([{ sex: 'male', ageYears: 30, kcalPerDay: 2000 }], '2026-04', ['fat_g']).fat_g;
    // 20–35 % of 2000 kcal ÷ 9 kcal/g × 30 days (IOM 2005 AMDR); April has 30 days
    expect(fat.need).toBeCloseTo((400 / 9) * 30, 9);
    expect(fat.needLow).toBeCloseTo((400 / 9) * 30, 9);
    expect(fat.needHigh).toBeCloseTo((700 / 9) * 30, 9);
    expect(monthlyNeedDetails([{ sex: 'male', ageYears: 30 }], '2026-04', ['protein_g']).protein_g.needHigh).toBeNull();
  });
});
