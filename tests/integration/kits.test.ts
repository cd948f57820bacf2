/**
 * The kit library's services on a fresh database: kits and instruments, the loan state machine
 * with its roles, the calibration and condition refusals, double booking refused by the database
 * and reported as a 409, installation scope, and the history of an instrument.
 * Inventories, people and dates are constructed for these checks (relative to today).
 */
import { eq, sql } from 'drizzle-orm';
import { beforeAll, describe, expect, it } from 'vitest';
import { getDb, queryRows } from '../../src/db/client';
import { loan, loanEvent, walkthrough } from '../../src/db/schema';
import { addDays, todayIn } from '../../src/lib/kits/loan-dates';
import type { Actor } from '../../src/server/authz';
import { HttpError } from '../../src/server/http';
import { instrumentHistory } from '../../src/server/kits/instrument-history';
import { createInstrument, updateInstrument } from '../../src/server/kits/instruments';
import { createKit, getKit, listKits, updateKit } from '../../src/server/kits/kits';
import { transitionLoan } from '../../src/server/kits/loan-transitions';
import { getLoan, listLoans, requestLoan } from '../../src/server/kits/loans';
import { actor, twoInstallations } from '../support/fixtures';

const today = todayIn('UTC');
const d = (n: number) => addDays(today, n);

let inv: Awaited<ReturnType<typeof twoInstallations>>;
let custodian: Actor, admin: Actor, staffA: Actor, staffA2: Actor, staffB: Actor, auditorAB: Actor, manager: Actor, analyst: Actor;

beforeAll(async () => {
  inv = await twoInstallations();
  custodian = await actor('kit_custodian');
  admin = await actor('admin');
  staffA = await actor('installation_staff', [inv.a.id]);
  staffA2 = await actor('installation_staff', [inv.a.id]);
  staffB = await actor('installation_staff', [inv.b.id]);
  auditorAB = await actor('auditor', [inv.a.id, inv.b.id]);
  manager = await actor('regional_manager');
  analyst = await actor('analyst');
});

/** Expects `p` to reject with an HttpError of `status` whose message matches `message`. */
async function refused(p: Promise<unknown>, status: number, message?: RegExp): Promise<HttpError> {
  const e = await p.then(
    () => null,
    (x: unknown) => x,
  );
  expect(e, 'expected a refusal').toBeInstanceOf(HttpError);
  const h = e as HttpError;
  expect(h.status, h.message).toBe(status);
  if (message) expect(h.message).toMatch(message);
  return h;
}

let seq = 0;
async function kitWith(instruments: { type?: string; calibrationDue?: string | null; condition?: 'good' | 'fair' | 'needs-repair' | 'retired' }[] = [{}]) {
  seq++;
  const k = await createKit(custodian, { code: `KT-${seq}`, name: `Test kit ${seq}`, description: '', homeLocation: 'Store room' });
  const ids: string[] = [];
  for (const [n, i] of instruments.entries()) {
    const row = await createInstrument(custodian, {
      kitId: k.id,
      type: (i.type ?? 'light_meter') as 'light_meter',
      model: 'LX-1',
      serial: `S${seq}-${n}`,
      calibrationDue: i.calibrationDue === undefined ? d(300) : i.calibrationDue,
      condition: i.condition ?? 'good',
      notes: '',
    });
    ids.push(row.id);
  }
  return { kit: k, instrumentIds: ids };
}

