/**
 * Finds the reference crop (reference-data/crops.csv) a household crop's name stands for, so a new
 * crop named "Potato" or "Potatoes" takes the reference row's category instead of "Other". Words
 * are compared in their singular ("Carrot" = "Carrots"), against the row's key, its whole name and
 * its name before the first comma or bracket ("Onion" = "Onions, storage").
 */
import { singular } from './food-query';
import type { CropTableRow } from './crop-table';

type NamedRow = Pick<CropTableRow, 'key' | 'name' | 'category'>;

/** The words of a name, lower case, each in its singular. Example: `nameWords('Sweet Potatoes')` → 'sweet potato' */
export function nameWords(name: string): string {
  return (name.toLowerCase().match(/[\p{L}\p{N}]+/gu) ?? []).map((w) => singular(w) ?? w).join(' ');
}

/**
 * The reference row a crop name matches, or undefined: by key first, then whole name, then the
 * name's head; the table's order breaks ties.
 * Example: `referenceCropForName('Potato', rows)?.key` → 'potatoes'; `referenceCropForName('Dahlia', rows)` → undefined
 */
export function referenceCropForName<Row extends NamedRow>(name: string, rows: readonly Row[]): Row | undefined {
  const wanted = nameWords(name);
  if (wanted === '') return undefined;
  const byKey = rows.find((r) => nameWords(r.key.replaceAll('-', ' ')) === wanted);
  if (byKey) return byKey;
  const byName = rows.find((r) => nameWords(r.name) === wanted);
  if (byName) return byName;
  return rows.find((r) => nameWords(r.name.split(/[,(]/)[0]!) === wanted);
}
