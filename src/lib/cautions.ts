/**
 * The cautions the share report shows beside its figures, in one home and in Selfsown's own words.
 * A figure can be right and still mislead: iron from beans is not iron from meat, a month "covered"
 * twice over is no better than covered, and a logged harvest is food supply, not food eaten. Each
 * caution is shown where it matters — a short line under the nutrient it concerns, the general ones
 * in an "About these figures" section — rather than as a wall of text.
 */
import { VEGETARIAN_CAUTIONS } from './diet';
import type { NutrientKey } from './nutrients';

/** Every caution by a stable id (the screens use the id as a test hook and React key). */
export const CAUTIONS = {
  // IOM 2001, iron chapter: non-haem iron absorbed far less than haem iron; phytate lowers it further.
  plantIron:
    'Iron from plants is absorbed much less well than iron from meat or fish; vitamin C in the same meal helps, tea and coffee with it hinder.',
  // IOM 2001, zinc chapter: phytate in grains and pulses lowers zinc absorption.
  plantZinc: 'Zinc from grains and pulses is absorbed poorly, held back by their phytate; soaking, sprouting and leavening help a little.',
  // IOM 1997 (calcium): oxalate binds calcium, so spinach calcium is poorly absorbed.
  oxalateCalcium:
    'Calcium from high-oxalate greens such as spinach and chard is poorly absorbed: count on kale, cabbage, broccoli and other low-oxalate greens, dairy or pulses instead.',
  // IOM 2001, vitamin A chapter: 12 µg dietary β-carotene = 1 µg retinol activity equivalent (RAE).
  carotenoidVitaminA:
    'Vitamin A from vegetables comes as carotenoids, which the body turns into vitamin A at about 12 to 1 (12 µg beta-carotene for 1 µg RAE); the figures already count it that way.',
  vitaminKBloodThinners:
    'Anyone taking a blood thinner such as warfarin should keep vitamin K from greens steady from week to week and talk to their doctor before eating much more or less of them.',
  plantProtein:
    'Protein from plants alone needs variety: cereals are short of lysine and pulses of the sulphur amino acids, so eat grains and pulses both, over the day.',
  amdrRange:
    'Carbohydrate and fat have a recommended range, not one need: the share is of the least recommended amount, and more within the range is fine.',
  upperLimit:
    'More than 100 % is not better, and no colour rewards it. Upper limits are about supplements and preformed vitamin A (liver, fish-liver oil, pills), not about the vitamins in garden food.',
  aiNotRequirement:
    'Where a nutrient has no RDA its recommended intake is an AI (adequate intake): the amount healthy people are seen to eat, not a proven requirement.',
  foodSupply:
    'The figures are food supply, not what was eaten: food wasted, spoiled or fed to animals is not logged, so real intake is lower than shown.',
  precision:
    'Whole percent is all the precision the data allow: reference foods, edible portions and recommended intakes are averages, and a garden’s food differs from them.',
  vegetarianZinc: VEGETARIAN_CAUTIONS[0],
  // common practice (no published source); tested recipes: USDA Complete Guide to Home Canning.
  foodStorage:
    'The larder is worked out from the log, not seen: check your stores and discard anything mouldy, soft or off-smelling. Home-preserved food should follow tested recipes and local food-safety advice.',
  medical:
    'These figures are estimates from public reference data (food composition tables and dietary reference intakes), not medical or dietary advice. Pregnancy, children, illness and special diets need a registered dietitian or a physician.',
} as const;

export type CautionId = keyof typeof CAUTIONS;

export interface Caution {
  id: CautionId;
  text: string;
}

function caution(id: CautionId): Caution {
  return { id, text: CAUTIONS[id] };
}

/** What the household is like, as far as the cautions care. */
export interface CautionContext {
  /** Someone who eats in the household is vegetarian. */
  vegetarian?: boolean;
}

const BY_NUTRIENT: Partial<Record<NutrientKey, readonly CautionId[]>> = {
  protein_g: ['plantProtein'],
  carbohydrate_g: ['amdrRange'],
  fat_g: ['amdrRange'],
  iron_mg: ['plantIron'],
  zinc_mg: ['plantZinc'],
  calcium_mg: ['oxalateCalcium'],
  vitamin_a_rae_ug: ['carotenoidVitaminA'],
  vitamin_k_ug: ['vitaminKBloodThinners'],
};

/**
 * The cautions to show beside one nutrient's figures, most important first,
 * e.g. nutrientCautions('zinc_mg', { vegetarian: true }).map((c) => c.id) → ['plantZinc', 'vegetarianZinc'],
 * nutrientCautions('energy_kcal') → [].
 */
export function nutrientCautions(key: NutrientKey, context: CautionContext = {}): Caution[] {
  const ids = [...(BY_NUTRIENT[key] ?? [])];
  if (key === 'zinc_mg' && context.vegetarian) ids.push('vegetarianZinc');
  return ids.map(caution);
}

/**
 * The cautions about the figures as a whole, for the "About these figures" section,
 * e.g. aboutCautions().map((c) => c.id) → ['foodSupply', 'precision', 'upperLimit', 'aiNotRequirement', 'medical'].
 */
export function aboutCautions(context: CautionContext = {}): Caution[] {
  const ids: CautionId[] = ['foodSupply', 'precision', 'upperLimit', 'aiNotRequirement'];
  if (context.vegetarian) ids.push('vegetarianZinc');
  ids.push('medical');
  return ids.map(caution);
}
