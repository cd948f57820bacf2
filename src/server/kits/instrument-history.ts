/**
 * The history of one instrument: its entries in the activity log (added, moved between kits,
 * calibration date and condition changes) and the loans that took it out. Loans are kept per
 * kit; a loan belongs to an instrument's history when the instrument was in the loan's kit at the
 * moment the kit was shipped (or, for loans not shipped yet, when it is in that kit now).
 */
import { and, asc, eq, inArray } from 'drizzle-orm';
import { getDb } from '../../db/client';
import { activityLog, installation, instrument, loan, loanEvent, user } from '../../db/schema';
import { formatDate } from '../../lib/format';
import type { HistoryEntry } from '../../lib/kits/api-types';
import { CONDITION_LABELS, type InstrumentCondition } from '../../lib/kits/kit-readiness';
import { formatRange } from '../../lib/kits/loan-dates';
import { LOAN_STATUS_LABELS, type LoanStatus } from '../../lib/kits/loan-states';
import type { Actor } from '../authz';
import { errors } from '../http';
import { loanRef, seesLoan } from './loan-rows';

type Details = Record<string, unknown>;
const str = (v: unknown): string | null => (typeof v === 'string' && v ? v : null);
const cond = (v: unknown) => CONDITION_LABELS[v as InstrumentCondition] ?? String(v);

function describe(action: string, d: Details): { kind: HistoryEntry['kind']; text: string } | null {
  switch (action) {
    case 'instrument.create':
      return { kind: 'created', text: `Added to the library${str(d.kitId) ? '' : ', in no kit'}.` };
    case 'instrument.move': {
      const from = str(d.fromKit);
      const to = str(d.toKit);
      return { kind: 'moved', text: from && to ? `Moved from kit ${from} to kit ${to}.` : to ? `Put in kit ${to}.` : `Taken out of kit ${from ?? '—'}.` };
    }
    case 'instrument.calibration':
      return { kind: 'calibration', text: `Calibration due date set to ${formatDate(str(d.to)) || 'none'}${str(d.from) ? ` (was ${formatDate(str(d.from))})` : ''}.` };
    case 'instrument.condition':
      return { kind: 'condition', text: `Condition ${cond(d.from)} → ${cond(d.to)}${str(d.loanId) ? ` at the inspection after loan ${loanRef(str(d.loanId)!)}` : ''}${str(d.note) ? `: ${str(d.note)}` : '.'}` };
    case 'instrument.update':
      return { kind: 'updated', text: `Details edited (${Array.isArray(d.fields) ? d.fields.join(', ') : 'fields'}).` };
    default:
      return null;
  }
}

export async function instrumentHistory(actor: Actor, id: string): Promise<HistoryEntry[]> {
  const db = await getDb();
  const [cur] = await db.select({ kitId: instrument.kitId }).from(instrument).where(eq(instrument.id, id));
  if (!cur) throw errors.notFound('No instrument with this id.');
  const log = await db
    .select({ at: activityLog.at, action: activityLog.action, actor: activityLog.actor, name: user.name, details: activityLog.details })
    .from(activityLog)
    .leftJoin(user, eq(user.id, activityLog.userId))
    .where(and(eq(activityLog.entityType, 'instrument'), eq(activityLog.entityId, id)))
    .orderBy(asc(activityLog.at), asc(activityLog.id));

  // Which kit the instrument was in at a moment: replay the moves (before the first one, it was in
  // that move's "from" kit; with no moves, in its current kit).
  const moves = log.filter((e) => e.action === 'instrument.move').map((e) => ({ at: e.at.getTime(), from: str((e.details as Details).fromKitId), to: str((e.details as Details).toKitId) }));
  const kitAt = (t: number): string | null => {
    let k = moves.length ? moves[0]!.from : cur.kitId;
    for (const m of moves) if (m.at <= t) k = m.to;
    return k;
  };
  const kitIds = [...new Set([cur.kitId, ...moves.flatMap((m) => [m.from, m.to])].filter((x): x is string => !!x))];

  const entries: HistoryEntry[] = [];
  for (const e of log) {
    const d = describe(e.action, e.details as Details);
    if (d) entries.push({ at: e.at.toISOString(), ...d, by: e.name || e.actor || null, loan: null });
  }
  if (kitIds.length) {
    const loans = await db
      .select({ id: loan.id, kitId: loan.kitId, start: loan.startDate, end: loan.endDate, status: loan.status, purpose: loan.purpose, installationId: loan.installationId, installationCode: installation.code, createdAt: loan.createdAt })
      .from(loan)
      .leftJoin(installation, eq(installation.id, loan.installationId))
      .where(and(inArray(loan.kitId, kitIds), inArray(loan.status, ['requested', 'approved', 'shipped', 'in-use', 'returned', 'inspected'])));
    const shipped = loans.length
      ? await db.select({ loanId: loanEvent.loanId, at: loanEvent.at, by: loanEvent.actor }).from(loanEvent).where(and(inArray(loanEvent.loanId, loans.map((l) => l.id)), eq(loanEvent.toStatus, 'shipped')))
      : [];
    for (const l of loans) {
      const status = l.status as LoanStatus;
      const ev = shipped.find((s) => s.loanId === l.id);
      // A loan recorded without its events (loaded history) went out on its first day.
      const outAt = ev ? ev.at : status === 'requested' || status === 'approved' ? null : new Date(`${l.start}T00:00:00Z`);
      if (outAt ? kitAt(outAt.getTime()) !== l.kitId : l.kitId !== cur.kitId) continue;
      const visible = seesLoan(actor, l.installationId);
      const ref = loanRef(l.id);
      const state = LOAN_STATUS_LABELS[status].toLowerCase();
      entries.push({
        at: (outAt ?? l.createdAt).toISOString(),
        kind: 'loan',
        text: visible
          ? `${outAt ? 'Out with' : 'Reserved by'} loan ${ref}, ${formatRange(l)}: “${l.purpose}”${l.installationCode ? ` (${l.installationCode})` : ''}; now ${state}.`
          : `${outAt ? 'Out on' : 'Reserved by'} a loan for another installation, ${formatRange(l)}; now ${state}.`,
        by: ev?.by ?? null,
        loan: visible ? { id: l.id, ref, start: l.start, end: l.end, status } : null,
      });
    }
  }
  return entries.sort((a, b) => (a.at < b.at ? 1 : a.at > b.at ? -1 : 0));
}
