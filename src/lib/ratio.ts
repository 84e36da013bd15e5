/**
 * The self-sufficiency ratio as FAO food balance sheets define it:
 *   SSR = production × 100 / (production + imports − exports)
 * (FAO, Food Balance Sheets: A Handbook, 2001). For a household, per nutrient over a range:
 * production = every home harvest (all uses, seed, gifts, sales and losses included),
 * imports = bought food, exports = food sold or given away. Flows count in the month of the
 * entry's date (a balance of the period's flows), not spread over the months it is eaten.
 *
 * FAO states the ratio in percent: ssrPercent returns that; ssrFraction the same ÷ 100, which is
 * what computeShare's `ratio` holds so that every share in the report is a fraction.
 */
import { dateMonthIndex, listMonths, monthIndex } from './months';
import { shareIndexes, type FoodEntry } from './allocate';
import type { NutrientKey } from './nutrients';

/**
 * FAO self-sufficiency ratio in percent; null when the denominator is ≤ 0 or an input is unknown,
 * e.g. ssrPercent(600, 500, 100) → 60.
 */
export function ssrPercent(production: number | null, imports: number | null, exports: number | null): number | null {
  if (production === null || imports === null || exports === null) return null;
  for (const [name, v] of [['production', production], ['imports', imports], ['exports', exports]] as const) {
    if (!Number.isFinite(v) || v < 0) throw new RangeError(`${name} must be a number ≥ 0, got ${v}`);
  }
  const supply = production + imports - exports;
  return supply <= 0 ? null : (production * 100) / supply;
}

/** The same ratio as a fraction, e.g. ssrFraction(600, 500, 100) → 0.6. */
export function ssrFraction(production: number | null, imports: number | null, exports: number | null): number | null {
  const pct = ssrPercent(production, imports, exports);
  return pct === null ? null : pct / 100;
}

export interface SelfSufficiency {
  /** Sums of known amounts; null when every gram in the flow has no value for the nutrient. */
  production: number | null;
  imports: number | null;
  exports: number | null;
  /** FAO SSR in percent. */
  percent: number | null;
  /** FAO SSR ÷ 100. */
  fraction: number | null;
  /** Edible grams of production and imports with no value for the nutrient. */
  unknownGrams: number;
}

interface Flow {
  sum: number;
  known: number;
  unknown: number;
}

const flow = (): Flow => ({ sum: 0, known: 0, unknown: 0 });

/** FoodEntry.shareAmounts writes unknown as NaN. */
const nullIfNaN = (a: number): number | null => (Number.isNaN(a) ? null : a);

function add(f: Flow, amount: number | null | undefined, grams: number): void {
  if (amount == null) f.unknown += grams;
  else {
    f.sum += amount;
    f.known += grams;
  }
}

/** Known sum, or null when all its weight is of unknown value (nothing at all is a known 0). */
function value(f: Flow): number | null {
  return f.known === 0 && f.unknown > 0 ? null : f.sum;
}

/**
 * Production, imports, exports and the FAO ratio per nutrient for entries dated in [from, to],
 * e.g. selfSufficiency(entries, { from: '2026-01', to: '2026-12', keys: ['energy_kcal'] }).energy_kcal.percent.
 */
export function selfSufficiency<K extends NutrientKey>(
  entries: readonly FoodEntry[],
  { from, to, keys }: { from: string; to: string; keys: readonly K[] },
): Record<K, SelfSufficiency> {
  listMonths(from, to); // checks the range
  const [start, end] = [monthIndex(from), monthIndex(to)];
  const flows = new Map<K, { production: Flow; imports: Flow; exports: Flow }>();
  for (const key of keys) flows.set(key, { production: flow(), imports: flow(), exports: flow() });
  const byKey = keys.map((key) => flows.get(key)!);
  const places = shareIndexes(keys);
  for (const entry of entries) {
    const index = dateMonthIndex(entry.date);
    if (index < start || index > end) continue;
    if (!Number.isFinite(entry.edibleGrams) || entry.edibleGrams < 0) {
      throw new RangeError(`edible grams must be a number ≥ 0, got ${entry.edibleGrams}`);
    }
    for (let k = 0; k < keys.length; k++) {
      const f = byKey[k]!;
      const amount = places && entry.shareAmounts ? nullIfNaN(entry.shareAmounts[places[k]!]!) : entry.nutrients[keys[k]!];
      add(entry.source === 'home' ? f.production : f.imports, amount, entry.edibleGrams);
      if (entry.use === 'sold' || entry.use === 'given') add(f.exports, amount, entry.edibleGrams);
    }
  }
  const out = {} as Record<K, SelfSufficiency>;
  for (const key of keys) {
    const f = flows.get(key)!;
    const production = value(f.production);
    const imports = value(f.imports);
    const exports = value(f.exports);
    const percent = ssrPercent(production, imports, exports);
    out[key] = {
      production,
      imports,
      exports,
      percent,
      fraction: percent === null ? null : percent / 100,
      unknownGrams: f.production.unknown + f.imports.unknown,
    };
  }
  return out;
}
