/**
 * The demo's weighings (INVENTED): for one planting in one season, the pickings through the crop's
 * harvest window (src/lib/growing-season.ts, from the household's frost dates), or the early
 * pickings and one main lift split between uses; then the hens' weekly eggs and the hive's honey.
 * Totals follow the reference crop table's typical yield per m² (or per hen, per hive), varied by
 * seeded noise per season and per planting. Pure: no clock, no database.
 */
import { edibleGrams } from '@/lib/edible';
import { addDays } from '@/lib/growing-season';
import type { CropTableRow } from '@/lib/crop-table';
import { daysBetween } from '@/lib/months';
import { isSpreadUse, type Use } from '@/lib/uses';
import { toGrams } from '@/lib/units';
import type { PreserveMethod } from '@/lib/retention';
import { DEMO_ANIMALS, type DemoCropSpec } from './demo-catalogue';
import type { Rng } from './demo-random';
import type { DemoFood, DemoHarvest, DemoPlanting } from './demo-types';

/** What one weighing needs besides its date and weight. */
interface Source {
  crop: string | null;
  food: DemoFood & { code: string };
  edibleFraction: number | null;
  planting: string | null;
}

/** Rounds a weight to what a kitchen scale shows: 10 g under a kilo, 50 g above. */
function weighed(kg: number): { quantity: number; unit: 'kg' | 'g' } {
  if (kg < 1) return { quantity: Math.max(10, Math.round((kg * 1000) / 10) * 10), unit: 'g' };
  return { quantity: Math.round(kg * 20) / 20, unit: 'kg' };
}

function entry(src: Source, date: string, kg: number, use: Use, opts: { spread?: number; method?: PreserveMethod; split?: string | null; note?: string } = {}): DemoHarvest {
  const w = weighed(kg);
  const grams = toGrams(w.quantity, w.unit);
  return {
    crop: src.crop,
    food: src.food.code,
    planting: src.planting,
    split: opts.split ?? null,
    entry: {
      date,
      quantity: w.quantity,
      unit: w.unit,
      use,
      spreadMonths: isSpreadUse(use) ? (opts.spread ?? 1) : 1,
      ...(use === 'preserved' && opts.method ? { preserveMethod: opts.method } : {}),
      trimmed: false,
      ...(opts.note ? { note: opts.note } : {}),
    },
    grams,
    edibleGrams: edibleGrams(grams, { refusePercent: src.food.refusePct, edibleFraction: src.edibleFraction }),
  };
}

/** Days from `from` to `to` every `every` days (± a day), never past `to`. */
function pickDays(from: string, to: string, every: number, rng: Rng): string[] {
  const span = daysBetween(from, to);
  const out: string[] = [];
  for (let d = 0; d <= span; d += every) {
    const day = Math.min(span, Math.max(0, d + rng.int(-1, 1)));
    const date = addDays(from, day);
    if (out[out.length - 1] !== date) out.push(date);
  }
  return out;
}

/** Weights of n pickings rising to a peak and falling off, noisy, adding up to 1. */
function humpShares(n: number, rng: Rng): number[] {
  const raw = Array.from({ length: n }, (_, i) => (0.25 + Math.sin((Math.PI * (i + 0.5)) / n)) * rng.between(0.7, 1.3));
  const sum = raw.reduce((a, b) => a + b, 0);
  return raw.map((x) => x / sum);
}

export interface PlantingHarvestInput {
  planting: DemoPlanting;
  spec: DemoCropSpec;
  row: CropTableRow;
  food: DemoFood & { code: string };
  /** kg harvested from the planting this season. */
  totalKg: number;
  rng: Rng;
}

