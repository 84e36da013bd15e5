import { describe, expect, it } from 'vitest';
import { parseHarvestCsv, parsePurchaseCsv } from '@/lib/csv-import';
import { foodCodeText, pickFood, readFoodCodeRef } from '@/lib/food-code-ref';

describe('a food code with its dataset', () => {
  it('reads a bare code, a slug:code code and a dataset column', () => {
    expect(readFoodCodeRef('11352', undefined)).toEqual({ ref: { code: '11352' } });
    expect(readFoodCodeRef(' ifct2017:F006 ', undefined)).toEqual({ ref: { code: 'F006', dataset: 'ifct2017' } });
    expect(readFoodCodeRef('F006', 'ifct2017')).toEqual({ ref: { code: 'F006', dataset: 'ifct2017' } });
    expect(readFoodCodeRef('ifct2017:F006', 'ifct2017')).toEqual({ ref: { code: 'F006', dataset: 'ifct2017' } });
  });

  it('refuses a bad dataset name, a missing code and two datasets that disagree', () => {
    expect(readFoodCodeRef('ifct2017:', undefined)).toMatchObject({ column: 'food_code' });
    expect(readFoodCodeRef('IFCT 2017:F006', undefined)).toMatchObject({ column: 'food_code' });
    expect(readFoodCodeRef('F006', 'IFCT!')).toMatchObject({ column: 'dataset' });
    expect(readFoodCodeRef('usda-sr28:11352', 'ifct2017')).toEqual({ column: 'dataset', message: 'The food_code names dataset usda-sr28 but the dataset column says ifct2017; keep one.' });
  });

  it('names a food back as it was written', () => {
    expect(foodCodeText({ code: 'F006', dataset: 'ifct2017' })).toBe('ifct2017:F006');
    expect(foodCodeText({ code: '11352' })).toBe('11352');
  });

  it('picks the named dataset, else the first in the household order, else the first given', () => {
    const both = [
      { id: 1, dataset: 'usda-sr28' },
      { id: 2, dataset: 'fdc-legacy' },
    ];
    expect(pickFood(both, { code: '11352' }, ['fdc-legacy', 'usda-sr28'])?.id).toBe(2);
    expect(pickFood(both, { code: '11352' }, ['usda-sr28', 'fdc-legacy'])?.id).toBe(1);
    expect(pickFood(both, { code: '11352' }, ['ifct2017'])?.id).toBe(1);
    expect(pickFood(both, { code: '11352', dataset: 'usda-sr28' }, ['fdc-legacy'])?.id).toBe(1);
    expect(pickFood(both, { code: '11352', dataset: 'ifct2017' }, [])).toBeUndefined();
  });
});

describe('the dataset of a CSV row', () => {
  it('keeps the dataset of a food row, from its own column or the code', () => {
    const h = parseHarvestCsv('date,food_code,dataset,quantity,unit\n2026-07-14,F006,ifct2017,1,kg\n2026-07-14,usda-sr28:11352,,1,kg\n2026-07-14,11352,,1,kg');
    expect(h.errors).toEqual([]);
    expect(h.rows.map((r) => [r.foodCode, r.foodDataset])).toEqual([['F006', 'ifct2017'], ['11352', 'usda-sr28'], ['11352', undefined]]);
    const p = parsePurchaseCsv('date;food_code;dataset;quantity;unit\n2026-03-02;ifct2017:A015;;25;kg');
    expect(p.rows[0]).toMatchObject({ foodCode: 'A015', foodDataset: 'ifct2017' });
  });

  it('refuses a dataset beside a crop', () => {
    const h = parseHarvestCsv('date,crop,food_code,dataset,quantity,unit\n2026-07-14,Potato,,usda-sr28,1,kg');
    expect(h.errors).toEqual([{ row: 2, column: 'dataset', message: 'A dataset goes with a food_code; a crop names its food itself.' }]);
  });
});
