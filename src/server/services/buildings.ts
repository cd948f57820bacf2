/** Buildings: list, read, create and edit within the actor's installations. */
import { and, asc, desc, eq, ilike, or, sql, type SQL } from 'drizzle-orm';
import type { BuildingInput, BuildingPatch, } from '../../lib/schemas/inventory';
import type { UseType } from '../../lib/domain';
import { getDb } from '../../db/client';
import { bill, building, installation, meter } from '../../db/schema';
import { logActivity } from '../activity';
import { installationByCode, scopeToInstallations, type Actor } from '../authz';
import { isUniqueViolation } from '../db-errors';
import { errors } from '../http';

export interface BuildingRow {
  id: string;
  installationCode: string;
  installationName: string;
  number: string;
  name: string;
  useType: string;
  grossAreaFt2: number;
  yearBuilt: number | null;
  occupants: number | null;
  lastEvaluatedOn: string | null;
  notes: string;
  archived: boolean;
  updatedAt: string;
}

const columns = {
  id: building.id,
  installationCode: installation.code,
  installationName: installation.name,
  number: building.number,
  name: building.name,
  useType: building.useType,
  grossAreaFt2: building.grossAreaFt2,
  yearBuilt: building.yearBuilt,
  occupants: building.occupants,
  lastEvaluatedOn: building.lastEvaluatedOn,
  notes: building.notes,
  archived: building.archived,
  updatedAt: building.updatedAt,
};

type Raw = { [K in keyof typeof columns]: unknown };
const toRow = (r: Raw): BuildingRow => ({
  ...(r as unknown as BuildingRow),
  updatedAt: (r.updatedAt as Date).toISOString(),
});

export const BUILDING_SORTS = ['number', 'name', 'area', 'use', 'installation'] as const;
export type BuildingSort = (typeof BUILDING_SORTS)[number];

export interface BuildingQuery {
  installation?: string | undefined;
  q?: string | undefined;
  useType?: UseType | undefined;
  sort?: BuildingSort | undefined;
  includeArchived?: boolean | undefined;
}

export async function listBuildings(actor: Actor, query: BuildingQuery = {}): Promise<BuildingRow[]> {
  const db = await getDb();
  const where: (SQL | undefined)[] = [scopeToInstallations(actor, building.installationId)];
  if (query.installation) {
    const inst = await installationByCode(db, actor, query.installation);
    where.push(eq(building.installationId, inst.id));
  }
  if (query.q) {
    const like = `%${query.q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
    where.push(or(ilike(building.name, like), ilike(building.number, like)));
  }
  if (query.useType) where.push(eq(building.useType, query.useType));
  if (!query.includeArchived) where.push(eq(building.archived, false));
  const order = {
    number: [asc(installation.code), asc(building.number)],
    name: [asc(building.name), asc(building.number)],
    area: [desc(building.grossAreaFt2), asc(building.number)],
    use: [asc(building.useType), asc(building.number)],
    installation: [asc(installation.code), asc(building.number)],
  }[query.sort ?? 'number'];
  const rows = await db
    .select(columns)
    .from(building)
    .innerJoin(installation, eq(installation.id, building.installationId))
    .where(and(...where))
    .orderBy(...order);
  return rows.map(toRow);
}

/** One building if it is in the actor's scope. @throws 404 otherwise (even when it exists elsewhere). */
export async function getBuilding(actor: Actor, id: string): Promise<BuildingRow & { installationId: string }> {
  const db = await getDb();
  const [row] = await db
    .select({ ...columns, installationId: building.installationId })
    .from(building)
    .innerJoin(installation, eq(installation.id, building.installationId))
    .where(and(eq(building.id, id), scopeToInstallations(actor, building.installationId)));
  if (!row) throw errors.notFound('No such building in your installations.');
  return { ...toRow(row), installationId: row.installationId };
}

export async function createBuilding(actor: Actor, input: BuildingInput, ip = ''): Promise<{ id: string }> {
  const db = await getDb();
  const inst = await installationByCode(db, actor, input.installation);
  const { installation: _code, ...fields } = input;
  try {
    const [row] = await db
      .insert(building)
      .values({ ...fields, installationId: inst.id })
      .returning({ id: building.id });
    await logActivity({ action: 'building.create', userId: actor.id, actor: actor.email, entityType: 'building', entityId: row!.id, installationId: inst.id, ip, details: { number: input.number } });
    return row!;
  } catch (e) {
    if (isUniqueViolation(e))
      throw errors.conflict(`Building number ${input.number} already exists at ${inst.code}.`, [{ field: 'number', message: 'already in use at this installation' }]);
    throw e;
  }
}

export async function updateBuilding(actor: Actor, id: string, patch: BuildingPatch, ip = ''): Promise<BuildingRow> {
  const db = await getDb();
  try {
    const updated = await db
      .update(building)
      .set({ ...patch, updatedAt: new Date() })
      .where(and(eq(building.id, id), scopeToInstallations(actor, building.installationId)))
      .returning({ id: building.id, installationId: building.installationId });
    if (updated.length === 0) throw errors.notFound('No such building in your installations.');
    await logActivity({ action: 'building.update', userId: actor.id, actor: actor.email, entityType: 'building', entityId: id, installationId: updated[0]!.installationId, ip, details: { fields: Object.keys(patch) } });
  } catch (e) {
    if (isUniqueViolation(e)) throw errors.conflict(`Building number ${patch.number} already exists at this installation.`, [{ field: 'number', message: 'already in use at this installation' }]);
    throw e;
  }
  return getBuilding(actor, id);
}

/** Meters of one building (scope checked through the building). */
export async function buildingMeters(actor: Actor, buildingId: string) {
  const db = await getDb();
  const last = db
    .select({ meterId: bill.meterId, lastEnd: sql<string>`max(${bill.periodEnd})`.as('last_end'), bills: sql<number>`count(*)`.as('bills') })
    .from(bill)
    .groupBy(bill.meterId)
    .as('last');
  return db
    .select({
      id: meter.id,
      code: meter.code,
      commodity: meter.commodity,
      unit: meter.unit,
      account: meter.account,
      active: meter.active,
      heatContentKbtuPerUnit: meter.heatContentKbtuPerUnit,
      lastBillEnd: last.lastEnd,
      bills: sql<number>`coalesce(${last.bills}, 0)::int`,
    })
    .from(meter)
    .leftJoin(last, eq(last.meterId, meter.id))
    .where(and(eq(meter.buildingId, buildingId), scopeToInstallations(actor, meter.installationId)))
    .orderBy(asc(meter.commodity), asc(meter.code));
}
