/**
 * The planting plan as a linear programme: how many m² of each candidate crop to add so that, for
 * every target nutrient, what the garden already gives plus what the new beds would give reaches
 * the target share of the household's need — over the year, or in every month — with the least
 * added area. This module turns the plan's input into CPLEX LP text (the format HiGHS reads) and
 * keeps the map from LP names back to crops and rows; solving is src/server/planner.ts, reading
 * the answer src/lib/plan-result.ts. Pure: no solver, no database.
 *
 * Each target row is written in shares of need (coefficients are "share of this need per m²"), so
 * energy in kcal and vitamin B12 in µg sit in one model with numbers of the same size.
 *
 * Animal lines of the reference table (eggs per hen, honey per hive) are not m² crops: they are
 * left out of the model (a hen is not bed area), and the endpoint refuses them as candidates.
 *
 * Two more models serve a target that cannot be met: the first minimises the weighted shortfall
 * (a slack per target row, each nutrient weighing the same in total), the second keeps that least
 * shortfall and minimises area, so the best achievable plan is also the smallest one.
 */
import { nutrientPerM2, type CropFood, type CropTableRow } from './crop-table';
import { monthShares } from './crop-months';
import type { FrostDates } from './growing-season';
import { edibleFactor } from './edible';
import { addMonths, parseMonth } from './months';
import { NUTRIENT_KEYS, type NutrientKey } from './nutrients';

/** A crop the planner may add area of: its reference row, its food's composition and, when measured, the household's own yield. */
export interface PlanCandidate {
  row: CropTableRow;
  food: CropFood;
  /** The household's own measured yield, kg per m² per season; the table's typical yield otherwise. */
  ownYieldKgM2?: number | null;
  /** Grams the household kept as seed from this crop last season (shown beside the seed the plan needs). */
  seedKeptG?: number;
}

/** The per-person daily caps on how much the added beds may give of vegetables and of fruit, g edible. */
export interface CategoryCaps {
  vegetables: number;
  fruit: number;
}

/**
 * Daily caps per person, in grams of the edible part. common practice (no published source): a
 * household eats up to about a kilogram of vegetables and half a kilogram of fruit a day per
 * person; beyond that a plan grows food nobody eats. (WHO's "at least 400 g of fruit and
 * vegetables a day" is a floor, not the source of these caps.)
 */
export const DEFAULT_CATEGORY_CAPS: CategoryCaps = { vegetables: 1000, fruit: 500 };

/** Default largest share of the household's energy need one crop may give. */
export const DEFAULT_MAX_SHARE_OF_ENERGY_PER_CROP = 0.3;

export type PlanBasis = 'year' | 'month';

/** Everything a plan is worked out from. Need and supply are per month, aligned with `months`. */
export interface PlanInput {
  /** The growing year planned for (the first calendar year of it). */
  year: number;
  /** The 12 months ('YYYY-MM') the need and supply arrays are given for; default January–December of `year`. */
  months?: readonly string[];
  /** Share of need to reach per nutrient, e.g. { energy_kcal: 0.5, vitamin_c_mg: 1 }. */
  targets: Partial<Record<NutrientKey, number>>;
  basis?: PlanBasis;
  maxAreaM2?: number | null;
  /** Crop keys to consider; every candidate when absent. */
  cropKeys?: readonly string[] | null;
  maxShareOfEnergyPerCrop?: number;
  /** The household's need per month and nutrient. */
  need: Partial<Record<NutrientKey, readonly number[]>>;
  /** What the household's garden already gives per month and nutrient. */
  homeSupply: Partial<Record<NutrientKey, readonly number[]>>;
  /** People who eat; the category caps are per person. */
  people: number;
  frost: FrostDates;
  candidates: readonly PlanCandidate[];
  categoryCaps?: CategoryCaps;
}

export type CapGroup = keyof CategoryCaps;

/** A candidate as the model sees it. */
export interface ModelCrop {
  key: string;
  name: string;
  candidate: PlanCandidate;
  /** LP column name. */
  column: string;
  yieldKgM2: number;
  ownYield: boolean;
  /** Nutrients per m² (null = unknown, counted as none). */
  perM2: Record<NutrientKey, number | null>;
  /** Edible kg per m² (for the category caps). */
  edibleKgM2: number;
  /** Share of the crop's food eaten in each of the plan's 12 months. */
  monthShare: number[];
  capGroup: CapGroup | null;
  /** Largest area the energy cap allows; null when there is no energy cap for it. */
  energyCapM2: number | null;
}

