import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { CHART_COLOURS, CONTRAST_PAIRS, PALETTE, USE_COLOURS } from '@/lib/palette';
import { BEFORE_RECORDS_BAND, SHARE_BANDS, UNKNOWN_BAND } from '@/lib/share-scale';

// Written here on purpose rather than imported, so a mistake in src/lib/palette.ts cannot hide:
// WCAG 2.2, definition "relative luminance": sRGB channels linearised (threshold 0.04045,
// divisor 12.92, else ((c + 0.055) / 1.055) ^ 2.4), weighted 0.2126 R + 0.7152 G + 0.0722 B;
// "contrast ratio" (L1 + 0.05) / (L2 + 0.05) with L1 the lighter.
function luminance(hex: string): number {
  const lin = (i: number) => {
    const c = parseInt(hex.slice(i, i + 2), 16) / 255;
    return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
  };
  return 0.2126 * lin(1) + 0.7152 * lin(3) + 0.0722 * lin(5);
}
function ratio(a: string, b: string): number {
  const [hi, lo] = [luminance(a), luminance(b)].sort((x, y) => y - x) as [number, number];
  return (hi + 0.05) / (lo + 0.05);
}

describe('the palette', () => {
  it('computes contrast as WCAG 2.2 defines it', () => {
    // WCAG 2.2 §1.4.3 understanding document: black on white is 21:1; #767676 on white is the lightest grey at 4.5:1
    expect(ratio('#000000', '#ffffff')).toBeCloseTo(21, 10);
    expect(ratio('#767676', '#ffffff')).toBeGreaterThanOrEqual(4.5);
    expect(ratio('#777777', '#ffffff')).toBeLessThan(4.5);
  });

  it.each(CONTRAST_PAIRS.map((p) => [`${p.text} on ${p.background} (${p.where})`, p] as const))('%s meets its WCAG 2.2 AA minimum', (_, p) => {
    // WCAG 2.2 SC 1.4.3 Contrast (Minimum): 4.5:1 for text; SC 1.4.11 Non-text Contrast: 3:1 for UI parts
    expect(ratio(PALETTE[p.text], PALETTE[p.background])).toBeGreaterThanOrEqual(p.minimum);
  });

  it('gives every share band text at 4.5:1 or more on its colour', () => {
    // WCAG 2.2 SC 1.4.3: the figures in the cells are normal-size text
    for (const b of [...SHARE_BANDS, UNKNOWN_BAND, BEFORE_RECORDS_BAND]) expect(ratio(b.text, b.background)).toBeGreaterThanOrEqual(4.5);
  });

  it('keeps "none" and "under 10 %" apart: a different colour and a pattern on "none"', () => {
    const [none, under10] = SHARE_BANDS as [typeof SHARE_BANDS[0], typeof SHARE_BANDS[0]];
    // Neighbouring pale bands used to be 1.03:1 apart; they must now differ in lightness visibly
    expect(ratio(none.background, under10.background)).toBeGreaterThan(1.1);
    expect(none.pattern).not.toBeNull();
    expect(under10.pattern).toBeNull();
  });

  it('holds the same values as the @theme tokens of src/styles/global.css', () => {
    const css = readFileSync(fileURLToPath(new URL('../../src/styles/global.css', import.meta.url)), 'utf8');
    const tokens = Object.fromEntries([...css.matchAll(/--color-([a-z0-9-]+):\s*(#[0-9a-f]{6})/gi)].map((m) => [m[1]!, m[2]!.toLowerCase()]));
    expect(tokens).toEqual(Object.fromEntries(Object.entries(PALETTE).map(([k, v]) => [k, v.toLowerCase()])));
  });

  it('draws charts and bars only in palette colours', () => {
    const values = new Set<string>(Object.values(PALETTE));
    for (const c of [...Object.values(CHART_COLOURS), ...Object.values(USE_COLOURS)]) expect(values.has(c)).toBe(true);
  });

  it('keeps the component folders free of hex colours of their own', () => {
    // The charts, grid, strip and bars take their colours from src/lib/palette.ts; only the logo's file may not (it imports PALETTE too).
    const files = ['share/ShareGrid.tsx', 'share/month-chart-data.ts', 'share/HarvestUses.tsx', 'gaps/GapStrip.tsx', 'larder/LotCard.tsx', 'larder/LarderPage.tsx'];
    for (const f of files) {
      const text = readFileSync(fileURLToPath(new URL(`../../src/components/${f}`, import.meta.url)), 'utf8');
      expect(text.match(/#[0-9a-f]{6}\b/gi), f).toBeNull();
    }
  });
});
