/**
 * Loans of kits: request (the contract `POST /api/loans`), list and read. Installation staff and
 * auditors request for their own installations and see only their installations' loans;
 * custodians, administrators and region-wide roles see all. The database refuses a request that
 * overlaps a loan already holding the kit (exclusion constraint `loan_no_double_booking`); that
 * refusal becomes a 409 naming the dates held.
 */
import { and, asc, desc, eq, gte, inArray, lte, type SQL } from 'drizzle-orm';
import { getDb } from '../../db/client';
import { installation, kit, loan, loanEvent, walkthrough } from '../../db/schema';
import type { LoanEventRow } from '../../lib/kits/api-types';
import { checkLoanDates, formatRange, todayIn } from '../../lib/kits/loan-dates';
import type { LoanStatus } from '../../lib/kits/loan-states';
import type { LoanRequest, LoansQuery } from '../../lib/kits/schemas';
import { logActivity } from '../activity';
import { installationByCode, scopeToInstallations, type Actor } from '../authz';
import { isExclusionViolation } from '../db-errors';
import { errors } from '../http';
import { assertKitCanGoOut, doubleBookingError } from './loan-conflicts';
import { loanRef, selectLoans, toLoanRow, type LoanRecord, type LoanRow } from './loan-rows';
import { utcToday } from './kits';
import { mailNewRequest, type LoanForMail } from './notify';
import { custodians } from './people';

export function forMail(r: LoanRecord): LoanForMail {
  return { id: r.id, ref: loanRef(r.id), kitId: r.kitId, kitCode: r.kitCode, kitName: r.kitName, start: r.start, end: r.end, purpose: r.purpose, installationCode: r.installationCode, walkthroughTitle: r.walkthroughTitle, requestedByName: r.requestedByName };
}

/** The installation a new loan is for: the walkthrough's, the one named, or the requester's only one. */
async function loanInstallation(actor: Actor, input: LoanRequest, db: Awaited<ReturnType<typeof getDb>>) {
  if (input.walkthroughId) {
    const [w] = await db
      .select({ id: walkthrough.id, installationId: walkthrough.installationId, code: installation.code, timeZone: installation.timeZone, status: walkthrough.status, plannedOn: walkthrough.plannedOn, title: walkthrough.title })
      .from(walkthrough)
      .innerJoin(installation, eq(installation.id, walkthrough.installationId))
      .where(and(eq(walkthrough.id, input.walkthroughId), scopeToInstallations(actor, walkthrough.installationId)));
    if (!w) throw errors.notFound('No such walkthrough in your installations.');
    if (input.installation && input.installation !== w.code)
      throw errors.unprocessable(`The walkthrough is at ${w.code}, not ${input.installation}.`, [{ field: 'installation', message: `the walkthrough is at ${w.code}` }]);
    if (w.status === 'cancelled' || w.status === 'completed')
      throw errors.unprocessable(`The walkthrough “${w.title}” is ${w.status}: a kit is no longer needed for it.`, [{ field: 'walkthroughId', message: `walkthrough ${w.status}` }]);
    return { id: w.installationId, code: w.code, timeZone: w.timeZone, plannedOn: w.plannedOn };
  }
  if (input.installation) {
    const i = await installationByCode(db, actor, input.installation);
    return { id: i.id, code: i.code, timeZone: i.timeZone, plannedOn: null };
  }
  if (actor.scoped) {
    if (actor.installationIds.length === 0) throw errors.forbidden('You are not assigned to any installation, so you cannot borrow a kit.');
    const mine = await db.select({ id: installation.id, code: installation.code, timeZone: installation.timeZone }).from(installation).where(inArray(installation.id, [...actor.installationIds])).orderBy(asc(installation.code));
    if (mine.length > 1)
      throw errors.badRequest(`Say which installation the kit is for (${mine.map((m) => m.code).join(' or ')}): send "installation" or the walkthrough.`, [{ field: 'installation', message: `one of ${mine.map((m) => m.code).join(', ')}` }]);
    return { ...mine[0]!, plannedOn: null };
  }
  return null;
}

/**
 * Asks for a kit for inclusive dates. @throws 404 (kit or walkthrough), 422 (dates, kit out of
 * service, an instrument past calibration on a loan day or out of order), 409 (dates held).
 */