describe('kits', () => {
  it('a kit code is unique (case-insensitive as typed), with a clear message', async () => {
    await createKit(custodian, { code: 'DUP-1', name: 'First', description: '', homeLocation: '' });
    await refused(createKit(custodian, { code: 'DUP-1', name: 'Second', description: '', homeLocation: '' }), 409, /DUP-1 is already in use/);
  });

  it('lists kits with their instruments and availability for a range', async () => {
    const { kit } = await kitWith([{ type: 'clamp_ammeter' }, { type: 'light_meter' }]);
    await requestLoan(staffA, { kitId: kit.id, start: d(10), end: d(12), purpose: 'Lighting survey' });
    const overlapping = (await listKits(staffA, { from: d(12), to: d(14) })).find((k) => k.id === kit.id)!;
    expect(overlapping.available).toBe(false);
    expect(overlapping.unavailableBecause.join(' ')).toMatch(/Held/);
    const free = (await listKits(staffA, { from: d(13), to: d(14) })).find((k) => k.id === kit.id)!;
    expect(free.available).toBe(true);
    expect(free.instrumentTypes.sort()).toEqual(['clamp_ammeter', 'light_meter']);
    expect((await listKits(staffA)).find((k) => k.id === kit.id)!.available).toBeNull();
  });

  it('a kit cannot be taken out of service while loans hold it; it can once they are closed', async () => {
    const { kit } = await kitWith();
    const l = await requestLoan(staffA, { kitId: kit.id, start: d(3), end: d(4), purpose: 'Plug loads' });
    await refused(updateKit(custodian, kit.id, { active: false }), 409, new RegExp(`loan ${l.ref}`));
    await transitionLoan(custodian, l.id, { to: 'declined', note: 'kit going for repair', conditions: [] });
    const k = await updateKit(custodian, kit.id, { active: false });
    expect(k.active).toBe(false);
    await refused(requestLoan(staffA, { kitId: kit.id, start: d(3), end: d(4), purpose: 'Plug loads' }), 422, /out of service/);
  });
});

