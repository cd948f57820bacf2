/** Meters and their bills, within the actor's installations. */
import { and, asc, eq, sql } from 'drizzle-orm';
import type { MeterInput, MeterPatch } from '../../lib/schemas/inventory';
import { COMMODITY_UNITS, type Commodity, type Unit } from '../../lib/domain';
import { getDb } from '../../db/client';
import { bill, building, installation, meter } from '../../db/schema';
import { logActivity } from '../activity';
import { installationByCode, scopeToInstallations, type Actor } from '../authz';
import { isUniqueViolation } from '../db-errors';
import { errors } from '../http';

const meterColumns = {
  id: meter.id,
  code: meter.code,
  commodity: meter.commodity,
  unit: meter.unit,
  account: meter.account,
  active: meter.active,
  heatContentKbtuPerUnit: meter.heatContentKbtuPerUnit,
  buildingId: meter.buildingId,
  buildingNumber: building.number,
  buildingName: building.name,
  installationCode: installation.code,
};

export async function listMeters(actor: Actor, query: { installation?: string | undefined; buildingId?: string | undefined }) {
  const db = await getDb();
  const conditions = [scopeToInstallations(actor, meter.installationId)];
  if (query.installation) {
    const inst = await installationByCode(db, actor, query.installation);
    conditions.push(eq(meter.installationId, inst.id));
  }
  if (query.buildingId) conditions.push(eq(meter.buildingId, query.buildingId));
  return db
    .select(meterColumns)
    .from(meter)
    .innerJoin(building, eq(building.id, meter.buildingId))
    .innerJoin(installation, eq(installation.id, meter.installationId))
    .where(and(...conditions))
    .orderBy(asc(installation.code), asc(building.number), asc(meter.code));
}

export async function getMeter(actor: Actor, id: string) {
  const db = await getDb();
  const [row] = await db
    .select({ ...meterColumns, installationId: meter.installationId })
    .from(meter)
    .innerJoin(building, eq(building.id, meter.buildingId))
    .innerJoin(installation, eq(installation.id, meter.installationId))
    .where(and(eq(meter.id, id), scopeToInstallations(actor, meter.installationId)));
  if (!row) throw errors.notFound('No such meter in your installations.');
  return row;
}

export async function createMeter(actor: Actor, input: MeterInput, ip = ''): Promise<{ id: string }> {
  const db = await getDb();
  const [b] = await db
    .select({ id: building.id, installationId: building.installationId })
    .from(building)
    .where(and(eq(building.id, input.buildingId), scopeToInstallations(actor, building.installationId)));
  if (!b) throw errors.notFound('No such building in your installations.');
  try {
    const [row] = await db
      .insert(meter)
      .values({ ...input, installationId: b.installationId })
      .returning({ id: meter.id });
    await logActivity({ action: 'meter.create', userId: actor.id, actor: actor.email, entityType: 'meter', entityId: row!.id, installationId: b.installationId, ip, details: { code: input.code } });
    return row!;
  } catch (e) {
    if (isUniqueViolation(e)) throw errors.conflict(`Meter code ${input.code} is already used at this installation.`, [{ field: 'code', message: 'already in use' }]);
    throw e;
  }
}

export async function updateMeter(actor: Actor, id: string, patch: MeterPatch, ip = ''): Promise<void> {
  const current = await getMeter(actor, id);
  if (patch.unit && !COMMODITY_UNITS[current.commodity as Commodity].includes(patch.unit as Unit))
    throw errors.badRequest(`unit: ${patch.unit} is not a unit ${current.commodity} is billed in`, [{ field: 'unit', message: 'not valid for this commodity' }]);
  const db = await getDb();
  try {
    await db
      .update(meter)
      .set({ ...patch, updatedAt: new Date() })
      .where(and(eq(meter.id, id), scopeToInstallations(actor, meter.installationId)));
  } catch (e) {
    if (isUniqueViolation(e)) throw errors.conflict(`Meter code ${patch.code} is already used at this installation.`, [{ field: 'code', message: 'already in use' }]);
    throw e;
  }
  await logActivity({ action: 'meter.update', userId: actor.id, actor: actor.email, entityType: 'meter', entityId: id, installationId: current.installationId, ip, details: { fields: Object.keys(patch) } });
}

/** Bills of one meter, oldest first; the meter's scope is checked in the same query. */
export async function listBills(actor: Actor, meterId: string) {
  const db = await getDb();
  const rows = await db
    .select({
      id: bill.id,
      periodStart: bill.periodStart,
      periodEnd: bill.periodEnd,
      days: sql<number>`(${bill.periodEnd} - ${bill.periodStart} + 1)::int`,
      quantity: bill.quantity,
      unit: bill.unit,
      cost: bill.cost,
      demandKw: bill.demandKw,
      estimated: bill.estimated,
      importId: bill.importId,
    })
    .from(bill)
    .innerJoin(meter, eq(meter.id, bill.meterId))
    .where(and(eq(bill.meterId, meterId), scopeToInstallations(actor, meter.installationId)))
    .orderBy(asc(bill.periodStart), asc(bill.periodEnd));
  if (rows.length === 0) await getMeter(actor, meterId); // 404 when the meter is not visible
  return rows;
}
