/**
 * Mail about loans: a new request to the custodians, a decision to the requester, a cancelled
 * loan to the custodians. Mail is a notification sent after the change is committed; a failed
 * send stays in the outbox with its error.
 */
import { appBaseUrl } from '../config';
import { sendMail } from '../mail';
import { formatRange } from '../../lib/kits/loan-dates';
import { LOAN_STATUS_LABELS, type LoanStatus } from '../../lib/kits/loan-states';
import type { Person } from './people';
import { uniqueRecipients } from './people';

export interface LoanForMail {
  id: string;
  ref: string;
  kitId: string;
  kitCode: string;
  kitName: string;
  start: string;
  end: string;
  purpose: string;
  installationCode: string | null;
  walkthroughTitle: string | null;
  requestedByName: string | null;
}

export function loanLink(l: Pick<LoanForMail, 'kitId' | 'id'>): string {
  return `${appBaseUrl()}/kits/${l.kitId}?loan=${l.id}`;
}

/** The lines every loan mail carries. */
export function loanSummary(l: LoanForMail): string {
  return [
    `Kit: ${l.kitCode} · ${l.kitName}`,
    `Dates: ${formatRange(l)} (inclusive)`,
    `Purpose: ${l.purpose}`,
    l.walkthroughTitle ? `Walkthrough: ${l.walkthroughTitle}` : null,
    l.installationCode ? `Installation: ${l.installationCode}` : null,
    l.requestedByName ? `Requested by: ${l.requestedByName}` : null,
    `Loan ${l.ref}: ${loanLink(l)}`,
  ]
    .filter(Boolean)
    .join('\n');
}

export async function mailEach(people: readonly Person[], subject: string, body: (p: Person) => string): Promise<number> {
  const list = uniqueRecipients(people);
  for (const p of list) await sendMail({ to: p.email, subject, text: body(p) });
  return list.length;
}

export function mailNewRequest(custodians: readonly Person[], l: LoanForMail) {
  return mailEach(custodians, `Kit request: ${l.kitCode}, ${formatRange(l)}`, (p) => `Hello ${p.name},\n\nA loan of a kit waits for your decision.\n\n${loanSummary(l)}\n`);
}

export function mailDecision(requester: Person, l: LoanForMail, to: LoanStatus, by: string, note: string) {
  const what: Partial<Record<LoanStatus, string>> = {
    approved: 'is approved. The custodian will ship it before the first day.',
    declined: 'is declined.',
    shipped: 'is on its way. Mark it in use when it arrives, and send it back by the last day.',
  };
  return mailEach([requester], `Kit ${l.kitCode} ${LOAN_STATUS_LABELS[to].toLowerCase()}: ${formatRange(l)}`, (p) =>
    `Hello ${p.name},\n\nYour loan of kit ${l.kitCode} ${what[to] ?? `is now ${LOAN_STATUS_LABELS[to].toLowerCase()}.`}\n${note ? `\nNote from ${by}: ${note}\n` : ''}\n${loanSummary(l)}\n`,
  );
}

export function mailCancelled(custodians: readonly Person[], l: LoanForMail, by: string, note: string) {
  return mailEach(custodians, `Kit loan cancelled: ${l.kitCode}, ${formatRange(l)}`, (p) =>
    `Hello ${p.name},\n\n${by} cancelled this loan; the dates are free again.${note ? `\nNote: ${note}` : ''}\n\n${loanSummary(l)}\n`,
  );
}
