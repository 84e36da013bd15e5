/**
 * Selfsown's own colour scale for "home share of need", from bare soil to full leaf: hatched loam
 * for nothing from home, squash-rind ambers for a little, sprout greens for much, the darkest green
 * for a month the garden covered. The scale stops at "covered": eating more than the recommended
 * intake is not better, so 100 % and 250 % look the same and nothing rewards excess. Months before
 * the household's records start get a grey of their own (no need is counted there). Colours come
 * from src/lib/palette.ts (the tokens of src/styles/global.css); each band carries the text colour
 * that reads on it (WCAG 2.2 contrast, tested), and colour is never the only cue: cells carry their
 * figure, "none" is hatched and a missing figure is dashed.
 */
import { PALETTE, contrastRatio, relativeLuminance } from './palette';

export { contrastRatio, relativeLuminance };

export interface ShareBand {
  /** Lowest share in the band (fraction, included); the band runs to the next band's min. */
  min: number;
  label: string;
  background: string;
  text: string;
  /** A CSS background-image laid over the colour (the hatch of "none"), or null. */
  pattern: string | null;
}

const LOAM_900 = PALETTE['loam-900'];
const WHITE = PALETTE.white;

/** Diagonal hatching: "nothing from home" reads as bare ground, not as a pale colour. */
export const HATCH = `repeating-linear-gradient(135deg, transparent 0 5px, ${PALETTE['loam-300']} 5px 7px)`;

/** Shown when the share cannot be given (no need set, or the food's value unknown). */
export const UNKNOWN_BAND: ShareBand = { min: Number.NaN, label: 'no figure', background: PALETTE['loam-50'], text: PALETTE['loam-700'], pattern: null };

/** The bands, lowest first. Example: `SHARE_BANDS[0].label` → 'none from home' */
export const SHARE_BANDS: readonly ShareBand[] = [
  { min: 0, label: 'none from home', background: PALETTE['loam-100'], text: LOAM_900, pattern: HATCH },
  { min: Number.MIN_VALUE, label: 'under 10 %', background: PALETTE['rind-200'], text: LOAM_900, pattern: null },
  { min: 0.1, label: '10–25 %', background: PALETTE['rind-300'], text: LOAM_900, pattern: null },
  { min: 0.25, label: '25–50 %', background: PALETTE['sprout-300'], text: LOAM_900, pattern: null },
  { min: 0.5, label: '50–75 %', background: PALETTE['sprout-500'], text: LOAM_900, pattern: null },
  { min: 0.75, label: '75–100 %', background: PALETTE['sprout-700'], text: WHITE, pattern: null },
  // The last band, however far past 100 %.
  { min: 1, label: 'covered', background: PALETTE['sprout-900'], text: WHITE, pattern: null },
];

/** A month before the household's records start: no need, no share, greyed. */
export const BEFORE_RECORDS_BAND: ShareBand = { min: Number.NaN, label: 'before records', background: PALETTE['fog-200'], text: PALETTE['fog-700'], pattern: null };

/** The inline style of a band: its colour, its pattern over it, its text colour. */
export function bandStyle(band: ShareBand): { backgroundColor: string; backgroundImage?: string; color: string } {
  return band.pattern ? { backgroundColor: band.background, backgroundImage: band.pattern, color: band.text } : { backgroundColor: band.background, color: band.text };
}

/**
 * The band of a home share of need (fraction; null = no figure),
 * e.g. shareBand(0.3).label → '25–50 %', shareBand(0).label → 'none from home', shareBand(null) → UNKNOWN_BAND.
 */
export function shareBand(share: number | null): ShareBand {
  if (share === null || !Number.isFinite(share) || share < 0) return UNKNOWN_BAND;
  let band = SHARE_BANDS[0]!;
  for (const b of SHARE_BANDS) if (share >= b.min) band = b;
  return band;
}

/**
 * A share as whole percent — all the precision the reference data allow,
 * e.g. percentText(0.426) → '43 %', percentText(null) → '–'.
 */
export function percentText(share: number | null): string {
  if (share === null || !Number.isFinite(share)) return '–';
  const pct = share * 100;
  if (pct > 0 && pct < 1) return '<1 %';
  return `${Math.round(pct).toLocaleString('en-US')} %`;
}

/**
 * A share as a figure that says when it is uncertain (more than a tenth of the weight behind it has
 * no value), so it is never read as a clean number,
 * e.g. shareText(0.43, true) → '43 % (uncertain)', shareText(0.43, false) → '43 %', shareText(null, true) → '–'.
 */
export function shareText(share: number | null, uncertain: boolean): string {
  const text = percentText(share);
  return uncertain && text !== '–' ? `${text} (uncertain)` : text;
}

/**
 * How much of the weight eaten had no value for a nutrient, in words, or null when all of it had one,
 * e.g. unknownText(0.153) → '15 % of the weight eaten has no value for it',
 * unknownText(0.2, 'zinc') → '20 % of the weight eaten has no value for zinc', unknownText(0) → null.
 */
export function unknownText(unknownShare: number | null, what = 'it'): string | null {
  if (unknownShare === null || !Number.isFinite(unknownShare) || unknownShare <= 0) return null;
  return `${percentText(unknownShare)} of the weight eaten has no value for ${what}`;
}
