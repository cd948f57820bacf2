/**
 * Walkthroughs: the list (the contract for scripts and the walkthroughs page), one walkthrough
 * with everything recorded in it, planning one from a flagged building, and edits of the plan.
 * Every query carries the actor's installation scope.
 */
import { and, asc, desc, eq, inArray, isNull, sql, type SQL } from 'drizzle-orm';
import { getDb } from '../../db/client';
import { building, buildingFlag, installation, user, walkthrough } from '../../db/schema';
import { SECTION_IDS, walkthroughFormSchema, type WalkthroughForm, type WalkthroughStatus } from '../../lib/field/walkthrough-form';
import { completionGaps } from '../../lib/field/walkthrough-lifecycle';
import type { WalkthroughPlan } from '../../lib/field/walkthrough-api';
import { emptyWalkthroughForm } from '../../lib/field/walkthrough-form';
import { rollUpMeasures } from '../../lib/savings/measure-rollup';
import { logActivity } from '../activity';
import { toRollupMeasure } from '../measures/rollup';
import { installationByCode, scopeToInstallations, type Actor } from '../authz';
import { errors } from '../http';
import { checkAuditor, notifyAuditor } from './auditors';
import { walkthroughRef } from './access';
import { findingsOf } from './findings';
import { photosOf } from './photos';

export interface WalkthroughListItem {
  id: string;
  title: string;
  buildingId: string;
  buildingNumber: string;
  buildingName: string;
  installationCode: string;
  plannedOn: string;
  auditor: { id: string; name: string } | null;
  status: WalkthroughStatus;
  progress: { completed: number; total: number };
  findings: number;
  measures: number;
  loan: { id: string; kitCode: string; status: string } | null;
}

/** Sections marked complete, counted in SQL so the list never reads whole forms. */
const completedSections = sql<number>`(${sql.join(
  SECTION_IDS.map((id) => sql`case when (${walkthrough.form}->${id}->>'completed') = 'true' then 1 else 0 end`),
  sql` + `,
)})::int`;

/** The kit loan of a walkthrough: the one holding the kit, else the latest. */
const loanOf = sql<WalkthroughListItem['loan']>`(
  select json_build_object('id', l.id, 'kitCode', k.code, 'status', l.status)
    from loan l join kit k on k.id = l.kit_id
   where l.walkthrough_id = ${walkthrough.id}
   order by (l.status in ('declined', 'cancelled')), l.created_at desc limit 1)`;

const listColumns = {
  id: walkthrough.id,
  title: walkthrough.title,
  buildingId: walkthrough.buildingId,
  buildingNumber: building.number,
  buildingName: building.name,
  installationCode: installation.code,
  plannedOn: walkthrough.plannedOn,
  auditorId: walkthrough.auditorId,
  auditorName: user.name,
  status: walkthrough.status,
  completed: completedSections,
  findings: sql<number>`(select count(*)::int from finding f where f.walkthrough_id = ${walkthrough.id})`,
  measures: sql<number>`(select count(*)::int from measure m where m.walkthrough_id = ${walkthrough.id})`,
  loan: loanOf,
};

type ListRow = { [K in keyof typeof listColumns]: unknown };
function toItem(r: ListRow): WalkthroughListItem {
  return {
    id: r.id as string,
    title: r.title as string,
    buildingId: r.buildingId as string,
    buildingNumber: r.buildingNumber as string,
    buildingName: r.buildingName as string,
    installationCode: r.installationCode as string,
    plannedOn: r.plannedOn as string,
    auditor: r.auditorId ? { id: r.auditorId as string, name: (r.auditorName as string | null) ?? 'unknown account' } : null,
    status: r.status as WalkthroughStatus,
    progress: { completed: r.completed as number, total: SECTION_IDS.length },
    findings: r.findings as number,
    measures: r.measures as number,
    loan: (r.loan as WalkthroughListItem['loan']) ?? null,
  };
}