describe('loan requests', () => {
  it('refuses bad dates with a clear message and stores nothing', async () => {
    const { kit } = await kitWith();
    await refused(requestLoan(staffA, { kitId: kit.id, start: d(5), end: d(4), purpose: 'x-ray' }), 422, /before the first day/);
    await refused(requestLoan(staffA, { kitId: kit.id, start: d(-1), end: d(4), purpose: 'x-ray' }), 422, /in the past/);
    await refused(requestLoan(staffA, { kitId: kit.id, start: d(1), end: d(61), purpose: 'x-ray' }), 422, /at most 60 days; these dates make 61/);
    expect(await listLoans(custodian, { kit: kit.id })).toEqual([]);
  });

  it('a 60-day loan starting today is accepted (inclusive days)', async () => {
    const { kit } = await kitWith();
    const l = await requestLoan(staffA, { kitId: kit.id, start: today, end: d(59), purpose: 'Season of logging' });
    expect(l).toMatchObject({ status: 'requested', start: today, end: d(59), days: 60 });
  });

  it('refuses a kit with an instrument past calibration on a loan day, naming it', async () => {
    const { kit } = await kitWith([{ type: 'light_meter' }, { type: 'combustion_analyzer', calibrationDue: d(8) }]);
    const e = await refused(requestLoan(staffA, { kitId: kit.id, start: d(5), end: d(9), purpose: 'Boiler check' }), 422, /Combustion analyzer \(LX-1, serial S\d+-1\): calibration due/);
    expect((e.details as { problems: { reason: string }[] }).problems.map((p) => p.reason)).toEqual(['past-calibration']);
    // Its last day within calibration (the due date itself) is fine.
    expect((await requestLoan(staffA, { kitId: kit.id, start: d(5), end: d(8), purpose: 'Boiler check' })).status).toBe('requested');
  });

  it('refuses a kit with a retired or broken instrument', async () => {
    const retired = await kitWith([{}, { condition: 'retired' }]);
    await refused(requestLoan(staffA, { kitId: retired.kit.id, start: d(2), end: d(3), purpose: 'Survey' }), 422, /is retired/);
    const broken = await kitWith([{ condition: 'needs-repair' }]);
    await refused(requestLoan(staffA, { kitId: broken.kit.id, start: d(2), end: d(3), purpose: 'Survey' }), 422, /needs repair/);
    const empty = await createKit(custodian, { code: 'EMPTY-1', name: 'Nothing in it', description: '', homeLocation: '' });
    await refused(requestLoan(staffA, { kitId: empty.id, start: d(2), end: d(3), purpose: 'Survey' }), 422, /no instruments/);
  });

  it('double booking is refused by the database and reported as a 409 naming the dates and the loan', async () => {
    const { kit } = await kitWith();
    const first = await requestLoan(staffA, { kitId: kit.id, start: d(20), end: d(25), purpose: 'Chiller plant survey' });
    const e = await refused(requestLoan(staffA2, { kitId: kit.id, start: d(25), end: d(27), purpose: 'Another survey' }), 409);
    expect(e.message).toContain(`loan ${first.ref}`);
    expect(e.message).toContain('Chiller plant survey');
    expect(e.message).toMatch(/already held/);
    // Adjacent days do not overlap (inclusive ranges end and start on different days).
    expect((await requestLoan(staffA2, { kitId: kit.id, start: d(26), end: d(27), purpose: 'Another survey' })).status).toBe('requested');
    // The other installation learns the dates but not what the loan is for.
    const hidden = await refused(requestLoan(staffB, { kitId: kit.id, start: d(21), end: d(21), purpose: 'Bravo survey' }), 409);
    expect(hidden.message).toMatch(/another installation/);
    expect(hidden.message).not.toContain('Chiller plant survey');
    // A cancelled loan frees its dates.
    await transitionLoan(staffA, first.id, { to: 'cancelled', note: '', conditions: [] });
    expect((await requestLoan(staffB, { kitId: kit.id, start: d(21), end: d(21), purpose: 'Bravo survey' })).status).toBe('requested');
  });

  it('four overlapping requests at once: exactly one is stored', async () => {
    const { kit } = await kitWith();
    const who = [staffA, staffA2, auditorAB, manager];
    const results = await Promise.allSettled(who.map((a, n) => requestLoan(a, { kitId: kit.id, start: d(30 + n), end: d(34 + n), purpose: `Request ${n}`, installation: a === auditorAB ? 'AAA' : undefined })));
    expect(results.filter((r) => r.status === 'fulfilled')).toHaveLength(1);
    const rejected = results.filter((r): r is PromiseRejectedResult => r.status === 'rejected');
    expect(rejected.map((r) => (r.reason as HttpError).status)).toEqual([409, 409, 409]);
    const db = await getDb();
    const rows = await queryRows<{ n: number }>(db, sql`select count(*)::int as n from loan where kit_id = ${kit.id} and status in ('requested','approved','shipped','in-use')`);
    expect(rows[0]!.n).toBe(1);
  });

  it('scoped roles request only for their installations; one with several must say which', async () => {
    const { kit } = await kitWith();
    await refused(requestLoan(staffA, { kitId: kit.id, start: d(40), end: d(41), purpose: 'Foreign', installation: 'BBB' }), 403, /not assigned to installation BBB/);
    await refused(requestLoan(auditorAB, { kitId: kit.id, start: d(40), end: d(41), purpose: 'Which one' }), 400, /AAA or BBB/);
    const l = await requestLoan(auditorAB, { kitId: kit.id, start: d(40), end: d(41), purpose: 'At Bravo', installation: 'BBB' });
    expect(l.installationCode).toBe('BBB');
    const byManager = await requestLoan(manager, { kitId: kit.id, start: d(43), end: d(44), purpose: 'Region-wide training' });
    expect(byManager.installationCode).toBeNull();
  });

  it('a loan for a walkthrough takes its installation and must include its day', async () => {
    const { kit } = await kitWith();
    const db = await getDb();
    const [w] = await db.insert(walkthrough).values({ buildingId: inv.buildingA.id, installationId: inv.a.id, plannedOn: d(50), title: 'HQ lighting', status: 'planned', auditorId: auditorAB.id }).returning();
    await refused(requestLoan(staffA, { kitId: kit.id, start: d(51), end: d(52), purpose: 'Lights', walkthroughId: w!.id }), 422, /must include that day/);
    await refused(requestLoan(staffB, { kitId: kit.id, start: d(49), end: d(51), purpose: 'Lights', walkthroughId: w!.id }), 404);
    const l = await requestLoan(staffA, { kitId: kit.id, start: d(49), end: d(51), purpose: 'Lights', walkthroughId: w!.id });
    expect(l).toMatchObject({ installationCode: 'AAA', walkthrough: { id: w!.id, title: 'HQ lighting' } });
    // The walkthrough's auditor is a borrower: may mark it in use, not ship it.
    await transitionLoan(custodian, l.id, { to: 'approved', note: '', conditions: [] });
    await refused(transitionLoan(auditorAB, l.id, { to: 'shipped', note: '', conditions: [] }), 403, /custodian/);
    await transitionLoan(custodian, l.id, { to: 'shipped', note: 'courier', conditions: [] });
    expect((await transitionLoan(auditorAB, l.id, { to: 'in-use', note: 'arrived', conditions: [] })).status).toBe('in-use');
  });
});

