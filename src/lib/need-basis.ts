/**
 * What a household's need for a nutrient rests on over a range of months. A recommended intake
 * is an RDA (covers nearly everyone) or, where the evidence was too thin for one, an AI (not a
 * requirement; a share below it says less); energy is the IOM EER; carbohydrate and fat are the
 * low end of the AMDR. The dashboard labels the need with this, and says 'mixed' when the people
 * at home rest on different kinds of value (a baby's AI beside the parents' RDA).
 */
import { eatsHouseholdFood, stageDailyNeeds, type NeedMemo, type Person } from './needs';
import { lifeStageIn } from './life-stage';
import type { NutrientKey } from './nutrients';

export type NeedBasis = 'RDA' | 'AI' | 'AMDR' | 'EER' | 'mixed';

/**
 * The kind of value behind each nutrient's need over the given months: one of RDA, AI, AMDR,
 * EER (energy, estimated or stated), 'mixed' when the people who eat at home differ, null when
 * nobody at home has a value (or nobody is at home),
 * e.g. needBasis([{ sex: 'female', ageYears: 30 }], ['2026-05'], ['iron_mg', 'vitamin_k_ug']) → { iron_mg: 'RDA', vitamin_k_ug: 'AI' }.
 */
export function needBasis<K extends NutrientKey>(people: readonly Person[], months: readonly string[], keys: readonly K[], memo?: NeedMemo): Record<K, NeedBasis | null> {
  const seen = {} as Record<K, Set<Exclude<NeedBasis, 'mixed'>>>;
  for (const key of keys) seen[key] = new Set();
  for (const month of months) {
    for (const person of people) {
      if (!eatsHouseholdFood(person, month)) continue;
      const known = stageDailyNeeds(person, lifeStageIn(person, month)!, keys, memo);
      for (const key of keys) {
        const need = known.get(key);
        if (need) seen[key].add(need.basis === 'stated' ? 'EER' : need.basis);
      }
    }
  }
  const out = {} as Record<K, NeedBasis | null>;
  for (const key of keys) {
    const kinds = [...seen[key]];
    out[key] = kinds.length === 0 ? null : kinds.length === 1 ? kinds[0]! : 'mixed';
  }
  return out;
}
