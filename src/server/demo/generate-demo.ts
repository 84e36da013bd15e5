/**
 * The demo household, generated (INVENTED data, for the demo and the benchmarks only — never a test
 * oracle). Deterministic: given a seed, an anchor day (default today in the household's zone, its
 * one reading of the clock), the reference crop table and the energy of the foods it names, it
 * returns the same household every time — no database, no I/O: people, beds, a crop per
 * crop-table row it grows, plantings per season (veg beds and field strips rotate a step a year),
 * every weighing with its uses, eggs and honey, a few larder records and a year of bought food per
 * year sized so that what is eaten meets the need. Nothing is dated after the anchor.
 *
 * Records start with the growing year `years − 1` before the anchor's (the household's year starts
 * in March); the autumn before, only the lots put into store are logged, so the first spring eats
 * from a cellar like every later one. src/server/demo/write-demo.ts puts the result in the database.
 */
import type { CropTableRow } from '@/lib/crop-table';
import { addDays, harvestWindow, type FrostDates } from '@/lib/growing-season';
import { growingYear } from '@/lib/growing-year';
import { addMonths, isDate, listMonths, monthOf, todayIn } from '@/lib/months';
import { monthlyNeeds } from '@/lib/needs';
import { needsPerson, personInput } from '@/lib/people-schemas';
import { spreadByDay, spreadEnd } from '@/lib/spread';
import { isEatenUse, isSpreadUse } from '@/lib/uses';
import { DEMO_ANIMALS, DEMO_BEDS, DEMO_CROPS, DEMO_HOUSEHOLD, DEMO_PEOPLE, DEMO_STAPLE_LIST, type DemoBedSpec } from './demo-catalogue';
import { eggHarvests, honeyHarvests, plantingHarvests } from './demo-harvests';
import { demoPurchases } from './demo-purchases';
import { streamOf } from './demo-random';
import type { DemoBed, DemoCrop, DemoData, DemoFood, DemoHarvest, DemoOptions, DemoOutcome, DemoPlanting } from './demo-types';

export const DEFAULT_DEMO_SEED = 20261;
const MAX_YEARS = 10;
const MAX_LINES = 4;

/** Keys and names of a line of beds: the first line's are the catalogue's own. */
function lineOf(line: number): { key: string; name: string } {
  return line === 1 ? { key: '', name: '' } : { key: `~${line}`, name: ` (line ${line})` };
}

function tableRow(table: readonly CropTableRow[], key: string): CropTableRow {
  const row = table.find((r) => r.key === key);
  if (!row) throw new Error(`The demo grows "${key}", which is not a row of the reference crop table.`);
  return row;
}

function foodOf(foods: ReadonlyMap<string, DemoFood>, code: string): DemoFood & { code: string } {
  const f = foods.get(code);
  if (!f) throw new Error(`The demo needs SR28 food ${code}, which is not among the foods given to the generator.`);
  return { ...f, code };
}

/** The plan bed `bed` carries in the season `step` years after the first: rotating beds pass plans along their group. */
function planOf(beds: readonly DemoBedSpec[], bed: DemoBedSpec, step: number) {
  if (!bed.group) return bed.plan;
  const group = beds.filter((b) => b.group === bed.group);
  const i = group.indexOf(bed);
  return group[(((i + step) % group.length) + group.length) % group.length]!.plan;
}

/** A planting's harvest window: the crop's, cut to the first half of summer (early slot) or the second (late). */
function slotWindow(window: { from: string; to: string }, slot: 'main' | 'early' | 'late', year: number): { from: string; to: string } {
  const midsummer = `${year}-07-15`;
  if (slot === 'early') return { from: window.from, to: window.to < midsummer ? window.to : addDays(midsummer, -1) };
  if (slot === 'late') return { from: window.from > midsummer ? window.from : midsummer, to: window.to };
  return window;
}

