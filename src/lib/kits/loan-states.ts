/**
 * The life of a kit loan as a state machine: requested → approved → shipped → in use → returned →
 * inspected, with declined (from requested) and cancelled (from requested or approved). Each
 * move names who may make it; the server checks it, the screens use it to offer only the moves
 * a person may make. The holding states are those the database's exclusion constraint
 * `loan_no_double_booking` covers (drizzle/0012): a kit held by one loan cannot be held by another
 * on the same day.
 */
import { z } from 'zod';

export const LOAN_STATUSES = ['requested', 'approved', 'shipped', 'in-use', 'returned', 'inspected', 'declined', 'cancelled'] as const;
export const loanStatusSchema = z.enum(LOAN_STATUSES);
export type LoanStatus = z.infer<typeof loanStatusSchema>;

export const LOAN_STATUS_LABELS: Record<LoanStatus, string> = {
  requested: 'Requested',
  approved: 'Approved',
  shipped: 'Shipped',
  'in-use': 'In use',
  returned: 'Returned',
  inspected: 'Inspected',
  declined: 'Declined',
  cancelled: 'Cancelled',
};

/** Statuses in which a loan holds its kit for its dates (the exclusion constraint's WHERE). */
export const HOLDING_STATUSES = ['requested', 'approved', 'shipped', 'in-use'] as const satisfies readonly LoanStatus[];
/** Statuses in which the kit is away from its home (overdue reminders apply). */
export const OUT_STATUSES = ['shipped', 'in-use'] as const satisfies readonly LoanStatus[];
/** Statuses after which nothing more happens to a loan. */
export const FINAL_STATUSES = ['inspected', 'declined', 'cancelled'] as const satisfies readonly LoanStatus[];

export function isHolding(s: LoanStatus): boolean {
  return (HOLDING_STATUSES as readonly LoanStatus[]).includes(s);
}

export function isOut(s: LoanStatus): boolean {
  return (OUT_STATUSES as readonly LoanStatus[]).includes(s);
}

/**
 * Who may make a move:
 * - `custodian`: anyone who manages loans (kit custodian, administrator);
 * - `requester`: the person who asked for the loan (or a custodian);
 * - `borrower`: the requester, the auditor of the loan's walkthrough, or a custodian.
 */
export type LoanParty = 'custodian' | 'requester' | 'borrower';

export interface LoanMove {
  from: LoanStatus;
  to: LoanStatus;
  by: LoanParty;
  /** The button's words. */
  verb: string;
  /** Moves that send the kit out again check the instruments' calibration and condition. */
  checksInstruments: boolean;
}

export const LOAN_MOVES: readonly LoanMove[] = [
  { from: 'requested', to: 'approved', by: 'custodian', verb: 'Approve', checksInstruments: true },
  { from: 'requested', to: 'declined', by: 'custodian', verb: 'Decline', checksInstruments: false },
  { from: 'requested', to: 'cancelled', by: 'requester', verb: 'Cancel request', checksInstruments: false },
  { from: 'approved', to: 'shipped', by: 'custodian', verb: 'Mark shipped', checksInstruments: true },
  { from: 'approved', to: 'cancelled', by: 'requester', verb: 'Cancel loan', checksInstruments: false },
  { from: 'shipped', to: 'in-use', by: 'borrower', verb: 'Mark in use', checksInstruments: false },
  // A kit may come back without anyone having marked it in use.
  { from: 'shipped', to: 'returned', by: 'custodian', verb: 'Mark returned', checksInstruments: false },
  { from: 'in-use', to: 'returned', by: 'custodian', verb: 'Mark returned', checksInstruments: false },
  { from: 'returned', to: 'inspected', by: 'custodian', verb: 'Mark inspected', checksInstruments: false },
];

/** The move from `from` to `to`, or null when the state machine has no such move. */
export function loanMove(from: LoanStatus, to: LoanStatus): LoanMove | null {
  return LOAN_MOVES.find((m) => m.from === from && m.to === to) ?? null;
}

/** What a person in the given parties may do next with a loan in status `from`. */
export function movesFor(from: LoanStatus, parties: { custodian: boolean; requester: boolean; borrower: boolean }): LoanMove[] {
  return LOAN_MOVES.filter((m) => {
    if (m.from !== from) return false;
    if (parties.custodian) return true;
    if (m.by === 'requester') return parties.requester;
    if (m.by === 'borrower') return parties.requester || parties.borrower;
    return false;
  });
}

/** The statuses a loan in `from` may move to, whoever moves it. */
export function nextStatuses(from: LoanStatus): LoanStatus[] {
  return LOAN_MOVES.filter((m) => m.from === from).map((m) => m.to);
}
