import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { FAVICON_PLATE, MARK, markSvg } from '@/lib/app-icon';
import { PALETTE } from '@/lib/palette';
import { ICONS, MASKABLE, offlinePageHtml } from '@/cli/gen-app-files';

const read = (path: string) => readFileSync(fileURLToPath(new URL(`../../${path}`, import.meta.url)));

/** Width and height from a PNG's IHDR chunk (PNG spec, ISO/IEC 15948: bytes 16–23, big-endian). */
function pngSize(buf: Buffer): [number, number] {
  expect(buf.subarray(1, 4).toString('ascii')).toBe('PNG');
  return [buf.readUInt32BE(16), buf.readUInt32BE(20)];
}

describe('the app mark', () => {
  it('draws the same plate as Logo.astro and the favicon', () => {
    const logo = read('src/components/Logo.astro').toString();
    const favicon = read('public/favicon.svg').toString();
    for (const d of [MARK.wedge.d, MARK.edge.d]) {
      expect(logo).toContain(`d="${d}"`);
      expect(favicon).toContain(`d="${d}"`);
    }
    expect(logo).toContain(`r="${MARK.rim.r}"`);
    expect(logo).toContain(`r="${MARK.ring.r}"`);
    for (const colour of [MARK.rim.fill, MARK.rim.stroke, MARK.ring.stroke, MARK.wedge.fill, MARK.edge.stroke]) expect(favicon).toContain(colour);
  });

  it('is drawn at the favicon’s size by default and scaled about the centre when asked', () => {
    expect(FAVICON_PLATE).toBeCloseTo(30.5 / 32, 10);
    expect(markSvg()).not.toContain('scale(');
    const maskable = markSvg({ background: PALETTE['sprout-100'], plate: 0.72 });
    expect(maskable).toContain(`<rect width="32" height="32" fill="${PALETTE['sprout-100']}"/>`);
    expect(maskable).toContain(`scale(${+(0.72 / FAVICON_PLATE).toFixed(4)})`);
    expect(() => markSvg({ plate: 1.2 })).toThrow(/at most 1/);
  });

  it('keeps a maskable icon’s plate inside the safe zone, a circle of 40 % radius (W3C Web App Manifest, "maskable")', () => {
    const maskable = ICONS.find((i) => i.file === 'maskable-512.png')!;
    expect(maskable.svg()).toBe(markSvg(MASKABLE));
    // A full-bleed background, and a round plate whose radius (plate / 2 of the width) is at most 40 %.
    expect(maskable.svg()).toContain('<rect width="32" height="32"');
    expect(MASKABLE.plate / 2).toBeLessThanOrEqual(0.4);
  });
});

describe('the committed app files match their sources (npm run gen:app-files)', () => {
  it('has each PNG icon at its size', () => {
    for (const icon of ICONS) expect(pngSize(read(`public/icons/${icon.file}`)), icon.file).toEqual([icon.size, icon.size]);
  });

  it('has the SVG icon and the offline page as generated', () => {
    expect(read('public/icons/icon.svg').toString()).toBe(`${markSvg()}\n`);
    expect(read('public/offline.html').toString()).toBe(offlinePageHtml());
  });
});
