/**
 * Daily need per nutrient for one person: the RDA, or the AI where no RDA exists, of the
 * National Academies' Dietary Reference Intakes for the person's life-stage group
 * (reference-data/dri.csv, mirrored in dri-table.ts); energy from eer.ts.
 * A nutrient without a published value for the group (sugars, cholesterol, an infant's fibre, …)
 * has no need: null, never zero.
 *
 * Issue 9 refines the table value where the sources do: protein from the person's weight when
 * given (protein-need.ts), a vegetarian's iron × 1.8 (diet.ts), and carbohydrate and fat as the
 * acceptable macronutrient distribution range from the energy need (amdr.ts) instead of a gram RDA.
 */
import { AMDR_SOURCE, amdrGrams, isAmdrKey } from './amdr';
import { DIET_SOURCE, dietFactor, type Diet } from './diet';
import { DRI_ROWS, type DriRow } from './dri-table';
import { estimatedEnergyRequirement, referenceBody, type EnergyPerson } from './eer';
import { NUTRIENT_KEYS, type NutrientKey } from './nutrients';
import { PROTEIN_SOURCE, proteinByWeight, proteinPerKg } from './protein-need';

export type { Sex, Condition, Activity } from './eer';

export type { Diet } from './diet';

/** Who a need is for: sex, age in years, for energy the EER inputs (weightKg also sets protein), and diet. */
export interface RequirementPerson extends EnergyPerson {
  /** 'vegetarian' raises the iron RDA 1.8 times (IOM 2001); default: eats meat. */
  diet?: Diet | null;
}

export interface DailyNeed {
  /** Per day, in the unit of the nutrient key; for an AMDR the low end of the range. */
  value: number;
  /** For carbohydrate and fat from 1 year: the AMDR in grams a day (low = value); else null. */
  range: { low: number; high: number } | null;
  basis: 'RDA' | 'AI' | 'EER' | 'stated' | 'AMDR';
  source: string;
  /** DRI life-stage group the value belongs to (null for a stated energy need). */
  lifeStage: string | null;
  /** Assumptions behind an estimate (reference body, default activity, …); empty for table values. */
  notes: string[];
}

const rowsByNutrient = new Map<NutrientKey, DriRow[]>();
for (const row of DRI_ROWS) {
  const list = rowsByNutrient.get(row.nutrient) ?? [];
  list.push(row);
  rowsByNutrient.set(row.nutrient, list);
}

function inAgeRange(row: DriRow, age: number): boolean {
  return row.ageMin <= age && (row.ageMax === null || age < row.ageMax);
}

/**
 * The DRI table row that applies to a person, or null when the table has none.
 * Pregnancy and lactation rows apply whatever the sex field says (the DRI groups are not split
 * by sex); past the table's oldest pregnancy/lactation group (31–50 y) that group is used.
 * Ages: ageMin ≤ age < ageMax, so 30.9 years is 19–30 and 31 is 31–50.
 * e.g. driRow({ sex: 'female', ageYears: 25 }, 'protein_g')?.value → 46.
 */
export function driRow(person: Pick<RequirementPerson, 'sex' | 'ageYears' | 'condition'>, key: NutrientKey): DriRow | null {
  checkPerson(person);
  const rows = rowsByNutrient.get(key);
  if (!rows) return null;
  const { ageYears: age, condition } = person;
  if (condition) {
    const forCondition = rows.filter((r) => r.condition === condition);
    const exact = forCondition.find((r) => inAgeRange(r, age));
    if (exact) return exact;
    // older than the table's groups: the oldest group that starts at or below the age
    const below = forCondition.filter((r) => r.ageMin <= age).sort((a, b) => b.ageMin - a.ageMin);
    return below[0] ?? null;
  }
  return rows.find((r) => r.condition === 'none' && (r.sex === 'any' || r.sex === person.sex) && inAgeRange(r, age)) ?? null;
}

/**
 * A person's daily need for one nutrient, or null when the DRI set none for their group,
 * e.g. dailyNeed({ sex: 'male', ageYears: 25 }, 'protein_g') → { value: 56, basis: 'RDA', … };
 * dailyNeed({ sex: 'male', ageYears: 25, weightKg: 80 }, 'protein_g').value → 64 (0.80 g/kg);
 * dailyNeed({ sex: 'male', ageYears: 25 }, 'sugars_g') → null.
 */
export function dailyNeed(person: RequirementPerson, key: NutrientKey): DailyNeed | null {
  checkPerson(person);
  if (key === 'energy_kcal') {
    const energy = estimatedEnergyRequirement(person);
    return {
      value: energy.value,
      range: null,
      basis: energy.basis,
      source: energy.source,
      lifeStage: energy.basis === 'stated' ? null : referenceBody(person.sex, person.ageYears).group,
      notes: energy.assumptions,
    };
  }
  if (isAmdrKey(key)) {
    const energy = estimatedEnergyRequirement(person);
    const range = amdrGrams(key, person.ageYears, energy.value);
    if (range) {
      return {
        value: range.low,
        range,
        basis: 'AMDR',
        source: AMDR_SOURCE,
        lifeStage: null,
        notes: [`from an energy need of ${Math.round(energy.value)} kcal a day (${energy.basis === 'stated' ? 'stated' : 'EER'})`],
      };
    }
  }
  const row = driRow(person, key);
  if (!row) return null;
  const need: DailyNeed = { value: row.value, range: null, basis: row.basis, source: row.source, lifeStage: row.lifeStage, notes: [] };
  if (key === 'protein_g') {
    const byWeight = proteinByWeight({ ageYears: person.ageYears, weightKg: person.weightKg, condition: person.condition });
    if (byWeight !== null) {
      need.value = byWeight;
      need.basis = 'RDA';
      need.source = PROTEIN_SOURCE;
      need.notes.push(`${proteinPerKg(person.ageYears, person.condition)} g/kg/day × ${person.weightKg} kg`);
    }
  }
  const factor = dietFactor(key, person.diet, need.basis);
  if (factor !== 1) {
    need.value *= factor;
    need.notes.push(`vegetarian diet: × ${factor} (${DIET_SOURCE})`);
  }
  return need;
}

/**
 * Daily needs for several nutrients (all Selfsown knows by default); null where none is set,
 * e.g. dailyNeeds({ sex: 'female', ageYears: 30 }, ['iron_mg', 'fat_g']) → { iron_mg: { value: 18, … }, fat_g: null }.
 */
export function dailyNeeds<K extends NutrientKey = NutrientKey>(
  person: RequirementPerson,
  keys: readonly K[] = NUTRIENT_KEYS as readonly K[],
): Record<K, DailyNeed | null> {
  const out = {} as Record<K, DailyNeed | null>;
  for (const key of keys) out[key] = dailyNeed(person, key);
  return out;
}

function checkPerson(person: Pick<RequirementPerson, 'sex' | 'ageYears' | 'condition'>): void {
  if (person.sex !== 'female' && person.sex !== 'male') {
    throw new RangeError(`sex must be "female" or "male", got "${String(person.sex)}"`);
  }
  if (!Number.isFinite(person.ageYears) || person.ageYears < 0 || person.ageYears > 130) {
    throw new RangeError(`age must be a number of years from 0 to 130, got ${person.ageYears}`);
  }
  if (person.condition != null && person.condition !== 'pregnancy' && person.condition !== 'lactation') {
    throw new RangeError(`condition must be "pregnancy" or "lactation", got "${String(person.condition)}"`);
  }
}
