/**
 * Instruments of the loaner library: add, edit (model, serial, calibration due date, condition,
 * notes), move between kits. Every change of kit, calibration date or condition goes to the
 * activity log under entity type `instrument`: with the loans that took the instrument out, that
 * is its history (instrument-history.ts). An instrument cannot join or leave a kit that is out on
 * loan (it is physically with the borrower).
 */
import { and, asc, eq, inArray, isNull, lte, ne, sql, type SQL } from 'drizzle-orm';
import { getDb } from '../../db/client';
import type { Db, Tx } from '../../db/client';
import { instrument, kit, loan } from '../../db/schema';
import { CALIBRATION_NOTICE_DAYS, calibrationStatus } from '../../lib/kits/calibration';
import { instrumentName } from '../../lib/kits/kit-readiness';
import { addDays, formatRange } from '../../lib/kits/loan-dates';
import { OUT_STATUSES } from '../../lib/kits/loan-states';
import type { InstrumentInput, InstrumentPatch, InstrumentsQuery } from '../../lib/kits/schemas';
import { logActivity } from '../activity';
import type { Actor } from '../authz';
import { errors } from '../http';
import { instrumentColumns, utcToday } from './kits';
import { loanRef } from './loan-rows';

const columns = { ...instrumentColumns, kitCode: kit.code, kitName: kit.name, createdAt: instrument.createdAt };

function select(db: Db | Tx) {
  return db.select(columns).from(instrument).leftJoin(kit, eq(kit.id, instrument.kitId));
}
type Record_ = Awaited<ReturnType<typeof select>>[number];

function toRow(r: Record_, today: string) {
  return { ...r, createdAt: r.createdAt.toISOString(), calibration: calibrationStatus(r.calibrationDue, today) };
}
export type InstrumentRow = ReturnType<typeof toRow>;

export async function listInstruments(_actor: Actor, q: Partial<InstrumentsQuery> = {}): Promise<InstrumentRow[]> {
  const db = await getDb();
  const today = utcToday();
  const where: (SQL | undefined)[] = [];
  if (q.kit === 'none') where.push(isNull(instrument.kitId));
  else if (q.kit) where.push(eq(instrument.kitId, q.kit));
  if (q.type) where.push(eq(instrument.type, q.type));
  if (q.retired !== 'include') where.push(ne(instrument.condition, 'retired'));
  if (q.calibration === 'past-due') where.push(sql`${instrument.calibrationDue} < ${today}`);
  if (q.calibration === 'due-soon') where.push(and(sql`${instrument.calibrationDue} >= ${today}`, lte(instrument.calibrationDue, addDays(today, CALIBRATION_NOTICE_DAYS))));
  if (q.calibration === 'attention') where.push(lte(instrument.calibrationDue, addDays(today, CALIBRATION_NOTICE_DAYS)));
  const rows = await select(db)
    .where(and(...where))
    .orderBy(asc(kit.code), asc(instrument.type), asc(instrument.serial));
  return rows.map((r) => toRow(r, today));
}

export async function getInstrument(_actor: Actor, id: string): Promise<InstrumentRow> {
  const db = await getDb();
  const [r] = await select(db).where(eq(instrument.id, id));
  if (!r) throw errors.notFound('No instrument with this id.');
  return toRow(r, utcToday());
}

/** @throws 409 when the kit is out on loan now (shipped or in use). */
async function assertKitHome(db: Db | Tx, kitId: string, doing: string) {
  const [out] = await db
    .select({ id: loan.id, code: kit.code, start: loan.startDate, end: loan.endDate })
    .from(loan)
    .innerJoin(kit, eq(kit.id, loan.kitId))
    .where(and(eq(loan.kitId, kitId), inArray(loan.status, [...OUT_STATUSES])));
  if (out) throw errors.conflict(`Kit ${out.code} is out on loan ${loanRef(out.id)} (${formatRange(out)}): ${doing} once it is back.`, [{ field: 'kitId', message: 'kit out on loan' }]);
}

async function assertKitExists(db: Db | Tx, kitId: string) {
  const [k] = await db.select({ id: kit.id, code: kit.code }).from(kit).where(eq(kit.id, kitId));
  if (!k) throw errors.unprocessable('No kit with this id.', [{ field: 'kitId', message: 'no such kit' }]);
  return k;
}

