/**
 * The import graph of src/ (relative and "@/" imports, type imports included), for the test that
 * keeps the layers apart: no import circles anywhere, and src/lib importing nothing outside src/lib
 * (data files included: src/lib reads nothing from outside it).
 * A reimplementation of the lead's small tools/import-graph.mjs, so the check runs in CI on its own.
 */
import { existsSync, readdirSync, readFileSync, statSync } from 'node:fs';
import { dirname, join, relative, resolve } from 'node:path';

const EXTENSIONS = ['', '.ts', '.tsx', '.astro', '.mjs', '/index.ts', '/index.tsx'];
const IMPORT = /(?:import|export)\s+(?:type\s+)?[^'"]*?from\s+['"]([^'"]+)['"]|import\(\s*['"]([^'"]+)['"]\s*\)/g;

export interface ImportReport {
  files: number;
  /** Each circle as 'a -> b -> …' (paths relative to the project root). */
  cycles: string[];
  /** 'src/lib/x.ts -> src/server/y.ts' for every import out of src/lib, data files included. */
  libOut: string[];
}

function walk(dir: string, out: string[]): string[] {
  for (const entry of readdirSync(dir)) {
    const p = join(dir, entry);
    if (statSync(p).isDirectory()) walk(p, out);
    else if (/\.(ts|tsx|astro|mjs)$/.test(p)) out.push(p);
  }
  return out;
}

function resolveImport(src: string, from: string, spec: string): string | null {
  let base: string;
  if (spec.startsWith('.')) base = resolve(dirname(from), spec);
  else if (spec.startsWith('@/')) base = join(src, spec.slice(2));
  else return null;
  for (const e of EXTENSIONS) {
    const p = base + e;
    if (existsSync(p) && statSync(p).isFile()) return p;
  }
  const ts = base.replace(/\.js$/, '.ts');
  return existsSync(ts) ? ts : null;
}

/** Reads src/ under a project root. Example: `importReport(process.cwd()).cycles` → [] */
export function importReport(root: string): ImportReport {
  const src = join(root, 'src');
  const files = walk(src, []);
  const graph = new Map<string, Set<string>>();
  for (const f of files) {
    const out = new Set<string>();
    for (const m of readFileSync(f, 'utf8').matchAll(IMPORT)) {
      const p = resolveImport(src, f, (m[1] ?? m[2])!);
      if (p) out.add(p);
    }
    graph.set(f, out);
  }
  const rel = (p: string) => relative(root, p);
  const cycles: string[] = [];
  const state = new Map<string, 1 | 2>();
  const stack: string[] = [];
  const visit = (v: string): void => {
    state.set(v, 1);
    stack.push(v);
    for (const w of graph.get(v) ?? []) {
      if (state.get(w) === 1) cycles.push(stack.slice(stack.indexOf(w)).map(rel).join(' -> '));
      else if (!state.get(w)) visit(w);
    }
    stack.pop();
    state.set(v, 2);
  };
  for (const f of files) if (!state.get(f)) visit(f);
  const libOut: string[] = [];
  for (const [f, out] of graph) {
    if (!rel(f).startsWith('src/lib/')) continue;
    for (const w of out) if (!rel(w).startsWith('src/lib/')) libOut.push(`${rel(f)} -> ${rel(w)}`);
  }
  return { files: files.length, cycles, libOut };
}
