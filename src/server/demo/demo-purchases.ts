/**
 * The demo's bought food (INVENTED): each month the household buys what its own food does not
 * cover, so the logged year is complete (energy eaten ≈ need) and the home share reads like a real
 * one. The energy to buy in a month is the need less the home food eaten that month, but never under
 * a floor (a household that grows a lot still buys flour, oil and dairy); each staple takes its share
 * of that energy, in bulk buys spread over the months they last, milk weekly, and a few fixed buys.
 */
import { edibleGrams } from '@/lib/edible';
import { addDays } from '@/lib/growing-season';
import { addMonths, daysInMonth, listMonths } from '@/lib/months';
import { toGrams } from '@/lib/units';
import { DEMO_STAPLES, type BoughtStaple } from './demo-catalogue';
import { streamOf } from './demo-random';
import type { DemoFood, DemoPurchase } from './demo-types';

/** Share of the need bought even in the month the garden gives most. */
export const BOUGHT_FLOOR = 0.45;

export interface PurchasePlanInput {
  seed: number;
  /** First month of records and the anchor day (nothing is dated after it). */
  from: string;
  anchor: string;
  /** kcal needed and kcal of home food eaten, per month from `from`. */
  needKcal: ReadonlyMap<string, number>;
  homeKcal: ReadonlyMap<string, number>;
  foods: ReadonlyMap<string, DemoFood>;
  staples?: readonly BoughtStaple[];
  /** Shopping trips per purchase (default 1): each buy split into that many on consecutive days. */
  trips?: number;
}

function food(foods: ReadonlyMap<string, DemoFood>, code: string): DemoFood {
  const f = foods.get(code);
  if (!f) throw new Error(`The demo buys SR28 food ${code}, which is not among the foods given to the generator.`);
  return f;
}

/** kcal in one kg of a food as bought. */
function kcalPerKg(f: DemoFood): number {
  return f.kcalPer100g * 10 * (1 - (f.refusePct ?? 0) / 100);
}

function purchase(code: string, f: DemoFood, date: string, kg: number, staple: BoughtStaple, spreadMonths: number): DemoPurchase {
  const quantity = Math.max(staple.stepKg, Math.round(kg / staple.stepKg) * staple.stepKg);
  const q = Math.round(quantity * 1000) / 1000;
  const grams = toGrams(q, 'kg');
  return {
    food: code,
    entry: { date, quantity: q, unit: 'kg', spreadMonths, price: Math.round(q * staple.pricePerKg * 100) / 100, currency: 'GBP', trimmed: false },
    grams,
    edibleGrams: edibleGrams(grams, { refusePercent: f.refusePct }),
  };
}

/** One purchase as `trips` equal buys on consecutive days, each rounded as a shop weighs it. */
function inTrips(p: DemoPurchase, trips: number, foods: ReadonlyMap<string, DemoFood>, staples: readonly BoughtStaple[]): DemoPurchase[] {
  const staple = staples.find((s) => s.code === p.food)!;
  const f = food(foods, p.food);
  const kg = p.grams / 1000 / trips;
  return Array.from({ length: trips }, (_, i) => purchase(p.food, f, addDays(p.entry.date, i), kg, { ...staple, stepKg: Math.min(staple.stepKg, 0.05) }, p.entry.spreadMonths));
}

const day = (month: string, d: number) => `${month}-${String(Math.min(d, daysInMonth(month))).padStart(2, '0')}`;

/** Every purchase from `from` to the anchor, in date order. */
export function demoPurchases(input: PurchasePlanInput): DemoPurchase[] {
  const staples = input.staples ?? DEMO_STAPLES;
  const months = listMonths(input.from, input.anchor.slice(0, 7));
  const out: DemoPurchase[] = [];
  // Energy of the fixed buys comes off what the shares must cover.
  const fixedKcal = new Map<string, number>();
  for (const m of months) {
    let kcal = 0;
    for (const s of staples) if (s.fixedKg && (!s.months || s.months.includes(Number(m.slice(5))))) kcal += s.fixedKg * kcalPerKg(food(input.foods, s.code));
    fixedKcal.set(m, kcal);
  }
  const toBuy = (m: string) => {
    const need = input.needKcal.get(m) ?? 0;
    return Math.max(BOUGHT_FLOOR * need, need - (input.homeKcal.get(m) ?? 0)) - (fixedKcal.get(m) ?? 0);
  };
  for (const s of staples) {
    const f = food(input.foods, s.code);
    const rng = streamOf(input.seed, `bought:${s.code}`);
    if (s.fixedKg) {
      for (const m of months) {
        if (s.months && !s.months.includes(Number(m.slice(5)))) continue;
        out.push(purchase(s.code, f, day(m, rng.int(1, 12)), s.fixedKg * rng.between(0.8, 1.2), s, 1));
      }
      continue;
    }
    for (let i = 0; i < months.length; i += s.everyMonths) {
      const period = listMonths(months[i]!, addMonths(months[i]!, s.everyMonths - 1));
      const kcal = period.reduce((sum, m) => sum + toBuy(m), 0) * s.energyShare * rng.between(0.92, 1.08);
      const kg = kcal / kcalPerKg(f);
      if (s.weekly) {
        const days = [2, 9, 16, 23, 30].filter((d) => d <= daysInMonth(months[i]!));
        for (const d of days) out.push(purchase(s.code, f, day(months[i]!, d), kg / days.length, s, 1));
      } else {
        // Bought in the first days of the period, eaten evenly until the next buy.
        out.push(purchase(s.code, f, day(months[i]!, 1), kg, s, s.everyMonths));
      }
    }
  }
  const trips = input.trips ?? 1;
  if (!Number.isInteger(trips) || trips < 1) throw new Error(`trips must be a whole number from 1, got ${trips}.`);
  const split = trips === 1 ? out : out.flatMap((p) => inTrips(p, trips, input.foods, staples));
  return split.filter((p) => p.entry.date <= input.anchor).sort((a, b) => (a.entry.date < b.entry.date ? -1 : a.entry.date > b.entry.date ? 1 : 0));
}
