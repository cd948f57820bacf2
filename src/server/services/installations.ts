/** Installations: list, read, create and edit, always within the actor's scope. */
import { and, asc, count, eq, max, sql } from 'drizzle-orm';
import type { InstallationInput, InstallationPatch } from '../../lib/schemas/inventory';
import { getDb } from '../../db/client';
import { bill, building, installation, meter, region } from '../../db/schema';
import { logActivity } from '../activity';
import { installationByCode, scopeToInstallations, type Actor } from '../authz';
import { isUniqueViolation } from '../db-errors';
import { errors } from '../http';

export interface InstallationSummary {
  id: string;
  code: string;
  name: string;
  climate: string;
  timeZone: string;
  address: string;
  regionCode: string;
  buildings: number;
  grossAreaFt2: number;
  meters: number;
  lastBillEnd: string | null;
  target: { baselineFy: number | null; reductionPct: number | null; targetFy: number | null };
}

export async function listInstallations(actor: Actor): Promise<InstallationSummary[]> {
  const db = await getDb();
  const b = db
    .select({
      installationId: building.installationId,
      buildings: count(building.id).as('buildings'),
      area: sql<number>`coalesce(sum(${building.grossAreaFt2}), 0)`.as('area'),
    })
    .from(building)
    .where(eq(building.archived, false))
    .groupBy(building.installationId)
    .as('b');
  const m = db
    .select({ installationId: meter.installationId, meters: count(meter.id).as('meters') })
    .from(meter)
    .groupBy(meter.installationId)
    .as('m');
  const l = db
    .select({ installationId: meter.installationId, lastEnd: max(bill.periodEnd).as('last_end') })
    .from(bill)
    .innerJoin(meter, eq(meter.id, bill.meterId))
    .groupBy(meter.installationId)
    .as('l');
  const rows = await db
    .select({
      id: installation.id,
      code: installation.code,
      name: installation.name,
      climate: installation.climate,
      timeZone: installation.timeZone,
      address: installation.address,
      regionCode: region.code,
      buildings: sql<number>`coalesce(${b.buildings}, 0)`,
      grossAreaFt2: sql<number>`coalesce(${b.area}, 0)`,
      meters: sql<number>`coalesce(${m.meters}, 0)`,
      lastBillEnd: l.lastEnd,
      targetBaselineFy: installation.targetBaselineFy,
      targetReductionPct: installation.targetReductionPct,
      targetFy: installation.targetFy,
    })
    .from(installation)
    .innerJoin(region, eq(region.id, installation.regionId))
    .leftJoin(b, eq(b.installationId, installation.id))
    .leftJoin(m, eq(m.installationId, installation.id))
    .leftJoin(l, eq(l.installationId, installation.id))
    .where(scopeToInstallations(actor, installation.id))
    .orderBy(asc(installation.code));
  return rows.map((r) => ({
    id: r.id,
    code: r.code,
    name: r.name,
    climate: r.climate,
    timeZone: r.timeZone,
    address: r.address,
    regionCode: r.regionCode,
    buildings: Number(r.buildings),
    grossAreaFt2: Number(r.grossAreaFt2),
    meters: Number(r.meters),
    lastBillEnd: r.lastBillEnd ?? null,
    target: { baselineFy: r.targetBaselineFy, reductionPct: r.targetReductionPct, targetFy: r.targetFy },
  }));
}

export async function getInstallation(actor: Actor, code: string): Promise<InstallationSummary> {
  const all = await listInstallations(actor);
  const found = all.find((i) => i.code === code);
  if (found) return found;
  // Distinguish "not yours" (403) from "no such installation" (404).
  const db = await getDb();
  await installationByCode(db, actor, code);
  throw errors.notFound(`No installation with code ${code}.`);
}

export async function createInstallation(actor: Actor, input: InstallationInput, ip = ''): Promise<{ id: string; code: string }> {
  const db = await getDb();
  const [reg] = await db.select({ id: region.id }).from(region).orderBy(asc(region.code)).limit(1);
  if (!reg) throw errors.conflict('Create a region first (the demo scenario creates one).');
  try {
    const [row] = await db
      .insert(installation)
      .values({ ...input, regionId: reg.id })
      .returning({ id: installation.id, code: installation.code });
    await logActivity({ action: 'installation.create', userId: actor.id, actor: actor.email, entityType: 'installation', entityId: row!.id, installationId: row!.id, ip, details: { code: input.code } });
    return row!;
  } catch (e) {
    if (isUniqueViolation(e)) throw errors.conflict(`An installation with code ${input.code} already exists.`, [{ field: 'code', message: 'already in use' }]);
    throw e;
  }
}

export async function updateInstallation(actor: Actor, code: string, patch: InstallationPatch, ip = ''): Promise<void> {
  const db = await getDb();
  const inst = await installationByCode(db, actor, code);
  await db.update(installation).set({ ...patch, updatedAt: new Date() }).where(and(eq(installation.id, inst.id)));
  await logActivity({ action: 'installation.update', userId: actor.id, actor: actor.email, entityType: 'installation', entityId: inst.id, installationId: inst.id, ip, details: { fields: Object.keys(patch) } });
}
