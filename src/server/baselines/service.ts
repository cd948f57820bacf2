/** Reading baselines and recording the analyst's decisions on them, within the actor's scope. */
import { and, asc, desc, eq, sql, type SQL } from 'drizzle-orm';
import type { BaselineDecision, BaselinePeriod, BaselineStatus } from '../../lib/schemas/baselines';
import { getDb } from '../../db/client';
import { baseline, baselineDecision, building, installation, meter } from '../../db/schema';
import { logActivity } from '../activity';
import { installationByCode, scopeToInstallations, type Actor } from '../authz';
import { errors } from '../http';
import { refitBaselines, runState } from './run';

const listColumns = {
  id: baseline.id,
  installationId: baseline.installationId,
  meterId: baseline.meterId,
  meterCode: meter.code,
  buildingId: baseline.buildingId,
  buildingNumber: building.number,
  buildingName: building.name,
  useType: building.useType,
  installationCode: installation.code,
  commodity: baseline.commodity,
  unit: baseline.unit,
  status: baseline.status,
  shape: baseline.shape,
  overrideShape: baseline.overrideShape,
  reason: baseline.reason,
  r2: baseline.r2,
  adjR2: baseline.adjR2,
  cvrmse: baseline.cvrmse,
  nac: baseline.nac,
  nacConverted: baseline.nacConverted,
  periodStart: baseline.periodStart,
  periodEnd: baseline.periodEnd,
  periodChosen: baseline.periodChosen,
  fittedAt: baseline.fittedAt,
  reviewedAt: baseline.reviewedAt,
  stale: sql<boolean>`coalesce(${installation.dataChangedAt} > ${baseline.fittedAt}, false)`,
};

export interface BaselineQuery {
  installation?: string | undefined;
  status?: BaselineStatus | undefined;
  commodity?: string | undefined;
}

export async function listBaselines(actor: Actor, q: BaselineQuery = {}) {
  const db = await getDb();
  const where: (SQL | undefined)[] = [scopeToInstallations(actor, baseline.installationId)];
  if (q.installation) where.push(eq(baseline.installationId, (await installationByCode(db, actor, q.installation)).id));
  if (q.commodity) where.push(eq(baseline.commodity, q.commodity));
  const base = db
    .select(listColumns)
    .from(baseline)
    .innerJoin(meter, eq(meter.id, baseline.meterId))
    .innerJoin(building, eq(building.id, baseline.buildingId))
    .innerJoin(installation, eq(installation.id, baseline.installationId));
  const all = await base.where(and(...where)).orderBy(asc(installation.code), asc(building.number), asc(meter.code));
  const counts = { accepted: 0, 'needs-review': 0, 'failing-criteria': 0, 'insufficient-data': 0 } as Record<BaselineStatus, number>;
  for (const r of all) counts[r.status as BaselineStatus]++;
  return { items: q.status ? all.filter((r) => r.status === q.status) : all, counts, run: runState() };
}

/** One meter's baseline with its full fit and the decisions taken on it. @throws 404 */
export async function getBaseline(actor: Actor, meterId: string) {
  const db = await getDb();
  const [row] = await db
    .select({ ...listColumns, fit: baseline.fit, inputHash: baseline.inputHash, note: baseline.note })
    .from(baseline)
    .innerJoin(meter, eq(meter.id, baseline.meterId))
    .innerJoin(building, eq(building.id, baseline.buildingId))
    .innerJoin(installation, eq(installation.id, baseline.installationId))
    .where(and(eq(baseline.meterId, meterId), scopeToInstallations(actor, baseline.installationId)));
  if (!row) throw errors.notFound('No baseline for this meter in your installations.');
  const decisions = await db.select().from(baselineDecision).where(eq(baselineDecision.baselineId, row.id)).orderBy(desc(baselineDecision.at));
  return { ...row, decisions };
}

