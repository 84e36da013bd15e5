/**
 * The planting planner: the LP built from candidates and needs (src/lib/plan-model.ts), solved by
 * HiGHS in node (src/server/planner.ts) and read back (src/lib/plan-result.ts). The small cases use
 * invented crops whose optimum is worked by hand beside each test; one case uses the real kale row
 * and its SR28 composition.
 */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { nutrientPerM2, parseCropTable, type CropFood, type CropTableRow } from '@/lib/crop-table';
import { buildPlanModel, capGroupOf, planLp, preparePlan, type PlanCandidate, type PlanInput } from '@/lib/plan-model';
import { projectShares, roundArea } from '@/lib/plan-result';
import { loadHighs, planPlanting } from '@/server/planner';

const table = parseCropTable(readFileSync(fileURLToPath(new URL('../../reference-data/crops.csv', import.meta.url)), 'utf8'));
const crop = (key: string) => table.find((r) => r.key === key)!;
const north = { lastSpringFrost: '04-15', firstAutumnFrost: '10-15' };
const months12 = (x: number) => new Array<number>(12).fill(x);

/**
 * An invented crop on the wheat row's frame: 1 kg/m², all of it eaten, so nutrient per m² is 10 ×
 * its amount per 100 g. No daily cap applies to a grain unless the test says otherwise.
 */
function invented(key: string, per100g: CropFood['per100g'], over: Partial<CropTableRow> = {}): PlanCandidate {
  const row: CropTableRow = {
    ...crop('wheat'),
    key,
    name: `Crop ${key}`,
    group: 'grain',
    category: 'grain',
    edibleFraction: 1,
    yieldKg: { low: 1, typical: 1, high: 1 },
    seedPerM2: 10,
    seedUnit: 'g',
    ...over,
  };
  return { row, food: { refusePct: 0, per100g } };
}

// A: 1000 kcal/m², no vitamin C. B: 500 kcal and 1000 mg vitamin C per m².
const A = invented('a', { energy_kcal: 100, vitamin_c_mg: 0 });
const B = invented('b', { energy_kcal: 50, vitamin_c_mg: 100 });

function input(over: Partial<PlanInput> = {}): PlanInput {
  return {
    year: 2027,
    targets: { energy_kcal: 1, vitamin_c_mg: 1 },
    // 12 000 kcal and 3 600 mg vitamin C a year, evenly by month; nothing from the garden yet.
    need: { energy_kcal: months12(1000), vitamin_c_mg: months12(300) },
    homeSupply: { energy_kcal: months12(0), vitamin_c_mg: months12(0) },
    people: 1,
    frost: north,
    candidates: [A, B],
    maxShareOfEnergyPerCrop: 1,
    ...over,
  };
}

const area = (answer: Awaited<ReturnType<typeof planPlanting>>, key: string) => answer.crops.find((c) => c.cropKey === key)?.areaM2 ?? 0;

describe('nutrient per m² in the model', () => {
  it('works out kale from its yield row and SR28 composition', () => {
    // USDA SR28, NDB 11233 "Kale, raw": 49 kcal, 120 mg vitamin C and 28 % refuse per 100 g
    const kaleFood: CropFood = { refusePct: 28, per100g: { energy_kcal: 49, vitamin_c_mg: 120 } };
    const model = preparePlan(input({ candidates: [{ row: crop('kale'), food: kaleFood }] }));
    const kale = model.crops[0]!;
    // 2.5 kg/m² typical (crops.csv) × 0.72 edible × 49 kcal × 10 = 882 kcal per m²
    expect(kale.perM2.energy_kcal).toBeCloseTo(882, 9);
    // 2.5 × 0.72 × 120 mg × 10 = 2160 mg vitamin C per m²
    expect(kale.perM2.vitamin_c_mg).toBeCloseTo(2160, 9);
    expect(kale.capGroup).toBe('vegetables');

    // The household's own measured 3 kg/m² replaces the table's: 3 × 0.72 × 120 × 10 = 2592 mg
    const own = preparePlan(input({ candidates: [{ row: crop('kale'), food: kaleFood, ownYieldKgM2: 3 }] })).crops[0]!;
    expect(own.perM2.vitamin_c_mg).toBeCloseTo(2592, 9);
    expect(own.ownYield).toBe(true);
  });

  it('leaves animal lines out and sorts crops under the daily caps', () => {
    const eggs: PlanCandidate = { row: crop('eggs-hen'), food: { refusePct: 12, per100g: { energy_kcal: 143 } } };
    expect(preparePlan(input({ candidates: [A, eggs] })).crops.map((c) => c.key)).toEqual(['a']);
    expect(capGroupOf(crop('apples'))).toBe('fruit');
    expect(capGroupOf(crop('carrots'))).toBe('vegetables');
    // WHO counts potatoes as a starchy staple, not a vegetable (from memory: WHO, Healthy diet fact sheet)
    expect(capGroupOf(crop('potatoes'))).toBeNull();
    expect(capGroupOf(crop('dry-beans-navy'))).toBeNull();
  });

  it('writes LP text HiGHS reads, in shares of need', () => {
    const lp = planLp(preparePlan(input()), { kind: 'area' });
    // energy: A gives 1000/12000 of the year's need per m², B 500/12000
    expect(lp).toContain('t0: 0.0833333333333 a0 + 0.0416666666667 a1 >= 1');
    expect(lp).toContain('t1: 0.277777777778 a1 >= 1');
    expect(lp.startsWith('Minimize\n obj: a0 + a1\n')).toBe(true);
    expect(buildPlanModel(input()).columns).toEqual({ a0: 'a', a1: 'b' });
    expect(buildPlanModel(input(), { kind: 'shortfall' }).columns.s1).toBe('shortfall of vitamin_c_mg');
  });
});

