/**
 * The kit library's scheduled mail: overdue loans and calibration reminders reach the outbox
 * through the local SMTP server, at most once a day per loan and once per instrument and stage,
 * however often the job runs. Dates are constructed relative to today.
 */
import { and, eq, like } from 'drizzle-orm';
import { beforeAll, describe, expect, it } from 'vitest';
import { getDb } from '../../src/db/client';
import { loan, mailOutbox } from '../../src/db/schema';
import { addDays, todayIn } from '../../src/lib/kits/loan-dates';
import { JOBS, runJob } from '../../src/server/jobs';
import type { Actor } from '../../src/server/authz';
import { createInstrument, updateInstrument } from '../../src/server/kits/instruments';
import { createKit } from '../../src/server/kits/kits';
import { transitionLoan } from '../../src/server/kits/loan-transitions';
import { requestLoan } from '../../src/server/kits/loans';
import { sendCalibrationReminders, sendOverdueReminders } from '../../src/server/kits/reminders';
import { actor, twoInstallations } from '../support/fixtures';

const today = todayIn('UTC');
const d = (n: number) => addDays(today, n);
let custodian: Actor, staff: Actor;

beforeAll(async () => {
  const inv = await twoInstallations();
  custodian = await actor('kit_custodian', [], 'keeper@example.test');
  staff = await actor('installation_staff', [inv.a.id], 'borrower@example.test');
});

async function mailsTo(to: string, subject: string) {
  const db = await getDb();
  return db.select().from(mailOutbox).where(and(eq(mailOutbox.toAddress, to), like(mailOutbox.subject, `${subject}%`)));
}

async function delivered(to: string, subject: string) {
  for (let i = 0; i < 100; i++) {
    const rows = await mailsTo(to, subject);
    if (rows.length > 0 && rows.every((r) => r.receivedAt)) return rows;
    await new Promise((r) => setTimeout(r, 50));
  }
  throw new Error(`no mail to ${to}: ${subject}`);
}

describe('overdue loans', () => {
  it('the job mails the borrower and the custodian once a day while the kit is out after its last day', async () => {
    const k = await createKit(custodian, { code: 'OVR-1', name: 'Overdue kit', description: '', homeLocation: '' });
    await createInstrument(custodian, { kitId: k.id, type: 'light_meter', model: 'L', serial: 'O-1', calibrationDue: null, condition: 'good', notes: '' });
    const l = await requestLoan(staff, { kitId: k.id, start: today, end: d(2), purpose: 'Lighting survey' });
    await transitionLoan(custodian, l.id, { to: 'approved', note: '', conditions: [] });
    await transitionLoan(custodian, l.id, { to: 'shipped', note: '', conditions: [] });

    expect(await sendOverdueReminders(d(2))).toEqual({ loans: 0, mails: 0 }); // the last day is not late
    expect(await sendOverdueReminders(d(3))).toEqual({ loans: 1, mails: 2 });
    const subject = 'Overdue: kit OVR-1';
    const [toBorrower] = await delivered('borrower@example.test', subject);
    expect(toBorrower!.status).toBe('sent');
    expect(toBorrower!.text).toContain('ended 1 day ago');
    expect(toBorrower!.text).toContain(`Loan ${l.ref}`);
    expect(await delivered('keeper@example.test', subject)).toHaveLength(1);

    // The same day again, twice at once too: nothing more.
    expect(await sendOverdueReminders(d(3))).toEqual({ loans: 0, mails: 0 });
    const again = await Promise.all([sendOverdueReminders(d(3)), sendOverdueReminders(d(3))]);
    expect(again.map((r) => r.mails)).toEqual([0, 0]);
    expect(await mailsTo('borrower@example.test', subject)).toHaveLength(1);

    // The next day, one more; none once the kit is back.
    expect((await sendOverdueReminders(d(4))).loans).toBe(1);
    expect(await mailsTo('borrower@example.test', subject)).toHaveLength(2);
    await transitionLoan(custodian, l.id, { to: 'returned', note: '', conditions: [] });
    expect(await sendOverdueReminders(d(5))).toEqual({ loans: 0, mails: 0 });
  });

  it('runs as the scheduled job `loan-overdue`, twice in a row sending one mail', async () => {
    const k = await createKit(custodian, { code: 'OVR-2', name: 'Job kit', description: '', homeLocation: '' });
    await createInstrument(custodian, { kitId: k.id, type: 'flashlight', model: '', serial: 'O-2', calibrationDue: null, condition: 'good', notes: '' });
    const l = await requestLoan(staff, { kitId: k.id, start: today, end: today, purpose: 'One-day check' });
    await transitionLoan(custodian, l.id, { to: 'approved', note: '', conditions: [] });
    await transitionLoan(custodian, l.id, { to: 'shipped', note: '', conditions: [] });
    await transitionLoan(staff, l.id, { to: 'in-use', note: '', conditions: [] });
    // The job uses today's date: a loan ending yesterday is the one to find. Move this one back a
    // few days by hand (a request cannot start in the past).
    const db = await getDb();
    await db.update(loan).set({ startDate: d(-3), endDate: d(-2) }).where(eq(loan.id, l.id));
    const job = JOBS.find((j) => j.name === 'loan-overdue')!;
    const first = await runJob(job);
    expect(first).toMatchObject({ status: 'ok' });
    expect(first.detail).toMatch(/^1 overdue loans, 2 mails/);
    const second = await runJob(job);
    expect(second.detail).toMatch(/^0 overdue loans, 0 mails/);
    const rows = await delivered('borrower@example.test', 'Overdue: kit OVR-2');
    expect(rows).toHaveLength(1);
    expect(rows[0]!.text).toContain('ended 2 days ago');
  });
});

