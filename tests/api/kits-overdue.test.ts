/**
 * Overdue mail reaches the Outbox when the job runs. A server of its own on a copy of the demo
 * folder: a loan is requested, approved and shipped over HTTP; with the server stopped, the loan
 * is moved ten days back (as if that time had passed) and the `loan-overdue` job runs as the
 * scheduler runs it; the restarted server then lists the reminders on its Outbox API and shows
 * the loan as overdue. Dates are constructed relative to today.
 */
import { spawnSync } from 'node:child_process';
import { cpSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, inject, it } from 'vitest';
import { DEMO, DEMO_PASSWORD } from '../support/http';
import { ROOT, serverEnv, startServer, type RunningServer } from '../support/server-process';

const template = inject('demoTemplateDir');
const day = (n: number) => new Date(Date.now() + n * 86_400_000).toISOString().slice(0, 10);

/** A client for one server: signs each demo account in once. */
function client(base: string) {
  const cookies = new Map<string, string>();
  return async (as: keyof typeof DEMO, method: string, path: string, body?: unknown) => {
    let cookie = cookies.get(as);
    if (!cookie) {
      const res = await fetch(`${base}/api/auth/sign-in/email`, { method: 'POST', headers: { 'content-type': 'application/json', origin: base }, body: JSON.stringify({ email: DEMO[as], password: DEMO_PASSWORD }) });
      if (!res.ok) throw new Error(`sign-in ${as}: ${res.status}`);
      cookie = res.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ');
      cookies.set(as, cookie);
    }
    const res = await fetch(`${base}${path}`, { method, headers: { origin: base, cookie, ...(body === undefined ? {} : { 'content-type': 'application/json' }) }, body: body === undefined ? null : JSON.stringify(body) });
    return { status: res.status, body: await res.json() };
  };
}

describe.skipIf(!template)('the loan-overdue job', () => {
  const dir = mkdtempSync(join(tmpdir(), 'plumbline-kits-overdue-'));
  let server: RunningServer | undefined;
  afterAll(async () => {
    await server?.stop();
    rmSync(dir, { recursive: true, force: true });
  });

  it('mails the borrower and the custodian; the mail is in the Outbox and the loan shows overdue', { timeout: 300_000 }, async () => {
    cpSync(template, dir, { recursive: true, filter: (p) => !p.endsWith('ready') && !p.endsWith('plumbline.lock') });
    server = await startServer({ dataDir: dir });
    let api = client(server.baseUrl);
    const kit = await api('custodian', 'POST', '/api/kits', { code: 'OVERDUE-1', name: 'Overdue check kit' });
    expect(kit.status).toBe(201);
    expect((await api('custodian', 'POST', '/api/instruments', { kitId: kit.body.id, type: 'light_meter', serial: 'OD-1', calibrationDue: day(300) })).status).toBe(201);
    const l = await api('staff', 'POST', '/api/loans', { kitId: kit.body.id, start: day(0), end: day(2), purpose: 'Lighting survey, building 1040' });
    expect(l.status, JSON.stringify(l.body)).toBe(201);
    expect((await api('custodian', 'POST', `/api/loans/${l.body.id}/transition`, { to: 'approved' })).status).toBe(200);
    expect((await api('custodian', 'POST', `/api/loans/${l.body.id}/transition`, { to: 'shipped', note: 'Courier' })).status).toBe(200);
    await server.stop();

    const run = spawnSync(process.execPath, ['--import', 'tsx', join(ROOT, 'tests', 'api', 'kits-overdue-job.ts'), l.body.id, '10'], { cwd: ROOT, env: serverEnv({ PLUMBLINE_DATA_DIR: dir }), encoding: 'utf8', timeout: 120_000 });
    expect(run.status, run.stderr).toBe(0);
    const result = JSON.parse(run.stdout.trim().split('\n').at(-1)!);
    // Ended 8 days ago (was due back on day 2, moved back 10).
    expect(result).toMatchObject({ moved: { start: day(-10), end: day(-8) }, status: 'ok', detail: '1 overdue loans, 2 mails' });

    server = await startServer({ dataDir: dir });
    api = client(server.baseUrl);
    const box = await api('admin', 'GET', '/api/outbox');
    const overdue = box.body.items.filter((m: { subject: string }) => m.subject.startsWith('Overdue: kit OVERDUE-1'));
    expect(overdue.map((m: { to: string }) => m.to).sort()).toEqual([DEMO.custodian, DEMO.staff]);
    for (const m of overdue) {
      expect(m.status).toBe('sent');
      expect(m.text).toContain('ended 8 days ago');
      expect(m.text).toContain(`Loan ${l.body.ref}`);
    }
    const after = await api('staff', 'GET', `/api/loans/${l.body.id}`);
    expect(after.body).toMatchObject({ status: 'shipped', overdue: true, end: day(-8) });
  });
});
