import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { DRI_ROWS, type DriRow } from '@/lib/dri-table';
import { dailyNeed, dailyNeeds, driRow } from '@/lib/requirements';
import { isNutrientKey } from '@/lib/nutrients';

const csvPath = fileURLToPath(new URL('../../reference-data/dri.csv', import.meta.url));

function csvRows(): DriRow[] {
  const parsed = Papa.parse<Record<string, string>>(readFileSync(csvPath, 'utf8'), { header: true, skipEmptyLines: true });
  expect(parsed.errors).toEqual([]);
  return parsed.data.map((r) => ({
    nutrient: r.nutrient_key as DriRow['nutrient'],
    lifeStage: r.life_stage!,
    sex: r.sex as DriRow['sex'],
    ageMin: Number(r.age_min),
    ageMax: r.age_max === '' ? null : Number(r.age_max),
    condition: r.condition as DriRow['condition'],
    value: Number(r.value),
    basis: r.basis as DriRow['basis'],
    source: r.source!,
  }));
}

const need = (person: Parameters<typeof dailyNeed>[0], key: Parameters<typeof dailyNeed>[1]) => dailyNeed(person, key)?.value;

describe('the DRI table', () => {
  it('is the same in reference-data/dri.csv and src/lib/dri-table.ts', () => {
    expect(csvRows()).toEqual(DRI_ROWS);
  });

  it('names a source on every row and only RDA or AI as basis', () => {
    for (const row of DRI_ROWS) {
      expect(row.source.length).toBeGreaterThan(10);
      expect(['RDA', 'AI']).toContain(row.basis);
      expect(isNutrientKey(row.nutrient)).toBe(true);
      expect(row.value).toBeGreaterThan(0);
    }
  });

  it('has no overlapping life-stage groups for one nutrient', () => {
    for (const a of DRI_ROWS) {
      for (const b of DRI_ROWS) {
        if (a === b || a.nutrient !== b.nutrient || a.condition !== b.condition) continue;
        if (a.sex !== b.sex && a.sex !== 'any' && b.sex !== 'any') continue;
        const overlap = a.ageMin < (b.ageMax ?? Infinity) && b.ageMin < (a.ageMax ?? Infinity);
        expect(overlap, `${a.nutrient}: ${a.lifeStage} / ${b.lifeStage}`).toBe(false);
      }
    }
  });

  it('covers the nutrients of the share report that have an RDA or AI', () => {
    const keys = new Set(DRI_ROWS.map((r) => r.nutrient));
    for (const key of [
      'protein_g', 'carbohydrate_g', 'fiber_g', 'vitamin_a_rae_ug', 'vitamin_c_mg', 'folate_dfe_ug', 'vitamin_k_ug',
      'vitamin_b12_ug', 'calcium_mg', 'iron_mg', 'magnesium_mg', 'potassium_mg', 'zinc_mg',
    ] as const) {
      expect(keys.has(key), key).toBe(true);
    }
  });
});

