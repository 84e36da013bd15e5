import { describe, expect, it } from 'vitest';
import { nutrientsOf, type FoodEntry } from '@/lib/allocate';
import { computeShare, knownSum, topContributors, type CropEntry } from '@/lib/shares';

// Edible portion as the product brief defines it: grams as harvested × (1 − refuse/100).
const edible = (grams: number, refusePct: number) => grams * (1 - refusePct / 100);

// USDA SR28, NDB 11352 "Potatoes, flesh and skin, raw", per 100 g: 77 kcal, 2.05 g protein, 12.1 mg choline, 0 µg RAE vitamin A; refuse 25 %
const POTATO = { per100g: { energy_kcal: 77, protein_g: 2.05, choline_mg: 12.1, vitamin_a_rae_ug: 0, fat_g: 0.09 }, refuse: 25 };
// USDA SR28, NDB 11485 "Squash, winter, butternut, raw", per 100 g: 45 kcal, 1.00 g protein, no choline value, 532 µg RAE vitamin A; refuse 16 %
const BUTTERNUT = { per100g: { energy_kcal: 45, protein_g: 1, choline_mg: null, vitamin_a_rae_ug: 532, fat_g: 0.1 }, refuse: 16 };

type Food = typeof POTATO | typeof BUTTERNUT;

function harvest(food: Food, gramsAsHarvested: number, over: Partial<FoodEntry> & Pick<FoodEntry, 'date'>): FoodEntry {
  const grams = edible(gramsAsHarvested, food.refuse);
  return { use: 'fresh', source: 'home', spreadMonths: 1, edibleGrams: grams, nutrients: nutrientsOf(grams, food.per100g), ...over };
}

const woman25 = { sex: 'female', ageYears: 25 } as const;

