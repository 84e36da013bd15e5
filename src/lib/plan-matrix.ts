/**
 * The plan's linear programme as packed arrays (columns, rows, a column-wise sparse matrix) for a
 * solver that takes them directly, so a plan is not written as 160 KB of LP text and parsed back
 * three times. The arrays say exactly what the LP text of planLp says: the same program
 * (planProgram), every number rounded as the text writes it (12 significant digits), columns
 * numbered in the order an LP reader meets them (objective, then rows, then bounds) and rows in
 * text order. tests/unit/plan-matrix.test.ts checks that against HiGHS's own reading of the text.
 * Pure: no solver.
 */
import type { LpProgram } from './plan-model';

export interface PlanMatrix {
  /** Column names (a0, s3, …) in solver order. */
  columns: string[];
  colCost: number[];
  colLower: number[];
  colUpper: number[];
  rowNames: string[];
  rowLower: number[];
  rowUpper: number[];
  /** Compressed sparse columns: column j's entries (row indices rising) are starts[j] … starts[j + 1] − 1. */
  starts: number[];
  indices: number[];
  values: number[];
}

/** A number as the LP text carries it (infinite bounds stay infinite). Example: `asWritten(1 / 3)` → 0.333333333333 */
export function asWritten(x: number): number {
  // lpNumber's text read back; a double's shortest text reads back as that double, so one step does.
  return Number.isFinite(x) ? Number(x.toPrecision(12)) : x;
}

/** Packs a program (see planProgram) as arrays. Example: `packProgram(planProgram(model, { kind: 'area' })).columns[0]` → 'a0' */
export function packProgram(program: LpProgram): PlanMatrix {
  const index = new Map<string, number>();
  const columns: string[] = [];
  const column = (name: string): number => {
    let i = index.get(name);
    if (i === undefined) {
      i = columns.length;
      index.set(name, i);
      columns.push(name);
    }
    return i;
  };
  // The LP text writes "0 a0" for an empty objective: the reader meets a0 there first.
  const objective = program.objective.length > 0 ? program.objective : ([[0, 'a0']] as const);
  const cost = new Map<number, number>();
  for (const [c, name] of objective) cost.set(column(name), asWritten(c));

  // Entries by column, rows in text order — the layout HiGHS keeps a model read from text in.
  const entries: [number, number][][] = [];
  program.rows.forEach((row, r) => {
    for (const [c, name] of row.terms) (entries[column(name)] ??= []).push([r, asWritten(c)]);
  });
  const lower = new Map<number, number>();
  const upper = new Map<number, number>();
  for (const b of program.bounds) {
    const i = column(b.column);
    lower.set(i, asWritten(b.lower));
    upper.set(i, asWritten(b.upper));
  }
  const starts = [0];
  const indices: number[] = [];
  const values: number[] = [];
  for (let j = 0; j < columns.length; j++) {
    for (const [r, v] of entries[j] ?? []) {
      indices.push(r);
      values.push(v);
    }
    starts.push(indices.length);
  }
  return {
    columns,
    colCost: columns.map((_, i) => cost.get(i) ?? 0),
    // Unbounded columns of LP text are ≥ 0.
    colLower: columns.map((_, i) => lower.get(i) ?? 0),
    colUpper: columns.map((_, i) => upper.get(i) ?? Infinity),
    rowNames: program.rows.map((r) => r.name),
    rowLower: program.rows.map((r) => asWritten(r.lower)),
    rowUpper: program.rows.map((r) => asWritten(r.upper)),
    starts,
    indices,
    values,
  };
}
