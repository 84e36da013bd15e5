/**
 * Solves the planting plan with HiGHS (npm `highs`, WebAssembly). The solver is loaded once per
 * process — a module-level promise, so concurrent first requests share one load — and each plan
 * is a few one-shot solves of the LP text from src/lib/plan-model.ts: the least area that meets
 * every target, or, when that is impossible, the least weighted shortfall and then the least area
 * within it (the best achievable plan). The wasm file is read from the package itself and handed
 * to the loader, so a bundled server finds it wherever its own chunk lands.
 */
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import type { Highs } from 'highs';
import { planLp, preparePlan, type PlanInput, type PlanModel, type PlanStage } from '@/lib/plan-model';
import { readPlan, type PlanAnswer } from '@/lib/plan-result';

let solver: Promise<Highs> | null = null;

/** The HiGHS runtime, loaded on first use and kept for the life of the process. */
export function loadHighs(): Promise<Highs> {
  solver ??= (async () => {
    const require = createRequire(import.meta.url);
    const wasmBinary = readFileSync(require.resolve('highs/runtime'));
    const loader = (await import('highs')).default;
    return loader({ wasmBinary });
  })().catch((error: unknown) => {
    solver = null; // let the next request try again
    throw error;
  });
  return solver;
}

interface Solved {
  status: string;
  objective: number;
  primal: Map<string, number>;
}

function solve(highs: Highs, model: PlanModel, stage: PlanStage): Solved {
  const result = highs.solve(planLp(model, stage), { output_flag: false });
  const primal = new Map<string, number>();
  if (result.Status === 'Optimal') {
    for (const [name, col] of Object.entries(result.Columns)) primal.set(name, (col as { Primal: number }).Primal);
  }
  return { status: result.Status, objective: result.ObjectiveValue, primal };
}

function mustBeOptimal(s: Solved, what: string): Solved {
  if (s.status !== 'Optimal') throw new Error(`The planner's ${what} model ended "${s.status}" instead of optimal; this is a bug in the model, not in the request.`);
  return s;
}

/**
 * The plan for one household and year: the least added area of the candidate crops that lifts
 * every target nutrient to its share of need (over the year or in every month), or the best
 * achievable plan with the reasons each unmet target falls short.
 * Example: `(await planPlanting(input)).crops[0]` → { cropKey: 'potatoes', areaM2: 12.4, … }
 */
export async function planPlanting(input: PlanInput): Promise<PlanAnswer> {
  const model = preparePlan(input);
  if (model.rows.length === 0 || model.crops.length === 0) return readPlan(model, new Map(), model.rows.length === 0 ? 'optimal' : 'infeasible-best-effort');
  const highs = await loadHighs();
  if (!model.rows.some((r) => r.unsupplied)) {
    const first = solve(highs, model, { kind: 'area' });
    if (first.status === 'Optimal') return readPlan(model, first.primal, 'optimal');
    if (first.status !== 'Infeasible' && first.status !== 'Primal infeasible or unbounded') mustBeOptimal(first, 'least-area');
  }
  const least = mustBeOptimal(solve(highs, model, { kind: 'shortfall' }), 'least-shortfall');
  const best = mustBeOptimal(solve(highs, model, { kind: 'area-within-shortfall', maxShortfall: least.objective }), 'best-effort');
  return readPlan(model, best.primal, 'infeasible-best-effort');
}
