import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { nutrientPerM2, parseCropTable, type CropFood, type CropTableRow } from '@/lib/crop-table';
import { eatingMonths, harvestMonths } from '@/lib/crop-months';
import { findGaps, lowestMonths, type GapCrop, type GapMonthInput } from '@/lib/gaps';
import { listMonths } from '@/lib/months';

const rows = parseCropTable(readFileSync(fileURLToPath(new URL('../../reference-data/crops.csv', import.meta.url)), 'utf8'));
const row = (key: string): CropTableRow => rows.find((r) => r.key === key)!;

// USDA SR28, NDB 11352 "Potatoes, flesh and skin, raw": 25 % refuse, 77 kcal, 19.7 mg vitamin C per 100 g
const potatoFood: CropFood = { refusePct: 25, per100g: { energy_kcal: 77, vitamin_c_mg: 19.7 } };
// USDA SR28, NDB 11233 "Kale, raw": 28 % refuse, 49 kcal, 120 mg vitamin C per 100 g
const kaleFood: CropFood = { refusePct: 28, per100g: { energy_kcal: 49, vitamin_c_mg: 120 } };
// USDA SR28, NDB 11643 "Squash, winter, all varieties, raw": 29 % refuse, 34 kcal, 12.3 mg vitamin C per 100 g
const squashFood: CropFood = { refusePct: 29, per100g: { energy_kcal: 34, vitamin_c_mg: 12.3 } };

const frosts = { lastSpringFrost: '04-20', firstAutumnFrost: '10-15' };

function gapCrop(key: string, food: CropFood): GapCrop {
  const r = row(key);
  const harvest = harvestMonths(r, frosts);
  const stored = eatingMonths(r, frosts).slice(harvest.length);
  return { key, name: r.name, perM2: nutrientPerM2(r, food), yieldSource: 'reference', yieldKgM2: r.yieldKg.typical, harvestMonths: harvest, storedMonths: stored };
}

const crops = [gapCrop('potatoes', potatoFood), gapCrop('kale', kaleFood), gapCrop('winter-squash', squashFood)];

// A year of home supply (invented for the test): the late-winter months are leanest.
const needKcal = 60_000; // per month, invented
const needC = 2_700; // per month, invented (90 mg × 30 days)
const homeKcal = [9_000, 3_000, 1_800, 2_400, 6_000, 30_000, 45_000, 48_000, 50_000, 40_000, 20_000, 12_000];
const homeC = [300, 100, 60, 50, 400, 2_000, 2_700, 2_700, 2_500, 1_800, 900, 500];
const months: GapMonthInput<'energy_kcal' | 'vitamin_c_mg'>[] = listMonths('2026-01', '2026-12').map((month, i) => ({
  month,
  values: {
    energy_kcal: { home: homeKcal[i]!, need: needKcal, shareOfNeed: homeKcal[i]! / needKcal },
    vitamin_c_mg: { home: homeC[i]!, need: needC, shareOfNeed: homeC[i]! / needC },
  },
}));
const nutrients = [
  { key: 'energy_kcal' as const, name: 'Energy', unit: 'kcal' },
  { key: 'vitamin_c_mg' as const, name: 'Vitamin C', unit: 'mg' },
];

describe('the months a crop feeds the household (src/lib/crop-months.ts, as the gap finder reads them)', () => {
  it('splits the harvest window from the months in store, wrapping over the year end', () => {
    // crops.csv winter-squash: harvest autumn −4 (17 Sep) to autumn 0 (15 Oct) weeks, keeps 5 months
    const squash = crops.find((c) => c.key === 'winter-squash')!;
    expect([squash.harvestMonths, squash.storedMonths]).toEqual([[9, 10], [11, 12, 1, 2, 3]]);
    // crops.csv kale: picked from spring +8 (15 June) to autumn +20 weeks (4 March), keeps 0.3 months (none whole)
    const kale = crops.find((c) => c.key === 'kale')!;
    expect([kale.harvestMonths, kale.storedMonths]).toEqual([[6, 7, 8, 9, 10, 11, 12, 1, 2, 3], []]);
  });
});

