/**
 * Reads the reference crop table (reference-data/crops.csv) from disk for the server, checked by
 * the pure parser in src/lib/crop-table.ts. The file ships with the app and never changes while it
 * runs, so each process reads it once; a broken file stops the caller with the parser's list of
 * problems rather than planning from half a table.
 */
import { parseCropTable, type CropTableRow } from '@/lib/crop-table';
import { referenceFileLoader, referenceFilePath } from './reference-file';

/** Where the table lives: reference-data/crops.csv under the project root (the working directory). */
export function cropTablePath(root = process.cwd()): string {
  return referenceFilePath('crops.csv', root);
}

/**
 * The rows of the crop table, read and checked once per file per process.
 * Example: `loadCropTable().find((r) => r.key === 'garlic')?.sr28Code` → '11215'
 */
export const loadCropTable: (file?: string) => readonly CropTableRow[] = referenceFileLoader({
  name: 'crops.csv',
  label: 'crop table',
  parse: (text) => Object.freeze(parseCropTable(text)),
});

/** One crop of the table by key, or undefined. Example: `cropByKey('potatoes')?.name` → 'Potatoes' */
export function cropByKey(key: string, file = cropTablePath()): CropTableRow | undefined {
  return loadCropTable(file).find((row) => row.key === key);
}
