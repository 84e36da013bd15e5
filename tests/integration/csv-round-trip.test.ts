/**
 * The export → re-import round trip through the real server and MariaDB, with generated entries
 * (fast-check, fixed seed): every entry the API accepts (201) is in the export and comes back the
 * same in a second household; everything it refuses is a 400 in the documented shape, never a 5xx.
 * The schema-level version with many more cases is tests/unit/csv-round-trip.test.ts.
 */
import fc from 'fast-check';
import { beforeAll, describe, expect, it } from 'vitest';
import { cropInput } from '@/lib/crop-schemas';
import { harvestInput, isSpreadUse, purchaseInput, USES } from '@/lib/entry-schemas';
import { WEIGHT_UNITS } from '@/lib/units';
import { allHarvests, allPurchases, foodId, makeCrop, upload } from '../support/entries';
import { messyQuantity, messyText, pastDate } from '../support/arbitraries';
import { api } from '../support/env';
import { apiAs, createHousehold, newVerifiedUser, type TestUser } from '../support/users';

const SEED = 15_2026;
let owner: TestUser;
beforeAll(async () => {
  owner = await newVerifiedUser({ name: 'Round tripper' });
});

function expectDocumentedRefusal(r: { status: number; body: any }) {
  expect(r.status).toBe(400);
  expect(r.body.error.code).toBe('invalid_input');
  expect(typeof r.body.error.message).toBe('string');
  expect(Object.keys(r.body.error.fields).length).toBeGreaterThan(0);
}

const sortKey = (e: any) => JSON.stringify([e.date, e.quantity, e.unit, e.note ?? '', e.cropName ?? e.foodCode]);

describe('CSV round trip of generated entries through the server', () => {
  it('harvests: what the API accepted comes back the same, what it refused was a 400', async () => {
    const h = await createHousehold(owner.cookie, { name: 'Generated plot' });
    const potato = await foodId('11352'); // USDA SR28, NDB 11352 "Potatoes, flesh and skin, raw"
    const names = fc.sample(messyText(4).filter((n) => cropInput.safeParse({ name: n }).success && cropInput.parse({ name: n }).name !== ''), { numRuns: 40, seed: SEED });
    const cropNames = [...new Map(names.map((n) => [cropInput.parse({ name: n }).name.toLocaleLowerCase(), n])).values()].slice(0, 3);
    const crops: { id: number; name: string }[] = [];
    for (const name of cropNames) crops.push(await makeCrop(owner.cookie, h.id, { name, category: 'root_tuber', foodId: potato }));

    const raws = fc.sample(
      fc.record({ date: pastDate, crop: fc.nat(crops.length - 1), quantity: messyQuantity, unit: fc.constantFrom(...WEIGHT_UNITS), use: fc.constantFrom(...USES), spreadMonths: fc.integer({ min: 1, max: 24 }), note: messyText() }),
      { numRuns: 40, seed: SEED },
    ).map(({ crop, spreadMonths, ...r }) => ({ ...r, cropId: crops[crop]!.id, ...(isSpreadUse(r.use) ? { spreadMonths } : {}) }));

    let accepted = 0;
    for (const raw of raws) {
      const r = await apiAs(owner.cookie, 'POST', `/api/households/${h.id}/harvests`, raw);
      if (harvestInput.safeParse(raw).success) {
        expect(r.status, JSON.stringify(raw)).toBe(201);
        accepted += 1;
      } else expectDocumentedRefusal(r);
    }
    expect(accepted).toBeGreaterThan(10);

    const csv = await api(`/api/households/${h.id}/exports/harvests.csv`, { headers: { cookie: owner.cookie } });
    expect(csv.status).toBe(200);
    const copy = await createHousehold(owner.cookie, { name: 'Generated copy' });
    const createCrops = crops.map((c) => ({ name: c.name, category: 'root_tuber', foodId: potato }));
    const imported = await upload(owner.cookie, copy.id, { kind: 'harvests', mode: 'commit', csv: csv.body, createCrops });
    expect(imported.status, JSON.stringify(imported.body)).toBe(201);

    const pick = (e: any) => ({ date: e.date, cropName: e.cropName, quantity: e.quantity, unit: e.unit, use: e.use, spreadMonths: e.spreadMonths, trimmed: e.trimmed, note: e.note, grams: e.grams });
    const before = (await allHarvests(owner.cookie, h.id)).harvests.map(pick).sort((a, b) => sortKey(a).localeCompare(sortKey(b)));
    const after = (await allHarvests(owner.cookie, copy.id)).harvests.map(pick).sort((a, b) => sortKey(a).localeCompare(sortKey(b)));
    expect(before).toHaveLength(accepted);
    expect(after).toEqual(before);
  });

  it('bought food: what the API accepted comes back the same, what it refused was a 400', async () => {
    const h = await createHousehold(owner.cookie, { name: 'Generated shop' });
    const foods = [await foodId('11352'), await foodId('09040')]; // USDA SR28 NDB 11352 potatoes, 09040 bananas
    const raws = fc.sample(
      fc.record({ date: pastDate, food: fc.nat(1), quantity: messyQuantity, unit: fc.constantFrom(...WEIGHT_UNITS), price: fc.integer({ min: 0, max: 50_000 }).map((c) => c / 100), currency: fc.constantFrom('EUR', 'GBP'), spreadMonths: fc.integer({ min: 1, max: 24 }), note: messyText() }),
      { numRuns: 40, seed: SEED + 1 },
    ).map(({ food, ...r }) => ({ ...r, foodId: foods[food] }));

    let accepted = 0;
    for (const raw of raws) {
      const r = await apiAs(owner.cookie, 'POST', `/api/households/${h.id}/purchases`, raw);
      if (purchaseInput.safeParse(raw).success) {
        expect(r.status, JSON.stringify(raw)).toBe(201);
        accepted += 1;
      } else expectDocumentedRefusal(r);
    }
    expect(accepted).toBeGreaterThan(10);

    const csv = await api(`/api/households/${h.id}/exports/purchases.csv?delimiter=semicolon`, { headers: { cookie: owner.cookie } });
    const copy = await createHousehold(owner.cookie, { name: 'Generated shop copy' });
    const imported = await upload(owner.cookie, copy.id, { kind: 'purchases', mode: 'commit', csv: csv.body });
    expect(imported.status, JSON.stringify(imported.body)).toBe(201);

    const pick = (e: any) => ({ date: e.date, foodCode: e.foodCode, quantity: e.quantity, unit: e.unit, price: e.price, currency: e.currency, spreadMonths: e.spreadMonths, note: e.note, grams: e.grams });
    const before = (await allPurchases(owner.cookie, h.id)).purchases.map(pick).sort((a, b) => sortKey(a).localeCompare(sortKey(b)));
    const after = (await allPurchases(owner.cookie, copy.id)).purchases.map(pick).sort((a, b) => sortKey(a).localeCompare(sortKey(b)));
    expect(before).toHaveLength(accepted);
    expect(after).toEqual(before);
  });
});