describe('findGaps', () => {
  const report = findGaps({ nutrients, months, crops });
  const energy = report.nutrients.find((n) => n.key === 'energy_kcal')!;
  const vitC = report.nutrients.find((n) => n.key === 'vitamin_c_mg')!;

  it('sums the year: need, home supply, shortfall and share', () => {
    expect(energy.need).toBe(720_000); // 12 × 60,000
    expect(energy.home).toBe(267_200); // sum of homeKcal
    expect(energy.shortfall).toBe(452_800);
    expect(energy.shareOfNeed).toBeCloseTo(267_200 / 720_000, 10);
  });

  it('names the months with the lowest home share of need, lowest first', () => {
    expect(energy.leanMonths).toEqual(['2026-03', '2026-04', '2026-02']); // 3 %, 4 %, 5 %
    expect(vitC.leanMonths).toEqual(['2026-04', '2026-03', '2026-02']); // 50, 60, 100 mg
  });

  it('ranks the crops that close the shortfall on the least area, worked by hand', () => {
    // potatoes: 3 kg/m² (crops.csv typical) × 0.75 edible × 77 kcal × 10 = 1,732.5 kcal/m²
    // kale: 2.5 kg/m² × 0.72 × 49 × 10 = 882 kcal/m²; winter squash: 3 kg/m² × 0.71 × 34 × 10 = 724.2 kcal/m²
    expect(energy.leastAreaCrops.map((c) => c.cropKey)).toEqual(['potatoes', 'kale', 'winter-squash']);
    expect(energy.leastAreaCrops[0]!.perM2).toBeCloseTo(1_732.5, 6);
    expect(energy.leastAreaCrops[0]!.areaToCloseM2).toBeCloseTo(452_800 / 1_732.5, 6); // ≈ 261.4 m²
    // kale: 2.5 × 0.72 × 120 mg × 10 = 2,160 mg vitamin C per m² — far ahead of potatoes' 2.25 × 197 = 443.25
    expect(vitC.leastAreaCrops[0]!.cropKey).toBe('kale');
    expect(vitC.leastAreaCrops[0]!.perM2).toBeCloseTo(2_160, 6);
    expect(vitC.leastAreaCrops[0]!.m2PerUnit).toBeCloseTo(1 / 2_160, 12);
  });

  it('finds the storage and overwintering crops that carry food into the lean months', () => {
    // Lean months for vitamin C: April, March, February.
    // Potatoes (harvest June–October, keep 6 months: November–April) cover all three from store;
    // kale stands in the ground until 4 March: February and March fresh;
    // winter squash keeps to March: February and March from store.
    expect(vitC.carryCrops).toEqual([
      { cropKey: 'potatoes', name: row('potatoes').name, perM2: expect.closeTo(443.25, 6), covers: ['2026-02', '2026-03', '2026-04'], how: 'stored' },
      { cropKey: 'kale', name: 'Kale', perM2: expect.closeTo(2_160, 6), covers: ['2026-02', '2026-03'], how: 'fresh' },
      { cropKey: 'winter-squash', name: row('winter-squash').name, perM2: expect.closeTo(261.99, 6), covers: ['2026-02', '2026-03'], how: 'stored' },
    ]);
  });

  it('never suggests a crop with no value for the nutrient', () => {
    const noC = { ...gapCrop('kale', { refusePct: 28, per100g: { energy_kcal: 49 } }), key: 'kale-unknown-c' };
    const r = findGaps({ nutrients, months, crops: [noC] });
    expect(r.nutrients[1]!.leastAreaCrops).toEqual([]);
    expect(r.nutrients[1]!.carryCrops).toEqual([]);
    expect(r.nutrients[0]!.leastAreaCrops.map((c) => c.cropKey)).toEqual(['kale-unknown-c']);
  });

  it('leaves months before the records and months still to come out of the year', () => {
    const marked = months.map((m, i) => ({ ...m, beforeRecords: i === 0, future: i >= 10 }));
    const r = findGaps({ nutrients, months: marked, crops });
    expect(r.countedMonths).toEqual(listMonths('2026-02', '2026-10'));
    expect(r.nutrients[0]!.need).toBe(9 * 60_000);
    expect(r.nutrients[0]!.leanMonths).not.toContain('2026-01');
  });

  it('gives no shortfall when a month’s need is unknown, and no lean month without a share', () => {
    const withUnknown = months.map((m, i) => (i === 2 ? { ...m, values: { ...m.values, energy_kcal: { home: 1_800, need: null, shareOfNeed: null } } } : m));
    const r = findGaps({ nutrients, months: withUnknown, crops });
    expect(r.nutrients[0]!.need).toBeNull();
    expect(r.nutrients[0]!.shortfall).toBeNull();
    expect(r.nutrients[0]!.leanMonths).not.toContain('2026-03');
  });

  it('orders ties by the earlier month', () => {
    expect(lowestMonths([
      { month: '2026-02', shareOfNeed: 0.1, counted: true },
      { month: '2026-01', shareOfNeed: 0.1, counted: false },
      { month: '2026-03', shareOfNeed: 0.1, counted: true },
    ], 2)).toEqual(['2026-02', '2026-03']);
  });
});

describe('projectYearShares', () => {
  it('adds each planned area’s nutrient to the year’s home supply', async () => {
    const { projectYearShares } = await import('@/lib/plan-projection');
    // 10 m² of potatoes at 1,732.5 kcal/m² (crops.csv typical yield × SR28 NDB 11352, worked above) on 267,200 kcal home of 720,000 need
    const p = projectYearShares(
      { energy_kcal: { home: 267_200, need: 720_000 }, vitamin_c_mg: { home: null, need: 32_400 } },
      [{ areaM2: 10, perM2: crops[0]!.perM2 }, { areaM2: 0, perM2: crops[1]!.perM2 }],
    );
    expect(p.energy_kcal).toBeCloseTo((267_200 + 17_325) / 720_000, 10);
    expect(p.vitamin_c_mg).toBeNull();
  });
});
