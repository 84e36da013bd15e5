import { describe, expect, it } from 'vitest';
import {
  cropsToCsv,
  harvestRecord,
  harvestsToCsv,
  numberCell,
  peopleToCsv,
  purchaseRecord,
  purchasesToCsv,
  toCsv,
  type ExportLookups,
} from '@/lib/csv-export';
import {
  cropNameKey,
  HARVEST_CSV_COLUMNS,
  PURCHASE_CSV_COLUMNS,
} from '@/lib/csv-import';
import { type HarvestResolvers } from '@/lib/csv-match';
import { importHarvestCsv, importPurchaseCsv } from '../support/csv-import';
import { harvestInput, purchaseInput, type HarvestInput, type PurchaseInput } from '@/lib/entry-schemas';

const crops = [
  { id: 1, name: 'Potato', variety: 'Charlotte' },
  { id: 2, name: 'Potato', variety: 'Pink Fir Apple' },
  { id: 3, name: 'Kürbis „Hokkaido“', variety: null },
  { id: 4, name: 'ジャガイモ', variety: null },
  { id: 5, name: 'Runner bean', variety: null },
];
const foods = [
  { id: 101, code: '11352' }, // USDA SR28 NDB 11352, potatoes, flesh and skin, raw
  { id: 102, code: '11485' }, // USDA SR28 NDB 11485, squash, winter, butternut, raw
  { id: 103, code: '09040' }, // USDA SR28 NDB 09040, bananas, raw (leading zero kept as text)
];

const lookups: ExportLookups = {
  crop: (id) => crops.find((c) => c.id === id),
  foodCode: (id) => foods.find((f) => f.id === id)?.code,
};
const resolvers: HarvestResolvers = {
  cropByName: (name, variety) =>
    crops.find((c) => cropNameKey(c.name) === cropNameKey(name) && cropNameKey(c.variety ?? '') === cropNameKey(variety ?? ''))?.id,
  foodByCode: (code) => foods.find((f) => f.code === code)?.id,
};

const harvests: HarvestInput[] = [
  { date: '2026-07-14', cropId: 1, quantity: 2.5, unit: 'kg', use: 'fresh', spreadMonths: 1, trimmed: false, note: 'first dig, "earlies", wet soil' },
  { date: '2026-09-20', cropId: 2, quantity: 18.25, unit: 'kg', use: 'stored', spreadMonths: 6, trimmed: false, note: 'clamp 1;\nsecond line\r\nthird line' },
  { date: '2026-10-02', cropId: 3, quantity: 7.3, unit: 'lb', use: 'stored', trimmed: false },
  { date: '2026-08-01', cropId: 4, quantity: 12, unit: 'oz', use: 'given', spreadMonths: 1, trimmed: true, note: 'für die Nachbarn — ça va' },
  { date: '2026-08-03', foodId: 102, quantity: 0.1 + 0.2, unit: 'g', use: 'preserved', spreadMonths: 9, trimmed: false, note: '=SUM(A1:A9) is not a formula' },
  { date: '2026-08-04', cropId: 5, quantity: 0.001, unit: 'kg', use: 'seed', spreadMonths: 1, trimmed: false, note: "-5 °C frost; 'quoted'" },
].map((h) => harvestInput.parse(h));

const purchases: PurchaseInput[] = [
  { date: '2026-03-02', foodId: 101, quantity: 25, unit: 'kg', price: 31.5, currency: 'EUR', spreadMonths: 6, trimmed: false, note: 'sack, "bio"' },
  { date: '2026-03-09', foodId: 103, quantity: 1.2, unit: 'lb', spreadMonths: 1, trimmed: false },
].map((p) => purchaseInput.parse(p));

describe('exporting harvests', () => {
  it('writes the importer’s columns', () => {
    const csv = harvestsToCsv([], { bom: false });
    expect(csv).toBe(`${HARVEST_CSV_COLUMNS.join(',')}\r\n`);
  });
  it('starts with a byte-order mark unless told not to', () => {
    expect(harvestsToCsv([]).startsWith('\uFEFFdate,')).toBe(true);
  });
  it('re-imports to the same harvests, comma-separated', () => {
    const csv = harvestsToCsv(harvests.map((h) => harvestRecord(h, lookups)));
    const result = importHarvestCsv(csv, resolvers);
    expect(result.errors).toEqual([]);
    expect(result.inputs.map((i) => i.input)).toEqual(harvests);
    expect(result.inputs.map((i) => i.row)).toEqual([2, 3, 4, 5, 6, 7]);
  });
  it('re-imports to the same harvests, semicolon-separated with decimal commas', () => {
    const csv = harvestsToCsv(harvests.map((h) => harvestRecord(h, lookups)), { delimiter: ';' });
    expect(csv).toContain(';18,25;kg;');
    const result = importHarvestCsv(csv, resolvers);
    expect(result.errors).toEqual([]);
    expect(result.inputs.map((i) => i.input)).toEqual(harvests);
  });
  it('guards text that a spreadsheet would run as a formula', () => {
    const csv = harvestsToCsv(harvests.map((h) => harvestRecord(h, lookups)));
    expect(csv).toContain(`"'=SUM(A1:A9) is not a formula"`);
    expect(csv).toContain(`"'-5 °C frost; 'quoted'"`);
  });
  it('writes and reads back the preserving method of a preserved harvest', () => {
    const frozen = harvestInput.parse({ date: '2026-08-10', cropId: 3, quantity: 4, unit: 'kg', use: 'preserved', spreadMonths: 6, preserveMethod: 'frozen' });
    const csv = harvestsToCsv([harvestRecord(frozen, lookups)], { bom: false });
    expect(csv.split('\r\n')[1]).toContain(',preserved,6,frozen,');
    const result = importHarvestCsv(csv, resolvers);
    expect(result.errors).toEqual([]);
    expect(result.inputs[0]!.input).toEqual(frozen);
  });
  it('refuses a preserving method on a harvest that is not preserved, on its column', () => {
    const result = importHarvestCsv('date,crop,quantity,unit,use,preserve_method\n2026-08-10,Runner bean,1,kg,fresh,canned', resolvers);
    expect(result.errors).toEqual([expect.objectContaining({ row: 2, column: 'preserve_method' })]);
  });
  it('refuses an entry whose crop is missing', () => {
    expect(() => harvestRecord({ ...harvests[0]!, cropId: 99 }, lookups)).toThrow(/crop 99, which was not found/);
  });
});

