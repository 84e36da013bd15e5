import { describe, expect, it } from 'vitest';
import {
  columnKey,
  CSV_LIMITS,
  detectDelimiter,
  parseCsvBoolean,
  parseCsvNumber,
  parseHarvestCsv,
  parsePurchaseCsv,
} from '@/lib/csv-import';
import { resolveHarvestRows, resolvePurchaseRows, type HarvestResolvers } from '@/lib/csv-match';
import { importHarvestCsv } from '../support/csv-import';

const crops = new Map([
  ['potato', { id: 1, notFood: false }],
  ['butternut squash', { id: 2, notFood: false }],
  ['foxglove', { id: 3, notFood: true }],
]);
const foods = new Map([['11352', 101], ['11485', 102]]); // USDA SR28 NDB numbers of potatoes and butternut squash
const resolvers: HarvestResolvers = {
  cropByName: (name) => crops.get(name.toLowerCase()),
  foodByCode: (code) => foods.get(code),
};

describe('reading numbers', () => {
  it('reads a decimal comma in a semicolon file', () => {
    expect(parseCsvNumber('1,5', ';')).toEqual({ ok: true, value: 1.5 });
  });
  it('reads a decimal point in either file', () => {
    expect(parseCsvNumber('1.5', ',')).toEqual({ ok: true, value: 1.5 });
    expect(parseCsvNumber('0.25', ';')).toEqual({ ok: true, value: 0.25 });
    expect(parseCsvNumber('1.500', ',')).toEqual({ ok: true, value: 1.5 });
  });
  it('refuses a comma in a number of a comma file as ambiguous', () => {
    const result = parseCsvNumber('1,5', ',');
    expect(result.ok).toBe(false);
    expect(!result.ok && result.message).toMatch(/ambiguous/);
  });
  it('refuses a point followed by three digits in a semicolon file as ambiguous', () => {
    const result = parseCsvNumber('1.500', ';');
    expect(!result.ok && result.message).toMatch(/could mean 1500 or 1\.5/);
  });
  it('refuses thousands separators and spaces', () => {
    for (const [text, d] of [['1.234,5', ';'], ['1,234.5', ','], ['1 500', ';'], ['1,2,3', ';']] as const) {
      expect(parseCsvNumber(text, d).ok).toBe(false);
    }
  });
  it('refuses text that is not a number', () => {
    for (const text of ['abc', '1e3', '2kg', '--1']) expect(parseCsvNumber(text, ',').ok).toBe(false);
  });
});

describe('reading the header and cells', () => {
  it('reads column names in any case and spacing', () => {
    expect(columnKey(' Spread Months ')).toBe('spread_months');
    expect(columnKey('FOOD_CODE')).toBe('food_code');
    expect(columnKey('Food-code')).toBe('food_code');
  });
  it('detects the delimiter from the header row', () => {
    expect(detectDelimiter('date;quantity;unit;crop\n2026-01-01;1,5;kg;Potato')).toBe(';');
    expect(detectDelimiter('\uFEFFdate,quantity,unit,crop')).toBe(',');
  });
  it('reads yes and no in the usual spellings', () => {
    for (const t of ['true', 'YES', '1', ' yes ']) expect(parseCsvBoolean(t)).toBe(true);
    for (const t of ['false', 'No', '0']) expect(parseCsvBoolean(t)).toBe(false);
    expect(parseCsvBoolean('maybe')).toBeUndefined();
  });
});