describe('home share', () => {
  it('divides home food by all food eaten and by the need', () => {
    const report = computeShare({
      from: '2026-01',
      to: '2026-01',
      people: [woman25],
      nutrients: ['energy_kcal', 'protein_g'],
      entries: [
        harvest(POTATO, 1000, { date: '2026-01-10' }), // 750 g edible: 577.5 kcal, 15.375 g protein
        harvest(POTATO, 2000, { date: '2026-01-12', source: 'bought' }), // 1500 g edible: 1155 kcal, 30.75 g protein
      ],
    });
    const jan = report.months[0]!;
    expect(jan.month).toBe('2026-01');
    expect(jan.days).toBe(31);
    expect(jan.values.energy_kcal.home).toBe(577.5);
    expect(jan.values.energy_kcal.bought).toBe(1155);
    expect(jan.values.energy_kcal.shareOfIntake).toBeCloseTo(1 / 3, 12); // 577.5 / (577.5 + 1155)
    // RDA protein, women 19–30 y: 46 g/day (National Academies DRI) × 31 days = 1426 g
    expect(jan.values.protein_g.need).toBe(1426);
    expect(jan.values.protein_g.shareOfNeed).toBeCloseTo(15.375 / 1426, 12);
    expect(report.nutrients).toEqual([
      { key: 'energy_kcal', name: 'Energy', unit: 'kcal' },
      { key: 'protein_g', name: 'Protein', unit: 'g' },
    ]);
  });

  it('lets the share of need pass 1', () => {
    // 10 kg butternut → 8400 g edible × 532 µg RAE/100 g = 44,688 µg; RDA vitamin A, women 19–30 y: 700 µg RAE/day (DRI) × 31 = 21,700 µg
    const report = computeShare({
      from: '2026-01', to: '2026-01', people: [woman25], nutrients: ['vitamin_a_rae_ug'],
      entries: [harvest(BUTTERNUT, 10_000, { date: '2026-01-05' })],
    });
    expect(report.months[0]!.values.vitamin_a_rae_ug.shareOfNeed).toBeCloseTo(44_688 / 21_700, 9);
  });

  it('reports home as unknown, not zero, when no home weight has a value', () => {
    const report = computeShare({
      from: '2026-10', to: '2026-10', people: [woman25], nutrients: ['choline_mg'],
      entries: [harvest(BUTTERNUT, 1000, { date: '2026-10-01' })], // 840 g edible, no choline value in SR28
    });
    const v = report.months[0]!.values.choline_mg;
    expect(v.home).toBeNull();
    expect(v.shareOfIntake).toBeNull();
    expect(v.shareOfNeed).toBeNull();
    expect(v.unknownGrams).toBe(840);
    expect(v.need).toBe(425 * 31); // AI choline, women 19+ y: 425 mg/day (DRI Vitamins table)
  });

  it('sums the known values and reports the weight without one', () => {
    const report = computeShare({
      from: '2026-10', to: '2026-10', people: [woman25], nutrients: ['choline_mg'],
      entries: [harvest(BUTTERNUT, 1000, { date: '2026-10-01' }), harvest(POTATO, 1000, { date: '2026-10-03' })],
    });
    const v = report.months[0]!.values.choline_mg;
    expect(v.home).toBeCloseTo(90.75, 9); // 750 g × 12.1 mg/100 g
    expect(v.unknownGrams).toBe(840);
    expect(v.shareOfIntake).toBe(1);
  });

  it('counts a month with no food as a known 0', () => {
    const report = computeShare({ from: '2026-03', to: '2026-03', people: [woman25], nutrients: ['energy_kcal'], entries: [] });
    const v = report.months[0]!.values.energy_kcal;
    expect(v).toMatchObject({ home: 0, bought: 0, shareOfIntake: null, shareOfNeed: 0, unknownGrams: 0 });
  });

  it('has no share of need where the DRI set no need or nobody is at home', () => {
    const entries = [harvest(POTATO, 1000, { date: '2026-01-10' })];
    // total sugars: no RDA, AI or AMDR (DRI Macronutrients table); 0.78 g/100 g from memory: USDA SR28 NDB 11352
    const sugary = [{ ...entries[0]!, nutrients: { sugars_g: 5.85 } }];
    const sugars = computeShare({ from: '2026-01', to: '2026-01', people: [woman25], nutrients: ['sugars_g'], entries: sugary });
    expect(sugars.months[0]!.values.sugars_g.need).toBeNull();
    expect(sugars.months[0]!.values.sugars_g.shareOfNeed).toBeNull();
    expect(sugars.months[0]!.values.sugars_g.shareOfIntake).toBe(1);
    const empty = computeShare({ from: '2026-01', to: '2026-01', people: [], nutrients: ['protein_g'], entries });
    expect(empty.months[0]!.values.protein_g.need).toBe(0);
    expect(empty.months[0]!.values.protein_g.shareOfNeed).toBeNull();
  });

  it('totals the months of the range, stored food in the months it is eaten', () => {
    const report = computeShare({
      from: '2026-11', to: '2027-02', people: [woman25], nutrients: ['energy_kcal', 'protein_g'],
      entries: [harvest(BUTTERNUT, 1000, { date: '2026-11-01', use: 'stored', spreadMonths: 4 })], // 378 kcal, 8.4 g protein
    });
    // eaten per day over 1 Nov 2026 – 28 Feb 2027: 30 + 31 + 31 + 28 = 120 days (Gregorian calendar)
    const expected = [30, 31, 31, 28].map((days) => (378 * days) / 120);
    report.months.forEach((m, i) => expect(m.values.energy_kcal.home).toBeCloseTo(expected[i]!, 9));
    expect(report.months.map((m) => m.days)).toEqual([30, 31, 31, 28]); // Nov, Dec, Jan, Feb 2027 (Gregorian calendar)
    expect(report.total.values.energy_kcal.home).toBeCloseTo(378, 9);
    // RDA protein 46 g/day × (30 + 31 + 31 + 28) days = 5520 g
    expect(report.total.values.protein_g.need).toBe(5520);
    expect(report.total.values.protein_g.shareOfNeed).toBeCloseTo(8.4 / 5520, 12);
  });

  it('gives the FAO ratio as a fraction and in percent', () => {
    const report = computeShare({
      from: '2026-01', to: '2026-12', people: [woman25], nutrients: ['energy_kcal'],
      entries: [
        harvest(POTATO, 1000, { date: '2026-08-01', use: 'stored', spreadMonths: 6 }), // 577.5 kcal
        harvest(POTATO, 1000, { date: '2026-08-01', use: 'sold' }), // 577.5 kcal, exported
        harvest(POTATO, 1000, { date: '2026-03-01', source: 'bought' }), // 577.5 kcal, imported
      ],
    });
    // 1155 × 100 / (1155 + 577.5 − 577.5) = 100 % (FAO, Food Balance Sheets: A Handbook, 2001)
    expect(report.ratioPercent.energy_kcal).toBeCloseTo(100, 9);
    expect(report.ratio.energy_kcal).toBeCloseTo(1, 9);
  });

  it('uses the share nutrients by default and refuses unknown ones', () => {
    const report = computeShare({ from: '2026-01', to: '2026-01', people: [], entries: [] });
    expect(report.nutrients.map((n) => n.key)).toContain('vitamin_b12_ug');
    expect(() => computeShare({ from: '2026-01', to: '2026-01', people: [], entries: [], nutrients: ['unobtainium_mg' as 'iron_mg'] })).toThrow(
      /unknown nutrient/,
    );
  });

  it('refuses a range longer than ten years', () => {
    expect(() => computeShare({ from: '2016-01', to: '2026-12', people: [], entries: [] })).toThrow(/at most 120/);
  });
});

