import { randomUUID } from 'node:crypto';
import { beforeAll, describe, expect, it } from 'vitest';
import { allHarvests, allPurchases, foodId, makeCrop } from '../support/entries';
import { addMember, apiAs, createHousehold, newVerifiedUser, type TestHousehold, type TestUser } from '../support/users';

let owner: TestUser;
let h: TestHousehold;
let cropId: number;
let flour: number;
const harvestsUrl = () => `/api/households/${h.id}/harvests`;
const purchasesUrl = () => `/api/households/${h.id}/purchases`;
const withKey = (key: string) => ({ 'Idempotency-Key': key });

beforeAll(async () => {
  owner = await newVerifiedUser({ name: 'Ida Idem' });
  h = await createHousehold(owner.cookie, { name: 'Retry plot' });
  cropId = (await makeCrop(owner.cookie, h.id, { name: 'Potato', foodId: await foodId('11352'), category: 'root_tuber' })).id;
  flour = await foodId('20081');
});

describe('Idempotency-Key on entry creation', () => {
  it('answers a retried harvest with the first answer and stores one entry', async () => {
    const key = randomUUID();
    const body = { date: '2026-07-01', cropId, quantity: 1.5, unit: 'kg' };
    const first = await apiAs(owner.cookie, 'POST', harvestsUrl(), body, withKey(key));
    expect(first.status).toBe(201);
    expect(first.headers.get('idempotency-replayed')).toBeNull();
    const again = await apiAs(owner.cookie, 'POST', harvestsUrl(), body, withKey(key));
    expect(again.status).toBe(201);
    expect(again.body).toEqual(first.body);
    expect(again.headers.get('idempotency-replayed')).toBe('true');
    const list = await allHarvests(owner.cookie, h.id, 'from=2026-07-01&to=2026-07-01');
    expect(list.total).toBe(1);
  });

  it('stores one entry when identical requests race each other', async () => {
    const key = randomUUID();
    const body = { date: '2026-07-02', cropId, quantity: 2, unit: 'kg' };
    const answers = await Promise.all(Array.from({ length: 6 }, () => apiAs(owner.cookie, 'POST', harvestsUrl(), body, withKey(key))));
    expect(answers.map((a) => a.status)).toEqual(Array(6).fill(201));
    const ids = new Set(answers.map((a) => a.body.harvest.id));
    expect(ids.size).toBe(1);
    expect((await allHarvests(owner.cookie, h.id, 'from=2026-07-02&to=2026-07-02')).total).toBe(1);
  });

  it('stores a racing split weighing once', async () => {
    const key = randomUUID();
    const body = { date: '2026-07-03', cropId, unit: 'kg', parts: [{ quantity: 5, use: 'stored' }, { quantity: 1, use: 'fresh' }] };
    const answers = await Promise.all(Array.from({ length: 4 }, () => apiAs(owner.cookie, 'POST', harvestsUrl(), body, withKey(key))));
    expect(answers.every((a) => a.status === 201)).toBe(true);
    expect(new Set(answers.map((a) => a.body.harvests[0].splitGroup)).size).toBe(1);
    expect((await allHarvests(owner.cookie, h.id, 'from=2026-07-03&to=2026-07-03')).total).toBe(2);
  });

  it('stores one purchase for a retried or racing POST', async () => {
    const key = randomUUID();
    const body = { date: '2026-03-02', foodId: flour, quantity: 16, unit: 'kg', spreadMonths: 4, price: 21.5, currency: 'GBP' };
    const answers = await Promise.all(Array.from({ length: 4 }, () => apiAs(owner.cookie, 'POST', purchasesUrl(), body, withKey(key))));
    expect(answers.every((a) => a.status === 201)).toBe(true);
    expect(new Set(answers.map((a) => a.body.purchase.id)).size).toBe(1);
    const later = await apiAs(owner.cookie, 'POST', purchasesUrl(), body, withKey(key));
    expect(later.body.purchase.id).toBe(answers[0]!.body.purchase.id);
    expect((await allPurchases(owner.cookie, h.id)).purchases.filter((p) => p.date === '2026-03-02')).toHaveLength(1);
  });

  it('logs a staple once for a retried tap', async () => {
    const s = await apiAs(owner.cookie, 'POST', `/api/households/${h.id}/staples`, { foodId: flour, label: 'Flour sack', quantity: 25, unit: 'kg', spreadMonths: 6 });
    expect(s.status).toBe(201);
    const key = randomUUID();
    const url = `/api/households/${h.id}/staples/${s.body.staple.id}/log`;
    const [a, b] = await Promise.all([apiAs(owner.cookie, 'POST', url, { date: '2026-04-04' }, withKey(key)), apiAs(owner.cookie, 'POST', url, { date: '2026-04-04' }, withKey(key))]);
    expect(a.status).toBe(201);
    expect(b.body.purchase.id).toBe(a.body.purchase.id);
    expect((await allPurchases(owner.cookie, h.id)).purchases.filter((p) => p.date === '2026-04-04')).toHaveLength(1);
  });

  it('keeps keys apart per household', async () => {
    const other = await createHousehold(owner.cookie, { name: 'Second plot' });
    const otherCrop = (await makeCrop(owner.cookie, other.id, { name: 'Potato', foodId: await foodId('11352'), category: 'root_tuber' })).id;
    const key = randomUUID();
    const a = await apiAs(owner.cookie, 'POST', harvestsUrl(), { date: '2026-07-04', cropId, quantity: 1, unit: 'kg' }, withKey(key));
    const b = await apiAs(owner.cookie, 'POST', `/api/households/${other.id}/harvests`, { date: '2026-07-04', cropId: otherCrop, quantity: 1, unit: 'kg' }, withKey(key));
    expect(a.status).toBe(201);
    expect(b.status).toBe(201);
    expect(b.body.harvest.id).not.toBe(a.body.harvest.id);
  });

  it('does not keep a refused request, so a corrected retry with the same key is stored', async () => {
    const key = randomUUID();
    const bad = await apiAs(owner.cookie, 'POST', harvestsUrl(), { date: '2026-02-30', cropId, quantity: 1, unit: 'kg' }, withKey(key));
    expect(bad.status).toBe(400);
    const good = await apiAs(owner.cookie, 'POST', harvestsUrl(), { date: '2026-02-28', cropId, quantity: 1, unit: 'kg' }, withKey(key));
    expect(good.status).toBe(201);
    expect(good.body.harvest.date).toBe('2026-02-28');
  });

  it('answers every racing twin of a refused request with the refusal, never a 500', async () => {
    const key = randomUUID();
    const body = { date: '2026-07-06', cropId: 99_999_999, quantity: 1, unit: 'kg' };
    const answers = await Promise.all(Array.from({ length: 5 }, () => apiAs(owner.cookie, 'POST', harvestsUrl(), body, withKey(key))));
    expect(answers.map((a) => a.status)).toEqual(Array(5).fill(400));
    expect(answers.every((a) => a.body.error.fields.cropId)).toBe(true);
  });

  it('refuses a key used before for another kind of entry, and a malformed key', async () => {
    const key = randomUUID();
    expect((await apiAs(owner.cookie, 'POST', harvestsUrl(), { date: '2026-07-05', cropId, quantity: 1, unit: 'kg' }, withKey(key))).status).toBe(201);
    const reused = await apiAs(owner.cookie, 'POST', purchasesUrl(), { date: '2026-07-05', foodId: flour, quantity: 1, unit: 'kg' }, withKey(key));
    expect(reused.status).toBe(422);
    expect(reused.body.error.code).toBe('idempotency_key_reused');
    const malformed = await apiAs(owner.cookie, 'POST', harvestsUrl(), { date: '2026-07-05', cropId, quantity: 1, unit: 'kg' }, withKey('not a key!'));
    expect(malformed.status).toBe(400);
    expect(malformed.body.error.code).toBe('invalid_idempotency_key');
    const tooLong = await apiAs(owner.cookie, 'POST', harvestsUrl(), { date: '2026-07-05', cropId, quantity: 1, unit: 'kg' }, withKey('k'.repeat(101)));
    expect(tooLong.status).toBe(400);
  });

  it('refuses a key sent again with a different body (422), storing nothing more', async () => {
    const key = randomUUID();
    const first = await apiAs(owner.cookie, 'POST', harvestsUrl(), { date: '2026-07-07', cropId, quantity: 1, unit: 'kg' }, withKey(key));
    expect(first.status).toBe(201);
    const other = await apiAs(owner.cookie, 'POST', harvestsUrl(), { date: '2026-07-07', cropId, quantity: 2, unit: 'kg' }, withKey(key));
    expect(other.status).toBe(422);
    expect(other.body.error.code).toBe('idempotency_key_reused');
    expect(other.body.error.message).toMatch(/different body/);
    expect(other.body.error.fields['Idempotency-Key']).toBeDefined();
    // The same body with its fields in another order is the same request: replayed.
    const reordered = await apiAs(owner.cookie, 'POST', harvestsUrl(), { unit: 'kg', quantity: 1, cropId, date: '2026-07-07' }, withKey(key));
    expect(reordered.status).toBe(201);
    expect(reordered.headers.get('idempotency-replayed')).toBe('true');
    const list = await allHarvests(owner.cookie, h.id, 'from=2026-07-07&to=2026-07-07');
    expect(list.harvests.map((x) => x.quantity)).toEqual([1]);
  });

  it('answers racing twins with different bodies: one stored, the others refused, none lost silently', async () => {
    const key = randomUUID();
    const bodies = [1, 2, 3, 4].map((q) => ({ date: '2026-07-08', cropId, quantity: q, unit: 'kg' }));
    const answers = await Promise.all(bodies.map((b) => apiAs(owner.cookie, 'POST', harvestsUrl(), b, withKey(key))));
    expect(answers.filter((a) => a.status === 201)).toHaveLength(1);
    expect(answers.filter((a) => a.status === 422).every((a) => a.body.error.code === 'idempotency_key_reused')).toBe(true);
    expect(answers.filter((a) => a.status === 422)).toHaveLength(3);
    expect((await allHarvests(owner.cookie, h.id, 'from=2026-07-08&to=2026-07-08')).total).toBe(1);
  });

  it('keeps keys apart per member: the same key from another member is another request', async () => {
    const grower = await newVerifiedUser({ name: 'Gro Wer' });
    await addMember(owner, h.id, grower, 'grower');
    const key = randomUUID();
    const body = { date: '2026-07-09', cropId, quantity: 1, unit: 'kg' };
    const mine = await apiAs(owner.cookie, 'POST', harvestsUrl(), body, withKey(key));
    const theirs = await apiAs(grower.cookie, 'POST', harvestsUrl(), body, withKey(key));
    expect(mine.status).toBe(201);
    expect(theirs.status).toBe(201);
    expect(theirs.headers.get('idempotency-replayed')).toBeNull();
    expect(theirs.body.harvest.id).not.toBe(mine.body.harvest.id);
    // Each member's retry still replays their own answer.
    expect((await apiAs(grower.cookie, 'POST', harvestsUrl(), body, withKey(key))).body.harvest.id).toBe(theirs.body.harvest.id);
    expect((await allHarvests(owner.cookie, h.id, 'from=2026-07-09&to=2026-07-09')).total).toBe(2);
  });

  it('refuses a staple-log key reused for another staple', async () => {
    // USDA SR28 NDB 11352 potatoes and 09040 bananas (a staple per food)
    const made = await Promise.all(['11352', '09040'].map(async (code) => apiAs(owner.cookie, 'POST', `/api/households/${h.id}/staples`, { foodId: await foodId(code), quantity: 1, unit: 'kg' })));
    expect(made.map((m) => m.status)).toEqual([201, 201]);
    const key = randomUUID();
    const log = (id: number) => apiAs(owner.cookie, 'POST', `/api/households/${h.id}/staples/${id}/log`, { date: '2026-04-05' }, withKey(key));
    expect((await log(made[0]!.body.staple.id)).status).toBe(201);
    const other = await log(made[1]!.body.staple.id);
    expect(other.status).toBe(422);
    expect(other.body.error.code).toBe('idempotency_key_reused');
  });
});
