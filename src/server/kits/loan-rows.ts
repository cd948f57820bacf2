/**
 * How a loan is read and shown: one query shape (loan with its kit, installation, walkthrough and
 * requester), the row the API answers, and the moves the caller may make next.
 */
import { eq } from 'drizzle-orm';
import { installation, kit, loan, user, walkthrough } from '../../db/schema';
import type { Db, Tx } from '../../db/client';
import type { LoanRow } from '../../lib/kits/api-types';
import { movesFor, isOut, LOAN_STATUS_LABELS, type LoanStatus } from '../../lib/kits/loan-states';
import { loanDays } from '../../lib/kits/loan-dates';
import { can, inScope, type Actor } from '../authz';

export type { LoanRow };

export const loanColumns = {
  id: loan.id,
  kitId: loan.kitId,
  kitCode: kit.code,
  kitName: kit.name,
  installationId: loan.installationId,
  installationCode: installation.code,
  installationTimeZone: installation.timeZone,
  walkthroughId: loan.walkthroughId,
  walkthroughTitle: walkthrough.title,
  walkthroughAuditorId: walkthrough.auditorId,
  walkthroughPlannedOn: walkthrough.plannedOn,
  requestedById: loan.requestedBy,
  requestedByName: user.name,
  requestedByEmail: user.email,
  purpose: loan.purpose,
  start: loan.startDate,
  end: loan.endDate,
  status: loan.status,
  overdueNoticeOn: loan.overdueNoticeOn,
  createdAt: loan.createdAt,
  updatedAt: loan.updatedAt,
};

/** `select(loanColumns)` from loan with the joins its columns need. */
export function selectLoans(db: Db | Tx) {
  return db
    .select(loanColumns)
    .from(loan)
    .innerJoin(kit, eq(kit.id, loan.kitId))
    .leftJoin(installation, eq(installation.id, loan.installationId))
    .leftJoin(walkthrough, eq(walkthrough.id, loan.walkthroughId))
    .leftJoin(user, eq(user.id, loan.requestedBy));
}

export type LoanRecord = Awaited<ReturnType<typeof selectLoans>>[number];

/** The short reference people quote for a loan (the first eight hex digits of its id). */
export function loanRef(id: string): string {
  return id.slice(0, 8).toUpperCase();
}

/**
 * Whether the caller may see a loan's details: its installation is in the caller's scope; a loan
 * for no installation (region-wide) is seen by region-wide roles only.
 */
export function seesLoan(actor: Actor, installationId: string | null): boolean {
  return installationId === null ? !actor.scoped : inScope(actor, installationId);
}

/** The caller's relation to a loan, for the state machine's `by`. */
export function partiesOf(actor: Actor, r: Pick<LoanRecord, 'requestedById' | 'walkthroughAuditorId'>) {
  return {
    custodian: can(actor, 'loans:manage'),
    requester: r.requestedById === actor.id,
    borrower: r.walkthroughAuditorId === actor.id,
  };
}

export function toLoanRow(actor: Actor, r: LoanRecord, today: string): LoanRow {
  const status = r.status as LoanStatus;
  return {
    id: r.id,
    ref: loanRef(r.id),
    kitId: r.kitId,
    kitCode: r.kitCode,
    kitName: r.kitName,
    installationCode: r.installationCode,
    walkthrough: r.walkthroughId ? { id: r.walkthroughId, title: r.walkthroughTitle ?? '', plannedOn: r.walkthroughPlannedOn } : null,
    requestedBy: r.requestedById ? { id: r.requestedById, name: r.requestedByName ?? 'a former user' } : null,
    purpose: r.purpose,
    start: r.start,
    end: r.end,
    days: loanDays(r.start, r.end) ?? 0,
    status,
    statusLabel: LOAN_STATUS_LABELS[status] ?? status,
    overdue: isOut(status) && r.end < today,
    createdAt: r.createdAt.toISOString(),
    updatedAt: r.updatedAt.toISOString(),
    moves: movesFor(status, partiesOf(actor, r)).map((m) => ({ to: m.to, verb: m.verb })),
  };
}
