/**
 * Which state-changing requests the app believes came from its own pages (cross-site request
 * forgery defence). Browsers name the page that sent a request in `Origin` and, in Fetch metadata,
 * `Sec-Fetch-Site`; a page of another site cannot forge either. `Referer` is not read: it can be
 * absent or trimmed by policy, and a foreign one must not count as a pass.
 *
 * - Origin present: it must be the public origin exactly, and Sec-Fetch-Site (when sent) must not
 *   say cross-site.
 * - Origin absent (or "null") on a request that carries cookies: refused unless
 *   `Sec-Fetch-Site: same-origin` — the cookie would otherwise lend the request someone's session.
 * - Origin absent and no cookie: nobody's authority is at stake (a script or curl); let it through
 *   to the route, which answers 401 where sign-in is needed.
 */

export interface RequestOriginHeaders {
  origin: string | null;
  fetchSite: string | null;
  hasCookie: boolean;
}

/**
 * True when a state-changing request may go on.
 * Example: `sameSiteRequest({ origin: null, fetchSite: null, hasCookie: true }, 'https://a.example')` → false
 */
export function sameSiteRequest(h: RequestOriginHeaders, publicOrigin: string): boolean {
  if (h.fetchSite === 'cross-site' || h.fetchSite === 'same-site') return false;
  if (h.origin !== null && h.origin !== 'null') return h.origin === publicOrigin;
  if (!h.hasCookie) return true;
  return h.fetchSite === 'same-origin';
}
