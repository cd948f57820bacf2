/** The client address behind trusted proxies (right-most untrusted X-Forwarded-For hop). */
import { describe, expect, it } from 'vitest';
import { clientAddress } from '../../src/server/client-address';

const proxies = new Set(['10.0.0.2', '10.0.0.3']);
const h = (xff?: string) => new Headers(xff ? { 'x-forwarded-for': xff } : {});

describe('clientAddress', () => {
  it('is the socket address when the peer is not a trusted proxy, whatever the headers say', () => {
    expect(clientAddress('203.0.113.9', h('198.51.100.1'), proxies)).toBe('203.0.113.9');
    expect(clientAddress('::ffff:203.0.113.9', h(), proxies)).toBe('203.0.113.9');
  });
  it('behind trusted proxies, the right-most hop that is not one of them', () => {
    // Source: MDN Web Docs, X-Forwarded-For, "Selecting an IP address" (use the right-most address not added by a trusted proxy) [memory].
    expect(clientAddress('10.0.0.2', h('198.51.100.7, 203.0.113.50, 10.0.0.3'), proxies)).toBe('203.0.113.50');
    expect(clientAddress('10.0.0.2', h('203.0.113.50'), proxies)).toBe('203.0.113.50');
  });
  it('a forged left-most hop does not win', () => {
    expect(clientAddress('10.0.0.2', h('1.2.3.4, 203.0.113.50'), proxies)).toBe('203.0.113.50');
  });
  it('falls back to the proxy when it forwarded nothing', () => {
    expect(clientAddress('10.0.0.2', h(), proxies)).toBe('10.0.0.2');
  });
});