/** One planting's season of weighings. Split keys are unique per planting. */
export function plantingHarvests({ planting, spec, row, food, totalKg, rng }: PlantingHarvestInput): DemoHarvest[] {
  const src: Source = { crop: spec.key, food, edibleFraction: row.edibleFraction, planting: planting.key };
  const storedSpread = spec.storedSpread ?? row.defaultSpreadMonths;
  const out: DemoHarvest[] = [];
  const from = planting.harvestFrom;
  const to = planting.harvestTo;
  if (spec.pattern === 'pick') {
    const days = pickDays(from, to, spec.everyDays ?? 7, rng);
    const shares = humpShares(days.length, rng);
    days.forEach((date, i) => {
      const kg = totalKg * shares[i]!;
      // Preserving days: every third picking of the peak (the middle half), so the larder holds a few batches.
      const batchDay = i >= days.length / 4 && i < (days.length * 3) / 4 && i % 3 === 1;
      if (spec.givenShare && rng.next() < spec.givenShare) {
        out.push(entry(src, date, kg, 'given', { note: 'glut shared with neighbours' }));
      } else if (spec.preserved && batchDay && kg >= 0.3) {
        // Part of that day's picking is frozen, bottled or fermented the same day.
        const split = `${planting.key}:${date}`;
        const part = Math.min(0.9, spec.preserved.share * 4);
        out.push(entry(src, date, kg * (1 - part), 'fresh', { split }));
        out.push(entry(src, date, kg * part, 'preserved', { split, spread: spec.preserved.spread, method: spec.preserved.method }));
      } else {
        out.push(entry(src, date, kg, 'fresh'));
      }
    });
    return out;
  }
  // Lift: fresh pickings while the crop sizes up, then the main harvest near the window's end.
  const span = daysBetween(from, to);
  const liftDay = addDays(from, Math.max(0, span - rng.int(3, 12)));
  const earlyKg = totalKg * (spec.earlyShare ?? 0);
  const earlyDays = spec.earlyShare && daysBetween(from, liftDay) > 10 ? pickDays(from, addDays(liftDay, -7), 7, rng) : [];
  if (earlyDays.length > 0) {
    const shares = humpShares(earlyDays.length, rng);
    earlyDays.forEach((date, i) => out.push(entry(src, date, earlyKg * shares[i]!, 'fresh')));
  }
  const mainKg = totalKg - (earlyDays.length > 0 ? earlyKg : 0);
  const split = `${planting.key}:lift`;
  for (const [use, share] of Object.entries(spec.split ?? { stored: 1 }) as [Use, number][]) {
    if (share <= 0) continue;
    out.push(
      entry(src, liftDay, mainKg * share, use, {
        split,
        spread: use === 'stored' ? storedSpread : spec.preserved?.spread,
        method: use === 'preserved' ? spec.preserved?.method : undefined,
        note: use === 'seed' ? 'kept for next year' : use === 'sold' ? 'sold at the gate' : undefined,
      }),
    );
  }
  return out;
}

/**
 * The hens' eggs: collected and weighed weekly from `from` to `to`, the year's typical yield per hen
 * shared out by day length; in the spring flush some are sold at the gate.
 */
export function eggHarvests(opts: { from: string; to: string; hens: number; perHenKg: number; food: DemoFood & { code: string }; rng: Rng }): DemoHarvest[] {
  const { from, to, hens, perHenKg, food, rng } = opts;
  const src: Source = { crop: null, food, edibleFraction: null, planting: null };
  const lay = DEMO_ANIMALS.layByMonth;
  const layMean = lay.reduce((a, b) => a + b, 0) / 12;
  const out: DemoHarvest[] = [];
  for (const date of pickDays(from, to, 7, rng)) {
    const m = Number(date.slice(5, 7));
    const kg = ((hens * perHenKg * 7) / 365) * (lay[m - 1]! / layMean) * rng.between(0.85, 1.15);
    if (m >= 4 && m <= 6) {
      const split = `eggs:${date}`;
      out.push(entry(src, date, kg * 0.75, 'fresh', { split }));
      out.push(entry(src, date, kg * 0.25, 'sold', { split, note: 'eggs sold at the gate' }));
    } else {
      out.push(entry(src, date, kg, 'fresh'));
    }
  }
  return out;
}

/** The hive's honey in season `year`: two takes in the window, stored for the year; some given. */
export function honeyHarvests(opts: { window: { from: string; to: string }; hives: number; perHiveKg: number; food: DemoFood & { code: string }; rng: Rng }): DemoHarvest[] {
  const { window, hives, perHiveKg, food, rng } = opts;
  const src: Source = { crop: null, food, edibleFraction: null, planting: null };
  const total = hives * perHiveKg * rng.between(0.6, 1.3);
  const span = daysBetween(window.from, window.to);
  const first = addDays(window.from, Math.floor(span * 0.3) + rng.int(0, 3));
  const second = addDays(window.from, Math.max(0, span - rng.int(0, 4)));
  const split = `honey:${second}`;
  return [
    entry(src, first, total * 0.6, 'stored', { spread: 12 }),
    entry(src, second, total * 0.32, 'stored', { split, spread: 12 }),
    entry(src, second, total * 0.08, 'given', { split, note: 'jars for the neighbours' }),
  ];
}
