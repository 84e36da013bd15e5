/**
 * One row of the benchmark's table and the arithmetic around it: medians of alternating rounds,
 * percentiles, and the row's pass mark. `.data/bench/latest.json` holds these rows as they are.
 */
export interface BenchRow {
  name: string;
  /** What was measured (unit in `unit`): a median of rounds, a p95, req/s or MB. */
  value: number;
  /** What it is compared with, measured side by side in the same run; null when the row has none. */
  baseline: number | null;
  /** value ÷ baseline; null without a baseline. */
  ratio: number | null;
  /** The pass mark, as text (e.g. "ratio <= 1.5"). */
  target: string;
  pass: boolean;
}

export const median = (xs: readonly number[]): number => {
  const s = [...xs].sort((a, b) => a - b);
  const mid = Math.floor(s.length / 2);
  return s.length % 2 ? s[mid]! : (s[mid - 1]! + s[mid]!) / 2;
};

/** The 95th percentile (nearest rank). */
export const p95 = (xs: readonly number[]): number => {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.ceil(0.95 * s.length) - 1)]!;
};

/** A row compared with a baseline: pass when the ratio is at most (or, for `atLeast`, at least) `limit`. */
export function ratioRow(name: string, value: number, baseline: number, limit: number, opts: { atLeast?: boolean; also?: { ok: boolean; text: string } } = {}): BenchRow {
  const ratio = value / baseline;
  const ok = opts.atLeast ? ratio >= limit : ratio <= limit;
  const target = `ratio ${opts.atLeast ? '>=' : '<='} ${limit}${opts.also ? `, ${opts.also.text}` : ''}`;
  return { name, value, baseline, ratio, target, pass: ok && (opts.also?.ok ?? true) };
}

/** A row with an absolute limit only (value < limit). */
export function limitRow(name: string, value: number, limit: number, unit: string): BenchRow {
  return { name, value, baseline: null, ratio: null, target: `value < ${limit} ${unit}`, pass: value < limit };
}

/** Milliseconds since `t0` (performance.now()). */
export const since = (t0: number): number => performance.now() - t0;
