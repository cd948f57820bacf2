/**
 * The Content-Security-Policy directives besides script-src and style-src (OWASP ASVS 4.0.3
 * 14.4.3, 14.4.7), shared by Astro's page policy (astro.config.mjs) and the policy of every other
 * response (security-headers.ts). See docs/decisions/0008-content-security-policy.md.
 */
export const CSP_DIRECTIVES = [
  "default-src 'self'",
  "img-src 'self' data: blob:",
  "font-src 'self'",
  "connect-src 'self'",
  "object-src 'none'",
  "base-uri 'self'",
  "form-action 'self'",
  "frame-ancestors 'none'",
] as const;
