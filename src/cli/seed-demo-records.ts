/**
 * The demo household's records: its crops (each matched to a USDA SR28 food by code), one growing
 * season of harvests and some bought staples. All of it is INVENTED for the demo — plausible, but
 * never a test oracle. seed-demo.ts calls seedDemoRecords once, inside the transaction that creates
 * the demo household.
 *
 * The season is the latest one that has begun by the seeding date: from March to the following
 * February, keeping only entries dated up to today (no harvest from the future).
 */
import { randomUUID } from 'node:crypto';
import { and, eq, inArray } from 'drizzle-orm';
import * as schema from '@/db/schema';
import type { CropCategory } from '@/lib/crop-categories';
import type { HarvestInput, PurchaseInput, Use } from '@/lib/entry-schemas';
import type { WeightUnit } from '@/lib/units';
import type { Executor } from '@/server/entry-input';
import { harvestValues, type HarvestBasis } from '@/server/harvests';
import { purchaseValues } from '@/server/purchases';

const SR28 = 'usda-sr28';

interface DemoCrop {
  key: string;
  name: string;
  variety?: string;
  /** USDA SR28 NDB number of the food that describes the harvested form. */
  code: string | null;
  category: CropCategory;
  defaultUse?: Use;
  defaultSpreadMonths?: number;
  edibleFraction?: number;
  notFood?: boolean;
}

/** Invented catalogue; the codes name real SR28 foods. */
const CROPS: DemoCrop[] = [
  { key: 'potato', name: 'Potato', variety: 'Charlotte', code: '11352', category: 'root_tuber' }, // SR28 11352 Potatoes, flesh and skin, raw
  { key: 'corn', name: 'Flint corn for meal', variety: 'Painted Mountain', code: '20014', category: 'grain' }, // SR28 20014 Corn grain, yellow
  { key: 'beans', name: 'Dry beans', variety: 'Borlotti', code: '16019', category: 'legume' }, // SR28 16019 Beans, cranberry (roman), mature seeds, raw
  { key: 'squash', name: 'Butternut squash', code: '11485', category: 'squash', defaultSpreadMonths: 5 }, // SR28 11485 Squash, winter, butternut, raw
  { key: 'kale', name: 'Kale', variety: 'Cavolo nero', code: '11233', category: 'leafy_green' }, // SR28 11233 Kale, raw
  { key: 'apple', name: 'Apples', variety: 'orchard mix', code: '09003', category: 'fruit' }, // SR28 09003 Apples, raw, with skin
  { key: 'eggs', name: 'Laying hens — eggs', code: '01123', category: 'animal_product' }, // SR28 01123 Egg, whole, raw, fresh
  { key: 'sweetpea', name: 'Sweet peas (cut flowers)', code: null, category: 'other', notFood: true, defaultUse: 'given' },
];

interface DemoStaple {
  code: string;
  label: string;
  quantity: number;
  unit: WeightUnit;
  spreadMonths: number;
}

const STAPLES: DemoStaple[] = [
  { code: '20081', label: 'Flour, 16 kg sack', quantity: 16, unit: 'kg', spreadMonths: 4 }, // SR28 20081 Wheat flour, white, all-purpose
  { code: '04053', label: 'Olive oil, 3 l tin', quantity: 2.75, unit: 'kg', spreadMonths: 3 }, // SR28 04053 Oil, olive
  { code: '01211', label: 'Milk, weekly', quantity: 4, unit: 'kg', spreadMonths: 1 }, // SR28 01211 Milk, whole
  { code: '19335', label: 'Sugar, 5 kg', quantity: 5, unit: 'kg', spreadMonths: 5 }, // SR28 19335 Sugars, granulated
];

/** Plain, repeatable variation (so every demo looks the same). */
function jitter(seed: number): () => number {
  let s = seed >>> 0;
  return () => {
    s = (Math.imul(s, 1664525) + 1013904223) >>> 0;
    return s / 2 ** 32;
  };
}

const iso = (y: number, m: number, d: number) => new Date(Date.UTC(y, m - 1, d)).toISOString().slice(0, 10);

type DemoHarvest = { crop: string; date: string; quantity: number; unit: WeightUnit; use: Use; split?: string };

