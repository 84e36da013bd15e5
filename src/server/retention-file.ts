/**
 * Reads the vitamin retention factors (reference-data/retention.csv, from the USDA Table of
 * Nutrient Retention Factors, Release 6) from disk for the share report, checked by the pure
 * parser in src/lib/retention.ts. The file ships with the app and never changes while it runs, so
 * each process reads it once; a broken file stops the report with the parser's sentence rather
 * than counting preserved food at full vitamin value.
 */
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { parseRetentionCsv, retentionTable, type RetentionTable } from '@/lib/retention';

/** Where the table lives: reference-data/retention.csv under the project root (the working directory). */
export function retentionPath(root = process.cwd()): string {
  return resolve(root, 'reference-data', 'retention.csv');
}

const cache = new Map<string, RetentionTable>();

/**
 * The retention factors by method and nutrient, read and checked once per file per process.
 * Example: `loadRetention().get('frozen')?.get('vitamin_c_mg')?.factor` → 0.7
 */
export function loadRetention(file = retentionPath()): RetentionTable {
  const cached = cache.get(file);
  if (cached) return cached;
  let text: string;
  try {
    text = readFileSync(file, 'utf8');
  } catch (error) {
    const reason = error instanceof Error ? error.message : String(error);
    throw new Error(`The retention table ${file} cannot be read (${reason}): run the server from the project root or restore reference-data/retention.csv.`);
  }
  const table = retentionTable(parseRetentionCsv(text));
  cache.set(file, table);
  return table;
}
