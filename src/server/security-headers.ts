/**
 * Response headers per OWASP ASVS 4.0.3 14.4: a Content-Security-Policy, no framing, no MIME
 * sniffing, a same-origin referrer policy. Astro's island hydration uses inline scripts, so
 * script-src allows them; nothing is loaded from any other origin.
 */
const CSP = [
  "default-src 'self'",
  "script-src 'self' 'unsafe-inline'",
  "style-src 'self' 'unsafe-inline'",
  "img-src 'self' data: blob:",
  "font-src 'self'",
  "connect-src 'self'",
  "object-src 'none'",
  "base-uri 'self'",
  "form-action 'self'",
  "frame-ancestors 'none'",
].join('; ');

export function securityHeaders(res: Response): Response {
  try {
    const h = res.headers;
    if (!h.has('content-security-policy')) h.set('content-security-policy', CSP);
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