/** Generates the demo household. Throws with a sentence when an option or a crop or food is missing. */
export function generateDemo(options: DemoOptions): DemoData {
  const { seed, cropTable, foods } = options;
  const anchor = options.anchor ?? todayIn(DEMO_HOUSEHOLD.timezone);
  if (!isDate(anchor)) throw new Error(`The anchor must be a date written YYYY-MM-DD, got "${anchor}".`);
  const years = options.years ?? 3;
  if (!Number.isInteger(years) || years < 1 || years > MAX_YEARS) throw new Error(`years must be a whole number from 1 to ${MAX_YEARS}, got ${years}.`);
  const areaScale = options.areaScale ?? 1;
  if (!(areaScale > 0)) throw new Error(`areaScale must be more than 0, got ${areaScale}.`);
  const frost: FrostDates = { lastSpringFrost: DEMO_HOUSEHOLD.lastSpringFrost, firstAutumnFrost: DEMO_HOUSEHOLD.firstAutumnFrost };
  const startMonth = addMonths(growingYear(monthOf(anchor), DEMO_HOUSEHOLD.yearStartMonth).from, -12 * (years - 1));
  const startDate = `${startMonth}-01`;
  const firstSeason = Number(startMonth.slice(0, 4));
  const lastSeason = Number(anchor.slice(0, 4));

  const lines = options.lines ?? 1;
  if (!Number.isInteger(lines) || lines < 1 || lines > MAX_LINES) throw new Error(`lines must be a whole number from 1 to ${MAX_LINES}, got ${lines}.`);
  const pickScale = options.pickScale ?? 1;
  if (!(pickScale > 0)) throw new Error(`pickScale must be more than 0, got ${pickScale}.`);
  const lineList = Array.from({ length: lines }, (_, i) => lineOf(i + 1));

  const bedSpecs = DEMO_BEDS.slice(0, options.bedCount ?? DEMO_BEDS.length);
  const beds: DemoBed[] = lineList.flatMap((line) => bedSpecs.map((b) => ({ key: b.key + line.key, name: b.name + line.name, areaM2: b.areaM2 * areaScale, notes: b.notes })));
  const grown = new Set(bedSpecs.flatMap((b) => (b.group ? DEMO_BEDS.filter((g) => g.group === b.group && bedSpecs.includes(g)) : [b]).flatMap((g) => g.plan.map((p) => p.crop))));
  const specs = DEMO_CROPS.filter((c) => grown.has(c.key));
  const crops: DemoCrop[] = lineList.flatMap((line) =>
    specs.map((c) => {
      const row = tableRow(cropTable, c.key);
      foodOf(foods, row.sr28Code);
      return { key: c.key + line.key, referenceKey: c.key, name: c.name, variety: c.variety + line.name, code: row.sr28Code, category: row.category, edibleFraction: row.edibleFraction, defaultSpreadMonths: c.storedSpread ?? row.defaultSpreadMonths };
    }),
  );

  // Every entry from the autumn before the records start up to the anchor.
  const plantings: DemoPlanting[] = [];
  const harvests: DemoHarvest[] = [];
  for (let season = firstSeason - 1; season <= lastSeason; season++) {
    const yearRng = streamOf(seed, `season:${season}`);
    const seasonFactor = yearRng.between(0.82, 1.12); // a wet summer, a good one
    for (const line of lineList) for (const bed of bedSpecs) {
      for (const part of planOf(bedSpecs, bed, season - firstSeason)) {
        const base = specs.find((c) => c.key === part.crop)!;
        const spec = { ...base, key: base.key + line.key, everyDays: base.everyDays && Math.max(1, Math.round(base.everyDays / pickScale)) };
        const row = tableRow(cropTable, part.crop);
        const slot = part.slot ?? 'main';
        const w = slotWindow(harvestWindow(row, season, frost), slot, season);
        const planting: DemoPlanting = {
          key: `${bed.key}${line.key}:${part.crop}:${season}`,
          crop: spec.key,
          bed: bed.key + line.key,
          areaM2: part.areaM2 * areaScale,
          seasonYear: season,
          slot,
          sowDate: row.life === 'perennial' || row.daysToHarvest === null ? null : addDays(w.from, -row.daysToHarvest),
          harvestFrom: w.from,
          harvestTo: w.to,
        };
        const rng = streamOf(seed, `planting:${planting.key}`);
        const totalKg = planting.areaM2 * row.yieldKg.typical * seasonFactor * rng.between(0.8, 1.15);
        harvests.push(...plantingHarvests({ planting, spec, row, food: foodOf(foods, row.sr28Code), totalKg, rng }));
        if (season >= firstSeason && planting.harvestFrom <= anchor) plantings.push(planting);
      }
    }
    const hives = options.hives ?? DEMO_ANIMALS.hives;
    if (hives > 0) {
      const honeyRow = tableRow(cropTable, 'honey-hive');
      const hw = harvestWindow(honeyRow, season, frost);
      harvests.push(...honeyHarvests({ window: hw, hives, perHiveKg: honeyRow.yieldKg.typical, food: foodOf(foods, DEMO_ANIMALS.honeyCode), rng: streamOf(seed, `honey:${season}`) }));
    }
  }
  const hens = options.hens ?? DEMO_ANIMALS.hens;
  if (hens > 0) {
    const eggRow = tableRow(cropTable, 'eggs-hen');
    harvests.push(...eggHarvests({ from: startDate, to: anchor, hens, perHenKg: eggRow.yieldKg.typical, food: foodOf(foods, DEMO_ANIMALS.eggCode), rng: streamOf(seed, 'eggs') }));
  }

  // Keep what is dated by the anchor and either falls in the records or is a lot still in store when they start.
  const kept = harvests
    .filter((h) => h.entry.date <= anchor && (h.entry.date >= startDate || (isSpreadUse(h.entry.use) && spreadEnd(h.entry.date, h.entry.spreadMonths) > startDate)))
    .map((h) => (h.planting && !plantings.some((p) => p.key === h.planting) ? { ...h, planting: null } : h))
    .sort((a, b) => (a.entry.date < b.entry.date ? -1 : a.entry.date > b.entry.date ? 1 : 0));

  const outcomes = larderOutcomes(kept, seed, firstSeason, lastSeason, anchor);
  const months = listMonths(startMonth, monthOf(anchor));
  const people = [...(options.people ?? DEMO_PEOPLE)];
  const needPeople = people.map((p) => needsPerson(personInput.parse(p)));
  const needKcal = new Map(months.map((m) => [m, monthlyNeeds(needPeople, m, ['energy_kcal']).energy_kcal ?? 0]));
  const homeKcal = eatenByMonth(kept.map((h) => ({ ...h.entry, kcal: (h.edibleGrams / 100) * foods.get(h.food)!.kcalPer100g, eaten: isEatenUse(h.entry.use) })), months);
  const purchases = demoPurchases({ seed, from: startMonth, anchor, needKcal, homeKcal, foods, trips: options.tripsPerBuy });
  const boughtKcal = eatenByMonth(purchases.map((p) => ({ ...p.entry, kcal: (p.edibleGrams / 100) * foods.get(p.food)!.kcalPer100g, eaten: true })), months);

  const sum = (xs: number[]) => xs.reduce((a, b) => a + b, 0);
  return {
    household: { ...DEMO_HOUSEHOLD, recordsSince: startMonth },
    people,
    beds,
    crops,
    plantings,
    harvests: kept,
    purchases,
    outcomes,
    staples: DEMO_STAPLE_LIST.filter((s) => foods.has(s.code)).map((s) => ({ ...s, unit: 'kg' as const })),
    months: months.map((m) => ({ month: m, needKcal: needKcal.get(m)!, homeKcal: homeKcal.get(m)!, boughtKcal: boughtKcal.get(m)! })),
    totals: {
      harvests: kept.length,
      purchases: purchases.length,
      harvestKg: sum(kept.map((h) => h.grams)) / 1000,
      purchaseKg: sum(purchases.map((p) => p.grams)) / 1000,
      homeKcal: sum([...homeKcal.values()]),
      boughtKcal: sum([...boughtKcal.values()]),
    },
  };
}