/** @throws 409 when another instrument of the same type and model has this serial number. */
async function assertSerialFree(db: Db | Tx, v: { type: string; model: string; serial: string }, exceptId?: string) {
  const [dup] = await db
    .select({ id: instrument.id, kitCode: kit.code })
    .from(instrument)
    .leftJoin(kit, eq(kit.id, instrument.kitId))
    .where(and(eq(instrument.type, v.type), sql`lower(${instrument.model}) = lower(${v.model})`, sql`lower(${instrument.serial}) = lower(${v.serial})`, exceptId ? ne(instrument.id, exceptId) : undefined));
  if (dup)
    throw errors.conflict(`${instrumentName(v)} is already in the library${dup.kitCode ? ` (kit ${dup.kitCode})` : ''}.`, [{ field: 'serial', message: 'already in the library' }]);
}

export async function createInstrument(actor: Actor, input: InstrumentInput, ip = ''): Promise<InstrumentRow> {
  const db = await getDb();
  if (input.kitId) {
    await assertKitExists(db, input.kitId);
    await assertKitHome(db, input.kitId, 'add the instrument');
  }
  await assertSerialFree(db, input);
  const [row] = await db.insert(instrument).values(input).returning({ id: instrument.id });
  await logActivity({ action: 'instrument.create', userId: actor.id, actor: actor.email, entityType: 'instrument', entityId: row!.id, ip, details: { kitId: input.kitId, calibrationDue: input.calibrationDue, condition: input.condition } });
  return getInstrument(actor, row!.id);
}

/**
 * Edits an instrument. A new calibration due date clears the reminder bookkeeping (the reminders
 * start over for the new date); moving to another kit (or out of any: `kitId: null`) is refused
 * while either kit is out on loan.
 */
export async function updateInstrument(actor: Actor, id: string, patch: InstrumentPatch, ip = ''): Promise<InstrumentRow> {
  const db = await getDb();
  const [cur] = await db.select().from(instrument).where(eq(instrument.id, id));
  if (!cur) throw errors.notFound('No instrument with this id.');
  const moving = patch.kitId !== undefined && patch.kitId !== cur.kitId;
  if (moving) {
    if (patch.kitId) await assertKitExists(db, patch.kitId);
    if (cur.kitId) await assertKitHome(db, cur.kitId, 'take the instrument out');
    if (patch.kitId) await assertKitHome(db, patch.kitId, 'add the instrument');
  }
  const next = { type: patch.type ?? cur.type, model: patch.model ?? cur.model, serial: patch.serial ?? cur.serial };
  if (patch.type !== undefined || patch.model !== undefined || patch.serial !== undefined) await assertSerialFree(db, next, id);
  const recalibrated = patch.calibrationDue !== undefined && patch.calibrationDue !== cur.calibrationDue;
  await db.transaction(async (tx) => {
    await tx
      .update(instrument)
      .set({ ...patch, ...(recalibrated ? { calibrationNoticeOn: null } : {}) })
      .where(eq(instrument.id, id));
    const log = (action: string, details: Record<string, unknown>) => logActivity({ action, userId: actor.id, actor: actor.email, entityType: 'instrument', entityId: id, ip, details }, tx);
    if (moving) {
      const codes = await tx.select({ id: kit.id, code: kit.code }).from(kit).where(inArray(kit.id, [cur.kitId, patch.kitId].filter((x): x is string => !!x)));
      const code = (k: string | null | undefined) => (k ? (codes.find((c) => c.id === k)?.code ?? null) : null);
      await log('instrument.move', { fromKitId: cur.kitId, toKitId: patch.kitId ?? null, fromKit: code(cur.kitId), toKit: code(patch.kitId) });
    }
    if (recalibrated) await log('instrument.calibration', { from: cur.calibrationDue, to: patch.calibrationDue });
    if (patch.condition !== undefined && patch.condition !== cur.condition) await log('instrument.condition', { from: cur.condition, to: patch.condition });
    const other = (['type', 'model', 'serial', 'notes'] as const).filter((f) => patch[f] !== undefined && patch[f] !== cur[f]);
    if (other.length) await log('instrument.update', { fields: other });
  });
  return getInstrument(actor, id);
}
