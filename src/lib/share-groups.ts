/**
 * Groups of entries as the share report reads them from the database: harvests or purchases
 * summed by (month, use, spread, crop, food, preserving method), each turned into one FoodEntry
 * for allocate.ts and shares.ts. Grouping by food keeps "unknown" honest: every entry of a group
 * has a value for a nutrient or none does, so a nutrient the food has no amount for stays
 * missing, never zero. A lot eaten over 2 months or more is spread by day from its date, so such
 * lots are grouped by their day, not their month; a preserved lot's vitamins are reduced by the
 * retention factors of its method (retention.ts).
 */
import type { Source, Use } from './allocate';
import { SHARE_NUTRIENTS, type ShareNutrientKey } from './nutrients';
import type { PreserveMethod, RetentionTable } from './retention';
import type { CropEntry } from './shares';

/** One aggregate row: the entries of a month (or of a day, for lots spread by day), use, spread, crop, food and method, summed. */
export interface GroupRow {
  /** 'YYYY-MM' the entries are dated in. */
  month: string;
  /** 'YYYY-MM-DD' of the entries for a lot spread over 2 months or more; default: the month's first day (the day does not matter). */
  date?: string | null;
  /** How a preserved lot was kept; null or missing = not said (no retention applied). */
  preserveMethod?: PreserveMethod | null;
  /** A part of a lot with larder records: eaten evenly by day over [eatenFrom, until) (see allocate.ts). */
  eatenFrom?: string | null;
  until?: string | null;
  use: Use;
  /** Months the food is eaten over (≥ 1). */
  spread: number;
  cropId: number | null;
  foodId: number | null;
  /** The crop's name and variety, else the food's name; null when neither is known. */
  name: string | null;
  grams: number;
  edibleGrams: number;
  entries: number;
}

/** Amount per 100 g of each share nutrient, by food id; a missing key is unknown, never zero. */
export type FoodAmounts = Map<number, Partial<Record<ShareNutrientKey, number>>>;

/** A group with its source and the nutrients of its edible grams. */
export interface ShareGroup {
  /** What tells the group from every other: source, date, use, spread, method, crop, food and (for a part of a lot) its days. */
  readonly key: string;
  source: Source;
  month: string;
  /** 'YYYY-MM-DD' the group is eaten from (the month's first day unless spread by day). */
  date: string;
  use: Use;
  spread: number;
  preserveMethod: PreserveMethod | null;
  /** Set for a part of a lot with larder records: eaten evenly by day over [eatenFrom, until). */
  eatenFrom: string | null;
  until: string | null;
  cropId: number | null;
  foodId: number | null;
  name: string;
  grams: number;
  edibleGrams: number;
  entries: number;
  nutrients: Partial<Record<ShareNutrientKey, number>>;
  /** The same as numbers in SHARE_NUTRIENTS order, NaN where unknown (FoodEntry.shareAmounts). */
  shareAmounts?: readonly number[];
}

/**
 * The groups of home and bought rows with the nutrients of their edible grams, home first; with a
 * retention table, a preserved group naming its method keeps only the retained share of each vitamin,
 * e.g. shareGroups([{ month: '2026-08', use: 'fresh', foodId: 7, edibleGrams: 500, … }], [], new Map([[7, { energy_kcal: 77 }]]))[0].nutrients → { energy_kcal: 385 }.
 */
export function shareGroups(home: readonly GroupRow[], bought: readonly GroupRow[], amounts: FoodAmounts, retention?: RetentionTable): ShareGroup[] {
  const into: Grouping = { byDate: new Map(), order: [] };
  const foods = foodShapes(amounts);
  const factors = retentionFactors(retention);
  collect(home, 'home', foods, into, factors);
  collect(bought, 'bought', foods, into, factors);
  return into.order;
}

/**
 * Groups found so far: by date (then compared field by field, as the report meets thousands of
 * rows and a date holds a few groups), and in the order they were first met.
 */
interface Grouping {
  byDate: Map<string, Group[]>;
  order: Group[];
}

/** A food's known share nutrients (SHARE_NUTRIENTS order) with their amounts per 100 g, and an object of those keys to copy. */
interface FoodShape {
  keys: ShareNutrientKey[];
  /** Each key's place in SHARE_NUTRIENTS. */
  places: number[];
  per100g: number[];
  blank: Partial<Record<ShareNutrientKey, number>>;
}

const NO_FOOD: FoodShape = { keys: [], places: [], per100g: [], blank: {} };

