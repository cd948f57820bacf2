/**
 * Response headers per OWASP ASVS 4.0.3 14.4: a Content-Security-Policy, no framing, no MIME
 * sniffing, a same-origin referrer policy. Pages get their policy from Astro (astro.config.mjs:
 * the hashes of the scripts it rendered); every other response (API answers, error pages,
 * redirects) gets this one, which allows no inline script at all.
 */
import { CSP_DIRECTIVES } from './csp';

const CSP = [...CSP_DIRECTIVES, "script-src 'self'", "style-src 'self' 'unsafe-inline'"].join('; ');

/**
 * Astro lists the hashes of its own inline <style> elements in style-src; a listed hash switches
 * 'unsafe-inline' off, which would block the style attributes of server-rendered islands. Style
 * hashes are dropped so that styles stay 'self' 'unsafe-inline' while scripts keep their hashes.
 */
export function relaxStyleHashes(policy: string): string {
  return policy.replace(/style-src([^;]*)/, (_m, sources: string) => `style-src${sources.replace(/\s+'sha(256|384|512)-[^']*'/g, '')}`);
}

export function securityHeaders(res: Response): Response {
  try {
    const h = res.headers;
    const fromAstro = h.get('content-security-policy');
    h.set('content-security-policy', fromAstro ? relaxStyleHashes(fromAstro) : CSP);
    h.set('x-content-type-options', 'nosniff');
    h.set('x-frame-options', 'DENY');
    h.set('referrer-policy', 'same-origin');
    h.set('permissions-policy', 'camera=(self), microphone=(), geolocation=()');
    h.set('cross-origin-opener-policy', 'same-origin');
    return res;
  } catch {
    // Immutable headers (e.g. a redirect built by the platform): copy into a new response.
    const copy = new Response(res.body, res);
    return securityHeaders(copy);
  }
}