describe('the state machine', () => {
  it('runs requested → approved → shipped → in use → returned → inspected, each step with who and when', async () => {
    const { kit, instrumentIds } = await kitWith([{ type: 'clamp_ammeter' }, { type: 'light_meter' }]);
    const l = await requestLoan(staffA, { kitId: kit.id, start: d(2), end: d(6), purpose: 'Motor survey' });
    expect(l.moves.map((m) => m.to)).toEqual(['cancelled']);
    await refused(transitionLoan(staffA, l.id, { to: 'approved', note: '', conditions: [] }), 403, /Only the kit custodian/);
    await refused(transitionLoan(custodian, l.id, { to: 'shipped', note: '', conditions: [] }), 409, /cannot become shipped; it can become approved or declined or cancelled/);
    await transitionLoan(custodian, l.id, { to: 'approved', note: 'ok', conditions: [] });
    await transitionLoan(custodian, l.id, { to: 'shipped', note: 'by van', conditions: [] });
    await refused(transitionLoan(staffA2, l.id, { to: 'in-use', note: '', conditions: [] }), 403);
    await transitionLoan(staffA, l.id, { to: 'in-use', note: 'arrived', conditions: [] });
    await refused(transitionLoan(staffA, l.id, { to: 'returned', note: '', conditions: [] }), 403);
    await refused(transitionLoan(custodian, l.id, { to: 'returned', note: '', conditions: [{ instrumentId: instrumentIds[0]!, condition: 'fair' }] }), 400, /at inspection only/);
    await transitionLoan(custodian, l.id, { to: 'returned', note: 'all there', conditions: [] });
    const done = await transitionLoan(custodian, l.id, { to: 'inspected', note: 'jaw of the clamp cracked', conditions: [{ instrumentId: instrumentIds[0]!, condition: 'needs-repair' }] });
    expect(done.status).toBe('inspected');
    expect(done.moves).toEqual([]);
    expect(done.events.map((e) => `${e.from ?? '∅'}→${e.to}`)).toEqual(['∅→requested', 'requested→approved', 'approved→shipped', 'shipped→in-use', 'in-use→returned', 'returned→inspected']);
    expect(done.events.map((e) => e.userId)).toEqual([staffA.id, custodian.id, custodian.id, staffA.id, custodian.id, custodian.id]);
    for (const e of done.events) expect(Date.parse(e.at)).not.toBeNaN();
    await refused(transitionLoan(custodian, l.id, { to: 'returned', note: '', conditions: [] }), 409, /nothing more happens/);
    // The instrument found broken keeps the kit home.
    await refused(requestLoan(staffA, { kitId: kit.id, start: d(20), end: d(21), purpose: 'Again' }), 422, /Clamp ammeter .* needs repair/);
  });

  it('declined from requested; cancelled by the requester from requested or approved, not by a colleague', async () => {
    const { kit } = await kitWith();
    const a = await requestLoan(staffA, { kitId: kit.id, start: d(2), end: d(2), purpose: 'One day' });
    expect((await transitionLoan(custodian, a.id, { to: 'declined', note: 'kit needed for calibration', conditions: [] })).status).toBe('declined');
    const b = await requestLoan(staffA, { kitId: kit.id, start: d(2), end: d(2), purpose: 'One day' });
    await transitionLoan(custodian, b.id, { to: 'approved', note: '', conditions: [] });
    await refused(transitionLoan(staffA2, b.id, { to: 'cancelled', note: '', conditions: [] }), 403, /asked for the loan/);
    expect((await transitionLoan(staffA, b.id, { to: 'cancelled', note: 'plans changed', conditions: [] })).status).toBe('cancelled');
    const c = await requestLoan(staffA, { kitId: kit.id, start: d(2), end: d(2), purpose: 'One day' });
    await transitionLoan(custodian, c.id, { to: 'approved', note: '', conditions: [] });
    await transitionLoan(custodian, c.id, { to: 'shipped', note: '', conditions: [] });
    await refused(transitionLoan(staffA, c.id, { to: 'cancelled', note: '', conditions: [] }), 409, /shipped cannot become cancelled/);
  });

  it('approving and shipping check calibration again', async () => {
    const { kit, instrumentIds } = await kitWith([{ type: 'infrared_camera' }]);
    const l = await requestLoan(staffA, { kitId: kit.id, start: d(3), end: d(9), purpose: 'Envelope scan' });
    await updateInstrument(custodian, instrumentIds[0]!, { calibrationDue: d(5) });
    await refused(transitionLoan(custodian, l.id, { to: 'approved', note: '', conditions: [] }), 422, /Infrared camera .*calibration due/);
    await updateInstrument(custodian, instrumentIds[0]!, { calibrationDue: d(9) });
    await transitionLoan(custodian, l.id, { to: 'approved', note: '', conditions: [] });
    await updateInstrument(custodian, instrumentIds[0]!, { condition: 'needs-repair' });
    await refused(transitionLoan(custodian, l.id, { to: 'shipped', note: '', conditions: [] }), 422, /needs repair/);
    const db = await getDb();
    expect((await db.select().from(loan).where(eq(loan.id, l.id)))[0]!.status).toBe('approved');
    expect(await db.select().from(loanEvent).where(eq(loanEvent.loanId, l.id))).toHaveLength(2);
  });
});