/** The season's weighings, invented: successions of greens and eggs, main crops lifted and stored. */
function seasonHarvests(year: number): DemoHarvest[] {
  const r = jitter(year);
  const out: DemoHarvest[] = [];
  const round = (x: number, step: number) => Math.round(x / step) * step;
  // Eggs: six hens, weighed weekly; fewer in the short days.
  for (let week = 0; week < 52; week++) {
    const day = new Date(Date.UTC(year, 2, 2 + week * 7));
    const month = day.getUTCMonth() + 1;
    const perWeek = month >= 4 && month <= 8 ? 1.6 : month === 3 || month === 9 ? 1.2 : 0.6;
    out.push({ crop: 'eggs', date: day.toISOString().slice(0, 10), quantity: round(perWeek * (0.85 + r() * 0.3), 0.05), unit: 'kg', use: 'fresh' });
  }
  // Kale: picked weekly from July into the winter.
  for (let week = 0; week < 34; week++) {
    const day = new Date(Date.UTC(year, 6, 4 + week * 7));
    out.push({ crop: 'kale', date: day.toISOString().slice(0, 10), quantity: round(300 + r() * 500, 10), unit: 'g', use: 'fresh' });
  }
  // Early potatoes dug as needed, then the main crop lifted and split in one weighing.
  for (const [m, d] of [[7, 6], [7, 13], [7, 20], [7, 27], [8, 3], [8, 10], [8, 17], [8, 24]] as const) {
    out.push({ crop: 'potato', date: iso(year, m, d), quantity: round(2 + r() * 2.5, 0.1), unit: 'kg', use: 'fresh' });
  }
  out.push({ crop: 'potato', date: iso(year, 9, 14), quantity: 64, unit: 'kg', use: 'stored', split: 'potato-main' });
  out.push({ crop: 'potato', date: iso(year, 9, 14), quantity: 6, unit: 'kg', use: 'fresh', split: 'potato-main' });
  out.push({ crop: 'potato', date: iso(year, 9, 14), quantity: 3.5, unit: 'kg', use: 'lost', split: 'potato-main' });
  // Squash cured and stored; a few eaten at once.
  out.push({ crop: 'squash', date: iso(year, 9, 28), quantity: 31, unit: 'kg', use: 'stored', split: 'squash' });
  out.push({ crop: 'squash', date: iso(year, 9, 28), quantity: 4.5, unit: 'kg', use: 'fresh', split: 'squash' });
  // Apples: windfalls fresh, the main pick stored, bottled and shared.
  out.push({ crop: 'apple', date: iso(year, 8, 30), quantity: 6, unit: 'kg', use: 'fresh' });
  out.push({ crop: 'apple', date: iso(year, 9, 21), quantity: 28, unit: 'kg', use: 'stored', split: 'apple-main' });
  out.push({ crop: 'apple', date: iso(year, 9, 21), quantity: 12, unit: 'kg', use: 'preserved', split: 'apple-main' });
  out.push({ crop: 'apple', date: iso(year, 9, 21), quantity: 8, unit: 'kg', use: 'given', split: 'apple-main' });
  // Dry beans threshed; the best pods kept as seed.
  out.push({ crop: 'beans', date: iso(year, 10, 5), quantity: 5.8, unit: 'kg', use: 'stored', split: 'beans' });
  out.push({ crop: 'beans', date: iso(year, 10, 5), quantity: 0.4, unit: 'kg', use: 'seed', split: 'beans' });
  // Flint corn shelled for meal.
  out.push({ crop: 'corn', date: iso(year, 10, 19), quantity: 17.5, unit: 'kg', use: 'stored', split: 'corn' });
  out.push({ crop: 'corn', date: iso(year, 10, 19), quantity: 0.6, unit: 'kg', use: 'seed', split: 'corn' });
  // Sweet peas: bunches given away (not food).
  for (const [m, d] of [[6, 21], [7, 5], [7, 19]] as const) out.push({ crop: 'sweetpea', date: iso(year, m, d), quantity: 0.8, unit: 'kg', use: 'given' });
  return out;
}

type DemoPurchase = { code: string; date: string; quantity: number; unit: WeightUnit; spreadMonths: number; price: number };

function seasonPurchases(year: number): DemoPurchase[] {
  const out: DemoPurchase[] = [];
  for (let m = 0; m < 12; m += 4) out.push({ code: '20081', date: iso(year, 3 + m, 3), quantity: 16, unit: 'kg', spreadMonths: 4, price: 21.5 });
  for (let m = 0; m < 12; m += 3) out.push({ code: '04053', date: iso(year, 3 + m, 10), quantity: 2.75, unit: 'kg', spreadMonths: 3, price: 27 });
  for (let m = 0; m < 12; m += 5) out.push({ code: '19335', date: iso(year, 3 + m, 12), quantity: 5, unit: 'kg', spreadMonths: 5, price: 4.6 });
  for (let m = 0; m < 12; m++) out.push({ code: '01145', date: iso(year, 3 + m, 1), quantity: 500, unit: 'g', spreadMonths: 1, price: 2.9 }); // SR28 01145 Butter, without salt
  for (let m = 0; m < 12; m += 3) out.push({ code: '20044', date: iso(year, 3 + m, 15), quantity: 5, unit: 'kg', spreadMonths: 3, price: 9.8 }); // SR28 20044 Rice, white, long-grain
  for (let week = 0; week < 52; week++) {
    const day = new Date(Date.UTC(year, 2, 5 + week * 7)).toISOString().slice(0, 10);
    out.push({ code: '01211', date: day, quantity: 4, unit: 'kg', spreadMonths: 1, price: 4.2 });
  }
  return out;
}

