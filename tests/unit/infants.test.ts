import { describe, expect, it } from 'vitest';
import { monthlyNeedDetails, monthlyNeeds, personMonthNeeds } from '@/lib/needs';
import { personEnergy } from '@/lib/person-energy';

const mother = { sex: 'female', ageYears: 25 } as const;

describe('infants and values not determined', () => {
  it('adds no need for a baby under 6 months on breast milk', () => {
    const baby = { sex: 'male', birthMonth: '2026-09' } as const;
    // RDA protein, women 19–30 y: 46 g/day (DRI Macronutrients table); November 30 days
    expect(monthlyNeeds([mother, baby], '2026-11', ['protein_g']).protein_g).toBe(46 * 30);
    expect(personMonthNeeds(baby, '2026-11', ['protein_g', 'energy_kcal'])).toEqual({ protein_g: 0, energy_kcal: 0 });
    expect(personEnergy(baby, '2026-11')!.atHomeKcalPerDay).toBe(0);
  });

  it('counts a baby under 6 months fed from the household', () => {
    const baby = { sex: 'male', birthMonth: '2026-09', fedFromHousehold: true } as const;
    // + AI protein, infants 0–6 mo: 9.1 g/day (DRI Macronutrients table)
    expect(monthlyNeeds([mother, baby], '2026-11', ['protein_g']).protein_g).toBeCloseTo((46 + 9.1) * 30, 9);
  });

  it('counts a baby from 6 months, in the 7–12 month group', () => {
    const baby = { sex: 'male', birthMonth: '2026-09' } as const;
    // + RDA protein, infants 7–12 mo: 11 g/day (DRI Macronutrients table); March 31 days
    expect(monthlyNeeds([mother, baby], '2027-03', ['protein_g']).protein_g).toBe((46 + 11) * 31);
  });

  it('lets a person with no published value add nothing instead of making the need unknown', () => {
    const baby = { sex: 'female', birthMonth: '2026-03' } as const; // 8 months in November
    // total fibre: infants "ND"; AI women 19–30 y 25 g/day (DRI Macronutrients table)
    const fibre = monthlyNeedDetails([mother, baby], '2026-11', ['fiber_g']).fiber_g;
    expect(fibre.need).toBe(25 * 30);
    expect(fibre.peopleWithoutValue).toBe(1);
    expect(monthlyNeeds([baby], '2026-11', ['fiber_g']).fiber_g).toBeNull();
  });
});