describe('installation scope', () => {
  it('staff see only their installations’ loans; custodians, managers and analysts see all', async () => {
    const { kit } = await kitWith();
    const a = await requestLoan(staffA, { kitId: kit.id, start: d(2), end: d(3), purpose: 'Alpha' });
    const b = await requestLoan(staffB, { kitId: kit.id, start: d(4), end: d(5), purpose: 'Bravo' });
    const seen = (rows: { id: string }[]) => rows.map((r) => r.id).filter((id) => id === a.id || id === b.id).sort();
    expect(seen(await listLoans(staffA, { kit: kit.id }))).toEqual([a.id]);
    expect(seen(await listLoans(staffB, { kit: kit.id }))).toEqual([b.id]);
    expect(seen(await listLoans(auditorAB, { kit: kit.id }))).toEqual([a.id, b.id].sort());
    for (const who of [custodian, manager, analyst, admin]) expect(seen(await listLoans(who, { kit: kit.id }))).toEqual([a.id, b.id].sort());
    await refused(getLoan(staffA, b.id), 404);
    await refused(transitionLoan(staffA, b.id, { to: 'cancelled', note: '', conditions: [] }), 404);
    // The kit's calendar shows the other installation's hold without its details.
    const cal = (await getKit(staffA, kit.id)).calendar;
    expect(cal.map((c) => [c.start, c.loan?.purpose ?? null])).toEqual([
      [d(2), 'Alpha'],
      [d(4), null],
    ]);
    expect(seen(await listLoans(staffA, { mine: '1' }))).toEqual([a.id]);
    expect(seen(await listLoans(staffA2, { mine: '1' }))).toEqual([]);
  });
});

