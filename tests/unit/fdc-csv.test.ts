import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { FDC_FILE_ORDER, FdcReader, readFdcTexts, type FdcFile } from '@/lib/fdc-csv';
import { releaseChanges } from '@/lib/release-changes';

// The column layouts of FoodData Central's CSV download (from memory: FDC "Download Data" field
// descriptions, April 2019 onwards): every file quoted, header on line 1.
const csv = (rows: string[][]) => rows.map((r) => r.map((c) => `"${c}"`).join(',')).join('\n');
const parse = (text: string) => {
  const p = Papa.parse<Record<string, string>>(text, { header: true, skipEmptyLines: true });
  return { headers: p.meta.fields ?? [], rows: p.data };
};

const NUTRIENT = csv([
  ['id', 'name', 'unit_name', 'nutrient_nbr', 'rank'],
  ['1003', 'Protein', 'G', '203', '600'],
  ['1008', 'Energy', 'KCAL', '208', '300'],
  ['1062', 'Energy', 'kJ', '268', '400'],
  ['2047', 'Energy (Atwater General Factors)', 'KCAL', '957', '280'],
  ['2048', 'Energy (Atwater Specific Factors)', 'KCAL', '958', '290'],
  ['1162', 'Vitamin C, total ascorbic acid', 'MG', '401', '6300'],
  ['1089', 'Iron, Fe', 'MG', '303', '5400'],
]);

// SR Legacy: fdc_id 170026 is NDB 11352 "Potatoes, flesh and skin, raw" (from memory: FDC SR Legacy);
// 77 kcal and 2.05 g protein per 100 g (USDA SR28, NDB 11352), vitamin C 19.7 mg (USDA SR28, NDB 11352)
const SR_LEGACY: Partial<Record<FdcFile, string>> = {
  'nutrient.csv': NUTRIENT,
  'food_category.csv': csv([['id', 'code', 'description'], ['11', '1100', 'Vegetables and Vegetable Products']]),
  'sr_legacy_food.csv': csv([['fdc_id', 'NDB_number'], ['170026', '11352']]),
  'measure_unit.csv': csv([['id', 'name'], ['1000', 'cup'], ['9999', 'undetermined']]),
  'food.csv': csv([
    ['fdc_id', 'data_type', 'description', 'food_category_id', 'publication_date'],
    ['170026', 'sr_legacy_food', 'Potatoes, flesh and skin, raw', '11', '2019-04-01'],
  ]),
  'food_nutrient.csv': csv([
    ['id', 'fdc_id', 'nutrient_id', 'amount', 'data_points', 'derivation_id', 'min', 'max', 'median', 'footnote', 'min_year_acquired'],
    ['1', '170026', '1008', '77', '0', '49', '', '', '', '', ''],
    ['2', '170026', '1003', '2.05', '0', '1', '', '', '', '', ''],
    ['3', '170026', '1062', '322', '0', '49', '', '', '', '', ''],
    ['4', '170026', '1162', '19.7', '0', '1', '', '', '', '', ''],
    ['5', '170026', '1089', '', '0', '1', '', '', '', '', ''],
  ]),
  'food_portion.csv': csv([
    ['id', 'fdc_id', 'seq_num', 'amount', 'measure_unit_id', 'portion_description', 'modifier', 'gram_weight', 'data_points', 'footnote', 'min_year_acquired'],
    ['1', '170026', '1', '1', '9999', '', 'medium (2-1/4" to 3-1/4" dia)', '213', '', '', ''],
  ]),
};

// Foundation Foods: ids, names and figures made up for this parse test (not food facts); energy
// only as Atwater factors, samples of the food listed beside it in food.csv.
const FOUNDATION: Partial<Record<FdcFile, string>> = {
  'nutrient.csv': NUTRIENT,
  'food.csv': csv([
    ['fdc_id', 'data_type', 'description', 'food_category_id', 'publication_date'],
    ['900001', 'foundation_food', 'Test squash, raw', '', '2024-04-18'],
    ['900002', 'sub_sample_food', 'Test squash, sample 1', '', '2024-04-18'],
  ]),
  'food_nutrient.csv': csv([
    ['id', 'fdc_id', 'nutrient_id', 'amount', 'data_points', 'derivation_id', 'min', 'max', 'median', 'footnote', 'min_year_acquired'],
    ['10', '900001', '2047', '41', '', '', '', '', '', '', ''],
    ['11', '900001', '2048', '38', '', '', '', '', '', '', ''],
    ['12', '900002', '1003', '9', '', '', '', '', '', '', ''],
  ]),
};

