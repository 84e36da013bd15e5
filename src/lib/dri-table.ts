/**
 * The Dietary Reference Intakes table of reference-data/dri.csv, typed and checked, so pure code
 * can use it without reading files. The CSV is the one source: `npm run gen:dri` turns it into
 * ./dri-rows.generated.ts, and tests/unit/dri-table.test.ts fails when the two differ. Values are
 * per day in the unit of the nutrient key (copper converted from the table's µg to mg). Ages in
 * years: ageMin ≤ age < ageMax (ageMax null = no upper limit).
 */
import { DRI_CSV_CELLS, DRI_CSV_SOURCES } from './dri-rows.generated';
import { isNutrientKey, type NutrientKey } from './nutrients';

export type DriSex = 'female' | 'male' | 'any';
export type DriCondition = 'none' | 'pregnancy' | 'lactation';
export type DriBasis = 'RDA' | 'AI';

export interface DriRow {
  nutrient: NutrientKey;
  lifeStage: string;
  sex: DriSex;
  ageMin: number;
  ageMax: number | null;
  condition: DriCondition;
  value: number;
  basis: DriBasis;
  source: string;
}

export const DRI_SOURCES = {
  MACRO: 'National Academies DRI, Macronutrients RDA/AI table (IOM 2005 report; 2011 summary)',
  VITAMINS: 'National Academies DRI, Vitamins RDA/AI table (2011 summary)',
  ELEMENTS: 'National Academies DRI, Elements RDA/AI table (2011 summary)',
  SODIUM_POTASSIUM: 'NASEM 2019 DRI for Sodium and Potassium (AI table)',
} as const;

const SEXES: readonly string[] = ['female', 'male', 'any'] satisfies DriSex[];
const CONDITIONS: readonly string[] = ['none', 'pregnancy', 'lactation'] satisfies DriCondition[];
const BASES: readonly string[] = ['RDA', 'AI'] satisfies DriBasis[];

// Checks one generated row, so a slip in the CSV fails at load with the row to fix, not as a wrong need.
function toRow([nutrient, lifeStage, sex, ageMin, ageMax, condition, value, basis, sourceIndex]: (typeof DRI_CSV_CELLS)[number], i: number): DriRow {
  const at = `reference-data/dri.csv row ${i + 2} (${nutrient}, ${lifeStage})`;
  if (!isNutrientKey(nutrient)) throw new Error(`${at}: unknown nutrient key; use one of the keys in src/lib/nutrients.ts.`);
  if (!SEXES.includes(sex)) throw new Error(`${at}: sex "${sex}" must be female, male or any.`);
  if (!CONDITIONS.includes(condition)) throw new Error(`${at}: condition "${condition}" must be none, pregnancy or lactation.`);
  if (!BASES.includes(basis)) throw new Error(`${at}: basis "${basis}" must be RDA or AI.`);
  const source = DRI_CSV_SOURCES[sourceIndex];
  if (source === undefined) throw new Error(`${at}: no source; run npm run gen:dri again.`);
  return { nutrient, lifeStage, sex: sex as DriSex, ageMin, ageMax, condition: condition as DriCondition, value, basis: basis as DriBasis, source };
}

/** Every row of the DRI table, e.g. DRI_ROWS.find((r) => r.nutrient === 'protein_g' && r.lifeStage === 'females 19–30 y')?.value → 46. */
export const DRI_ROWS: readonly DriRow[] = DRI_CSV_CELLS.map(toRow);
