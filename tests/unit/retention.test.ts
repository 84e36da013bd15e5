import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { applyRetention, parseRetentionCsv, retentionTable } from '@/lib/retention';

const csv = readFileSync(new URL('../../reference-data/retention.csv', import.meta.url), 'utf8');
const HEADER = 'method,nutrient_key,retention_pct,item,source';

describe('vitamins kept when food is preserved', () => {
  const rows = parseRetentionCsv(csv);
  const table = retentionTable(rows);

  it('reads every row of retention.csv with its table item and source', () => {
    expect(rows.length).toBeGreaterThan(0);
    for (const row of rows) {
      expect(row.item).toMatch(/^[A-Z]+,/); // the table's items are written "VEGETABLES, …"
      expect(row.source).toMatch(/USDA (Table of Nutrient )?Retention Factors,? Release 6 \(2007\)/);
      expect(row.factor).toBeGreaterThanOrEqual(0);
      expect(row.factor).toBeLessThanOrEqual(1);
    }
  });

  it('reduces vitamin C of a frozen preserved entry by its factor', () => {
    const factor = table.get('frozen')!.get('vitamin_c_mg')!.factor;
    expect(factor).toBe(0.7); // from memory: USDA Retention Factors Release 6 (2007), item VEGETABLES, blanched, frozen: vitamin C 70 %
    const out = applyRetention({ use: 'preserved', preserveMethod: 'frozen' }, { vitamin_c_mg: 100, energy_kcal: 77, folate_dfe_ug: null }, table);
    expect(out.vitamin_c_mg).toBeCloseTo(70, 9);
    expect(out.energy_kcal).toBe(77); // energy has no retention factor: unchanged
    expect(out.folate_dfe_ug).toBeNull(); // unknown stays unknown
  });

  it('changes nothing for fresh or stored food, a preserved entry without a method, or a method with no rows', () => {
    const n = { vitamin_c_mg: 100 };
    expect(applyRetention({ use: 'stored', preserveMethod: 'frozen' }, n, table).vitamin_c_mg).toBe(100);
    expect(applyRetention({ use: 'preserved' }, n, table).vitamin_c_mg).toBe(100);
    expect(applyRetention({ use: 'preserved', preserveMethod: 'smoked' }, n, table).vitamin_c_mg).toBe(100);
    expect(applyRetention({ use: 'preserved', preserveMethod: 'fermented' }, n, table).vitamin_c_mg).toBe(100); // the table has no fermentation rows
  });

  it('refuses a file with a bad method, nutrient, percent or a pair given twice', () => {
    const row = (r: string) => `${HEADER}\n${r}`;
    expect(() => parseRetentionCsv(row('pickled,vitamin_c_mg,50,"VEGETABLES, x",s'))).toThrow(/line 2: the method must be one of/);
    expect(() => parseRetentionCsv(row('frozen,vitamin_q,50,"VEGETABLES, x",s'))).toThrow(/not a nutrient key/);
    expect(() => parseRetentionCsv(row('frozen,vitamin_c_mg,120,"VEGETABLES, x",s'))).toThrow(/percent from 0 to 100/);
    expect(() => parseRetentionCsv(row('frozen,vitamin_c_mg,50,,s'))).toThrow(/item and the source/);
    expect(() => parseRetentionCsv(`${HEADER}\nfrozen,vitamin_c_mg,50,"V, x",s\nfrozen,vitamin_c_mg,60,"V, x",s`)).toThrow(/given twice/);
    expect(() => parseRetentionCsv('method,nutrient_key\nfrozen,vitamin_c_mg')).toThrow(/missing: retention_pct/);
  });
});
