/**
 * The browser security headers Selfsown sends, written once. Pages load only the app's own
 * assets: scripts from our origin plus the inline ones Astro writes (the island runtime, client
 * directives, small page scripts), allowed by the SHA-256 hashes Astro computes at build time —
 * never 'unsafe-inline' for scripts. Styles allow 'unsafe-inline' because server-rendered bars and
 * charts carry `style` attributes (widths, colours); no style or font comes from another origin.
 * `worker-src` and `manifest-src` allow the app's own service worker and web manifest.
 */

/** Headers every answer carries, static files included (src/server/boot.ts sets them on those). */
export const BASE_SECURITY_HEADERS: Readonly<Record<string, string>> = {
  'X-Content-Type-Options': 'nosniff',
  'X-Frame-Options': 'SAMEORIGIN',
  'Referrer-Policy': 'strict-origin-when-cross-origin',
  'Cross-Origin-Opener-Policy': 'same-origin',
  // Powerful features the app never uses, off for it and anything it could be made to embed.
  'Permissions-Policy': 'accelerometer=(), camera=(), geolocation=(), gyroscope=(), magnetometer=(), microphone=(), payment=(), usb=()',
};

/** The policy of an answer that is not a page (JSON, CSV, plain text, files): nothing may run or load. */
export const NON_PAGE_POLICY = "default-src 'none'; frame-ancestors 'self'; base-uri 'none'; form-action 'none'";

/**
 * The policy of a page, given the hashes of the inline scripts it may run.
 * Example: `pagePolicy(["'sha256-abc='"])` → "default-src 'self'; script-src 'self' 'sha256-abc='; …"
 */
export function pagePolicy(scriptHashes: readonly string[]): string {
  return [
    "default-src 'self'",
    `script-src ${["'self'", ...scriptHashes].join(' ')}`,
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' data:",
    "font-src 'self'",
    "connect-src 'self'",
    "worker-src 'self'",
    "manifest-src 'self'",
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "frame-ancestors 'self'",
  ].join('; ');
}

/**
 * The script hashes of a policy Astro wrote (its `script-src` sources of the form 'sha256-…').
 * Example: `scriptHashesOf("script-src 'self' 'sha256-abc='; style-src 'self'")` → ["'sha256-abc='"]
 */
export function scriptHashesOf(policy: string | null): string[] {
  const scriptSrc = (policy ?? '').split(';').map((d) => d.trim()).find((d) => d.startsWith('script-src '));
  return scriptSrc ? scriptSrc.split(/\s+/).filter((s) => /^'sha(256|384|512)-[A-Za-z0-9+/=]+'$/.test(s)) : [];
}
