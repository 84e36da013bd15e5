/** Where to send someone after signing in: only paths on this site, never another origin. */

/** The page a signed-in person lands on when no (usable) `next` is given. */
export const DEFAULT_NEXT = '/households';

/**
 * `next` when it is a same-site path, else the fallback. Refuses absolute URLs, scheme-relative
 * `//host` and `/\host` (browsers read both as another host) and control characters.
 * @example safeNext('/households/3?tab=members') // '/households/3?tab=members'; safeNext('https://evil.example') // '/households'
 */
export function safeNext(next: string | null | undefined, fallback = DEFAULT_NEXT): string {
  if (!next || next.length > 2000) return fallback;
  if (!next.startsWith('/') || next.startsWith('//') || next.startsWith('/\\')) return fallback;
  // eslint-disable-next-line no-control-regex
  if (/[\u0000-\u001f\u007f\\]/.test(next)) return fallback;
  // Resolve against a dummy origin: if the result leaves it, the path was a disguised URL.
  const probe = new URL(next, 'http://selfsown.invalid');
  if (probe.origin !== 'http://selfsown.invalid') return fallback;
  return probe.pathname + probe.search + probe.hash;
}

/**
 * A sign-in or sign-up link that comes back to `next` afterwards.
 * @example withNext('/sign-in', '/invite/abc') // '/sign-in?next=%2Finvite%2Fabc'
 */
export function withNext(page: string, next: string | null | undefined): string {
  const n = safeNext(next, '');
  return n ? `${page}?next=${encodeURIComponent(n)}` : page;
}
