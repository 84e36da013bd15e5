import { describe, expect, it } from 'vitest';
import { api } from '../support/env';

describe('GET /api/foods', () => {
  it('finds butternut squash, raw, first for "butternut raw"', async () => {
    const r = await api('/api/foods?q=butternut%20raw');
    expect(r.status).toBe(200);
    // USDA SR28, NDB 11485 "Squash, winter, butternut, raw"
    expect(r.body.foods[0]).toMatchObject({ code: '11485', dataset: 'usda-sr28', name: 'Squash, winter, butternut, raw', refusePct: 16 });
  });

  it('matches words in any order', async () => {
    const a = await api('/api/foods?q=raw%20butternut');
    expect(a.body.foods[0].code).toBe('11485');
  });

  it('puts raw, whole forms first', async () => {
    const r = await api('/api/foods?q=potatoes');
    // USDA SR28, NDB 11352 "Potatoes, flesh and skin, raw" is the plain raw potato
    const names: string[] = r.body.foods.map((f: { name: string }) => f.name);
    expect(names.slice(0, 5).some((n) => /raw/.test(n))).toBe(true);
    expect(names[0]).toMatch(/raw/);
    // The whole potato, not "Potatoes, raw, skin" (NDB 11362, a part on its own)
    const raw = await api('/api/foods?q=potatoes%20raw');
    expect(raw.body.foods[0].code).toBe('11352');
  });

  it('finds a food by its exact dataset code', async () => {
    const r = await api('/api/foods?code=11352');
    expect(r.status).toBe(200);
    expect(r.body.foods).toHaveLength(1);
    expect(r.body.foods[0]).toMatchObject({ code: '11352', name: 'Potatoes, flesh and skin, raw', group: 'Vegetables and Vegetable Products', refusePct: 25 });
  });

  it('answers 400 with the error shape when neither q nor code is given', async () => {
    const r = await api('/api/foods');
    expect(r.status).toBe(400);
    expect(r.body.error.code).toBe('invalid_input');
    expect(Object.keys(r.body.error.fields)).toContain('q');
  });

  it('rejects an over-long query with 400, not 500', async () => {
    const r = await api(`/api/foods?q=${'a'.repeat(101)}`);
    expect(r.status).toBe(400);
  });

  it('treats boolean-search operators in the query as plain text', async () => {
    const r = await api(`/api/foods?q=${encodeURIComponent('+potato* -"raw" (@)')}`);
    expect(r.status).toBe(200);
  });
});

describe('GET /api/foods/{id}', () => {
  it('gives every nutrient per 100 g with null for values the dataset lacks', async () => {
    const hit = (await api('/api/foods?code=11485')).body.foods[0];
    const r = await api(`/api/foods/${hit.id}`);
    expect(r.status).toBe(200);
    const byKey = Object.fromEntries(r.body.food.nutrients.map((n: { key: string }) => [n.key, n]));
    // USDA SR28, NDB 11485 "Squash, winter, butternut, raw": 45 kcal, 1.00 g protein, 21 mg vitamin C per 100 g
    expect(byKey.energy_kcal).toEqual({ key: 'energy_kcal', name: 'Energy', unit: 'kcal', amount: 45 });
    expect(byKey.protein_g.amount).toBe(1);
    expect(byKey.vitamin_c_mg.amount).toBe(21);
    expect(byKey.choline_mg.amount).toBeNull();
    expect(r.body.food.datasetInfo.release).toBe('Release 28');
  });

  it('answers 404 for an unknown id and for one that is not plain digits, like every route', async () => {
    expect((await api('/api/foods/99999999')).status).toBe(404);
    for (const bad of ['abc', '0x1', '1.0', '1e0', '01']) {
      const r = await api(`/api/foods/${bad}`);
      expect(r.status).toBe(404);
      expect(r.body.error.code).toBe('not_found');
    }
  });
});
