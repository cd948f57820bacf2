/**
 * Kits of the loaner library: list (with availability for a date range), one kit with its
 * instruments and the calendar of its loans, create and edit. Kits are region-wide; the loans on
 * a kit's calendar carry their details only for callers who may see the loan's installation.
 */
import { and, asc, eq, gte, inArray, lte, ne, or } from 'drizzle-orm';
import { getDb } from '../../db/client';
import { installation, instrument, kit, loan } from '../../db/schema';
import type { CalendarEntry, KitDetail, KitFields, KitInstrument, KitSummary } from '../../lib/kits/api-types';
import { calibrationStatus } from '../../lib/kits/calibration';
import { kitProblems } from '../../lib/kits/kit-readiness';
import { addDays, formatRange, rangesOverlap, todayIn } from '../../lib/kits/loan-dates';
import { HOLDING_STATUSES, LOAN_STATUS_LABELS, OUT_STATUSES, type LoanStatus } from '../../lib/kits/loan-states';
import type { KitInput, KitPatch } from '../../lib/kits/schemas';
import { logActivity } from '../activity';
import type { Actor } from '../authz';
import { isUniqueViolation } from '../db-errors';
import { errors } from '../http';
import { loanRef, seesLoan } from './loan-rows';

export const utcToday = () => todayIn('UTC');

export const instrumentColumns = {
  id: instrument.id,
  kitId: instrument.kitId,
  type: instrument.type,
  model: instrument.model,
  serial: instrument.serial,
  calibrationDue: instrument.calibrationDue,
  condition: instrument.condition,
  notes: instrument.notes,
};

const kitFields = (k: typeof kit.$inferSelect): KitFields => ({ id: k.id, code: k.code, name: k.name, description: k.description, homeLocation: k.homeLocation, active: k.active });

type InstrumentRecord = Omit<KitInstrument, 'calibration'>;
const withCalibration = (i: InstrumentRecord, today: string): KitInstrument => ({ ...i, calibration: calibrationStatus(i.calibrationDue, today) });

/** Instruments currently in the given kits, by kit id. */
async function instrumentsOf(kitIds: string[], today: string): Promise<Map<string, KitInstrument[]>> {
  const out = new Map<string, KitInstrument[]>();
  if (kitIds.length === 0) return out;
  const db = await getDb();
  const rows = await db.select(instrumentColumns).from(instrument).where(inArray(instrument.kitId, kitIds)).orderBy(asc(instrument.type), asc(instrument.serial));
  for (const r of rows) {
    const list = out.get(r.kitId!) ?? [];
    list.push(withCalibration(r, today));
    out.set(r.kitId!, list);
  }
  return out;
}

/** Holding loans ending today or later, and loans still out after their last day, by kit id. */
async function holdsOf(kitIds: string[], today: string) {
  const out = new Map<string, { start: string; end: string; status: LoanStatus }[]>();
  if (kitIds.length === 0) return out;
  const db = await getDb();
  const rows = await db
    .select({ kitId: loan.kitId, start: loan.startDate, end: loan.endDate, status: loan.status })
    .from(loan)
    .where(and(inArray(loan.kitId, kitIds), inArray(loan.status, [...HOLDING_STATUSES]), or(gte(loan.endDate, today), inArray(loan.status, [...OUT_STATUSES]))))
    .orderBy(asc(loan.startDate));
  for (const r of rows) {
    const list = out.get(r.kitId) ?? [];
    list.push({ start: r.start, end: r.end, status: r.status as LoanStatus });
    out.set(r.kitId, list);
  }
  return out;
}

/** Every kit with its instruments; `range` adds availability for those dates. */
export async function listKits(_actor: Actor, range?: { from: string; to: string }): Promise<KitSummary[]> {
  const db = await getDb();
  const today = utcToday();
  const kits = await db.select().from(kit).orderBy(asc(kit.code));
  const ids = kits.map((k) => k.id);
  const [instruments, holds] = await Promise.all([instrumentsOf(ids, today), holdsOf(ids, today)]);
  return kits.map((k) => {
    const list = instruments.get(k.id) ?? [];
    const kitHolds = holds.get(k.id) ?? [];
    let available: boolean | null = null;
    const because: string[] = [];
    if (range) {
      if (!k.active) because.push(`Kit ${k.code} is out of service.`);
      if (list.length === 0) because.push(`Kit ${k.code} has no instruments.`);
      for (const h of kitHolds.filter((h) => rangesOverlap(h, { start: range.from, end: range.to }))) because.push(`Held ${formatRange(h)} (${LOAN_STATUS_LABELS[h.status].toLowerCase()}).`);
      because.push(...kitProblems(list, range.to).map((p) => p.message));
      available = because.length === 0;
    }
    return {
      ...kitFields(k),
      instruments: list,
      instrumentTypes: [...new Set(list.map((i) => i.type))],
      available,
      unavailableBecause: because,
      calibrationOk: list.every((i) => i.calibration.state !== 'past-due'),
      now: kitHolds.find((h) => h.start <= today) ?? null,
      next: kitHolds.find((h) => h.start > today) ?? null,
    };
  });
}

