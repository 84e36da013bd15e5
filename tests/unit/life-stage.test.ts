import { describe, expect, it } from 'vitest';
import { ageInMonths, lactationPeriodIn, lifeStageIn, trimesterIn } from '@/lib/life-stage';
import { homeDays, monthlyNeeds } from '@/lib/needs';
import { personEnergy } from '@/lib/person-energy';

const body = { sex: 'female', ageYears: 25, heightCm: 165, weightKg: 60, activity: 'low' } as const;

describe('dated people', () => {
  it('moves a person into the next DRI group in the month of the birthday, not on 1 January', () => {
    const teen = { sex: 'female', birthMonth: '2008-05' } as const;
    expect(ageInMonths('2008-05', '2027-04')).toBe(227);
    // RDA iron: girls 14–18 y 15 mg/day, women 19–30 y 18 mg/day (National Academies DRI, Elements table); April 30 days, May 31
    expect(monthlyNeeds([teen], '2027-04', ['iron_mg']).iron_mg).toBe(15 * 30);
    expect(monthlyNeeds([teen], '2027-05', ['iron_mg']).iron_mg).toBe(18 * 31);
  });

  it('counts no need before birth', () => {
    const baby = { sex: 'male', birthMonth: '2027-03', fedFromHousehold: true } as const;
    expect(homeDays(baby, '2027-02')).toBe(0);
    expect(lifeStageIn(baby, '2027-02')).toBeNull();
    expect(monthlyNeeds([baby], '2027-02', ['protein_g']).protein_g).toBe(0);
  });

  it('keeps ageYears and birthYear working as before', () => {
    expect(lifeStageIn({ ageYears: 40 }, '2026-01')?.ageYears).toBe(40);
    expect(lifeStageIn({ birthYear: 1990, ageYears: 12 }, '2026-06')?.ageYears).toBe(36);
    expect(lifeStageIn({ birthMonth: '2026-01', birthYear: 1990 }, '2026-07')?.ageYears).toBe(0.5);
  });

  it('follows the trimester from the due month, and counts no pregnancy outside it', () => {
    // three calendar months to each trimester of a nine-month pregnancy: common practice (no published source)
    expect(trimesterIn('2027-06', '2026-09')).toBeNull();
    expect(trimesterIn('2027-06', '2026-10')).toBe(1);
    expect(trimesterIn('2027-06', '2027-01')).toBe(2);
    expect(trimesterIn('2027-06', '2027-04')).toBe(3);
    expect(trimesterIn('2027-06', '2027-06')).toBe(3);
    expect(trimesterIn('2027-06', '2027-07')).toBeNull();
  });

  it('adds the pregnancy energy of the month\u2019s trimester to the EER', () => {
    const mother = { ...body, pregnancyDueMonth: '2027-06' };
    const base = (month: string) => personEnergy(body, month)!.kcalPerDay;
    // pregnancy energy deposition: +0 first, +340 second, +452 third trimester (IOM 2005; IOM 2009 Table B-1A)
    expect(personEnergy(mother, '2026-11')!.kcalPerDay - base('2026-11')).toBeCloseTo(0, 9);
    expect(personEnergy(mother, '2027-02')!.kcalPerDay - base('2027-02')).toBeCloseTo(340, 9);
    expect(personEnergy(mother, '2027-05')!.kcalPerDay - base('2027-05')).toBeCloseTo(452, 9);
    expect(personEnergy(mother, '2027-08')!.kcalPerDay - base('2027-08')).toBeCloseTo(0, 9);
  });

  it('uses the pregnancy RDA only in the months of the pregnancy', () => {
    const mother = { ...body, pregnancyDueMonth: '2027-06' };
    // RDA vitamin C: women 19–30 y 75 mg/day, pregnancy 19–30 y 85 mg/day (DRI Vitamins table); January 31 days, August 31
    expect(monthlyNeeds([mother], '2027-01', ['vitamin_c_mg']).vitamin_c_mg).toBe(85 * 31);
    expect(monthlyNeeds([mother], '2027-08', ['vitamin_c_mg']).vitamin_c_mg).toBe(75 * 31);
  });

  it('dates lactation into its first and second six months, for the first year when no end is given', () => {
    expect(lactationPeriodIn('2027-06', null, '2027-06')).toBe('first6');
    expect(lactationPeriodIn('2027-06', null, '2027-11')).toBe('first6');
    expect(lactationPeriodIn('2027-06', null, '2027-12')).toBe('second6');
    expect(lactationPeriodIn('2027-06', null, '2028-06')).toBeNull();
    expect(lactationPeriodIn('2027-06', '2027-08', '2027-09')).toBeNull();
    expect(() => lactationPeriodIn('2027-06', '2027-05', '2027-06')).toThrow(/must not be before/);
  });

  it('adds the lactation energy of the month\u2019s period and the lactation RDA', () => {
    const mother = { ...body, pregnancyDueMonth: '2027-06', lactationFrom: '2027-06', lactationTo: '2028-03' };
    // lactation: +330 kcal months 0–6, +400 kcal months 7–12 (IOM 2005 EER, 500 − 170 and 400 − 0)
    expect(personEnergy(mother, '2027-06')!.kcalPerDay - personEnergy(body, '2027-06')!.kcalPerDay).toBeCloseTo(330, 9);
    expect(personEnergy(mother, '2028-01')!.kcalPerDay - personEnergy(body, '2028-01')!.kcalPerDay).toBeCloseTo(400, 9);
    expect(lifeStageIn(mother, '2028-04')?.condition).toBeNull();
    // RDA vitamin C, lactation 19–30 y: 120 mg/day (DRI Vitamins table); June 30 days
    expect(monthlyNeeds([mother], '2027-06', ['vitamin_c_mg']).vitamin_c_mg).toBe(120 * 30);
  });

  it('refuses a due month or birth month that is not a month', () => {
    expect(() => trimesterIn('2027-13', '2027-01')).toThrow(/YYYY-MM/);
    expect(() => ageInMonths('May 2008', '2027-01')).toThrow(/birth month/);
  });
});