/** The season to seed: the latest one (March to February) that has begun by `today`. */
export function demoSeasonYear(today: string): number {
  const year = Number(today.slice(0, 4));
  return Number(today.slice(5, 7)) >= 3 ? year : year - 1;
}

/**
 * Adds the demo crops, a season of harvests, bought staples and the staples list to a household.
 * Skips (and says so) when the SR28 reference foods are not loaded. Returns what it wrote.
 */
export async function seedDemoRecords(
  ex: Executor,
  householdId: number,
  userId: string | null,
  options: { today?: string; log?: (line: string) => void } = {},
): Promise<{ crops: number; harvests: number; purchases: number; staples: number }> {
  const log = options.log ?? console.log;
  const today = options.today ?? new Date().toISOString().slice(0, 10);
  const year = demoSeasonYear(today);
  const codes = [...new Set([...CROPS.flatMap((c) => (c.code ? [c.code] : [])), ...STAPLES.map((s) => s.code), ...seasonPurchases(year).map((p) => p.code)])];
  const foodRows = await ex
    .select({ id: schema.foods.id, code: schema.foods.code, refusePct: schema.foods.refusePct })
    .from(schema.foods)
    .innerJoin(schema.datasets, eq(schema.datasets.id, schema.foods.datasetId))
    .where(and(eq(schema.datasets.slug, SR28), inArray(schema.foods.code, codes)));
  const food = new Map(foodRows.map((f) => [f.code, f]));
  const missing = codes.filter((c) => !food.has(c));
  if (missing.length > 0) {
    log(`• demo records skipped: SR28 foods ${missing.join(', ')} are not loaded`);
    return { crops: 0, harvests: 0, purchases: 0, staples: 0 };
  }

  const basis = new Map<string, HarvestBasis>();
  for (const c of CROPS) {
    const f = c.code ? food.get(c.code)! : null;
    const [res] = await ex.insert(schema.crops).values({
      householdId,
      name: c.name,
      variety: c.variety ?? '',
      foodId: f?.id ?? null,
      category: c.category,
      edibleFraction: c.edibleFraction ?? null,
      defaultUse: c.defaultUse ?? null,
      defaultSpreadMonths: c.defaultSpreadMonths ?? null,
      notFood: c.notFood ?? false,
    });
    basis.set(c.key, {
      cropId: res.insertId,
      cropName: c.name,
      foodId: f?.id ?? null,
      refusePct: f?.refusePct ?? null,
      edibleFraction: c.edibleFraction ?? null,
      notFood: c.notFood ?? false,
      category: c.category,
      cropDefaultSpread: c.defaultSpreadMonths ?? null,
    });
  }

  const groups = new Map<string, string>();
  const harvestRows = seasonHarvests(year)
    .filter((h) => h.date <= today)
    .map((h) => {
      const b = basis.get(h.crop)!;
      const input = { date: h.date, cropId: b.cropId!, quantity: h.quantity, unit: h.unit, use: h.use, trimmed: false, ...(h.use === 'stored' || h.use === 'preserved' ? {} : { spreadMonths: 1 }) } as HarvestInput;
      let splitGroup: string | null = null;
      if (h.split) {
        if (!groups.has(h.split)) groups.set(h.split, randomUUID());
        splitGroup = groups.get(h.split)!;
      }
      return { ...harvestValues(input, b), householdId, createdBy: userId, splitGroup };
    });
  if (harvestRows.length > 0) await ex.insert(schema.harvests).values(harvestRows);

  const purchaseRows = seasonPurchases(year)
    .filter((p) => p.date <= today)
    .map((p) => {
      const f = food.get(p.code)!;
      const input: PurchaseInput = { date: p.date, foodId: f.id, quantity: p.quantity, unit: p.unit, spreadMonths: p.spreadMonths, trimmed: false, price: p.price, currency: 'GBP' };
      return { ...purchaseValues(input, f.refusePct), householdId, createdBy: userId };
    });
  if (purchaseRows.length > 0) await ex.insert(schema.purchases).values(purchaseRows);

  await ex.insert(schema.staples).values(
    STAPLES.map((s) => ({ householdId, foodId: food.get(s.code)!.id, label: s.label, quantity: s.quantity, unit: s.unit, spreadMonths: s.spreadMonths })),
  );
  log(`• demo records: ${CROPS.length} crops, ${harvestRows.length} harvests and ${purchaseRows.length} bought-food entries of the ${year} season, ${STAPLES.length} staples`);
  return { crops: CROPS.length, harvests: harvestRows.length, purchases: purchaseRows.length, staples: STAPLES.length };
}
