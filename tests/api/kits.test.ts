/**
 * The kit library over HTTP: the contract for scripts and the planner (GET /api/kits, POST
 * /api/loans answering 201, 409 or 422), four simultaneous overlapping requests of which exactly
 * one is stored, roles per route and per loan move, and clear refusals that change nothing.
 * Kits, instruments and dates are constructed for the checks (relative to today).
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { call } from '../support/http';

const day = (n: number) => new Date(Date.now() + n * 86_400_000).toISOString().slice(0, 10);
const tag = String(Date.now() % 1_000_000);
let seq = 0;

/** A kit with instruments, created by the custodian over the API. */
async function newKit(instruments: { type: string; calibrationDue?: string | null }[] = [{ type: 'light_meter' }]) {
  seq++;
  const k = await call('custodian', 'POST', '/api/kits', { code: `API-${tag}-${seq}`, name: `API kit ${seq}`, homeLocation: 'Store' });
  expect(k.status, JSON.stringify(k.body)).toBe(201);
  for (const [n, i] of instruments.entries()) {
    const r = await call('custodian', 'POST', '/api/instruments', { kitId: k.body.id, type: i.type, model: 'M', serial: `API-${tag}-${seq}-${n}`, calibrationDue: i.calibrationDue ?? day(300) });
    expect(r.status, JSON.stringify(r.body)).toBe(201);
  }
  return k.body as { id: string; code: string };
}

let kit: { id: string; code: string };
beforeAll(async () => {
  kit = await newKit([{ type: 'clamp_ammeter' }, { type: 'flashlight', calibrationDue: null }]);
});

describe('GET /api/kits', () => {
  it('answers the documented shape', async () => {
    const r = await call('auditor', 'GET', '/api/kits');
    expect(r.status).toBe(200);
    const k = r.body.items.find((x: { id: string }) => x.id === kit.id);
    expect(k).toMatchObject({ id: kit.id, code: kit.code, name: expect.any(String), description: expect.any(String), homeLocation: 'Store', active: true, available: null, calibrationOk: true });
    expect(k.instrumentTypes.sort()).toEqual(['clamp_ammeter', 'flashlight']);
    for (const i of k.instruments) expect(Object.keys(i)).toEqual(expect.arrayContaining(['id', 'type', 'model', 'serial', 'calibrationDue', 'condition']));
  });

  it('with a range, says whether each kit is available', async () => {
    const held = await newKit();
    expect((await call('staff', 'POST', '/api/loans', { kitId: held.id, start: day(5), end: day(8), purpose: 'Hold it' })).status).toBe(201);
    const during = await call('staff', 'GET', `/api/kits?from=${day(8)}&to=${day(9)}`);
    expect(during.body.items.find((x: { id: string }) => x.id === held.id).available).toBe(false);
    const after = await call('staff', 'GET', `/api/kits?from=${day(9)}&to=${day(10)}`);
    expect(after.body.items.find((x: { id: string }) => x.id === held.id).available).toBe(true);
  });

  it('refuses a half or reversed range with a message naming the field', async () => {
    const half = await call('staff', 'GET', `/api/kits?from=${day(1)}`);
    expect(half.status).toBe(400);
    expect(half.body.error.message).toMatch(/to: give both from and to/);
    const reversed = await call('staff', 'GET', `/api/kits?from=${day(3)}&to=${day(1)}`);
    expect(reversed.status).toBe(400);
    expect((await call('staff', 'GET', '/api/kits?from=2026-02-30&to=2026-03-01')).body.error.message).toMatch(/not a real date/);
  });
});

