/**
 * Reads the vitamin retention factors (reference-data/retention.csv, from the USDA Table of
 * Nutrient Retention Factors, Release 6) from disk for the share report, checked by the pure
 * parser in src/lib/retention.ts. The file ships with the app and never changes while it runs, so
 * each process reads it once; a broken file stops the report with the parser's sentence rather
 * than counting preserved food at full vitamin value.
 */
import { parseRetentionCsv, retentionTable, type RetentionTable } from '@/lib/retention';
import { referenceFileLoader, referenceFilePath } from './reference-file';

/** Where the table lives: reference-data/retention.csv under the project root (the working directory). */
export function retentionPath(root = process.cwd()): string {
  return referenceFilePath('retention.csv', root);
}

/**
 * The retention factors by method and nutrient, read and checked once per file per process.
 * Example: `loadRetention().get('frozen')?.get('vitamin_c_mg')?.factor` → 0.7
 */
export const loadRetention: (file?: string) => RetentionTable = referenceFileLoader({
  name: 'retention.csv',
  label: 'retention table',
  parse: (text) => retentionTable(parseRetentionCsv(text)),
});