/** The baselines of one building (all its meters). @throws 404 */
export async function buildingBaselines(actor: Actor, buildingId: string) {
  const db = await getDb();
  const [b] = await db
    .select({ id: building.id, number: building.number, name: building.name, installationCode: installation.code })
    .from(building)
    .innerJoin(installation, eq(installation.id, building.installationId))
    .where(and(eq(building.id, buildingId), scopeToInstallations(actor, building.installationId)));
  if (!b) throw errors.notFound('No such building in your installations.');
  const items = await db
    .select({ ...listColumns, fit: baseline.fit })
    .from(baseline)
    .innerJoin(meter, eq(meter.id, baseline.meterId))
    .innerJoin(building, eq(building.id, baseline.buildingId))
    .innerJoin(installation, eq(installation.id, baseline.installationId))
    .where(eq(baseline.buildingId, buildingId))
    .orderBy(asc(baseline.commodity), asc(meter.code));
  return { building: b, items };
}

function statsOf(b: { shape: string | null; r2: number | null; adjR2: number | null; cvrmse: number | null; nac: number | null; inputHash: string }) {
  return { shape: b.shape, r2: b.r2, adjR2: b.adjR2, cvrmse: b.cvrmse, nac: b.nac, inputHash: b.inputHash };
}

/** Accept the fit, choose another shape, or reopen a decision; a note is required. */
export async function decide(actor: Actor, d: BaselineDecision, ip = '') {
  const current = await getBaseline(actor, d.meterId);
  const db = await getDb();
  if (d.action === 'override') {
    const shapes = (current.fit as { shapes?: Record<string, { ok: boolean }> }).shapes ?? {};
    if (!shapes[d.shape]?.ok) throw errors.conflict(`The ${d.shape} shape has no qualified model for this meter; choose one that does.`, [{ field: 'shape', message: 'no qualified model' }]);
    await db.update(baseline).set({ overrideShape: d.shape }).where(eq(baseline.id, current.id));
    await refitBaselines({ meterIds: [d.meterId] }, 'override');
  }
  if (d.action === 'reopen') {
    await db.update(baseline).set({ overrideShape: null, status: 'needs-review', reviewedAt: null, reviewedBy: null }).where(eq(baseline.id, current.id));
    await refitBaselines({ meterIds: [d.meterId] }, 'reopen');
  }
  const after = await getBaseline(actor, d.meterId);
  if (d.action !== 'reopen') {
    if (after.status === 'insufficient-data' || after.shape === null) throw errors.conflict('There is no model to accept for this meter.');
    await db.update(baseline).set({ status: 'accepted', reviewedBy: actor.id, reviewedAt: new Date(), note: d.note }).where(eq(baseline.id, current.id));
  }
  const [full] = await db.select({ inputHash: baseline.inputHash }).from(baseline).where(eq(baseline.id, current.id));
  await db.insert(baselineDecision).values({
    baselineId: current.id,
    userId: actor.id,
    actor: actor.email,
    action: d.action,
    shape: d.action === 'override' ? d.shape : after.shape,
    note: d.note,
    details: statsOf({ ...after, inputHash: full?.inputHash ?? '' }),
  });
  const { computeBuildingMetrics } = await import('../benchmark/metrics');
  await computeBuildingMetrics({ installationIds: [current.installationId] });
  await logActivity({ action: `baseline.${d.action}`, userId: actor.id, actor: actor.email, entityType: 'meter', entityId: d.meterId, installationId: null, ip, details: { shape: after.shape } });
  return getBaseline(actor, d.meterId);
}

/** Sets the baseline period of a meter and refits it. */
export async function setPeriod(actor: Actor, p: BaselinePeriod, ip = '') {
  const current = await getBaseline(actor, p.meterId);
  const db = await getDb();
  await db.update(baseline).set({ periodStart: p.start, periodEnd: p.end, periodChosen: true }).where(eq(baseline.id, current.id));
  await refitBaselines({ meterIds: [p.meterId] }, 'period chosen');
  const after = await getBaseline(actor, p.meterId);
  const { computeBuildingMetrics } = await import('../benchmark/metrics');
  await computeBuildingMetrics({ installationIds: [current.installationId] });
  await db.insert(baselineDecision).values({ baselineId: current.id, userId: actor.id, actor: actor.email, action: 'period', shape: after.shape, note: `${p.start} to ${p.end}: ${p.note}`, details: statsOf({ ...after, inputHash: '' }) });
  await logActivity({ action: 'baseline.period', userId: actor.id, actor: actor.email, entityType: 'meter', entityId: p.meterId, ip, details: { start: p.start, end: p.end } });
  return after;
}