describe('POST /api/loans', () => {
  it('201 with the loan; the custodian is told by mail', async () => {
    const r = await call('staff', 'POST', '/api/loans', { kitId: kit.id, start: day(20), end: day(22), purpose: 'Motor survey, building 1040' });
    expect(r.status, JSON.stringify(r.body)).toBe(201);
    expect(r.body).toMatchObject({ id: expect.any(String), kitId: kit.id, status: 'requested', start: day(20), end: day(22), days: 3, installationCode: 'BNP' });
    const box = await call('admin', 'GET', '/api/outbox');
    const mail = box.body.items.find((m: { to: string; subject: string }) => m.to === 'custodian@demo.plumbline.test' && m.subject.startsWith(`Kit request: ${kit.code}`));
    expect(mail.text).toContain(`Loan ${r.body.ref}`);
    expect(mail.text).toContain('Motor survey, building 1040');
  });

  it('four simultaneous overlapping requests for one kit: exactly one 201, three 409, one holding loan', async () => {
    const k = await newKit();
    const who = ['staff', 'auditor', 'manager', 'admin'] as const;
    const results = await Promise.all(
      who.map((w, n) => call(w, 'POST', '/api/loans', { kitId: k.id, start: day(40 + n), end: day(45 + n), purpose: `Request by ${w}`, installation: w === 'auditor' ? 'KSL' : undefined })),
    );
    const statuses = results.map((r) => r.status).sort();
    expect(statuses, JSON.stringify(results.map((r) => r.body))).toEqual([201, 409, 409, 409]);
    const winner = results.find((r) => r.status === 201)!.body;
    for (const r of results.filter((x) => x.status === 409)) {
      expect(r.body.error.code).toBe('conflict');
      expect(r.body.error.message).toMatch(new RegExp(`^Kit ${k.code} is already held on days you asked for`));
      expect(r.body.error.details.held.map((h: { start: string; end: string }) => [h.start, h.end])).toEqual([[winner.start, winner.end]]);
    }
    const loans = await call('custodian', 'GET', `/api/loans?kit=${k.id}`);
    expect(loans.body.items.filter((l: { status: string }) => ['requested', 'approved', 'shipped', 'in-use'].includes(l.status)).map((l: { id: string }) => l.id)).toEqual([winner.id]);
  });

  it('409 names the held dates and the loan; the other installation learns the dates only', async () => {
    const k = await newKit();
    const first = await call('staff', 'POST', '/api/loans', { kitId: k.id, start: day(12), end: day(14), purpose: 'Chiller survey' });
    const clash = await call('staff', 'POST', '/api/loans', { kitId: k.id, start: day(14), end: day(15), purpose: 'Second' });
    expect(clash.status).toBe(409);
    expect(clash.body.error.message).toContain(`loan ${first.body.ref}`);
    expect(clash.body.error.message).toContain('Chiller survey');
    const foreign = await call('auditor', 'POST', '/api/loans', { kitId: k.id, start: day(13), end: day(13), purpose: 'Elsewhere', installation: 'KSL' });
    expect(foreign.status).toBe(409);
    // The auditor works at BNP too, so the BNP loan is theirs to see.
    expect(foreign.body.error.message).toContain('Chiller survey');
    const ines = await call('ines.varga@demo.plumbline.test', 'POST', '/api/loans', { kitId: k.id, start: day(13), end: day(13), purpose: 'Elsewhere' });
    expect(ines.status).toBe(409);
    expect(ines.body.error.message).toMatch(/another installation/);
    expect(ines.body.error.message).not.toContain('Chiller survey');
  });

  it('422 when an instrument would be past calibration on a loan day, naming it', async () => {
    const k = await newKit([{ type: 'combustion_analyzer', calibrationDue: day(10) }]);
    const r = await call('staff', 'POST', '/api/loans', { kitId: k.id, start: day(8), end: day(11), purpose: 'Boiler tune-up check' });
    expect(r.status).toBe(422);
    expect(r.body.error.message).toMatch(/Combustion analyzer \(M, serial .*\): calibration due/);
    expect(r.body.error.details.problems[0].reason).toBe('past-calibration');
    expect((await call('staff', 'POST', '/api/loans', { kitId: k.id, start: day(8), end: day(10), purpose: 'Boiler tune-up check' })).status).toBe(201);
  });

  it('bad input gets a clear message and stores nothing', async () => {
    const k = await newKit();
    const cases: [unknown, number, RegExp][] = [
      [{ kitId: k.id, start: day(3), purpose: 'No end' }, 400, /end: a date is required/],
      [{ kitId: k.id, start: day(3), end: day(2), purpose: 'Backwards' }, 422, /before the first day/],
      [{ kitId: k.id, start: day(-2), end: day(2), purpose: 'Past' }, 422, /in the past/],
      [{ kitId: k.id, start: day(1), end: day(70), purpose: 'Too long' }, 422, /at most 60 days/],
      [{ kitId: k.id, start: day(1), end: day(2), purpose: '' }, 400, /purpose: say in a few words/],
      [{ kitId: 'not-a-uuid', start: day(1), end: day(2), purpose: 'Bad kit' }, 400, /kitId/],
      [{ kitId: '00000000-0000-4000-8000-000000000000', start: day(1), end: day(2), purpose: 'No kit' }, 404, /No kit/],
    ];
    for (const [body, status, message] of cases) {
      const r = await call('staff', 'POST', '/api/loans', body);
      expect(r.status, JSON.stringify(r.body)).toBe(status);
      expect(r.body.error.message).toMatch(message);
    }
    expect((await call('custodian', 'GET', `/api/loans?kit=${k.id}`)).body.items).toEqual([]);
  });
});