/** Every share nutrient unknown (NaN), copied for each group's amounts. */
const UNKNOWN_AMOUNTS: readonly number[] = SHARE_NUTRIENTS.map(() => NaN);

/**
 * Each food's shape, worked out once per report: a group's nutrients are then a copy of the
 * food's blank object filled in place, instead of an object grown key by key thousands of times.
 */
function foodShapes(amounts: FoodAmounts): (foodId: number | null) => FoodShape {
  const shapes = new Map<number, FoodShape>();
  return (foodId) => {
    if (foodId == null) return NO_FOOD;
    let shape = shapes.get(foodId);
    if (!shape) {
      const per100g = amounts.get(foodId);
      shape = { keys: [], places: [], per100g: [], blank: {} };
      for (const [place, k] of SHARE_NUTRIENTS.entries()) {
        const a = per100g?.[k];
        if (a === undefined) continue;
        shape.keys.push(k);
        shape.places.push(place);
        shape.per100g.push(a);
        shape.blank[k] = 0;
      }
      shapes.set(foodId, shape);
    }
    return shape;
  };
}

/** A group as collect() makes it; its key is written out only when asked for. */
class Group implements ShareGroup {
  month: string;
  use: Use;
  spread: number;
  cropId: number | null;
  foodId: number | null;
  name: string;
  grams: number;
  edibleGrams: number;
  entries: number;
  shareAmounts?: readonly number[];
  /**
   * The nutrients as an object: made by collect() only for a value that is not a number (then no
   * shareAmounts), else from shareAmounts when first read (the share code reads the numbers).
   */
  kept?: Partial<Record<ShareNutrientKey, number>>;
  get nutrients(): Partial<Record<ShareNutrientKey, number>> {
    return (this.kept ??= nutrientsOf(this.shareAmounts!));
  }
  set nutrients(v: Partial<Record<ShareNutrientKey, number>>) {
    this.kept = v;
  }

  constructor(
    public source: Source,
    r: GroupRow,
    public date: string,
    public preserveMethod: PreserveMethod | null,
    public eatenFrom: string | null,
    public until: string | null,
  ) {
    this.month = r.month;
    this.use = r.use;
    this.spread = r.spread;
    this.cropId = r.cropId;
    this.foodId = r.foodId;
    this.name = r.name ?? '';
    this.grams = r.grams;
    this.edibleGrams = r.edibleGrams;
    this.entries = r.entries;
  }

  get key(): string {
    const part = this.until ? `|${this.eatenFrom}|${this.until}` : '';
    return `${this.source}|${this.date}|${this.use}|${this.spread}|${this.preserveMethod ?? ''}|${this.cropId ?? ''}|${this.foodId ?? ''}${part}`;
  }
}

function collect(
  rows: readonly GroupRow[],
  source: Source,
  foodShape: (foodId: number | null) => FoodShape,
  into: Grouping,
  retained: (shape: FoodShape, method: PreserveMethod) => readonly number[] | null,
): void {
  for (const r of rows) {
    const date = r.date ?? `${r.month}-01`;
    const method = r.use === 'preserved' ? (r.preserveMethod ?? null) : null;
    const eatenFrom = r.until ? (r.eatenFrom ?? date) : null;
    const until = r.until ?? null;
    const cropId = r.cropId ?? null;
    const foodId = r.foodId ?? null;
    // One group per source, date, use, spread, method, crop, food and (for a part of a lot with
    // larder records) the days it is eaten over.
    let sameDate = into.byDate.get(date);
    if (!sameDate) into.byDate.set(date, (sameDate = []));
    // A loop, not find(): no closure made per row.
    let g: Group | undefined;
    for (let i = 0; i < sameDate.length; i++) {
      const x = sameDate[i]!;
      if (
        x.cropId === cropId &&
        x.foodId === foodId &&
        x.source === source &&
        x.use === r.use &&
        x.spread === r.spread &&
        x.preserveMethod === method &&
        (x.until || null) === (until || null) &&
        (x.until ? x.eatenFrom : null) === (until ? eatenFrom : null)
      ) {
        g = x;
        break;
      }
    }
    if (!g) {
      g = new Group(source, r, date, method, eatenFrom, until);
      sameDate.push(g);
      into.order.push(g);
    } else {
      // Only the parts of lots with larder records can meet an existing group (SQL groups are distinct).
      g.grams += r.grams;
      g.edibleGrams += r.edibleGrams;
      g.entries += r.entries;
    }
    // A nutrient the food has no row for stays missing: unknown, never zero. The amounts are
    // written as numbers (shareAmounts, what the share code reads), a preserved lot's after its
    // method's retention factors (as applyRetention); the object of the same values is made only
    // when something reads it.
    const shape = foodShape(r.foodId);
    const factors = g.preserveMethod === null ? null : retained(shape, g.preserveMethod);
    const amounts = UNKNOWN_AMOUNTS.slice();
    let notANumber = false;
    for (let i = 0; i < shape.keys.length; i++) {
      let v = (g.edibleGrams * shape.per100g[i]!) / 100;
      if (factors) v *= factors[i]!;
      amounts[shape.places[i]!] = v;
      if (Number.isNaN(v)) notANumber = true;
    }
    if (!notANumber) {
      g.shareAmounts = amounts;
      g.kept = undefined;
      continue;
    }
    // A value that is not a number: no numbers (the share code reads the object by key and refuses it there).
    const nutrients = { ...shape.blank };
    for (let i = 0; i < shape.keys.length; i++) nutrients[shape.keys[i]!] = amounts[shape.places[i]!]!;
    g.kept = nutrients;
    g.shareAmounts = undefined;
  }
}