/** kcal eaten per month in `months`: fresh in its month, stored and bought lots evenly by day over their spread (src/lib/spread.ts). */
function eatenByMonth(entries: readonly { date: string; spreadMonths: number; kcal: number; eaten: boolean }[], months: readonly string[]): Map<string, number> {
  const out = new Map(months.map((m) => [m, 0]));
  for (const e of entries) {
    if (!e.eaten) continue;
    for (const part of spreadByDay(e.date, e.spreadMonths)) {
      const m = addMonths(monthOf(e.date), part.offset);
      if (out.has(m)) out.set(m, out.get(m)! + e.kcal * part.fraction);
    }
  }
  return out;
}

/**
 * A few larder records each season: part of the stored squash went soft before Christmas, and the
 * stored carrots were finished early, in January. Only records dated by the anchor are kept.
 */
function larderOutcomes(harvests: readonly DemoHarvest[], seed: number, firstSeason: number, lastSeason: number, anchor: string): DemoOutcome[] {
  const out: DemoOutcome[] = [];
  for (let season = firstSeason; season <= lastSeason; season++) {
    const rng = streamOf(seed, `larder:${season}`);
    const lot = (crop: string) => harvests.findIndex((h) => h.crop === crop && h.entry.use === 'stored' && h.entry.date.startsWith(String(season)));
    const squash = lot('butternut');
    const spoiledOn = `${season}-12-${String(rng.int(5, 18)).padStart(2, '0')}`;
    if (squash >= 0 && spoiledOn <= anchor && spoiledOn < spreadEnd(harvests[squash]!.entry.date, harvests[squash]!.entry.spreadMonths)) {
      out.push({ harvest: squash, kind: 'spoiled', date: spoiledOn, lostFraction: Math.round(rng.between(0.15, 0.35) * 100) / 100, note: 'soft at the stalk end after a damp autumn' });
    }
    const carrots = lot('carrots');
    const usedUpOn = `${season + 1}-01-${String(rng.int(12, 28)).padStart(2, '0')}`;
    if (carrots >= 0 && usedUpOn <= anchor && usedUpOn < spreadEnd(harvests[carrots]!.entry.date, harvests[carrots]!.entry.spreadMonths)) {
      out.push({ harvest: carrots, kind: 'used_up', date: usedUpOn, lostFraction: null, note: 'finished early: carrot soup all winter' });
    }
  }
  return out;
}
