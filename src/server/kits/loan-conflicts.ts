/**
 * What stands in the way of a loan: the loans already holding the kit on overlapping days (the
 * database refuses the overlap itself, SQLSTATE 23P01, and this module words the refusal), and
 * instruments that may not go out (calibration, condition).
 */
import { and, asc, eq, gte, inArray, lte } from 'drizzle-orm';
import type { Db, Tx } from '../../db/client';
import { installation, instrument, kit, loan, walkthrough } from '../../db/schema';
import { kitProblems, type InstrumentProblem } from '../../lib/kits/kit-readiness';
import { formatRange, type DateRange } from '../../lib/kits/loan-dates';
import { HOLDING_STATUSES, LOAN_STATUS_LABELS, type LoanStatus } from '../../lib/kits/loan-states';
import type { Actor } from '../authz';
import { errors, HttpError } from '../http';
import { loanRef, seesLoan } from './loan-rows';

export interface HeldRange extends DateRange {
  status: LoanStatus;
  /** Null when the caller may not see the holding loan's installation. */
  loanId: string | null;
  ref: string | null;
  purpose: string | null;
  walkthroughTitle: string | null;
  installationCode: string | null;
}

/** Loans holding `kitId` on a day of `range`, as the caller may see them. */
export async function heldRanges(db: Db | Tx, actor: Actor, kitId: string, range: DateRange): Promise<HeldRange[]> {
  const rows = await db
    .select({ id: loan.id, start: loan.startDate, end: loan.endDate, status: loan.status, purpose: loan.purpose, installationId: loan.installationId, installationCode: installation.code, walkthroughTitle: walkthrough.title })
    .from(loan)
    .leftJoin(installation, eq(installation.id, loan.installationId))
    .leftJoin(walkthrough, eq(walkthrough.id, loan.walkthroughId))
    .where(and(eq(loan.kitId, kitId), inArray(loan.status, [...HOLDING_STATUSES]), lte(loan.startDate, range.end), gte(loan.endDate, range.start)))
    .orderBy(asc(loan.startDate));
  return rows.map((r) => {
    const visible = seesLoan(actor, r.installationId);
    return {
      start: r.start,
      end: r.end,
      status: r.status as LoanStatus,
      loanId: visible ? r.id : null,
      ref: visible ? loanRef(r.id) : null,
      purpose: visible ? r.purpose : null,
      walkthroughTitle: visible ? r.walkthroughTitle : null,
      installationCode: visible ? r.installationCode : null,
    };
  });
}

/** One sentence per holding loan: dates, which loan and what for (or "another installation"). */
export function describeHeld(h: HeldRange): string {
  const status = LOAN_STATUS_LABELS[h.status].toLowerCase();
  if (!h.ref) return `${formatRange(h)} by a loan for another installation (${status})`;
  const what = [`“${h.purpose}”`, h.walkthroughTitle ? `walkthrough “${h.walkthroughTitle}”` : null, h.installationCode].filter(Boolean).join(', ');
  return `${formatRange(h)} by loan ${h.ref} (${status}: ${what})`;
}

/** The 409 for a request the exclusion constraint refused. */
export async function doubleBookingError(db: Db | Tx, actor: Actor, kitId: string, kitCode: string, range: DateRange): Promise<HttpError> {
  const held = await heldRanges(db, actor, kitId, range);
  const asked = formatRange(range);
  if (held.length === 0)
    return errors.conflict(`Kit ${kitCode} was reserved for days within ${asked} a moment ago. Reload its calendar and choose other dates.`, { held: [] });
  return errors.conflict(`Kit ${kitCode} is already held on days you asked for (${asked}): ${held.map(describeHeld).join('; ')}. Choose dates outside those, or another kit.`, {
    held: held.map(({ start, end, status, loanId, ref }) => ({ start, end, status, loanId, ref })),
  });
}

/** Instruments now in the kit, for the readiness check. */
export async function kitInstruments(db: Db | Tx, kitId: string) {
  return db
    .select({ id: instrument.id, type: instrument.type, model: instrument.model, serial: instrument.serial, calibrationDue: instrument.calibrationDue, condition: instrument.condition })
    .from(instrument)
    .where(eq(instrument.kitId, kitId));
}

/**
 * @throws 422 naming each instrument that keeps the kit from going out for a loan ending on
 * `lastDay`, or when the kit has no instruments at all.
 */
export async function assertKitCanGoOut(db: Db | Tx, k: Pick<typeof kit.$inferSelect, 'id' | 'code'>, lastDay: string, doing: string): Promise<void> {
  const list = await kitInstruments(db, k.id);
  if (list.length === 0) throw errors.unprocessable(`Kit ${k.code} has no instruments: it cannot be ${doing}.`, { problems: [] });
  const problems: InstrumentProblem[] = kitProblems(list, lastDay);
  if (problems.length > 0)
    throw errors.unprocessable(`Kit ${k.code} cannot be ${doing}: ${problems.map((p) => p.message).join(' ')}`, { problems });
}
