/**
 * Measures from findings: figures entered by the auditor (or the manager), economics computed at
 * the discount rate in force and stored with it, and the status path proposed → approved →
 * implemented (dated) or rejected, every move logged with who, when and a note. Figures can change
 * only while a measure is proposed: an approval was given on those figures and that rate.
 */
import { and, asc, desc, eq, inArray, type SQL } from 'drizzle-orm';
import { getDb } from '../../db/client';
import { activityLog, building, installation, measure, user, walkthrough } from '../../db/schema';
import { measureEconomics } from '../../lib/economics';
import type { MeasureStatus } from '../../lib/field/walkthrough-form';
import { canMoveMeasure, ECONOMICS_FIELD_NAMES, economicsInput, MEASURE_STATUS_LABELS, type MeasureInput, type MeasureStatusChange } from '../../lib/savings/measure-input';
import { logActivity } from '../activity';
import { installationByCode, scopeToInstallations, type Actor } from '../authz';
import { errors } from '../http';
import { findingRef, measureRef, requireAny } from '../walkthroughs/access';
import { currentDiscountRate } from './discount-rate';
import { measureView, type MeasureView, type StoredEconomics } from './view';

const today = () => new Date().toISOString().slice(0, 10);

/** Economics of the figures at the rate in force. @throws 400 naming the measure's fields */
async function economicsFor(input: MeasureInput): Promise<StoredEconomics> {
  const rate = await currentDiscountRate();
  const r = measureEconomics.run(economicsInput(input, rate.realDiscountRatePercent));
  if (!r.ok) {
    const details = (r.issues ?? []).map((i) => ({ field: ECONOMICS_FIELD_NAMES[i.field] ?? i.field, message: i.message }));
    throw errors.badRequest(`Invalid input — ${details.map((d) => `${d.field}: ${d.message}`).join('; ') || r.message}`, details);
  }
  return { computedAt: new Date().toISOString(), rate, energyEscalationPercent: input.energyEscalationPercent, result: r.value, notes: r.notes };
}

/** Creates the measure of a finding, or changes its figures while it is proposed (economics recomputed). */
export async function saveMeasure(actor: Actor, findingId: string, input: MeasureInput, ip = ''): Promise<MeasureView> {
  requireAny(actor, ['walkthroughs:field', 'measures:approve'], 'price findings as measures');
  const db = await getDb();
  const f = await findingRef(db, actor, findingId);
  if (f.walkthroughStatus === 'cancelled') throw errors.conflict('This walkthrough is cancelled.', { reason: 'not-editable' });
  const [existing] = await db.select({ id: measure.id, status: measure.status }).from(measure).where(eq(measure.findingId, findingId));
  if (existing && existing.status !== 'proposed') {
    throw errors.conflict(`This measure is ${existing.status}: its figures are kept as decided. Move it back to proposed to change them.`, { reason: 'measure-decided', status: existing.status });
  }
  const economics = await economicsFor(input);
  const values = {
    title: input.title ?? f.title,
    savings: input.savings,
    annualEnergyCostSavings: input.annualEnergyCostSavings,
    annualWaterCostSavings: input.annualWaterCostSavings,
    annualOmCostSavings: input.annualOmCostSavings,
    installedCost: input.installedCost,
    incentives: input.incentives,
    lifeYears: input.lifeYears,
    economics,
    updatedAt: new Date(),
  };
  const [row] = existing
    ? await db.update(measure).set(values).where(and(eq(measure.id, existing.id), eq(measure.status, 'proposed'))).returning()
    : await db.insert(measure).values({ ...values, findingId, walkthroughId: f.walkthroughId, installationId: f.installationId, buildingId: f.buildingId, status: 'proposed', createdBy: actor.id }).returning();
  if (!row) throw errors.conflict('This measure was decided meanwhile: reload it.', { reason: 'measure-decided' });
  await logActivity({
    action: existing ? 'measure.update' : 'measure.create',
    userId: actor.id,
    actor: actor.email,
    entityType: 'measure',
    entityId: row.id,
    installationId: f.installationId,
    ip,
    details: { findingId, installedCost: input.installedCost, discountRatePercent: economics.rate.realDiscountRatePercent },
  });
  return measureView(row);
}