describe('reading a harvest log', () => {
  it('reads a semicolon file with decimal commas', () => {
    const text = 'date;crop;quantity;unit;use;spread_months\n2026-09-20;Potato;12,5;kg;stored;6\n2026-09-21;Potato;0,75;kg;;';
    const { rows, errors, delimiter } = parseHarvestCsv(text);
    expect(errors).toEqual([]);
    expect(delimiter).toBe(';');
    expect(rows).toEqual([
      { row: 2, crop: 'Potato', entry: { date: '2026-09-20', quantity: 12.5, unit: 'kg', use: 'stored', spreadMonths: 6, trimmed: false } },
      { row: 3, crop: 'Potato', entry: { date: '2026-09-21', quantity: 0.75, unit: 'kg', use: 'fresh', spreadMonths: 1, trimmed: false } },
    ]);
  });
  it('reads a file that starts with a byte-order mark', () => {
    const { rows, errors } = parseHarvestCsv('\uFEFFdate,crop,quantity,unit\r\n2026-07-14,Potato,2,lb\r\n');
    expect(errors).toEqual([]);
    expect(rows[0]?.entry.date).toBe('2026-07-14');
  });
  it('reads UTF-8 bytes, with or without a byte-order mark', () => {
    const text = 'date,crop,quantity,unit\n2026-07-14,Pomme de terre « Ratte »,2,kg\n';
    for (const bytes of [new TextEncoder().encode(text), new Uint8Array([0xef, 0xbb, 0xbf, ...new TextEncoder().encode(text)])]) {
      const { rows, errors } = parseHarvestCsv(bytes);
      expect(errors).toEqual([]);
      expect(rows[0]?.crop).toBe('Pomme de terre « Ratte »');
    }
  });
  it('refuses bytes that are not UTF-8', () => {
    const latin1 = new Uint8Array([...new TextEncoder().encode('date,crop,quantity,unit\n2026-07-14,Pur'), 0xe9, 0x65, 0x2c, 0x31, 0x2c, 0x6b, 0x67]);
    expect(parseHarvestCsv(latin1).errors[0]?.message).toMatch(/not UTF-8/);
  });
  it('reads columns in any order and any case', () => {
    const { rows, errors } = parseHarvestCsv('UNIT,Note,Quantity, Crop ,Date,Trimmed\nKG,"first, small",3,potato,2026-06-30,yes');
    expect(errors).toEqual([]);
    expect(rows[0]).toEqual({ row: 2, crop: 'potato', entry: { date: '2026-06-30', quantity: 3, unit: 'kg', use: 'fresh', spreadMonths: 1, trimmed: true, note: 'first, small' } });
  });
  it('numbers error rows as a spreadsheet does, header being row 1', () => {
    const text = [
      'date,crop,quantity,unit',
      '2026-07-01,Potato,1,kg', // row 2
      '', // row 3, blank
      '2026-02-30,Potato,1,kg', // row 4: no such day
      '2026-07-03,"Potato",-2,kg', // row 5: negative weight
      '2026-07-04,Potato,1,stone', // row 6: unknown unit
    ].join('\n');
    const { rows, errors } = parseHarvestCsv(text);
    expect(rows.map((r) => r.row)).toEqual([2]);
    expect(errors.map((e) => [e.row, e.column])).toEqual([
      [4, 'date'],
      [5, 'quantity'],
      [6, 'unit'],
    ]);
  });
  it('reads counts and volumes in their common spellings, a bare pint as the household says', () => {
    const text = 'date,food_code,quantity,unit\n2026-07-01,01123,12,pcs\n2026-07-01,01123,6,each\n2026-07-02,01077,2,litre\n2026-07-02,01077,2,cups\n2026-07-03,01077,1,pt\n2026-07-03,11457,2,bunches';
    const units = (pint?: 'pint_us' | 'pint_imp') => parseHarvestCsv(text, pint ? { pint } : {}).rows.map((r) => r.entry.unit);
    expect(units('pint_imp')).toEqual(['piece', 'piece', 'l', 'cup', 'pint_imp', 'bunch']);
    expect(units('pint_us')[4]).toBe('pint_us');
    // Without a household's meaning a bare pint is not guessed: the row is refused on its unit.
    expect(parseHarvestCsv(text).errors).toEqual([{ row: 6, column: 'unit', message: expect.stringContaining('pint_us, pint_imp') }]);
  });
  it('counts a quoted note with line breaks as one row', () => {
    const text = 'date,crop,quantity,unit,note\n2026-07-01,Potato,1,kg,"line one\nline two"\n2026-07-02,Potato,0,kg,';
    const { errors, rows } = parseHarvestCsv(text);
    expect(rows[0]?.entry.note).toBe('line one\nline two');
    expect(errors).toEqual([{ row: 3, column: 'quantity', message: 'The weight must be more than 0.' }]);
  });
  it('refuses spreads of 0, 25 and 1,5 months', () => {
    const text = 'date;crop;quantity;unit;use;spread_months\n2026-09-20;Potato;1;kg;stored;0\n2026-09-20;Potato;1;kg;stored;25\n2026-09-20;Potato;1;kg;stored;1,5';
    expect(parseHarvestCsv(text).errors.map((e) => [e.row, e.column])).toEqual([
      [2, 'spread_months'],
      [3, 'spread_months'],
      [4, 'spread_months'],
    ]);
  });
  it('refuses a quoted decimal comma in a comma file', () => {
    const { errors } = parseHarvestCsv('date,crop,quantity,unit\n2026-07-14,Potato,"1,5",kg');
    expect(errors[0]).toMatchObject({ row: 2, column: 'quantity' });
    expect(errors[0]?.message).toMatch(/ambiguous/);
  });
  it('refuses an unquoted decimal comma that splits the row', () => {
    const { errors } = parseHarvestCsv('date,crop,quantity,unit\n2026-07-14,Potato,1,5,kg');
    expect(errors[0]).toMatchObject({ row: 2 });
    expect(errors[0]?.message).toMatch(/more cells than the header/);
  });
  it('refuses a bad yes/no, an unknown use, and a row with both crop and food_code', () => {
    const text = 'date,crop,food_code,quantity,unit,use,trimmed\n2026-07-14,Potato,,1,kg,fresh,perhaps\n2026-07-14,Potato,,1,kg,eaten,\n2026-07-14,Potato,11352,1,kg,,';
    expect(parseHarvestCsv(text).errors.map((e) => [e.row, e.column])).toEqual([
      [2, 'trimmed'],
      [3, 'use'],
      [4, 'food_code'],
    ]);
  });
  it('refuses a file without the required columns', () => {
    const { rows, errors } = parseHarvestCsv('day,crop,weight_in_kg\n2026-07-14,Potato,1');
    expect(rows).toEqual([]);
    expect(errors[0]?.row).toBe(1);
    expect(errors[0]?.message).toMatch(/missing "date", "quantity", "unit"/);
  });
  it('needs a crop or food_code column', () => {
    expect(parseHarvestCsv('date,quantity,unit\n2026-07-14,1,kg').errors[0]?.message).toMatch(/"crop" column/);
  });
  it('lists columns it does not read', () => {
    expect(parseHarvestCsv('date,crop,quantity,unit,weather\n2026-07-14,Potato,1,kg,sunny').ignoredColumns).toEqual(['weather']);
  });
  it('refuses an empty file and a file of only a header', () => {
    expect(parseHarvestCsv('').errors[0]?.message).toMatch(/empty/);
    expect(parseHarvestCsv('date,crop,quantity,unit\n').errors[0]?.message).toMatch(/no data rows/);
  });
  it('refuses a file over 5 MB', () => {
    const header = 'date,crop,quantity,unit,note\n';
    const row = `2026-07-14,Potato,1,kg,${'x'.repeat(400)}\n`;
    const big = header + row.repeat(Math.ceil(CSV_LIMITS.maxBytes / row.length) + 1);
    const { rows, errors } = parseHarvestCsv(big);
    expect(rows).toEqual([]);
    expect(errors).toEqual([{ row: 0, message: 'The file is larger than 5 MB; split it into smaller files.' }]);
  });
  it('counts the size in UTF-8 bytes, not characters', () => {
    const header = 'date,crop,quantity,unit,note\n';
    // 2 bytes per "é": about 3 MB of characters but over 5 MB of UTF-8.
    const row = `2026-07-14,Potato,1,kg,${'é'.repeat(240)}\n`;
    const rowBytes = new TextEncoder().encode(row).length;
    const text = header + row.repeat(Math.ceil(CSV_LIMITS.maxBytes / rowBytes) + 10);
    expect(text.length).toBeLessThan(CSV_LIMITS.maxBytes);
    expect(new TextEncoder().encode(text).length).toBeGreaterThan(CSV_LIMITS.maxBytes);
    expect(parseHarvestCsv(text).errors[0]?.message).toMatch(/larger than 5 MB/);
  });
  it('refuses more than 50,000 data rows', () => {
    const text = `date,crop,quantity,unit\n${'2026-07-14,P,1,g\n'.repeat(CSV_LIMITS.maxRows + 1)}`;
    const { rows, errors } = parseHarvestCsv(text);
    expect(rows).toEqual([]);
    expect(errors[0]?.message).toMatch(/50,001 data rows, more than the 50,000/);
  });
  it('accepts exactly 50,000 data rows', () => {
    const text = `date,crop,quantity,unit\n${'2026-07-14,P,1,g\n'.repeat(CSV_LIMITS.maxRows)}`;
    const { rows, errors } = parseHarvestCsv(text);
    expect(errors).toEqual([]);
    expect(rows.length).toBe(CSV_LIMITS.maxRows);
  });
  it('reports a quote that is never closed', () => {
    const { errors } = parseHarvestCsv('date,crop,quantity,unit,note\n2026-07-14,Potato,1,kg,ok\n2026-07-15,Potato,1,kg,"never closed\n');
    expect(errors[0]).toMatchObject({ row: 3 });
    expect(errors[0]?.message).toMatch(/never closed/);
  });
});