/** One kit, its instruments, and the loans on its calendar between `from` and `to`. */
export async function getKit(actor: Actor, id: string, window: { from?: string | undefined; to?: string | undefined } = {}): Promise<KitDetail> {
  const db = await getDb();
  const [k] = await db.select().from(kit).where(eq(kit.id, id));
  if (!k) throw errors.notFound('No kit with this id.');
  const today = utcToday();
  const from = window.from ?? addDays(today, -120);
  const to = window.to ?? addDays(today, 400);
  const instruments = (await instrumentsOf([id], today)).get(id) ?? [];
  const loans = await db
    .select({ id: loan.id, start: loan.startDate, end: loan.endDate, status: loan.status, purpose: loan.purpose, installationId: loan.installationId, installationCode: installation.code })
    .from(loan)
    .leftJoin(installation, eq(installation.id, loan.installationId))
    .where(and(eq(loan.kitId, id), lte(loan.startDate, to), gte(loan.endDate, from), ne(loan.status, 'declined'), ne(loan.status, 'cancelled')))
    .orderBy(asc(loan.startDate));
  const calendar: CalendarEntry[] = loans.map((l) => ({
    start: l.start,
    end: l.end,
    status: l.status as LoanStatus,
    loan: seesLoan(actor, l.installationId) ? { id: l.id, ref: loanRef(l.id), purpose: l.purpose, installationCode: l.installationCode } : null,
  }));
  return {
    ...kitFields(k),
    createdAt: k.createdAt.toISOString(),
    today,
    instruments,
    calibrationOk: instruments.every((i) => i.calibration.state !== 'past-due'),
    window: { from, to },
    calendar,
  };
}

function codeTaken(code: string | undefined) {
  return errors.conflict(`Kit code ${code} is already in use: choose another.`, [{ field: 'code', message: 'already in use' }]);
}

export async function createKit(actor: Actor, input: KitInput, ip = '') {
  const db = await getDb();
  try {
    const [row] = await db.insert(kit).values(input).returning({ id: kit.id });
    await logActivity({ action: 'kit.create', userId: actor.id, actor: actor.email, entityType: 'kit', entityId: row!.id, ip, details: { code: input.code } });
    return getKit(actor, row!.id);
  } catch (e) {
    if (isUniqueViolation(e)) throw codeTaken(input.code);
    throw e;
  }
}

/**
 * Edits a kit. Taking it out of service is refused while loans still hold it (requested,
 * approved, shipped or in use, ending today or later): decide those first.
 */
export async function updateKit(actor: Actor, id: string, patch: KitPatch, ip = '') {
  const db = await getDb();
  const [current] = await db.select().from(kit).where(eq(kit.id, id));
  if (!current) throw errors.notFound('No kit with this id.');
  if (patch.active === false && current.active) {
    const holding = await db
      .select({ id: loan.id, start: loan.startDate, end: loan.endDate, status: loan.status })
      .from(loan)
      .where(and(eq(loan.kitId, id), inArray(loan.status, [...HOLDING_STATUSES])))
      .orderBy(asc(loan.startDate));
    if (holding.length > 0)
      throw errors.conflict(
        `Kit ${current.code} cannot be taken out of service while loans hold it: ${holding.map((h) => `loan ${loanRef(h.id)} ${formatRange(h)} (${LOAN_STATUS_LABELS[h.status as LoanStatus].toLowerCase()})`).join('; ')}. Decline, cancel or close them first.`,
        [{ field: 'active', message: 'loans still hold this kit' }],
      );
  }
  try {
    await db.update(kit).set(patch).where(eq(kit.id, id));
  } catch (e) {
    if (isUniqueViolation(e)) throw codeTaken(patch.code);
    throw e;
  }
  const action = patch.active === false && current.active ? 'kit.deactivate' : patch.active === true && !current.active ? 'kit.reactivate' : 'kit.update';
  await logActivity({ action, userId: actor.id, actor: actor.email, entityType: 'kit', entityId: id, ip, details: { fields: Object.keys(patch) } });
  return getKit(actor, id);
}