describe('top contributors', () => {
  const asCrop = (e: FoodEntry, cropId: number, name: string): CropEntry => ({ ...e, cropId, name });

  it('ranks home crops by what the household ate of a nutrient', () => {
    const entries = [
      asCrop(harvest(POTATO, 1000, { date: '2026-08-01' }), 1, 'Potato'), // 577.5 kcal
      asCrop(harvest(POTATO, 1000, { date: '2026-08-15' }), 1, 'Potato'), // 577.5 kcal
      asCrop(harvest(BUTTERNUT, 1000, { date: '2026-09-01' }), 2, 'Butternut'), // 378 kcal
      asCrop(harvest(BUTTERNUT, 5000, { date: '2026-09-01', use: 'sold' }), 2, 'Butternut'), // not eaten
      asCrop(harvest(POTATO, 9000, { date: '2026-09-01', source: 'bought' }), 3, 'Bought potato'), // not home
    ];
    const top = topContributors(entries, 'energy_kcal', 5);
    expect(top.map((c) => c.name)).toEqual(['Potato', 'Butternut']);
    expect(top[0]!.amount).toBe(1155);
    expect(top[0]!.shareOfHome).toBeCloseTo(1155 / 1533, 12);
    expect(topContributors(entries, 'energy_kcal', 1)).toHaveLength(1);
  });

  it('counts stored food only for the months of the range it is eaten in', () => {
    const entries = [asCrop(harvest(BUTTERNUT, 1000, { date: '2026-11-01', use: 'stored', spreadMonths: 4 }), 2, 'Butternut')];
    const top = topContributors(entries, 'energy_kcal', 3, { from: '2027-01', to: '2027-12' });
    // Eaten per day from 1 Nov 2026 to 1 Mar 2027 (30 + 31 + 31 + 28 = 120 days); Jan + Feb 2027 are 31 + 28 = 59 of them
    expect(top[0]!.amount).toBeCloseTo((378 * 59) / 120, 9); // 1000 g × 84 % edible × 45 kcal/100 g (USDA SR28, NDB 11485) = 378 kcal
  });
});

describe('known sums', () => {
  it('is unknown only when every gram behind the sum is of unknown value', () => {
    expect(knownSum(0, 0, 250)).toBeNull();
    expect(knownSum(0, 0, 0)).toBe(0); // no food at all is a known 0
    expect(knownSum(90, 100, 250)).toBe(90);
  });
});

