/**
 * Both steps of a CSV import in one call, for unit tests of the file rules: read the rows
 * (src/lib/csv-import.ts), then match them (src/lib/csv-match.ts), errors of both in row order —
 * as src/server/entry-import.ts does with its database look-ups between the two.
 */
import { byRow, parseHarvestCsv, parsePurchaseCsv, type CsvSource } from '@/lib/csv-import';
import { resolveHarvestRows, resolvePurchaseRows, type HarvestResolution, type HarvestResolvers, type PurchaseResolution, type PurchaseResolvers } from '@/lib/csv-match';

export function importHarvestCsv(source: CsvSource, resolvers: HarvestResolvers): HarvestResolution & { ignoredColumns: string[] } {
  const parsed = parseHarvestCsv(source);
  const resolved = resolveHarvestRows(parsed.rows, resolvers);
  return { ...resolved, errors: byRow([...parsed.errors, ...resolved.errors]), ignoredColumns: parsed.ignoredColumns };
}

export function importPurchaseCsv(source: CsvSource, resolvers: PurchaseResolvers): PurchaseResolution & { ignoredColumns: string[] } {
  const parsed = parsePurchaseCsv(source);
  const resolved = resolvePurchaseRows(parsed.rows, resolvers);
  return { ...resolved, errors: byRow([...parsed.errors, ...resolved.errors]), ignoredColumns: parsed.ignoredColumns };
}