export interface WalkthroughQuery {
  status?: WalkthroughStatus[] | undefined;
  installation?: string | undefined;
  building?: string | undefined;
}

export async function listWalkthroughs(actor: Actor, q: WalkthroughQuery = {}): Promise<WalkthroughListItem[]> {
  const db = await getDb();
  const where: (SQL | undefined)[] = [scopeToInstallations(actor, walkthrough.installationId)];
  if (q.installation) where.push(eq(walkthrough.installationId, (await installationByCode(db, actor, q.installation)).id));
  if (q.status?.length) where.push(inArray(walkthrough.status, q.status));
  if (q.building) where.push(eq(walkthrough.buildingId, q.building));
  const rows = await db
    .select(listColumns)
    .from(walkthrough)
    .innerJoin(building, eq(building.id, walkthrough.buildingId))
    .innerJoin(installation, eq(installation.id, walkthrough.installationId))
    .leftJoin(user, eq(user.id, walkthrough.auditorId))
    .where(and(...where))
    .orderBy(desc(walkthrough.plannedOn), asc(installation.code), asc(building.number));
  return rows.map(toItem);
}

/** A stored form with every section present; a section that no longer parses shows empty (and stays stored as it was until edited). */
export function readForm(raw: unknown): WalkthroughForm {
  const stored = (raw && typeof raw === 'object' ? raw : {}) as Record<string, unknown>;
  const form = emptyWalkthroughForm();
  for (const id of SECTION_IDS) {
    const r = walkthroughFormSchema.shape[id].safeParse(stored[id]);
    if (r.success) (form as Record<string, unknown>)[id] = r.data;
  }
  return form;
}

/** One walkthrough with its form, photos, findings and measures. @throws 404 */
export async function getWalkthrough(actor: Actor, id: string) {
  const db = await getDb();
  const [row] = await db
    .select({
      ...listColumns,
      installationId: walkthrough.installationId,
      installationName: installation.name,
      useType: building.useType,
      grossAreaFt2: building.grossAreaFt2,
      flagId: walkthrough.flagId,
      form: walkthrough.form,
      formVersion: walkthrough.formVersion,
      createdAt: walkthrough.createdAt,
      updatedAt: walkthrough.updatedAt,
      completedAt: walkthrough.completedAt,
    })
    .from(walkthrough)
    .innerJoin(building, eq(building.id, walkthrough.buildingId))
    .innerJoin(installation, eq(installation.id, walkthrough.installationId))
    .leftJoin(user, eq(user.id, walkthrough.auditorId))
    .where(and(eq(walkthrough.id, id), scopeToInstallations(actor, walkthrough.installationId)));
  if (!row) throw errors.notFound('No such walkthrough in your installations.');
  const form = readForm(row.form);
  const findings = await findingsOf(db, id);
  const [flag] = row.flagId ? await db.select({ id: buildingFlag.id, reason: buildingFlag.reason, clearedAt: buildingFlag.clearedAt }).from(buildingFlag).where(eq(buildingFlag.id, row.flagId)) : [];
  return {
    ...toItem(row),
    installationId: row.installationId,
    installationName: row.installationName,
    useType: row.useType,
    grossAreaFt2: row.grossAreaFt2,
    flag: flag ? { id: flag.id, reason: flag.reason, open: flag.clearedAt === null } : null,
    form,
    formVersion: row.formVersion,
    gaps: completionGaps(form),
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
    completedAt: row.completedAt?.toISOString() ?? null,
    photos: await photosOf(db, id),
    findings,
    rollup: rollUpMeasures(findings.flatMap((f) => (f.measure ? [toRollupMeasure(f.measure)] : []))),
  };
}

