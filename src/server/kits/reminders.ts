/**
 * The kit library's scheduled mail (jobs `loan-overdue` and `calibration-reminders` in
 * src/server/jobs.ts). Each run first claims what it will announce with one conditional UPDATE
 * (the day of the notice goes into the row), then mails: a second run on the same day, in this
 * process or another instance, finds nothing left to claim and sends nothing.
 */
import { and, asc, eq, gt, inArray, isNull, isNotNull, lt, lte, ne, or } from 'drizzle-orm';
import { getDb } from '../../db/client';
import { instrument, kit, loan } from '../../db/schema';
import { formatDate } from '../../lib/format';
import { CALIBRATION_NOTICE_DAYS, reminderToSend } from '../../lib/kits/calibration';
import { instrumentName } from '../../lib/kits/kit-readiness';
import { addDays, daysBetween, formatRange } from '../../lib/kits/loan-dates';
import { HOLDING_STATUSES, OUT_STATUSES } from '../../lib/kits/loan-states';
import { appBaseUrl } from '../config';
import { utcToday } from './kits';
import { loanRef, selectLoans } from './loan-rows';
import { forMail } from './loans';
import { loanSummary, mailEach } from './notify';
import { custodians, peopleById } from './people';

/**
 * Loans shipped or in use whose last day has passed: a reminder to the borrower (the requester
 * and the walkthrough's auditor) and the custodians, at most one a day per loan.
 */
export async function sendOverdueReminders(today: string = utcToday()): Promise<{ loans: number; mails: number }> {
  const db = await getDb();
  const claimed = await db
    .update(loan)
    .set({ overdueNoticeOn: today })
    .where(and(inArray(loan.status, [...OUT_STATUSES]), lt(loan.endDate, today), or(isNull(loan.overdueNoticeOn), lt(loan.overdueNoticeOn, today))))
    .returning({ id: loan.id });
  if (claimed.length === 0) return { loans: 0, mails: 0 };
  const rows = await selectLoans(db).where(inArray(loan.id, claimed.map((c) => c.id))).orderBy(asc(loan.endDate));
  const keepers = await custodians(db);
  let mails = 0;
  for (const r of rows) {
    const late = daysBetween(r.end, today);
    const borrowers = await peopleById(db, [r.requestedById, r.walkthroughAuditorId]);
    const subject = `Overdue: kit ${r.kitCode} was due back ${formatDate(r.end)}`;
    const body = `The loan below ended ${late} day${late === 1 ? '' : 's'} ago and the kit is not back yet.\n\n${loanSummary(forMail(r))}\n`;
    mails += await mailEach(borrowers, subject, (p) => `Hello ${p.name},\n\n${body}\nPlease send the kit back to the custodian, or ask the custodian if you need it longer.\n`);
    mails += await mailEach(keepers, subject, (p) => `Hello ${p.name},\n\n${body}\nMark it returned when it arrives.\n`);
  }
  return { loans: rows.length, mails };
}

/**
 * Instruments whose calibration is due within CALIBRATION_NOTICE_DAYS days or past: one mail to
 * the custodians per instrument and stage (due soon, past due), for its current due date.
 */
export async function sendCalibrationReminders(today: string = utcToday()): Promise<{ instruments: number; mails: number }> {
  const db = await getDb();
  const candidates = await db
    .select({ id: instrument.id, type: instrument.type, model: instrument.model, serial: instrument.serial, due: instrument.calibrationDue, noticeOn: instrument.calibrationNoticeOn, kitId: instrument.kitId, kitCode: kit.code })
    .from(instrument)
    .leftJoin(kit, eq(kit.id, instrument.kitId))
    .where(and(ne(instrument.condition, 'retired'), isNotNull(instrument.calibrationDue), lte(instrument.calibrationDue, addDays(today, CALIBRATION_NOTICE_DAYS))))
    .orderBy(asc(instrument.calibrationDue));
  const keepers = await custodians(db);
  let count = 0;
  let mails = 0;
  for (const c of candidates) {
    const due = c.due!;
    const stage = reminderToSend(due, c.noticeOn, today);
    if (!stage) continue;
    const claimed = await db
      .update(instrument)
      .set({ calibrationNoticeOn: today })
      .where(and(eq(instrument.id, c.id), eq(instrument.calibrationDue, due), c.noticeOn === null ? isNull(instrument.calibrationNoticeOn) : eq(instrument.calibrationNoticeOn, c.noticeOn)))
      .returning({ id: instrument.id });
    if (claimed.length === 0) continue; // another run got there first, or the date changed meanwhile
    count++;
    const name = instrumentName(c);
    const where = c.kitCode ? `in kit ${c.kitCode}` : 'in no kit';
    const affected = c.kitId
      ? await db
          .select({ id: loan.id, start: loan.startDate, end: loan.endDate })
          .from(loan)
          .where(and(eq(loan.kitId, c.kitId), inArray(loan.status, [...HOLDING_STATUSES]), gt(loan.endDate, due)))
          .orderBy(asc(loan.startDate))
      : [];
    const left = daysBetween(today, due);
    const subject = stage === 'past-due' ? `Past calibration: ${name} ${where} (due ${formatDate(due)})` : `Calibration due ${formatDate(due)}: ${name} ${where}`;
    const lines = [
      stage === 'past-due' ? `${name} ${where} passed its calibration due date, ${formatDate(due)}, ${-left} day${left === -1 ? '' : 's'} ago. It may not go out on a loan until it is recalibrated.` : `${name} ${where} is due for calibration on ${formatDate(due)}, in ${left} day${left === 1 ? '' : 's'}.`,
      affected.length ? `\nLoans of the kit that end after that date, refused at approval or shipping unless the instrument is recalibrated or taken out of the kit:\n${affected.map((a) => `- loan ${loanRef(a.id)}, ${formatRange(a)}`).join('\n')}` : '',
      `\nRecord the new due date after calibration: ${appBaseUrl()}/kits${c.kitId ? `/${c.kitId}` : ''}`,
    ];
    mails += await mailEach(keepers, subject, (p) => `Hello ${p.name},\n\n${lines.join('\n')}\n`);
  }
  return { instruments: count, mails };
}