/** One "reach the target" row: a nutrient over the year, or in one month. */
export interface TargetRow {
  name: string;
  nutrient: NutrientKey;
  /** Index into the plan's months; null for the whole year. */
  month: number | null;
  /** Share of this row's need each crop gives per m², in crop order. */
  coeffs: number[];
  /** Share of need still missing (target − home ÷ need), > 0. */
  gap: number;
  /** Weight of this row's shortfall in the best-effort plan. */
  weight: number;
  /** No candidate gives anything here. */
  unsupplied: boolean;
}

/** The prepared plan: crops, target rows and caps, ready to be written as LP text. */
export interface PlanModel {
  basis: PlanBasis;
  months: string[];
  targets: Partial<Record<NutrientKey, number>>;
  crops: ModelCrop[];
  rows: TargetRow[];
  maxAreaM2: number | null;
  maxShareOfEnergyPerCrop: number;
  /** Kilograms per year each cap group may give (people × days × daily cap). */
  capKg: Record<CapGroup, number>;
  input: PlanInput;
}

// Grown for food as vegetables: WHO counts potatoes, sweet potatoes and other starchy roots as
// staples, not as fruit or vegetables (from memory: WHO, Healthy diet fact sheet no. 394).
const VEGETABLE_GROUPS = new Set(['root', 'squash', 'brassica', 'green', 'allium', 'fruiting', 'perennial_veg', 'herb']);
const STARCHY_ROOTS = new Set(['potatoes', 'sweet-potatoes']);

/** Which daily cap a row falls under: fruit (the fruit category), vegetables, or none (grains, pulses, nuts, starchy roots). */
export function capGroupOf(row: Pick<CropTableRow, 'key' | 'category' | 'group'>): CapGroup | null {
  if (row.category === 'fruit') return 'fruit';
  if (VEGETABLE_GROUPS.has(row.group) && !STARCHY_ROOTS.has(row.key)) return 'vegetables';
  return null;
}

/** The 12 months of the plan. Example: `planMonths({ year: 2027 })[0]` → '2027-01' */
export function planMonths(input: Pick<PlanInput, 'year' | 'months'>): string[] {
  const months = input.months ? [...input.months] : Array.from({ length: 12 }, (_, i) => addMonths(`${input.year}-01`, i));
  if (months.length !== 12) throw new RangeError(`A plan covers 12 months, got ${months.length}: give the need and supply for each month of the year.`);
  return months;
}

function series(values: readonly number[] | undefined, what: string, key: string): number[] {
  if (!values) return new Array<number>(12).fill(0);
  if (values.length !== 12 || values.some((v) => !Number.isFinite(v) || v < 0)) {
    throw new RangeError(`The ${what} of ${key} must be 12 amounts of zero or more, one per month.`);
  }
  return [...values];
}

const sum = (xs: readonly number[]) => xs.reduce((a, b) => a + b, 0);

