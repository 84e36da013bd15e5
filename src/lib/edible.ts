/**
 * Edible portion: the part of a weighed harvest or purchase that is eaten, once peel, stones, cores,
 * pods and trimmings (the food table's "refuse") are taken off.
 */

export interface EdibleBasis {
  /** The reference food's refuse, in percent of the weight as bought or harvested (0–100). */
  refusePercent?: number | null;
  /** The crop's own override: the fraction of the weight that is eaten (0–1). Wins over refuse. */
  edibleFraction?: number | null;
  /** True when the entry was weighed already trimmed, so nothing more is taken off. */
  trimmed?: boolean;
}

function checkRefuse(refusePercent: number): void {
  if (!Number.isFinite(refusePercent) || refusePercent < 0 || refusePercent > 100) {
    throw new Error(`Refuse must be a percentage from 0 to 100, got ${String(refusePercent)}.`);
  }
}

function checkFraction(edibleFraction: number): void {
  if (!Number.isFinite(edibleFraction) || edibleFraction < 0 || edibleFraction > 1) {
    throw new Error(`The edible fraction must be between 0 and 1, got ${String(edibleFraction)}.`);
  }
}

/**
 * The fraction of the weight that is eaten: 1 when trimmed, else the crop's edible fraction, else
 * 1 − refuse/100 (no refuse given counts as none, as in food tables that leave it blank).
 * Example: `edibleFactor({ refusePercent: 25 })` → 0.75
 */
export function edibleFactor({ refusePercent, edibleFraction, trimmed }: EdibleBasis): number {
  // Check every number given, even the ones that are not used, so a bad value never hides.
  if (refusePercent != null) checkRefuse(refusePercent);
  if (edibleFraction != null) checkFraction(edibleFraction);
  if (trimmed) return 1;
  if (edibleFraction != null) return edibleFraction;
  return 1 - (refusePercent ?? 0) / 100;
}

/**
 * Edible grams of an entry: grams × (1 − refuse/100), or grams × the crop's edible fraction, or the
 * grams themselves when weighed trimmed. Example: `edibleGrams(1000, { refusePercent: 25 })` → 750
 */
export function edibleGrams(grams: number, basis: EdibleBasis): number {
  if (!Number.isFinite(grams) || grams < 0) {
    throw new Error(`The weight must be zero or more grams, got ${String(grams)}.`);
  }
  return grams * edibleFactor(basis);
}
