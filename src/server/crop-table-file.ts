/**
 * Reads the reference crop table (reference-data/crops.csv) from disk for the server, checked by
 * the pure parser in src/lib/crop-table.ts. The file ships with the app and never changes while it
 * runs, so each process reads it once; a broken file stops the caller with the parser's list of
 * problems rather than planning from half a table.
 */
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { parseCropTable, type CropTableRow } from '@/lib/crop-table';

/** Where the table lives: reference-data/crops.csv under the project root (the working directory). */
export function cropTablePath(root = process.cwd()): string {
  return resolve(root, 'reference-data', 'crops.csv');
}

const cache = new Map<string, readonly CropTableRow[]>();

/**
 * The rows of the crop table, read and checked once per file per process.
 * Example: `loadCropTable().find((r) => r.key === 'garlic')?.sr28Code` → '11215'
 */
export function loadCropTable(file = cropTablePath()): readonly CropTableRow[] {
  const cached = cache.get(file);
  if (cached) return cached;
  let text: string;
  try {
    text = readFileSync(file, 'utf8');
  } catch (error) {
    const reason = error instanceof Error ? error.message : String(error);
    throw new Error(`The crop table ${file} cannot be read (${reason}): run the server from the project root or restore reference-data/crops.csv.`);
  }
  const rows = Object.freeze(parseCropTable(text));
  cache.set(file, rows);
  return rows;
}

/** One crop of the table by key, or undefined. Example: `cropByKey('potatoes')?.name` → 'Potatoes' */
export function cropByKey(key: string, file = cropTablePath()): CropTableRow | undefined {
  return loadCropTable(file).find((row) => row.key === key);
}
