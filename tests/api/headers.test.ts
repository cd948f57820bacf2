/**
 * Security headers on pages, API answers and refusals (OWASP ASVS 4.0.3 14.4.1–14.4.7): a
 * Content-Security-Policy without inline script, no framing, nosniff, a same-origin referrer.
 */
import { describe, expect, it } from 'vitest';
import { call } from '../support/http';

function directives(policy: string | null): Map<string, string[]> {
  const out = new Map<string, string[]>();
  for (const part of (policy ?? '').split(';')) {
    const [name, ...sources] = part.trim().split(/\s+/);
    if (name) out.set(name, sources);
  }
  return out;
}

function expectCommon(headers: Headers) {
  const csp = directives(headers.get('content-security-policy'));
  // Source: OWASP ASVS 4.0.3 14.4.3 (CSP), 14.4.7 (frame-ancestors), W3C CSP Level 3 §6.
  expect(csp.get('default-src')).toEqual(["'self'"]);
  expect(csp.get('frame-ancestors')).toEqual(["'none'"]);
  expect(csp.get('object-src')).toEqual(["'none'"]);
  expect(csp.get('base-uri')).toEqual(["'self'"]);
  expect(csp.get('script-src')).toContain("'self'");
  expect(csp.get('script-src')).not.toContain("'unsafe-inline'");
  expect(csp.get('script-src')).not.toContain("'unsafe-eval'");
  expect(headers.get('x-content-type-options')).toBe('nosniff'); // ASVS 14.4.4
  expect(headers.get('x-frame-options')).toBe('DENY');
  expect(headers.get('referrer-policy')).toBe('same-origin'); // ASVS 14.4.6
  return csp;
}

describe('security headers', () => {
  it('a page lists the hashes of its scripts and allows no other inline script', async () => {
    const page = await call('manager', 'GET', '/');
    expect(page.status).toBe(200);
    const csp = expectCommon(page.headers);
    const scriptSources = csp.get('script-src')!;
    expect(scriptSources.some((s) => /^'sha256-[A-Za-z0-9+/=]+'$/.test(s))).toBe(true);
    // Every inline script in the page has its hash listed (W3C CSP Level 3 §8.3 hash-source).
    const html = String(page.body);
    const { createHash } = await import('node:crypto');
    const inline = [...html.matchAll(/<script(?![^>]*\bsrc=)[^>]*>([\s\S]*?)<\/script>/g)].map((m) => m[1]!);
    expect(inline.length).toBeGreaterThan(0);
    for (const body of inline) expect(scriptSources).toContain(`'sha256-${createHash('sha256').update(body, 'utf8').digest('base64')}'`);
    // Styles: 'unsafe-inline' only counts while no style hash is listed.
    expect(csp.get('style-src')).toEqual(["'self'", "'unsafe-inline'"]);
  });

  it('API answers, refusals and the sign-in redirect carry the strict policy', async () => {
    const api = await call('manager', 'GET', '/api/me');
    expect(expectCommon(api.headers).get('script-src')).toEqual(["'self'"]);
    const refused = await call(null, 'GET', '/api/buildings');
    expect(refused.status).toBe(401);
    expectCommon(refused.headers);
    const redirect = await call(null, 'GET', '/shortlist');
    expect(redirect.status).toBe(303);
    expectCommon(redirect.headers);
  });
});
