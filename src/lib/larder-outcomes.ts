/**
 * What a grower can record about a stored or preserved lot after it went into store: it was used
 * up early, it lasted longer than its spread, or part of it spoiled or was thrown out. The list
 * lives here because the schema, the input rules and the larder arithmetic all need it.
 */

/** Outcome kinds. Example: `LARDER_OUTCOMES[2]` → 'spoiled' */
export const LARDER_OUTCOMES = ['used_up', 'lasted_longer', 'spoiled'] as const;

export type LarderOutcomeKind = (typeof LARDER_OUTCOMES)[number];

/** Display names in our own words. Example: `LARDER_OUTCOME_LABELS.used_up` → 'Used up early' */
export const LARDER_OUTCOME_LABELS: Readonly<Record<LarderOutcomeKind, string>> = {
  used_up: 'Used up early',
  lasted_longer: 'Lasting longer',
  spoiled: 'Spoiled or thrown out',
};
