/**
 * Vitamins lost when food is preserved. Freezing, canning and drying destroy part of the vitamin C,
 * folate and other vitamins of a harvest, so a preserved entry that names its method counts its
 * vitamins × the retention factor of the USDA Table of Nutrient Retention Factors, Release 6
 * (2007), kept in reference-data/retention.csv. This module is pure: it parses the CSV text it is
 * given (a server loader reads the file) and applies the factors; a method or nutrient without a
 * row leaves the amount unchanged, and an unknown amount stays unknown.
 */
import Papa from 'papaparse';
import type { NutrientAmounts } from './allocate';
import { isNutrientKey, type NutrientKey } from './nutrients';

export const PRESERVE_METHODS = ['frozen', 'canned', 'dried', 'fermented'] as const;
export type PreserveMethod = (typeof PRESERVE_METHODS)[number];

export interface RetentionRow {
  method: PreserveMethod;
  nutrient: NutrientKey;
  /** Share retained, 0–1 (the table's percent ÷ 100). */
  factor: number;
  /** The table's item, e.g. "VEGETABLES, blanched, frozen". */
  item: string;
  source: string;
}

/** Factors by method and nutrient. */
export type RetentionTable = ReadonlyMap<PreserveMethod, ReadonlyMap<NutrientKey, RetentionRow>>;

const COLUMNS = ['method', 'nutrient_key', 'retention_pct', 'item', 'source'] as const;

export function isPreserveMethod(value: unknown): value is PreserveMethod {
  return typeof value === 'string' && (PRESERVE_METHODS as readonly string[]).includes(value);
}

/**
 * The rows of retention.csv from its text, checked: known method and nutrient key, a percent from
 * 0 to 100, an item and a source on every row, no method–nutrient pair twice,
 * e.g. parseRetentionCsv('method,nutrient_key,retention_pct,item,source\nfrozen,vitamin_c_mg,70,VEG,…')[0].factor → 0.7.
 */
export function parseRetentionCsv(text: string): RetentionRow[] {
  const parsed = Papa.parse<Record<string, string>>(text.replace(/^\uFEFF/, ''), { header: true, skipEmptyLines: true });
  if (parsed.errors.length > 0) {
    const e = parsed.errors[0]!;
    throw new RangeError(`retention.csv cannot be read near row ${(e.row ?? 0) + 2}: ${e.message}. Check its quotes and commas.`);
  }
  const header = parsed.meta.fields ?? [];
  const missing = COLUMNS.filter((c) => !header.includes(c));
  if (missing.length > 0) throw new RangeError(`retention.csv needs the columns ${COLUMNS.join(', ')}; missing: ${missing.join(', ')}.`);
  const seen = new Set<string>();
  return parsed.data.map((r, i) => {
    const line = i + 2;
    const method = r.method?.trim();
    const key = r.nutrient_key?.trim() ?? '';
    const pctText = r.retention_pct?.trim() ?? '';
    const pct = Number(pctText);
    if (!isPreserveMethod(method)) throw new RangeError(`retention.csv line ${line}: the method must be one of ${PRESERVE_METHODS.join(', ')}, got "${method}".`);
    if (!isNutrientKey(key)) throw new RangeError(`retention.csv line ${line}: "${key}" is not a nutrient key of src/lib/nutrients.ts.`);
    if (pctText === '' || !Number.isFinite(pct) || pct < 0 || pct > 100) {
      throw new RangeError(`retention.csv line ${line}: retention_pct must be a percent from 0 to 100, got "${pctText}".`);
    }
    const item = r.item?.trim() ?? '';
    const source = r.source?.trim() ?? '';
    if (!item || !source) throw new RangeError(`retention.csv line ${line}: give the table's item and the source of the value.`);
    const pair = `${method}/${key}`;
    if (seen.has(pair)) throw new RangeError(`retention.csv line ${line}: ${key} for ${method} is given twice; keep one row.`);
    seen.add(pair);
    return { method, nutrient: key, factor: pct / 100, item, source };
  });
}

/** The rows as a lookup by method and nutrient, e.g. retentionTable(rows).get('frozen')?.get('vitamin_c_mg')?.factor. */
export function retentionTable(rows: readonly RetentionRow[]): RetentionTable {
  const table = new Map<PreserveMethod, Map<NutrientKey, RetentionRow>>();
  for (const row of rows) {
    const byKey = table.get(row.method) ?? new Map<NutrientKey, RetentionRow>();
    byKey.set(row.nutrient, row);
    table.set(row.method, byKey);
  }
  return table;
}

/**
 * An entry's nutrient amounts after preserving: for a preserved entry naming a known method each
 * amount × its retention factor; anything else (fresh or stored food, no method, a method with no
 * rows, a nutrient with no row) unchanged; null stays null,
 * e.g. applyRetention({ use: 'preserved', preserveMethod: 'frozen' }, { vitamin_c_mg: 100 }, table).vitamin_c_mg → 70.
 */
export function applyRetention<A extends NutrientAmounts>(
  entry: { use: string; preserveMethod?: string | null },
  nutrients: A,
  table: RetentionTable,
): A {
  if (entry.use !== 'preserved' || !isPreserveMethod(entry.preserveMethod)) return nutrients;
  const factors = table.get(entry.preserveMethod);
  if (!factors) return nutrients;
  const out = { ...nutrients };
  for (const key of Object.keys(out) as NutrientKey[]) {
    const amount = out[key];
    const row = factors.get(key);
    if (amount != null && row) (out as NutrientAmounts)[key] = amount * row.factor;
  }
  return out;
}
