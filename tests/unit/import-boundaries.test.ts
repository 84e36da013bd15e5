import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { importReport } from '../support/import-graph';

const root = fileURLToPath(new URL('../..', import.meta.url));

describe('import boundaries', () => {
  const report = importReport(root);

  it('reads the whole of src/', () => {
    expect(report.files).toBeGreaterThan(100);
  });

  it('has no import circle in src/ (type imports count too)', () => {
    expect(report.cycles).toEqual([]);
  });

  it('keeps src/lib free of src/server, src/db, src/components and src/pages', () => {
    expect(report.libOut).toEqual([]);
  });

  describe('the check itself', () => {
    const fake = mkdtempSync(join(tmpdir(), 'selfsown-imports-'));
    afterAll(() => rmSync(fake, { recursive: true, force: true }));
    mkdirSync(join(fake, 'src/lib'), { recursive: true });
    mkdirSync(join(fake, 'src/server'), { recursive: true });
    writeFileSync(join(fake, 'src/lib/a.ts'), "import type { B } from './b';\nexport type A = 1;\n");
    writeFileSync(join(fake, 'src/lib/b.ts'), "import { a } from './a';\nimport { s } from '@/server/s';\nexport type B = 2;\n");
    writeFileSync(join(fake, 'src/server/s.ts'), 'export const s = 1;\n');
    mkdirSync(join(fake, 'reference-data'));
    writeFileSync(join(fake, 'reference-data/t.json'), '{}\n');
    writeFileSync(join(fake, 'src/lib/c.ts'), "import t from '../../reference-data/t.json';\nexport const c = t;\n");

    it('finds a circle and every import out of src/lib, files outside it included (pure code gets its data from its callers or from src/lib)', () => {
      const r = importReport(fake);
      expect(r.cycles).toEqual(['src/lib/a.ts -> src/lib/b.ts']);
      expect(r.libOut).toEqual(['src/lib/b.ts -> src/server/s.ts', 'src/lib/c.ts -> reference-data/t.json']);
    });
  });
});