describe('matching crops and foods', () => {
  it('matches crops by name and foods by code', () => {
    const parsed = parseHarvestCsv('date,crop,food_code,quantity,unit\n2026-07-14, POTATO ,,1,kg\n2026-07-15,,11485,3,lb');
    const { inputs, errors } = resolveHarvestRows(parsed.rows, resolvers);
    expect(errors).toEqual([]);
    expect(inputs.map((i) => i.input)).toEqual([
      { date: '2026-07-14', cropId: 1, quantity: 1, unit: 'kg', use: 'fresh', spreadMonths: 1, trimmed: false },
      { date: '2026-07-15', foodId: 102, quantity: 3, unit: 'lb', use: 'fresh', spreadMonths: 1, trimmed: false },
    ]);
  });
  it('lists unknown crops once each so they can be created', () => {
    const text = 'date,crop,variety,quantity,unit\n2026-07-14,Oca,,1,kg\n2026-07-15,oca,,1,kg\n2026-07-16,Bean,Borlotto,1,kg';
    const { errors, unknownCrops } = importHarvestCsv(text, resolvers);
    expect(unknownCrops).toEqual([{ name: 'Oca' }, { name: 'Bean', variety: 'Borlotto' }]);
    expect(errors.map((e) => [e.row, e.column])).toEqual([
      [2, 'crop'],
      [3, 'crop'],
      [4, 'crop'],
    ]);
  });
  it('refuses an eaten use for a crop marked not food', () => {
    const { errors, inputs } = importHarvestCsv('date,crop,quantity,unit,use\n2026-07-14,Foxglove,1,kg,fresh\n2026-07-14,Foxglove,1,kg,seed', resolvers);
    expect(errors).toEqual([{ row: 2, column: 'use', message: 'Foxglove is marked as not food, so it can only be logged as seed, given, sold or lost.' }]);
    expect(inputs.map((i) => i.row)).toEqual([3]);
  });
  it('reports unknown food codes', () => {
    const { errors, unknownFoodCodes } = importHarvestCsv('date,food_code,quantity,unit\n2026-07-14,99999,1,kg', resolvers);
    expect(unknownFoodCodes).toEqual(['99999']);
    expect(errors[0]).toMatchObject({ row: 2, column: 'food_code' });
  });
});