describe('instruments', () => {
  it('a serial number is unique per type and model; moving needs the kits home', async () => {
    const one = await kitWith([{ type: 'manometer' }]);
    const two = await kitWith([]);
    await refused(createInstrument(custodian, { kitId: two.kit.id, type: 'manometer', model: 'lx-1', serial: `s${seq - 1}-0`, calibrationDue: null, condition: 'good', notes: '' }), 409, /already in the library \(kit KT-/);
    const l = await requestLoan(staffA, { kitId: one.kit.id, start: today, end: d(2), purpose: 'Draft test' });
    await transitionLoan(custodian, l.id, { to: 'approved', note: '', conditions: [] });
    await transitionLoan(custodian, l.id, { to: 'shipped', note: '', conditions: [] });
    await refused(updateInstrument(custodian, one.instrumentIds[0]!, { kitId: two.kit.id }), 409, /is out on loan .* once it is back/);
    await transitionLoan(custodian, l.id, { to: 'returned', note: '', conditions: [] });
    const moved = await updateInstrument(custodian, one.instrumentIds[0]!, { kitId: two.kit.id });
    expect(moved.kitCode).toBe(two.kit.code);
  });

  it('history holds kit moves, calibration and condition changes, and the loans that took it out', async () => {
    const first = await kitWith([{ type: 'stroboscope' }]);
    const second = await kitWith([]);
    const id = first.instrumentIds[0]!;
    const l1 = await requestLoan(staffA, { kitId: first.kit.id, start: today, end: d(1), purpose: 'Fan speeds' });
    await transitionLoan(custodian, l1.id, { to: 'approved', note: '', conditions: [] });
    await transitionLoan(custodian, l1.id, { to: 'shipped', note: '', conditions: [] });
    await transitionLoan(custodian, l1.id, { to: 'returned', note: '', conditions: [] });
    await transitionLoan(custodian, l1.id, { to: 'inspected', note: 'lamp dim', conditions: [{ instrumentId: id, condition: 'fair' }] });
    await updateInstrument(custodian, id, { calibrationDue: d(400) });
    await updateInstrument(custodian, id, { kitId: second.kit.id });
    // A loan of the first kit after the move is not this instrument's.
    const other = await kitWith([]);
    await createInstrument(custodian, { kitId: first.kit.id, type: 'light_meter', model: '', serial: `X-${seq}`, calibrationDue: null, condition: 'good', notes: '' });
    const l2 = await requestLoan(staffA, { kitId: first.kit.id, start: d(3), end: d(4), purpose: 'Not with the strobe' });
    await transitionLoan(custodian, l2.id, { to: 'approved', note: '', conditions: [] });
    await transitionLoan(custodian, l2.id, { to: 'shipped', note: '', conditions: [] });
    void other;
    const h = await instrumentHistory(custodian, id);
    const kinds = h.map((e) => e.kind);
    expect(kinds).toEqual(['moved', 'calibration', 'condition', 'loan', 'created']);
    expect(h.find((e) => e.kind === 'loan')!.loan!.id).toBe(l1.id);
    expect(h.find((e) => e.kind === 'condition')!.text).toMatch(/Good → Fair at the inspection after loan/);
    expect(h.find((e) => e.kind === 'moved')!.text).toBe(`Moved from kit ${first.kit.code} to kit ${second.kit.code}.`);
    // Someone from the other installation sees that it was out, not what for.
    const foreign = await instrumentHistory(staffB, id);
    expect(foreign.find((e) => e.kind === 'loan')!.loan).toBeNull();
    expect(foreign.find((e) => e.kind === 'loan')!.text).toMatch(/another installation/);
  });
});
