import { describe, expect, it } from 'vitest';
import { personEnergy } from '@/lib/person-energy';

describe('personEnergy', () => {
  it('uses a stated kcal/day and scales the at-home part by the share of meals at home', () => {
    const e = personEnergy({ sex: 'female', ageYears: 30, kcalPerDay: 2100, atHomePct: 50 }, '2026-05')!;
    expect(e.basis).toBe('stated');
    expect(e.kcalPerDay).toBe(2100);
    expect(e.atHomeKcalPerDay).toBe(1050);
  });

  it('estimates by the IOM 2005 EER equation from age, sex, height, weight and activity', () => {
    // IOM 2005 DRI for Energy, EER for men ≥19 y: 662 − 9.53 × age + PA × (15.91 × kg + 539.6 × m), PA (active) = 1.25
    // hand-worked: 662 − 9.53 × 30 + 1.25 × (15.91 × 70 + 539.6 × 1.77) = 662 − 285.9 + 1.25 × (1113.7 + 955.092) = 2962.09
    const e = personEnergy({ sex: 'male', ageYears: 30, heightCm: 177, weightKg: 70, activity: 'active' }, '2026-05')!;
    expect(e.basis).toBe('EER');
    expect(e.kcalPerDay).toBeCloseTo(2962.09, 2);
    expect(e.notes).toEqual([]);
  });

  it('says which reference measures it assumed when height and weight are missing', () => {
    const e = personEnergy({ sex: 'female', ageYears: 40 }, '2026-05')!;
    expect(e.notes.join(' ')).toMatch(/reference height 163 cm/);
    expect(e.notes.join(' ')).toMatch(/reference weight 57 kg/);
  });

  it('takes the age from the birth year in the month’s year', () => {
    expect(personEnergy({ sex: 'female', birthYear: 1990 }, '2026-03')!.ageYears).toBe(36);
  });

  it('has no need before the person is born', () => {
    expect(personEnergy({ sex: 'female', birthYear: 2027 }, '2026-03')).toBeNull();
  });
});
