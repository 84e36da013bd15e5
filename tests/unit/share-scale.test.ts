import { describe, expect, it } from 'vitest';
import { BEFORE_RECORDS_BAND, SHARE_BANDS, UNKNOWN_BAND, contrastRatio, percentText, shareBand, shareText, unknownText } from '@/lib/share-scale';

describe('share colour scale', () => {
  it('puts a share in the band whose lower bound it reaches', () => {
    expect(shareBand(0).label).toBe('none from home');
    expect(shareBand(0.001).label).toBe('under 10 %');
    expect(shareBand(0.1).label).toBe('10–25 %');
    expect(shareBand(0.4999).label).toBe('25–50 %');
    expect(shareBand(0.75).label).toBe('75–100 %');
    expect(shareBand(1).label).toBe('covered');
  });

  it('stops at covered: more than the recommended intake earns no deeper colour', () => {
    expect(shareBand(2.5)).toBe(shareBand(1));
    expect(shareBand(2.5).label).toBe('covered');
    expect(SHARE_BANDS.at(-1)!.label).toBe('covered');
    expect(SHARE_BANDS.filter((b) => b.min >= 1)).toHaveLength(1);
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
    for (const b of [...SHARE_BANDS, UNKNOWN_BAND, BEFORE_RECORDS_BAND]) expect(contrastRatio(b.background, b.text)).toBeGreaterThanOrEqual(4.5);
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

  it('greys months before records apart from the none-from-home band', () => {
    expect(BEFORE_RECORDS_BAND.background).not.toBe(SHARE_BANDS[0]!.background);
    expect(BEFORE_RECORDS_BAND.label).toBe('before records');
  });

  it('flags an uncertain share instead of writing it as a clean figure', () => {
    expect(shareText(0.426, true)).toBe('43 % (uncertain)');
    expect(shareText(0.426, false)).toBe('43 %');
    expect(shareText(null, true)).toBe('–');
  });

  it('says how much of the weight had no value, whole percent, and nothing when all had one', () => {
    expect(unknownText(0.153)).toBe('15 % of the weight eaten has no value for it');
    expect(unknownText(0.002)).toBe('<1 % of the weight eaten has no value for it');
    expect(unknownText(0.2, 'zinc')).toBe('20 % of the weight eaten has no value for zinc');
    expect(unknownText(0)).toBeNull();
    expect(unknownText(null)).toBeNull();
  });
});
