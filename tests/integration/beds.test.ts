/**
 * Beds, plantings, the growing season and a plan turned into plantings, against the built server
 * and a real MariaDB; the roles of every route are checked in route-matrix.test.ts.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { foodId, logHarvest, makeCrop } from '../support/entries';
import { apiAs, householdWithRoles, type RoleFixture } from '../support/users';

let f: RoleFixture;
let base: string;

beforeAll(async () => {
  f = await householdWithRoles({ name: 'Bed plot', timezone: 'Europe/London' });
  base = `/api/households/${f.household.id}`;
});

describe('beds', () => {
  it('a grower adds, renames and deletes a bed; a viewer only reads', async () => {
    const made = await apiAs(f.grower.cookie, 'POST', `${base}/beds`, { name: 'North bed', area: 12.5, notes: 'heavy clay' });
    expect(made.status).toBe(201);
    expect(made.body.bed).toMatchObject({ name: 'North bed', areaM2: 12.5, area: 12.5, areaUnit: 'm2', notes: 'heavy clay' });
    const id = made.body.bed.id;

    const twin = await apiAs(f.owner.cookie, 'POST', `${base}/beds`, { name: 'North bed', area: 3 });
    expect(twin.status).toBe(409);
    expect(twin.body.error.fields.name).toMatch(/already has a bed/);

    const seen = await apiAs(f.viewer.cookie, 'GET', `${base}/beds`);
    expect(seen.body.beds.map((b: any) => b.name)).toContain('North bed');
    expect((await apiAs(f.viewer.cookie, 'PATCH', `${base}/beds/${id}`, { name: 'X' })).status).toBe(403);

    const renamed = await apiAs(f.grower.cookie, 'PATCH', `${base}/beds/${id}`, { name: 'North bed (old)', notes: null });
    expect(renamed.status).toBe(200);
    expect(renamed.body.bed).toMatchObject({ name: 'North bed (old)', notes: null, areaM2: 12.5 });

    const bad = await apiAs(f.grower.cookie, 'POST', `${base}/beds`, { name: 'Y', area: -1 });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.area).toBe('The area must be more than 0.');

    expect((await apiAs(f.grower.cookie, 'DELETE', `${base}/beds/${id}`)).status).toBe(204);
    expect((await apiAs(f.grower.cookie, 'GET', `${base}/beds/${id}`)).status).toBe(404);
  });

  it('a US household gives areas in ft² and they are stored in m²', async () => {
    const us = await householdWithRoles({ name: 'Acre plot', units: 'us' });
    const r = await apiAs(us.owner.cookie, 'POST', `/api/households/${us.household.id}/beds`, { name: 'Long row', area: 100 });
    expect(r.status).toBe(201);
    // 1 ft² = 0.09290304 m² exactly (1 ft = 0.3048 m, International Yard and Pound Agreement, 1959)
    expect(r.body.bed.areaM2).toBeCloseTo(9.290304, 9);
    expect(r.body.bed.area).toBeCloseTo(100, 9);
    expect(r.body.bed.areaUnit).toBe('ft2');
    const metric = await apiAs(us.owner.cookie, 'POST', `/api/households/${us.household.id}/beds`, { name: 'Metric row', area: 2, areaUnit: 'm2' });
    expect(metric.body.bed.areaM2).toBe(2);
  });

  it('keeps another household’s bed out of reach', async () => {
    const other = await householdWithRoles({ name: 'Other bed plot' });
    const theirs = await apiAs(other.owner.cookie, 'POST', `/api/households/${other.household.id}/beds`, { name: 'Theirs', area: 1 });
    expect((await apiAs(f.owner.cookie, 'GET', `${base}/beds/${theirs.body.bed.id}`)).status).toBe(404);
    expect((await apiAs(f.owner.cookie, 'DELETE', `${base}/beds/${theirs.body.bed.id}`)).status).toBe(404);
    const p = await apiAs(f.owner.cookie, 'POST', `${base}/plantings`, { referenceKey: 'garlic', bedId: theirs.body.bed.id, area: 1, seasonYear: 2027 });
    expect(p.status).toBe(400);
    expect(p.body.error.fields.bedId).toMatch(/no such bed/);
  });
});

describe('growing season', () => {
  it('defaults from the time zone’s hemisphere and takes the household’s own dates', async () => {
    const first = await apiAs(f.viewer.cookie, 'GET', `${base}/season`);
    expect(first.status).toBe(200);
    // common practice (no published source): northern last spring frost ~1 May, first autumn frost ~1 October
    expect(first.body.season).toMatchObject({ lastSpringFrost: '05-01', firstAutumnFrost: '10-01', hemisphere: 'northern' });
    expect(first.body.stored).toEqual({ lastSpringFrost: null, firstAutumnFrost: null });

    const south = await householdWithRoles({ name: 'Southern plot', timezone: 'Australia/Hobart' });
    const s = await apiAs(south.grower.cookie, 'GET', `/api/households/${south.household.id}/season`);
    expect(s.body.season).toMatchObject({ lastSpringFrost: '11-01', firstAutumnFrost: '04-01', hemisphere: 'southern' });

    const set = await apiAs(south.grower.cookie, 'PUT', `/api/households/${south.household.id}/season`, { lastSpringFrost: '10-15', firstAutumnFrost: null });
    expect(set.status).toBe(200);
    expect(set.body.season).toMatchObject({ lastSpringFrost: '10-15', firstAutumnFrost: '04-01' });
    const again = await apiAs(south.viewer.cookie, 'GET', `/api/households/${south.household.id}/season`);
    expect(again.body.stored).toEqual({ lastSpringFrost: '10-15', firstAutumnFrost: null });

    const bad = await apiAs(south.owner.cookie, 'PUT', `/api/households/${south.household.id}/season`, { lastSpringFrost: '02-30', firstAutumnFrost: null });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.lastSpringFrost).toMatch(/MM-DD/);
    expect((await apiAs(south.viewer.cookie, 'PUT', `/api/households/${south.household.id}/season`, { lastSpringFrost: null, firstAutumnFrost: null })).status).toBe(403);
  });
});

describe('plantings', () => {
  it('creates, lists by season, changes and deletes a planting, filling the harvest window from the reference row', async () => {
    const bed = (await apiAs(f.grower.cookie, 'POST', `${base}/beds`, { name: 'Garlic bed', area: 6 })).body.bed;
    const made = await apiAs(f.grower.cookie, 'POST', `${base}/plantings`, { referenceKey: 'garlic', bedId: bed.id, area: 3, seasonYear: 2027, sowDate: '2026-10-20', slot: 'main' });
    expect(made.status).toBe(201);
    const p = made.body.planting;
    // reference-data/crops.csv, garlic: 10 to 14 weeks after the last spring frost (default 1 May): 1 May 2027 + 70 and + 98 days
    expect(p).toMatchObject({ cropName: 'Garlic', referenceKey: 'garlic', bedName: 'Garlic bed', areaM2: 3, seasonYear: 2027, slot: 'main', sowDate: '2026-10-20', harvestFrom: '2027-07-10', harvestTo: '2027-08-07', fromPlan: false });

    // The same reference crop again finds the crop it added, not a second one.
    const again = await apiAs(f.grower.cookie, 'POST', `${base}/plantings`, { referenceKey: 'garlic', area: 1, seasonYear: 2027, slot: 'late', harvestFrom: '2027-09-01', harvestTo: '2027-09-20' });
    expect(again.status).toBe(201);
    expect(again.body.planting).toMatchObject({ cropId: p.cropId, bedId: null, harvestFrom: '2027-09-01', harvestTo: '2027-09-20' });

    const list = await apiAs(f.viewer.cookie, 'GET', `${base}/plantings?year=2027`);
    expect(list.status).toBe(200);
    expect(list.body.year).toBe(2027);
    expect(list.body.plantings.map((x: any) => x.id)).toEqual([p.id, again.body.planting.id]);
    expect((await apiAs(f.viewer.cookie, 'GET', `${base}/plantings?year=2026`)).body.plantings).toEqual([]);
    expect((await apiAs(f.viewer.cookie, 'GET', `${base}/plantings?year=two`)).status).toBe(400);

    const moved = await apiAs(f.grower.cookie, 'PATCH', `${base}/plantings/${again.body.planting.id}`, { bedId: bed.id, area: 2 });
    expect(moved.status).toBe(200);
    expect(moved.body.planting).toMatchObject({ bedId: bed.id, areaM2: 2, slot: 'late' });
    const backwards = await apiAs(f.grower.cookie, 'PATCH', `${base}/plantings/${again.body.planting.id}`, { harvestTo: '2027-08-01' });
    expect(backwards.status).toBe(400);
    expect(backwards.body.error.fields.harvestTo).toMatch(/ends before it starts/);

    // Deleting the bed leaves its plantings without one.
    expect((await apiAs(f.grower.cookie, 'DELETE', `${base}/beds/${bed.id}`)).status).toBe(204);
    expect((await apiAs(f.grower.cookie, 'GET', `${base}/plantings/${p.id}`)).body.planting.bedId).toBeNull();

    expect((await apiAs(f.viewer.cookie, 'DELETE', `${base}/plantings/${p.id}`)).status).toBe(403);
    expect((await apiAs(f.grower.cookie, 'DELETE', `${base}/plantings/${p.id}`)).status).toBe(204);
    expect((await apiAs(f.grower.cookie, 'GET', `${base}/plantings/${p.id}`)).status).toBe(404);
  });

  it('refuses an unknown reference crop, an animal line and another household’s crop', async () => {
    const unknown = await apiAs(f.grower.cookie, 'POST', `${base}/plantings`, { referenceKey: 'moon-melon', area: 1, seasonYear: 2027 });
    expect(unknown.status).toBe(400);
    expect(unknown.body.error.fields.referenceKey).toMatch(/no reference crop moon-melon/);
    // reference-data/crops.csv, honey-hive: a yield per hive, not per m²
    const hive = await apiAs(f.grower.cookie, 'POST', `${base}/plantings`, { referenceKey: 'honey-hive', area: 1, seasonYear: 2027 });
    expect(hive.status).toBe(400);
    expect(hive.body.error.fields.referenceKey).toMatch(/per hive, not per m² of bed/);
    const other = await householdWithRoles({ name: 'Crop elsewhere' });
    const theirs = await makeCrop(other.owner.cookie, other.household.id, { name: 'Leek', category: 'other' });
    const r = await apiAs(f.grower.cookie, 'POST', `${base}/plantings`, { cropId: theirs.id, area: 1, seasonYear: 2027 });
    expect(r.status).toBe(400);
    expect(r.body.error.fields.cropId).toMatch(/no such crop/);
  });

  it('a harvest names its planting, giving the own measured yield beside the reference yield', async () => {
    const potato = await foodId('11352'); // USDA SR28, NDB 11352 "Potatoes, flesh and skin, raw"
    const crop = await makeCrop(f.owner.cookie, f.household.id, { name: 'Potato', variety: 'Pink Fir', foodId: potato, category: 'root_tuber' });
    const kale = await makeCrop(f.owner.cookie, f.household.id, { name: 'Kale', category: 'leafy_green' });
    const planting = (await apiAs(f.grower.cookie, 'POST', `${base}/plantings`, { cropId: crop.id, area: 4, seasonYear: 2026 })).body.planting;
    // A crop without a reference row gets no harvest window.
    expect(planting).toMatchObject({ harvestFrom: null, harvestTo: null, referenceKey: null });

    await logHarvest(f.grower.cookie, f.household.id, { date: '2026-08-01', cropId: crop.id, quantity: 6, unit: 'kg', plantingId: planting.id });
    await logHarvest(f.grower.cookie, f.household.id, { date: '2026-08-20', cropId: crop.id, quantity: 4, unit: 'kg', use: 'stored', plantingId: planting.id });

    const wrongCrop = await apiAs(f.grower.cookie, 'POST', `${base}/harvests`, { date: '2026-08-01', cropId: kale.id, quantity: 1, unit: 'kg', plantingId: planting.id });
    expect(wrongCrop.status).toBe(422);
    expect(wrongCrop.body.error.fields.plantingId).toMatch(/another crop/);
    const noSuch = await apiAs(f.grower.cookie, 'POST', `${base}/harvests`, { date: '2026-08-01', cropId: crop.id, quantity: 1, unit: 'kg', plantingId: 999999999 });
    expect(noSuch.status).toBe(422);

    // A harvest logged without a planting can name it later; a wrong one is refused on PATCH too.
    const loose = await logHarvest(f.grower.cookie, f.household.id, { date: '2026-09-01', cropId: crop.id, quantity: 2, unit: 'kg' });
    expect((await apiAs(f.grower.cookie, 'PATCH', `${base}/harvests/${loose.id}`, { plantingId: planting.id })).status).toBe(200);
    expect((await apiAs(f.grower.cookie, 'PATCH', `${base}/harvests/${loose.id}`, { cropId: kale.id })).status).toBe(422);

    const list = await apiAs(f.viewer.cookie, 'GET', `${base}/plantings?year=2026`);
    expect(list.body.plantings.find((x: any) => x.id === planting.id).harvestedKg).toBeCloseTo(12, 9);
    const y = list.body.yields.find((x: any) => x.cropId === crop.id);
    // worked by hand: (6 + 4 + 2) kg from 4 m² = 3 kg/m²
    expect(y).toMatchObject({ cropName: 'Potato (Pink Fir)', measuredAreaM2: 4, referenceKgPerM2: null });
    expect(y.ownKgPerM2).toBeCloseTo(3, 9);
    expect(y.harvestedKg).toBeCloseTo(12, 9);
  });
});

describe('a plan turned into plantings', () => {
  it('adds the missing crops, matched to their SR28 food, and one planting each, in one go', async () => {
    const h = await householdWithRoles({ name: 'Plan plot' });
    const hb = `/api/households/${h.household.id}`;
    // An existing crop of the same name without a link gets the link instead of a twin.
    const kale = await makeCrop(h.owner.cookie, h.household.id, { name: 'Kale', category: 'leafy_green' });
    const r = await apiAs(h.grower.cookie, 'POST', `${hb}/plantings/from-plan`, { year: 2027, crops: [{ cropKey: 'potatoes', areaM2: 12 }, { cropKey: 'kale', areaM2: 2.5 }] });
    expect(r.status).toBe(201);
    expect(r.body.plantings).toHaveLength(2);
    const [pot, kal] = r.body.plantings;
    // reference-data/crops.csv, potatoes: 8 weeks after the last spring frost to the first autumn frost (defaults 1 May, 1 October)
    expect(pot).toMatchObject({ cropName: 'Potatoes', referenceKey: 'potatoes', bedId: null, areaM2: 12, seasonYear: 2027, fromPlan: true, harvestFrom: '2027-06-26', harvestTo: '2027-10-01' });
    expect(kal).toMatchObject({ cropId: kale.id, referenceKey: 'kale', areaM2: 2.5, fromPlan: true });

    const crops = (await apiAs(h.owner.cookie, 'GET', `${hb}/crops`)).body.crops;
    const potatoes = crops.find((c: any) => c.name === 'Potatoes');
    // USDA SR28, NDB 11352 "Potatoes, flesh and skin, raw" is the row's sr28_code
    expect(potatoes.foodId).toBe(await foodId('11352'));
    expect(potatoes.category).toBe('root_tuber');
    expect(crops.filter((c: any) => c.name === 'Kale')).toHaveLength(1);

    // One unknown key refuses the whole plan: nothing is added.
    const bad = await apiAs(h.grower.cookie, 'POST', `${hb}/plantings/from-plan`, { year: 2028, crops: [{ cropKey: 'garlic', areaM2: 1 }, { cropKey: 'moon-melon', areaM2: 1 }] });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields['crops.1.cropKey']).toMatch(/moon-melon/);
    expect((await apiAs(h.grower.cookie, 'GET', `${hb}/plantings?year=2028`)).body.plantings).toEqual([]);
    expect((await apiAs(h.owner.cookie, 'GET', `${hb}/crops`)).body.crops.some((c: any) => c.name === 'Garlic')).toBe(false);
    expect((await apiAs(h.viewer.cookie, 'POST', `${hb}/plantings/from-plan`, { year: 2027, crops: [{ cropKey: 'garlic', areaM2: 1 }] })).status).toBe(403);
  });
});

describe('deleting a household', () => {
  it('takes its beds, plantings and the harvests naming them along', async () => {
    const h = await householdWithRoles({ name: 'Short-lived plot' });
    const hb = `/api/households/${h.household.id}`;
    const bed = (await apiAs(h.owner.cookie, 'POST', `${hb}/beds`, { name: 'Only bed', area: 2 })).body.bed;
    const p = (await apiAs(h.owner.cookie, 'POST', `${hb}/plantings`, { referenceKey: 'garlic', bedId: bed.id, area: 2, seasonYear: 2026 })).body.planting;
    await logHarvest(h.owner.cookie, h.household.id, { date: '2026-07-20', cropId: p.cropId, quantity: 1, unit: 'kg', plantingId: p.id });
    expect((await apiAs(h.owner.cookie, 'DELETE', hb)).status).toBe(204);
    expect((await apiAs(h.owner.cookie, 'GET', `${hb}/beds`)).status).toBe(404);
  });
});