describe('records start, future months, headline and intake (issue 9)', () => {
  const woman2000 = { sex: 'female', ageYears: 30, kcalPerDay: 2000 } as const;
  const report = computeShare({
    from: '2026-01',
    to: '2026-12',
    people: [woman2000],
    nutrients: ['energy_kcal', 'choline_mg'],
    recordsSince: '2026-10',
    currentMonth: '2026-11',
    entries: [
      harvest(POTATO, 1000, { date: '2026-03-10' }), // before records: shown, never counted
      harvest(POTATO, 1000, { date: '2026-10-10' }), // 750 g edible: 577.5 kcal
      harvest(BUTTERNUT, 1000, { date: '2026-11-10' }), // 840 g edible: 378 kcal; no choline value
      harvest(POTATO, 4000, { date: '2026-11-20', source: 'bought' }), // 3000 g edible: 2310 kcal
    ],
  });
  const month = (m: string) => report.months.find((x) => x.month === m)!;

  it('marks months before the records start and after the current month', () => {
    expect(month('2026-03')).toMatchObject({ beforeRecords: true, future: false });
    expect(month('2026-03').values.energy_kcal.need).toBeNull();
    expect(month('2026-03').values.energy_kcal.home).toBe(577.5); // the food is still shown
    expect(month('2026-10')).toMatchObject({ beforeRecords: false, future: false });
    expect(month('2026-12')).toMatchObject({ beforeRecords: false, future: true });
    expect(report).toMatchObject({ recordsSince: '2026-10', currentMonth: '2026-11' });
  });

  it('leaves months before records out of the total, and future months out of the headline', () => {
    // stated 2000 kcal a day: Oct 31 + Nov 30 + Dec 31 days in the total; Oct + Nov in the headline
    expect(report.total.values.energy_kcal.need).toBe(2000 * (31 + 30 + 31));
    expect(report.total.values.energy_kcal.home).toBe(577.5 + 378); // not the March potatoes
    expect(report.headline).toMatchObject({ from: '2026-10', to: '2026-11' });
    expect(report.headline!.values.energy_kcal.need).toBe(2000 * (31 + 30));
  });

  it('says logged food looks incomplete under 70 % of the energy need', () => {
    // (577.5 + 378 + 2310) kcal ÷ (2000 × 61) kcal = 2.7 % of the need (70 %: Selfsown's threshold, issue 9)
    expect(report.intake.loggedEnergyShareOfNeed).toBeCloseTo((577.5 + 378 + 2310) / (2000 * 61), 12);
    expect(report.intake.looksIncomplete).toBe(true);
    const full = computeShare({
      from: '2026-01', to: '2026-01', people: [woman2000], nutrients: ['energy_kcal'],
      entries: [harvest(POTATO, 60_000, { date: '2026-01-05', source: 'bought' })], // 45,000 g edible × 0.77 = 34,650 kcal of 62,000 (55.9 %)
    });
    expect(full.intake.looksIncomplete).toBe(true);
    const enough = computeShare({
      from: '2026-01', to: '2026-01', people: [woman2000], nutrients: ['energy_kcal'],
      entries: [harvest(POTATO, 80_000, { date: '2026-01-05', source: 'bought' })], // 60,000 g edible × 0.77 = 46,200 kcal of 62,000 (74.5 %)
    });
    expect(enough.intake).toEqual({ loggedEnergyShareOfNeed: 46_200 / 62_000, looksIncomplete: false });
  });

  it('gives no headline when every month is before records or in the future', () => {
    const r = computeShare({ from: '2027-01', to: '2027-03', people: [woman2000], entries: [], currentMonth: '2026-12', recordsSince: '2026-12' });
    expect(r.headline).toBeNull();
    expect(r.intake).toEqual({ loggedEnergyShareOfNeed: null, looksIncomplete: false });
  });

  it('flags a share resting on more than 10 % unknown weight', () => {
    // November choline: butternut has no value (840 g unknown), bought potatoes 3000 g known (USDA SR28, NDB 11352: 12.1 mg/100 g)
    const nov = month('2026-11').values.choline_mg;
    expect(nov.unknownShare).toBeCloseTo(840 / (840 + 3000), 12);
    expect(nov.uncertain).toBe(true);
    expect(month('2026-10').values.choline_mg).toMatchObject({ unknownShare: 0, uncertain: false });
    expect(month('2026-12').values.choline_mg).toMatchObject({ unknownShare: null, uncertain: false }); // nothing eaten
  });
});

describe('need ranges and bases (issue 9)', () => {
  it('carries the AMDR range of carbohydrate and fat into months and totals, and names what each need rests on', () => {
    const report = computeShare({
      from: '2026-04', to: '2026-05', entries: [],
      people: [{ sex: 'male', ageYears: 30, kcalPerDay: 2000 }, { sex: 'female', birthMonth: '2026-01', fedFromHousehold: true }],
      nutrients: ['fat_g', 'iron_mg', 'vitamin_c_mg', 'energy_kcal'],
    });
    const apr = report.months[0]!.values;
    // AMDR fat from 19 y: 20–35 % of energy at 9 kcal/g (IOM 2005): 2000 kcal → 44.4–77.8 g a day × 30 days;
    // the baby (under 1 y) has no AMDR: AI fat infants 0–6 mo 31 g/day (National Academies DRI) added to both ends
    expect(apr.fat_g.needLow).toBeCloseTo(((2000 * 0.2) / 9) * 30 + 31 * 30, 9);
    expect(apr.fat_g.needHigh).toBeCloseTo(((2000 * 0.35) / 9) * 30 + 31 * 30, 9);
    expect(apr.fat_g.need).toBe(apr.fat_g.needLow);
    expect(apr.iron_mg.needLow).toBeNull();
    expect(report.total.values.fat_g.needHigh).toBeCloseTo(((2000 * 0.35) / 9) * 61 + 31 * 61, 9);
    // the man's iron is an RDA, the baby's an AI (infants 0–6 mo, National Academies DRI): mixed
    expect(report.needBasis).toEqual({ fat_g: 'mixed', iron_mg: 'mixed', vitamin_c_mg: 'mixed', energy_kcal: 'EER' });
  });
});
