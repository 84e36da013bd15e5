/**
 * Succession slots: one bed can carry more than one planting in a season (an early crop, then a
 * late one). The slot names them, so a bed's season reads in order. Defined once, for the schema,
 * the planting rules and the forms.
 */

/** Example: `PLANTING_SLOTS[1]` → 'early' */
export const PLANTING_SLOTS = ['main', 'early', 'late'] as const;
export type PlantingSlot = (typeof PLANTING_SLOTS)[number];

/** Display names. Example: `PLANTING_SLOT_LABELS.late` → 'Late (after an early crop)' */
export const PLANTING_SLOT_LABELS: Readonly<Record<PlantingSlot, string>> = {
  main: 'Main (the whole season)',
  early: 'Early (cleared by midsummer)',
  late: 'Late (after an early crop)',
};
