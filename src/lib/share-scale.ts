/**
 * Selfsown's own colour scale for "home share of need", from bare soil to full leaf: loam for
 * nothing from home, squash-rind ambers for a little, sprout greens for much, the darkest green for
 * a month the garden covered. The scale stops at "covered": eating more than the recommended intake
 * is not better, so 100 % and 250 % look the same and nothing rewards excess. Months before the
 * household's records start get a grey of their own (no need is counted there). Colours are the
 * palette of src/styles/global.css; each band carries the text colour that reads best on it (WCAG
 * 2.1 contrast, see contrastRatio).
 */

export interface ShareBand {
  /** Lowest share in the band (fraction, included); the band runs to the next band's min. */
  min: number;
  label: string;
  background: string;
  text: string;
}

const LOAM_900 = '#2e2218';
const WHITE = '#ffffff';

/** Shown when the share cannot be given (no need set, or the food's value unknown). */
export const UNKNOWN_BAND: ShareBand = { min: Number.NaN, label: 'no figure', background: '#faf6f1', text: '#5a4330' };

/** The bands, lowest first. Example: `SHARE_BANDS[0].label` → 'none from home' */
export const SHARE_BANDS: readonly ShareBand[] = [
  { min: 0, label: 'none from home', background: '#f1e8dc', text: LOAM_900 }, // loam-100
  { min: Number.MIN_VALUE, label: 'under 10 %', background: '#fdf0d5', text: LOAM_900 }, // rind-100
  { min: 0.1, label: '10–25 %', background: '#f6c866', text: LOAM_900 }, // rind-300
  { min: 0.25, label: '25–50 %', background: '#a8d48f', text: LOAM_900 }, // sprout-300
  { min: 0.5, label: '50–75 %', background: '#5f9a3f', text: LOAM_900 }, // sprout-500
  { min: 0.75, label: '75–100 %', background: '#3b6a24', text: WHITE }, // sprout-700
  { min: 1, label: 'covered', background: '#1f3a12', text: WHITE }, // sprout-900: the last band, however far past 100 %
];

/** A month before the household's records start: no need, no share, greyed. */
export const BEFORE_RECORDS_BAND: ShareBand = { min: Number.NaN, label: 'before records', background: '#e6e4e1', text: '#4a4440' };


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

function channel(c: number): number {
  const s = c / 255;
  return s <= 0.04045 ? s / 12.92 : ((s + 0.055) / 1.055) ** 2.4;
}

/** Relative luminance of '#rrggbb' (WCAG 2.1), e.g. relativeLuminance('#ffffff') → 1. */
export function relativeLuminance(hex: string): number {
  const m = /^#([0-9a-f]{2})([0-9a-f]{2})([0-9a-f]{2})$/i.exec(hex);
  if (!m) throw new RangeError(`"${hex}" is not a colour written #rrggbb`);
  const [r, g, b] = [m[1]!, m[2]!, m[3]!].map((x) => channel(parseInt(x, 16)));
  return 0.2126 * r! + 0.7152 * g! + 0.0722 * b!;
}

/** Contrast ratio of two colours (WCAG 2.1, 1–21), e.g. contrastRatio('#000000', '#ffffff') → 21. */
export function contrastRatio(a: string, b: string): number {
  const la = relativeLuminance(a);
  const lb = relativeLuminance(b);
  return (Math.max(la, lb) + 0.05) / (Math.min(la, lb) + 0.05);
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
