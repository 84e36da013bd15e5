/**
 * Selfsown's colours as values, for the code that cannot read CSS: the charts (Chart.js draws on a
 * canvas), the share scale and the inline bars. The design tokens themselves are written in
 * src/styles/global.css (`@theme`); tests/unit/palette.test.ts fails when the two disagree, and
 * checks every text/background pair listed in CONTRAST_PAIRS against WCAG 2.2 AA.
 *
 * The families: loam (soil browns and the oat paper), sprout (leaf greens), rind (squash-rind
 * ambers), berry (the warning red) and one focus colour, an elderberry purple that no other part
 * of the page uses, so a keyboard ring is never mistaken for a state.
 */
import type { Use } from './uses';

/** Every colour token, by its Tailwind name (`bg-loam-100` ↔ `PALETTE['loam-100']`). */
export const PALETTE = {
  white: '#ffffff',
  'loam-50': '#faf6f1',
  'loam-100': '#f1e8dc',
  'loam-200': '#e0cdb5',
  'loam-300': '#c9b194',
  'loam-400': '#a08566',
  'loam-500': '#7a5c40',
  'loam-700': '#5a4330',
  'loam-900': '#2e2218',
  'sprout-100': '#e4f2dc',
  'sprout-300': '#93c274',
  'sprout-500': '#6fa84c',
  'sprout-700': '#3b6a24',
  'sprout-900': '#1f3a12',
  'rind-100': '#fdf0d5',
  'rind-200': '#f7d98c',
  'rind-300': '#f0b850',
  'rind-500': '#d9901c',
  'rind-700': '#9a5d0b',
  'berry-100': '#f6e4e2',
  'berry-500': '#b3413a',
  'berry-700': '#842a25',
  'fog-200': '#e6e4e1',
  'fog-700': '#4a4440',
  focus: '#4b2a6b',
} as const;

export type PaletteToken = keyof typeof PALETTE;

/** The roles charts and bars give colours, so a component never writes a hex value of its own. */
export const CHART_COLOURS = {
  /** Home-grown food: a bar, a segment. */
  home: PALETTE['sprout-500'],
  /** Bought food. */
  bought: PALETTE['rind-300'],
  /** The recommended intake line. */
  need: PALETTE['loam-900'],
  /** A larder lot: already eaten, still left, lost. */
  eaten: PALETTE['sprout-300'],
  left: PALETTE['sprout-700'],
  lost: PALETTE['berry-500'],
  /** Axis text and grid lines on a canvas. */
  axisText: PALETTE['loam-700'],
  grid: PALETTE['loam-200'],
} as const;

/** Where the harvest went: eaten uses in greens, the rest in ambers and berry, so a bar says at a glance how much stayed home. */
export const USE_COLOURS: Readonly<Record<Use, string>> = {
  fresh: PALETTE['sprout-500'],
  stored: PALETTE['sprout-700'],
  preserved: PALETTE['sprout-300'],
  seed: PALETTE['rind-500'],
  given: PALETTE['rind-200'],
  sold: PALETTE['rind-700'],
  lost: PALETTE['berry-500'],
};

/** A pair of colours that sit together as text on a background somewhere in the app. */
export interface ContrastPair {
  text: PaletteToken;
  background: PaletteToken;
  /** Where the pair is used, so a failure says what to look at. */
  where: string;
  /** 4.5 for body text (WCAG 2.2 SC 1.4.3), 3 for large text and UI parts (SC 1.4.3, 1.4.11). */
  minimum: 4.5 | 3;
}

/** Every text/background pair the tokens are used in; each must meet its minimum. */
export const CONTRAST_PAIRS: readonly ContrastPair[] = [
  { text: 'loam-900', background: 'loam-50', where: 'page text', minimum: 4.5 },
  { text: 'loam-900', background: 'white', where: 'card text', minimum: 4.5 },
  { text: 'loam-900', background: 'loam-100', where: 'quiet button hover, chips', minimum: 4.5 },
  { text: 'loam-900', background: 'rind-100', where: 'cautions', minimum: 4.5 },
  { text: 'loam-900', background: 'rind-200', where: 'lean-month tag', minimum: 4.5 },
  { text: 'loam-700', background: 'white', where: 'secondary text on cards', minimum: 4.5 },
  { text: 'loam-700', background: 'loam-50', where: 'secondary text on the page', minimum: 4.5 },
  { text: 'loam-700', background: 'loam-100', where: 'secondary text on chips', minimum: 4.5 },
  { text: 'loam-700', background: 'rind-100', where: 'secondary text in cautions', minimum: 4.5 },
  { text: 'loam-500', background: 'white', where: 'placeholders, months to come', minimum: 4.5 },
  { text: 'loam-500', background: 'loam-100', where: 'muted text on chips', minimum: 4.5 },
  { text: 'sprout-700', background: 'white', where: 'links on cards', minimum: 4.5 },
  { text: 'sprout-700', background: 'loam-50', where: 'links on the page', minimum: 4.5 },
  { text: 'sprout-900', background: 'sprout-100', where: 'chosen chip, good news', minimum: 4.5 },
  { text: 'sprout-900', background: 'white', where: 'big figures', minimum: 4.5 },
  { text: 'white', background: 'sprout-700', where: 'primary button', minimum: 4.5 },
  { text: 'white', background: 'sprout-900', where: 'primary button hover', minimum: 4.5 },
  { text: 'white', background: 'berry-700', where: 'danger button', minimum: 4.5 },
  { text: 'white', background: 'berry-500', where: 'danger button hover', minimum: 4.5 },
  { text: 'berry-700', background: 'white', where: 'error text', minimum: 4.5 },
  { text: 'berry-700', background: 'berry-100', where: 'error box, empty larder month', minimum: 4.5 },
  { text: 'rind-700', background: 'white', where: 'caution mark', minimum: 4.5 },
  { text: 'fog-700', background: 'fog-200', where: 'months before records', minimum: 4.5 },
  { text: 'loam-400', background: 'white', where: 'field and chip borders (UI part)', minimum: 3 },
  { text: 'focus', background: 'white', where: 'focus ring on cards (UI part)', minimum: 3 },
  { text: 'focus', background: 'loam-50', where: 'focus ring on the page (UI part)', minimum: 3 },
  { text: 'sprout-700', background: 'white', where: 'chosen chip border (UI part)', minimum: 3 },
];

function channel(c: number): number {
  const s = c / 255;
  return s <= 0.04045 ? s / 12.92 : ((s + 0.055) / 1.055) ** 2.4;
}

/** Relative luminance of '#rrggbb' (WCAG 2.2 definition), e.g. relativeLuminance('#ffffff') → 1. */
export function relativeLuminance(hex: string): number {
  const m = /^#([0-9a-f]{2})([0-9a-f]{2})([0-9a-f]{2})$/i.exec(hex);
  if (!m) throw new RangeError(`"${hex}" is not a colour written #rrggbb`);
  const [r, g, b] = [m[1]!, m[2]!, m[3]!].map((x) => channel(parseInt(x, 16)));
  return 0.2126 * r! + 0.7152 * g! + 0.0722 * b!;
}

/** Contrast ratio of two colours (WCAG 2.2, 1–21), e.g. contrastRatio('#000000', '#ffffff') → 21. */
export function contrastRatio(a: string, b: string): number {
  const la = relativeLuminance(a);
  const lb = relativeLuminance(b);
  return (Math.max(la, lb) + 0.05) / (Math.min(la, lb) + 0.05);
}
