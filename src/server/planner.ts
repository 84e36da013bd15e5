/**
 * Solves the planting plan with HiGHS (npm `highs`, WebAssembly). The solver is loaded once per
 * process — a module-level promise, so concurrent first requests share one load — and each plan
 * is a few one-shot solves of the programme of src/lib/plan-model.ts: the least area that meets
 * every target, or, when that is impossible, the least weighted shortfall and then the least area
 * within it (the best achievable plan). Each solve hands HiGHS the programme as packed arrays
 * (src/lib/plan-matrix.ts: the same numbers and order as its LP text), since reading the text back
 * cost several times the solve itself. The wasm file is read from the package itself and handed
 * to the loader, so a bundled server finds it wherever its own chunk lands.
 */
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import type { Highs } from 'highs';
import { packProgram } from '@/lib/plan-matrix';
import { planProgram, preparePlan, type PlanInput, type PlanModel, type PlanStage } from '@/lib/plan-model';
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

/** HiGHS's model status codes as the words its LP-text solver used (the planner's checks read these). */
const STATUS_WORDS: Record<number, string> = { 7: 'Optimal', 8: 'Infeasible', 9: 'Primal infeasible or unbounded', 10: 'Unbounded' };

function solve(highs: Highs, model: PlanModel, stage: PlanStage): Solved {
  const m = packProgram(planProgram(model, stage));
  const numCols = m.columns.length;
  const numRows = m.rowNames.length;
  return highs.withModel((lp) => {
    lp.options.set('output_flag', false);
    lp.passModel({
      numCols,
      numRows,
      colCost: m.colCost,
      colLower: m.colLower,
      colUpper: m.colUpper,
      rowLower: m.rowLower,
      rowUpper: m.rowUpper,
      matrix: { format: 'csc', numRows, numCols, starts: m.starts, indices: m.indices, values: m.values },
    });
    const run = lp.run();
    const status = STATUS_WORDS[run.modelStatus] ?? `model status ${run.modelStatus}`;
    const primal = new Map<string, number>();
    if (status === 'Optimal') {
      const values = lp.getSolution().colValue;
      m.columns.forEach((name, i) => primal.set(name, values[i]!));
    }
    return { status, objective: lp.getObjectiveValue(), primal };
  });
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