describe('planPlanting (HiGHS)', () => {
  it('finds the least area of a small case worked by hand', async () => {
    // Minimise a + b subject to 1000a + 500b ≥ 12000 (energy) and 1000b ≥ 3600 (vitamin C).
    // Vitamin C forces b ≥ 3.6. Each m² of b beyond that saves only 0.5 m² of a, so b stays at 3.6
    // and a = (12000 − 500 × 3.6) / 1000 = 10.2: 13.8 m² in all.
    const plan = await planPlanting(input());
    expect(plan.status).toBe('optimal');
    expect(area(plan, 'a')).toBeCloseTo(10.2, 6);
    expect(area(plan, 'b')).toBeCloseTo(3.6, 6);
    expect(plan.addedAreaM2).toBeCloseTo(13.8, 6);
    expect(plan.projected.energy_kcal).toBeCloseTo(1, 6);
    expect(plan.projected.vitamin_c_mg).toBeCloseTo(1, 6);
    expect(plan.limits).toEqual([]);
    // 10 g of seed per m² (the invented rate) × 10.2 m²
    expect(plan.crops.find((c) => c.cropKey === 'a')!.seedNeeded).toEqual({ amount: 102, unit: 'g' });
  });

  it('counts what the garden gives already', async () => {
    // Half the energy is home-grown: 1000a + 500b ≥ 6000 with b = 3.6 → a = 4.2
    const plan = await planPlanting(input({ homeSupply: { energy_kcal: months12(500), vitamin_c_mg: months12(0) } }));
    expect(area(plan, 'a')).toBeCloseTo(4.2, 6);
    expect(area(plan, 'b')).toBeCloseTo(3.6, 6);
  });

  it('holds each crop to its share of the energy need', async () => {
    // At most 50 % of 12000 kcal per crop: a ≤ 6000/1000 = 6 m², b ≤ 6000/500 = 12 m².
    // a at its cap of 6 leaves 6000 kcal for b: b = 12 (also at its cap); total 18 m².
    const plan = await planPlanting(input({ maxShareOfEnergyPerCrop: 0.5 }));
    expect(plan.status).toBe('optimal');
    expect(area(plan, 'a')).toBeCloseTo(6, 6);
    expect(area(plan, 'b')).toBeCloseTo(12, 6);
  });

  it('says which crops an energy cap holds back when a target is lost to it', async () => {
    // At most 25 %: a ≤ 3 m², b ≤ 6 m², together 3000 + 3000 = 6000 kcal, half the need.
    const plan = await planPlanting(input({ maxShareOfEnergyPerCrop: 0.25 }));
    expect(plan.status).toBe('infeasible-best-effort');
    expect(area(plan, 'a')).toBeCloseTo(3, 6);
    expect(area(plan, 'b')).toBeCloseTo(6, 6);
    expect(plan.limits[0]).toMatchObject({ nutrient: 'energy_kcal', reasons: ['crop-cap'], cappedCrops: ['a', 'b'] });
    expect(plan.limits[0]!.achieved).toBeCloseTo(0.5, 6);
    expect(plan.limits[0]!.message).toMatch(/Crop a and Crop b are held at 25 % of the energy need per crop/);
  });

  it('holds vegetables to the daily cap per person, and says so when a target is lost to it', async () => {
    // b as a vegetable under a cap of 5 g a day for 1 person: 1.825 kg a year = 1.825 m² at 1 kg/m².
    // Vitamin C reaches 1825/3600 = 50.69 % at best; energy is then met by a = (12000 − 912.5)/1000.
    const veg = invented('b', { energy_kcal: 50, vitamin_c_mg: 100 }, { group: 'green', category: 'leafy_green' });
    const plan = await planPlanting(input({ candidates: [A, veg], categoryCaps: { vegetables: 5, fruit: 5 } }));
    expect(plan.status).toBe('infeasible-best-effort');
    expect(area(plan, 'b')).toBeCloseTo(1.83, 6); // 1.825 rounded up to the next 0.01 m²
    expect(area(plan, 'a')).toBeCloseTo(11.09, 6); // 11.0875 rounded up
    const limit = plan.limits.find((l) => l.nutrient === 'vitamin_c_mg')!;
    expect(limit.reasons).toContain('category-cap');
    expect(limit.cappedCrops).toEqual(['b']);
    expect(limit.achieved).toBeCloseTo(1830 / 3600, 6);
    expect(plan.limits.map((l) => l.nutrient)).toEqual(['vitamin_c_mg']);
    expect(limit.message).toMatch(/Vitamin C reaches 51 % of the year's need, short of the 100 % target: the added vegetables reach the daily cap per person\./);
  });

  it('answers the best plan within an area limit and names the limit', async () => {
    // At most 10 m². Shortfall per m²: b lifts vitamin C by 1000/3600 and energy by 500/12000 (0.319
    // of need in all) until vitamin C is met at b = 3.6; a lifts energy by 1000/12000 = 0.083, more than
    // b's 0.042 after that. So b = 3.6, a = 6.4, and energy reaches (6400 + 1800)/12000 = 68.3 %.
    const plan = await planPlanting(input({ maxAreaM2: 10 }));
    expect(plan.status).toBe('infeasible-best-effort');
    expect(area(plan, 'a')).toBeCloseTo(6.4, 6);
    expect(area(plan, 'b')).toBeCloseTo(3.6, 6);
    expect(plan.projected.energy_kcal).toBeCloseTo(8200 / 12000, 6);
    expect(plan.limits).toHaveLength(1);
    expect(plan.limits[0]).toMatchObject({ nutrient: 'energy_kcal', target: 1, reasons: ['area-limit'] });
    expect(plan.limits[0]!.message).toMatch(/^Energy reaches 68 % of the year's need, short of the 100 % target: the plan fills the area limit of 10 m²/);
  });

  it('reports a nutrient no candidate supplies, and still plans the rest', async () => {
    const plan = await planPlanting(input({ targets: { energy_kcal: 1, vitamin_b12_ug: 0.5 }, need: { energy_kcal: months12(1000), vitamin_b12_ug: months12(70) } }));
    expect(plan.status).toBe('infeasible-best-effort');
    // energy alone: all from a, 12 m² (a gives twice b's energy per m²)
    expect(area(plan, 'a')).toBeCloseTo(12, 6);
    expect(area(plan, 'b')).toBe(0);
    expect(plan.limits).toEqual([
      expect.objectContaining({ nutrient: 'vitamin_b12_ug', achieved: 0, reasons: ['no-crop'], message: expect.stringMatching(/no candidate crop supplies it/) }),
    ]);
  });

  it('moves area to a storage crop when the winter months bind', async () => {
    // F (fresh) is picked May–September and does not keep: 1200 mg vitamin C per m², 1/5 a month.
    // S (stored) is picked September–October and keeps 6 months, eaten September–April: 1000 mg, 1/8 a month.
    const F = invented('fresh', { vitamin_c_mg: 120 }, { harvestFrom: { frost: 'spring', weeks: 3 }, harvestTo: { frost: 'autumn', weeks: -5 }, storageMonths: 0 });
    const S = invented('store', { vitamin_c_mg: 100 }, { harvestFrom: { frost: 'autumn', weeks: -6 }, harvestTo: { frost: 'autumn', weeks: 2 }, storageMonths: 6 });
    const base = input({ targets: { vitamin_c_mg: 1 }, need: { vitamin_c_mg: months12(300) }, homeSupply: {}, candidates: [F, S] });

    // Over the year F is cheaper: 3600 / 1200 = 3 m² and nothing else.
    const year = await planPlanting(base);
    expect(area(year, 'fresh')).toBeCloseTo(3, 6);
    expect(area(year, 'store')).toBe(0);
    expect(year.projectedMonths[0]!.values.vitamin_c_mg).toBe(0); // January gets nothing

    // Month by month: January needs 300 mg and only S gives any (125 per m²): S ≥ 2.4; May–August only
    // F (240 per m²): F ≥ 1.25; September gets both (300 + 300). 3.65 m² in all.
    const month = await planPlanting({ ...base, basis: 'month' });
    expect(month.status).toBe('optimal');
    expect(area(month, 'store')).toBeCloseTo(2.4, 6);
    expect(area(month, 'fresh')).toBeCloseTo(1.25, 6);
    for (const m of month.projectedMonths) expect(m.values.vitamin_c_mg!).toBeGreaterThanOrEqual(1 - 1e-9);
    expect(month.projectedMonths.map((m) => m.month)).toEqual(Array.from({ length: 12 }, (_, i) => `2027-${String(i + 1).padStart(2, '0')}`));
  });

  it('names the lean months no candidate reaches on the monthly basis', async () => {
    const F = invented('fresh', { vitamin_c_mg: 120 }, { harvestFrom: { frost: 'spring', weeks: 3 }, harvestTo: { frost: 'autumn', weeks: -5 }, storageMonths: 0 });
    const plan = await planPlanting(input({ basis: 'month', targets: { vitamin_c_mg: 1 }, need: { vitamin_c_mg: months12(300) }, homeSupply: {}, candidates: [F] }));
    expect(plan.status).toBe('infeasible-best-effort');
    expect(area(plan, 'fresh')).toBeCloseTo(1.25, 6); // fills May–September, no more
    const limit = plan.limits[0]!;
    expect(limit.reasons).toEqual(['no-crop']);
    expect(limit.months).toEqual(['2027-01', '2027-02', '2027-03', '2027-04', '2027-10', '2027-11', '2027-12']);
  });

  it('projects shares that equal a recomputation from the plan’s own areas', async () => {
    // Real rows: potatoes, kale, carrots, navy beans, with their SR28 energy, protein, vitamin C and refuse per 100 g.
    const foods: Record<string, CropFood> = {
      potatoes: { refusePct: 25, per100g: { energy_kcal: 77, protein_g: 2.05, vitamin_c_mg: 19.7 } }, // USDA SR28, NDB 11352 "Potatoes, flesh and skin, raw"
      kale: { refusePct: 28, per100g: { energy_kcal: 49, protein_g: 4.28, vitamin_c_mg: 120 } }, // USDA SR28, NDB 11233 "Kale, raw"
      carrots: { refusePct: 11, per100g: { energy_kcal: 41, protein_g: 0.93, vitamin_c_mg: 5.9 } }, // USDA SR28, NDB 11124 "Carrots, raw"
      // USDA SR28, NDB 16037 "Beans, navy, mature seeds, raw": no vitamin C value (unknown, counted as none)
      'dry-beans-navy': { refusePct: 0, per100g: { energy_kcal: 337, protein_g: 22.33, vitamin_c_mg: null } },
    };
    const candidates = Object.entries(foods).map(([key, food]) => ({ row: crop(key), food }));
    const need = { energy_kcal: months12(2000 * 30), protein_g: months12(50 * 30), vitamin_c_mg: months12(90 * 30) };
    const homeSupply = { energy_kcal: months12(5000), protein_g: months12(100), vitamin_c_mg: months12(1000) };
    const plan = await planPlanting({ year: 2027, targets: { energy_kcal: 0.4, protein_g: 0.5, vitamin_c_mg: 1 }, basis: 'month', need, homeSupply, people: 1, frost: north, candidates });

    for (const key of ['energy_kcal', 'protein_g', 'vitamin_c_mg'] as const) {
      let supply = homeSupply[key].reduce((a, b) => a + b, 0);
      for (const c of plan.crops) {
        const { row, food } = candidates.find((x) => x.row.key === c.cropKey)!;
        supply += c.areaM2 * (nutrientPerM2(row, food)[key] ?? 0);
      }
      const recomputed = supply / need[key].reduce((a, b) => a + b, 0);
      expect(plan.projected[key]).toBeCloseTo(recomputed, 9);
    }
    // and the model's own recomputation from the same areas agrees
    const again = projectShares(preparePlan({ year: 2027, targets: {}, need, homeSupply, people: 1, frost: north, candidates }), new Map(plan.crops.map((c) => [c.cropKey, c.areaM2])));
    expect(again.projected).toEqual(plan.projected);
    expect(plan.crops.length).toBeGreaterThan(0);
  });

  it('needs no solve when the garden meets the targets already', async () => {
    const plan = await planPlanting(input({ homeSupply: { energy_kcal: months12(1000), vitamin_c_mg: months12(300) } }));
    expect(plan).toMatchObject({ status: 'optimal', addedAreaM2: 0, crops: [], limits: [] });
    expect(plan.projected.energy_kcal).toBe(1);
  });

  it('loads HiGHS once per process', async () => {
    expect(loadHighs()).toBe(loadHighs());
    expect(roundArea(2.3412)).toBe(2.35);
    expect(roundArea(1e-9)).toBe(0);
  });
});
