/**
 * npm run gen:dri
 * Writes src/lib/dri-rows.generated.ts from reference-data/dri.csv, the one source of the Dietary
 * Reference Intakes table. The CSV is the table people read and correct (each row cites its
 * source); the generated module lets pure code, the server and the browser use it without reading
 * files. tests/unit/dri-table.test.ts fails when the two differ, so a CSV edit without this step
 * is caught.
 */
import { readFileSync, writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import Papa from 'papaparse';
import { isMain } from './is-main';

export const DRI_CSV_PATH = fileURLToPath(new URL('../../reference-data/dri.csv', import.meta.url));
export const DRI_MODULE_PATH = fileURLToPath(new URL('../lib/dri-rows.generated.ts', import.meta.url));

const COLUMNS = ['nutrient_key', 'life_stage', 'sex', 'age_min', 'age_max', 'condition', 'value', 'basis', 'source'] as const;

function number(text: string, row: number, column: string): number {
  const n = Number(text);
  if (text.trim() === '' || !Number.isFinite(n)) {
    throw new Error(`reference-data/dri.csv row ${row}: ${column} "${text}" is not a number; write it with a decimal point, e.g. 0.5.`);
  }
  return n;
}

/** The generated module's text for a DRI CSV's text. Example: `driModuleText(readFileSync(DRI_CSV_PATH, 'utf8'))` */
export function driModuleText(csv: string): string {
  const parsed = Papa.parse<Record<string, string>>(csv, { header: true, skipEmptyLines: true });
  const header = parsed.meta.fields ?? [];
  if (COLUMNS.some((c, i) => header[i] !== c)) {
    throw new Error(`reference-data/dri.csv must start with the columns ${COLUMNS.join(',')}; it has ${header.join(',')}.`);
  }
  const sources: string[] = [];
  // One line per nutrient (its cells in CSV order), so the module stays a short, readable table.
  const byNutrient = new Map<string, string[]>();
  parsed.data.forEach((r, i) => {
    const row = i + 2;
    if (!sources.includes(r.source!)) sources.push(r.source!);
    const ageMax = r.age_max === '' ? null : number(r.age_max!, row, 'age_max');
    const cells = [r.nutrient_key, r.life_stage, r.sex, number(r.age_min!, row, 'age_min'), ageMax, r.condition, number(r.value!, row, 'value'), r.basis, sources.indexOf(r.source!)];
    const line = byNutrient.get(r.nutrient_key!) ?? [];
    line.push(JSON.stringify(cells));
    byNutrient.set(r.nutrient_key!, line);
  });
  const lines = [...byNutrient.values()].map((cells) => `  ${cells.join(', ')},`);
  return [
    '// Generated from reference-data/dri.csv by `npm run gen:dri`: edit the CSV and run it again, never this file.',
    '// Read through src/lib/dri-table.ts, which types and checks these cells.',
    '',
    '/** The sources cited in the CSV, in order of first use; a row names one by its index. */',
    'export const DRI_CSV_SOURCES: readonly string[] = [',
    ...sources.map((s) => `  ${JSON.stringify(s)},`),
    '];',
    '',
    '/** nutrient, life stage, sex, age from, age below (null = no limit), condition, value, basis, source index */',
    'export const DRI_CSV_CELLS: readonly (readonly [string, string, string, number, number | null, string, number, string, number])[] = [',
    ...lines,
    '];',
    '',
  ].join('\n');
}

if (isMain(import.meta.url)) {
  const text = driModuleText(readFileSync(DRI_CSV_PATH, 'utf8'));
  writeFileSync(DRI_MODULE_PATH, text);
  console.log(`• wrote ${DRI_MODULE_PATH} (${text.split('\n').length} lines)`);
}
