/**
 * Reads a solved planting plan into the answer a grower sees: the area of each crop (rounded up to
 * the next 0.01 m², so rounding never drops a plan below its target), the harvest and seed that
 * area means, the shares of need the household would reach, and — when the targets cannot all be
 * met — which ones fall short and why (the area limit, a cap, or a nutrient no crop supplies).
 * The projected shares are worked out again from the plan's own rounded areas, not taken from the
 * solver, so what the answer promises is exactly what its areas give. Pure: no solver, no database.
 */
import type { CapGroup, ModelCrop, PlanBasis, PlanModel, TargetRow } from './plan-model';
import type { SeedUnit } from './crop-table';
import { NUTRIENT_KEYS, nutrientDef, type NutrientKey } from './nutrients';

export type PlanStatus = 'optimal' | 'infeasible-best-effort';

/** Why a target is not met. */
export type LimitReason = 'no-crop' | 'area-limit' | 'crop-cap' | 'category-cap';

export interface PlannedCrop {
  cropKey: string;
  name: string;
  areaM2: number;
  /** Harvest as weighed, kg per season. */
  expectedKg: number;
  /** The yield the plan counts with, kg per m²; `ownYield` when it is the household's own measured one. */
  yieldKgM2: number;
  ownYield: boolean;
  /** Seed the area needs from the sowing rate (grams, or raised plants); null when the table has no rate. */
  seedNeeded: { amount: number; unit: SeedUnit } | null;
  /** Grams kept as seed from this crop last season. */
  seedKept: number;
}

export interface PlanLimit {
  nutrient: NutrientKey;
  target: number;
  /** The share reached: over the year, or in the leanest month on the monthly basis. */
  achieved: number;
  /** Months ('YYYY-MM') that stay short, on the monthly basis. */
  months?: string[];
  reasons: LimitReason[];
  /** Crops held at the energy cap, or in a group held at its daily cap, that supply this nutrient. */
  cappedCrops: string[];
  message: string;
}

export interface PlanAnswer {
  status: PlanStatus;
  basis: PlanBasis;
  addedAreaM2: number;
  crops: PlannedCrop[];
  /** Share of the year's need per nutrient, with the plan's areas added to the current home supply. */
  projected: Partial<Record<NutrientKey, number | null>>;
  projectedMonths: { month: string; values: Partial<Record<NutrientKey, number | null>> }[];
  limits: PlanLimit[];
}

const TOLERANCE = 1e-6;

/** Rounds an area up to 0.01 m² (solver noise below 1e-7 m² counts as none). Example: `roundArea(2.3412)` → 2.35 */
export function roundArea(m2: number): number {
  if (!(m2 > 1e-7)) return 0;
  return Math.ceil(m2 * 100 - 1e-6) / 100;
}

const round = (x: number, places: number) => Math.round(x * 10 ** places) / 10 ** places;

/** The nutrients the plan projects: every nutrient the need is given for. */
function projectedKeys(model: PlanModel): NutrientKey[] {
  return NUTRIENT_KEYS.filter((k) => model.input.need[k] !== undefined);
}

/**
 * Home supply plus what the given areas give, as shares of need: per nutrient over the year and
 * per month. Exported so a test (or a caller changing an area by hand) can recompute a plan.
 */
export function projectShares(model: PlanModel, areas: ReadonlyMap<string, number>) {
  const keys = projectedKeys(model);
  const projected: Partial<Record<NutrientKey, number | null>> = {};
  const projectedMonths = model.months.map((month) => ({ month, values: {} as Partial<Record<NutrientKey, number | null>> }));
  for (const key of keys) {
    const need = model.input.need[key]!;
    const home = model.input.homeSupply[key] ?? new Array<number>(12).fill(0);
    let totalNeed = 0;
    let totalSupply = 0;
    for (let m = 0; m < 12; m++) {
      let supply = home[m] ?? 0;
      for (const c of model.crops) supply += (areas.get(c.key) ?? 0) * (c.perM2[key] ?? 0) * c.monthShare[m]!;
      totalNeed += need[m]!;
      totalSupply += supply;
      projectedMonths[m]!.values[key] = need[m]! > 0 ? supply / need[m]! : null;
    }
    projected[key] = totalNeed > 0 ? totalSupply / totalNeed : null;
  }
  return { projected, projectedMonths };
}

function percent(share: number): string {
  return `${Math.round(share * 100)} %`;
}

function nameList(names: string[]): string {
  return names.length <= 1 ? (names[0] ?? '') : `${names.slice(0, -1).join(', ')} and ${names[names.length - 1]}`;
}

