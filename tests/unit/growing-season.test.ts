import { describe, expect, it } from 'vitest';
import { addDays, DEFAULT_FROST_DATES, defaultFrostDates, frostDatesOfSeason, harvestWindow, hemisphereOf, isMonthDay, seasonFrostDates } from '@/lib/growing-season';
import { cropByKey } from '@/server/crop-table-file';

describe('frost dates by hemisphere', () => {
  it('takes the northern default for a European or North American zone', () => {
    expect(hemisphereOf('Europe/Oslo')).toBe('northern');
    expect(hemisphereOf('America/Chicago')).toBe('northern');
    // common practice (no published source): last spring frost about 1 May, first autumn frost about 1 October
    expect(defaultFrostDates('Europe/Berlin')).toEqual({ lastSpringFrost: '05-01', firstAutumnFrost: '10-01' });
  });

  it('shifts the default by six months south of the equator', () => {
    expect(hemisphereOf('Australia/Hobart')).toBe('southern');
    expect(hemisphereOf('Pacific/Auckland')).toBe('southern');
    expect(hemisphereOf('America/Argentina/Mendoza')).toBe('southern');
    expect(hemisphereOf('Africa/Johannesburg')).toBe('southern');
    // common practice (no published source): the northern dates shifted by six months
    expect(defaultFrostDates('America/Santiago')).toEqual({ lastSpringFrost: '11-01', firstAutumnFrost: '04-01' });
  });

  it('uses the household’s own date where set and the default where not, saying which', () => {
    const s = seasonFrostDates({ lastSpringFrost: '04-20', firstAutumnFrost: null }, 'Europe/Paris');
    expect(s.lastSpringFrost).toBe('04-20');
    expect(s.firstAutumnFrost).toBe('10-01');
    expect(s.own).toEqual({ lastSpringFrost: true, firstAutumnFrost: false });
    expect(s.defaults).toEqual(DEFAULT_FROST_DATES.northern);
  });

  it('accepts MM-DD that every year has and refuses the rest', () => {
    expect(isMonthDay('05-01')).toBe(true);
    expect(isMonthDay('12-31')).toBe(true);
    expect(isMonthDay('02-29')).toBe(false);
    expect(isMonthDay('13-01')).toBe(false);
    expect(isMonthDay('5-1')).toBe(false);
  });

  it('puts a southern autumn frost in the next calendar year', () => {
    expect(frostDatesOfSeason(2027, DEFAULT_FROST_DATES.southern)).toEqual({ spring: '2027-11-01', autumn: '2028-04-01' });
    expect(frostDatesOfSeason(2027, DEFAULT_FROST_DATES.northern)).toEqual({ spring: '2027-05-01', autumn: '2027-10-01' });
  });
});

describe('harvest windows from the frost dates', () => {
  it('adds days across a year end', () => {
    expect(addDays('2026-12-30', 3)).toBe('2027-01-02');
    expect(addDays('2026-03-01', -1)).toBe('2026-02-28');
  });

  it('counts a row’s weeks from each frost date', () => {
    // reference-data/crops.csv, potatoes: harvest from 8 weeks after the last spring frost to the first autumn frost
    const potatoes = cropByKey('potatoes')!;
    expect(potatoes.harvestFrom).toEqual({ frost: 'spring', weeks: 8 });
    const w = harvestWindow(potatoes, 2026, DEFAULT_FROST_DATES.northern);
    // 1 May + 56 days = 26 June; the autumn frost itself is 1 October
    expect(w).toEqual({ from: '2026-06-26', to: '2026-10-01', months: ['2026-06', '2026-07', '2026-08', '2026-09', '2026-10'] });
  });

  it('moves the same row six months in the southern hemisphere', () => {
    const garlic = { harvestFrom: { frost: 'spring' as const, weeks: 10 }, harvestTo: { frost: 'spring' as const, weeks: 14 } };
    // 1 November 2027 + 70 days = 10 January 2028; + 98 days = 7 February 2028
    expect(harvestWindow(garlic, 2027, DEFAULT_FROST_DATES.southern)).toEqual({ from: '2028-01-10', to: '2028-02-07', months: ['2028-01', '2028-02'] });
  });

  it('carries a window counted into winter past the year end', () => {
    const kaleLike = { harvestFrom: { frost: 'spring' as const, weeks: 8 }, harvestTo: { frost: 'autumn' as const, weeks: 20 } };
    const w = harvestWindow(kaleLike, 2026, { lastSpringFrost: '05-01', firstAutumnFrost: '10-01' });
    // 1 October 2026 + 140 days = 18 February 2027
    expect(w.to).toBe('2027-02-18');
    expect(w.months).toHaveLength(9);
    expect(w.months.at(-1)).toBe('2027-02');
  });

  it('follows the household’s own frost dates', () => {
    const potatoes = { harvestFrom: { frost: 'spring' as const, weeks: 8 }, harvestTo: { frost: 'autumn' as const, weeks: 0 } };
    expect(harvestWindow(potatoes, 2026, { lastSpringFrost: '04-15', firstAutumnFrost: '10-20' })).toMatchObject({ from: '2026-06-10', to: '2026-10-20' });
  });
});
