import { describe, expect, it } from 'vitest';
import { api } from '../support/env';

// What the search shows first for what growers pick, through GET /api/foods against the imported SR28.
const first = async (q: string): Promise<{ code: string; name: string }[]> => {
  const r = await api(`/api/foods?q=${encodeURIComponent(q)}&limit=10`);
  expect(r.status).toBe(200);
  return r.body.foods;
};

describe('GET /api/foods puts the everyday raw form first', () => {
  it('finds the ripe red tomato before the green one', async () => {
    const hits = await first('tomatoes');
    // USDA SR28, NDB 11529 "Tomatoes, red, ripe, raw, year round average"
    expect(hits[0]!.code).toBe('11529');
    const green = hits.findIndex((h) => h.code === '11527'); // USDA SR28, NDB 11527 "Tomatoes, green, raw"
    expect(green).toBeGreaterThan(0);
  });

  it('answers common garden queries with their plain raw food', async () => {
    const expected: Record<string, string> = {
      potatoes: '11352', // USDA SR28, NDB 11352 "Potatoes, flesh and skin, raw"
      carrots: '11124', // USDA SR28, NDB 11124 "Carrots, raw"
      cabbage: '11109', // USDA SR28, NDB 11109 "Cabbage, raw"
      onions: '11282', // USDA SR28, NDB 11282 "Onions, raw"
      kale: '11233', // USDA SR28, NDB 11233 "Kale, raw"
      apples: '09003', // USDA SR28, NDB 09003 "Apples, raw, with skin"
      honey: '19296', // USDA SR28, NDB 19296 "Honey"
      oats: '20038', // USDA SR28, NDB 20038 "Oats"
      beans: '16027', // USDA SR28, NDB 16027 "Beans, kidney, all types, mature seeds, raw"
    };
    for (const [q, code] of Object.entries(expected)) {
      const hits = await first(q);
      expect(hits[0]?.code, `${q}: ${hits.slice(0, 3).map((h) => h.name).join(' | ')}`).toBe(code);
    }
    // USDA SR28, NDB 11052 "Beans, snap, green, raw" within the first three for "beans"
    expect((await first('beans')).slice(0, 3).map((h) => h.code)).toContain('11052');
    // USDA SR28: 11641 and 11643, summer and winter squash "all varieties, raw", first for "squash"
    expect((await first('squash')).slice(0, 2).map((h) => h.code).sort()).toEqual(['11641', '11643']);
  });

  it('puts the plain raw food first for a singular or a word still being typed', async () => {
    // USDA SR28, NDB 11352 "Potatoes, flesh and skin, raw" and 11124 "Carrots, raw": not 11672
    // "Potato pancakes" (a dish) nor "Sweet potato, …" for "potato" or "pota"
    for (const [q, code] of [['potato', '11352'], ['pota', '11352'], ['carrot', '11124']] as const) {
      const hits = await first(q);
      expect(hits[0]?.code, `${q}: ${hits.slice(0, 3).map((h) => h.name).join(' | ')}`).toBe(code);
    }
  });

  it('finds a plural by its singular without matching longer words', async () => {
    // USDA SR28, NDB 01123 "Egg, whole, raw, fresh": "eggs" finds it, and Eggplant is not an egg
    const hits = await first('eggs');
    expect(hits[0]!.code).toBe('01123');
    expect(hits.some((h) => /^Eggplant/.test(h.name))).toBe(false);
  });

  const BRAND = /Quaker|Malt-O-Meal|General Mills|Kellogg/;

  it('leaves branded foods out unless asked, then shows them below every unbranded one', async () => {
    // USDA SR28, NDB 08402 "Cereals, Quaker, quick oats, dry" names a brand;
    // NDB 08120 "Cereals, oats, regular and quick, not fortified, dry" does not
    const plainOnly: string[] = (await api('/api/foods?q=quick%20oats&limit=40')).body.foods.map((h: { name: string }) => h.name);
    expect(plainOnly).toContain('Cereals, oats, regular and quick, not fortified, dry');
    expect(plainOnly.filter((n) => BRAND.test(n))).toEqual([]);

    const r = await api('/api/foods?q=quick%20oats&limit=40&branded=1');
    const names: string[] = r.body.foods.map((h: { name: string }) => h.name);
    const branded = names.map((n, i) => (BRAND.test(n) ? i : -1)).filter((i) => i >= 0);
    const plain = names.map((n, i) => (BRAND.test(n) ? -1 : i)).filter((i) => i >= 0);
    expect(branded.length).toBeGreaterThan(0);
    expect(Math.min(...branded)).toBeGreaterThan(Math.max(...plain));
  });

  it('shows branded foods when the words name the brand', async () => {
    const names: string[] = (await api('/api/foods?q=quaker%20oats&limit=40')).body.foods.map((h: { name: string }) => h.name);
    expect(names.some((n) => /Quaker/.test(n))).toBe(true);
  });
});
