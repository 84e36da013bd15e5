import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { DRI_CSV_PATH, DRI_MODULE_PATH, driModuleText } from '@/cli/gen-dri';
import { DRI_ROWS, DRI_SOURCES } from '@/lib/dri-table';

describe('dri-table', () => {
  it('is generated from reference-data/dri.csv as it is now (run npm run gen:dri after editing the CSV)', () => {
    expect(readFileSync(DRI_MODULE_PATH, 'utf8')).toBe(driModuleText(readFileSync(DRI_CSV_PATH, 'utf8')));
  });

  it('names only the sources listed in DRI_SOURCES, and uses each of them', () => {
    expect(new Set(DRI_ROWS.map((r) => r.source))).toEqual(new Set(Object.values(DRI_SOURCES)));
  });

  it('reads the published values through the typed rows', () => {
    const row = DRI_ROWS.find((r) => r.nutrient === 'protein_g' && r.lifeStage === 'females 19–30 y');
    expect(row?.value).toBe(46); // RDA protein, women 19–30 y: 46 g/day (National Academies, Dietary Reference Intakes)
    expect(row?.basis).toBe('RDA');
    expect(DRI_ROWS.find((r) => r.nutrient === 'protein_g' && r.lifeStage === 'males >70 y')?.ageMax).toBeNull();
  });

  it('refuses a CSV whose columns are not the expected ones', () => {
    expect(() => driModuleText('nutrient,stage\nprotein_g,x\n')).toThrow(/must start with the columns/);
  });
});
