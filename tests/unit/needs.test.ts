import { describe, expect, it } from 'vitest';
import { ageInMonth, homeDays, monthlyNeedDetails, monthlyNeeds, needMemo, personMonthNeeds } from '@/lib/needs';

describe('monthly need', () => {
  it('is the daily need times the days of the month', () => {
    // RDA protein, women 19–30 y: 46 g/day (National Academies DRI); February 2026 has 28 days
    expect(personMonthNeeds({ sex: 'female', ageYears: 25 }, '2026-02', ['protein_g']).protein_g).toBe(46 * 28);
    // February 2028 has 29 days (Gregorian leap year)
    expect(personMonthNeeds({ sex: 'female', ageYears: 25 }, '2028-02', ['protein_g']).protein_g).toBe(46 * 29);
  });

  it('scales by the share of meals eaten at home', () => {
    // RDA protein, men 19–30 y: 56 g/day (National Academies DRI)
    expect(personMonthNeeds({ sex: 'male', ageYears: 25, atHomePct: 50 }, '2026-01', ['protein_g']).protein_g).toBe(56 * 31 * 0.5);
  });

  it('counts only the days a person is present', () => {
    const p = { sex: 'male', ageYears: 40, presentFrom: '2026-03-17', presentTo: '2026-04-10' } as const;
    expect(homeDays(p, '2026-03')).toBe(15);
    expect(homeDays(p, '2026-04')).toBe(10);
    expect(homeDays(p, '2026-05')).toBe(0);
  });

  it('sums people and moves a person into the next group with the calendar year', () => {
    // RDA iron: girls 14–18 y 15 mg/day, women 19–30 y 18 mg/day (National Academies DRI, Elements table)
    const teen = { sex: 'female', birthYear: 2008 } as const;
    expect(ageInMonth(teen, '2026-12')).toBe(18);
    expect(ageInMonth(teen, '2027-01')).toBe(19);
    expect(monthlyNeeds([teen], '2026-12', ['iron_mg']).iron_mg).toBe(15 * 31);
    expect(monthlyNeeds([teen], '2027-01', ['iron_mg']).iron_mg).toBe(18 * 31);
    // + RDA iron, men 19–30 y: 8 mg/day
    expect(monthlyNeeds([teen, { sex: 'male', ageYears: 25 }], '2027-01', ['iron_mg']).iron_mg).toBe((18 + 8) * 31);
  });

  it('is unknown only when nobody at home has a published need, and 0 with nobody at home', () => {
    // total fibre: infants "ND"; AI men 19–30 y 38 g/day (DRI Macronutrients table): the baby adds nothing (issue 9)
    const household = [{ sex: 'female', ageYears: 0.7 }, { sex: 'male', ageYears: 30 }] as const;
    expect(monthlyNeeds(household, '2026-01', ['fiber_g']).fiber_g).toBe(38 * 31);
    expect(monthlyNeeds([{ sex: 'female', ageYears: 0.7 }], '2026-01', ['fiber_g']).fiber_g).toBeNull();
    expect(monthlyNeeds([{ sex: 'male', ageYears: 30 }], '2026-01', ['sugars_g']).sugars_g).toBeNull(); // sugars: no RDA or AI
    const away = [{ sex: 'male', ageYears: 30, presentTo: '2025-12-31' }] as const;
    expect(monthlyNeeds(away, '2026-01', ['fat_g', 'protein_g'])).toEqual({ fat_g: 0, protein_g: 0 });
    expect(monthlyNeeds([], '2026-01', ['protein_g'])).toEqual({ protein_g: 0 });
  });

  it('counts nobody before the year of birth', () => {
    expect(homeDays({ sex: 'female', birthYear: 2027 }, '2026-06')).toBe(0);
  });

  it('refuses a person without an age and an out-of-range home share', () => {
    expect(() => homeDays({ sex: 'female' }, '2026-01')).toThrow(/ageYears or birthYear/);
    expect(() => homeDays({ sex: 'female', ageYears: 30, atHomePct: 120 }, '2026-01')).toThrow(/atHomePct/);
  });
});

describe('the need memo of a report', () => {
  it('gives every month the same need as working each month out alone', () => {
    // A boy turning 9 in May 2026 changes DRI group (4–8 → 9–13 y), a pregnancy runs its trimesters:
    // the memo must keep each life stage apart.
    const people = [
      { sex: 'male', birthMonth: '2017-05', activity: 'active' },
      { sex: 'female', ageYears: 31, pregnancyDueMonth: '2026-08', weightKg: 60 },
      { sex: 'male', ageYears: 70, kcalPerDay: 2100, atHomePct: 80 },
    ] as const;
    const keys = ['energy_kcal', 'protein_g', 'iron_mg', 'fat_g', 'vitamin_c_mg'] as const;
    const memo = needMemo();
    for (const month of ['2025-09', '2025-12', '2026-01', '2026-04', '2026-05', '2026-06', '2026-08', '2026-09']) {
      expect(monthlyNeedDetails(people, month, keys, memo)).toEqual(monthlyNeedDetails(people, month, keys));
    }
  });
});
