/**
 * Selfsown's mark as SVG text, for what cannot render Logo.astro: the app icons of the web app
 * manifest (drawn to PNG by `npm run gen:app-files`) and the offline page. The same drawing as
 * src/components/Logo.astro and public/favicon.svg — a plate seen from above whose green wedge is
 * the home share (tests/unit/app-icon.test.ts keeps the three in step).
 */
import { PALETTE } from './palette';

/** The plate on its 32-unit grid: rim, inner ring, the home-share wedge and its amber edge. */
export const MARK = {
  rim: { cx: 16, cy: 16, r: 14, fill: PALETTE['loam-50'], stroke: PALETTE['loam-900'], strokeWidth: 2.5 },
  ring: { cx: 16, cy: 16, r: 9.5, stroke: PALETTE['loam-300'], strokeWidth: 1.25 },
  wedge: { d: 'M16 16V6.5A9.5 9.5 0 1 1 7.07 19.25Z', fill: PALETTE['sprout-700'] },
  edge: { d: 'M16 16V6.5', stroke: PALETTE['rind-500'], strokeWidth: 1.5 },
} as const;

export interface MarkOptions {
  /** A square background behind the plate (a maskable icon must fill its whole square); none = transparent. */
  background?: string;
  /**
   * The plate's diameter (rim stroke included) as a share of the square: 1 fills it; the default is
   * the favicon's 30.5 of 32; a maskable icon keeps it inside the middle 80 %.
   */
  plate?: number;
}

/** The favicon's plate: 30.5 of 32 units (rim radius 14 plus half its 2.5 stroke on each side). */
export const FAVICON_PLATE = (2 * MARK.rim.r + MARK.rim.strokeWidth) / 32;

/**
 * The mark as a standalone SVG document on a 32 × 32 view box.
 * Example: `markSvg({ background: PALETTE['sprout-100'], plate: 0.7 })` for a maskable icon.
 */
export function markSvg({ background, plate = FAVICON_PLATE }: MarkOptions = {}): string {
  if (!(plate > 0 && plate <= 1)) throw new Error(`The plate's share of the icon must be above 0 and at most 1: got ${plate}.`);
  // Scale the plate about the centre to the share asked for (1 = the favicon's size).
  const scale = +(plate / FAVICON_PLATE).toFixed(4);
  const { rim, ring, wedge, edge } = MARK;
  const body =
    (scale === 1 ? '<g>' : `<g transform="translate(16 16) scale(${scale}) translate(-16 -16)">`) +
    `<circle cx="${rim.cx}" cy="${rim.cy}" r="${rim.r}" fill="${rim.fill}" stroke="${rim.stroke}" stroke-width="${rim.strokeWidth}"/>` +
    `<circle cx="${ring.cx}" cy="${ring.cy}" r="${ring.r}" fill="none" stroke="${ring.stroke}" stroke-width="${ring.strokeWidth}"/>` +
    `<path d="${wedge.d}" fill="${wedge.fill}"/>` +
    `<path d="${edge.d}" stroke="${edge.stroke}" stroke-width="${edge.strokeWidth}" stroke-linecap="round"/>` +
    `</g>`;
  const back = background ? `<rect width="32" height="32" fill="${background}"/>` : '';
  return `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 32 32">${back}${body}</svg>`;
}