/** Moves a measure along its status path. @throws 403, 409 (not allowed), 422 (implementation date) */
export async function setMeasureStatus(actor: Actor, id: string, change: MeasureStatusChange, ip = ''): Promise<MeasureView> {
  const db = await getDb();
  return db.transaction(async (tx) => {
    const { measure: m, plannedOn } = await measureRef(tx, actor, id, true);
    const from = m.status as MeasureStatus;
    const to = change.status;
    // Who may ask for this status is decided before anything about the measure is revealed.
    if (to === 'implemented') requireAny(actor, ['measures:approve', 'walkthroughs:plan'], 'record an implementation');
    else requireAny(actor, ['measures:approve'], `${to === 'approved' && from === 'proposed' ? 'approve' : 'decide on'} measures (measures:approve)`);
    if (from === to) return measureView(m);
    if (!canMoveMeasure(from, to)) throw errors.conflict(`A measure cannot go from ${MEASURE_STATUS_LABELS[from].toLowerCase()} to ${MEASURE_STATUS_LABELS[to].toLowerCase()}.`, { reason: 'not-allowed' });
    const set: Partial<typeof measure.$inferInsert> = { status: to, updatedAt: new Date() };
    if (to === 'implemented') {
      const on = change.implementedOn!;
      if (on > today()) throw errors.unprocessable('The implementation date is in the future.', [{ field: 'implementedOn', message: 'not after today' }]);
      if (on < plannedOn) throw errors.unprocessable(`The implementation date is before the walkthrough (${plannedOn}).`, [{ field: 'implementedOn', message: `not before ${plannedOn}` }]);
      set.implementedOn = on;
    }
    if (from === 'implemented') set.implementedOn = null;
    if (to === 'approved' && from === 'proposed') Object.assign(set, { approvedBy: actor.id, approvedAt: new Date() });
    if (to === 'proposed' || to === 'rejected') Object.assign(set, { approvedBy: null, approvedAt: null });
    const [row] = await tx.update(measure).set(set).where(eq(measure.id, id)).returning();
    await logActivity(
      { action: 'measure.status', userId: actor.id, actor: actor.email, entityType: 'measure', entityId: id, installationId: m.installationId, ip, details: { from, to, note: change.note, implementedOn: change.implementedOn ?? null } },
      tx,
    );
    return measureView(row!);
  });
}

/** Who moved the measure, when, from what to what, with their note. */
export async function measureHistory(actor: Actor, id: string) {
  const db = await getDb();
  await measureRef(db, actor, id);
  const rows = await db
    .select({ at: activityLog.at, action: activityLog.action, actor: activityLog.actor, name: user.name, details: activityLog.details })
    .from(activityLog)
    .leftJoin(user, eq(user.id, activityLog.userId))
    .where(and(eq(activityLog.entityType, 'measure'), eq(activityLog.entityId, id)))
    .orderBy(asc(activityLog.at), asc(activityLog.id));
  return rows.map((r) => ({ at: r.at.toISOString(), action: r.action, by: r.name ?? r.actor, details: r.details as Record<string, unknown> }));
}

export async function getMeasure(actor: Actor, id: string) {
  const db = await getDb();
  const { measure: m } = await measureRef(db, actor, id);
  return { ...measureView(m), history: await measureHistory(actor, id) };
}

export interface MeasureQuery {
  installation?: string | undefined;
  building?: string | undefined;
  walkthrough?: string | undefined;
  status?: MeasureStatus[] | undefined;
}

/** Measures in the actor's scope with where they are, newest walkthrough first. */
export async function listMeasures(actor: Actor, q: MeasureQuery = {}) {
  const db = await getDb();
  const where: (SQL | undefined)[] = [scopeToInstallations(actor, measure.installationId)];
  if (q.installation) where.push(eq(measure.installationId, (await installationByCode(db, actor, q.installation)).id));
  if (q.building) where.push(eq(measure.buildingId, q.building));
  if (q.walkthrough) where.push(eq(measure.walkthroughId, q.walkthrough));
  if (q.status?.length) where.push(inArray(measure.status, q.status));
  const rows = await db
    .select({ m: measure, installationCode: installation.code, buildingNumber: building.number, buildingName: building.name, walkthroughTitle: walkthrough.title, plannedOn: walkthrough.plannedOn })
    .from(measure)
    .innerJoin(building, eq(building.id, measure.buildingId))
    .innerJoin(installation, eq(installation.id, measure.installationId))
    .innerJoin(walkthrough, eq(walkthrough.id, measure.walkthroughId))
    .where(and(...where))
    .orderBy(desc(walkthrough.plannedOn), asc(measure.createdAt));
  return rows.map((r) => ({ ...measureView(r.m), installationCode: r.installationCode, buildingNumber: r.buildingNumber, buildingName: r.buildingName, walkthroughTitle: r.walkthroughTitle, plannedOn: r.plannedOn }));
}