describe('FoodData Central CSV', () => {
  it('reads an SR Legacy download: NDB number as code, known nutrients only, blanks unknown', () => {
    const r = readFdcTexts(SR_LEGACY, parse);
    expect(r.errors).toEqual([]);
    expect(r.format).toBe('sr_legacy');
    expect(r.foods).toEqual([
      { code: '11352', fdcId: '170026', name: 'Potatoes, flesh and skin, raw', group: 'Vegetables and Vegetable Products', rawness: 0, weights: [{ description: '1 medium (2-1/4" to 3-1/4" dia)', grams: 213 }] },
    ]);
    const got = Object.fromEntries(r.amounts.map((a) => [a.key, a.amount]));
    expect(got).toEqual({ energy_kcal: 77, protein_g: 2.05, vitamin_c_mg: 19.7 }); // no kJ row, no iron (blank)
  });

  it('reads a Foundation Foods download: FDC id as code, Atwater specific energy first, samples skipped', () => {
    const r = readFdcTexts(FOUNDATION, parse);
    expect(r.errors).toEqual([]);
    expect(r.format).toBe('foundation');
    expect(r.foods.map((f) => [f.code, f.group])).toEqual([['900001', 'FoodData Central']]);
    expect(r.amounts).toEqual([{ code: '900001', key: 'energy_kcal', amount: 38 }]);
    expect(r.skippedFoods).toBe(1);
  });

  it('names the file, line and column of each bad row', () => {
    const bad = { ...SR_LEGACY, 'food_nutrient.csv': SR_LEGACY['food_nutrient.csv']!.replace('"2.05"', '"-2"').replace('"170026","1162"', '"170099","1162"') };
    const r = readFdcTexts(bad, parse);
    expect(r.errors).toEqual([
      { file: 'food_nutrient.csv', line: 3, column: 'amount', message: '"-2" is not an amount of 0 or more.' },
      { file: 'food_nutrient.csv', line: 5, column: 'fdc_id', message: 'No food with FDC id "170099" in food.csv.' },
    ]);
  });

  it('refuses a missing required file or column, and a nutrient in the wrong unit', () => {
    const noFood = readFdcTexts({ ...SR_LEGACY, 'food.csv': undefined }, parse);
    expect(noFood.errors[0]).toMatchObject({ file: 'food.csv', line: 1, column: 'fdc_id' });
    const wrongUnit = readFdcTexts({ ...SR_LEGACY, 'nutrient.csv': NUTRIENT.replace('"Protein","G"', '"Protein","MG"') }, parse);
    expect(wrongUnit.errors).toContainEqual(expect.objectContaining({ file: 'nutrient.csv', line: 2, column: 'unit_name' }));
  });

  it('reads files in the order their look-ups need', () => {
    expect(FDC_FILE_ORDER.indexOf('food.csv')).toBeLessThan(FDC_FILE_ORDER.indexOf('food_nutrient.csv'));
    expect(new FdcReader().start('food.csv', ['fdc_id', 'data_type', 'description', 'food_category_id'])).toBe(true);
  });
});

describe('what a new release would change', () => {
  it('sums energy and protein per household before and after, and lists dropped foods', () => {
    const rows = [
      { householdId: 1, householdName: 'A', code: '11352', edibleGrams: 1000, entries: 2 },
      { householdId: 1, householdName: 'A', code: '11485', edibleGrams: 500, entries: 1 },
      { householdId: 2, householdName: 'B', code: '11485', edibleGrams: 200, entries: 1 },
    ];
    const before = new Map([['11352', { energy_kcal: 77, protein_g: 2.05 }], ['11485', { energy_kcal: 45, protein_g: 1 }]]);
    const after = new Map([['11352', { energy_kcal: 80, protein_g: 2.05 }]]);
    const c = releaseChanges(rows, before, after);
    expect(c[0]).toMatchObject({ householdId: 1, entries: 3, kcalBefore: 770 + 225, kcalAfter: 800, foodsChanged: ['11352'], foodsDropped: ['11485'] });
    expect(c[1]).toMatchObject({ householdId: 2, kcalBefore: 90, kcalAfter: 0, proteinBefore: 2, proteinAfter: 0 });
    expect(releaseChanges(rows, before, before)).toEqual([]);
  });
});
