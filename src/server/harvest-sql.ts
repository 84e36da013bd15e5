/**
 * SQL pieces every read of harvests as food shares (the share report, the larder): the join to the
 * harvest's own crop, its display name, and the rule that a not-food crop never counts as food.
 * Kept in one place so the share report and the larder cannot disagree about which harvests count.
 */
import { and, eq, isNotNull, isNull, or, sql, type SQL } from 'drizzle-orm';
import { crops, foods, harvests } from '@/db/schema';

/** Join condition: the harvest's crop, in the same household. */
export function cropOfHarvest(): SQL {
  return and(eq(crops.id, harvests.cropId), eq(crops.householdId, harvests.householdId))!;
}

/** Join condition: the harvest's reference food. */
export function foodOfHarvest(): SQL {
  return eq(foods.id, harvests.foodId);
}

/** The crop's name as cropDisplayName writes it ("Potato (Charlotte)"), else the reference food's name. */
export function harvestNameSql(): SQL<string | null> {
  const variety = sql`NULLIF(${crops.variety}, '')`;
  return sql<string | null>`COALESCE(NULLIF(IF(${variety} IS NULL, ${crops.name}, CONCAT(${crops.name}, ' (', ${variety}, ')')), ''), ${foods.name})`;
}

/** Harvests that count as food: no crop or a food crop, and never one whose crop is not the household's. */
export function countsAsFood(): SQL {
  return and(or(isNull(crops.id), eq(crops.notFood, false)), or(isNull(harvests.cropId), isNotNull(crops.id)))!;
}
