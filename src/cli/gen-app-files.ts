/**
 * npm run gen:app-files
 * Writes the installable app's static files into public/ from one source each: the icons of the
 * web app manifest (public/icons/: an SVG, PNGs of 192 and 512 px, a maskable 512 px PNG and the
 * 180 px touch icon) from the mark in src/lib/app-icon.ts, and public/offline.html, the page the
 * service worker shows for a page that was never opened with a signal. PNGs are drawn by sharp.
 * tests/unit/app-icon.test.ts fails when a committed file no longer matches its source.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import sharp from 'sharp';
import { markSvg } from '@/lib/app-icon';
import { PALETTE } from '@/lib/palette';
import { plainPageHtml } from '@/lib/plain-page';
import { isMain } from './is-main';

export const PUBLIC_DIR = fileURLToPath(new URL('../../public/', import.meta.url));

/** The maskable icon's background and plate: the plate stays inside the 80 % safe circle. */
export const MASKABLE = { background: PALETTE['sprout-100'], plate: 0.72 } as const;

/** The icons: file name under public/icons/, size in px, and how the mark is drawn. */
export const ICONS = [
  { file: 'icon-192.png', size: 192, svg: () => markSvg() },
  { file: 'icon-512.png', size: 512, svg: () => markSvg() },
  { file: 'maskable-512.png', size: 512, svg: () => markSvg(MASKABLE) },
  // iOS fills transparency with black: the touch icon gets the paper background.
  { file: 'apple-touch-icon.png', size: 180, svg: () => markSvg({ background: PALETTE['loam-50'], plate: 0.8 }) },
] as const;

/** The offline page (plain-page.ts's shell): our colours inline (the built stylesheet's name changes every build), no script but "Try again". */
export function offlinePageHtml(): string {
  const P = PALETTE;
  return plainPageHtml({
    title: 'No connection',
    head: `<meta name="theme-color" content="${P['sprout-700']}">\n`,
    style: `  body { margin: 0; min-height: 100vh; background: ${P['loam-50']}; color: ${P['loam-900']}; font: 18px/1.5 "Nunito Sans", system-ui, sans-serif; }
  main { max-width: 34rem; margin: 0 auto; padding: 2rem 1rem; }
  .mark { width: 56px; height: 56px; }
  h1 { font-size: 1.6rem; line-height: 1.25; margin: 1rem 0 0.5rem; }
  p { margin: 0.5rem 0; }
  .note { color: ${P['loam-700']}; font-size: 1rem; }
  .actions { display: flex; flex-wrap: wrap; gap: 0.75rem; margin-top: 1.5rem; }
  button { min-height: 48px; padding: 0 1.25rem; border-radius: 0.75rem; font: inherit; font-weight: 700; cursor: pointer; background: ${P['sprout-700']}; color: ${P.white}; border: 0; }
  button.quiet { background: ${P.white}; color: ${P['sprout-900']}; border: 1px solid ${P['loam-300']}; }
  button:focus-visible { outline: 3px solid ${P.focus}; outline-offset: 2px; }
`,
    body: `<main data-testid="offline-page">
  <div class="mark" aria-hidden="true">${markSvg()}</div>
  <h1>No connection, and this page is not kept on this device yet</h1>
  <p>Selfsown keeps the pages you need in the garden once you have opened them with a signal: the harvest form, bought food and the harvest log of your household.</p>
  <p class="note">Harvests and bought food you log there while offline wait on this device and are sent, each once, when the connection returns.</p>
  <div class="actions">
    <button type="button" onclick="location.reload()">Try again</button>
    <button type="button" class="quiet" onclick="history.back()">Go back</button>
  </div>
</main>
`,
  });
}

export async function writeAppFiles(dir = PUBLIC_DIR): Promise<string[]> {
  mkdirSync(`${dir}icons`, { recursive: true });
  const written: string[] = [];
  const write = (name: string, data: string | Buffer) => {
    writeFileSync(`${dir}${name}`, data);
    written.push(name);
  };
  write('icons/icon.svg', `${markSvg()}\n`);
  for (const icon of ICONS) {
    // Drawn at the icon's size (density scales the 32-unit view box), not resized from a small bitmap.
    const png = await sharp(Buffer.from(icon.svg()), { density: (72 * icon.size) / 32 })
      .resize(icon.size, icon.size)
      .png({ compressionLevel: 9 })
      .toBuffer();
    write(`icons/${icon.file}`, png);
  }
  write('offline.html', offlinePageHtml());
  return written;
}

if (isMain(import.meta.url)) {
  const written = await writeAppFiles();
  console.log(`gen:app-files: wrote ${written.map((f) => `public/${f}`).join(', ')}`);
}
