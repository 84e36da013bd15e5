import { describe, expect, it } from 'vitest';
import { ifctCoverage, ifctReading, ifctTableOf } from '@/lib/ifct-tables';

// Made-up rows in the package's layout (grams per 100 g); they test the rule, not any food.
const rows: Record<string, string>[] = [
  { code: 'A001', grup: 'Cereals and Millets', water: '9', protcnt: '10', fatce: '2', enerc: '1400', vitc: '0', thia: '0.0003', retol: '0', tocpha: '0.0001' },
  { code: 'A002', grup: 'Cereals and Millets', water: '70', protcnt: '3', fatce: '1', enerc: '500', vitc: '0.004', thia: '0.0002', retol: '0', tocpha: '0.0001' },
  { code: 'O001', grup: 'Animal Meat', water: '66', protcnt: '20', fatce: '12', enerc: '780', vitc: '0', thia: '0.00007', retol: '0.0000075', tocpha: '0.0003' },
  { code: 'T001', grup: 'Edible Oils and Fats', water: '0', protcnt: '0', fatce: '100', enerc: '0', fasat: '90' },
];
const coverage = ifctCoverage(rows);
const at = (code: string) => rows.find((r) => r.code === code)!;

describe('IFCT 2017 book tables: a 0 is a reading or a gap', () => {
  it('reads a 0 as below the detectable limit where the food is in the table and its group has the column', () => {
    // A002 has vitamin C, so the cereal pages print it: A001's 0 is the book's blank
    expect(ifctReading(at('A001'), 'vitc', coverage)).toBe(0);
    expect(ifctReading(at('A002'), 'vitc', coverage)).toBe(0.004);
  });

  it('reads a 0 as unknown where no food of the group has the column', () => {
    // No meat row has vitamin C above 0; no cereal has retinol
    expect(ifctReading(at('O001'), 'vitc', coverage)).toBeNull();
    expect(ifctReading(at('A001'), 'retol', coverage)).toBeNull();
    expect(ifctReading(at('O001'), 'retol', coverage)).toBe(0.0000075);
  });

  it('reads a 0 as unknown where the food has no row in the table', () => {
    // T001 has fat from its own table but no water, protein or energy: not in Table 1
    expect(ifctReading(at('T001'), 'enerc', coverage)).toBeNull();
    expect(ifctReading(at('T001'), 'fatce', coverage)).toBe(100);
    expect(ifctReading(at('T001'), 'fasat', coverage)).toBe(90);
  });

  it('names the table of each column, Table 5 in its two halves', () => {
    expect(ifctTableOf('vitc')?.table).toBe('2');
    expect(ifctTableOf('ca')?.table).toBe('5a');
    expect(ifctTableOf('k')?.table).toBe('5b');
    expect(ifctTableOf('name')).toBeUndefined();
  });
});