describe('calibration reminders', () => {
  it('one mail per instrument and stage: due within 30 days, then past due; a new due date starts over', async () => {
    const k = await createKit(custodian, { code: 'CAL-1', name: 'Calibration kit', description: '', homeLocation: '' });
    const soon = await createInstrument(custodian, { kitId: k.id, type: 'combustion_analyzer', model: 'CA', serial: 'C-1', calibrationDue: d(20), condition: 'good', notes: '' });
    await createInstrument(custodian, { kitId: k.id, type: 'light_meter', model: 'LM', serial: 'C-2', calibrationDue: d(31), condition: 'good', notes: '' });
    await createInstrument(custodian, { kitId: null, type: 'manometer', model: 'MM', serial: 'C-3', calibrationDue: d(-5), condition: 'retired', notes: '' });

    expect(await sendCalibrationReminders(today)).toEqual({ instruments: 1, mails: 1 });
    const [first] = await delivered('keeper@example.test', 'Calibration due');
    expect(first!.subject).toContain('Combustion analyzer (CA, serial C-1) in kit CAL-1');
    expect(first!.text).toContain('in 20 days');
    expect(await sendCalibrationReminders(today)).toEqual({ instruments: 0, mails: 0 });
    expect((await sendCalibrationReminders(d(1))).instruments).toBe(1); // the light meter is now 30 days out
    expect(await sendCalibrationReminders(d(10))).toEqual({ instruments: 0, mails: 0 }); // both in the same stage

    const past = await sendCalibrationReminders(d(21));
    expect(past.instruments).toBe(1);
    const [late] = await delivered('keeper@example.test', 'Past calibration: Combustion analyzer');
    expect(late!.text).toContain('1 day ago');
    expect(await sendCalibrationReminders(d(21))).toEqual({ instruments: 0, mails: 0 });
    expect(await sendCalibrationReminders(d(22))).toEqual({ instruments: 0, mails: 0 });

    // Recalibrated: a new due date, and the reminders start over for it.
    await updateInstrument(custodian, soon.id, { calibrationDue: d(60) });
    expect(await sendCalibrationReminders(d(29))).toEqual({ instruments: 0, mails: 0 });
    const again = await sendCalibrationReminders(d(30));
    expect(again.instruments).toBe(1);
  });

  it('names the loans of the kit that end after the due date', async () => {
    const k = await createKit(custodian, { code: 'CAL-2', name: 'Second', description: '', homeLocation: '' });
    const i = await createInstrument(custodian, { kitId: k.id, type: 'clamp_ammeter', model: 'CL', serial: 'C-9', calibrationDue: d(12), condition: 'good', notes: '' });
    const inside = await requestLoan(staff, { kitId: k.id, start: d(2), end: d(4), purpose: 'Motor loads' });
    const after = await requestLoan(staff, { kitId: k.id, start: d(5), end: d(12), purpose: 'Pump loads' });
    // The certificate says the calibration runs out earlier than recorded.
    await updateInstrument(custodian, i.id, { calibrationDue: d(8) });
    await sendCalibrationReminders(today);
    const mine = (await mailsTo('keeper@example.test', 'Calibration due')).find((r) => r.subject.includes('CAL-2'))!;
    expect(mine.text).toContain(`loan ${after.ref}`);
    expect(mine.text).not.toContain(`loan ${inside.ref}`);
  });
});
