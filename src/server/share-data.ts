/**
 * The share report of a household over a range of months: a few aggregate queries (harvests,
 * purchases, people, datasets) feeding the pure code of src/lib/shares.ts. Used by the share
 * endpoint, the dashboard and later the monthly e-mail and the planner.
 *
 * The queries group entries by (month, use, spread, crop, food) and join the food's nutrients,
 * so the rows grow with the variety of what was logged, not with the number of weighings. Grouping
 * by food keeps "unknown" honest: every entry of a group has a value for a nutrient or none does.
 */
import type { RowDataPacket } from 'mysql2';
import type { Pool } from 'mysql2/promise';
import { getPool } from '../db/client';
import type { Household } from '../db/schema';
import type { FoodEntry, Use } from '../lib/allocate';
import { ENTRY_LIMITS, USES } from '../lib/entry-schemas';
import { addMonths, daysInMonth, monthIndex } from '../lib/months';
import { SHARE_NUTRIENTS, type ShareNutrientKey } from '../lib/nutrients';
import { needsPerson } from '../lib/people-schemas';
import { computeShare, topContributors, type CropEntry, type ShareReport } from '../lib/shares';
import { listPeople, personFields } from './people';

/** How many crops per nutrient the report names (the union over nutrients is returned). */
export const TOP_CROPS_PER_NUTRIENT = 5;

export interface TopCrop {
  /** The household's crop, or null for a harvest logged directly against a reference food. */
  cropId: number | null;
  foodId: number | null;
  name: string;
  /** Amount of each nutrient eaten from this crop in the range; null when its food has no value. */
  values: Record<ShareNutrientKey, number | null>;
  /** values ÷ everything home-grown eaten in the range (fraction). */
  shareOfHome: Record<ShareNutrientKey, number | null>;
}

export interface UseTotal {
  use: Use;
  /** Weight as harvested, g. */
  grams: number;
  /** Edible portion, g. */
  edibleGrams: number;
  entries: number;
  /** Energy of the edible portion, kcal; null when none of it has a known value. */
  energyKcal: number | null;
}

export interface ShareResponse extends ShareReport<ShareNutrientKey> {
  topCrops: TopCrop[];
  /** The harvest dated in the range, by use (not-food crops left out). */
  uses: UseTotal[];
  /** People counted for the need (present in some month of the range or not). */
  peopleCount: number;
  /** Food composition datasets behind the figures. */
  datasets: { slug: string; name: string; release: string }[];
}

interface GroupRow extends RowDataPacket {
  month: string;
  use: Use;
  spread: number;
  crop_id: number | null;
  food_id: number | null;
  name: string | null;
  grams: number;
  edible_grams: number;
  entries: number;
}

/** Amount per 100 g of each share nutrient, by food id; a missing key is unknown, never zero. */
type FoodAmounts = Map<number, Partial<Record<ShareNutrientKey, number>>>;

interface Group {
  key: string;
  source: 'home' | 'bought';
  month: string;
  use: Use;
  spread: number;
  cropId: number | null;
  foodId: number | null;
  name: string;
  grams: number;
  edibleGrams: number;
  entries: number;
  nutrients: Partial<Record<ShareNutrientKey, number>>;
}

const KEYS: readonly ShareNutrientKey[] = SHARE_NUTRIENTS;

function lastDay(month: string): string {
  return `${month}-${String(daysInMonth(month)).padStart(2, '0')}`;
}

/** 'YYYY-MM' → 'YYYYMM', the period format of MariaDB's PERIOD_DIFF. */
const period = (month: string) => month.replace('-', '');

/**
 * Harvest groups whose eating can fall in [from, to] or that are dated in it: dated in the range,
 * or stored/preserved earlier with a spread reaching `from`. Not-food crops never count as food.
 */
async function harvestGroups(pool: Pool, householdId: number, from: string, to: string): Promise<GroupRow[]> {
  const lookback = `${addMonths(from, -ENTRY_LIMITS.maxSpreadMonths)}-01`;
  const [rows] = await pool.query<GroupRow[]>(
    `SELECT g.month, g.use, g.spread, g.crop_id, g.food_id, g.name, g.grams, g.edible_grams, g.entries
       FROM (SELECT DATE_FORMAT(h.date, '%Y-%m') AS month, h.use, GREATEST(h.spread_months, 1) AS spread,
                    h.crop_id, h.food_id,
                    MAX(COALESCE(NULLIF(CONCAT_WS(', ', c.name, NULLIF(c.variety, '')), ''), f.name)) AS name,
                    SUM(h.grams) AS grams, SUM(h.edible_grams) AS edible_grams, COUNT(*) AS entries
               FROM harvests h
               LEFT JOIN crops c ON c.id = h.crop_id AND c.household_id = h.household_id
               LEFT JOIN foods f ON f.id = h.food_id
              WHERE h.household_id = ?
                AND h.date >= ? AND h.date <= ?
                AND (c.id IS NULL OR c.not_food = 0)
                AND (h.crop_id IS NULL OR c.id IS NOT NULL)
                AND (h.date >= ?
                     OR (h.use IN ('stored', 'preserved') AND PERIOD_DIFF(?, DATE_FORMAT(h.date, '%Y%m')) < h.spread_months))
              GROUP BY month, h.use, spread, h.crop_id, h.food_id) g`,
    [householdId, lookback, lastDay(to), `${from}-01`, period(from)],
  );
  return rows;
}