/** Prepares the model: crops with their nutrients per m² and months, and the rows still short of target. */
export function preparePlan(input: PlanInput): PlanModel {
  const months = planMonths(input);
  const basis = input.basis ?? 'year';
  const maxShare = input.maxShareOfEnergyPerCrop ?? DEFAULT_MAX_SHARE_OF_ENERGY_PER_CROP;
  if (!(maxShare > 0 && maxShare <= 1)) throw new RangeError(`The largest share of energy per crop must be more than 0 and at most 1, got ${maxShare}.`);
  if (!(Number.isInteger(input.people) && input.people >= 0)) throw new RangeError(`The number of people must be a whole number of zero or more, got ${input.people}.`);
  const caps = input.categoryCaps ?? DEFAULT_CATEGORY_CAPS;
  const calendar = months.map((m) => parseMonth(m).month);
  const energyNeed = sum(series(input.need.energy_kcal, 'need', 'energy_kcal'));

  const wanted = input.cropKeys ? new Set(input.cropKeys) : null;
  const crops: ModelCrop[] = input.candidates
    .filter((c) => c.row.yieldBasis === 'm2' && (!wanted || wanted.has(c.row.key)))
    .map((c, i) => {
      const own = c.ownYieldKgM2 != null && c.ownYieldKgM2 > 0;
      const yieldKgM2 = own ? c.ownYieldKgM2! : c.row.yieldKg.typical;
      const perM2 = nutrientPerM2(c.row, c.food, { yieldKg: yieldKgM2 });
      const byCalendar = monthShares(c.row, input.frost);
      const kcal = perM2.energy_kcal ?? 0;
      return {
        key: c.row.key,
        name: c.row.name,
        candidate: c,
        column: `a${i}`,
        yieldKgM2,
        ownYield: own,
        perM2,
        edibleKgM2: yieldKgM2 * edibleFactor({ refusePercent: c.food.refusePct, edibleFraction: c.row.edibleFraction }),
        monthShare: calendar.map((m) => byCalendar[m - 1]!),
        capGroup: capGroupOf(c.row),
        energyCapM2: energyNeed > 0 && kcal > 0 ? (maxShare * energyNeed) / kcal : null,
      };
    });

  const rows: TargetRow[] = [];
  for (const [nutrient, target] of Object.entries(input.targets) as [NutrientKey, number][]) {
    if (!NUTRIENT_KEYS.includes(nutrient)) throw new RangeError(`"${nutrient}" is not a nutrient Selfsown knows: use a key of src/lib/nutrients.ts.`);
    if (!(target >= 0)) throw new RangeError(`The target for ${nutrient} must be a share of need of zero or more, got ${target}.`);
    const need = series(input.need[nutrient], 'need', nutrient);
    const home = series(input.homeSupply[nutrient], 'home supply', nutrient);
    const add = (name: string, month: number | null, needHere: number, homeHere: number, give: (c: ModelCrop) => number, weight: number) => {
      const gap = target - homeHere / needHere;
      if (gap <= 1e-12) return;
      const coeffs = crops.map((c) => give(c) / needHere);
      rows.push({ name, nutrient, month, coeffs, gap, weight, unsupplied: coeffs.every((x) => x <= 0) });
    };
    if (basis === 'year') {
      const totalNeed = sum(need);
      if (totalNeed > 0) add(`t${rows.length}`, null, totalNeed, sum(home), (c) => c.perM2[nutrient] ?? 0, 1);
    } else {
      const counted = need.filter((n) => n > 0).length;
      need.forEach((n, m) => {
        if (n > 0) add(`t${rows.length}`, m, n, home[m]!, (c) => (c.perM2[nutrient] ?? 0) * c.monthShare[m]!, 1 / counted);
      });
    }
  }

  const capKg = { vegetables: (input.people * 365 * caps.vegetables) / 1000, fruit: (input.people * 365 * caps.fruit) / 1000 };
  return { basis, months, targets: input.targets, crops, rows, maxAreaM2: input.maxAreaM2 ?? null, maxShareOfEnergyPerCrop: maxShare, capKg, input };
}

/** Which model to write: least area meeting every target; least weighted shortfall; least area within a shortfall. */
export type PlanStage = { kind: 'area' } | { kind: 'shortfall' } | { kind: 'area-within-shortfall'; maxShortfall: number };

/** A number as LP text: 12 significant digits, no trailing noise. Example: `lpNumber(1 / 3)` → '0.333333333333' */
export function lpNumber(x: number): string {
  return String(Number(x.toPrecision(12)));
}

/** One term of a linear expression: coefficient and LP column name. */
export type LpTerm = [number, string];

/** A constraint row: lower ≤ Σ terms ≤ upper, one side infinite. */
export interface LpRow {
  name: string;
  terms: LpTerm[];
  lower: number;
  upper: number;
}

/**
 * One stage of the plan as a linear programme, before it is written down: the objective
 * (minimised), the rows and the column bounds, terms already without the zero coefficients. LP text
 * (planLp) and the packed arrays of ./plan-matrix.ts are both written from it, so they say the same.
 */
export interface LpProgram {
  objective: LpTerm[];
  rows: LpRow[];
  bounds: { column: string; lower: number; upper: number }[];
}

const kept = (terms: LpTerm[]): LpTerm[] => terms.filter(([c]) => Math.abs(c) > 1e-15);

/** The shortfall column of a target row. */
export const slackName = (row: TargetRow) => `s${row.name.slice(1)}`;

/**
 * The model's programme for one stage. Columns are `a<i>` (m² of crop i) and, in the best-effort
 * stages, `s<j>` (the shortfall of target row j, in shares of need).
 */