describe('daily need from the DRI', () => {
  const woman25 = { sex: 'female', ageYears: 25 } as const;
  const man25 = { sex: 'male', ageYears: 25 } as const;

  it('gives the protein RDA of adults', () => {
    expect(need(woman25, 'protein_g')).toBe(46); // RDA protein, women 19–30 y: 46 g/day (National Academies DRI, Macronutrients table)
    expect(need(man25, 'protein_g')).toBe(56); // RDA protein, men 19–30 y: 56 g/day (National Academies DRI, Macronutrients table)
    expect(dailyNeed(woman25, 'protein_g')?.basis).toBe('RDA');
  });

  it('gives iron by sex and age', () => {
    expect(need({ sex: 'female', ageYears: 40 }, 'iron_mg')).toBe(18); // RDA iron, women 31–50 y: 18 mg/day (DRI Elements table)
    expect(need({ sex: 'female', ageYears: 60 }, 'iron_mg')).toBe(8); // RDA iron, women 51–70 y: 8 mg/day (DRI Elements table)
    expect(need({ sex: 'male', ageYears: 16 }, 'iron_mg')).toBe(11); // RDA iron, boys 14–18 y: 11 mg/day (DRI Elements table)
    expect(need({ sex: 'female', ageYears: 0.75 }, 'iron_mg')).toBe(11); // RDA iron, infants 7–12 mo: 11 mg/day (DRI Elements table)
    expect(dailyNeed({ sex: 'male', ageYears: 0.2 }, 'iron_mg')).toMatchObject({ value: 0.27, basis: 'AI' }); // AI iron, infants 0–6 mo: 0.27 mg/day
  });

  it('gives calcium by the 2011 values', () => {
    expect(need({ sex: 'male', ageYears: 60 }, 'calcium_mg')).toBe(1000); // RDA calcium, men 51–70 y: 1,000 mg/day (IOM 2011; DRI Elements table)
    expect(need({ sex: 'female', ageYears: 60 }, 'calcium_mg')).toBe(1200); // RDA calcium, women 51–70 y: 1,200 mg/day (IOM 2011; DRI Elements table)
    expect(need({ sex: 'male', ageYears: 2 }, 'calcium_mg')).toBe(700); // RDA calcium, children 1–3 y: 700 mg/day (IOM 2011; DRI Elements table)
    expect(need({ sex: 'female', ageYears: 12 }, 'calcium_mg')).toBe(1300); // RDA calcium, girls 9–13 y: 1,300 mg/day (IOM 2011)
  });

  it('gives vitamins for adults, pregnancy and lactation', () => {
    expect(need(man25, 'vitamin_c_mg')).toBe(90); // RDA vitamin C, men 19–30 y: 90 mg/day (DRI Vitamins table)
    expect(need(woman25, 'vitamin_c_mg')).toBe(75); // RDA vitamin C, women 19–30 y: 75 mg/day (DRI Vitamins table)
    expect(need({ ...woman25, condition: 'pregnancy' }, 'vitamin_c_mg')).toBe(85); // RDA vitamin C, pregnancy 19–30 y: 85 mg/day
    expect(need({ sex: 'female', ageYears: 17, condition: 'lactation' }, 'vitamin_c_mg')).toBe(115); // RDA vitamin C, lactation ≤18 y: 115 mg/day
    expect(need({ ...woman25, condition: 'pregnancy' }, 'folate_dfe_ug')).toBe(600); // RDA folate, pregnancy: 600 µg DFE/day (DRI Vitamins table)
    expect(need({ ...woman25, condition: 'lactation' }, 'vitamin_a_rae_ug')).toBe(1300); // RDA vitamin A, lactation 19–30 y: 1,300 µg RAE/day
    expect(need({ sex: 'male', ageYears: 75 }, 'vitamin_d_ug')).toBe(20); // RDA vitamin D, >70 y: 20 µg/day (IOM 2011; DRI Vitamins table)
    expect(need({ sex: 'male', ageYears: 60 }, 'vitamin_b6_mg')).toBe(1.7); // RDA vitamin B6, men 51–70 y: 1.7 mg/day (DRI Vitamins table)
    expect(need({ sex: 'male', ageYears: 0.3 }, 'vitamin_a_rae_ug')).toBe(400); // AI vitamin A, infants 0–6 mo: 400 µg/day (DRI Vitamins table)
  });

  it('gives the AI where no RDA exists', () => {
    expect(dailyNeed(man25, 'vitamin_k_ug')).toMatchObject({ value: 120, basis: 'AI' }); // AI vitamin K, men 19–30 y: 120 µg/day (DRI Vitamins table)
    expect(dailyNeed(woman25, 'vitamin_k_ug')).toMatchObject({ value: 90, basis: 'AI' }); // AI vitamin K, women 19–30 y: 90 µg/day
    expect(dailyNeed({ sex: 'male', ageYears: 6 }, 'fiber_g')).toMatchObject({ value: 25, basis: 'AI' }); // AI total fibre, children 4–8 y: 25 g/day (DRI Macronutrients table)
    expect(need({ sex: 'male', ageYears: 60 }, 'fiber_g')).toBe(30); // AI total fibre, men 51–70 y: 30 g/day
  });

  it('gives potassium and sodium from the 2019 report', () => {
    expect(dailyNeed(woman25, 'potassium_mg')).toMatchObject({ value: 2600, basis: 'AI' }); // AI potassium, women 19+ y: 2,600 mg/day (NASEM 2019 DRI for Sodium and Potassium)
    expect(need(man25, 'potassium_mg')).toBe(3400); // AI potassium, men 19+ y: 3,400 mg/day (NASEM 2019)
    expect(need({ sex: 'female', ageYears: 2 }, 'potassium_mg')).toBe(2000); // AI potassium, children 1–3 y: 2,000 mg/day (NASEM 2019)
    expect(need(man25, 'sodium_mg')).toBe(1500); // AI sodium, adults 19–50 y: 1,500 mg/day (NASEM 2019)
    expect(dailyNeed(man25, 'potassium_mg')?.source).toMatch(/NASEM 2019/);
  });

  it('gives zinc for teenagers by sex', () => {
    expect(need({ sex: 'male', ageYears: 15 }, 'zinc_mg')).toBe(11); // RDA zinc, boys 14–18 y: 11 mg/day (DRI Elements table)
    expect(need({ sex: 'female', ageYears: 15 }, 'zinc_mg')).toBe(9); // RDA zinc, girls 14–18 y: 9 mg/day (DRI Elements table)
  });

  it('answers null, not zero, where the DRI set no need', () => {
    // total fat: no RDA or AI for ages ≥ 1 y, "ND" (DRI Macronutrients table): the AMDR stands in (issue 9, amdr.test.ts)
    expect(dailyNeed(man25, 'fat_g')?.basis).toBe('AMDR');
    expect(dailyNeed(man25, 'sugars_g')).toBeNull();
    expect(dailyNeed(man25, 'cholesterol_mg')).toBeNull();
    expect(dailyNeed({ sex: 'male', ageYears: 0.3 }, 'fat_g')).toMatchObject({ value: 31, basis: 'AI' }); // AI total fat, infants 0–6 mo: 31 g/day
    expect(dailyNeed({ sex: 'male', ageYears: 0.3 }, 'fiber_g')).toBeNull(); // total fibre, infants: "ND"
  });

  it('puts each birthday on the right side of a group boundary', () => {
    expect(driRow({ sex: 'female', ageYears: 30.99 }, 'iron_mg')?.lifeStage).toBe('females 19–30 y');
    expect(driRow({ sex: 'female', ageYears: 31 }, 'iron_mg')?.lifeStage).toBe('females 31–50 y');
    expect(driRow({ sex: 'male', ageYears: 70 }, 'calcium_mg')?.lifeStage).toBe('males 51–70 y');
    expect(driRow({ sex: 'male', ageYears: 71 }, 'calcium_mg')?.lifeStage).toBe('males >70 y');
    expect(driRow({ sex: 'male', ageYears: 0.5 }, 'protein_g')?.lifeStage).toBe('infants 7–12 mo');
  });

  it('uses the oldest pregnancy group past the table', () => {
    expect(driRow({ sex: 'female', ageYears: 52, condition: 'pregnancy' }, 'iron_mg')?.lifeStage).toBe('pregnancy 31–50 y');
  });

  it('takes energy from the EER', () => {
    const energy = dailyNeed({ sex: 'male', ageYears: 30, heightCm: 177, weightKg: 70, activity: 'active' }, 'energy_kcal');
    expect(energy?.basis).toBe('EER');
    expect(energy?.value).toBeCloseTo(2962.09, 6); // worked in eer.test.ts from the IOM 2005 adult man equation
  });

  it('lists needs for many nutrients at once', () => {
    const needs = dailyNeeds(woman25, ['iron_mg', 'sugars_g', 'protein_g']);
    expect(needs.iron_mg?.value).toBe(18); // RDA iron, women 19–30 y: 18 mg/day (DRI Elements table)
    expect(needs.sugars_g).toBeNull(); // total sugars: no RDA or AI (DRI Macronutrients table)
    expect(needs.protein_g?.value).toBe(46);
    expect(Object.keys(dailyNeeds(woman25)).length).toBeGreaterThan(30);
  });

  it('refuses a person it cannot place', () => {
    expect(() => dailyNeed({ sex: 'other' as 'female', ageYears: 30 }, 'iron_mg')).toThrow(/sex/);
    expect(() => dailyNeed({ sex: 'female', ageYears: -2 }, 'iron_mg')).toThrow(/age/);
  });
});
