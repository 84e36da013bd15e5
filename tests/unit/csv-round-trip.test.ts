/**
 * Whatever the entry schemas accept comes back unchanged through a CSV export and re-import —
 * checked with generated entries (fast-check) full of the text and numbers that broke it before:
 * a NUL in a note, a quantity of 1e-21 (issue 15). The API validates with these same schemas, so
 * "accepted" here is "accepted by the API"; tests/integration/csv-round-trip.test.ts runs a sample
 * through the server and the database.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { harvestRecord, harvestsToCsv, numberCell, purchaseRecord, purchasesToCsv, type ExportLookups } from '@/lib/csv-export';
import { cropNameKey, type CsvDelimiter } from '@/lib/csv-import';
import type { HarvestResolvers } from '@/lib/csv-match';
import { cropInput } from '@/lib/crop-schemas';
import { harvestInput, isSpreadUse, purchaseInput, USES, type HarvestInput, type PurchaseInput } from '@/lib/entry-schemas';
import { PRESERVE_METHODS } from '@/lib/retention';
import { WEIGHT_UNITS } from '@/lib/units';
import { importHarvestCsv, importPurchaseCsv } from '../support/csv-import';
import { messyQuantity, messyText, pastDate } from '../support/arbitraries';

const FOOD_CODES = ['11352', '11485', '09040']; // USDA SR28 NDB numbers (potatoes, butternut, bananas), one with a leading zero
const delimiter = fc.constantFrom<CsvDelimiter>(',', ';');

const rawHarvest = fc.record(
  {
    date: pastDate,
    cropId: fc.constantFrom(1, 2),
    quantity: messyQuantity,
    unit: fc.constantFrom(...WEIGHT_UNITS),
    use: fc.constantFrom(...USES),
    spreadMonths: fc.integer({ min: 1, max: 24 }),
    preserveMethod: fc.constantFrom(...PRESERVE_METHODS),
    trimmed: fc.boolean(),
    note: messyText(),
  },
  { requiredKeys: ['date', 'cropId', 'quantity', 'unit', 'use'] },
).map((h) => {
  // Keep the cross-field rules, so most entries get as far as the text and number rules.
  const { spreadMonths, preserveMethod, ...rest } = h;
  return { ...rest, ...(isSpreadUse(h.use) && spreadMonths ? { spreadMonths } : {}), ...(h.use === 'preserved' && preserveMethod ? { preserveMethod } : {}) };
});

const rawPurchase = fc.record(
  {
    date: pastDate,
    foodId: fc.constantFrom(1, 2, 3),
    quantity: messyQuantity,
    unit: fc.constantFrom(...WEIGHT_UNITS),
    price: fc.oneof(fc.integer({ min: 0, max: 100_000 }).map((c) => c / 100), fc.constant(0)),
    currency: fc.constantFrom('EUR', 'usd', 'GBP'),
    spreadMonths: fc.integer({ min: 1, max: 24 }),
    trimmed: fc.boolean(),
    note: messyText(),
  },
  { requiredKeys: ['date', 'foodId', 'quantity', 'unit'] },
);

/** Crop names the crop schema accepts, two that differ (the import finds crops by name and variety). */
const cropPair = fc
  .tuple(messyText(4), messyText(3), messyText(4))
  .map(([a, v, b]) => [cropInput.safeParse({ name: a, variety: v }), cropInput.safeParse({ name: b })] as const)
  .filter(([a, b]) => a.success && b.success && cropNameKey(a.data.name) !== cropNameKey(b.data.name))
  .map(([a, b]) => [
    { id: 1, name: a.data!.name, variety: a.data!.variety ?? null },
    { id: 2, name: b.data!.name, variety: null },
  ]);

function harvestLookups(crops: { id: number; name: string; variety: string | null }[]): { lookups: ExportLookups; resolvers: HarvestResolvers } {
  return {
    lookups: { crop: (id) => crops.find((c) => c.id === id), foodCode: (id) => FOOD_CODES[id - 1] },
    resolvers: {
      cropByName: (name, variety) => crops.find((c) => cropNameKey(c.name) === cropNameKey(name) && cropNameKey(c.variety ?? '') === cropNameKey(variety ?? ''))?.id,
      foodByCode: (code) => FOOD_CODES.indexOf(code) + 1 || undefined,
    },
  };
}

let accepted = { harvests: 0, purchases: 0, tried: 0 };

describe('CSV export → re-import with generated entries', () => {
  it('gives back every harvest the schema accepts, unchanged, with either delimiter', () => {
    fc.assert(
      fc.property(cropPair, fc.array(rawHarvest, { minLength: 1, maxLength: 6 }), delimiter, (crops, raws, delim) => {
        accepted.tried += raws.length;
        const entries = raws.map((r) => harvestInput.safeParse(r)).filter((r) => r.success).map((r) => r.data as HarvestInput);
        fc.pre(entries.length > 0);
        accepted.harvests += entries.length;
        const { lookups, resolvers } = harvestLookups(crops);
        const csv = harvestsToCsv(entries.map((e) => harvestRecord(e, lookups)), { delimiter: delim });
        const back = importHarvestCsv(csv, resolvers);
        expect(back.errors).toEqual([]);
        expect(back.inputs.map((i) => i.input)).toEqual(entries);
      }),
      { numRuns: 400 },
    );
    // The generator is not so wild that nothing gets through (the test would prove nothing).
    expect(accepted.harvests).toBeGreaterThan(200);
  });

  it('gives back every bought-food entry the schema accepts, unchanged, with either delimiter', () => {
    fc.assert(
      fc.property(fc.array(rawPurchase, { minLength: 1, maxLength: 6 }), delimiter, (raws, delim) => {
        const entries = raws.map((r) => purchaseInput.safeParse(r)).filter((r) => r.success).map((r) => r.data as PurchaseInput);
        fc.pre(entries.length > 0);
        accepted.purchases += entries.length;
        const csv = purchasesToCsv(entries.map((e) => purchaseRecord(e, { foodCode: (id) => FOOD_CODES[id - 1] })), { delimiter: delim });
        const back = importPurchaseCsv(csv, { foodByCode: (code) => FOOD_CODES.indexOf(code) + 1 || undefined });
        expect(back.errors).toEqual([]);
        expect(back.inputs.map((i) => i.input)).toEqual(entries);
      }),
      { numRuns: 400 },
    );
    expect(accepted.purchases).toBeGreaterThan(200);
  });
});

describe('the rules that keep the round trip whole', () => {
  it('refuses the two values the probe found: a NUL in a note and a quantity of 1e-21', () => {
    const base = { date: '2026-07-01', cropId: 1, quantity: 1, unit: 'kg' };
    expect(harvestInput.safeParse({ ...base, note: 'a\u0000b' }).error?.issues[0]?.path).toEqual(['note']);
    expect(harvestInput.safeParse({ ...base, quantity: 1e-21 }).error?.issues[0]?.path).toEqual(['quantity']);
  });

  it('prints every accepted quantity as a plain decimal that reads back as the same number', () => {
    fc.assert(
      fc.property(messyQuantity, (q) => {
        const r = harvestInput.safeParse({ date: '2026-07-01', cropId: 1, quantity: q, unit: 'g' });
        if (!r.success) return;
        const cell = numberCell(r.data.quantity);
        expect(cell).toMatch(/^\d+(\.\d{1,6})?$/);
        expect(Number(cell)).toBe(r.data.quantity);
        expect(r.data.quantity).toBeGreaterThanOrEqual(0.001);
      }),
      { numRuns: 2000 },
    );
  });
});