/** Plans a walkthrough of a building in the actor's scope. @throws 404 (building), 422 (auditor or flag) */
export async function planWalkthrough(actor: Actor, input: WalkthroughPlan, ip = ''): Promise<{ id: string }> {
  const db = await getDb();
  const [b] = await db
    .select({ id: building.id, number: building.number, name: building.name, installationId: building.installationId, code: installation.code, archived: building.archived })
    .from(building)
    .innerJoin(installation, eq(installation.id, building.installationId))
    .where(and(eq(building.id, input.buildingId), scopeToInstallations(actor, building.installationId)));
  if (!b) throw errors.notFound('No such building in your installations.');
  if (b.archived) throw errors.unprocessable('This building is archived.', [{ field: 'buildingId', message: 'archived' }]);
  if (input.auditorId) await checkAuditor(db, input.auditorId, b.installationId, b.code);
  let flagId: string | null = null;
  if (input.flagId) {
    const [f] = await db.select({ id: buildingFlag.id }).from(buildingFlag).where(and(eq(buildingFlag.id, input.flagId), eq(buildingFlag.buildingId, b.id)));
    if (!f) throw errors.unprocessable('That flag is not on this building.', [{ field: 'flagId', message: 'not a flag of this building' }]);
    flagId = f.id;
  } else if (input.flagId === undefined) {
    const [open] = await db.select({ id: buildingFlag.id }).from(buildingFlag).where(and(eq(buildingFlag.buildingId, b.id), isNull(buildingFlag.clearedAt))).orderBy(desc(buildingFlag.flaggedAt)).limit(1);
    flagId = open?.id ?? null;
  }
  const [row] = await db
    .insert(walkthrough)
    .values({ buildingId: b.id, installationId: b.installationId, flagId, title: input.title, plannedOn: input.plannedOn, auditorId: input.auditorId, status: 'planned', form: emptyWalkthroughForm(), formVersion: 0, createdBy: actor.id })
    .returning({ id: walkthrough.id });
  await logActivity({ action: 'walkthrough.plan', userId: actor.id, actor: actor.email, entityType: 'walkthrough', entityId: row!.id, installationId: b.installationId, ip, details: { building: `${b.code} ${b.number}`, plannedOn: input.plannedOn, auditorId: input.auditorId, flagId } });
  if (input.auditorId) await notifyAuditor(db, input.auditorId, { id: row!.id, title: input.title, plannedOn: input.plannedOn, building: `${b.code} ${b.number} ${b.name}`, by: actor.name });
  return { id: row!.id };
}

/** Changes the title, date or auditor while the walkthrough is not completed or cancelled. */
export async function updatePlan(actor: Actor, id: string, patch: { title?: string | undefined; plannedOn?: string | undefined; auditorId?: string | null | undefined }, ip = '') {
  const db = await getDb();
  const w = await walkthroughRef(db, actor, id);
  if (w.status === 'completed' || w.status === 'cancelled') throw errors.conflict(`This walkthrough is ${w.status}: its plan can no longer change.`);
  const [inst] = await db.select({ code: installation.code }).from(installation).where(eq(installation.id, w.installationId));
  if (patch.auditorId) await checkAuditor(db, patch.auditorId, w.installationId, inst!.code);
  const set: Record<string, unknown> = { updatedAt: new Date() };
  if (patch.title !== undefined) set.title = patch.title;
  if (patch.plannedOn !== undefined) set.plannedOn = patch.plannedOn;
  if (patch.auditorId !== undefined) set.auditorId = patch.auditorId;
  await db.update(walkthrough).set(set).where(eq(walkthrough.id, id));
  await logActivity({ action: 'walkthrough.replan', userId: actor.id, actor: actor.email, entityType: 'walkthrough', entityId: id, installationId: w.installationId, ip, details: patch });
  if (patch.auditorId && patch.auditorId !== w.auditorId) {
    const [b] = await db.select({ number: building.number, name: building.name }).from(building).where(eq(building.id, w.buildingId));
    await notifyAuditor(db, patch.auditorId, { id, title: patch.title ?? w.title, plannedOn: patch.plannedOn ?? w.plannedOn, building: `${inst!.code} ${b!.number} ${b!.name}`, by: actor.name });
  }
  return getWalkthrough(actor, id);
}
