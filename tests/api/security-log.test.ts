/**
 * Security events reach the activity log (OWASP ASVS 4.0.3 7.1.3, 7.2.1, 7.2.2): failed and
 * successful sign-ins, refused requests, role changes, imports and exports, each with who, when
 * and from where.
 */
import { describe, expect, it } from 'vitest';
import { baseUrl, call, DEMO, fileForm } from '../support/http';

interface Entry {
  action: string;
  actor: string;
  ip: string;
  at?: string;
  createdAt?: string;
  details: Record<string, unknown>;
}
async function latest(action: string): Promise<Entry[]> {
  const r = await call('admin', 'GET', `/api/activity?action=${encodeURIComponent(action)}`);
  expect(r.status).toBe(200);
  return r.body.items as Entry[];
}

describe('security events in the activity log', () => {
  it('a failed sign-in, naming the account and the address', async () => {
    const res = await fetch(`${baseUrl()}/api/auth/sign-in/email`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', origin: baseUrl() },
      body: JSON.stringify({ email: DEMO.custodian, password: 'not the password at all' }),
    });
    expect(res.status).toBe(401);
    const entries = await latest('auth.sign-in-failed');
    expect(entries.some((e) => e.actor === DEMO.custodian && e.ip !== '')).toBe(true);
  });

  it('a refused request, with the route and the person', async () => {
    const r = await call('analyst', 'PUT', '/api/shortlist/weights', { excessEnergy: 30, excessCost: 20, yoyIncrease: 15, anomalies: 10, evaluationAge: 15, manualFlag: 10 });
    expect(r.status).toBe(403);
    const entries = await latest('access.denied');
    expect(entries.some((e) => e.actor === DEMO.analyst && e.details.path === '/api/shortlist/weights' && e.details.method === 'PUT')).toBe(true);
  });

  it('an import and an export', async () => {
    const meters = (await call('admin', 'GET', '/api/meters?installation=BNP')).body.items as { code: string }[];
    const csv = `Meter,Start,End,Usage\n${meters[0]!.code},2027-01-01,2027-01-30,100\n`;
    const done = await call('staff', 'POST', '/api/imports', fileForm({ name: 'log.csv', text: csv }, { installation: 'BNP', dryRun: 'false' }));
    expect(done.status).toBe(201);
    expect((await latest('import.commit')).some((e) => e.actor === DEMO.staff)).toBe(true);
    const exp = await call('manager', 'GET', '/api/shortlist?format=csv');
    expect(exp.status).toBe(200);
    expect((await latest('export.shortlist-csv')).some((e) => e.actor === DEMO.manager)).toBe(true);
    await call('admin', 'DELETE', `/api/imports/${done.body.id}`);
  });
});