describe('reading a bought-food list', () => {
  it('reads price, currency and spread with decimal commas', () => {
    const text = 'Date;Food_Code;Quantity;Unit;Price;Currency;Spread_Months;Note\n2026-03-02;11352;25;kg;31,50;eur;6;sack';
    const parsed = parsePurchaseCsv(text);
    expect(parsed.errors).toEqual([]);
    const { inputs, errors } = resolvePurchaseRows(parsed.rows, { foodByCode: (c) => foods.get(c) });
    expect(errors).toEqual([]);
    expect(inputs).toEqual([
      { row: 2, input: { date: '2026-03-02', foodId: 101, quantity: 25, unit: 'kg', price: 31.5, currency: 'EUR', spreadMonths: 6, trimmed: false, note: 'sack' } },
    ]);
  });
  it('defaults the spread to one month', () => {
    expect(parsePurchaseCsv('date,food_code,quantity,unit\n2026-03-02,11352,1,kg').rows[0]?.entry.spreadMonths).toBe(1);
  });
  it('refuses a negative price and a missing food code', () => {
    const { errors } = parsePurchaseCsv('date,food_code,quantity,unit,price\n2026-03-02,11352,1,kg,-2\n2026-03-02,,1,kg,2');
    expect(errors.map((e) => [e.row, e.column])).toEqual([
      [2, 'price'],
      [3, 'food_code'],
    ]);
  });
});
