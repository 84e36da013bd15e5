import { describe, expect, it } from 'vitest';
import { SHARE_BANDS, UNKNOWN_BAND, contrastRatio, percentText, shareBand } from '@/lib/share-scale';

describe('share colour scale', () => {
  it('puts a share in the band whose lower bound it reaches', () => {
    expect(shareBand(0).label).toBe('none from home');
    expect(shareBand(0.001).label).toBe('under 10 %');
    expect(shareBand(0.1).label).toBe('10–25 %');
    expect(shareBand(0.4999).label).toBe('25–50 %');
    expect(shareBand(0.75).label).toBe('75–100 %');
    expect(shareBand(1).label).toBe('all of it or more');
    expect(shareBand(2.5).label).toBe('all of it or more');
  });

  it('gives no band (no figure) for null, never the zero band', () => {
    expect(shareBand(null)).toBe(UNKNOWN_BAND);
    expect(shareBand(null)).not.toBe(SHARE_BANDS[0]);
  });

  it('darkens from band to band, so more home share always looks deeper', () => {
    const lum = SHARE_BANDS.slice(1).map((b) => contrastRatio(b.background, '#ffffff'));
    for (let i = 1; i < lum.length; i++) expect(lum[i]!).toBeGreaterThan(lum[i - 1]!);
  });

  it('keeps every band’s text at WCAG AA contrast (4.5:1) or more', () => {
    // WCAG 2.1 success criterion 1.4.3: contrast at least 4.5:1 for normal text
    for (const b of [...SHARE_BANDS, UNKNOWN_BAND]) expect(contrastRatio(b.background, b.text)).toBeGreaterThanOrEqual(4.5);
  });

  it('computes the WCAG contrast ratio', () => {
    // WCAG 2.1 definition of contrast ratio: black on white is 21:1, a colour on itself 1:1
    expect(contrastRatio('#000000', '#ffffff')).toBeCloseTo(21, 10);
    expect(contrastRatio('#5f9a3f', '#5f9a3f')).toBe(1);
  });

  it('writes shares as whole percent, a trace as <1 % and no figure as a dash', () => {
    expect(percentText(0.426)).toBe('43 %');
    expect(percentText(0.004)).toBe('<1 %');
    expect(percentText(0)).toBe('0 %');
    expect(percentText(1.5)).toBe('150 %');
    expect(percentText(null)).toBe('–');
  });
});
