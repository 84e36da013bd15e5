/**
 * The shell of the app's two pages that stand without its pages and stylesheet: the 503 page while
 * the database is down (unavailable-page.ts) and the offline page of the service worker
 * (public/offline.html, written by src/cli/gen-app-files.ts). Styles inline, since neither can
 * name the built stylesheet; no script beyond what a page passes in its body.
 */

export interface PlainPage {
  /** Before " · Selfsown" in the tab. */
  title: string;
  /** Extra head lines (each ending in a newline), before the icon link. */
  head?: string;
  /** The rules inside <style> (each line ending in a newline). */
  style: string;
  /** Everything inside <body> (ending in a newline). */
  body: string;
}

/** The whole page, e.g. plainPageHtml({ title: 'No connection', style: '', body: '<main></main>\n' }). */
export function plainPageHtml(page: PlainPage): string {
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
${page.head ?? ''}<link rel="icon" type="image/svg+xml" href="/favicon.svg">
<title>${page.title} · Selfsown</title>
<style>
${page.style}</style>
</head>
<body>
${page.body}</body>
</html>
`;
}
