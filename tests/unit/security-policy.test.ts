import { describe, expect, it } from 'vitest';
import { BASE_SECURITY_HEADERS, NON_PAGE_POLICY, pagePolicy, scriptHashesOf } from '@/lib/security-policy';

describe('the Content-Security-Policy', () => {
  it('keeps the script hashes of the policy Astro wrote, and nothing else of it', () => {
    const astro = "script-src 'self' 'sha256-6jvFpQC5qvsFlP4oRBzE+NdjFeAvdPfO+OceaIWyfTw=' 'unsafe-inline' https://cdn.example; style-src 'self' 'sha256-vv9IoKo7BSLbWcUHr3tNmfNVmm5L/9Cfn2H6LMk7/ow='";
    expect(scriptHashesOf(astro)).toEqual(["'sha256-6jvFpQC5qvsFlP4oRBzE+NdjFeAvdPfO+OceaIWyfTw='"]);
    expect(scriptHashesOf(null)).toEqual([]);
    expect(scriptHashesOf("style-src 'self'")).toEqual([]);
  });

  it('allows scripts from our origin and the given hashes only, and no plugins, framing or foreign forms', () => {
    const policy = pagePolicy(["'sha256-abc='"]);
    const directives = Object.fromEntries(policy.split('; ').map((d) => [d.split(' ')[0], d.split(' ').slice(1).join(' ')]));
    expect(directives['script-src']).toBe("'self' 'sha256-abc='");
    expect(directives['default-src']).toBe("'self'");
    expect(directives['object-src']).toBe("'none'");
    expect(directives['frame-ancestors']).toBe("'self'");
    expect(directives['form-action']).toBe("'self'");
    expect(directives['worker-src']).toBe("'self'");
    expect(directives['manifest-src']).toBe("'self'");
    expect(policy).not.toMatch(/https?:|\*/);
  });

  it('lets nothing run in an answer that is not a page, and sends the base headers', () => {
    expect(NON_PAGE_POLICY).toMatch(/^default-src 'none'/);
    expect(BASE_SECURITY_HEADERS['X-Content-Type-Options']).toBe('nosniff');
    expect(BASE_SECURITY_HEADERS['Cross-Origin-Opener-Policy']).toBe('same-origin');
  });
});