export function planProgram(model: PlanModel, stage: PlanStage): LpProgram {
  const area = model.crops.map((c): LpTerm => [1, c.column]);
  const withSlack = stage.kind !== 'area';
  const targetRows = withSlack ? model.rows : model.rows.filter((r) => !r.unsupplied);
  const shortfall = model.rows.map((r): LpTerm => [r.weight, slackName(r)]);

  const objective = kept(stage.kind === 'shortfall' ? shortfall : area);
  const rows: LpRow[] = [];
  const add = (name: string, terms: LpTerm[], lower: number, upper: number) => {
    const nonzero = kept(terms);
    if (nonzero.length > 0) rows.push({ name, terms: nonzero, lower, upper });
  };
  for (const r of targetRows) {
    const terms = model.crops.map((c, i): LpTerm => [r.coeffs[i]!, c.column]);
    if (withSlack) terms.push([1, slackName(r)]);
    add(r.name, terms, r.gap, Infinity);
  }
  for (const group of ['vegetables', 'fruit'] as const) {
    add(`cap_${group}`, model.crops.filter((c) => c.capGroup === group).map((c): LpTerm => [c.edibleKgM2, c.column]), -Infinity, model.capKg[group]);
  }
  if (model.maxAreaM2 != null && area.length > 0) add('area', area, -Infinity, model.maxAreaM2);
  if (stage.kind === 'area-within-shortfall' && shortfall.length > 0) {
    // A hair of room above the least shortfall, so rounding in the first solve cannot make this one infeasible.
    add('short', shortfall, -Infinity, stage.maxShortfall * (1 + 1e-7) + 1e-9);
  }
  const bounds = model.crops.map((c) => ({ column: c.column, lower: 0, upper: c.energyCapM2 ?? Infinity }));
  if (withSlack) for (const r of model.rows) bounds.push({ column: slackName(r), lower: 0, upper: r.gap });
  if (model.crops.length === 0) bounds.push({ column: 'a0', lower: 0, upper: 0 });
  return { objective, rows, bounds };
}

function linear(terms: LpTerm[]): string {
  const parts = terms.map(([c, v], i) => `${c < 0 ? '- ' : i === 0 ? '' : '+ '}${Math.abs(c) === 1 ? '' : `${lpNumber(Math.abs(c))} `}${v}`);
  // A line break every few terms keeps the text readable; the LP format allows it anywhere between terms.
  const lines: string[] = [];
  for (let i = 0; i < parts.length; i += 8) lines.push(parts.slice(i, i + 8).join(' '));
  return lines.join('\n   ');
}

/**
 * The model as CPLEX LP text for one stage (see planProgram for the columns).
 * Example: `planLp(preparePlan(input), { kind: 'area' })` → 'Minimize\n obj: a0 + a1\nSubject To\n t0: 0.0004 a0 + … >= 0.5\n…End\n'
 */
export function planLp(model: PlanModel, stage: PlanStage): string {
  const program = planProgram(model, stage);
  const out: string[] = ['Minimize', ` obj: ${linear(program.objective) || '0 a0'}`, 'Subject To'];
  for (const r of program.rows) out.push(` ${r.name}: ${linear(r.terms)} ${r.upper === Infinity ? `>= ${lpNumber(r.lower)}` : `<= ${lpNumber(r.upper)}`}`);
  out.push('Bounds');
  for (const b of program.bounds) out.push(b.upper === Infinity ? ` ${b.column} >= ${lpNumber(b.lower)}` : ` ${lpNumber(b.lower)} <= ${b.column} <= ${lpNumber(b.upper)}`);
  out.push('End', '');
  return out.join('\n');
}

/**
 * The LP text of one stage with its variable map (LP column → crop key, and → target row for the
 * shortfall columns), for callers that solve it themselves.
 * Example: `buildPlanModel(input).columns.a0` → 'potatoes'
 */
export function buildPlanModel(input: PlanInput, stage: PlanStage = { kind: 'area' }): { lp: string; columns: Record<string, string>; model: PlanModel } {
  const model = preparePlan(input);
  const columns: Record<string, string> = Object.fromEntries(model.crops.map((c) => [c.column, c.key]));
  if (stage.kind !== 'area') for (const r of model.rows) columns[slackName(r)] = `shortfall of ${r.nutrient}${r.month === null ? '' : ` in ${model.months[r.month]}`}`;
  return { lp: planLp(model, stage), columns, model };
}