/** Why the short rows of one nutrient stay short, read from what binds in the plan. */
function limitFor(model: PlanModel, nutrient: NutrientKey, shortRows: TargetRow[], areas: ReadonlyMap<string, number>, achieved: number): PlanLimit {
  const target = model.targets[nutrient]!;
  const reasons = new Set<LimitReason>();
  const capped = new Set<string>();
  const suppliers = new Set<ModelCrop>();
  const fullGroups = new Set<CapGroup>();
  for (const r of shortRows) {
    if (r.unsupplied) reasons.add('no-crop');
    model.crops.forEach((c, i) => {
      if (r.coeffs[i]! > 0) suppliers.add(c);
    });
  }
  const total = [...areas.values()].reduce((a, b) => a + b, 0);
  if (model.maxAreaM2 != null && total >= model.maxAreaM2 - 0.01 - TOLERANCE) reasons.add('area-limit');
  const groupKg = (g: CapGroup) => model.crops.filter((c) => c.capGroup === g).reduce((s, c) => s + (areas.get(c.key) ?? 0) * c.edibleKgM2, 0);
  for (const c of suppliers) {
    const area = areas.get(c.key) ?? 0;
    if (c.energyCapM2 !== null && area >= c.energyCapM2 * (1 - 1e-6) - 0.01) {
      reasons.add('crop-cap');
      capped.add(c.key);
    }
    if (c.capGroup && groupKg(c.capGroup) >= model.capKg[c.capGroup] * (1 - 1e-6) - 0.01 * c.edibleKgM2) {
      reasons.add('category-cap');
      fullGroups.add(c.capGroup);
      capped.add(c.key);
    }
  }
  const def = nutrientDef(nutrient);
  const months = model.basis === 'month' ? shortRows.map((r) => model.months[r.month!]!) : undefined;
  const why: string[] = [];
  const unsuppliedMonths = shortRows.filter((r) => r.unsupplied);
  if (unsuppliedMonths.length > 0) {
    why.push(
      model.basis === 'month'
        ? `no candidate crop gives any in ${nameList(unsuppliedMonths.map((r) => model.months[r.month!]!))}`
        : 'no candidate crop supplies it',
    );
  }
  if (reasons.has('area-limit')) why.push(`the plan fills the area limit of ${model.maxAreaM2} m²`);
  const atEnergyCap = model.crops.filter((c) => capped.has(c.key) && c.energyCapM2 !== null && (areas.get(c.key) ?? 0) >= c.energyCapM2 * (1 - 1e-6) - 0.01);
  if (atEnergyCap.length > 0) {
    const names = atEnergyCap.map((c) => c.name);
    why.push(`${nameList(names)} ${names.length === 1 ? 'is' : 'are'} held at ${percent(model.maxShareOfEnergyPerCrop)} of the energy need per crop`);
  }
  if (reasons.has('category-cap')) {
    why.push(`the added ${[...fullGroups].join(' and ')} reach the daily cap per person`);
  }
  const reached = model.basis === 'month' ? `reaches ${percent(achieved)} of need in its leanest month` : `reaches ${percent(achieved)} of the year's need`;
  const fix = reasons.has('area-limit') ? ' Raise the area limit, lower the target or add crops that supply it.' : ' Lower the target or add crops that supply it.';
  return {
    nutrient,
    target,
    achieved,
    ...(months ? { months } : {}),
    reasons: [...reasons],
    cappedCrops: [...capped],
    message: `${def?.name ?? nutrient} ${reached}, short of the ${percent(target)} target: ${why.join('; ') || 'the caps allow no more'}.${fix}`,
  };
}

/**
 * The answer for a solved model: `primal` maps LP column names (a0, a1, …) to their values.
 * Example: `readPlan(model, new Map([['a0', 12.5]]), 'optimal').crops[0].areaM2` → 12.5
 */
export function readPlan(model: PlanModel, primal: ReadonlyMap<string, number>, status: PlanStatus): PlanAnswer {
  const areas = new Map<string, number>();
  const crops: PlannedCrop[] = [];
  for (const c of model.crops) {
    const area = roundArea(primal.get(c.column) ?? 0);
    if (area <= 0) continue;
    areas.set(c.key, area);
    const row = c.candidate.row;
    crops.push({
      cropKey: c.key,
      name: c.name,
      areaM2: area,
      expectedKg: round(area * c.yieldKgM2, 2),
      yieldKgM2: c.yieldKgM2,
      ownYield: c.ownYield,
      seedNeeded: row.seedPerM2 != null && row.seedUnit != null ? { amount: round(area * row.seedPerM2, 1), unit: row.seedUnit } : null,
      seedKept: c.candidate.seedKeptG ?? 0,
    });
  }
  crops.sort((a, b) => b.areaM2 - a.areaM2 || a.cropKey.localeCompare(b.cropKey));
  const { projected, projectedMonths } = projectShares(model, areas);

  const limits: PlanLimit[] = [];
  const targetKeys = (Object.keys(model.targets) as NutrientKey[]).filter((k) => model.rows.some((r) => r.nutrient === k));
  for (const nutrient of targetKeys) {
    const target = model.targets[nutrient]!;
    const rows = model.rows.filter((r) => r.nutrient === nutrient);
    const shareOf = (r: TargetRow) => (r.month === null ? projected[nutrient] : projectedMonths[r.month]!.values[nutrient]) ?? 0;
    const short = rows.filter((r) => shareOf(r) < target - TOLERANCE);
    if (short.length === 0) continue;
    const achieved = Math.min(...rows.map(shareOf));
    limits.push(limitFor(model, nutrient, short, areas, achieved));
  }

  return {
    status: limits.length > 0 ? 'infeasible-best-effort' : status,
    basis: model.basis,
    addedAreaM2: round([...areas.values()].reduce((a, b) => a + b, 0), 2),
    crops,
    projected,
    projectedMonths,
    limits,
  };
}