describe('exporting bought food', () => {
  it('writes the importer’s columns', () => {
    expect(purchasesToCsv([], { bom: false })).toBe(`${PURCHASE_CSV_COLUMNS.join(',')}\r\n`);
  });
  it('re-imports to the same purchases, keeping leading zeros of food codes', () => {
    for (const delimiter of [',', ';'] as const) {
      const csv = purchasesToCsv(purchases.map((p) => purchaseRecord(p, lookups)), { delimiter });
      const result = importPurchaseCsv(csv, { foodByCode: resolvers.foodByCode });
      expect(result.errors).toEqual([]);
      expect(result.inputs.map((i) => i.input)).toEqual(purchases);
    }
  });
});

describe('writing cells', () => {
  it('never writes numbers in exponent form', () => {
    expect(numberCell(1e-7)).toBe('0.0000001');
    expect(numberCell(2.5, ';')).toBe('2,5');
    expect(numberCell(undefined)).toBe('');
  });
  it('refuses numbers that are not finite', () => {
    expect(() => numberCell(Number.NaN)).toThrow(/Cannot write NaN/);
  });
  it('quotes only cells that need it', () => {
    expect(toCsv(['a', 'b', 'c'], [['plain', 'with, comma', true]], { bom: false })).toBe('a,b,c\r\nplain,"with, comma",true\r\n');
  });
});

describe('exporting crops and people', () => {
  it('writes one row per crop', () => {
    const csv = cropsToCsv(
      [
        { name: 'Potato', variety: 'Charlotte', category: 'root_tuber', foodCode: '11352', edibleFraction: null, defaultUse: 'stored', defaultSpreadMonths: 6, notFood: false },
        { name: 'Foxglove', category: 'other', notFood: true },
      ],
      { bom: false },
    );
    expect(csv.split('\r\n')).toEqual([
      'name,variety,category,food_code,edible_fraction,default_use,default_spread_months,not_food',
      'Potato,Charlotte,root_tuber,11352,,stored,6,false',
      'Foxglove,,other,,,,,true',
      '',
    ]);
  });
  it('writes one row per person', () => {
    const csv = peopleToCsv([{ name: 'Ana Núñez', sex: 'female', birthYear: 1988, activity: 'active', atHomePct: 85, presentFrom: '2026-05-01' }], { bom: false });
    expect(csv.split('\r\n')[0]).toBe(
      'name,sex,age_years,birth_year,height_cm,weight_kg,activity,condition,kcal_per_day,at_home_pct,present_from,present_to,birth_month,pregnancy_due_month,lactation_from,lactation_to,fed_from_household,diet',
    );
    expect(csv.split('\r\n')[1]).toBe('Ana Núñez,female,,1988,,,active,,,85,2026-05-01,,,,,,,');
  });
  it('writes the dated months, the feeding of a baby and the diet', () => {
    const csv = peopleToCsv([{ name: 'Mo', sex: 'male', birthMonth: '2026-09', fedFromHousehold: true, diet: 'vegetarian' }], { bom: false });
    expect(csv.split('\r\n')[1]).toBe('Mo,male,,,,,,,,,,,2026-09,,,,true,vegetarian');
  });
});

describe('exports written part by part', () => {
  it('join to the same file as one write: header and byte-order mark in the first part only', () => {
    const rows = [['2026-07-01', 1.5], ['2026-07-02', 2], ['2026-07-03', '=cmd']] as const;
    const whole = toCsv(['date', 'kg'], rows);
    const parts = toCsv(['date', 'kg'], rows.slice(0, 1)) + toCsv(['date', 'kg'], rows.slice(1), { bom: false, header: false });
    expect(parts).toBe(whole);
    expect(toCsv(['date', 'kg'], [], { bom: false, header: false })).toBe('');
  });
});