export async function requestLoan(actor: Actor, input: LoanRequest, ip = ''): Promise<LoanRow> {
  const db = await getDb();
  const [k] = await db.select().from(kit).where(eq(kit.id, input.kitId));
  if (!k) throw errors.notFound('No kit with this id.', );
  const inst = await loanInstallation(actor, input, db);
  const today = todayIn(inst?.timeZone ?? 'UTC');
  const range = { start: input.start, end: input.end };
  const dates = checkLoanDates(range, today, true);
  if (!dates.ok) throw errors.unprocessable(dates.message, [{ field: dates.field, message: dates.message }]);
  if (inst?.plannedOn && (inst.plannedOn < range.start || inst.plannedOn > range.end))
    throw errors.unprocessable(`The walkthrough is planned for ${formatRange({ start: inst.plannedOn, end: inst.plannedOn })}: the loan must include that day (asked ${formatRange(range)}).`, [{ field: 'start', message: 'must include the walkthrough day' }]);
  if (!k.active) throw errors.unprocessable(`Kit ${k.code} is out of service and cannot be borrowed.`, [{ field: 'kitId', message: 'kit out of service' }]);
  await assertKitCanGoOut(db, k, range.end, 'lent for these dates');

  let id: string;
  try {
    id = await db.transaction(async (tx) => {
      const [row] = await tx
        .insert(loan)
        .values({ kitId: k.id, installationId: inst?.id ?? null, walkthroughId: input.walkthroughId ?? null, requestedBy: actor.id, purpose: input.purpose, startDate: range.start, endDate: range.end, status: 'requested' })
        .returning({ id: loan.id });
      await tx.insert(loanEvent).values({ loanId: row!.id, fromStatus: null, toStatus: 'requested', userId: actor.id, actor: actor.name, note: input.purpose });
      return row!.id;
    });
  } catch (e) {
    if (isExclusionViolation(e)) throw await doubleBookingError(db, actor, k.id, k.code, range);
    throw e;
  }
  await logActivity({ action: 'loan.request', userId: actor.id, actor: actor.email, entityType: 'loan', entityId: id, installationId: inst?.id ?? null, ip, details: { kit: k.code, start: range.start, end: range.end } });
  const [record] = await selectLoans(db).where(eq(loan.id, id));
  await mailNewRequest(await custodians(db), forMail(record!));
  return toLoanRow(actor, record!, today);
}

/** Loans the caller may see, newest first. */
export async function listLoans(actor: Actor, q: Partial<LoansQuery> = {}): Promise<LoanRow[]> {
  const db = await getDb();
  const where: (SQL | undefined)[] = [scopeToInstallations(actor, loan.installationId)];
  if (q.status?.length) where.push(inArray(loan.status, q.status));
  if (q.kit) where.push(eq(loan.kitId, q.kit));
  if (q.from) where.push(gte(loan.endDate, q.from));
  if (q.to) where.push(lte(loan.startDate, q.to));
  if (q.mine === '1') where.push(eq(loan.requestedBy, actor.id));
  const rows = await selectLoans(db)
    .where(and(...where))
    .orderBy(desc(loan.startDate), desc(loan.createdAt))
    .limit(q.limit ?? 200);
  const today = utcToday();
  return rows.map((r) => toLoanRow(actor, r, today));
}

/** One loan in the caller's scope. @throws 404 otherwise. */
export async function loanRecord(actor: Actor, id: string): Promise<LoanRecord> {
  const db = await getDb();
  const [r] = await selectLoans(db).where(and(eq(loan.id, id), scopeToInstallations(actor, loan.installationId)));
  if (!r) throw errors.notFound('No such loan in your installations.');
  return r;
}

/** One loan with its events (who moved it, when, with which note). */
export async function getLoan(actor: Actor, id: string): Promise<LoanRow & { events: LoanEventRow[] }> {
  const db = await getDb();
  const r = await loanRecord(actor, id);
  const events = await db
    .select({ id: loanEvent.id, from: loanEvent.fromStatus, to: loanEvent.toStatus, userId: loanEvent.userId, by: loanEvent.actor, note: loanEvent.note, at: loanEvent.at })
    .from(loanEvent)
    .where(eq(loanEvent.loanId, id))
    .orderBy(asc(loanEvent.at), asc(loanEvent.id));
  return { ...toLoanRow(actor, r, utcToday()), events: events.map((e) => ({ ...e, from: e.from as LoanStatus | null, to: e.to as LoanStatus, at: e.at.toISOString() })) };
}
