/**
 * Issue 13, "Mending mistakes", through the API: pinned crops (PUT …/crops/pins) and the chips'
 * "most used" count, the larder records Undo reads before a delete, a deleted split part rejoining
 * its weighing (`splitWith`), and the harvest list's `splitGroup` filter that keeps a weighing whole.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { addDays, todayIn } from '@/lib/months';
import { allHarvests, foodId, logHarvest, makeCrop } from '../support/entries';
import { apiAs, createHousehold, householdWithRoles, type RoleFixture } from '../support/users';

let t: RoleFixture;
let hid: number;
let today: string;
const crops: Record<string, { id: number }> = {};
const url = (path: string) => `/api/households/${hid}/${path}`;
const pinRanks = async (cookie = t.owner.cookie) =>
  Object.fromEntries(((await apiAs(cookie, 'GET', url('crops'))).body.crops as { name: string; pinRank: number | null }[]).map((c) => [c.name, c.pinRank]));

beforeAll(async () => {
  t = await householdWithRoles();
  hid = t.household.id;
  today = todayIn(t.household.timezone);
  for (const [name, code, category] of [
    ['Potato', '11352', 'root_tuber'],
    ['Kale', '11233', 'leafy_green'],
    ['Onion', '11282', 'other'],
  ] as const) {
    crops[name] = await makeCrop(t.owner.cookie, hid, { name, foodId: await foodId(code), category });
  }
});

describe('pinned crops', () => {
  it('pins crops in the order sent and unpins the rest, in one request', async () => {
    const r = await apiAs(t.grower.cookie, 'PUT', url('crops/pins'), { cropIds: [crops.Onion!.id, crops.Potato!.id] });
    expect(r.status).toBe(200);
    expect(r.body.crops).toHaveLength(3);
    expect(await pinRanks(t.viewer.cookie)).toEqual({ Onion: 1, Potato: 2, Kale: null });

    // A new order replaces the old one whole: Kale first, Onion second, Potato no longer pinned.
    expect((await apiAs(t.owner.cookie, 'PUT', url('crops/pins'), { cropIds: [crops.Kale!.id, crops.Onion!.id] })).status).toBe(200);
    expect(await pinRanks()).toEqual({ Kale: 1, Onion: 2, Potato: null });
    const one = await apiAs(t.owner.cookie, 'GET', url(`crops/${crops.Kale!.id}`));
    expect(one.body.crop.pinRank).toBe(1);
  });

  it('refuses bad lists with the field named, and changes nothing', async () => {
    for (const body of [{ cropIds: [crops.Kale!.id, crops.Kale!.id] }, { cropIds: 'all' }, {}, { cropIds: [-1] }]) {
      const r = await apiAs(t.owner.cookie, 'PUT', url('crops/pins'), body);
      expect(r.status, JSON.stringify(body)).toBe(400);
      // The field, or the item of it that is wrong ("cropIds.1").
      expect(Object.keys(r.body.error.fields).join()).toMatch(/^cropIds/);
    }
    // A crop of another household: refused, and the pins stay as they were.
    const other = await createHousehold(t.outsider.cookie, { name: 'Next door' });
    const theirs = await makeCrop(t.outsider.cookie, other.id, { name: 'Chard', category: 'leafy_green' });
    const r = await apiAs(t.owner.cookie, 'PUT', url('crops/pins'), { cropIds: [crops.Potato!.id, theirs.id] });
    expect(r.status).toBe(400);
    expect(r.body.error.fields.cropIds).toBe(`There is no crop #${theirs.id} in this household.`);
    expect(await pinRanks()).toEqual({ Kale: 1, Onion: 2, Potato: null });
  });

  it('is for owners and growers: 403 for a viewer, 404 for someone outside, 401 signed out', async () => {
    const body = { cropIds: [crops.Potato!.id] };
    expect((await apiAs(t.viewer.cookie, 'PUT', url('crops/pins'), body)).status).toBe(403);
    expect((await apiAs(t.outsider.cookie, 'PUT', url('crops/pins'), body)).status).toBe(404);
    expect((await apiAs('', 'PUT', url('crops/pins'), body)).status).toBe(401);
    expect(await pinRanks()).toEqual({ Kale: 1, Onion: 2, Potato: null });
  });

  it('unpins every crop with an empty list', async () => {
    expect((await apiAs(t.owner.cookie, 'PUT', url('crops/pins'), { cropIds: [] })).status).toBe(200);
    expect(await pinRanks()).toEqual({ Kale: null, Onion: null, Potato: null });
  });
});

describe('"most used" for the chips', () => {
  it('counts the harvests of the 365 days ending on the household’s today', async () => {
    const onion = crops.Onion!.id;
    for (const date of [today, addDays(today, -364), addDays(today, -365), addDays(today, -800)]) {
      await logHarvest(t.owner.cookie, hid, { date, cropId: onion, quantity: 1, unit: 'kg' });
    }
    const r = await apiAs(t.owner.cookie, 'GET', url(`crops/${onion}`));
    expect(r.body.crop).toMatchObject({ harvestCount: 4, harvestsLastYear: 2, lastHarvestDate: today });
  });
});

describe('what Undo needs from the API', () => {
  it('lists a lot’s larder records in the order they apply', async () => {
    const lot = await logHarvest(t.owner.cookie, hid, { date: addDays(today, -60), cropId: crops.Potato!.id, quantity: 20, unit: 'kg', use: 'stored', spreadMonths: 6 });
    const later = await apiAs(t.grower.cookie, 'POST', url('larder/outcomes'), { harvestId: lot.id, kind: 'used_up', date: addDays(today, -5) });
    expect(later.status).toBe(201);
    const first = await apiAs(t.grower.cookie, 'POST', url('larder/outcomes'), { harvestId: lot.id, kind: 'spoiled', date: addDays(today, -30), lostFraction: 0.2, note: 'slugs' });
    expect(first.status).toBe(201);
    const r = await apiAs(t.viewer.cookie, 'GET', url(`larder/outcomes?harvestId=${lot.id}`));
    expect(r.status).toBe(200);
    expect(r.body.outcomes.map((o: { kind: string; date: string; lostFraction: number | null; note: string | null }) => [o.kind, o.date, o.lostFraction, o.note])).toEqual([
      ['spoiled', addDays(today, -30), 0.2, 'slugs'],
      ['used_up', addDays(today, -5), null, null],
    ]);
    expect((await apiAs(t.owner.cookie, 'GET', url('larder/outcomes?harvestId=999999999'))).status).toBe(404);
    const missing = await apiAs(t.owner.cookie, 'GET', url('larder/outcomes'));
    expect(missing.status).toBe(400);
    expect(missing.body.error.fields).toHaveProperty('harvestId');
    expect((await apiAs(t.outsider.cookie, 'GET', url(`larder/outcomes?harvestId=${lot.id}`))).status).toBe(404);
  });

  it('brings a deleted part back into its weighing, even when the other part was left alone', async () => {
    const date = addDays(today, -3);
    const parts = await logHarvest(t.owner.cookie, hid, { date, cropId: crops.Kale!.id, unit: 'kg', parts: [{ quantity: 2, use: 'fresh' }, { quantity: 1, use: 'given' }] });
    const [fresh, given] = parts as { id: number; splitGroup: string; quantity: number; use: string }[];
    expect((await apiAs(t.owner.cookie, 'DELETE', url(`harvests/${given!.id}`))).status).toBe(204);
    // The one part left is an ordinary harvest again…
    expect((await apiAs(t.owner.cookie, 'GET', url(`harvests/${fresh!.id}`))).body.harvest.splitGroup).toBeNull();
    // …and the deleted part, logged again with splitWith, makes it one weighing of two parts again.
    const back = await apiAs(t.owner.cookie, 'POST', url('harvests'), { date, cropId: crops.Kale!.id, quantity: 1, unit: 'kg', use: 'given', splitWith: fresh!.id });
    expect(back.status).toBe(201);
    const group = back.body.harvest.splitGroup;
    expect(group).toMatch(/^[0-9a-f-]{36}$/);
    expect((await apiAs(t.owner.cookie, 'GET', url(`harvests/${fresh!.id}`))).body.harvest.splitGroup).toBe(group);

    // Three parts, one deleted and brought back: it joins the group the two others kept.
    const three = (await logHarvest(t.owner.cookie, hid, { date, cropId: crops.Kale!.id, unit: 'kg', parts: [{ quantity: 1, use: 'fresh' }, { quantity: 1, use: 'seed' }, { quantity: 1, use: 'sold' }] })) as { id: number; splitGroup: string }[];
    await apiAs(t.owner.cookie, 'DELETE', url(`harvests/${three[2]!.id}`));
    const again = await apiAs(t.owner.cookie, 'POST', url('harvests'), { date, cropId: crops.Kale!.id, quantity: 1, unit: 'kg', use: 'sold', splitWith: three[0]!.id });
    expect(again.body.harvest.splitGroup).toBe(three[0]!.splitGroup);
  });

  it('refuses to join a weighing of another crop or day, or of another household', async () => {
    const kale = await logHarvest(t.owner.cookie, hid, { date: addDays(today, -2), cropId: crops.Kale!.id, quantity: 1, unit: 'kg' });
    for (const body of [
      { date: addDays(today, -2), cropId: crops.Onion!.id, quantity: 1, unit: 'kg', splitWith: kale.id },
      { date: addDays(today, -1), cropId: crops.Kale!.id, quantity: 1, unit: 'kg', splitWith: kale.id },
      { date: addDays(today, -2), cropId: crops.Kale!.id, quantity: 1, unit: 'kg', splitWith: 999_999_999 },
    ]) {
      const r = await apiAs(t.owner.cookie, 'POST', url('harvests'), body);
      expect(r.status, JSON.stringify(body)).toBe(400);
      expect(r.body.error.fields).toHaveProperty('splitWith');
    }
    const before = (await allHarvests(t.owner.cookie, hid)).total;
    const other = await createHousehold(t.owner.cookie, { name: 'Allotment' });
    const leek = await makeCrop(t.owner.cookie, other.id, { name: 'Leek', category: 'other' });
    const r = await apiAs(t.owner.cookie, 'POST', `/api/households/${other.id}/harvests`, { date: addDays(today, -2), cropId: leek.id, quantity: 1, unit: 'kg', splitWith: kale.id });
    expect(r.status).toBe(400);
    expect((await allHarvests(t.owner.cookie, hid)).total).toBe(before);
    expect((await apiAs(t.owner.cookie, 'GET', url(`harvests/${kale.id}`))).body.harvest.splitGroup).toBeNull();
  });

  it('lists every part of the weighings asked for (the log fetches parts on other pages)', async () => {
    const date = addDays(today, -4);
    const parts = (await logHarvest(t.owner.cookie, hid, { date, cropId: crops.Potato!.id, unit: 'kg', parts: [{ quantity: 5, use: 'fresh' }, { quantity: 15, use: 'stored' }] })) as { id: number; splitGroup: string }[];
    const group = parts[0]!.splitGroup;
    const r = await apiAs(t.viewer.cookie, 'GET', url(`harvests?splitGroup=${group}&pageSize=200`));
    expect(r.status).toBe(200);
    expect(r.body.harvests.map((h: { id: number }) => h.id).sort()).toEqual(parts.map((p) => p.id).sort());
    expect(r.body.totals.grams).toBe(20_000);
    // With the page's other filters: only the parts that match them.
    expect((await apiAs(t.viewer.cookie, 'GET', url(`harvests?splitGroup=${group}&use=stored`))).body.total).toBe(1);
    const bad = await apiAs(t.viewer.cookie, 'GET', url('harvests?splitGroup=not-a-group'));
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).join()).toMatch(/^splitGroup/);
  });
});