/** Purchase groups whose eating can fall in [from, to] (bought food is always spread). */
async function purchaseGroups(pool: Pool, householdId: number, from: string, to: string): Promise<GroupRow[]> {
  const lookback = `${addMonths(from, -ENTRY_LIMITS.maxSpreadMonths)}-01`;
  const [rows] = await pool.query<GroupRow[]>(
    `SELECT g.month, 'fresh' AS \`use\`, g.spread, NULL AS crop_id, g.food_id, NULL AS name, g.grams, g.edible_grams,
            g.entries
       FROM (SELECT DATE_FORMAT(p.date, '%Y-%m') AS month, GREATEST(p.spread_months, 1) AS spread, p.food_id,
                    SUM(p.grams) AS grams, SUM(p.edible_grams) AS edible_grams, COUNT(*) AS entries
               FROM purchases p
              WHERE p.household_id = ?
                AND p.date >= ? AND p.date <= ?
                AND (p.date >= ? OR PERIOD_DIFF(?, DATE_FORMAT(p.date, '%Y%m')) < p.spread_months)
              GROUP BY month, spread, p.food_id) g`,
    [householdId, lookback, lastDay(to), `${from}-01`, period(from)],
  );
  return rows;
}

/**
 * The share nutrients of the foods behind the groups, in one query over the distinct foods
 * (a handful), instead of joining every group to its nutrients in SQL.
 */
async function foodAmounts(pool: Pool, foodIds: readonly number[]): Promise<FoodAmounts> {
  const out: FoodAmounts = new Map();
  if (foodIds.length === 0) return out;
  const [rows] = await pool.query<RowDataPacket[]>(
    'SELECT food_id, nutrient_key, amount FROM food_nutrients WHERE food_id IN (?) AND nutrient_key IN (?)',
    [foodIds, KEYS],
  );
  for (const r of rows) {
    const id = Number(r.food_id);
    let m = out.get(id);
    if (!m) out.set(id, (m = {}));
    m[r.nutrient_key as ShareNutrientKey] = Number(r.amount);
  }
  return out;
}

/** Group rows → groups with the nutrients of their edible grams. */
function collect(rows: readonly GroupRow[], source: 'home' | 'bought', amounts: FoodAmounts, into: Map<string, Group>): void {
  for (const r of rows) {
    const key = `${source}|${r.month}|${r.use}|${r.spread}|${r.crop_id ?? ''}|${r.food_id ?? ''}`;
    let g = into.get(key);
    if (!g) {
      g = {
        key,
        source,
        month: r.month,
        use: r.use,
        spread: Number(r.spread),
        cropId: r.crop_id,
        foodId: r.food_id,
        name: r.name ?? '',
        grams: Number(r.grams),
        edibleGrams: Number(r.edible_grams),
        entries: Number(r.entries),
        nutrients: {},
      };
      into.set(key, g);
    }
    // A nutrient the food has no row for stays missing: unknown, never zero.
    const per100g = r.food_id == null ? undefined : amounts.get(r.food_id);
    for (const key of KEYS) {
      const a = per100g?.[key];
      if (a !== undefined) g.nutrients[key] = (g.edibleGrams * a) / 100;
    }
  }
}

function toEntry(g: Group): CropEntry {
  return {
    date: `${g.month}-01`, // only the month matters: eating and the ratio both go by month
    use: g.use,
    source: g.source,
    spreadMonths: g.spread,
    edibleGrams: g.edibleGrams,
    nutrients: g.nutrients,
    cropId: g.cropId ?? `food:${g.foodId ?? 'none'}`,
    name: g.name || 'Unnamed harvest',
  };
}