/**
 * A food's retention factors under a preserving method, one per key of its shape (1 where the
 * table has no row, as applyRetention leaves such a value), worked out once per report; null
 * when nothing changes (no table, or no rows for the method).
 */
function retentionFactors(retention?: RetentionTable): (shape: FoodShape, method: PreserveMethod) => readonly number[] | null {
  const kept = new Map<FoodShape, Map<PreserveMethod, readonly number[] | null>>();
  return (shape, method) => {
    if (!retention) return null;
    let byMethod = kept.get(shape);
    if (!byMethod) kept.set(shape, (byMethod = new Map()));
    let factors = byMethod.get(method);
    if (factors === undefined) {
      const rows = retention.get(method);
      factors = rows ? shape.keys.map((k) => rows.get(k)?.factor ?? 1) : null;
      byMethod.set(method, factors);
    }
    return factors;
  };
}

/** The known amounts of shareAmounts (NaN: unknown, left out) as an object in SHARE_NUTRIENTS order. */
function nutrientsOf(amounts: readonly number[]): Partial<Record<ShareNutrientKey, number>> {
  const out: Partial<Record<ShareNutrientKey, number>> = {};
  for (let i = 0; i < amounts.length; i++) if (!Number.isNaN(amounts[i]!)) out[SHARE_NUTRIENTS[i]!] = amounts[i]!;
  return out;
}

/** The distinct reference foods behind some rows or groups, e.g. [{ foodId: 3 }, { foodId: 3 }, { foodId: null }] → [3]. */
export function foodIdsOf(rows: readonly { foodId: number | null }[]): number[] {
  return [...new Set(rows.map((r) => r.foodId).filter((id): id is number => id != null))];
}

/**
 * Who a group's food came from, as the top-crop ranking counts it: the crop, else the reference
 * food the harvest was logged against, e.g. { cropId: null, foodId: 12 } → 'food:12'.
 */
export function contributorId(g: Pick<ShareGroup, 'cropId' | 'foodId'>): string | number {
  return g.cropId ?? `food:${g.foodId ?? 'none'}`;
}

/**
 * A group as one entry of the share code, dated on its day (a lot spread by day) or its month's
 * first day (fresh food and a spread of one month count wholly in their month).
 */
export function groupEntry(g: ShareGroup): CropEntry {
  return new GroupEntry(g);
}

/**
 * What groupEntry makes: every entry with the same fields in the same order (one hidden class, so
 * the share code's reads of thousands of them stay fast), its nutrients the group's own, read
 * only when asked for (the share code reads shareAmounts).
 */
class GroupEntry implements CropEntry {
  date: string;
  use: Use;
  source: Source;
  spreadMonths: number;
  edibleGrams: number;
  shareAmounts: readonly number[] | undefined;
  eatenFrom: string | null | undefined;
  until: string | null | undefined;
  cropId: string | number;
  name: string;

  constructor(private readonly group: ShareGroup) {
    this.date = group.date;
    this.use = group.use;
    this.source = group.source;
    this.spreadMonths = group.spread;
    this.edibleGrams = group.edibleGrams;
    this.shareAmounts = group.shareAmounts;
    this.eatenFrom = group.until ? group.eatenFrom : undefined;
    this.until = group.until || undefined;
    this.cropId = contributorId(group);
    this.name = group.name || 'Unnamed harvest';
  }

  get nutrients(): Partial<Record<ShareNutrientKey, number>> {
    return this.group.nutrients;
  }
}