describe('roles', () => {
  it('only custodians manage kits and instruments; analysts and custodians do not request', async () => {
    expect((await call('auditor', 'POST', '/api/kits', { code: 'AUD-1', name: 'No' })).status).toBe(403);
    expect((await call('manager', 'PATCH', `/api/kits/${kit.id}`, { name: 'No' })).status).toBe(403);
    expect((await call('staff', 'POST', '/api/instruments', { kitId: kit.id, type: 'camera', serial: 'X' })).status).toBe(403);
    expect((await call('analyst', 'POST', '/api/loans', { kitId: kit.id, start: day(2), end: day(3), purpose: 'No' })).status).toBe(403);
    expect((await call('custodian', 'POST', '/api/loans', { kitId: kit.id, start: day(2), end: day(3), purpose: 'No' })).status).toBe(403);
    expect((await call('admin', 'PATCH', `/api/kits/${kit.id}`, { description: 'Edited by the administrator' })).status).toBe(200);
  });

  it('each loan move is made by its party only; a move the status does not allow is 409', async () => {
    const k = await newKit();
    const l = (await call('staff', 'POST', '/api/loans', { kitId: k.id, start: day(3), end: day(4), purpose: 'Moves' })).body;
    const move = (who: string, to: string, note = '') => call(who, 'POST', `/api/loans/${l.id}/transition`, { to, note });
    expect((await move('staff', 'approved')).status).toBe(403);
    expect((await move('manager', 'approved')).status).toBe(403);
    expect((await move('custodian', 'shipped')).status).toBe(409);
    expect((await move('custodian', 'approved', 'Fine')).status).toBe(200);
    expect((await move('custodian', 'shipped', 'Courier')).status).toBe(200);
    expect((await move('staff', 'in-use')).status).toBe(200);
    expect((await move('staff', 'returned')).status).toBe(403);
    const back = await move('custodian', 'returned');
    expect(back.status).toBe(200);
    const bad = await call('custodian', 'POST', `/api/loans/${l.id}/transition`, { to: 'lost' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.message).toMatch(/^Invalid input — to:/);
    const done = await call('staff', 'GET', `/api/loans/${l.id}`);
    expect(done.body.events.map((e: { to: string; by: string }) => `${e.to} by ${e.by}`)).toEqual(['requested by Callum Brightwater', 'approved by Odile Fairbanks', 'shipped by Odile Fairbanks', 'in-use by Callum Brightwater', 'returned by Odile Fairbanks']);
  });

  it('a kit with a holding loan cannot be taken out of service', async () => {
    const k = await newKit();
    expect((await call('staff', 'POST', '/api/loans', { kitId: k.id, start: day(3), end: day(4), purpose: 'Holds it' })).status).toBe(201);
    const r = await call('custodian', 'PATCH', `/api/kits/${k.id}`, { active: false });
    expect(r.status).toBe(409);
    expect(r.body.error.message).toMatch(/cannot be taken out of service while loans hold it/);
    expect((await call('custodian', 'GET', `/api/kits/${k.id}`)).body.active).toBe(true);
  });
});
