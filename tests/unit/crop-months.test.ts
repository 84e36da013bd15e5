import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { parseCropTable } from '@/lib/crop-table';
import { dayOfYear, eatingMonths, frostDays, harvestMonths, monthOfDay, monthShares } from '@/lib/crop-months';

const rows = parseCropTable(readFileSync(fileURLToPath(new URL('../../reference-data/crops.csv', import.meta.url)), 'utf8'));
const crop = (key: string) => rows.find((r) => r.key === key)!;
const north = { lastSpringFrost: '04-15', firstAutumnFrost: '10-15' };

describe('frost dates', () => {
  it('counts days of a non-leap year from 1 January', () => {
    expect(dayOfYear('01-01')).toBe(0);
    expect(dayOfYear('03-01')).toBe(59);
    expect(dayOfYear('12-31')).toBe(364);
    expect(dayOfYear('02-29')).toBe(58); // read as 28 February
    expect(monthOfDay(370)).toBe(1);
    expect(monthOfDay(-1)).toBe(12);
  });

  it('refuses a date that is not a day of the year, saying how to write it', () => {
    expect(() => dayOfYear('13-01')).toThrow(/MM-DD, e\.g\. 04-20/);
    expect(() => dayOfYear('04-31')).toThrow(/not a day of the year/);
  });

  it('puts the autumn frost after the spring one, in the next year in the south', () => {
    expect(frostDays(north)).toEqual({ spring: 104, autumn: 287 });
    expect(frostDays({ lastSpringFrost: '10-01', firstAutumnFrost: '04-15' })).toEqual({ spring: 273, autumn: 469 });
  });
});

describe('eating months', () => {
  it('places a harvest window by the frost dates', () => {
    // potatoes: spring +8 weeks (10 June) to the autumn frost (15 October)
    expect(harvestMonths(crop('potatoes'), north)).toEqual([6, 7, 8, 9, 10]);
    // kale picked from spring +8 weeks to autumn +20 weeks (3 March next year)
    expect(harvestMonths(crop('kale'), north)).toEqual([6, 7, 8, 9, 10, 11, 12, 1, 2, 3]);
  });

  it('carries food that keeps on for its whole months of storage', () => {
    // potatoes keep 6 months: June–October, then November to April
    expect(eatingMonths(crop('potatoes'), north)).toEqual([6, 7, 8, 9, 10, 11, 12, 1, 2, 3, 4]);
    // lettuce keeps days, not months: only its harvest window
    expect(eatingMonths(crop('lettuce-leaf'), north)).toEqual(harvestMonths(crop('lettuce-leaf'), north));
  });

  it('moves the same crop by six months in the southern hemisphere', () => {
    const south = { lastSpringFrost: '10-15', firstAutumnFrost: '04-15' };
    expect(harvestMonths(crop('potatoes'), south)).toEqual([12, 1, 2, 3, 4]);
  });

  it('never counts more than twelve months', () => {
    const row = { harvestFrom: { frost: 'spring' as const, weeks: -10 }, harvestTo: { frost: 'autumn' as const, weeks: 20 }, storageMonths: 12 };
    expect(eatingMonths(row, north)).toHaveLength(12);
  });

  it('spreads the food evenly, the shares adding up to one', () => {
    const shares = monthShares(crop('potatoes'), north);
    expect(shares.reduce((a, b) => a + b, 0)).toBeCloseTo(1, 12);
    expect(shares[0]).toBeCloseTo(1 / 11, 12); // January
    expect(shares[4]).toBe(0); // May: last year's potatoes are gone, this year's not dug
  });
});
