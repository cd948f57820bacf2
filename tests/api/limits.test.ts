/**
 * Body size limits on every route that takes a body (OWASP ASVS 4.0.3 12.1.1, 13.1.3): JSON
 * bodies over 1 MB are refused with 413 whether their length is declared or not, auth bodies over
 * 64 KB or without a length are refused, and nothing is stored. Upload routes have their own
 * limits, tested with their routes (intake.test.ts, walkthroughs.test.ts).
 */
import { describe, expect, it } from 'vitest';
import { apiRoutes } from '../support/routes';
import { baseUrl, call, signIn, DEMO } from '../support/http';

const UPLOADS = new Set(['POST /api/imports', 'POST /api/weather/stations/[code]/observations', 'POST /api/walkthroughs/[id]/photos']);
const BIG = JSON.stringify({ notes: 'x'.repeat(1024 * 1024 + 10) });

function chunked(text: string): ReadableStream<Uint8Array> {
  const bytes = new TextEncoder().encode(text);
  let at = 0;
  return new ReadableStream({
    pull(c) {
      if (at >= bytes.length) return c.close();
      c.enqueue(bytes.subarray(at, at + 64 * 1024));
      at += 64 * 1024;
    },
  });
}

describe('body limits', () => {
  const bodyRoutes = apiRoutes().filter((r) => /^(POST|PUT|PATCH) /.test(r) && !r.startsWith('ALL ') && !UPLOADS.has(r));

  it('every JSON body route refuses a body over 1 MB with 413', async () => {
    expect(bodyRoutes.length).toBeGreaterThan(20);
    const answers: string[] = [];
    for (const route of bodyRoutes) {
      const [method, path] = route.split(' ') as [string, string];
      const concrete = path.replace(/\[[^\]]+\]/g, '00000000-0000-4000-8000-000000000000');
      const r = await call('admin', method, concrete, undefined, { contentType: 'application/json', raw: BIG });
      if (r.status !== 413 || r.body?.error?.code !== 'too_large') answers.push(`${route} → ${r.status}`);
    }
    expect(answers).toEqual([]);
  });

  it('a JSON body sent without a length is cut off past 1 MB, and nothing changes', async () => {
    const building = (await call('admin', 'GET', '/api/buildings?installation=BNP')).body.items[0];
    const before = (await call('admin', 'GET', `/api/buildings/${building.id}`)).body;
    const res = await fetch(`${baseUrl()}/api/buildings/${building.id}`, {
      method: 'PATCH',
      headers: { cookie: await signIn(DEMO.admin), origin: baseUrl(), 'content-type': 'application/json' },
      body: chunked(BIG),
      duplex: 'half',
    } as RequestInit);
    expect(res.status).toBe(413);
    expect((await res.json()).error.code).toBe('too_large');
    expect((await call('admin', 'GET', `/api/buildings/${building.id}`)).body).toEqual(before);
  });

  it('sign-in bodies: over 64 KB → 413, without a length → 411', async () => {
    const big = await fetch(`${baseUrl()}/api/auth/sign-in/email`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', origin: baseUrl() },
      body: JSON.stringify({ email: DEMO.analyst, password: 'x'.repeat(70 * 1024) }),
    });
    expect(big.status).toBe(413);
    const unannounced = await fetch(`${baseUrl()}/api/auth/sign-in/email`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', origin: baseUrl() },
      body: chunked(JSON.stringify({ email: DEMO.analyst, password: 'plumbline-demo-2026' })),
      duplex: 'half',
    } as RequestInit);
    expect(unannounced.status).toBe(411);
  });
});
