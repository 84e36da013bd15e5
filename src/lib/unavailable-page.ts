/**
 * The page a browser gets while the database is down (503): plain HTML written here, since none of
 * the app's pages can be rendered without the session and household they read from the database.
 * It keeps the app's look — the oat paper, the loam text, the plate mark of /favicon.svg, the
 * sprout button — with inline styles only (the page CSP allows them) and no script, in the shell
 * it shares with the offline page (plain-page.ts).
 */
import { PALETTE } from './palette';
import { plainPageHtml } from './plain-page';

/** The whole 503 page; `retryAfterSeconds` is said in words and matches the Retry-After header. */
export function unavailablePageHtml(retryAfterSeconds: number): string {
  return plainPageHtml({
    title: 'Back in a moment',
    head: '<meta name="robots" content="noindex">\n',
    style: `  body { margin: 0; min-height: 100vh; background: ${PALETTE['loam-50']}; color: ${PALETTE['loam-900']};
    font-family: "Nunito Sans", system-ui, sans-serif; font-size: 1.0625rem; line-height: 1.5; }
  header { border-bottom: 1px solid ${PALETTE['loam-200']}; background: ${PALETTE.white}; padding: 0.5rem 1rem; }
  header a { display: inline-flex; align-items: center; gap: 0.5rem; color: ${PALETTE['sprout-900']};
    font-weight: 800; font-size: 1.25rem; text-decoration: none; }
  main { max-width: 36rem; margin: 3rem auto; padding: 0 1rem; }
  .card { background: ${PALETTE.white}; border: 1px solid ${PALETTE['loam-200']}; border-radius: 1rem; padding: 1.5rem; }
  h1 { font-size: 1.5rem; margin: 0 0 0.75rem; }
  p { margin: 0 0 1rem; }
  .btn { display: inline-flex; align-items: center; min-height: 44px; padding: 0 1.25rem; border-radius: 0.75rem;
    background: ${PALETTE['sprout-700']}; color: ${PALETTE.white}; font-weight: 700; text-decoration: none; }
  .btn:focus-visible { outline: 3px solid ${PALETTE.focus}; outline-offset: 2px; }
`,
    body: `<header><a href="/"><img src="/favicon.svg" alt="" width="28" height="28"> Selfsown</a></header>
<main id="main" data-testid="database-unavailable">
  <div class="card">
    <h1>Back in a moment</h1>
    <p>Selfsown cannot reach its database just now, so this page cannot be shown. Nothing you saved
    before is lost, and harvests waiting on your phone stay there until they can be sent.</p>
    <p>Please try again in about ${retryAfterSeconds} seconds.</p>
    <a class="btn" href="">Try again</a>
  </div>
</main>
`,
  });
}
