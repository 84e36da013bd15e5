/**
 * Selfsown's own colour scale for "home share of need", from bare soil to full leaf: loam for
 * nothing from home, squash-rind ambers for a little, sprout greens for much, the darkest green for
 * a month the garden covered in full. Colours are the palette of src/styles/global.css; each band
 * carries the text colour that reads best on it (WCAG 2.1 contrast, see contrastRatio).
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
  { min: 1, label: 'all of it or more', background: '#1f3a12', text: WHITE }, // sprout-900
];

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

/** A share as whole percent for a cell, e.g. percentText(0.426) → '43 %', percentText(null) → '–'. */
export function percentText(share: number | null): string {
  if (share === null || !Number.isFinite(share)) return '–';
  const pct = share * 100;
  if (pct > 0 && pct < 1) return '<1 %';
  return `${Math.round(pct).toLocaleString('en-US')} %`;
}
