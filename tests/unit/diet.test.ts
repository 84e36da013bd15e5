import { describe, expect, it } from 'vitest';
import { dietFactor, VEGETARIAN_CAUTIONS } from '@/lib/diet';
import { dailyNeed } from '@/lib/requirements';

describe('a vegetarian diet', () => {
  it('raises the iron need 1.8 times', () => {
    // RDA iron, women 19–30 y: 18 mg/day (DRI Elements table) × 1.8 for vegetarians (IOM 2001, iron chapter)
    expect(dailyNeed({ sex: 'female', ageYears: 25, diet: 'vegetarian' }, 'iron_mg')?.value).toBeCloseTo(32.4, 9);
    // RDA iron, men 19–30 y: 8 mg/day × 1.8 (IOM 2001)
    expect(dailyNeed({ sex: 'male', ageYears: 25, diet: 'vegetarian' }, 'iron_mg')?.value).toBeCloseTo(14.4, 9);
    expect(dailyNeed({ sex: 'male', ageYears: 25, diet: 'omnivore' }, 'iron_mg')?.value).toBe(8);
  });

  it('leaves other nutrients and the breast-milk AI of young infants alone', () => {
    expect(dailyNeed({ sex: 'female', ageYears: 25, diet: 'vegetarian' }, 'zinc_mg')?.value).toBe(8); // RDA zinc, women 19+ y: 8 mg/day (DRI Elements table)
    expect(dailyNeed({ sex: 'male', ageYears: 0.3, diet: 'vegetarian' }, 'iron_mg')?.value).toBe(0.27); // AI iron, infants 0–6 mo: 0.27 mg/day (DRI Elements table)
    expect(dietFactor('iron_mg', 'vegetarian', 'AI')).toBe(1);
  });

  it('says zinc needs may be up to 50 % higher', () => {
    expect(VEGETARIAN_CAUTIONS.join(' ')).toMatch(/zinc.*50 %/i); // IOM 2001, zinc chapter
  });

  it('refuses a diet it does not know', () => {
    expect(() => dietFactor('iron_mg', 'carnivore' as 'vegetarian', 'RDA')).toThrow(/diet must be one of/);
  });
});
