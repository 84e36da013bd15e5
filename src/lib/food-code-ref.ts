/**
 * A reference food as a CSV row names it: a dataset code ("11352", "F006"), with its dataset when
 * the row says which — a `dataset` column or the code written "slug:code" ("ifct2017:F006"). Two
 * datasets can share a code (an FDC SR Legacy upload keeps SR28's NDB numbers): a row that names no
 * dataset takes the food of the first dataset in the household's search order that has the code.
 */
import { datasetSlug } from './dataset-order';

export interface FoodCodeRef {
  code: string;
  dataset?: string;
}

export type FoodCodeRead = { ref: FoodCodeRef } | { column: 'food_code' | 'dataset'; message: string };

/**
 * Reads a row's food_code and dataset cells (either may be blank; the code is required by the caller).
 * Example: readFoodCodeRef('ifct2017:F006', undefined) → { ref: { code: 'F006', dataset: 'ifct2017' } }
 */
export function readFoodCodeRef(codeCell: string, datasetCell: string | undefined): FoodCodeRead {
  const text = codeCell.trim();
  const colon = text.indexOf(':');
  const prefix = colon >= 0 ? text.slice(0, colon).trim() : undefined;
  const code = colon >= 0 ? text.slice(colon + 1).trim() : text;
  if (code === '') return { column: 'food_code', message: `"${text}" has no code after the dataset; write it like ifct2017:F006.` };
  if (prefix !== undefined && !datasetSlug.safeParse(prefix).success) {
    return { column: 'food_code', message: `"${prefix}" before the colon is not a dataset name; write the code like ifct2017:F006, or the dataset in its own column.` };
  }
  const column = datasetCell?.trim() || undefined;
  if (column !== undefined && !datasetSlug.safeParse(column).success) {
    return { column: 'dataset', message: `"${column}" is not a dataset name (lower-case letters, digits and dashes, like usda-sr28).` };
  }
  if (prefix !== undefined && column !== undefined && prefix !== column) {
    return { column: 'dataset', message: `The food_code names dataset ${prefix} but the dataset column says ${column}; keep one.` };
  }
  const dataset = prefix ?? column;
  return { ref: dataset === undefined ? { code } : { code, dataset } };
}

/** How a row's food is named back to the person: 'ifct2017:F006', or the bare code. */
export function foodCodeText(ref: FoodCodeRef): string {
  return ref.dataset === undefined ? ref.code : `${ref.dataset}:${ref.code}`;
}

/**
 * The food a row means among the foods with its code: the named dataset's, else the one whose
 * dataset comes first in `order` (datasets missing from it after, as given).
 * Example: pickFood([{ id: 1, dataset: 'usda-sr28' }, { id: 2, dataset: 'fdc-legacy' }], { code: '11352' }, ['fdc-legacy', 'usda-sr28'])?.id → 2
 */
export function pickFood<T extends { dataset: string }>(candidates: readonly T[], ref: FoodCodeRef, order: readonly string[]): T | undefined {
  if (ref.dataset !== undefined) return candidates.find((c) => c.dataset === ref.dataset);
  const rank = (c: T) => {
    const i = order.indexOf(c.dataset);
    return i < 0 ? order.length : i;
  };
  return [...candidates].sort((a, b) => rank(a) - rank(b))[0];
}
