import { describe, expect, it } from 'vitest';
import { relaxStyleHashes } from '../../../src/server/security-headers';

describe('relaxStyleHashes', () => {
  it('drops style hashes and keeps script hashes (W3C CSP Level 3 §6.6.2.2: a hash disables unsafe-inline)', () => {
    const p = "default-src 'self'; script-src 'self' 'sha256-AAA='; style-src 'self' 'unsafe-inline' 'sha256-BBB=' 'sha384-CCC=';";
    expect(relaxStyleHashes(p)).toBe("default-src 'self'; script-src 'self' 'sha256-AAA='; style-src 'self' 'unsafe-inline';");
  });
  it('leaves a policy without style-src alone', () => {
    expect(relaxStyleHashes("script-src 'self' 'sha256-AAA='")).toBe("script-src 'self' 'sha256-AAA='");
  });
});