function topCrops(groups: readonly Group[], from: string, to: string): TopCrop[] {
  const entries = groups.filter((g) => g.source === 'home').map(toEntry);
  const crops = new Map<string | number, TopCrop>();
  const chosen = new Set<string | number>();
  for (const key of KEYS) {
    const ranked = topContributors(entries, key, entries.length, { from, to });
    ranked.forEach((c, i) => {
      let crop = crops.get(c.cropId);
      if (!crop) {
        const g = groups.find((x) => x.source === 'home' && (x.cropId ?? `food:${x.foodId ?? 'none'}`) === c.cropId)!;
        crop = { cropId: g.cropId, foodId: g.foodId, name: c.name, values: emptyValues(), shareOfHome: emptyValues() };
        crops.set(c.cropId, crop);
      }
      crop.values[key] = c.amount;
      crop.shareOfHome[key] = c.shareOfHome;
      if (i < TOP_CROPS_PER_NUTRIENT) chosen.add(c.cropId);
    });
  }
  // A crop eaten in the range whose food has no value for a nutrient: unknown, not 0.
  const start = monthIndex(from);
  const end = monthIndex(to);
  for (const e of entries) {
    const crop = crops.get(e.cropId);
    if (!crop) continue;
    const first = monthIndex(e.date.slice(0, 7));
    const last = first + (e.use === 'fresh' ? 1 : e.spreadMonths) - 1;
    const eatenInRange = (e.use === 'fresh' || e.use === 'stored' || e.use === 'preserved') && last >= start && first <= end;
    if (!eatenInRange) continue;
    for (const key of KEYS) {
      if (e.nutrients[key] == null && crop.values[key] === 0) {
        crop.values[key] = null;
        crop.shareOfHome[key] = null;
      }
    }
  }
  return [...crops.entries()]
    .filter(([id]) => chosen.has(id))
    .map(([, c]) => c)
    .sort((a, b) => (b.values.energy_kcal ?? 0) - (a.values.energy_kcal ?? 0) || a.name.localeCompare(b.name));
}

function emptyValues(): Record<ShareNutrientKey, number | null> {
  const out = {} as Record<ShareNutrientKey, number | null>;
  for (const key of KEYS) out[key] = 0;
  return out;
}

function useTotals(groups: readonly Group[], from: string, to: string): UseTotal[] {
  const totals = new Map<Use, UseTotal & { known: number }>();
  for (const use of USES) totals.set(use, { use, grams: 0, edibleGrams: 0, entries: 0, energyKcal: 0, known: 0 });
  for (const g of groups) {
    if (g.source !== 'home' || g.month < from || g.month > to) continue;
    const t = totals.get(g.use)!;
    t.grams += g.grams;
    t.edibleGrams += g.edibleGrams;
    t.entries += g.entries;
    const kcal = g.nutrients.energy_kcal;
    if (kcal != null) {
      t.energyKcal = (t.energyKcal ?? 0) + kcal;
      t.known += g.edibleGrams;
    }
  }
  return [...totals.values()].map(({ known, ...t }) => ({ ...t, energyKcal: known === 0 && t.edibleGrams > 0 ? null : t.energyKcal }));
}

async function datasetsOf(pool: Pool, foodIds: number[]): Promise<ShareResponse['datasets']> {
  if (foodIds.length === 0) return [];
  const [rows] = await pool.query<RowDataPacket[]>(
    `SELECT DISTINCT d.slug, d.name, d.release FROM foods f JOIN datasets d ON d.id = f.dataset_id WHERE f.id IN (?) ORDER BY d.slug`,
    [foodIds],
  );
  return rows.map((r) => ({ slug: String(r.slug), name: String(r.name), release: String(r.release) }));
}

/**
 * The share report of a household for [from, to] ('YYYY-MM', at most 120 months): per month and
 * nutrient home, bought, need and shares, totals, the FAO ratio, top crops and the harvest's uses.
 * Throws RangeError when the range or a person's data cannot be computed.
 */
export async function householdShare(household: Pick<Household, 'id'>, from: string, to: string, pool: Pool = getPool()): Promise<ShareResponse> {
  const [home, bought, rows] = await Promise.all([
    harvestGroups(pool, household.id, from, to),
    purchaseGroups(pool, household.id, from, to),
    listPeople(household.id),
  ]);
  const ids = [...new Set([...home, ...bought].map((r) => r.food_id).filter((id): id is number => id != null))];
  const amounts = await foodAmounts(pool, ids);
  const groups = new Map<string, Group>();
  collect(home, 'home', amounts, groups);
  collect(bought, 'bought', amounts, groups);
  const all = [...groups.values()];
  const people = rows.map((r) => needsPerson(personFields(r)));
  const report = computeShare({ from, to, entries: all.map(toEntry), people, nutrients: KEYS });
  const foodIds = [...new Set(all.map((g) => g.foodId).filter((id): id is number => id != null))];
  return {
    ...report,
    topCrops: topCrops(all, from, to),
    uses: useTotals(all, from, to),
    peopleCount: people.length,
    datasets: await datasetsOf(pool, foodIds),
  };
}
