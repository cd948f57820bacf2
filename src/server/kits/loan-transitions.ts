/**
 * Moving a loan through its states (src/lib/kits/loan-states.ts): the move must exist, the caller
 * must be a party allowed to make it, and a move that sends the kit out (approve, ship) checks
 * the instruments again. Each move is recorded in loan_event with who, when and the note; at
 * inspection the custodian may record instruments found in another condition.
 */
import { and, eq, inArray } from 'drizzle-orm';
import { getDb } from '../../db/client';
import { instrument, loan, loanEvent } from '../../db/schema';
import { CONDITION_LABELS, instrumentName, type InstrumentCondition } from '../../lib/kits/kit-readiness';
import { LOAN_STATUS_LABELS, loanMove, nextStatuses, type LoanStatus } from '../../lib/kits/loan-states';
import type { LoanTransition } from '../../lib/kits/schemas';
import { logActivity } from '../activity';
import type { Actor } from '../authz';
import { errors } from '../http';
import { assertKitCanGoOut } from './loan-conflicts';
import { partiesOf } from './loan-rows';
import { forMail, getLoan, loanRecord } from './loans';
import { mailCancelled, mailDecision } from './notify';
import { custodians, peopleById } from './people';

const WHO: Record<string, string> = {
  custodian: 'the kit custodian',
  requester: 'the person who asked for the loan or the kit custodian',
  borrower: 'the borrower (the requester or the walkthrough’s auditor) or the kit custodian',
};

export async function transitionLoan(actor: Actor, id: string, input: LoanTransition, ip = '') {
  const db = await getDb();
  const r = await loanRecord(actor, id);
  const parties = partiesOf(actor, r);
  // Someone who is no party to the loan learns nothing about its state.
  if (!parties.custodian && !parties.requester && !parties.borrower) throw errors.forbidden('Only the person who asked for the loan, the walkthrough’s auditor or the kit custodian may move it.');
  const from = r.status as LoanStatus;
  const to = input.to;
  const move = loanMove(from, to);
  if (!move) {
    const next = nextStatuses(from).map((s) => LOAN_STATUS_LABELS[s].toLowerCase());
    throw errors.conflict(
      from === to
        ? `The loan is already ${LOAN_STATUS_LABELS[from].toLowerCase()}.`
        : `A loan that is ${LOAN_STATUS_LABELS[from].toLowerCase()} cannot become ${LOAN_STATUS_LABELS[to].toLowerCase()}${next.length ? `; it can become ${next.join(' or ')}` : '; nothing more happens to it'}.`,
      { status: from, next: nextStatuses(from) },
    );
  }
  const allowed = parties.custodian || (move.by === 'requester' && parties.requester) || (move.by === 'borrower' && (parties.requester || parties.borrower));
  if (!allowed) throw errors.forbidden(`Only ${WHO[move.by]} may ${move.verb.toLowerCase()} this loan.`);

  if (input.conditions.length > 0 && to !== 'inspected')
    throw errors.badRequest('Instrument conditions are recorded at inspection only.', [{ field: 'conditions', message: 'only with to: inspected' }]);
  const inKit = input.conditions.length
    ? await db.select({ id: instrument.id, type: instrument.type, model: instrument.model, serial: instrument.serial, condition: instrument.condition }).from(instrument).where(and(eq(instrument.kitId, r.kitId), inArray(instrument.id, input.conditions.map((c) => c.instrumentId))))
    : [];
  const stray = input.conditions.filter((c) => !inKit.some((i) => i.id === c.instrumentId));
  if (stray.length) throw errors.badRequest(`Only instruments in kit ${r.kitCode} can be recorded at this inspection.`, stray.map((s) => ({ field: 'conditions', message: `instrument ${s.instrumentId} is not in the kit` })));

  if (move.checksInstruments) await assertKitCanGoOut(db, { id: r.kitId, code: r.kitCode }, r.end, to === 'approved' ? 'approved for these dates' : 'shipped for these dates');

  const changed: { id: string; name: string; from: string; to: InstrumentCondition }[] = [];
  const done = await db.transaction(async (tx) => {
    const updated = await tx
      .update(loan)
      .set({ status: to, updatedAt: new Date() })
      .where(and(eq(loan.id, id), eq(loan.status, from)))
      .returning({ id: loan.id });
    if (updated.length === 0) return false;
    await tx.insert(loanEvent).values({ loanId: id, fromStatus: from, toStatus: to, userId: actor.id, actor: actor.name, note: input.note });
    for (const c of input.conditions) {
      const i = inKit.find((x) => x.id === c.instrumentId)!;
      if (i.condition === c.condition) continue;
      await tx.update(instrument).set({ condition: c.condition }).where(eq(instrument.id, i.id));
      changed.push({ id: i.id, name: instrumentName(i), from: i.condition, to: c.condition });
      await logActivity({ action: 'instrument.condition', userId: actor.id, actor: actor.email, entityType: 'instrument', entityId: i.id, ip, details: { from: i.condition, to: c.condition, loanId: id, note: input.note } }, tx);
    }
    return true;
  });
  if (!done) throw errors.conflict('Someone changed this loan a moment ago. Reload it and try again.');

  await logActivity({ action: `loan.${to}`, userId: actor.id, actor: actor.email, entityType: 'loan', entityId: id, installationId: r.installationId, ip, details: { from, to, note: input.note, conditions: changed.map((c) => `${c.name}: ${CONDITION_LABELS[c.to]}`) } });
  const mail = forMail(r);
  if ((to === 'approved' || to === 'declined' || to === 'shipped') && r.requestedById && r.requestedById !== actor.id) {
    const [requester] = await peopleById(db, [r.requestedById]);
    if (requester) await mailDecision(requester, mail, to, actor.name, input.note);
  }
  if (to === 'cancelled' && !parties.custodian) await mailCancelled(await custodians(db), mail, actor.name, input.note);
  return getLoan(actor, id);
}
